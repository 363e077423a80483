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
import type { PortFlow, TwoPortLaw, UpstreamPressure } from './two-port-law.js';

/**
 * Below this share of the rated loss (1e-4, i.e. about 1 % of the rated flow)
 * the square root is blended to a finite slope (low-flow-blend.ts): the flow
 * there is off by at most a few per cent of 1 % of rated flow; our choice.
 */
export const RATED_LOSS_BLEND_SHARE = 1e-4;

const PRESSURE_FLOOR_PA = 1; // Pa: guards a solver overshoot (see pipe-law.ts)
// Newton steps of the inverse inside the low-flow blend (our choice; the blend is a quadratic, 3-4 suffice).
const BLEND_INVERSE_STEPS = 30;

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
  const into = (pa: number, pb: number, out: PortFlow): void => {
    const a = guard(pa);
    const b = guard(pb);
    const rho = (a + b) / (2 * R_AIR * t);
    const dRho = 1 / (2 * R_AIR * t); // d rho / d pa = d rho / d pb
    const root = Math.sqrt(rho / STANDARD_DENSITY);
    const s = regularisedSignedSqrt((a - b) / dpRef, RATED_LOSS_BLEND_SHARE);
    const m = mRef * root * s.value;
    const fromDensity = (mRef * s.value * dRho) / (2 * Math.sqrt(rho * STANDARD_DENSITY));
    const fromDrop = (mRef * root * s.slope) / dpRef;
    out.massFlowKgPerS = m;
    out.dFlowDPa = fromDensity + fromDrop;
    out.dFlowDPb = fromDensity - fromDrop;
    out.limited = undefined;
  };
  // Above the blend, m^2 = m_ref^2 (pa^2 - pb^2) / (2 R T rho_ref dp_ref): pa = sqrt(pb^2 + C m^2).
  const inverseC = (2 * R_AIR * t * STANDARD_DENSITY * dpRef) / (mRef * mRef);
  const probe: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 };
  return {
    flow(pa: number, pb: number): PortFlow {
      const out: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 };
      into(pa, pb, out);
      delete out.limited;
      return out;
    },
    flowInto: into,
    upstreamPressureInto(m: number, pDown: number, out: UpstreamPressure): boolean {
      if (!(m >= 0) || !Number.isFinite(m) || !(pDown > PRESSURE_FLOOR_PA) || !Number.isFinite(pDown)) return false;
      let pa = Math.sqrt(pDown * pDown + inverseC * m * m);
      if ((pa - pDown) / dpRef >= RATED_LOSS_BLEND_SHARE) {
        out.pressurePa = pa;
        out.dPressureDFlow = (inverseC * m) / pa;
        out.dPressureDDown = pDown / pa;
        return true;
      }
      // Inside the low-flow blend: Newton on the law itself (rising in pa, from the square-law value).
      for (let i = 0; i < BLEND_INVERSE_STEPS; i++) {
        into(pa, pDown, probe);
        const step = (m - probe.massFlowKgPerS) / probe.dFlowDPa;
        if (!Number.isFinite(step)) return false;
        pa = Math.max(pDown, pa + step);
        if (Math.abs(step) <= 1e-15 * pa) break;
      }
      into(pa, pDown, probe);
      if (!(probe.dFlowDPa > 0)) return false;
      out.pressurePa = pa;
      out.dPressureDFlow = 1 / probe.dFlowDPa;
      out.dPressureDDown = -probe.dFlowDPb / probe.dFlowDPa;
      return true;
    },
  };
}

function guard(p: number): number {
  return Number.isFinite(p) && p > PRESSURE_FLOOR_PA ? p : PRESSURE_FLOOR_PA;
}
