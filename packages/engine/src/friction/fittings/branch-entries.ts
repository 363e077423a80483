/**
 * Loss where a branch joins a run (converging flow, as in every vacuum
 * system: air flows from the branch into the main toward the producer).
 */
import type { Junction } from '../../network/model.js';
import { lookup, type Table, toDegrees } from './table-lookup.js';

/**
 * Branch entry loss as a fraction of the branch velocity pressure, by entry
 * angle in deg: ACGIH Industrial Ventilation, branch entry losses.
 * 30/45/90 deg = 0.18/0.28/1.00 VP (CHECKS.md [M]); the other rows from the same table, from memory.
 */
export const ACGIH_BRANCH_ENTRY: Table = [
  [10, 0.06],
  [15, 0.09],
  [20, 0.12],
  [25, 0.15],
  [30, 0.18],
  [35, 0.21],
  [40, 0.25],
  [45, 0.28],
  [50, 0.32],
  [60, 0.44],
  [90, 1.0],
];

/** ACGIH branch entry loss (K on the branch velocity pressure) at `angleRad`, held to 10..90 deg. */
export function acgihBranchEntryK(angleRad: number): number {
  return lookup(ACGIH_BRANCH_ENTRY, Math.abs(toDegrees(angleRad)));
}

// A sweep entry (branch turned through a long-radius bend to join the run at
// a shallow angle) is taken as a 45 deg lateral: common practice, from memory.
const SWEEP_ENTRY_ANGLE_DEG = 45;

/**
 * The constant branch-entry K (on the branch's own velocity pressure) the
 * engine lumps into a branch pipe for the way it joins its parent: wye at its
 * angle and sweep by the ACGIH table, 90 deg tee = 1.0 VP (ACGIH).
 */
export function junctionEntryK(junction: Junction): number {
  switch (junction.kind) {
    case 'wye':
      return acgihBranchEntryK(junction.angleRad);
    case 'tee':
      return lookup(ACGIH_BRANCH_ENTRY, 90);
    case 'sweep':
      return lookup(ACGIH_BRANCH_ENTRY, SWEEP_ENTRY_ANGLE_DEG);
  }
}

/**
 * Crane converging-tee constant F by branch angle in deg (Crane TP-410 (2009),
 * converging flow through tees and wyes; also in Rennels and Hudson 2012):
 * 30/45/60/90 = 1.74/1.41/1.0/0. Angles between are interpolated linearly
 * (our choice), below 30 deg held at 30 deg.
 */
export const CRANE_CONVERGING_F: Table = [
  [30, 1.74],
  [45, 1.41],
  [60, 1.0],
  [90, 0],
];

export interface ConvergingTeeInput {
  /** Angle between branch and run, rad (pi/2 for a tee). */
  angleRad: number;
  /** Branch flow / combined flow, Qb/Qc (volume or mass; held to 0.001..1). */
  flowRatio: number;
  /** Branch diameter / combined (outlet) diameter, Db/Dc (held to 0.05..1). */
  diameterRatio: number;
}

export interface ConvergingTeeK {
  /** Branch-to-combined loss, K on the combined-flow velocity pressure (Crane's basis). */
  branchOnCombined: number;
  /** Run-to-combined loss, K on the combined-flow velocity pressure. */
  runOnCombined: number;
  /** Branch-to-combined loss on the branch's own velocity pressure: branchOnCombined (beta^2/q)^2. */
  branchOnBranch: number;
}

/**
 * Converging tee or wye by the Crane method (Crane TP-410 (2009), after
 * Idelchik; as implemented in the fluids library, K_branch_converging_Crane):
 *   K_branch = C [1 + D (q/beta^2)^2 - E (1 - q)^2 - F/beta^2 q^2], D = 1, E = 2,
 *   C = 1 when beta^2 <= 0.35, else 0.9 (1 - q) when q <= 0.4, else 0.55.
 *   K_run (90 deg) = 1.55 q - q^2; other angles
 *   K_run = 1 - (1 - q)^2 - F/beta^2 q^2 (Crane TP-410 with C = 1, D = 0, E = 1; from memory).
 * q = Qb/Qc, beta = Db/Dc; K on the combined velocity pressure. Negative K
 * means the run flow draws the branch in (an ejector effect).
 */
export function craneConvergingTeeK(input: ConvergingTeeInput): ConvergingTeeK {
  const q = clamp(input.flowRatio, 1e-3, 1);
  const beta = clamp(input.diameterRatio, 0.05, 1);
  const b2 = beta * beta;
  const deg = Math.min(90, Math.abs(toDegrees(input.angleRad)));
  const f = lookup(CRANE_CONVERGING_F, deg);
  // C: Crane TP-410 converging flow (area ratio 0.35 and flow ratio 0.4 thresholds).
  const c = b2 <= 0.35 ? 1 : q <= 0.4 ? 0.9 * (1 - q) : 0.55;
  const branchOnCombined = c * (1 + (q / b2) ** 2 - 2 * (1 - q) ** 2 - (f / b2) * q * q);
  // 90 deg run: Crane TP-410, K_run = 1.55 q - q^2.
  const runOnCombined = deg >= 90 ? 1.55 * q - q * q : 1 - (1 - q) ** 2 - (f / b2) * q * q;
  return { branchOnCombined, runOnCombined, branchOnBranch: branchOnCombined * (b2 / q) ** 2 };
}

function clamp(x: number, lo: number, hi: number): number {
  return Number.isFinite(x) ? Math.min(hi, Math.max(lo, x)) : lo;
}
