/**
 * Safeguarded Newton for one unknown: Newton steps while they stay inside a
 * shrinking bracket, bisection otherwise. Used by the element laws to invert
 * their equations; it always terminates and never leaves the bracket.
 */

/** A function value and its derivative at x. */
export type ValueAndSlope = (x: number) => { value: number; slope: number };

export interface SolveOptions {
  /** Relative tolerance on x (default 1e-13). */
  relTol?: number;
  /** Absolute tolerance on x (default 0). */
  absTol?: number;
  /** Iteration cap (default 200). */
  maxIterations?: number;
  /** fn rises through the root (fn(lo) < 0 < fn(hi)) or falls; when given, the ends are not evaluated. */
  rising?: boolean;
  /** Take bisection steps in log(x) (for positive brackets spanning decades). */
  logBisection?: boolean;
}

/**
 * Root of `fn` in [lo, hi], where fn(lo) and fn(hi) have opposite signs (or
 * one is zero; with `rising` given the caller vouches for the signs). Starts from x0 (clamped into the bracket). Returns the best
 * estimate after convergence or the iteration cap; never NaN for a finite
 * bracket.
 */
export function solveBracketed(fn: ValueAndSlope, lo: number, hi: number, x0: number, options: SolveOptions = {}): number {
  const relTol = options.relTol ?? 1e-13;
  const absTol = options.absTol ?? 0;
  const maxIterations = options.maxIterations ?? 200;
  let a = lo;
  let b = hi;
  let rising: boolean;
  if (options.rising !== undefined) {
    rising = options.rising;
  } else {
    const fa = fn(a).value;
    if (fa === 0) return a;
    const fb = fn(b).value;
    if (fb === 0) return b;
    rising = fb > 0; // sign of fn at b; fn(a) has the other sign
  }
  let x = Number.isFinite(x0) ? Math.min(b, Math.max(a, x0)) : 0.5 * (a + b);
  for (let i = 0; i < maxIterations; i++) {
    const { value, slope } = fn(x);
    if (value === 0) return x;
    if (!Number.isFinite(value)) {
      // No usable value: shrink toward the middle without trusting a side.
      x = 0.5 * (a + b);
      continue;
    }
    if ((value > 0) === rising) b = x;
    else a = x;
    let next = x - value / slope;
    if (!(next > a && next < b) || !Number.isFinite(next)) {
      next = options.logBisection && a > 0 ? Math.sqrt(a * b) : 0.5 * (a + b);
    }
    const step = Math.abs(next - x);
    x = next;
    if (step <= relTol * Math.abs(x) + absTol || b - a <= relTol * Math.abs(b) + absTol) break;
  }
  return x;
}
