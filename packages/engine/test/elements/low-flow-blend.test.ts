import { describe, expect, it } from 'vitest';
import { regularisedSignedSqrt } from '../../src/elements/low-flow-blend.js';

describe('regularisedSignedSqrt', () => {
  it('is the signed square root from the threshold on', () => {
    expect(regularisedSignedSqrt(4, 1e-4).value).toBe(2);
    expect(regularisedSignedSqrt(-9, 1e-4).value).toBe(-3);
    expect(regularisedSignedSqrt(4, 1e-4).slope).toBe(0.25);
  });
  it('is C1 at the threshold, odd, increasing, with slope 1.5/sqrt(delta) at zero', () => {
    const delta = 0.01;
    const below = regularisedSignedSqrt(delta * (1 - 1e-12), delta);
    const above = regularisedSignedSqrt(delta, delta);
    expect(below.value).toBeCloseTo(above.value, 9);
    expect(below.slope).toBeCloseTo(above.slope, 6);
    expect(regularisedSignedSqrt(0, delta).value).toBe(0);
    expect(regularisedSignedSqrt(0, delta).slope).toBeCloseTo(1.5 / Math.sqrt(delta), 10);
    let prev = Number.NEGATIVE_INFINITY;
    for (let x = -0.02; x <= 0.02; x += 0.0005) {
      const r = regularisedSignedSqrt(x, delta);
      expect(r.value).toBeGreaterThan(prev);
      expect(regularisedSignedSqrt(-x, delta).value).toBeCloseTo(-r.value, 14);
      prev = r.value;
    }
  });
});
