/**
 * Piecewise-linear lookup in a published table, held at the end values
 * outside the table (tables are not extrapolated).
 */

/** Table rows as [x, y] with strictly ascending x. */
export type Table = readonly (readonly [number, number])[];

/**
 * y at x by linear interpolation between neighbouring rows; below the first
 * row the first y, above the last the last y; a non-finite x gives the first y.
 */
export function lookup(table: Table, x: number): number {
  const first = table[0];
  const last = table[table.length - 1];
  if (!first || !last) return 0;
  if (!Number.isFinite(x) || x <= first[0]) return first[1];
  if (x >= last[0]) return last[1];
  for (let i = 1; i < table.length; i++) {
    const hi = table[i] as readonly [number, number];
    if (x <= hi[0]) {
      const lo = table[i - 1] as readonly [number, number];
      return lo[1] + ((hi[1] - lo[1]) * (x - lo[0])) / (hi[0] - lo[0]);
    }
  }
  return last[1];
}

/** Radians to degrees; a non-finite angle gives 0. */
export function toDegrees(angleRad: number): number {
  return Number.isFinite(angleRad) ? (angleRad * 180) / Math.PI : 0;
}
