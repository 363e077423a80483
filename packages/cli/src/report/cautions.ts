import type { SystemModel } from '@vacnet/engine';

/** The report's cautions: always the general ones; the dust caution when the file declares combustible dust. */
export interface Cautions {
  general: string[];
  /** Paragraphs of the combustible-dust caution, or null when the file declares none. */
  dust: string[] | null;
}

/**
 * The cautions every report carries. The wording defers to licensed
 * engineers, the equipment maker's data, local codes, the NFPA standards on
 * combustible dust and the authority having jurisdiction: the report
 * estimates airflow, it does not assess hazards.
 */
export function cautionsFor(model: SystemModel | undefined): Cautions {
  const general = [
    'The figures in this report are engineering estimates for design and review, computed from the file as written. ' +
      'They do not replace a licensed engineer, the equipment maker\u2019s data or the codes that apply where the system is built.',
    'High vacuum can injure people: keep hands, faces and loose clothing away from open inlets and hose ends while the producer runs, ' +
      'and follow the maker\u2019s instructions when testing and servicing.',
    'Check the commissioning readings on site against this report before handing the system over; a reading well off the expected value ' +
      'points to a leak, a blockage or equipment that differs from the design.',
  ];
  const dust = model?.dust;
  if (!dust?.combustible) return { general, dust: null };
  const paragraphs = [
    `This system is declared to handle combustible ${dust.metal ? 'metal ' : ''}dust. Combustible dust can burn and explode, in the separator, ` +
      'the filter and the piping as well as in the rooms served.',
    'This report does not assess that hazard. A dust hazard analysis, NFPA 652 and NFPA 654' +
      (dust.metal ? ', and NFPA 484 for combustible metals' : ' (NFPA 484 where metals are handled)') +
      ' (NFPA 660 now consolidates them), a qualified engineer and the authority having jurisdiction govern the separator type and placement, ' +
      'explosion protection, bonding and grounding, and what may be collected at all.',
    dust.bondedAndGrounded
      ? 'The file declares that all conductive parts are bonded and grounded; that declaration is the designer\u2019s and has not been verified here.'
      : 'The file does not declare the conductive parts bonded and grounded.',
  ];
  return { general, dust: paragraphs };
}
