import {
  buildNetworkGraph,
  caseElements,
  defaultElementLaws,
  solveNetwork,
  STANDARD_DENSITY,
  type SystemAnalysis,
  type SystemModel,
} from '@vacnet/engine';

/** One point of the system's demand: the producer-inlet vacuum and the standard flow the design case then draws. */
export interface DemandPoint {
  vacuumPa: number;
  flowStdM3PerS: number;
}

export type SystemDemandCurve =
  | { ok: true; points: DemandPoint[]; openInlets: string[] }
  | { ok: false; reason: string };

/** Vacuum levels solved besides the operating and demand points (our choice: a smooth line on the plot). */
const LEVELS = 16;

/**
 * The system demand curve of the design case: for a vacuum V held at the
 * producer inlet (the producer itself left out), the standard flow the
 * design operators' tools draw through the piping, separator and filter.
 * Where it crosses the producer curve is the operating point; the point on
 * it where the critical tool gets exactly what it needs is the demand point.
 *
 * Inputs: the model and its analysis (the design case's open inlets, tools
 * working; the loaded filter, as the analysis uses). Output: points with
 * ascending vacuum from 0 up to the larger of the producer's shut-off
 * vacuum, its relief and the operating point, through the operating and
 * demand vacuums; levels the solver cannot solve (choked tools) are left
 * out. Solved with the engine's network solver and element laws, so it is
 * the same physics as the analysis. Only for a system with one producer.
 */
export function systemDemandCurve(model: SystemModel, analysis: SystemAnalysis): SystemDemandCurve {
  try {
    return demandCurve(model, analysis);
  } catch (error) {
    return { ok: false, reason: `the demand curve could not be computed: ${error instanceof Error ? error.message : String(error)}` };
  }
}

function demandCurve(model: SystemModel, analysis: SystemAnalysis): SystemDemandCurve {
  const design = analysis.designCase;
  if (!design || design.openInlets.length === 0) return { ok: false, reason: 'the analysis found no design case' };
  if ((model.producers ?? []).length !== 1) return { ok: false, reason: 'drawn for a system with one producer only' };
  const graph = buildNetworkGraph(model, { laws: defaultElementLaws });
  const producer = graph.topology.elements.findIndex((el) => el.kind === 'producer');
  if (producer < 0) return { ok: false, reason: 'the system has no producer' };
  const inletNode = graph.topology.elements[producer]!.a;
  const openings = design.openInlets.map((inlet) => ({ inlet, toolState: 'working' as const }));
  const base = caseElements(graph, openings);
  if (!base.ok) return { ok: false, reason: base.failure.message };
  const elements = base.elements.filter((e) => !graph.net.drives[e]);
  const tools = new Set(design.openInlets.map((name) => graph.inletElements.get(name)?.toolWorking).filter((e): e is number => e !== undefined));
  const ambient = graph.ambientPa;
  if (!(ambient > 0)) return { ok: false, reason: 'the site air is not physical' };

  const curveTop = Math.max(0, ...(model.producers[0]!.model?.curve ?? []).map((p) => (Number.isFinite(p.vacuumPa) ? p.vacuumPa : 0)));
  const relief = model.producers[0]!.model?.reliefVacuumPa;
  const operating = analysis.producer?.vacuumPa;
  const demand = analysis.producer?.demand?.vacuumPa;
  const top = Math.max(curveTop, finite(relief), finite(operating), finite(demand));
  if (!(top > 0)) return { ok: false, reason: 'the producer curve gives no vacuum' };

  const levels = new Set<number>();
  for (let i = 1; i <= LEVELS; i++) levels.add((top * i) / LEVELS);
  for (const v of [operating, demand]) if (v !== undefined && v > 0 && v < ambient) levels.add(v);
  const points: DemandPoint[] = [{ vacuumPa: 0, flowStdM3PerS: 0 }];
  const guess = new Float64Array(graph.net.nodeCount).fill(Number.NaN);
  for (const vacuumPa of [...levels].sort((a, b) => a - b)) {
    if (!(vacuumPa < ambient)) continue;
    const res = solveNetwork(graph.net, elements, { fixedOverridesPa: new Map([[inletNode, ambient - vacuumPa]]), initialPressurePa: guess });
    if (!res.ok) continue;
    res.nodes.forEach((node, i) => (guess[node] = res.pressurePa[i]!));
    let mass = 0;
    res.elements.forEach((e, i) => {
      if (tools.has(e)) mass += res.flowKgPerS[i]!;
    });
    if (Number.isFinite(mass) && mass >= 0) points.push({ vacuumPa, flowStdM3PerS: mass / STANDARD_DENSITY });
  }
  if (points.length < 3) return { ok: false, reason: 'the design case could not be solved with the producer inlet held' };
  return { ok: true, points, openInlets: [...design.openInlets] };
}

function finite(x: number | undefined): number {
  return x !== undefined && Number.isFinite(x) ? x : 0;
}
