/**
 * Density of dry air as an ideal gas.
 */
import { R_AIR } from './standard-air.js';

/**
 * rho = p / (R T), kg/m3, p absolute in Pa, T in K (ideal gas, R = 287.05).
 * Returns 0 for a non-positive or non-finite pressure or temperature (no air,
 * or no meaningful state), never NaN.
 */
export function airDensity(pressurePa: number, temperatureK: number): number {
  if (!(pressurePa > 0) || !(temperatureK > 0) || !Number.isFinite(pressurePa) || !Number.isFinite(temperatureK)) {
    return 0;
  }
  return pressurePa / (R_AIR * temperatureK);
}
