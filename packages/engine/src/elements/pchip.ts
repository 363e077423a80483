/**
 * Monotone piecewise cubic Hermite interpolation (PCHIP).
 *
 * F. N. Fritsch and R. E. Carlson, "Monotone piecewise cubic interpolation",
 * SIAM J. Numer. Anal. 17(2), 1980, 238-246, with the interior slopes as the
 * weighted harmonic mean of F. N. Fritsch and J. Butland, SIAM J. Sci. Stat.
 * Comput. 5(2), 1984, and the shape-preserving three-point end slopes; the
 * same construction as MATLAB pchip and scipy PchipInterpolator. Monotone
 * data give a monotone interpolant with no overshoot.
 */

export interface MonotoneCurve {
  /** First and last x of the data. */
  xMin: number;
  xMax: number;
  /** Interpolated value and slope; outside [xMin, xMax] a straight line with the end slope. */
  at(x: number): { value: number; slope: number };
  /** The Hermite slope at each data point (after sanitising). */
  readonly slopes: readonly number[];
  readonly xs: readonly number[];
  readonly ys: readonly number[];
}

/**
 * Build a PCHIP curve through (xs[i], ys[i]). Points with a non-finite
 * coordinate are dropped, the rest sorted by x, and repeated x keep the first
 * point. Undefined when no point is left; one point gives a constant; two a
 * straight line.
 */
export function pchip(xsIn: readonly number[], ysIn: readonly number[]): MonotoneCurve | undefined {
  const pts: [number, number][] = [];
  for (let i = 0; i < Math.min(xsIn.length, ysIn.length); i++) {
    const x = xsIn[i] as number;
    const y = ysIn[i] as number;
    if (Number.isFinite(x) && Number.isFinite(y)) pts.push([x, y]);
  }
  pts.sort((p, q) => p[0] - q[0]);
  const xs: number[] = [];
  const ys: number[] = [];
  for (const [x, y] of pts) {
    if (xs.length === 0 || x > (xs[xs.length - 1] as number)) {
      xs.push(x);
      ys.push(y);
    }
  }
  const n = xs.length;
  if (n === 0) return undefined;
  const h: number[] = [];
  const delta: number[] = [];
  for (let k = 0; k < n - 1; k++) {
    h.push((xs[k + 1] as number) - (xs[k] as number));
    delta.push(((ys[k + 1] as number) - (ys[k] as number)) / (h[k] as number));
  }
  const d: number[] = new Array<number>(n).fill(0);
  if (n === 2) {
    d[0] = delta[0] as number;
    d[1] = delta[0] as number;
  } else if (n > 2) {
    for (let k = 1; k < n - 1; k++) {
      const d0 = delta[k - 1] as number;
      const d1 = delta[k] as number;
      if (d0 * d1 <= 0) {
        d[k] = 0; // local extremum or flat: zero slope keeps the shape
      } else {
        const w1 = 2 * (h[k] as number) + (h[k - 1] as number);
        const w2 = (h[k] as number) + 2 * (h[k - 1] as number);
        d[k] = (w1 + w2) / (w1 / d0 + w2 / d1);
      }
    }
    d[0] = endSlope(h[0] as number, h[1] as number, delta[0] as number, delta[1] as number);
    d[n - 1] = endSlope(h[n - 2] as number, h[n - 3] as number, delta[n - 2] as number, delta[n - 3] as number);
  }
  const xMin = xs[0] as number;
  const xMax = xs[n - 1] as number;
  return {
    xMin,
    xMax,
    slopes: d,
    xs,
    ys,
    at(x: number) {
      if (n === 1) return { value: ys[0] as number, slope: 0 };
      if (!Number.isFinite(x)) return { value: ys[0] as number, slope: d[0] as number };
      if (x <= xMin) return { value: (ys[0] as number) + (d[0] as number) * (x - xMin), slope: d[0] as number };
      if (x >= xMax) return { value: (ys[n - 1] as number) + (d[n - 1] as number) * (x - xMax), slope: d[n - 1] as number };
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if ((xs[mid] as number) <= x) lo = mid;
        else hi = mid;
      }
      const hk = h[lo] as number;
      const t = (x - (xs[lo] as number)) / hk;
      const y0 = ys[lo] as number;
      const y1 = ys[lo + 1] as number;
      const m0 = d[lo] as number;
      const m1 = d[lo + 1] as number;
      // Cubic Hermite basis on [0, 1].
      const t2 = t * t;
      const t3 = t2 * t;
      const value = (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * hk * m0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * hk * m1;
      const slope = ((6 * t2 - 6 * t) * y0 + (-6 * t2 + 6 * t) * y1) / hk + (3 * t2 - 4 * t + 1) * m0 + (3 * t2 - 2 * t) * m1;
      return { value, slope };
    },
  };
}

/** Three-point end slope, held to the data's shape (Moler, Numerical Computing with MATLAB, pchip). */
function endSlope(h0: number, h1: number, del0: number, del1: number): number {
  const d = ((2 * h0 + h1) * del0 - h0 * del1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(del0)) return 0;
  if (Math.sign(del0) !== Math.sign(del1) && Math.abs(d) > Math.abs(3 * del0)) return 3 * del0;
  return d;
}
