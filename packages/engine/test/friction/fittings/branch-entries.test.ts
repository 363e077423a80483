import { describe, expect, it } from 'vitest';
import { acgihBranchEntryK, craneConvergingTeeK, junctionEntryK } from '../../../src/friction/fittings/branch-entries.js';

const deg = (d: number): number => (d * Math.PI) / 180;

describe('ACGIH branch entry loss ([M], from memory: checked as a band)', () => {
  it('30 / 45 / 90 deg = 0.18 / 0.28 / 1.00 VP within 0.02', () => {
    expect(Math.abs(acgihBranchEntryK(deg(30)) - 0.18)).toBeLessThan(0.02);
    expect(Math.abs(acgihBranchEntryK(deg(45)) - 0.28)).toBeLessThan(0.02);
    expect(Math.abs(acgihBranchEntryK(deg(90)) - 1.0)).toBeLessThan(0.02);
  });
  it('junctions: a tee loses more than a 45 deg wye, which loses more than a 30 deg wye', () => {
    const tee = junctionEntryK({ kind: 'tee' });
    const wye45 = junctionEntryK({ kind: 'wye', angleRad: deg(45) });
    const wye30 = junctionEntryK({ kind: 'wye', angleRad: deg(30) });
    expect(tee).toBe(1);
    expect(tee).toBeGreaterThan(wye45);
    expect(wye45).toBeGreaterThan(wye30);
    expect(junctionEntryK({ kind: 'sweep' })).toBeLessThan(tee);
  });
});

describe('Crane converging tee (Crane TP-410 (2009))', () => {
  it('Crane Example 7-35: DN100 tee, run 1135 L/min + branch 380 L/min at 90 deg: K_branch -0.0404, K_run 0.326 (via fluids docs, CHECKS.md [C])', () => {
    // Flows as the fluids docs give them for this example: run 0.018917 m3/s, branch 0.00633 m3/s.
    const q = 0.00633 / (0.018917 + 0.00633);
    const k = craneConvergingTeeK({ angleRad: deg(90), flowRatio: q, diameterRatio: 1 });
    expect(k.branchOnCombined).toBeCloseTo(-0.0404, 4);
    expect(k.runOnCombined).toBeCloseTo(0.326, 3);
  });
  it('equal diameters, Qb/Qc 0.5: 0.413 at 90 deg vs 0.219 at 45 deg (CHECKS.md [K])', () => {
    expect(craneConvergingTeeK({ angleRad: deg(90), flowRatio: 0.5, diameterRatio: 1 }).branchOnCombined).toBeCloseTo(0.413, 3);
    expect(craneConvergingTeeK({ angleRad: deg(45), flowRatio: 0.5, diameterRatio: 1 }).branchOnCombined).toBeCloseTo(0.219, 3);
  });
  it('the branch-velocity form gives the same loss: K_b VP_b = K_c VP_c', () => {
    const q = 0.3;
    const beta = 0.75;
    const k = craneConvergingTeeK({ angleRad: deg(45), flowRatio: q, diameterRatio: beta });
    // Velocity ratio Vb/Vc = q / beta^2 at equal density.
    expect(k.branchOnBranch * (q / beta ** 2) ** 2).toBeCloseTo(k.branchOnCombined, 12);
  });
  it('guards: bad ratios give finite values', () => {
    const k = craneConvergingTeeK({ angleRad: Number.NaN, flowRatio: 0, diameterRatio: -2 });
    expect(Number.isFinite(k.branchOnBranch) && Number.isFinite(k.runOnCombined)).toBe(true);
  });
});
