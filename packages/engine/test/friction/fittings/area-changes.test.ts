import { describe, expect, it } from 'vitest';
import { areaChangeK, rescaleK, suddenExpansionK } from '../../../src/friction/fittings/area-changes.js';

describe('area changes (Crane TP-410 (2009); Borda-Carnot)', () => {
  it('sudden expansion at diameter ratio 0.5: 0.5625 = (1 - 0.25)^2 (CHECKS.md [C])', () => {
    expect(suddenExpansionK(0.05, 0.1)).toBeCloseTo(0.5625, 12);
    expect(areaChangeK({ upstreamDiameterM: 0.05, downstreamDiameterM: 0.1, includedAngleRad: Math.PI }).onUpstream).toBeCloseTo(0.5625, 12);
  });
  it('sudden contraction into a pipe from a very large space tends to the sharp entry 0.5 (Crane)', () => {
    expect(areaChangeK({ upstreamDiameterM: 100, downstreamDiameterM: 0.05, includedAngleRad: Math.PI }).onDownstream).toBeCloseTo(0.5, 6);
  });
  it('gradual: the 45 deg boundary is continuous within 1.5 % (Crane\'s two forms meet there) and a gentler cone loses less', () => {
    const at = (a: number, d1: number, d2: number) => areaChangeK({ upstreamDiameterM: d1, downstreamDiameterM: d2, includedAngleRad: a });
    const below = (45 - 1e-9) * (Math.PI / 180);
    const above = (45 + 1e-9) * (Math.PI / 180);
    expect(Math.abs(at(below, 0.05, 0.1).onUpstream / at(above, 0.05, 0.1).onUpstream - 1)).toBeLessThan(0.015);
    expect(Math.abs(at(below, 0.1, 0.05).onDownstream / at(above, 0.1, 0.05).onDownstream - 1)).toBeLessThan(0.015);
    expect(at(Math.PI / 12, 0.05, 0.1).onUpstream).toBeLessThan(at(Math.PI / 4, 0.05, 0.1).onUpstream);
  });
  it('K on the large pipe is K on the small pipe / beta^4', () => {
    const k = areaChangeK({ upstreamDiameterM: 0.1, downstreamDiameterM: 0.05 });
    expect(k.onUpstream).toBeCloseTo(k.onDownstream / 0.5 ** 4, 12);
    expect(rescaleK(k.onDownstream, 0.05, 0.1)).toBeCloseTo(k.onUpstream, 12);
  });
  it('guards: equal or invalid diameters give 0', () => {
    expect(areaChangeK({ upstreamDiameterM: 0.05, downstreamDiameterM: 0.05 })).toEqual({ onUpstream: 0, onDownstream: 0 });
    expect(areaChangeK({ upstreamDiameterM: 0, downstreamDiameterM: 0.05 })).toEqual({ onUpstream: 0, onDownstream: 0 });
    expect(areaChangeK({ upstreamDiameterM: Number.NaN, downstreamDiameterM: 0.05 })).toEqual({ onUpstream: 0, onDownstream: 0 });
    expect(rescaleK(0.5, 0, 0.1)).toBe(0.5);
    expect(suddenExpansionK(-1, 0.1)).toBe(0);
  });
});
