/**
 * The pipe law's fast path (warm-started flow, closed-form inverse) against
 * the plain bracketed solve of the same isothermal equation, the CHECKS.md
 * worked example and isothermal choking.
 */
import { describe, expect, it } from 'vitest';
import { isothermalFlow } from '../../src/elements/isothermal-pipe.js';
import { isothermalPipeOf, pipeChoking, pipeLaw, type PipeLawParams } from '../../src/elements/pipe-law.js';
import type { PortFlow, UpstreamPressure } from '../../src/elements/two-port-law.js';

const IN_HG = 3386.389; // Pa, NIST SP 811
const pipe: PipeLawParams = { diameterM: 0.0525, lengthM: 30, roughnessM: 0.045e-3, sumK: 0, temperatureK: 293.15 };
const fitted: PipeLawParams = { diameterM: 0.0828, lengthM: 12, roughnessM: 45e-6, sumK: 0.8, temperatureK: 293.15, frictionMultiplier: 1.3 };

/** A deterministic walk of pressure pairs that jumps around, as Newton and an analysis do. */
function pairs(n: number): [number, number][] {
  const out: [number, number][] = [];
  let s = 12345;
  const r = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
  for (let i = 0; i < n; i++) {
    const p1 = 40000 + 60000 * r();
    // Drops from 1e-6 Pa (laminar) to 20 % of p1, on a log scale.
    const drop = p1 * 0.2 * 10 ** (-11 * r());
    out.push([p1, p1 - drop]);
  }
  return out;
}

describe('pipe law fast path: the same roots as the bracketed solve', () => {
  for (const params of [pipe, fitted]) {
    it(`flow and derivatives agree with isothermalFlow whatever the call history (D ${params.diameterM} m)`, () => {
      const law = pipeLaw(params);
      const core = isothermalPipeOf(params)!;
      for (const [p1, p2] of pairs(400)) {
        const fast = law.flow(p1, p2);
        const plain = isothermalFlow(core, p1, p2);
        expect(Math.abs(fast.massFlowKgPerS - plain.massFlowKgPerS)).toBeLessThanOrEqual(1e-12 * plain.massFlowKgPerS + 1e-300);
        expect(Math.abs(fast.dFlowDPa - plain.dFlowDP1)).toBeLessThanOrEqual(1e-7 * Math.abs(plain.dFlowDP1));
        expect(Math.abs(fast.dFlowDPb - plain.dFlowDP2)).toBeLessThanOrEqual(1e-7 * Math.abs(plain.dFlowDP2));
      }
    });
  }

  it('flowInto writes what flow returns, with no limit left over from a choked call', () => {
    const law = pipeLaw(pipe);
    const out: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 };
    law.flowInto!(95000, 5000, out); // far past choking
    expect(out.limited).toBe('choked');
    law.flowInto!(95000, 80000, out);
    expect(out.limited).toBeUndefined();
    expect(out.massFlowKgPerS).toBeCloseTo(law.flow(95000, 80000).massFlowKgPerS, 15);
  });
});

describe('pipe law inverse: the inlet pressure for a flow', () => {
  const up: UpstreamPressure = { pressurePa: 0, dPressureDFlow: 0, dPressureDDown: 0 };

  it('0.05 kg/s into 80,844 Pa needs 84,393 Pa at the inlet (CHECKS.md [K], Colebrook; Churchill within 30 Pa)', () => {
    const law = pipeLaw(pipe);
    expect(law.upstreamPressureInto!(0.05, 80844, up)).toBe(true);
    expect(Math.abs(up.pressurePa - (101325 - 5 * IN_HG))).toBeLessThan(30);
  });

  it('is the inverse of the flow law to rounding', () => {
    const law = pipeLaw(fitted);
    for (const [p1, p2] of pairs(200)) {
      const m = law.flow(p1, p2).massFlowKgPerS;
      expect(law.upstreamPressureInto!(m, p2, up)).toBe(true);
      expect(Math.abs(up.pressurePa - p1)).toBeLessThan(1e-9 * p1 + 1e-9 * (p1 - p2) * 1e3);
    }
  });

  it('derivatives match finite differences', () => {
    const law = pipeLaw(pipe);
    const at = (m: number, p2: number) => {
      law.upstreamPressureInto!(m, p2, up);
      return up.pressurePa;
    };
    for (const [m, p2] of [[0.05, 80844], [0.002, 60000], [0.12, 90000]] as const) {
      law.upstreamPressureInto!(m, p2, up);
      const { dPressureDFlow, dPressureDDown } = up;
      const hm = m * 1e-6;
      const hp = 1e-3;
      expect(dPressureDFlow).toBeCloseTo((at(m + hm, p2) - at(m - hm, p2)) / (2 * hm), 2);
      expect(dPressureDDown).toBeCloseTo((at(m, p2 + hp) - at(m, p2 - hp)) / (2 * hp), 6);
    }
  });

  it('finds no inlet pressure past isothermal choking (outlet Mach 1/sqrt(kappa), Shapiro 1953)', () => {
    const law = pipeLaw(pipe);
    const choke = pipeChoking(pipe, 95000)!;
    expect(law.upstreamPressureInto!(choke.massFlowKgPerS * 1.001, choke.outletPressurePa, up)).toBe(false);
    // Just below the choking flow the inverse lands back on the inlet pressure that chokes.
    expect(law.upstreamPressureInto!(choke.massFlowKgPerS * (1 - 1e-9), choke.outletPressurePa, up)).toBe(true);
    expect(up.pressurePa).toBeCloseTo(95000, -1);
  });

  it('zero flow: the same pressure both ends, the laminar slope', () => {
    const law = pipeLaw(pipe);
    expect(law.upstreamPressureInto!(0, 70000, up)).toBe(true);
    expect(up.pressurePa).toBe(70000);
    expect(up.dPressureDDown).toBe(1);
    // Hagen-Poiseuille in the isothermal form: dp1/dm = 64 alpha / (2 p A^2/(RT)), alpha = pi mu L / 4.
    const f = law.flow(70000 + 1e-6, 70000).massFlowKgPerS;
    expect(up.dPressureDFlow).toBeCloseTo(1e-6 / f, 0);
  });
});
