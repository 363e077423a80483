/**
 * Ambient pressure at the site from its elevation.
 */
import { STANDARD_PRESSURE_PA } from './standard-air.js';

// Troposphere, standard atmosphere: ASHRAE Handbook Fundamentals, ch. 1 (psychrometrics).
const LAPSE_COEFFICIENT_PER_M = 2.25577e-5;
const EXPONENT = 5.25588;
/** Lowest and highest elevation the formula is used for, m (Dead Sea shore ~ -430 m; tropopause 11 km). */
export const ELEVATION_RANGE_M = { min: -500, max: 11000 } as const;

/**
 * Standard-atmosphere pressure at elevation `h` metres above sea level:
 * p = 101325 (1 - 2.25577e-5 h)^5.25588 Pa (ASHRAE Fundamentals ch. 1).
 * Valid in the troposphere; `h` is clamped to -500..11000 m and a
 * non-finite `h` gives sea level (101325 Pa), so the result is always a
 * positive finite pressure. Validate elevations where they are written.
 */
export function ambientPressureAtElevation(elevationM: number): number {
  const h = Number.isFinite(elevationM)
    ? Math.min(ELEVATION_RANGE_M.max, Math.max(ELEVATION_RANGE_M.min, elevationM))
    : 0;
  return STANDARD_PRESSURE_PA * Math.pow(1 - LAPSE_COEFFICIENT_PER_M * h, EXPONENT);
}
