/**
 * Loss coefficients of bends (elbows) in round pipe, K on the pipe's own
 * velocity pressure. Several published data sets are given, each with its
 * source; `bendLossCoefficient` is the one the engine uses by default.
 */
import type { Fitting } from '../../network/model.js';
import { lookup, type Table, toDegrees } from './table-lookup.js';

/**
 * Angle factor for elbows of other than 90 deg: K_theta = factor x K_90.
 * ASHRAE Fundamentals, duct fitting CR3-1 (2005): 30/45/60/90 deg = 0.45/0.60/0.78/1.00 (CHECKS.md [C]);
 * 20, 75, 110-180 deg from the same table, from memory.
 */
export const ELBOW_ANGLE_FACTOR: Table = [
  [0, 0],
  [20, 0.31],
  [30, 0.45],
  [45, 0.6],
  [60, 0.78],
  [75, 0.9],
  [90, 1.0],
  [110, 1.13],
  [130, 1.2],
  [150, 1.28],
  [180, 1.4],
];

/**
 * Smooth-radius round elbow, 90 deg, C' by R/D: ASHRAE Fundamentals (1997) ch. 32,
 * fitting CD3-1 "Elbow, smooth radius, round" (from memory).
 */
export const SMOOTH_ELBOW_90: Table = [
  [0.5, 0.71],
  [0.75, 0.33],
  [1.0, 0.22],
  [1.5, 0.15],
  [2.0, 0.13],
  [2.5, 0.12],
];

/**
 * Die-stamped 90 deg elbow, R/D 1.5, C by diameter in mm: ASHRAE Fundamentals (2009)
 * ch. 21, CD3-1: 75/100/150 mm = 0.30/0.21/0.14 (CHECKS.md [C]); 125, 180-250 mm from memory.
 */
export const DIE_STAMPED_90_BY_DIAMETER_MM: Table = [
  [75, 0.3],
  [100, 0.21],
  [125, 0.16],
  [150, 0.14],
  [180, 0.12],
  [200, 0.11],
  [250, 0.11],
];

/**
 * Die-stamped 45 deg elbow, R/D 1.5, C by diameter in mm: ASHRAE Fundamentals (2009)
 * ch. 21, CD3-3: 75/150 mm = 0.18/0.08 (CHECKS.md [C]); 100, 125 mm from memory.
 */
export const DIE_STAMPED_45_BY_DIAMETER_MM: Table = [
  [75, 0.18],
  [100, 0.13],
  [125, 0.1],
  [150, 0.08],
];

/**
 * 3-gore 90 deg elbow, C by R/D: ASHRAE Fundamentals ch. 21, CD3-12:
 * 0.75/1/1.5/2 = 0.54/0.42/0.34/0.33 (CHECKS.md [C]); 0.5 = 0.98 from memory.
 */
export const THREE_GORE_90: Table = [
  [0.5, 0.98],
  [0.75, 0.54],
  [1.0, 0.42],
  [1.5, 0.34],
  [2.0, 0.33],
];

/**
 * Mitred (single-cut) round elbow, C by angle in deg: ASHRAE Fundamentals ch. 21,
 * CD3-17 (from memory).
 */
export const MITRED_ELBOW: Table = [
  [0, 0],
  [20, 0.08],
  [30, 0.16],
  [45, 0.34],
  [60, 0.55],
  [75, 0.81],
  [90, 1.2],
];

/**
 * Round elbow by R/D as a fraction of velocity pressure: ACGIH Industrial
 * Ventilation, elbow losses: 1.5/2.0/2.5 = 0.39/0.27/0.22 VP (CHECKS.md [M], from memory).
 */
export const ACGIH_ELBOW_90: Table = [
  [1.5, 0.39],
  [2.0, 0.27],
  [2.5, 0.22],
];

/**
 * Equivalent length L/D of a 90 deg pipe bend by r/d: Crane Technical Paper
 * 410 (2009), "resistance of bends" (1/1.5/2/3 = 20/14/12/12: CHECKS.md [C]; the rest from the same chart, from memory).
 */
export const CRANE_BEND_90_L_OVER_D: Table = [
  [1, 20],
  [1.5, 14],
  [2, 12],
  [3, 12],
  [4, 14],
  [6, 17],
  [8, 24],
  [10, 30],
  [12, 34],
  [14, 38],
  [16, 42],
  [20, 50],
];

/** CR3-1 angle factor at `angleRad` (0..180 deg, held outside). */
export function elbowAngleFactor(angleRad: number): number {
  return lookup(ELBOW_ANGLE_FACTOR, Math.abs(toDegrees(angleRad)));
}

/** Smooth-radius elbow: C'(R/D) x angle factor (ASHRAE CD3-1 1997 and CR3-1); R/D held to 0.5..2.5. */
export function smoothElbowK(angleRad: number, radiusRatio: number): number {
  return lookup(SMOOTH_ELBOW_90, radiusRatio) * elbowAngleFactor(angleRad);
}

/** Die-stamped elbow, R/D 1.5, 90 deg or 45 deg data by diameter (ASHRAE CD3-1 / CD3-3); diameter held to the table. */
export function dieStampedElbowK(angle: 45 | 90, diameterM: number): number {
  const mm = diameterM * 1000;
  return lookup(angle === 90 ? DIE_STAMPED_90_BY_DIAMETER_MM : DIE_STAMPED_45_BY_DIAMETER_MM, mm);
}

/** 3-gore 90 deg elbow by R/D (ASHRAE CD3-12), scaled to other angles with the CR3-1 factor. */
export function threeGoreElbowK(angleRad: number, radiusRatio: number): number {
  return lookup(THREE_GORE_90, radiusRatio) * elbowAngleFactor(angleRad);
}

/** Mitred elbow by angle (ASHRAE CD3-17, from memory); above 90 deg scaled with CR3-1. */
export function mitredElbowK(angleRad: number): number {
  const deg = Math.abs(toDegrees(angleRad));
  return deg <= 90 ? lookup(MITRED_ELBOW, deg) : lookup(MITRED_ELBOW, 90) * elbowAngleFactor(angleRad);
}

/** ACGIH round elbow by R/D, 90 deg (from memory, [M]); R/D held to 1.5..2.5. */
export function acgihElbowK(radiusRatio: number): number {
  return lookup(ACGIH_ELBOW_90, radiusRatio);
}

/**
 * Crane fully turbulent friction factor f_T for a pipe of relative roughness
 * e/D: the rough-wall limit of Colebrook, f_T = 0.25 / log10((e/D)/3.7)^2
 * (Crane TP-410). e/D is held to 1e-6..0.05.
 */
export function craneFullyTurbulentFactor(relativeRoughness: number): number {
  const rr = Number.isFinite(relativeRoughness) ? Math.min(0.05, Math.max(1e-6, relativeRoughness)) : 1e-6;
  const lg = Math.log10(rr / 3.7);
  return 0.25 / (lg * lg);
}

/** Crane 90 deg bend: K = f_T (L/D)(r/d) (Crane TP-410); r/d held to 1..20. */
export function craneBend90K(radiusRatio: number, fullyTurbulentFactor: number): number {
  const fT = Number.isFinite(fullyTurbulentFactor) && fullyTurbulentFactor > 0 ? fullyTurbulentFactor : 0;
  return fT * lookup(CRANE_BEND_90_L_OVER_D, radiusRatio);
}

// Upper bound for a 90 deg bend of any radius: the mitred elbow (ASHRAE CD3-17, from memory).
const K90_MAX = 1.2;

/**
 * The engine's bend loss coefficient, K on the pipe's velocity pressure.
 *
 * K_90 follows the smooth-radius curve C'(R/D) (ASHRAE CD3-1, 1997) scaled so
 * that at R/D 1.5 it equals the size-dependent die-stamped value (ASHRAE CD3-1,
 * 2009: 0.30 at 75 mm, 0.14 at 150 mm; diameters below 75 mm take the 75 mm
 * value), never below the smooth curve and never above a mitred elbow (1.2).
 * Below R/D 0.5 it rises linearly to the mitred value at R/D 0. Other angles
 * use the CR3-1 factor. The scaling is our choice (common practice: small
 * stamped fittings lose more than large smooth ones); it lands within the
 * ACGIH elbow band. Inputs are held: R/D >= 0, non-finite R/D -> 0 (mitred).
 */
export function bendLossCoefficient(angleRad: number, radiusRatio: number, diameterM: number): number {
  const rd = Number.isFinite(radiusRatio) && radiusRatio > 0 ? radiusRatio : 0;
  const sizeScale = Math.max(1, dieStampedElbowK(90, Number.isFinite(diameterM) ? diameterM : 0) / lookup(SMOOTH_ELBOW_90, 1.5));
  let k90: number;
  if (rd >= 0.5) {
    k90 = Math.min(K90_MAX, lookup(SMOOTH_ELBOW_90, rd) * sizeScale);
  } else {
    const atHalf = Math.min(K90_MAX, lookup(SMOOTH_ELBOW_90, 0.5) * sizeScale);
    k90 = K90_MAX + ((atHalf - K90_MAX) * rd) / 0.5;
  }
  return k90 * elbowAngleFactor(angleRad);
}

/**
 * Sum of K for the bends among a pipe's fittings, each bend K x its count
 * (ASHRAE practice: fitting losses add). Reducers are skipped: their K
 * needs the neighbouring diameter (area-changes.ts). Non-finite or negative
 * counts count as 0.
 */
export function bendFittingsK(fittings: readonly Fitting[], diameterM: number): number {
  let sum = 0;
  for (const f of fittings) {
    if (f.kind !== 'bend') continue;
    const count = Number.isFinite(f.count) && f.count > 0 ? f.count : 0;
    sum += count * bendLossCoefficient(f.angleRad, f.radiusRatio, diameterM);
  }
  return sum;
}
