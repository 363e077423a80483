/**
 * Colebrook-White friction factor, solved to machine precision.
 *
 * C. F. Colebrook, "Turbulent flow in pipes...", J. ICE 11 (1939) 133-156:
 *   1/sqrt(f) = -2 log10( (e/D)/3.7 + 2.51 / (Re sqrt(f)) )
 * Valid for turbulent flow (Re above about 4000); it is the reference the
 * explicit correlations approximate. Used as a check and for reporting.
 */
import { guardReynolds, guardRoughness } from './friction-inputs.js';

/**
 * Darcy f by Colebrook-White. Solves g(x) = x + 2 log10(a + b x) = 0 for
 * x = 1/sqrt(f), a = (e/D)/3.7, b = 2.51/Re: g is increasing and concave, so
 * a Newton step from any point with g > 0 lands left of the root and the
 * iteration then climbs monotonically; a bracket with bisection guards it.
 * Re is floored at 1e-9 and e/D clamped to 0..0.5, so the result is always
 * finite and positive (though meaningless below Re ~ 2000: use 64/Re there).
 */
export function colebrookFrictionFactor(re: number, relativeRoughness: number): number {
  const a = guardRoughness(relativeRoughness) / 3.7;
  const b = 2.51 / guardReynolds(re);
  const g = (x: number): number => x + 2 * Math.log10(a + b * x);
  const dg = (x: number): number => 1 + (2 * b) / ((a + b * x) * Math.LN10);
  // Bracket: lo with g < 0, hi with g > 0 (g -> -inf near 0 when a = 0; a <= 0.135 < 1 so g(0+) < 0).
  let lo = 0;
  let hi = 1;
  while (g(hi) <= 0 && hi < 1e12) hi *= 2;
  let x = hi;
  for (let i = 0; i < 200; i++) {
    const gx = g(x);
    if (gx > 0) hi = x;
    else lo = x;
    let next = x - gx / dg(x);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-15 * x) {
      x = next;
      break;
    }
    x = next;
  }
  return 1 / (x * x);
}
