/**
 * Separator, filter or exhaust line: a quadratic loss scaled from one rated
 * point (ENGINEERING.md; the usual square law of turbulent losses):
 *   dp = dp_ref (m/m_ref)^2 (rho_ref/rho)
 * The rating is read as standard air: m_ref = Q_ref x 1.2041 kg/m3 and
 * rho_ref = 1.2041 kg/m3. rho is the density at the mean of the two port
 * pressures and the system temperature.
 */
import { R_AIR, STANDARD_DENSITY } from '../air/standard-air.js';
import { massFlowFromStandard } from '../air/flow-basis.js';
import type { RatedLoss } from '../network/model.js';
import { regularisedSignedSqrt } from './low-flow-blend.js';
import type { PortFlow, TwoPortLaw } from './two-port-law.js';

/**
 * Below this share of the rated loss (1e-4, i.e. about 1 % of the rated flow)
 * the square root is blended to a finite slope (low-flow-blend.ts): the flow
 * there is off by at most a few per cent of 1 % of rated flow; our choice.
 */
export const RATED_LOSS_BLEND_SHARE = 1e-4;

const PRESSURE_FLOOR_PA = 1; // Pa: guards a solver overshoot (see pipe-law.ts)

export type RatedLossProblem = 'rated-loss-not-positive' | 'rated-flow-not-positive';

/** What is wrong with a rating, for the network builder to report; empty when usable. */
export function ratedLossProblems(rated: RatedLoss): RatedLossProblem[] {
  const out: RatedLossProblem[] = [];
  if (!(rated.lossPa > 0) || !Number.isFinite(rated.lossPa)) out.push('rated-loss-not-positive');
  if (!(rated.flowStdM3PerS > 0) || !Number.isFinite(rated.flowStdM3PerS)) out.push('rated-flow-not-positive');
  return out;
}

/**
 * Pressure drop (Pa, signed like m) of a rated loss at mass flow m and
 * density rho, with d(dp)/dm: dp = dp_ref m|m|/m_ref^2 (rho_ref/rho). Used
 * where the loss is added to another law (the producer's exhaust). Invalid
 * ratings or density give 0.
 */
export function ratedLossDrop(rated: RatedLoss, massFlowKgPerS: number, densityKgPerM3: number): { dropPa: number; dDropDm: number } {
  if (ratedLossProblems(rated).length > 0 || !(densityKgPerM3 > 0) || !Number.isFinite(massFlowKgPerS)) return { dropPa: 0, dDropDm: 0 };
  const mRef = massFlowFromStandard(rated.flowStdM3PerS);
  const c = (rated.lossPa * STANDARD_DENSITY) / (mRef * mRef * densityKgPerM3);
  return { dropPa: c * massFlowKgPerS * Math.abs(massFlowKgPerS), dDropDm: 2 * c * Math.abs(massFlowKgPerS) };
}

/**
 * A rated loss as a two-port law, flow from the higher to the lower port:
 * m = m_ref sqrt(rho/rho_ref) s(dp/dp_ref), s the signed square root
 * blended below 1e-4 of the rated loss. An invalid rating closes the
 * element (zero flow, zero derivatives): report it with ratedLossProblems.
 */
export function ratedLossLaw(rated: RatedLoss, temperatureK: number): TwoPortLaw {
  const t = Number.isFinite(temperatureK) && temperatureK > 0 ? temperatureK : 293.15;
  if (ratedLossProblems(rated).length > 0) {
    return { flow: () => ({ massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 }) };
  }
  const mRef = massFlowFromStandard(rated.flowStdM3PerS);
  const dpRef = rated.lossPa;
  return {
    flow(pa: number, pb: number): PortFlow {
      const a = guard(pa);
      const b = guard(pb);
      const rho = (a + b) / (2 * R_AIR * t);
      const dRho = 1 / (2 * R_AIR * t); // d rho / d pa = d rho / d pb
      const root = Math.sqrt(rho / STANDARD_DENSITY);
      const s = regularisedSignedSqrt((a - b) / dpRef, RATED_LOSS_BLEND_SHARE);
      const m = mRef * root * s.value;
      const fromDensity = (mRef * s.value * dRho) / (2 * Math.sqrt(rho * STANDARD_DENSITY));
      const fromDrop = (mRef * root * s.slope) / dpRef;
      return { massFlowKgPerS: m, dFlowDPa: fromDensity + fromDrop, dFlowDPb: fromDensity - fromDrop };
    },
  };
}

function guard(p: number): number {
  return Number.isFinite(p) && p > PRESSURE_FLOOR_PA ? p : PRESSURE_FLOOR_PA;
}
