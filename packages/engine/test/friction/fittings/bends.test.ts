import { describe, expect, it } from 'vitest';
import {
  acgihElbowK,
  bendFittingsK,
  bendLossCoefficient,
  craneBend90K,
  craneFullyTurbulentFactor,
  dieStampedElbowK,
  elbowAngleFactor,
  mitredElbowK,
  smoothElbowK,
  threeGoreElbowK,
} from '../../../src/friction/fittings/bends.js';
import { colebrookFrictionFactor } from '../../../src/friction/colebrook.js';

const deg = (d: number): number => (d * Math.PI) / 180;

describe('elbow angle factor (ASHRAE CR3-1, 2005; CHECKS.md [C])', () => {
  it('30 / 45 / 60 / 90 deg = 0.45 / 0.60 / 0.78 / 1.00', () => {
    expect(elbowAngleFactor(deg(30))).toBeCloseTo(0.45, 10);
    expect(elbowAngleFactor(deg(45))).toBeCloseTo(0.6, 10);
    expect(elbowAngleFactor(deg(60))).toBeCloseTo(0.78, 10);
    expect(elbowAngleFactor(deg(90))).toBeCloseTo(1.0, 10);
  });
  it('rises with angle', () => {
    let prev = -1;
    for (let d = 0; d <= 180; d += 5) {
      const k = elbowAngleFactor(deg(d));
      expect(k).toBeGreaterThan(prev);
      prev = k;
    }
  });
});

describe('ASHRAE elbow data (CHECKS.md [C])', () => {
  it('die-stamped 90 deg R/D 1.5 at 75 / 100 / 150 mm = 0.30 / 0.21 / 0.14 (CD3-1, 2009)', () => {
    expect(dieStampedElbowK(90, 0.075)).toBeCloseTo(0.3, 10);
    expect(dieStampedElbowK(90, 0.1)).toBeCloseTo(0.21, 10);
    expect(dieStampedElbowK(90, 0.15)).toBeCloseTo(0.14, 10);
  });
  it('die-stamped 45 deg R/D 1.5 at 75 / 150 mm = 0.18 / 0.08 (CD3-3)', () => {
    expect(dieStampedElbowK(45, 0.075)).toBeCloseTo(0.18, 10);
    expect(dieStampedElbowK(45, 0.15)).toBeCloseTo(0.08, 10);
  });
  it('3-gore 90 deg at R/D 0.75 / 1 / 1.5 / 2 = 0.54 / 0.42 / 0.34 / 0.33 (CD3-12)', () => {
    expect(threeGoreElbowK(deg(90), 0.75)).toBeCloseTo(0.54, 10);
    expect(threeGoreElbowK(deg(90), 1)).toBeCloseTo(0.42, 10);
    expect(threeGoreElbowK(deg(90), 1.5)).toBeCloseTo(0.34, 10);
    expect(threeGoreElbowK(deg(90), 2)).toBeCloseTo(0.33, 10);
  });
  it('a 45 deg 3-gore elbow is the 90 deg value x 0.60 (CR3-1)', () => {
    expect(threeGoreElbowK(deg(45), 1.5)).toBeCloseTo(0.34 * 0.6, 10);
  });
});

describe('Crane bends (Crane TP-410, 2009)', () => {
  it('90 deg L/D at r/d 1 / 1.5 / 2 / 3 = 20 / 14 / 12 / 12 times f_T (CHECKS.md [C])', () => {
    expect(craneBend90K(1, 1)).toBe(20);
    expect(craneBend90K(1.5, 1)).toBe(14);
    expect(craneBend90K(2, 1)).toBe(12);
    expect(craneBend90K(3, 1)).toBe(12);
  });
  it('r/d 1.5 in 2 in schedule 40 (ID 52.50 mm, e 0.045 mm): K = 0.265 (CHECKS.md [K])', () => {
    const fT = craneFullyTurbulentFactor(0.045 / 52.5);
    expect(craneBend90K(1.5, fT)).toBeCloseTo(0.265, 3);
  });
  it('f_T is the fully rough limit of Colebrook-White', () => {
    const rr = 0.045 / 52.5;
    expect(Math.abs(craneFullyTurbulentFactor(rr) / colebrookFrictionFactor(1e12, rr) - 1)).toBeLessThan(1e-5);
  });
});

describe('ACGIH elbows ([M], from memory: wide band)', () => {
  it('R/D 1.5 / 2.0 / 2.5 = 0.39 / 0.27 / 0.22 VP', () => {
    expect(acgihElbowK(1.5)).toBeCloseTo(0.39, 10);
    expect(acgihElbowK(2.0)).toBeCloseTo(0.27, 10);
    expect(acgihElbowK(2.5)).toBeCloseTo(0.22, 10);
  });
});

describe('bendLossCoefficient (the engine default)', () => {
  it('at R/D 1.5 and 90 deg equals the ASHRAE die-stamped value by size', () => {
    expect(bendLossCoefficient(deg(90), 1.5, 0.075)).toBeCloseTo(0.3, 10);
    expect(bendLossCoefficient(deg(90), 1.5, 0.15)).toBeCloseTo(0.15, 10); // not below the smooth curve 0.15
  });
  it('is within 35 % of the ACGIH elbow values for 2 in tubing ([M] band)', () => {
    for (const rd of [1.5, 2.0, 2.5]) {
      const k = bendLossCoefficient(deg(90), rd, 0.0508);
      expect(Math.abs(k / acgihElbowK(rd) - 1), `R/D ${rd}`).toBeLessThan(0.35);
    }
  });
  it('falls with R/D, rises with angle, stays at or below a mitred elbow', () => {
    let prev = Number.POSITIVE_INFINITY;
    for (let rd = 0; rd <= 4; rd += 0.25) {
      const k = bendLossCoefficient(deg(90), rd, 0.05);
      expect(k).toBeLessThanOrEqual(prev + 1e-12);
      expect(k).toBeLessThanOrEqual(mitredElbowK(deg(90)) + 1e-12);
      prev = k;
    }
    expect(bendLossCoefficient(deg(45), 1.5, 0.1)).toBeLessThan(bendLossCoefficient(deg(90), 1.5, 0.1));
  });
  it('smooth-radius elbow (ASHRAE CD3-1, 1997, from memory): R/D 1.5 at 90 deg = 0.15', () => {
    expect(smoothElbowK(deg(90), 1.5)).toBeCloseTo(0.15, 10);
  });
  it('guards: bad inputs give finite non-negative values', () => {
    for (const [a, rd, d] of [[Number.NaN, 1.5, 0.05], [deg(90), Number.NaN, 0.05], [deg(90), -1, -1], [deg(90), 1.5, Number.NaN], [deg(-90), 1.5, 0.05]]) {
      const k = bendLossCoefficient(a as number, rd as number, d as number);
      expect(Number.isFinite(k) && k >= 0, `${a} ${rd} ${d}`).toBe(true);
    }
    expect(craneBend90K(1.5, Number.NaN)).toBe(0);
    expect(Number.isFinite(craneFullyTurbulentFactor(0))).toBe(true);
  });
});

describe('bendFittingsK', () => {
  it('adds bend K x count, skips reducers and bad counts', () => {
    const k90 = bendLossCoefficient(deg(90), 1.5, 0.1);
    const k45 = bendLossCoefficient(deg(45), 1.5, 0.1);
    expect(
      bendFittingsK(
        [
          { kind: 'bend', angleRad: deg(90), count: 2, radiusRatio: 1.5 },
          { kind: 'bend', angleRad: deg(45), count: 1, radiusRatio: 1.5 },
          { kind: 'reducer' },
          { kind: 'bend', angleRad: deg(90), count: Number.NaN, radiusRatio: 1.5 },
        ],
        0.1,
      ),
    ).toBeCloseTo(2 * k90 + k45, 12);
    expect(bendFittingsK([], 0.1)).toBe(0);
  });
});
