/**
 * The cleaning tool at the hose end: room air (port a, at ambient) enters
 * through the tool into the hose end (port b).
 *
 * Orifice form (ENGINEERING.md): isentropic nozzle flow through an equivalent
 * sharp-edged orifice of diameter d and discharge coefficient Cd,
 *   m = Cd A_o p_a sqrt( 2 kappa/((kappa-1) R T) (r^(2/kappa) - r^((kappa+1)/kappa)) ),
 *   r = p_b / p_a,
 * with r held at the critical ratio (2/(kappa+1))^(kappa/(kappa-1)) = 0.5283
 * below it (choked; Shapiro 1953, ch. 4). T is the room (stagnation) temperature.
 * Table form: measured standard flow against vacuum at the hose end.
 */
import { airDensity } from '../air/density.js';
import { massFlowFromStandard } from '../air/flow-basis.js';
import { KAPPA_AIR, R_AIR } from '../air/standard-air.js';
import type { ToolLaw } from '../network/model.js';
import type { ValueSlope } from './low-flow-blend.js';
import { type MonotoneCurve, pchip } from './pchip.js';
import type { PortFlow, TwoPortLaw } from './two-port-law.js';

/** Discharge coefficient of a sharp-edged orifice, the default (ENGINEERING.md; ISO 5167-2 orifices run ~0.60-0.61). */
export const DEFAULT_DISCHARGE_COEFFICIENT = 0.61;
/** Critical pressure ratio of isentropic nozzle flow for kappa 1.4: (2/2.4)^3.5 = 0.5283. */
export const CRITICAL_PRESSURE_RATIO = Math.pow(2 / (KAPPA_AIR + 1), KAPPA_AIR / (KAPPA_AIR - 1));
/** Below this pressure deficit (1 - r) the nozzle law is blended to a finite slope (0.1 % of the upstream pressure; our choice, ~100 Pa at sea level). */
export const NOZZLE_BLEND_DEFICIT = 1e-3;

const PRESSURE_FLOOR_PA = 1; // Pa: guards a solver overshoot (see pipe-law.ts)

/** psi(r) = r^(2/k) - r^((k+1)/k) and its derivative in r. */
function psi(r: number): ValueSlope {
  const k = KAPPA_AIR;
  return {
    value: Math.pow(r, 2 / k) - Math.pow(r, (k + 1) / k),
    slope: (2 / k) * Math.pow(r, 2 / k - 1) - ((k + 1) / k) * Math.pow(r, 1 / k),
  };
}

/** phi(u) = sqrt(psi(1 - u)) for the deficit u = 1 - r, and d phi/du. */
function phiExact(u: number): ValueSlope {
  const p = psi(1 - u);
  const root = Math.sqrt(Math.max(p.value, 0));
  return { value: root, slope: root > 0 ? -p.slope / (2 * root) : 0 }; // d/du = -d/dr
}

const U_CRIT = 1 - CRITICAL_PRESSURE_RATIO;
const PHI_AT_BLEND = phiExact(NOZZLE_BLEND_DEFICIT);
const PHI_CHOKED = phiExact(U_CRIT).value;
// The blend a u + b u^2 below NOZZLE_BLEND_DEFICIT (low-flow-blend.ts), its coefficients once.
const BLEND_A = (2 * PHI_AT_BLEND.value - PHI_AT_BLEND.slope * NOZZLE_BLEND_DEFICIT) / NOZZLE_BLEND_DEFICIT;
const BLEND_B = (PHI_AT_BLEND.slope * NOZZLE_BLEND_DEFICIT - PHI_AT_BLEND.value) / (NOZZLE_BLEND_DEFICIT * NOZZLE_BLEND_DEFICIT);
const INV_KAPPA = 1 / KAPPA_AIR;

/**
 * Nozzle mass flow from `up` to `down` (up >= down > 0) with
 * m = K up phi(u), u = 1 - down/up, K = Cd A sqrt(2 kappa/((kappa-1) R T)):
 * dm/dup = K (phi + r phi'), dm/ddown = -K phi'. phi is blended near zero
 * and held beyond the critical ratio; psi is taken through one power,
 * t = r^(1/kappa): r^(2/kappa) = t^2, r^((kappa+1)/kappa) = r t. Written
 * into `out`; returns whether the nozzle is choked.
 */
function nozzleInto(kFactor: number, up: number, down: number, out: PortFlow, flip: boolean): void {
  const r = down / up;
  const u = 1 - r;
  let value: number;
  let slope: number;
  let choked = false;
  if (u >= U_CRIT) {
    value = PHI_CHOKED;
    slope = 0;
    choked = true;
  } else if (u < NOZZLE_BLEND_DEFICIT) {
    value = BLEND_A * u + BLEND_B * u * u;
    slope = BLEND_A + 2 * BLEND_B * u;
  } else {
    const t = Math.pow(r, INV_KAPPA);
    const psiValue = t * t - r * t;
    // d psi/dr = (2/k) r^(2/k - 1) - ((k+1)/k) r^(1/k) = (2/k) t^2 / r - ((k+1)/k) t
    const psiSlope = (2 * INV_KAPPA * t * t) / r - (1 + INV_KAPPA) * t;
    value = Math.sqrt(Math.max(psiValue, 0));
    slope = value > 0 ? -psiSlope / (2 * value) : 0;
  }
  const m = kFactor * up * value;
  const dUp = kFactor * (value + r * slope);
  const dDown = 0 - kFactor * slope;
  if (!flip) {
    out.massFlowKgPerS = m;
    out.dFlowDPa = dUp;
    out.dFlowDPb = dDown;
  } else {
    out.massFlowKgPerS = 0 - m;
    out.dFlowDPa = 0 - dDown;
    out.dFlowDPb = 0 - dUp;
  }
  out.limited = choked ? 'choked' : undefined;
}

export type ToolLawProblem = 'orifice-diameter-not-positive' | 'discharge-coefficient-invalid' | 'table-has-no-points' | 'table-flow-falls';

/** What is wrong with a tool law, for the network builder to report; empty when usable. */
export function toolLawProblems(law: ToolLaw): ToolLawProblem[] {
  const out: ToolLawProblem[] = [];
  if (law.kind === 'orifice') {
    if (!(law.diameterM > 0) || !Number.isFinite(law.diameterM)) out.push('orifice-diameter-not-positive');
    if (!(law.dischargeCoefficient > 0 && law.dischargeCoefficient <= 1)) out.push('discharge-coefficient-invalid');
  } else {
    const pts = usablePoints(law.points);
    if (pts.length === 0) out.push('table-has-no-points');
    for (let i = 1; i < pts.length; i++) {
      if ((pts[i]?.flowStdM3PerS ?? 0) < (pts[i - 1]?.flowStdM3PerS ?? 0)) out.push('table-flow-falls');
    }
  }
  return [...new Set(out)];
}

function usablePoints(points: { vacuumPa: number; flowStdM3PerS: number }[]): { vacuumPa: number; flowStdM3PerS: number }[] {
  return points
    .filter((p) => Number.isFinite(p.vacuumPa) && Number.isFinite(p.flowStdM3PerS) && p.vacuumPa > 0 && p.flowStdM3PerS >= 0)
    .sort((a, b) => a.vacuumPa - b.vacuumPa);
}

/**
 * A tool as a two-port law, port a the room, port b the hose end; positive
 * flow from the room into the hose.
 *
 * Orifice: the nozzle law above, upstream pressure the higher port (reverse
 * flow, were the hose end above the room, is the mirror image); choked below
 * r = 0.5283 (held, `limited: 'choked'`); below a deficit of 0.1 % the law is
 * blended to a finite slope (low-flow-blend.ts). A non-finite or
 * non-positive Cd is taken as 0.61; a diameter that is not positive closes
 * the tool (zero flow, zero derivatives).
 *
 * Table: standard flow against vacuum (p_a - p_b), mass flow = Q_std x 1.2041
 * kg/m3, interpolated by PCHIP through (0, 0) (points at zero or negative
 * vacuum are dropped: no vacuum, no flow). Beyond the highest vacuum stated
 * the tool is taken to behave as an orifice: flow grows as sqrt(vacuum) from
 * the last point, flagged `limited: 'curve-end'`, and stops growing at the
 * critical vacuum (1 - 0.5283) x ambientPa (`limited: 'choked'`). A table
 * with no usable point closes the tool.
 */
export function toolLaw(law: ToolLaw, ambientPa: number, temperatureK: number): TwoPortLaw {
  const t = Number.isFinite(temperatureK) && temperatureK > 0 ? temperatureK : 293.15;
  const closed: TwoPortLaw = { flow: () => ({ massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 }) };
  if (law.kind === 'orifice') {
    if (!(law.diameterM > 0) || !Number.isFinite(law.diameterM)) return closed;
    const cd = Number.isFinite(law.dischargeCoefficient) && law.dischargeCoefficient > 0 ? law.dischargeCoefficient : DEFAULT_DISCHARGE_COEFFICIENT;
    const area = (Math.PI * law.diameterM * law.diameterM) / 4;
    const kFactor = cd * area * Math.sqrt((2 * KAPPA_AIR) / ((KAPPA_AIR - 1) * R_AIR * t));
    const into = (pa: number, pb: number, out: PortFlow): void => {
      const a = guard(pa);
      const b = guard(pb);
      if (a >= b) nozzleInto(kFactor, a, b, out, false);
      else nozzleInto(kFactor, b, a, out, true);
    };
    return {
      flow(pa: number, pb: number): PortFlow {
        const out: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 };
        into(pa, pb, out);
        if (out.limited === undefined) delete out.limited;
        return out;
      },
      flowInto: into,
    };
  }
  const pts = usablePoints(law.points);
  if (pts.length === 0) return closed;
  const curve = pchip([0, ...pts.map((p) => p.vacuumPa)], [0, ...pts.map((p) => massFlowFromStandard(p.flowStdM3PerS))]);
  if (!curve) return closed;
  const ambient = Number.isFinite(ambientPa) && ambientPa > 0 ? ambientPa : 101325;
  const criticalVacuum = (1 - CRITICAL_PRESSURE_RATIO) * ambient;
  return {
    flow(pa: number, pb: number): PortFlow {
      const v = guard(pa) - guard(pb);
      const r = tableFlow(curve, Math.abs(v), criticalVacuum);
      const sign = v < 0 ? -1 : 1;
      return withLimit({ massFlowKgPerS: sign * r.value, dFlowDPa: r.slope, dFlowDPb: 0 - r.slope }, r.limited);
    },
  };
}

function tableFlow(curve: MonotoneCurve, vacuum: number, criticalVacuum: number): ValueSlope & { limited?: 'choked' | 'curve-end' } {
  if (vacuum <= curve.xMax) return curve.at(vacuum);
  const last = curve.ys[curve.ys.length - 1] as number;
  if (vacuum >= criticalVacuum) {
    const held = curve.xMax >= criticalVacuum ? last : last * Math.sqrt(criticalVacuum / curve.xMax);
    return { value: held, slope: 0, limited: 'choked' };
  }
  const root = Math.sqrt(vacuum / curve.xMax);
  return { value: last * root, slope: (0.5 * last) / (curve.xMax * root), limited: 'curve-end' };
}

function withLimit(flow: PortFlow, limited: PortFlow['limited'] | undefined): PortFlow {
  if (limited) flow.limited = limited;
  return flow;
}

function guard(p: number): number {
  return Number.isFinite(p) && p > PRESSURE_FLOOR_PA ? p : PRESSURE_FLOOR_PA;
}

/** Room-air volume flow, m^3/s, of a tool mass flow at ambient density (for air power and trade cfm). */
export function roomAirFlow(massFlowKgPerS: number, ambientPa: number, temperatureK: number): number {
  const rho = airDensity(ambientPa, temperatureK);
  return rho > 0 && Number.isFinite(massFlowKgPerS) ? massFlowKgPerS / rho : 0;
}
