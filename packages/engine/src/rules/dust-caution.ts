/**
 * The closing words of every combustible-dust finding. These rules are
 * reminders, not a compliance check: the standards, a dust hazard analysis
 * and the authority having jurisdiction decide.
 */
export const DUST_DEFERRAL =
  'This is a caution, not a compliance check: follow NFPA 652 and NFPA 654 (NFPA 484 for metals; NFPA 660 now consolidates them), a dust hazard analysis, a qualified engineer and the authority having jurisdiction.';
