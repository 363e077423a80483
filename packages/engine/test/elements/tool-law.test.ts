import { describe, expect, it } from 'vitest';
import { CRITICAL_PRESSURE_RATIO, roomAirFlow, toolLaw, toolLawProblems } from '../../src/elements/tool-law.js';
import type { ToolLaw } from '../../src/network/model.js';

const IN_H2O = 249.082; // Pa, NIST SP 811 (39.2 F)
const CFM = 0.3048 ** 3 / 60; // m3/s
const P_ATM = 101325;
const T = 293.15;

function fd(law: ReturnType<typeof toolLaw>, pa: number, pb: number): { dA: number; dB: number } {
  const h = 1e-4 * Math.max(1, Math.abs(pa - pb));
  return {
    dA: (law.flow(pa + h, pb).massFlowKgPerS - law.flow(pa - h, pb).massFlowKgPerS) / (2 * h),
    dB: (law.flow(pa, pb + h).massFlowKgPerS - law.flow(pa, pb - h).massFlowKgPerS) / (2 * h),
  };
}

describe('toolLaw: orifice (isentropic nozzle, ENGINEERING.md)', () => {
  const orifice: ToolLaw = { kind: 'orifice', diameterM: 0.0254, dischargeCoefficient: 0.6 };
  const law = toolLaw(orifice, P_ATM, T);

  it('1.0 in orifice, Cd 0.60, 40 inH2O vacuum, 101,325 Pa, 20 C: 0.044544 kg/s, 78.38 cfm room air, 368.6 W (CHECKS.md [K])', () => {
    const pb = P_ATM - 40 * IN_H2O;
    const r = law.flow(P_ATM, pb);
    expect(r.massFlowKgPerS).toBeCloseTo(0.044544, 6);
    const q = roomAirFlow(r.massFlowKgPerS, P_ATM, T);
    expect(q / CFM).toBeCloseTo(78.38, 2);
    expect(q * (P_ATM - pb)).toBeCloseTo(368.6, 1);
    expect(r.limited).toBeUndefined();
  });

  it('critical pressure ratio for kappa 1.4: 0.5283 (isentropic nozzle flow, CHECKS.md [C])', () => {
    expect(CRITICAL_PRESSURE_RATIO).toBeCloseTo(0.5283, 4);
  });

  it('choked below the critical ratio: flow held, flagged, no dependence on the hose end', () => {
    const atCritical = law.flow(P_ATM, P_ATM * CRITICAL_PRESSURE_RATIO).massFlowKgPerS;
    const deeper = law.flow(P_ATM, P_ATM * 0.3);
    expect(deeper.massFlowKgPerS).toBeCloseTo(atCritical, 12);
    expect(deeper.limited).toBe('choked');
    expect(deeper.dFlowDPb).toBe(0);
    // Choked mass flow, closed form: Cd A p0 sqrt(kappa/(R T)) (2/(kappa+1))^((kappa+1)/(2(kappa-1))) (Shapiro 1953)
    const closed = 0.6 * (Math.PI * 0.0254 ** 2) / 4 * P_ATM * Math.sqrt(1.4 / (287.05 * T)) * (2 / 2.4) ** 3;
    expect(deeper.massFlowKgPerS).toBeCloseTo(closed, 10);
  });

  it('equals Cd eps A sqrt(2 rho1 dp) with the nozzle expansibility eps of ISO 5167-3 (beta -> 0)', () => {
    // ISO 5167-3:2003 eq. for nozzles: eps = sqrt( kappa tau^(2/kappa)/(kappa-1) (1 - tau^((kappa-1)/kappa))/(1 - tau) ), tau = p2/p1, beta -> 0.
    for (const dp of [1000, 5000, 20000]) {
      const tau = (P_ATM - dp) / P_ATM;
      const eps = Math.sqrt(((1.4 * tau ** (2 / 1.4)) / 0.4) * ((1 - tau ** (0.4 / 1.4)) / (1 - tau)));
      const rho = P_ATM / (287.05 * T);
      const expected = 0.6 * eps * ((Math.PI * 0.0254 ** 2) / 4) * Math.sqrt(2 * rho * dp);
      expect(law.flow(P_ATM, P_ATM - dp).massFlowKgPerS / expected).toBeCloseTo(1, 12);
    }
  });

  it('derivatives match finite differences, including the low-flow blend and reverse flow', () => {
    for (const pb of [P_ATM - 20, P_ATM - 500, P_ATM - 10 * IN_H2O, P_ATM - 40000, P_ATM + 50]) {
      const r = law.flow(P_ATM, pb);
      const { dA, dB } = fd(law, P_ATM, pb);
      const s = Math.abs(dA) + Math.abs(dB);
      expect(Math.abs(r.dFlowDPa - dA) / s, `dPa at ${pb}`).toBeLessThan(1e-5);
      expect(Math.abs(r.dFlowDPb - dB) / s, `dPb at ${pb}`).toBeLessThan(1e-5);
    }
  });

  it('zero flow at equal pressures with a finite slope; continuous across zero', () => {
    const r = law.flow(P_ATM, P_ATM);
    expect(r.massFlowKgPerS).toBe(0);
    expect(Number.isFinite(r.dFlowDPa) && r.dFlowDPa > 0).toBe(true);
    expect(law.flow(P_ATM, P_ATM + 1e-6).massFlowKgPerS).toBeCloseTo(-law.flow(P_ATM, P_ATM - 1e-6).massFlowKgPerS, 15);
  });
});

describe('toolLaw: measured table', () => {
  const table: ToolLaw = {
    kind: 'table',
    points: [
      { vacuumPa: 5000, flowStdM3PerS: 0.04 },
      { vacuumPa: 10000, flowStdM3PerS: 0.055 },
      { vacuumPa: 20000, flowStdM3PerS: 0.075 },
    ],
  };
  const law = toolLaw(table, P_ATM, T);

  it('passes through the stated points (standard flow x 1.2041 kg/m3) and through zero', () => {
    expect(law.flow(P_ATM, P_ATM - 10000).massFlowKgPerS).toBeCloseTo(0.055 * 1.20412, 5);
    expect(law.flow(P_ATM, P_ATM).massFlowKgPerS).toBe(0);
  });
  it('beyond the last vacuum: grows as sqrt(vacuum), flagged curve-end; held (choked) past the critical vacuum', () => {
    const r = law.flow(P_ATM, P_ATM - 40000);
    expect(r.limited).toBe('curve-end');
    expect(r.massFlowKgPerS).toBeCloseTo(0.075 * 1.20412 * Math.sqrt(2), 5);
    const deep = law.flow(P_ATM, 20000);
    expect(deep.limited).toBe('choked');
    expect(deep.dFlowDPb).toBe(0);
  });
  it('monotone in vacuum', () => {
    let prev = -1;
    for (let v = 0; v < 60000; v += 250) {
      const m = law.flow(P_ATM, P_ATM - v).massFlowKgPerS;
      expect(m).toBeGreaterThanOrEqual(prev);
      prev = m;
    }
  });
});

describe('toolLaw guards', () => {
  it('bad tools are reported and closed, never NaN', () => {
    expect(toolLawProblems({ kind: 'orifice', diameterM: 0, dischargeCoefficient: 0.6 })).toContain('orifice-diameter-not-positive');
    expect(toolLawProblems({ kind: 'orifice', diameterM: 0.02, dischargeCoefficient: 1.5 })).toContain('discharge-coefficient-invalid');
    expect(toolLawProblems({ kind: 'table', points: [] })).toEqual(['table-has-no-points']);
    expect(toolLawProblems({ kind: 'table', points: [{ vacuumPa: 1, flowStdM3PerS: 2 }, { vacuumPa: 2, flowStdM3PerS: 1 }] })).toEqual(['table-flow-falls']);
    const laws = [
      toolLaw({ kind: 'orifice', diameterM: -1, dischargeCoefficient: 0.6 }, P_ATM, T),
      toolLaw({ kind: 'orifice', diameterM: 0.02, dischargeCoefficient: Number.NaN }, P_ATM, T),
      toolLaw({ kind: 'table', points: [] }, P_ATM, T),
      toolLaw({ kind: 'table', points: [{ vacuumPa: Number.NaN, flowStdM3PerS: 1 }] }, Number.NaN, Number.NaN),
    ];
    for (const law of laws) {
      for (const [pa, pb] of [[P_ATM, 9e4], [0, 0], [Number.NaN, 1], [-1, P_ATM]]) {
        const r = law.flow(pa as number, pb as number);
        expect(Number.isFinite(r.massFlowKgPerS) && Number.isFinite(r.dFlowDPa) && Number.isFinite(r.dFlowDPb)).toBe(true);
      }
    }
    expect(laws[0]?.flow(P_ATM, 9e4).massFlowKgPerS).toBe(0);
    // NaN Cd falls back to 0.61
    const dflt = toolLaw({ kind: 'orifice', diameterM: 0.0254, dischargeCoefficient: 0.61 }, P_ATM, T).flow(P_ATM, 9e4).massFlowKgPerS;
    expect(laws[1]?.flow(P_ATM, 9e4).massFlowKgPerS).toBeCloseTo(dflt * (0.02 / 0.0254) ** 2, 12);
    expect(roomAirFlow(1, 0, T)).toBe(0);
  });
});
