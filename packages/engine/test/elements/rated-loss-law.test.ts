import { describe, expect, it } from 'vitest';
import { ratedLossDrop, ratedLossLaw, ratedLossProblems } from '../../src/elements/rated-loss-law.js';

const RHO_STD = 101325 / (287.05 * 293.15); // 1.2041 kg/m3, CHECKS.md
const rated = { lossPa: 1500, flowStdM3PerS: 0.1 };

describe('ratedLossLaw: dp = dp_ref (m/m_ref)^2 (rho_ref/rho) (ENGINEERING.md; square law)', () => {
  const law = ratedLossLaw(rated, 293.15);
  it('passes the rated point at standard density', () => {
    expect(law.flow(101325 + 750, 101325 - 750).massFlowKgPerS).toBeCloseTo(0.1 * RHO_STD, 12);
  });
  it('square law: a quarter of the loss gives half the flow', () => {
    expect(law.flow(101325 + 375 / 2, 101325 - 375 / 2).massFlowKgPerS).toBeCloseTo(0.05 * RHO_STD, 12);
  });
  it('at half the density the same loss passes 1/sqrt(2) of the mass flow', () => {
    expect(law.flow(101325 / 2 + 750, 101325 / 2 - 750).massFlowKgPerS).toBeCloseTo((0.1 * RHO_STD) / Math.SQRT2, 12);
  });
  it('antisymmetric, zero at equal pressures with a finite slope', () => {
    const f = law.flow(60000, 59000);
    const g = law.flow(59000, 60000);
    expect(g.massFlowKgPerS).toBeCloseTo(-f.massFlowKgPerS, 15);
    const z = law.flow(60000, 60000);
    expect(z.massFlowKgPerS).toBe(0);
    expect(Number.isFinite(z.dFlowDPa) && z.dFlowDPa > 0).toBe(true);
  });
  it('derivatives match finite differences (including inside the low-flow blend)', () => {
    for (const [pa, pb] of [[60000, 59000], [60000, 59999.95], [60000, 60000.01], [90000, 40000]]) {
      const r = law.flow(pa as number, pb as number);
      const h = 1e-4;
      const dA = (law.flow((pa as number) + h, pb as number).massFlowKgPerS - law.flow((pa as number) - h, pb as number).massFlowKgPerS) / (2 * h);
      const dB = (law.flow(pa as number, (pb as number) + h).massFlowKgPerS - law.flow(pa as number, (pb as number) - h).massFlowKgPerS) / (2 * h);
      const s = Math.abs(dA) + Math.abs(dB);
      expect(Math.abs(r.dFlowDPa - dA) / s).toBeLessThan(1e-5);
      expect(Math.abs(r.dFlowDPb - dB) / s).toBeLessThan(1e-5);
    }
  });
  it('upstreamPressureInto inverts the law: the rated point back, and inside the low-flow blend', () => {
    const up = { pressurePa: 0, dPressureDFlow: 0, dPressureDDown: 0 };
    // The rated point at standard density (ENGINEERING.md: the rating is read as standard air).
    expect(law.upstreamPressureInto!(0.1 * RHO_STD, 101325 - 750, up)).toBe(true);
    expect(up.pressurePa).toBeCloseTo(101325 + 750, 8);
    for (const [pa, pb] of [[60000, 59000], [60000, 59999.95], [90000, 40000]] as const) {
      const m = law.flow(pa, pb).massFlowKgPerS;
      expect(law.upstreamPressureInto!(m, pb, up)).toBe(true);
      expect(up.pressurePa).toBeCloseTo(pa, 6);
      const f = law.flow(pa, pb);
      expect(up.dPressureDFlow).toBeCloseTo(1 / f.dFlowDPa, 3);
      expect(up.dPressureDDown).toBeCloseTo(-f.dFlowDPb / f.dFlowDPa, 9);
    }
  });
  it('ratedLossDrop is the inverse', () => {
    const m = law.flow(70000, 68000).massFlowKgPerS;
    expect(ratedLossDrop(rated, m, 69000 / (287.05 * 293.15)).dropPa).toBeCloseTo(2000, 8);
  });
  it('guards: invalid ratings are reported and closed; bad pressures give finite values', () => {
    expect(ratedLossProblems({ lossPa: 0, flowStdM3PerS: 0.1 })).toEqual(['rated-loss-not-positive']);
    expect(ratedLossProblems({ lossPa: 100, flowStdM3PerS: Number.NaN })).toEqual(['rated-flow-not-positive']);
    expect(ratedLossLaw({ lossPa: 0, flowStdM3PerS: 0.1 }, 293.15).flow(1e5, 9e4).massFlowKgPerS).toBe(0);
    for (const [pa, pb] of [[0, 0], [Number.NaN, 1e5], [-1e5, 1e5]]) {
      const r = law.flow(pa as number, pb as number);
      expect(Number.isFinite(r.massFlowKgPerS) && Number.isFinite(r.dFlowDPa) && Number.isFinite(r.dFlowDPb)).toBe(true);
    }
    expect(ratedLossDrop(rated, 0.1, 0).dropPa).toBe(0);
  });
});
