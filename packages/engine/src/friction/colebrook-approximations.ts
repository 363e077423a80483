/**
 * Explicit approximations to Colebrook-White (Darcy factor), for checks and
 * for comparison with other tools. Each is valid in turbulent flow only
 * (Re above about 4000). Inputs are guarded: Re floored at 1e-9, e/D clamped
 * to 0..0.5, so every function returns a finite positive number.
 */
import { guardReynolds, guardRoughness } from './friction-inputs.js';

/**
 * Swamee and Jain (1976), J. Hydraulics Div. ASCE 102(5):
 * f = 0.25 / [log10( (e/D)/3.7 + 5.74 / Re^0.9 )]^2. Valid 5e3 < Re < 1e8, 1e-6 < e/D < 1e-2.
 */
export function swameeJainFrictionFactor(re: number, relativeRoughness: number): number {
  const r = guardReynolds(re);
  const lg = Math.log10(guardRoughness(relativeRoughness) / 3.7 + 5.74 / Math.pow(r, 0.9));
  return lg === 0 ? Number.MAX_VALUE : 0.25 / (lg * lg);
}

/**
 * Haaland (1983), J. Fluids Eng. 105(1):
 * 1/sqrt(f) = -1.8 log10[ ((e/D)/3.7)^1.11 + 6.9/Re ]. Valid 4e3 < Re < 1e8.
 */
export function haalandFrictionFactor(re: number, relativeRoughness: number): number {
  const r = guardReynolds(re);
  const x = -1.8 * Math.log10(Math.pow(guardRoughness(relativeRoughness) / 3.7, 1.11) + 6.9 / r);
  return x === 0 ? Number.MAX_VALUE : 1 / (x * x);
}

/**
 * Altshul-Tsal, as given in ASHRAE Handbook Fundamentals ch. 21 (duct design):
 * f' = 0.11 (e/D + 68/Re)^0.25; f = f' when f' >= 0.018, else f = 0.85 f' + 0.0028.
 */
export function altshulTsalFrictionFactor(re: number, relativeRoughness: number): number {
  const r = guardReynolds(re);
  const fPrime = 0.11 * Math.pow(guardRoughness(relativeRoughness) + 68 / r, 0.25);
  // Threshold 0.018 and blend 0.85 f' + 0.0028: ASHRAE Fundamentals ch. 21, eq. for f.
  return fPrime >= 0.018 ? fPrime : 0.85 * fPrime + 0.0028;
}
