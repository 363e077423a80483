import { describe, expect, it } from 'vitest';
import { isothermalChoking, isothermalFlow, isothermalOutletPressure, type IsothermalPipe } from '../../src/elements/isothermal-pipe.js';

/** A pipe with a constant Darcy factor f (as in the published examples). */
function constantF(f: number, over: Partial<IsothermalPipe>): IsothermalPipe {
  return {
    diameterM: 0.5,
    lengthM: 1000,
    sumK: 0,
    rt: 287.05 * 293.15,
    viscosityPaS: 1.8e-5,
    friction: (re: number) => ({ fRe: f * re, dFReDRe: f }),
    ...over,
  };
}

describe('isothermal compressible flow (Crane TP-410; Rennels and Hudson 2012)', () => {
  // fluids isothermal_gas docs, after Crane: rho1 11.3 kg/m3 at p1 1 MPa fixes RT = p1/rho1.
  const crane = constantF(0.00185, { rt: 1e6 / 11.3 });

  it('rho1 11.3, f 0.00185, p1 1 MPa, p2 0.9 MPa, L 1000 m, D 0.5 m: m = 145.4848 kg/s (CHECKS.md [C])', () => {
    expect(isothermalFlow(crane, 1e6, 9e5).massFlowKgPerS).toBeCloseTo(145.4848, 4);
  });

  it('same pipe, p1 1 MPa: choking outlet pressure 389,699.7 Pa (fluids docs, Wilkes; CHECKS.md [C])', () => {
    expect(isothermalChoking(crane, 1e6).outletPressurePa).toBeCloseTo(389699.7, 1);
  });

  it('below the choking pressure the flow is held at the maximum, never the false root', () => {
    const { massFlowKgPerS: mMax } = isothermalChoking(crane, 1e6);
    let prev = 0;
    for (let p2 = 999e3; p2 > 1e3; p2 -= 7e3) {
      const r = isothermalFlow(crane, 1e6, p2);
      expect(r.massFlowKgPerS).toBeGreaterThanOrEqual(prev - 1e-9);
      expect(r.massFlowKgPerS).toBeLessThanOrEqual(mMax * (1 + 1e-12));
      expect(r.choked).toBe(p2 < 389699.7);
      if (r.choked) {
        expect(r.massFlowKgPerS).toBeCloseTo(mMax, 9);
        expect(r.dFlowDP2).toBe(0);
      }
      prev = r.massFlowKgPerS;
    }
  });

  it('choked outlet: Mach 1/sqrt(kappa), i.e. velocity sqrt(RT) at p2* (Shapiro 1953)', () => {
    const { outletPressurePa, massFlowKgPerS } = isothermalChoking(crane, 1e6);
    const area = Math.PI * 0.25 * 0.25;
    const v2 = (massFlowKgPerS * crane.rt) / (outletPressurePa * area);
    expect(v2).toBeCloseTo(Math.sqrt(crane.rt), 9);
  });

  const small = constantF(0.02, { diameterM: 0.0525, lengthM: 30 });
  it('D 0.0525 m, L 30 m, f 0.02, 95 -> 80 kPa, 20 C: 0.111434 kg/s (CHECKS.md [K])', () => {
    expect(isothermalFlow(small, 95e3, 80e3).massFlowKgPerS).toBeCloseTo(0.111434, 6);
  });
  it('without the 2 ln term: 0.113098 kg/s, which is Darcy-Weisbach at the mean density (identity, CHECKS.md [K])', () => {
    const noAccel = { ...small, accelerationTerm: false };
    const m = isothermalFlow(noAccel, 95e3, 80e3).massFlowKgPerS;
    expect(m).toBeCloseTo(0.113098, 6);
    const rhoMean = (95e3 + 80e3) / (2 * small.rt);
    const area = (Math.PI * 0.0525 ** 2) / 4;
    const v = m / (rhoMean * area);
    const dpDarcy = ((0.02 * 30) / 0.0525) * 0.5 * rhoMean * v * v;
    expect(dpDarcy).toBeCloseTo(15e3, 6);
  });
  it('incompressible flow at inlet density overestimates: 0.11785 kg/s (CHECKS.md [K])', () => {
    const rho1 = 95e3 / small.rt;
    const area = (Math.PI * 0.0525 ** 2) / 4;
    const mIncompressible = area * Math.sqrt((2 * rho1 * 15e3) / ((0.02 * 30) / 0.0525));
    expect(mIncompressible).toBeCloseTo(0.11785, 5);
    expect(isothermalFlow(small, 95e3, 80e3).massFlowKgPerS).toBeLessThan(mIncompressible);
  });
  it('outlet pressure inverts the flow; above choking it is a typed failure', () => {
    const r = isothermalOutletPressure(small, 95e3, 0.111434397777);
    expect(r.ok && r.outletPressurePa).toBeCloseTo(80e3, 2);
    const choke = isothermalChoking(small, 95e3);
    const bad = isothermalOutletPressure(small, 95e3, choke.massFlowKgPerS * 1.01);
    expect(bad).toMatchObject({ ok: false, reason: 'choked' });
  });
  it('sum K adds to f L/D', () => {
    const withK = constantF(0.01, { diameterM: 0.0525, lengthM: 30, sumK: (0.01 * 30) / 0.0525 });
    expect(isothermalFlow(withK, 95e3, 80e3).massFlowKgPerS).toBeCloseTo(0.111434, 6);
  });
});
