import { describe, expect, it } from 'vitest';
import { axisTicks, tickText } from '../../../src/report/svg/axis-ticks.js';

// Nice tick steps of 1, 2, 2.5 and 5 times a power of ten (Heckbert,
// "Nice numbers for graph labels", Graphics Gems, 1990, with 2.5 added as
// plotting libraries do).

describe('axisTicks', () => {
  it('0 to 9.5 in about six steps: 0, 2, 4, ..., 10', () => {
    const t = axisTicks(0, 9.5, 6);
    expect(t.step).toBe(2);
    expect(t.values).toEqual([0, 2, 4, 6, 8, 10]);
  });

  it('0 to 560 in about eight steps: a step of 100 up to 600', () => {
    const t = axisTicks(0, 560, 8);
    expect(t.step).toBe(100);
    expect(t.max).toBe(600);
    expect(t.values).toHaveLength(7);
  });

  it('a step of 2.5 where 2 would give too many ticks and 5 too few', () => {
    const t = axisTicks(0, 14, 6); // raw step 2.33
    expect(t.step).toBe(2.5);
    expect(t.values.map((v) => tickText(v, t.step))).toEqual(['0.0', '2.5', '5.0', '7.5', '10.0', '12.5', '15.0']);
  });

  it('small steps print without float noise', () => {
    const t = axisTicks(0, 0.3, 6);
    expect(t.values.map((v) => tickText(v, t.step))).toEqual(['0.00', '0.05', '0.10', '0.15', '0.20', '0.25', '0.30']);
  });

  it('the axis always covers the data, and bad input still gives an axis', () => {
    for (const [lo, hi] of [[0, 1e-9], [0, 7.3e5], [3, 3], [Number.NaN, Number.NaN], [5, 1]] as const) {
      const t = axisTicks(lo, hi);
      expect(t.values.length).toBeGreaterThanOrEqual(2);
      expect(t.values.every(Number.isFinite)).toBe(true);
      if (Number.isFinite(hi) && hi > lo) expect(t.max).toBeGreaterThanOrEqual(hi);
    }
  });
});
