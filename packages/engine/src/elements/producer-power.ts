/**
 * Power of a producer at an operating point (ENGINEERING.md):
 *   isothermal air power  P = p1 Q1 ln(p_atm/p1),
 *   adiabatic air power   P = kappa/(kappa-1) p1 Q1 [ (p_atm/p1)^((kappa-1)/kappa) - 1 ],
 * p1, Q1 the absolute pressure and actual flow at the producer inlet
 * (p1 Q1 = m R T), p_atm the discharge (atmospheric) pressure. Shaft power
 * from the curve's power column (interpolated), else adiabatic air power /
 * efficiency (our reading of "air power / efficiency": the adiabatic form is
 * the one compressor efficiencies are usually quoted against).
 */
import { KAPPA_AIR, R_AIR, STANDARD_DENSITY } from '../air/standard-air.js';
import type { ProducerModel } from '../network/model.js';
import { pchip } from './pchip.js';
import { usableCurve } from './producer-law.js';

export interface ProducerOperatingPoint {
  /** Mass flow through the producer, kg/s. */
  massFlowKgPerS: number;
  /** Absolute pressure at the producer inlet, Pa. */
  inletPressurePa: number;
  /** Absolute discharge pressure (the atmosphere), Pa. */
  ambientPa: number;
  /** Air temperature at the inlet, K. */
  temperatureK: number;
}

export interface ProducerPower {
  isothermalAirW: number;
  adiabaticAirW: number;
  /** Shaft power, W, when the model has a power column or an efficiency. */
  shaftW?: number;
  shaftFrom?: 'power-column' | 'efficiency';
}

/**
 * Air and shaft power at an operating point. No flow, an inlet at or above
 * the discharge pressure, or an invalid state give zero air power.
 */
export function producerPower(point: ProducerOperatingPoint, model?: ProducerModel): ProducerPower {
  const { massFlowKgPerS: m, inletPressurePa: p1, ambientPa: p2, temperatureK: t } = point;
  const valid = [m, p1, p2, t].every(Number.isFinite) && m > 0 && p1 > 0 && p2 > p1 && t > 0;
  const p1q1 = valid ? m * R_AIR * t : 0;
  const ratio = valid ? p2 / p1 : 1;
  const isothermalAirW = p1q1 * Math.log(ratio);
  const adiabaticAirW = ((KAPPA_AIR / (KAPPA_AIR - 1)) * p1q1 * (Math.pow(ratio, (KAPPA_AIR - 1) / KAPPA_AIR) - 1));
  const out: ProducerPower = { isothermalAirW, adiabaticAirW };
  if (!model) return out;
  const pts = usableCurve(model.curve);
  if (pts.length > 0 && pts.every((p) => p.powerW !== undefined && Number.isFinite(p.powerW))) {
    const curve = pchip(pts.map((p) => p.flowM3PerS), pts.map((p) => p.powerW as number));
    const flowInBasis = model.flowBasis === 'actual' ? (p1 > 0 && t > 0 && Number.isFinite(m) ? (m * R_AIR * t) / p1 : 0) : (Number.isFinite(m) ? m / STANDARD_DENSITY : 0);
    if (curve) {
      out.shaftW = Math.max(0, curve.at(flowInBasis).value);
      out.shaftFrom = 'power-column';
      return out;
    }
  }
  if (model.efficiency !== undefined && model.efficiency > 0 && model.efficiency <= 1) {
    out.shaftW = adiabaticAirW / model.efficiency;
    out.shaftFrom = 'efficiency';
  }
  return out;
}
