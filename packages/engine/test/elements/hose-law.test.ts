import { describe, expect, it } from 'vitest';
import { DEFAULT_HOSE_ROUGHNESS_M, hoseFrictionMultiplier, hoseLaw, hosePipeParams } from '../../src/elements/hose-law.js';
import { pipeLaw } from '../../src/elements/pipe-law.js';
import type { HoseKind } from '../../src/network/model.js';

const RHO_STD = 101325 / (287.05 * 293.15);
const P_ATM = 101325;
const base: HoseKind = { name: 'h', lengthM: 9.144, boreM: 0.0381, conductive: true };

describe('hoseLaw', () => {
  it('without a measured point: a pipe with the hose roughness (default 0.3 mm, inside ASHRAE flexible duct 0.09-0.9 mm)', () => {
    expect(DEFAULT_HOSE_ROUGHNESS_M).toBeGreaterThanOrEqual(0.09e-3);
    expect(DEFAULT_HOSE_ROUGHNESS_M).toBeLessThanOrEqual(0.9e-3);
    const a = hoseLaw(base, P_ATM, 293.15).flow(P_ATM, 90000).massFlowKgPerS;
    const b = pipeLaw({ diameterM: 0.0381, lengthM: 9.144, roughnessM: DEFAULT_HOSE_ROUGHNESS_M, sumK: 0, temperatureK: 293.15 }).flow(P_ATM, 90000).massFlowKgPerS;
    expect(a).toBe(b);
    const rough = hoseLaw({ ...base, roughnessM: 0.9e-3 }, P_ATM, 293.15).flow(P_ATM, 90000).massFlowKgPerS;
    expect(rough).toBeLessThan(a);
  });

  it('calibrated from a measured point: the hose passes exactly that point', () => {
    // A loss point: 100 scfm (0.0472 m3/s) through 30 ft of 1.5 in hose losing 10 kPa, tool end in the room.
    const measured: HoseKind = { ...base, measuredLoss: { lossPa: 10000, flowStdM3PerS: 0.0471947 } };
    const cal = hoseFrictionMultiplier(measured, P_ATM, 293.15);
    expect(cal.ok).toBe(true);
    const m = hoseLaw(measured, P_ATM, 293.15).flow(P_ATM, P_ATM - 10000).massFlowKgPerS;
    expect(m).toBeCloseTo(0.0471947 * RHO_STD, 10);
  });

  it('recovers a known friction multiplier from the loss its own law produces', () => {
    const params = hosePipeParams(base, 293.15, 1.7);
    const m = pipeLaw(params).flow(P_ATM, 85000).massFlowKgPerS;
    const cal = hoseFrictionMultiplier({ ...base, measuredLoss: { lossPa: P_ATM - 85000, flowStdM3PerS: m / RHO_STD } }, P_ATM, 293.15);
    expect(cal.ok && cal.frictionMultiplier).toBeCloseTo(1.7, 9);
  });

  it('a larger measured loss means a larger multiplier', () => {
    const at = (loss: number) => hoseFrictionMultiplier({ ...base, measuredLoss: { lossPa: loss, flowStdM3PerS: 0.04 } }, P_ATM, 293.15);
    const a = at(8000);
    const b = at(12000);
    expect(a.ok && b.ok && b.frictionMultiplier > a.frictionMultiplier).toBe(true);
  });

  it('failures are typed and fall back to the rough-wall hose', () => {
    expect(hoseFrictionMultiplier(base, P_ATM, 293.15)).toEqual({ ok: false, reason: 'no-measured-point' });
    expect(hoseFrictionMultiplier({ ...base, measuredLoss: { lossPa: 2e5, flowStdM3PerS: 0.04 } }, P_ATM, 293.15)).toEqual({ ok: false, reason: 'loss-too-large' });
    expect(hoseFrictionMultiplier({ ...base, measuredLoss: { lossPa: 1, flowStdM3PerS: 0.04 } }, P_ATM, 293.15)).toEqual({ ok: false, reason: 'loss-too-small' });
    expect(hoseFrictionMultiplier({ ...base, measuredLoss: { lossPa: 50000, flowStdM3PerS: 2 } }, P_ATM, 293.15)).toEqual({ ok: false, reason: 'choked' });
    // 60 kPa at a trickle of 0.005 m3/s needs a multiplier far above 20: a slip, not a hose.
    expect(hoseFrictionMultiplier({ ...base, measuredLoss: { lossPa: 60000, flowStdM3PerS: 0.005 } }, P_ATM, 293.15)).toEqual({ ok: false, reason: 'loss-too-large' });
    expect(hoseFrictionMultiplier({ ...base, boreM: 0, measuredLoss: { lossPa: 5000, flowStdM3PerS: 0.04 } }, P_ATM, 293.15)).toEqual({ ok: false, reason: 'invalid-hose' });
    const fallback = hoseLaw({ ...base, measuredLoss: { lossPa: 1, flowStdM3PerS: 0.04 } }, P_ATM, 293.15).flow(P_ATM, 90000).massFlowKgPerS;
    expect(fallback).toBe(hoseLaw(base, P_ATM, 293.15).flow(P_ATM, 90000).massFlowKgPerS);
    const r = hoseLaw({ ...base, boreM: Number.NaN }, Number.NaN, Number.NaN).flow(P_ATM, 1);
    expect(Number.isFinite(r.massFlowKgPerS) && Number.isFinite(r.dFlowDPa)).toBe(true);
  });
});
