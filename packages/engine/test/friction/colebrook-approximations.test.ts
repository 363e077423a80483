import { describe, expect, it } from 'vitest';
import {
  altshulTsalFrictionFactor,
  haalandFrictionFactor,
  swameeJainFrictionFactor,
} from '../../src/friction/colebrook-approximations.js';
import { colebrookFrictionFactor } from '../../src/friction/colebrook.js';

describe('explicit friction correlations at Re 1e5, e/D 1e-4 (fluids library docs, CHECKS.md [C])', () => {
  it('Swamee-Jain 0.0184524', () => expect(swameeJainFrictionFactor(1e5, 1e-4)).toBeCloseTo(0.0184524, 7));
  it('Haaland 0.0182651', () => expect(haalandFrictionFactor(1e5, 1e-4)).toBeCloseTo(0.0182651, 7));
  it('Altshul-Tsal (ASHRAE Fundamentals ch. 21) 0.0183830', () =>
    expect(altshulTsalFrictionFactor(1e5, 1e-4)).toBeCloseTo(0.018383, 7));
  it('Altshul-Tsal low branch: f = 0.85 f\' + 0.0028 when f\' < 0.018 (smooth, Re 1e6)', () => {
    const fPrime = 0.11 * (68 / 1e6) ** 0.25;
    expect(fPrime).toBeLessThan(0.018);
    expect(altshulTsalFrictionFactor(1e6, 0)).toBeCloseTo(0.85 * fPrime + 0.0028, 12);
  });
  // Error bands: reviews of explicit approximations (e.g. Brkic 2011) put both within about 2-3 %; from memory.
  it('Swamee-Jain within 3 % and Haaland within 2 % of Colebrook', () => {
    for (const re of [5e3, 1e4, 1e5, 1e6, 1e7]) {
      for (const rr of [1e-6, 1e-4, 1e-3, 1e-2]) {
        const c = colebrookFrictionFactor(re, rr);
        expect(Math.abs(swameeJainFrictionFactor(re, rr) / c - 1), `SJ ${re} ${rr}`).toBeLessThan(0.03);
        expect(Math.abs(haalandFrictionFactor(re, rr) / c - 1), `H ${re} ${rr}`).toBeLessThan(0.02);
      }
    }
  });
  it('guards: bad inputs give finite positive values', () => {
    for (const fn of [swameeJainFrictionFactor, haalandFrictionFactor, altshulTsalFrictionFactor]) {
      for (const [re, rr] of [[0, 0], [-3, 0.1], [Number.NaN, Number.NaN], [1e5, 1e9], [Number.POSITIVE_INFINITY, 0]]) {
        const f = fn(re as number, rr as number);
        expect(Number.isFinite(f) && f > 0, `${fn.name} ${re} ${rr}`).toBe(true);
      }
    }
  });
});
