/**
 * Starting pressures for Newton when the caller has none: every free node
 * at a modest vacuum below the highest fixed pressure (the atmosphere).
 */
import type { LocalSystem } from './newton.js';

// Start at 10 % vacuum below the highest fixed pressure (our choice: the
// middle of the range of ordinary central vacuum systems, 10-50 kPa).
const START_VACUUM_FRACTION = 0.1;

export function defaultInitialPressures(sys: LocalSystem, maxFixedPa: number): Float64Array {
  const p = new Float64Array(sys.n);
  p.fill(maxFixedPa > 0 ? maxFixedPa * (1 - START_VACUUM_FRACTION) : 1);
  return p;
}
