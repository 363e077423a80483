import { airDensity, pchip, ratedLossDrop, STANDARD_DENSITY, standardFromActual, usableCurve, type SystemAnalysis, type SystemModel } from '@vacnet/engine';
import { systemDemandCurve, type DemandPoint } from './system-demand-curve.js';

/** A point on the plot: standard flow and vacuum, SI. */
export interface PlotPoint {
  flowStdM3PerS: number;
  vacuumPa: number;
}

/** What the producer-curve plot shows, in SI (its renderer converts to the display units). */
export interface CurvePlotModel {
  producerName: string;
  modelName: string;
  /** The curve's points as given (flow converted to standard flow when the curve is in actual flow). */
  curvePoints: (PlotPoint & { powerW?: number })[];
  /** The curve sampled densely along the engine's PCHIP interpolation, for drawing. */
  curveSamples: PlotPoint[];
  /**
   * With an exhaust line: the curve less the exhaust loss at each flow, the
   * vacuum the producer can hold at its inlet (the operating point lies on
   * it); null without one.
   */
  netSamples: PlotPoint[] | null;
  /** The exhaust line's rated loss, as written. */
  exhaust: { lossPa: number; flowStdM3PerS: number } | null;
  /** Set when the curve is in actual flow at the producer inlet and was converted to standard flow. */
  flowBasisNote: string | null;
  /** The system demand curve of the design case, or null with the reason in `demandCurveNote`. */
  demandCurve: DemandPoint[] | null;
  demandCurveNote: string;
  operating: (PlotPoint & { limited: 'curve-end' | 'relief' | null }) | null;
  /** Where the critical tool of the design case gets exactly what it needs. */
  demand: PlotPoint | null;
  marginFraction: number | null;
  requiredMarginFraction: number | null;
  /** The curve's flow at the demand vacuum: demand flow times (1 + margin). */
  marginFlowStdM3PerS: number | null;
  reliefVacuumPa: number | null;
  /** The design case's open inlets, critical one first. */
  designInlets: string[];
}

export type CurvePlotResult = { ok: true; plot: CurvePlotModel } | { ok: false; reason: string };

// Samples along the curve for drawing: enough for a smooth line at report size (our choice).
const SAMPLES = 96;

/**
 * The plot of the first producer: its curve through the catalog points by
 * the engine's PCHIP (the same interpolation as the producer law, in the
 * curve's own flow basis), the system demand curve of the design case
 * (system-demand-curve.ts), the operating point and the demand point.
 */
export function curvePlotModel(model: SystemModel, analysis: SystemAnalysis): CurvePlotResult {
  const point = analysis.producer;
  const unit = (point && model.producers.find((p) => p.name === point.name)) ?? model.producers[0];
  if (!unit?.model) return { ok: false, reason: 'The system has no producer to plot.' };
  const given = usableCurve(unit.model.curve ?? []);
  if (given.length < 2) return { ok: false, reason: `The curve of ${unit.model.name} has fewer than two usable points.` };
  const ambient = analysis.ambient.pressurePa;
  const temperature = analysis.ambient.temperatureK;
  const actual = unit.model.flowBasis === 'actual';
  // An actual flow at the producer inlet, at the vacuum of the same curve point, as standard flow.
  const toStandard = (q: number, vacuumPa: number) => (actual ? standardFromActual(q, ambient - vacuumPa, temperature) : q);

  const curve = pchip(
    given.map((p) => p.flowM3PerS),
    given.map((p) => p.vacuumPa),
  );
  if (!curve) return { ok: false, reason: `The curve of ${unit.model.name} cannot be interpolated.` };
  const samples: PlotPoint[] = [];
  for (let i = 0; i <= SAMPLES; i++) {
    const q = curve.xMin + ((curve.xMax - curve.xMin) * i) / SAMPLES;
    const v = curve.at(q).value;
    if (Number.isFinite(v)) samples.push({ flowStdM3PerS: toStandard(q, v), vacuumPa: v });
  }

  // The exhaust loss at the producer outlet, air at ambient density (as the producer law takes it).
  const exhaust = unit.exhaust;
  const exhaustDensity = airDensity(ambient, temperature);
  const net = exhaust
    ? samples.map((s) => ({ flowStdM3PerS: s.flowStdM3PerS, vacuumPa: s.vacuumPa - ratedLossDrop(exhaust, s.flowStdM3PerS * STANDARD_DENSITY, exhaustDensity).dropPa }))
    : null;

  const demandCurve = systemDemandCurve(model, analysis);
  const relief = unit.model.reliefVacuumPa;
  const margin = point?.marginFraction ?? null;
  return {
    ok: true,
    plot: {
      producerName: unit.name,
      modelName: unit.model.name,
      curvePoints: given.map((p) => ({ flowStdM3PerS: toStandard(p.flowM3PerS, p.vacuumPa), vacuumPa: p.vacuumPa, ...(p.powerW !== undefined ? { powerW: p.powerW } : {}) })),
      curveSamples: samples,
      netSamples: net,
      exhaust: exhaust ? { lossPa: exhaust.lossPa, flowStdM3PerS: exhaust.flowStdM3PerS } : null,
      flowBasisNote: actual ? 'The maker gives this curve in actual flow at the producer inlet; it is drawn in standard flow at each point\u2019s vacuum.' : null,
      demandCurve: demandCurve.ok ? demandCurve.points : null,
      demandCurveNote: demandCurve.ok
        ? `System demand: the design case (${demandCurve.openInlets.join(', ')} open, tools working) solved with the producer inlet held at each vacuum.`
        : `No system demand curve: ${demandCurve.reason}. The demand and operating points are marked.`,
      operating: point ? { flowStdM3PerS: point.flowStdM3PerS, vacuumPa: point.vacuumPa, limited: point.limited ?? null } : null,
      demand: point?.demand ? { ...point.demand } : null,
      marginFraction: margin,
      requiredMarginFraction: model.design?.producerMarginFraction ?? null,
      marginFlowStdM3PerS: point?.demand && margin !== null ? point.demand.flowStdM3PerS * (1 + margin) : null,
      reliefVacuumPa: relief !== undefined && Number.isFinite(relief) && relief > 0 ? relief : null,
      designInlets: analysis.designCase?.openInlets ?? [],
    },
  };
}
