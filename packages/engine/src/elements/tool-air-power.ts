/**
 * Air power at the tool, what the operator gets (ENGINEERING.md; ASTM F558
 * "air watts"): P = Q dp, Q the flow of room air entering the tool at ambient
 * density (not the expanded flow inside the hose), dp the vacuum at the hose
 * end. In trade units ASTM F558 writes it as 0.117354 x cfm x inH2O.
 */
import { airDensity } from '../air/density.js';

/**
 * Air power, W, for tool mass flow m (kg/s), hose-end absolute pressure and
 * ambient pressure (Pa), room temperature (K). No flow, no vacuum or an
 * invalid state give 0.
 */
export function toolAirPower(massFlowKgPerS: number, hoseEndPressurePa: number, ambientPa: number, temperatureK: number): number {
  const rho = airDensity(ambientPa, temperatureK);
  const vacuum = ambientPa - hoseEndPressurePa;
  if (!(rho > 0) || !(massFlowKgPerS > 0) || !(vacuum > 0) || !Number.isFinite(massFlowKgPerS) || !Number.isFinite(vacuum)) return 0;
  return (massFlowKgPerS / rho) * vacuum;
}
