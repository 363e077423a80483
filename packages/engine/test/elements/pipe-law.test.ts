import { describe, expect, it } from 'vitest';
import { airViscosity } from '../../src/air/viscosity.js';
import {
  pipeChoking,
  pipeLaw,
  type PipeLawParams,
  pipeParamProblems,
  pipePressureDrop,
  pipeReynolds,
  pipeVelocity,
} from '../../src/elements/pipe-law.js';

const IN_HG = 3386.389; // Pa, NIST SP 811
const R = 287.05;
const pipe: PipeLawParams = { diameterM: 0.0525, lengthM: 30, roughnessM: 0.045e-3, sumK: 0, temperatureK: 293.15 };

function fdCheck(law: ReturnType<typeof pipeLaw>, pa: number, pb: number): void {
  const r = law.flow(pa, pb);
  const h = Math.max(1e-3, 1e-7 * Math.max(pa, pb));
  const dA = (law.flow(pa + h, pb).massFlowKgPerS - law.flow(pa - h, pb).massFlowKgPerS) / (2 * h);
  const dB = (law.flow(pa, pb + h).massFlowKgPerS - law.flow(pa, pb - h).massFlowKgPerS) / (2 * h);
  const scale = Math.abs(dA) + Math.abs(dB) + 1e-15;
  expect(Math.abs(r.dFlowDPa - dA) / scale, `dPa at ${pa}, ${pb}`).toBeLessThan(1e-5);
  expect(Math.abs(r.dFlowDPb - dB) / scale, `dPb at ${pa}, ${pb}`).toBeLessThan(1e-5);
}

describe('pipeLaw (isothermal flow, Churchill friction)', () => {
  it('0.05 kg/s at p1 = 101325 - 5 inHg: Re 66,869; Colebrook f 0.022707 gives p2 80,844 Pa (CHECKS.md [K])', () => {
    const p1 = 101325 - 5 * IN_HG;
    expect(p1).toBeCloseTo(84393, 0);
    expect(pipeReynolds(0.05, 0.0525, 293.15)).toBeCloseTo(66869, 0);
    const colebrook = pipePressureDrop(pipe, p1, 0.05, 'colebrook');
    expect(colebrook.ok && colebrook.outletPressurePa).toBeCloseTo(80844, 0);
    // Churchill (the solver's factor) is within 0.5 % of Colebrook here: p2 within 30 Pa.
    const churchill = pipePressureDrop(pipe, p1, 0.05);
    expect(churchill.ok).toBe(true);
    if (churchill.ok && colebrook.ok) expect(Math.abs(churchill.outletPressurePa - colebrook.outletPressurePa)).toBeLessThan(30);
    // and the law inverts it
    if (churchill.ok) expect(pipeLaw(pipe).flow(p1, churchill.outletPressurePa).massFlowKgPerS).toBeCloseTo(0.05, 10);
  });

  it('the flow runs from high to low pressure and is antisymmetric', () => {
    const law = pipeLaw(pipe);
    const f = law.flow(95e3, 80e3);
    const g = law.flow(80e3, 95e3);
    expect(f.massFlowKgPerS).toBeGreaterThan(0);
    expect(g.massFlowKgPerS).toBeCloseTo(-f.massFlowKgPerS, 14);
    expect(g.dFlowDPa).toBeCloseTo(-f.dFlowDPb, 14);
    expect(g.dFlowDPb).toBeCloseTo(-f.dFlowDPa, 14);
  });

  it('at equal pressures: zero flow, derivative = Hagen-Poiseuille rho pi D^4 / (128 mu L)', () => {
    const law = pipeLaw(pipe);
    const p = 90e3;
    const r = law.flow(p, p);
    const rho = p / (R * 293.15);
    const hp = (rho * Math.PI * 0.0525 ** 4) / (128 * airViscosity(293.15) * 30);
    expect(r.massFlowKgPerS).toBe(0);
    expect(r.dFlowDPa).toBeCloseTo(hp, 12);
    expect(r.dFlowDPb).toBeCloseTo(-hp, 12);
    // with a friction multiplier the laminar conductance scales as 1/multiplier
    expect(pipeLaw({ ...pipe, frictionMultiplier: 2 }).flow(p, p).dFlowDPa).toBeCloseTo(hp / 2, 12);
  });

  it('small pressure differences: laminar Hagen-Poiseuille flow (Re < 2000)', () => {
    const law = pipeLaw({ ...pipe, lengthM: 100 });
    const dp = 0.01;
    const m = law.flow(90e3 + dp, 90e3).massFlowKgPerS;
    const rho = (90e3 + dp / 2) / (R * 293.15);
    expect(pipeReynolds(m, 0.0525, 293.15)).toBeLessThan(2000);
    expect(m).toBeCloseTo((rho * Math.PI * 0.0525 ** 4 * dp) / (128 * airViscosity(293.15) * 100), 12);
  });

  it('derivatives match central finite differences: laminar, transition, turbulent, reversed, with fittings', () => {
    const law = pipeLaw({ ...pipe, sumK: 1.3 });
    for (const [pa, pb] of [[90000.2, 90000], [90003, 90000], [90012, 90000], [90030, 90000], [95e3, 80e3], [101325, 60e3], [60e3, 101325], [30e3, 29e3]]) {
      fdCheck(law, pa as number, pb as number);
    }
  });

  it('chokes: held at the maximum flow, flagged, derivative in pb zero, dPa matches finite differences', () => {
    const short = { ...pipe, lengthM: 1, diameterM: 0.01 };
    const choke = pipeChoking(short, 101325);
    expect(choke).toBeDefined();
    if (!choke) return;
    const law = pipeLaw(short);
    const r = law.flow(101325, choke.outletPressurePa * 0.5);
    expect(r.limited).toBe('choked');
    expect(r.massFlowKgPerS).toBeCloseTo(choke.massFlowKgPerS, 12);
    expect(r.dFlowDPb).toBe(0);
    expect(law.flow(101325, choke.outletPressurePa * 1.05).limited).toBeUndefined();
    fdCheck(law, 101325, choke.outletPressurePa * 0.5);
    // outlet Mach 1/sqrt(kappa): velocity sqrt(RT) at the choking outlet pressure (isothermal sound speed)
    expect(pipeVelocity(choke.outletPressurePa, choke.massFlowKgPerS, 0.01, 293.15)).toBeCloseTo(Math.sqrt(R * 293.15), 6);
    // flow above choking has no pressure drop
    expect(pipePressureDrop(short, 101325, choke.massFlowKgPerS * 1.1)).toMatchObject({ ok: false, reason: 'choked' });
  });

  it('velocity: v = m R T / (p A)', () => {
    expect(pipeVelocity(101325, 1.2041 * 0.05, 0.05, 293.15)).toBeCloseTo(0.05 / ((Math.PI * 0.05 ** 2) / 4), 3);
  });

  it('guards: never NaN, never throws', () => {
    const bad: PipeLawParams[] = [
      { ...pipe, diameterM: 0 },
      { ...pipe, diameterM: Number.NaN },
      { ...pipe, lengthM: 0 },
      { ...pipe, lengthM: -5 },
      { ...pipe, roughnessM: Number.NaN },
      { ...pipe, sumK: -3 },
      { ...pipe, temperatureK: 0 },
      { ...pipe, frictionMultiplier: 0 },
    ];
    for (const p of bad) {
      expect(pipeParamProblems(p).length, JSON.stringify(p)).toBeGreaterThan(0);
      const law = pipeLaw(p);
      for (const [pa, pb] of [[1e5, 9e4], [0, 9e4], [-5, 1e5], [Number.NaN, 1e5], [1e5, 1e5], [Number.POSITIVE_INFINITY, 1]]) {
        const r = law.flow(pa as number, pb as number);
        expect(Number.isFinite(r.massFlowKgPerS) && Number.isFinite(r.dFlowDPa) && Number.isFinite(r.dFlowDPb), `${JSON.stringify(p)} ${pa} ${pb}`).toBe(true);
      }
    }
    expect(pipeParamProblems(pipe)).toEqual([]);
    expect(pipeLaw({ ...pipe, diameterM: 0 }).flow(1e5, 9e4).massFlowKgPerS).toBe(0);
    expect(pipePressureDrop({ ...pipe, diameterM: 0 }, 1e5, 0.01)).toMatchObject({ ok: false, reason: 'invalid-input' });
    expect(pipePressureDrop(pipe, 1e5, 0)).toMatchObject({ ok: true, dropPa: 0 });
    expect(pipeVelocity(0, 1, 0.05, 293.15)).toBe(0);
    expect(pipeReynolds(Number.NaN, 0.05, 293.15)).toBe(0);
  });
});
