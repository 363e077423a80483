import { describe, expect, it } from 'vitest';
import { pchip } from '../../src/elements/pchip.js';

// Reference values: scipy.interpolate.PchipInterpolator (scipy 1.17.1), the
// Fritsch-Carlson / Fritsch-Butland construction, computed for this test [K].
describe('pchip (Fritsch-Carlson monotone cubic)', () => {
  const flows = [0, 0.05, 0.1, 0.15, 0.2, 0.25];
  const vacuum = [50000, 48000, 44000, 37000, 27000, 12000];
  const curve = pchip(flows, vacuum);

  it('matches scipy PchipInterpolator on a producer-like curve (values and slopes)', () => {
    expect(curve).toBeDefined();
    if (!curve) return;
    const ref: [number, number, number][] = [
      [0.02, 49408.0, -38133.333333333336],
      [0.07, 46696.72727272727, -76218.18181818182],
      [0.12, 41593.49732620321, -136675.93582887706],
      [0.175, 32470.588235294115, -198823.52941176458],
      [0.24, 15416.000000000007, -332800.00000000006],
    ];
    for (const [x, v, s] of ref) {
      const r = curve.at(x);
      expect(r.value, `value at ${x}`).toBeCloseTo(v, 6);
      expect(r.slope, `slope at ${x}`).toBeCloseTo(s, 4);
    }
    expect(curve.slopes[0]).toBeCloseTo(-20000, 6);
    expect(curve.slopes[5]).toBeCloseTo(-350000, 4);
  });

  it('is monotone on monotone data with flat steps, no overshoot (scipy reference values)', () => {
    const c = pchip([0, 1, 2, 3, 4, 5], [0, 0, 1, 1, 3, 3.2]);
    if (!c) throw new Error('no curve');
    expect(c.at(0.5).value).toBeCloseTo(0, 12);
    expect(c.at(1.5).value).toBeCloseTo(0.5, 12);
    expect(c.at(2.5).value).toBeCloseTo(1, 12);
    expect(c.at(3.3).value).toBeCloseTo(1.409090909090909, 12);
    expect(c.at(4.6).value).toBeCloseTo(3.1645090909090907, 12);
    let prev = -1;
    for (let x = 0; x <= 5; x += 0.01) {
      const { value, slope } = c.at(x);
      expect(value).toBeGreaterThanOrEqual(prev - 1e-12);
      expect(slope).toBeGreaterThanOrEqual(-1e-12);
      expect(value).toBeLessThanOrEqual(3.2 + 1e-12);
      prev = value;
    }
  });

  it('the slope is the derivative of the value (central differences)', () => {
    if (!curve) return;
    for (let x = 0.003; x < 0.25; x += 0.011) {
      const h = 1e-7;
      const fd = (curve.at(x + h).value - curve.at(x - h).value) / (2 * h);
      expect(Math.abs(curve.at(x).slope - fd)).toBeLessThan(1e-4 * Math.abs(fd) + 1e-3);
    }
  });

  it('extends with straight lines at the end slopes outside the data', () => {
    if (!curve) return;
    expect(curve.at(0.3).value).toBeCloseTo(12000 - 350000 * 0.05, 4);
    expect(curve.at(-0.1).value).toBeCloseTo(50000 + 20000 * 0.1, 4);
  });

  it('sanitises: drops non-finite points, sorts, keeps the first of repeated x; 0, 1 and 2 points', () => {
    expect(pchip([], [])).toBeUndefined();
    expect(pchip([Number.NaN], [1])).toBeUndefined();
    expect(pchip([2], [7])?.at(100).value).toBe(7);
    const line = pchip([1, 0], [3, 1]);
    expect(line?.at(0.25).value).toBeCloseTo(1.5, 12);
    const dup = pchip([0, 1, 1, 2], [0, 1, 5, 2]);
    expect(dup?.ys).toEqual([0, 1, 2]);
    expect(Number.isFinite(pchip([0, 1], [0, 1])?.at(Number.NaN).value)).toBe(true);
  });
});
