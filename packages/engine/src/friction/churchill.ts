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
  const out = new Float64Array(2);
  churchillProductInto(re, guardRoughness(relativeRoughness), out);
  return { fRe: out[0]!, dFReDRe: out[1]! };
}

/**
 * The same as churchillProduct, written into out[0] (f Re) and out[1]
 * (d(f Re)/dRe) without allocating: the solver's hot path. The caller
 * passes a relative roughness already guarded (0..0.5). The powers are taken
 * by repeated squaring or through exp and log, and shared between the value
 * and the derivative, so that one call costs three logarithms and two
 * exponentials (agrees with the plain powers to a few units of rounding).
 */
export function churchillProductInto(re: number, rr: number, out: Float64Array): void {
  if (!(re > LAMINAR_ONLY_RE) || !Number.isFinite(re)) {
    if (re === Number.POSITIVE_INFINITY) {
      churchillProductInto(1e15, rr, out);
      return;
    }
    out[0] = 64;
    out[1] = 0;
    return;
  }
  const x = Math.exp(0.9 * (LN_7 - Math.log(re))); // (7/Re)^0.9
  const u = x + 0.27 * rr;
  const lnTerm = -Math.log(u); // ln(1/u)
  const g = 2.457 * lnTerm;
  const g2 = g * g;
  const g4 = g2 * g2;
  const g8 = g4 * g4;
  const a = g8 * g8; // (2.457 ln(1/u))^16
  const s = 37530 / re;
  const s2 = s * s;
  const s4 = s2 * s2;
  const s8 = s4 * s4;
  const b = s8 * s8; // (37530/Re)^16
  const sum = a + b;
  const c = 1 / (sum * Math.sqrt(sum)); // sum^-1.5
  const re2 = re * re;
  const re4 = re2 * re2;
  const re12 = re4 * re4 * re4;
  const inner = EIGHT_POW_12 + re12 * c;
  const root = Math.exp(Math.log(inner) / 12); // inner^(1/12)
  out[0] = 8 * root;
  // Derivatives: dA/dRe via u, dB/dRe = -16 B / Re; inner^(-11/12) = root / inner.
  const du = (-0.9 * x) / re;
  const dLn = -du / u;
  const dA = lnTerm !== 0 ? (16 * a * dLn) / lnTerm : 0; // 16 (2.457)^16 ln^15 dLn
  const dB = (-16 * b) / re;
  const dC = ((-1.5 * c) / sum) * (dA + dB);
  const dInner = (12 * re12 * c) / re + re12 * dC;
  const d = (8 / 12) * (root / inner) * dInner;
  out[1] = Number.isFinite(d) ? d : 0;
}

// 8^12, the laminar part of the bracket (Churchill 1977), and ln 7.
const EIGHT_POW_12 = 68719476736;
const LN_7 = Math.log(7);

/**
 * Darcy friction factor f and df/dRe by Churchill (1977). Re is floored at
 * 1e-9 (f = 6.4e10 there) so that the result is always finite.
 */
export function churchillFrictionFactor(re: number, relativeRoughness: number): FrictionFactor {
  const r = guardReynolds(re);
  const { fRe, dFReDRe } = churchillProduct(r, relativeRoughness);
  return { f: fRe / r, dfdRe: (dFReDRe - fRe / r) / r };
}
