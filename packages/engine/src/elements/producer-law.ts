/**
 * The producer (exhauster) from its inlet (port a) to the atmosphere (port
 * b): a performance curve of vacuum at the inlet against flow (ENGINEERING.md).
 *
 * The curve is interpolated by PCHIP (Fritsch and Carlson 1980, pchip.ts) in
 * the curve's flow basis: standard flow (m / 1.2041 kg/m3) or actual flow at
 * the producer inlet (m R T / p_a). With an exhaust line the producer must
 * also overcome the exhaust loss, so the flow m solves
 *   V(Q(m, p_a)) = (p_b - p_a) + dp_exhaust(m),
 * which falls monotonically in m; the exhaust density is taken at p_b.
 */
import { R_AIR, STANDARD_DENSITY } from '../air/standard-air.js';
import type { CurvePoint, ProducerModel, ProducerUnit } from '../network/model.js';
import { type MonotoneCurve, pchip } from './pchip.js';
import { ratedLossDrop } from './rated-loss-law.js';
import { solveBracketed } from './scalar-solve.js';
import type { PortFlow, TwoPortLaw, UpstreamPressure } from './two-port-law.js';

/**
 * Proportional band of the vacuum relief: the system flow falls from the
 * curve flow at the set vacuum to zero over 5 % of the set vacuum (a relief
 * valve holds its set point within a few per cent: common practice; the
 * finite band keeps the law usable by Newton). Our choice.
 */
export const RELIEF_BAND_SHARE = 0.05;

const PRESSURE_FLOOR_PA = 1; // Pa: guards a solver overshoot (see pipe-law.ts)
// Newton steps tried from the last flow before the bracketed solve (our choice).
const WARM_NEWTON_STEPS = 8;

export type ProducerProblem =
  | 'curve-too-short'
  | 'curve-flow-not-ascending'
  | 'curve-vacuum-rises'
  | 'efficiency-invalid'
  | 'relief-invalid';

/** Curve points with finite, non-negative flow, sorted by flow. */
export function usableCurve(curve: CurvePoint[]): CurvePoint[] {
  return curve
    .filter((p) => Number.isFinite(p.flowM3PerS) && Number.isFinite(p.vacuumPa) && p.flowM3PerS >= 0)
    .sort((a, b) => a.flowM3PerS - b.flowM3PerS);
}

/** What is wrong with a producer model, for the network builder to report; empty when usable. */
export function producerProblems(model: ProducerModel): ProducerProblem[] {
  const out: ProducerProblem[] = [];
  const pts = usableCurve(model.curve);
  if (pts.length < 2) out.push('curve-too-short');
  for (let i = 1; i < model.curve.length; i++) {
    const a = model.curve[i - 1] as CurvePoint;
    const b = model.curve[i] as CurvePoint;
    if (!(b.flowM3PerS > a.flowM3PerS)) out.push('curve-flow-not-ascending');
    if (b.vacuumPa > a.vacuumPa) out.push('curve-vacuum-rises');
  }
  if (model.efficiency !== undefined && !(model.efficiency > 0 && model.efficiency <= 1)) out.push('efficiency-invalid');
  if (model.reliefVacuumPa !== undefined && !(model.reliefVacuumPa > 0 && Number.isFinite(model.reliefVacuumPa))) out.push('relief-invalid');
  return [...new Set(out)];
}

/** The producer curve V(Q) with straight, strictly falling extensions beyond both ends. */
interface VacuumCurve {
  qMin: number;
  qMax: number;
  at(q: number): { value: number; slope: number };
}

function vacuumCurve(points: CurvePoint[]): VacuumCurve | undefined {
  const curve: MonotoneCurve | undefined = pchip(
    points.map((p) => p.flowM3PerS),
    points.map((p) => p.vacuumPa),
  );
  if (!curve || curve.xs.length < 2) return undefined;
  const n = curve.xs.length;
  const xs = curve.xs;
  const ys = curve.ys;
  const span = (xs[n - 1] as number) - (xs[0] as number);
  const vMax = Math.max(...ys.map(Math.abs), 1);
  // End slopes must fall so the law stays invertible: PCHIP slope, else the
  // end segment's secant, else the whole curve's vacuum over its flow span (our choice).
  const fallback = -vMax / span;
  const pick = (...candidates: number[]): number => candidates.find((s) => s < 0) ?? fallback;
  const sLo = pick(curve.slopes[0] as number, ((ys[1] as number) - (ys[0] as number)) / ((xs[1] as number) - (xs[0] as number)));
  const sHi = pick(
    curve.slopes[n - 1] as number,
    ((ys[n - 1] as number) - (ys[n - 2] as number)) / ((xs[n - 1] as number) - (xs[n - 2] as number)),
  );
  const qMin = xs[0] as number;
  const qMax = xs[n - 1] as number;
  return {
    qMin,
    qMax,
    at(q: number) {
      if (q < qMin) return { value: (ys[0] as number) + sLo * (q - qMin), slope: sLo };
      if (q > qMax) return { value: (ys[n - 1] as number) + sHi * (q - qMax), slope: sHi };
      return curve.at(q);
    },
  };
}

interface Solved {
  m: number;
  dPa: number;
  dPb: number;
  beyondCurve: boolean;
}

/**
 * A producer as a two-port law: positive flow from the inlet (a) to the
 * atmosphere (b).
 *
 * Beyond the curve's last flow (vacuum lower than the curve's last point) the
 * curve is extended linearly and the result flagged `limited: 'curve-end'`;
 * below its first flow (vacuum above shut-off) likewise, which gives a
 * reverse flow through the producer rather than no answer.
 * Vacuum relief (model.reliefVacuumPa): when p_b - p_a exceeds the set
 * vacuum, bleed air is admitted at the inlet; the producer keeps running at
 * its curve flow m_r at the set vacuum and the system flow falls linearly to
 * zero over RELIEF_BAND_SHARE of the set vacuum (and below zero beyond, air
 * then flowing back into the system through the relief), `limited: 'relief'`.
 * A model without two usable curve points is closed (zero flow, zero
 * derivatives): report it with producerProblems.
 */
export function producerLaw(unit: ProducerUnit, temperatureK: number): TwoPortLaw {
  const t = Number.isFinite(temperatureK) && temperatureK > 0 ? temperatureK : 293.15;
  const rt = R_AIR * t;
  const model = unit.model;
  const curve = vacuumCurve(usableCurve(model.curve));
  if (!curve) return { flow: () => ({ massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 }) };
  const actual = model.flowBasis === 'actual';
  const exhaust = unit.exhaust;

  let lastFlow = Number.NaN;
  let lastInlet = Number.NaN;
  const solve = (pa: number, pb: number): Solved => {
    const rhoBasis = actual ? pa / rt : STANDARD_DENSITY; // Q = m / rhoBasis
    const rhoExhaust = pb / rt;
    const dv = pb - pa;
    const g = (m: number) => {
      const v = curve.at(m / rhoBasis);
      const e = exhaust ? ratedLossDrop(exhaust, m, rhoExhaust) : { dropPa: 0, dDropDm: 0 };
      return { value: v.value - e.dropPa - dv, slope: v.slope / rhoBasis - e.dDropDm };
    };
    // Warm start: Newton from the last flow while it behaves (g falls
    // strictly, so its root is unique); else the bracketed solve.
    let m = Number.NaN;
    if (Number.isFinite(lastFlow)) {
      let x = lastFlow;
      for (let i = 0; i < WARM_NEWTON_STEPS; i++) {
        const r = g(x);
        if (!(r.slope < 0) || !Number.isFinite(r.value)) break;
        const next = x - r.value / r.slope;
        if (Math.abs(next - x) <= 1e-14 * Math.abs(next) + 1e-15) {
          m = next;
          break;
        }
        x = next;
      }
    }
    if (!Number.isFinite(m)) {
      let lo = curve.qMin * rhoBasis;
      let hi = curve.qMax * rhoBasis;
      const step = Math.max(hi - lo, 1e-9);
      for (let k = 0; k < 200 && g(lo).value < 0; k++) lo -= step * 2 ** k;
      for (let k = 0; k < 200 && g(hi).value > 0; k++) hi += step * 2 ** k;
      m = solveBracketed(g, lo, hi, 0.5 * (lo + hi), { relTol: 1e-14, absTol: 1e-15 });
    }
    lastFlow = m;
    const q = m / rhoBasis;
    const v = curve.at(q);
    const e = exhaust ? ratedLossDrop(exhaust, m, rhoExhaust) : { dropPa: 0, dDropDm: 0 };
    const gm = v.slope / rhoBasis - e.dDropDm;
    // dQ/dpa = -m rt/pa^2 (actual basis); d(dp_exhaust)/dpb = -dp_exhaust/pb (density at pb).
    const gpa = (actual ? (v.slope * -m * rt) / (pa * pa) : 0) + 1;
    const gpb = e.dropPa / pb - 1;
    return {
      m,
      dPa: gm !== 0 ? -gpa / gm : 0,
      dPb: gm !== 0 ? -gpb / gm : 0,
      beyondCurve: q > curve.qMax || q < curve.qMin,
    };
  };

  const relief = model.reliefVacuumPa !== undefined && model.reliefVacuumPa > 0 && Number.isFinite(model.reliefVacuumPa) ? model.reliefVacuumPa : undefined;

  return {
    flow(paIn: number, pbIn: number): PortFlow {
      const pa = guard(paIn);
      const pb = guard(pbIn);
      if (relief !== undefined && pb - pa > relief && pb - relief > PRESSURE_FLOOR_PA) {
        const atSet = solve(pb - relief, pb);
        if (atSet.m > 0) {
          const band = RELIEF_BAND_SHARE * relief;
          const k = atSet.m / band;
          const dmSetDpb = atSet.dPa + atSet.dPb; // pa follows pb at the set vacuum
          const over = pb - pa - relief;
          return {
            massFlowKgPerS: atSet.m - k * over,
            dFlowDPa: k,
            dFlowDPb: dmSetDpb - (dmSetDpb / band) * over - k,
            limited: 'relief',
          };
        }
      }
      const s = solve(pa, pb);
      const out: PortFlow = { massFlowKgPerS: s.m, dFlowDPa: s.dPa, dFlowDPb: s.dPb };
      if (s.beyondCurve) out.limited = 'curve-end';
      return out;
    },
    inletPressureInto(m: number, pbIn: number, out: UpstreamPressure): boolean {
      // The curve read the other way: p_a = p_b - V(Q(m, p_a)) + dp_exhaust(m), explicit on a
      // standard-flow curve, by Newton on p_a on an actual-flow one (Q = m R T / p_a).
      if (!Number.isFinite(m) || !(pbIn > PRESSURE_FLOOR_PA) || !Number.isFinite(pbIn)) return false;
      const pb = pbIn;
      const e = exhaust ? ratedLossDrop(exhaust, m, pb / rt) : { dropPa: 0, dDropDm: 0 };
      let pa: number;
      let v: { value: number; slope: number };
      if (!actual) {
        v = curve.at(m / STANDARD_DENSITY);
        pa = pb - v.value + e.dropPa;
      } else {
        pa = Number.isFinite(lastInlet) ? lastInlet : 0.8 * pb;
        v = curve.at((m * rt) / pa);
        let converged = false;
        for (let i = 0; i < WARM_NEWTON_STEPS * 4 && pa > PRESSURE_FLOOR_PA; i++) {
          const h = pa - pb + v.value - e.dropPa;
          const dh = 1 - (v.slope * m * rt) / (pa * pa);
          if (!(dh > 0)) return false;
          const next = pa - h / dh;
          const done = Math.abs(next - pa) <= 1e-15 * Math.abs(next) + 1e-12;
          pa = next;
          if (!(pa > PRESSURE_FLOOR_PA)) return false;
          v = curve.at((m * rt) / pa);
          if (done) {
            converged = true;
            break;
          }
        }
        if (!converged) return false;
      }
      // Past the relief's set vacuum the relief law applies: leave that to inverting `flow`.
      if (!(pa > PRESSURE_FLOOR_PA) || (relief !== undefined && pb - pa > relief)) return false;
      lastInlet = pa;
      // g(m, pa, pb) = V(Q) - dp_exhaust - (pb - pa) = 0 (see solve): dpa/dm = -g_m/g_pa, dpa/dpb = -g_pb/g_pa.
      const dq = actual ? rt / pa : 1 / STANDARD_DENSITY;
      const gm = v.slope * dq - e.dDropDm;
      const gpa = (actual ? (v.slope * -m * rt) / (pa * pa) : 0) + 1;
      const gpb = e.dropPa / pb - 1;
      out.pressurePa = pa;
      out.dPressureDFlow = -gm / gpa;
      out.dPressureDDown = -gpb / gpa;
      return true;
    },
  };
}

function guard(p: number): number {
  return Number.isFinite(p) && p > PRESSURE_FLOOR_PA ? p : PRESSURE_FLOOR_PA;
}
