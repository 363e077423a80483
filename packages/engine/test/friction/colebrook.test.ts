import { describe, expect, it } from 'vitest';
import { colebrookFrictionFactor } from '../../src/friction/colebrook.js';

describe('Colebrook-White friction factor', () => {
  it('Re 1e5, e/D 1e-4: 0.0185139 (Colebrook 1939; fluids library docs, CHECKS.md [C])', () => {
    expect(colebrookFrictionFactor(1e5, 1e-4)).toBeCloseTo(0.0185139, 7);
  });
  it('smooth pipe: Re 4e3 / 1e4 / 1e5 / 1e6 (CHECKS.md [K])', () => {
    expect(colebrookFrictionFactor(4e3, 0)).toBeCloseTo(0.039907, 6);
    expect(colebrookFrictionFactor(1e4, 0)).toBeCloseTo(0.030883, 6);
    expect(colebrookFrictionFactor(1e5, 0)).toBeCloseTo(0.01799, 6);
    expect(colebrookFrictionFactor(1e6, 0)).toBeCloseTo(0.011645, 6);
  });
  it('rough pipe (CHECKS.md [K])', () => {
    expect(colebrookFrictionFactor(1e4, 1e-3)).toBeCloseTo(0.032382, 6);
    expect(colebrookFrictionFactor(1e5, 1e-3)).toBeCloseTo(0.022175, 6);
    expect(colebrookFrictionFactor(1e5, 1e-2)).toBeCloseTo(0.038504, 6);
    expect(colebrookFrictionFactor(1e6, 1e-3)).toBeCloseTo(0.019943, 6);
  });
  it('satisfies its own equation to 1e-12', () => {
    for (const re of [3e3, 1e4, 1e5, 1e6, 1e8]) {
      for (const rr of [0, 1e-6, 1e-4, 1e-2, 0.05]) {
        const f = colebrookFrictionFactor(re, rr);
        const rhs = -2 * Math.log10(rr / 3.7 + 2.51 / (re * Math.sqrt(f)));
        expect(Math.abs(1 / Math.sqrt(f) - rhs), `Re ${re} e/D ${rr}`).toBeLessThan(1e-12 * rhs);
      }
    }
  });
  it('fully rough limit: f = 1/(2 log10(3.7 D/e))^2 (von Karman / Nikuradse)', () => {
    const rr = 0.01;
    const limit = 1 / (2 * Math.log10(3.7 / rr)) ** 2;
    expect(Math.abs(colebrookFrictionFactor(1e12, rr) / limit - 1)).toBeLessThan(1e-5);
  });
  it('guards: any input gives a finite positive factor', () => {
    for (const [re, rr] of [[0, 0], [-1, 0], [Number.NaN, 0.01], [1e5, Number.NaN], [1, 0.5], [Number.POSITIVE_INFINITY, 0], [1e-12, 0]]) {
      const f = colebrookFrictionFactor(re as number, rr as number);
      expect(Number.isFinite(f) && f > 0, `${re} ${rr}`).toBe(true);
    }
  });
});
