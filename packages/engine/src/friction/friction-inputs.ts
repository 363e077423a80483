/**
 * Input guards shared by the friction-factor correlations, so that every
 * correlation is total: any number in, a finite positive factor out.
 */

/** Reynolds numbers below this are taken as this (f = 64/Re = 6.4e10 there; laminar). */
export const RE_FLOOR = 1e-9;
/** Relative roughness is clamped to 0..0.5 (Moody's chart ends at 0.05; beyond 0.5 the idea of a rough pipe fails). */
export const RELATIVE_ROUGHNESS_MAX = 0.5;

/** Reynolds number guarded: non-finite or below RE_FLOOR -> RE_FLOOR; +Infinity -> 1e15. */
export function guardReynolds(re: number): number {
  if (re === Number.POSITIVE_INFINITY) return 1e15;
  return Number.isFinite(re) && re > RE_FLOOR ? re : RE_FLOOR;
}

/** Relative roughness e/D guarded: negative or non-finite -> 0, above 0.5 -> 0.5. */
export function guardRoughness(relativeRoughness: number): number {
  if (!Number.isFinite(relativeRoughness) || relativeRoughness < 0) return 0;
  return Math.min(relativeRoughness, RELATIVE_ROUGHNESS_MAX);
}
