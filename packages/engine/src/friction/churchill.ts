/**
 * Churchill (1977) friction factor: one smooth expression across laminar,
 * transition and turbulent flow, with its derivative, for the Newton solver.
 *
 * S. W. Churchill, "Friction-factor equation spans all fluid-flow regimes",
 * Chemical Engineering 84(24), 1977, 91-92:
 *   f = 8 [ (8/Re)^12 + (A + B)^-1.5 ]^(1/12)            (Darcy factor)
 *   A = [ 2.457 ln( 1 / ((7/Re)^0.9 + 0.27 e/D) ) ]^16
 *   B = (37530 / Re)^16
 * Here it is computed as the product f Re, which tends to 64 (Hagen-Poiseuille)
 * as Re -> 0 and stays finite at zero flow:
 *   f Re = 8 [ 8^12 + Re^12 (A + B)^-1.5 ]^(1/12)
 */
import { guardReynolds, guardRoughness } from './friction-inputs.js';

// Below Re = 1 the turbulent part is below 1e-100 of the laminar one: f Re = 64 exactly (Hagen-Poiseuille).
const LAMINAR_ONLY_RE = 1;

export interface FrictionProduct {
  /** f Re (Darcy factor times Reynolds number). */
  fRe: number;
  /** d(f Re)/d(Re). */
  dFReDRe: number;
}

export interface FrictionFactor {
  /** Darcy friction factor. */
  f: number;
  /** df/dRe. */
  dfdRe: number;
}

/**
 * f Re and its derivative by Churchill (1977). Inputs: Re >= 0 (0 allowed: gives
 * 64), relative roughness e/D (clamped to 0..0.5). Valid for all Re.
 */
export function churchillProduct(re: number, relativeRoughness: number): FrictionProduct {
  const rr = guardRoughness(relativeRoughness);
  if (!(re > LAMINAR_ONLY_RE) || !Number.isFinite(re)) {
    return re === Number.POSITIVE_INFINITY ? churchillProduct(1e15, rr) : { fRe: 64, dFReDRe: 0 };
  }
  const u = Math.pow(7 / re, 0.9) + 0.27 * rr;
  const lnTerm = -Math.log(u); // ln(1/u)
  const a = Math.pow(2.457 * lnTerm, 16);
  const b = Math.pow(37530 / re, 16);
  const sum = a + b;
  const c = Math.pow(sum, -1.5);
  const re12 = Math.pow(re, 12);
  const inner = Math.pow(8, 12) + re12 * c;
  const fRe = 8 * Math.pow(inner, 1 / 12);
  // Derivatives: dA/dRe via u, dB/dRe = -16 B / Re.
  const du = (-0.9 * Math.pow(7 / re, 0.9)) / re;
  const dLn = -du / u;
  const dA = 16 * Math.pow(2.457, 16) * Math.pow(lnTerm, 15) * dLn;
  const dB = (-16 * b) / re;
  const dC = -1.5 * Math.pow(sum, -2.5) * (dA + dB);
  const dInner = 12 * Math.pow(re, 11) * c + re12 * dC;
  const dFReDRe = (8 / 12) * Math.pow(inner, -11 / 12) * dInner;
  return { fRe, dFReDRe: Number.isFinite(dFReDRe) ? dFReDRe : 0 };
}

/**
 * Darcy friction factor f and df/dRe by Churchill (1977). Re is floored at
 * 1e-9 (f = 6.4e10 there) so that the result is always finite.
 */
export function churchillFrictionFactor(re: number, relativeRoughness: number): FrictionFactor {
  const r = guardReynolds(re);
  const { fRe, dFReDRe } = churchillProduct(r, relativeRoughness);
  return { f: fRe / r, dfdRe: (dFReDRe - fRe / r) / r };
}
