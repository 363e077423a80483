/**
 * The producer in a solved case (flow, vacuum, air and shaft power) and its
 * margin over the demand.
 *
 * Demand: the vacuum and flow at the producer inlet at which the critical
 * tool of the case gets exactly the vacuum it needs. Found by holding the
 * producer inlet at a pressure (the producer itself left out) and solving
 * for the pressure where the least tool margin (tool vacuum minus need) is
 * zero, by the Illinois variant of regula falsi (Dowell and Jarratt 1971).
 * Margin: the curve's flow at the demand vacuum over the demand flow, minus
 * one (a fraction of flow, as the design basis states its required margin).
 */
import { R_AIR, STANDARD_DENSITY } from '../air/standard-air.js';
import { producerPower } from '../elements/producer-power.js';
import type { ScenarioOpening } from '../network/model.js';
import type { ProducerPoint } from './analysis-types.js';
import type { CaseRunner, CaseView } from './case-runner.js';

/** Producer points of every producer that took part in a case. */
export function producerPoints(runner: CaseRunner, view: CaseView): ProducerPoint[] {
  const g = runner.graph;
  const out: ProducerPoint[] = [];
  g.topology.elements.forEach((el, e) => {
    if (el.kind !== 'producer' || !view.has(e)) return;
    const unit = g.model.producers.find((p) => p.name === el.ref.name);
    const m = view.flowOf(e) ?? 0;
    const p1 = view.pressureAt(el.a);
    if (!unit || p1 === undefined) return;
    const ambient = g.ambientPa;
    const t = g.temperatureK;
    const power = producerPower({ massFlowKgPerS: m, inletPressurePa: p1, ambientPa: ambient, temperatureK: t }, unit.model);
    const limit = g.net.laws[e]?.flow(p1, ambient).limited;
    const point: ProducerPoint = {
      name: unit.name,
      massFlowKgPerS: m,
      flowStdM3PerS: m / STANDARD_DENSITY,
      inletFlowM3PerS: (m * R_AIR * t) / p1,
      inletPressurePa: p1,
      vacuumPa: ambient - p1,
      airPowerW: power.isothermalAirW,
      airPowerIsothermalW: power.isothermalAirW,
      airPowerAdiabaticW: power.adiabaticAirW,
      shaftPowerW: power.shaftW ?? null,
      marginFraction: null,
      demand: null,
    };
    if (limit === 'curve-end' || limit === 'relief') point.limited = limit;
    out.push(point);
  });
  return out;
}

export type DemandResult =
  | { ok: true; flowStdM3PerS: number; vacuumPa: number; marginFraction: number }
  /** `infeasible`: no producer vacuum gives every open tool what it needs (a shortage, not a gap in the data). */
  | { ok: false; reason: string; infeasible?: boolean };

// Stop when the least tool margin is within 1 Pa of zero (our choice) or after 40 steps.
const MARGIN_TOLERANCE_PA = 1;
const MAX_STEPS = 40;
// Search the producer inlet pressure no lower than 10 % of ambient (90 % vacuum; our choice).
// Without an operating point start at 20 % vacuum; step deeper by at least 2 % of ambient (our choices).
const FALLBACK_START_FRACTION = 0.8;
const FIRST_STEP_FRACTION = 0.02;
const LOWEST_INLET_FRACTION = 0.1;

/**
 * The demand point and margin for a case with one producer. `need` gives
 * each open inlet's required tool vacuum (null: no need stated).
 */
export function demandAndMargin(
  runner: CaseRunner,
  openings: readonly ScenarioOpening[],
  need: (inlet: string) => number | null,
  producerName: string,
  operatingInletPa: number,
): DemandResult {
  const g = runner.graph;
  const el = g.topology.elements.find((x) => x.kind === 'producer' && x.ref.name === producerName);
  const producer = el ? g.topology.elements.indexOf(el) : -1;
  if (!el || producer < 0) return { ok: false, reason: 'no such producer' };
  const needs = openings.map((o) => need(o.inlet));
  if (needs.every((x) => x === null)) return { ok: false, reason: 'no open tool states the vacuum it needs' };
  const node = el.a;
  const ambient = g.ambientPa;

  const leastMargin = (pInlet: number): { margin: number; flow: number } | null => {
    const out = runner.solve(openings, 'tool', new Map([[node, pInlet]]), true);
    if (!out.ok) return null;
    let margin = Infinity;
    let flow = 0;
    openings.forEach((o, idx) => {
      const pt = runner.inletPoint(out.view, o.inlet, o.toolState);
      if (!pt) return;
      flow += pt.massFlowKgPerS;
      const req = needs[idx];
      if (req !== null && req !== undefined) margin = Math.min(margin, pt.toolVacuumPa - req);
    });
    return Number.isFinite(margin) ? { margin, flow } : null;
  };

  // Bracket from the operating point: toward no vacuum when the critical
  // tool has vacuum to spare, else deeper, doubling the step.
  const start = Number.isFinite(operatingInletPa) && operatingInletPa > 0 && operatingInletPa < ambient ? operatingInletPa : FALLBACK_START_FRACTION * ambient;
  const f0 = leastMargin(start);
  if (!f0) return { ok: false, reason: 'the case cannot be solved with the producer inlet held' };
  let hi: number;
  let lo: number;
  let fHi: { margin: number; flow: number };
  let fLo: { margin: number; flow: number };
  if (f0.margin >= 0) {
    lo = start;
    fLo = f0;
    // At no vacuum nothing flows and every tool lacks all it needs: no solve needed.
    hi = ambient;
    fHi = { margin: -Math.max(...needs.filter((x): x is number => x !== null)), flow: 0 };
    if (fHi.margin >= 0) return finish(lo, fLo.flow);
  } else {
    hi = start;
    fHi = f0;
    let step = Math.max(FIRST_STEP_FRACTION * ambient, ambient - start);
    for (;;) {
      const x = hi - step;
      if (x < LOWEST_INLET_FRACTION * ambient) {
        return { ok: false, infeasible: true, reason: 'no producer vacuum (down to 10 % of the air pressure) gives every open tool the vacuum it needs' };
      }
      const f = leastMargin(x);
      if (!f) return { ok: false, infeasible: true, reason: 'no producer vacuum short of choking gives every open tool the vacuum it needs' };
      if (f.margin >= 0) {
        lo = x;
        fLo = f;
        break;
      }
      hi = x;
      fHi = f;
      step *= 2;
    }
  }
  let side = 0;
  for (let step = 0; step < MAX_STEPS; step++) {
    const x = (lo * fHi.margin - hi * fLo.margin) / (fHi.margin - fLo.margin);
    const fx = leastMargin(x);
    if (!fx) return { ok: false, reason: 'the case cannot be solved with the producer inlet held' };
    if (Math.abs(fx.margin) <= MARGIN_TOLERANCE_PA) return finish(x, fx.flow);
    if (fx.margin > 0) {
      lo = x;
      fLo = fx;
      if (side === -1) fHi = { ...fHi, margin: fHi.margin / 2 };
      side = -1;
    } else {
      hi = x;
      fHi = fx;
      if (side === 1) fLo = { ...fLo, margin: fLo.margin / 2 };
      side = 1;
    }
  }
  return finish((lo + hi) / 2, (fLo.flow + fHi.flow) / 2);

  function finish(pInlet: number, demandMassFlow: number): DemandResult {
    const curve = g.net.laws[producer]?.flow(pInlet, ambient);
    const curveFlow = curve && Number.isFinite(curve.massFlowKgPerS) ? curve.massFlowKgPerS : 0;
    const margin = demandMassFlow > 0 ? Math.max(-1, curveFlow / demandMassFlow - 1) : 0;
    return { ok: true, flowStdM3PerS: demandMassFlow / STANDARD_DENSITY, vacuumPa: ambient - pInlet, marginFraction: margin };
  }
}
