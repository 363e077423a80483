/**
 * Standard and actual volume flow, and mass flow.
 *
 * Standard flow: dry air at 20 C and 101.325 kPa (standard-air.ts). Actual
 * flow: the same mass at the local absolute pressure and temperature. At
 * 15 inHg of vacuum one standard cubic foot is about two actual ones.
 */
import { airDensity } from './density.js';
import { STANDARD_DENSITY } from './standard-air.js';

/** Mass flow, kg/s, of a standard volume flow in m^3/s (m = Q_std rho_std). */
export function massFlowFromStandard(standardM3PerS: number): number {
  return Number.isFinite(standardM3PerS) ? standardM3PerS * STANDARD_DENSITY : 0;
}

/** Standard volume flow, m^3/s, of a mass flow in kg/s. */
export function standardFromMassFlow(massFlowKgPerS: number): number {
  return Number.isFinite(massFlowKgPerS) ? massFlowKgPerS / STANDARD_DENSITY : 0;
}

/**
 * Actual volume flow at (p, T) of a standard flow: Q = Q_std rho_std / rho(p, T).
 * A non-positive or non-finite state gives 0 (documented safe value, never NaN).
 */
export function actualFromStandard(standardM3PerS: number, pressurePa: number, temperatureK: number): number {
  const rho = airDensity(pressurePa, temperatureK);
  return rho > 0 && Number.isFinite(standardM3PerS) ? (standardM3PerS * STANDARD_DENSITY) / rho : 0;
}

/** Standard volume flow of an actual flow at (p, T): Q_std = Q rho(p, T) / rho_std. */
export function standardFromActual(actualM3PerS: number, pressurePa: number, temperatureK: number): number {
  const rho = airDensity(pressurePa, temperatureK);
  return Number.isFinite(actualM3PerS) ? (actualM3PerS * rho) / STANDARD_DENSITY : 0;
}
