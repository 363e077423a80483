import { describe, expect, it } from 'vitest';
import { churchillFrictionFactor, churchillProduct } from '../../src/friction/churchill.js';
import { colebrookFrictionFactor } from '../../src/friction/colebrook.js';

describe('Churchill (1977) friction factor', () => {
  it('Re 1e5, e/D 1e-4: 0.0184626 (fluids library docs, CHECKS.md [C])', () => {
    expect(churchillFrictionFactor(1e5, 1e-4).f).toBeCloseTo(0.0184626, 7);
  });
  it('laminar: 64/Re (Hagen-Poiseuille) at Re 1000 and at zero flow', () => {
    expect(churchillFrictionFactor(1000, 1e-4).f).toBeCloseTo(0.064, 6);
    expect(churchillProduct(0, 1e-3)).toEqual({ fRe: 64, dFReDRe: 0 });
    expect(churchillProduct(1e-3, 0).fRe).toBe(64);
  });
  // Churchill fits Colebrook in turbulent flow; the gap grows toward transition
  // with rough walls (2.1 % at Re 1e4, e/D 1e-2). Bands: common practice, from memory.
  it('close to Colebrook-White in turbulent flow: 1 % from Re 1e5, 2.5 % at Re 1e4', () => {
    for (const re of [1e4, 1e5, 1e6, 1e7]) {
      for (const rr of [0, 1e-5, 1e-4, 1e-3, 1e-2]) {
        const c = colebrookFrictionFactor(re, rr);
        const band = re < 1e5 ? 0.025 : 0.01;
        expect(Math.abs(churchillFrictionFactor(re, rr).f / c - 1), `Re ${re} e/D ${rr}`).toBeLessThan(band);
      }
    }
  });
  it('derivative matches central finite differences in every regime', () => {
    for (const re of [1.5, 10, 500, 1999, 2300, 3000, 4000, 1e4, 1e5, 1e6, 1e8]) {
      for (const rr of [0, 1e-4, 1e-2]) {
        const h = re * 1e-6;
        const { f, dfdRe } = churchillFrictionFactor(re, rr);
        const fd = (churchillFrictionFactor(re + h, rr).f - churchillFrictionFactor(re - h, rr).f) / (2 * h);
        expect(Number.isFinite(f)).toBe(true);
        expect(Math.abs(dfdRe - fd), `Re ${re} e/D ${rr}`).toBeLessThan(1e-6 * Math.abs(fd) + 1e-14);
        const p = churchillProduct(re, rr);
        const pfd = (churchillProduct(re + h, rr).fRe - churchillProduct(re - h, rr).fRe) / (2 * h);
        expect(Math.abs(p.dFReDRe - pfd), `product Re ${re}`).toBeLessThan(1e-6 * Math.abs(pfd) + 1e-9);
      }
    }
  });
  it('f Re is continuous and increasing from laminar through transition (smooth for Newton)', () => {
    let prev = churchillProduct(0, 1e-4).fRe;
    for (let re = 1; re < 1e7; re *= 1.05) {
      const { fRe } = churchillProduct(re, 1e-4);
      expect(fRe).toBeGreaterThanOrEqual(prev - 1e-9 * prev);
      expect(fRe / prev).toBeLessThan(1.15); // no jump: at most 15 % per 5 % step in Re, even in transition
      prev = fRe;
    }
  });
  it('guards: negative, NaN and infinite inputs give finite values', () => {
    for (const [re, rr] of [[-5, 1e-4], [Number.NaN, 1e-4], [1e5, Number.NaN], [1e5, -1], [Number.POSITIVE_INFINITY, 0], [1e5, 99]]) {
      const r = churchillFrictionFactor(re as number, rr as number);
      expect(Number.isFinite(r.f) && r.f > 0, `${re} ${rr}`).toBe(true);
      expect(Number.isFinite(r.dfdRe), `${re} ${rr}`).toBe(true);
    }
  });
});
