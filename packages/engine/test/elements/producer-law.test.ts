import { describe, expect, it } from 'vitest';
import { producerLaw, producerProblems, RELIEF_BAND_SHARE } from '../../src/elements/producer-law.js';
import type { ProducerModel, ProducerUnit } from '../../src/network/model.js';

const P_ATM = 101325;
const T = 293.15;
const RT = 287.05 * T;
const RHO_STD = 101325 / RT;
const IN_HG = 3386.389;

// A sample curve (ours, producer-like): vacuum falls with flow.
const curve = [
  { flowM3PerS: 0, vacuumPa: 50000 },
  { flowM3PerS: 0.05, vacuumPa: 48000 },
  { flowM3PerS: 0.1, vacuumPa: 44000 },
  { flowM3PerS: 0.15, vacuumPa: 37000 },
  { flowM3PerS: 0.2, vacuumPa: 27000 },
  { flowM3PerS: 0.25, vacuumPa: 12000 },
];
const model = (over: Partial<ProducerModel> = {}): ProducerModel => ({ name: 'p', flowBasis: 'standard', curve, ...over });
const unit = (m: ProducerModel, exhaust?: ProducerUnit['exhaust']): ProducerUnit => (exhaust ? { name: 'u', model: m, exhaust } : { name: 'u', model: m });

function fdCheck(law: ReturnType<typeof producerLaw>, pa: number, pb: number): void {
  const r = law.flow(pa, pb);
  const h = 0.01;
  const dA = (law.flow(pa + h, pb).massFlowKgPerS - law.flow(pa - h, pb).massFlowKgPerS) / (2 * h);
  const dB = (law.flow(pa, pb + h).massFlowKgPerS - law.flow(pa, pb - h).massFlowKgPerS) / (2 * h);
  const s = Math.abs(dA) + Math.abs(dB) + 1e-15;
  expect(Math.abs(r.dFlowDPa - dA) / s, `dPa at ${pa}`).toBeLessThan(1e-5);
  expect(Math.abs(r.dFlowDPb - dB) / s, `dPb at ${pa}`).toBeLessThan(1e-5);
}

describe('producerLaw (curve by PCHIP, ENGINEERING.md)', () => {
  it('standard basis: at each curve vacuum the flow is the curve flow x 1.2041 kg/m3', () => {
    const law = producerLaw(unit(model()), T);
    for (const p of curve.slice(1)) {
      const r = law.flow(P_ATM - p.vacuumPa, P_ATM);
      expect(r.massFlowKgPerS, `at ${p.vacuumPa}`).toBeCloseTo(p.flowM3PerS * RHO_STD, 10);
      expect(r.limited).toBeUndefined();
    }
  });

  it('actual basis: the curve flow is at the inlet state, m = Q p_a / (R T)', () => {
    const law = producerLaw(unit(model({ flowBasis: 'actual' })), T);
    const pa = P_ATM - 37000;
    expect(law.flow(pa, P_ATM).massFlowKgPerS).toBeCloseTo((0.15 * pa) / RT, 10);
  });

  it('flow falls as the vacuum rises (monotone), and is continuous', () => {
    const law = producerLaw(unit(model()), T);
    let prev = Number.POSITIVE_INFINITY;
    for (let v = -5000; v <= 60000; v += 500) {
      const m = law.flow(P_ATM - v, P_ATM).massFlowKgPerS;
      expect(m).toBeLessThan(prev);
      prev = m;
    }
  });

  it('beyond the last curve flow: linear extension, flagged curve-end; above shut-off: reverse flow, flagged', () => {
    const law = producerLaw(unit(model()), T);
    const r = law.flow(P_ATM - 5000, P_ATM);
    expect(r.limited).toBe('curve-end');
    expect(r.massFlowKgPerS).toBeGreaterThan(0.25 * RHO_STD);
    const s = law.flow(P_ATM - 55000, P_ATM);
    expect(s.limited).toBe('curve-end');
    expect(s.massFlowKgPerS).toBeLessThan(0);
  });

  it('an exhaust loss: the producer vacuum covers inlet vacuum plus the exhaust loss', () => {
    const exhaust = { lossPa: 2000, flowStdM3PerS: 0.2 };
    const law = producerLaw(unit(model(), exhaust), T);
    const free = producerLaw(unit(model()), T);
    // At 0.2 Sm3/s the exhaust loses 2000 Pa at standard density, so the inlet sees 27000 - 2000 (exhaust density at 101325 Pa, 20 C).
    const r = law.flow(P_ATM - 25000, P_ATM);
    expect(r.massFlowKgPerS).toBeCloseTo(0.2 * RHO_STD, 8);
    expect(r.massFlowKgPerS).toBeLessThan(free.flow(P_ATM - 25000, P_ATM).massFlowKgPerS);
  });

  it('vacuum relief: holds near the set vacuum, producer flow not below the curve flow there', () => {
    const relief = 44000;
    const law = producerLaw(unit(model({ reliefVacuumPa: relief })), T);
    const atSet = law.flow(P_ATM - relief, P_ATM).massFlowKgPerS;
    expect(atSet).toBeCloseTo(0.1 * RHO_STD, 10);
    const over = law.flow(P_ATM - relief * (1 + RELIEF_BAND_SHARE / 2), P_ATM);
    expect(over.limited).toBe('relief');
    expect(over.massFlowKgPerS).toBeCloseTo(atSet / 2, 10);
    expect(law.flow(P_ATM - relief * (1 + RELIEF_BAND_SHARE), P_ATM).massFlowKgPerS).toBeCloseTo(0, 10);
    // without relief the same vacuum still draws flow on the curve
    expect(producerLaw(unit(model()), T).flow(P_ATM - relief * 1.025, P_ATM).massFlowKgPerS).toBeGreaterThan(0.05 * RHO_STD);
  });

  it('derivatives match finite differences: on the curve, both extensions, exhaust, actual basis, relief', () => {
    const exhaust = { lossPa: 2000, flowStdM3PerS: 0.2 };
    const laws = [
      producerLaw(unit(model()), T),
      producerLaw(unit(model({ flowBasis: 'actual' }), exhaust), T),
      producerLaw(unit(model({ reliefVacuumPa: 40000 }), exhaust), T),
      producerLaw(unit(model({ flowBasis: 'actual', reliefVacuumPa: 40000 })), T),
    ];
    for (const law of laws) {
      for (const v of [-3000, 3000, 12 * IN_HG, 30000, 41000, 47000, 56000]) fdCheck(law, P_ATM - v, P_ATM);
    }
  });

  it('guards: bad models are reported and closed; bad pressures give finite values', () => {
    expect(producerProblems(model({ curve: [curve[0] as (typeof curve)[number]] }))).toContain('curve-too-short');
    expect(producerProblems(model({ curve: [{ flowM3PerS: 0, vacuumPa: 1 }, { flowM3PerS: 0.1, vacuumPa: 2 }] }))).toContain('curve-vacuum-rises');
    expect(producerProblems(model({ curve: [{ flowM3PerS: 0.1, vacuumPa: 2 }, { flowM3PerS: 0.1, vacuumPa: 1 }] }))).toContain('curve-flow-not-ascending');
    expect(producerProblems(model({ efficiency: 1.5 }))).toContain('efficiency-invalid');
    expect(producerProblems(model({ reliefVacuumPa: -1 }))).toContain('relief-invalid');
    expect(producerProblems(model())).toEqual([]);
    const closed = producerLaw(unit(model({ curve: [] })), T);
    expect(closed.flow(9e4, P_ATM)).toEqual({ massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 });
    // a flat curve still gives a unique, finite answer
    const flat = producerLaw(unit(model({ curve: [{ flowM3PerS: 0, vacuumPa: 20000 }, { flowM3PerS: 0.1, vacuumPa: 20000 }] })), T);
    const law = producerLaw(unit(model({ reliefVacuumPa: 30000 }), { lossPa: 1000, flowStdM3PerS: 0.1 }), Number.NaN);
    for (const l of [flat, law]) {
      for (const [pa, pb] of [[0, P_ATM], [Number.NaN, P_ATM], [P_ATM, 0], [-1, -1], [9e4, P_ATM]]) {
        const r = l.flow(pa as number, pb as number);
        expect(Number.isFinite(r.massFlowKgPerS) && Number.isFinite(r.dFlowDPa) && Number.isFinite(r.dFlowDPb), `${pa} ${pb}`).toBe(true);
      }
    }
  });
});

describe('producerLaw read the other way: the inlet pressure for a flow', () => {
  const up = { pressurePa: 0, dPressureDFlow: 0, dPressureDDown: 0 };
  it('standard basis: at each curve flow the inlet sits at the curve vacuum (the curve points themselves)', () => {
    const law = producerLaw(unit(model()), T);
    for (const p of curve.slice(1)) {
      expect(law.inletPressureInto!(p.flowM3PerS * RHO_STD, P_ATM, up)).toBe(true);
      expect(up.pressurePa).toBeCloseTo(P_ATM - p.vacuumPa, 6);
    }
  });
  it('inverts the flow law on both bases, with an exhaust line, with derivatives as finite differences', () => {
    const exhaust = { lossPa: 2 * 249.082, flowStdM3PerS: 0.2 };
    for (const law of [producerLaw(unit(model()), T), producerLaw(unit(model({ flowBasis: 'actual' }), exhaust), T)]) {
      for (const pa of [55000, 70000, 85000]) {
        const m = law.flow(pa, P_ATM).massFlowKgPerS;
        expect(law.inletPressureInto!(m, P_ATM, up)).toBe(true);
        expect(up.pressurePa).toBeCloseTo(pa, 6);
        const r = law.flow(pa, P_ATM);
        expect(up.dPressureDFlow).toBeCloseTo(1 / r.dFlowDPa, 0);
        expect(up.dPressureDDown).toBeCloseTo(-r.dFlowDPb / r.dFlowDPa, 9);
      }
    }
  });
  it('past the relief set vacuum it leaves the answer to the flow law', () => {
    const law = producerLaw(unit(model({ reliefVacuumPa: 30000 })), T);
    // 0.12 m3/s standard sits near 40 kPa on the curve: beyond the 30 kPa relief.
    expect(law.inletPressureInto!(0.12 * RHO_STD, P_ATM, up)).toBe(false);
    expect(law.inletPressureInto!(0.22 * RHO_STD, P_ATM, up)).toBe(true);
  });
});
