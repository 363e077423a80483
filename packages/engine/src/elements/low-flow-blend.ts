/**
 * Near zero flow, square-root laws (orifices, rated quadratic losses) have an
 * infinite slope, which a Newton solver cannot use. Below a small threshold
 * the law is replaced by a quadratic a u + b u^2 that passes through zero and
 * meets the true law with the same value and slope at the threshold, so the
 * law stays C1 and its slope at zero is finite (common practice in network
 * solvers; our construction).
 */

export interface ValueSlope {
  value: number;
  slope: number;
}

/**
 * The blend at u in [0, delta], given the true law's value v and slope s at
 * u = delta: a = (2v - s delta)/delta, b = (s delta - v)/delta^2. For a
 * concave increasing law through zero (s delta <= v) both a and the slope
 * on [0, delta] are positive, so the blend is monotone.
 */
export function blendBelow(u: number, delta: number, atDelta: ValueSlope): ValueSlope {
  const a = (2 * atDelta.value - atDelta.slope * delta) / delta;
  const b = (atDelta.slope * delta - atDelta.value) / (delta * delta);
  return { value: a * u + b * u * u, slope: a + 2 * b * u };
}

/**
 * sign(x) sqrt(|x|) with the blend for |x| < delta (delta > 0): an odd, C1,
 * increasing function with slope 1.5/sqrt(delta) at zero.
 */
export function regularisedSignedSqrt(x: number, delta: number): ValueSlope {
  const ax = Math.abs(x);
  const sign = x < 0 ? -1 : 1;
  if (ax >= delta) {
    const r = Math.sqrt(ax);
    return { value: sign * r, slope: 0.5 / r };
  }
  const root = Math.sqrt(delta);
  const inner = blendBelow(ax, delta, { value: root, slope: 0.5 / root });
  return { value: sign * inner.value, slope: inner.slope };
}
