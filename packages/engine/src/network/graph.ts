/**
 * The solvable network of a system: the topology with a flow law on every
 * element, as a `SolverNetwork`, plus the maps the analysis needs (inlet ->
 * nodes and elements, pipe -> segments).
 *
 * Pipe losses: each segment of a pipe split at inlets gets its share of the
 * bends (in proportion to length); the segment at the producer-side end
 * also gets the entry loss of the junction with the parent (wye, tee,
 * sweep) and, for a straight run-on into a parent of another size, the
 * transition loss (a stated reducer's angle, else a standard concentric
 * reducer).
 */
import type { TwoPortLaw } from '../elements/two-port-law.js';
import type { SolveFailure, SolverNetwork } from '../solve/solve-types.js';
import type { ElementLaws } from './element-laws.js';
import type { Pipe, ScenarioOpening, SystemModel, ToolLaw } from './model.js';
import { addInletElements, buildTopology, type InletElements, type Topology } from './topology.js';

export interface TestOrifice {
  diameterM: number;
  dischargeCoefficient: number;
}

export interface GraphOptions {
  laws: ElementLaws;
  /** Build a test-orifice element at every inlet valve (for commissioning predictions). */
  testOrifice?: TestOrifice;
  /** Filter rating to use (default: loaded where given, as the design case). */
  filterState?: 'loaded' | 'clean';
}

export interface NetworkGraph {
  model: SystemModel;
  topology: Topology;
  net: SolverNetwork;
  inletElements: Map<string, InletElements>;
  ambientPa: number;
  temperatureK: number;
  /** Inside diameter of each pipe segment, m (NaN for other elements). */
  diameterM: Float64Array;
  /** Lumped loss coefficient of each pipe segment (NaN for other elements). */
  sumK: Float64Array;
}

// Diameters within 0.5 % are the same size: no transition loss (our choice).
const SAME_SIZE_FRACTION = 0.005;

/** Builds the solvable graph of a system, with every inlet's hose and tools present but not yet opened. */
export function buildNetworkGraph(model: SystemModel, options: GraphOptions): NetworkGraph {
  const { laws } = options;
  const topology = buildTopology(model);
  const inletElements = addInletElements(topology);
  const ambientPa = model.site.ambientPressurePa;
  const temperatureK = model.site.temperatureK;
  const count = topology.elements.length;
  const lawList: (TwoPortLaw | null)[] = new Array(count).fill(null);
  const invalid: (string | undefined)[] = new Array(count).fill(undefined);
  const diameterM = new Float64Array(count).fill(NaN);
  const sumK = new Float64Array(count).fill(NaN);
  const drives = new Uint8Array(count);

  const siteOk = Number.isFinite(ambientPa) && ambientPa > 0 && Number.isFinite(temperatureK) && temperatureK > 0;
  const make = (e: number, reason: string | undefined, build: () => TwoPortLaw): void => {
    if (!siteOk) {
      invalid[e] = `site air is not physical (ambient ${ambientPa} Pa, ${temperatureK} K)`;
      return;
    }
    if (reason) {
      invalid[e] = reason;
      return;
    }
    try {
      // A law that later gives no finite flow is caught by the solver (invalid-element).
      lawList[e] = build();
    } catch (error) {
      invalid[e] = `the element law cannot be built: ${error instanceof Error ? error.message : String(error)}`;
    }
  };

  const producers = new Map((model.producers ?? []).map((p) => [p.name, p]));
  const separators = new Map((model.separators ?? []).map((s) => [s.name, s]));
  const filters = new Map((model.filters ?? []).map((f) => [f.name, f]));
  const parentOf = parentPipes(model);
  const inletLaw = new Map<number, { law: ToolLaw | undefined; name: string }>();
  for (const [name, ie] of inletElements) {
    const tool = topology.inlets.get(name)!.inlet.tool;
    inletLaw.set(ie.toolWorking, { law: tool?.working, name });
    inletLaw.set(ie.toolLifted, { law: tool?.lifted ?? tool?.working, name });
  }

  topology.elements.forEach((el, e) => {
    switch (el.kind) {
      case 'producer': {
        const unit = producers.get(el.ref.name)!;
        drives[e] = 1;
        make(e, unit.model?.curve?.length ? undefined : 'the producer has no curve', () => laws.producer(unit, model.site));
        break;
      }
      case 'separator': {
        const unit = separators.get(el.ref.name)!;
        make(e, ratedProblem(unit.model?.rated), () => laws.ratedLoss(unit.model.rated, temperatureK));
        break;
      }
      case 'filter': {
        const unit = filters.get(el.ref.name)!;
        const rated = options.filterState === 'clean' ? unit.model?.clean : (unit.model?.loaded ?? unit.model?.clean);
        make(e, ratedProblem(rated), () => laws.ratedLoss(rated!, temperatureK));
        break;
      }
      case 'pipe': {
        const info = el.pipe!;
        const pipe = info.pipe;
        const d = pipe.insideDiameterM;
        diameterM[e] = d;
        const k = segmentK(pipe, info.segment, info.lengthM, parentOf.get(pipe.name), laws);
        sumK[e] = k;
        const reason = pipeProblem(pipe, info.lengthM, k);
        make(e, reason, () =>
          laws.pipe({ diameterM: d, lengthM: info.lengthM, roughnessM: pipe.spec.roughnessM, sumK: k, temperatureK }),
        );
        break;
      }
      case 'hose': {
        const hose = el.inlet!.hose;
        const reason = !hose
          ? 'the inlet has no hose'
          : !(hose.boreM > 0 && Number.isFinite(hose.boreM))
            ? `hose ${hose.name} has no bore (${hose.boreM} m)`
            : !(hose.lengthM > 0 && Number.isFinite(hose.lengthM))
              ? `hose ${hose.name} has no length (${hose.lengthM} m)`
              : undefined;
        make(e, reason, () => laws.hose(hose, ambientPa, temperatureK));
        break;
      }
      case 'tool': {
        const { law } = inletLaw.get(e)!;
        make(e, toolProblem(law), () => laws.tool(law!, ambientPa, temperatureK));
        break;
      }
      case 'test-orifice': {
        const o = options.testOrifice;
        const law: ToolLaw | undefined = o ? { kind: 'orifice', diameterM: o.diameterM, dischargeCoefficient: o.dischargeCoefficient } : undefined;
        make(e, o ? toolProblem(law) : 'no test orifice was asked for', () => laws.tool(law!, ambientPa, temperatureK));
        break;
      }
    }
  });

  const net: SolverNetwork = {
    nodeCount: topology.nodes.length,
    fixedPressurePa: Float64Array.from(topology.nodes, (n) => (n.kind === 'atmosphere' ? ambientPa : NaN)),
    elementA: Int32Array.from(topology.elements, (el) => el.a),
    elementB: Int32Array.from(topology.elements, (el) => el.b),
    laws: lawList,
    invalid,
    refs: topology.elements.map((el) => el.ref),
    drives,
    classifyLimit: (e, limit, pa, _pb, flow) => {
      const el = topology.elements[e]!;
      // A tool or test orifice at sonic flow is a physical state: the nozzle
      // law holds the critical flow, fixed by the room side alone (ENGINEERING.md,
      // tool law). A test orifice so is a sound test; a choked tool is reported
      // by the analysis as a note on its inlet and by the rule tool-choked.
      // A pipe at isothermal choking has no physical solution: a failure.
      if (limit === 'choked') return el.kind === 'test-orifice' || el.kind === 'tool' ? null : 'choked';
      if (limit !== 'curve-end') return null;
      if (el.kind !== 'producer') return null; // a tool past its table: extrapolated, not a failure
      const unit = producers.get(el.ref.name)!;
      const end = laws.producerCurveEndFlow?.(unit, pa, temperatureK);
      // Past the low-flow end (vacuum above shut-off) is no shortage; past the high-flow end is.
      return end === undefined || flow > end ? 'infeasible-demand' : null;
    },
  };
  return { model, topology, net, inletElements, ambientPa, temperatureK, diameterM, sumK };
}

export type CaseElements = { ok: true; elements: number[] } | { ok: false; failure: SolveFailure };

/**
 * The elements of one case: all piping and equipment, plus the hose and the
 * tool (in its state) of each open inlet; with `testOrifice`, open inlets
 * get the test orifice in the valve instead of hose and tool. With
 * `withoutPiping`, only the inlets' own elements (the caller adds piping).
 */
export function caseElements(
  graph: NetworkGraph,
  openings: readonly ScenarioOpening[],
  opts: { testOrifice?: boolean; withoutPiping?: boolean } = {},
): CaseElements {
  const elements = opts.withoutPiping ? [] : [...graph.topology.structural];
  for (const o of openings) {
    const ie = graph.inletElements.get(o.inlet);
    const ti = graph.topology.inlets.get(o.inlet);
    if (!ie || !ti) {
      return { ok: false, failure: { cause: 'no-path', element: { kind: 'inlet', name: o.inlet }, message: `there is no inlet ${o.inlet}` } };
    }
    if (ti.node < 0) {
      return {
        ok: false,
        failure: { cause: 'no-path', element: { kind: 'inlet', name: o.inlet, property: 'position' }, message: `inlet ${o.inlet} is not on the piping` },
      };
    }
    if (opts.testOrifice) {
      elements.push(ie.testOrifice);
    } else {
      elements.push(ie.hose, o.toolState === 'lifted' ? ie.toolLifted : ie.toolWorking);
    }
  }
  return { ok: true, elements };
}

/** Pipes each pipe discharges into: those whose far end is its producer-side end. */
function parentPipes(model: SystemModel): Map<string, Pipe> {
  const endingAt = new Map<string, Pipe>();
  for (const p of model.pipes ?? []) if (!endingAt.has(p.to)) endingAt.set(p.to, p);
  const out = new Map<string, Pipe>();
  for (const p of model.pipes ?? []) {
    const parent = endingAt.get(p.from);
    if (parent && parent !== p) out.set(p.name, parent);
  }
  return out;
}

/** Lumped K of one segment of a pipe (see the file comment). */
function segmentK(pipe: Pipe, segment: number, segmentLengthM: number, parent: Pipe | undefined, laws: ElementLaws): number {
  const d = pipe.insideDiameterM;
  let bends = 0;
  let reducerAngle: number | undefined;
  let hasReducer = false;
  for (const f of pipe.fittings ?? []) {
    if (f.kind === 'bend') bends += Math.max(0, f.count) * laws.bendK(f.angleRad, f.radiusRatio, d);
    else {
      hasReducer = true;
      reducerAngle = f.angleRad;
    }
  }
  const share = pipe.lengthM > 0 ? segmentLengthM / pipe.lengthM : 1;
  let k = bends * share;
  if (segment === 0) {
    if (pipe.joins) k += laws.junctionK(pipe.joins);
    else if (parent && Math.abs(parent.insideDiameterM - d) > SAME_SIZE_FRACTION * d) {
      k += laws.transitionK(d, parent.insideDiameterM, hasReducer ? reducerAngle : undefined);
    }
  }
  return k;
}

function pipeProblem(pipe: Pipe, segmentLengthM: number, k: number): string | undefined {
  if (!(pipe.insideDiameterM > 0) || !Number.isFinite(pipe.insideDiameterM)) return `pipe ${pipe.name} has no bore (${pipe.insideDiameterM} m)`;
  if (!(pipe.lengthM > 0) || !Number.isFinite(pipe.lengthM)) return `pipe ${pipe.name} has no length (${pipe.lengthM} m)`;
  if (!(segmentLengthM > 0)) return `a part of pipe ${pipe.name} has no length`;
  if (!(pipe.spec?.roughnessM >= 0) || !Number.isFinite(pipe.spec.roughnessM)) return `pipe ${pipe.name} has no valid roughness`;
  if (!(k >= 0) || !Number.isFinite(k)) return `pipe ${pipe.name} has an invalid fitting loss`;
  return undefined;
}

function ratedProblem(rated: { lossPa: number; flowStdM3PerS: number } | undefined): string | undefined {
  if (!rated) return 'no rated loss is given';
  if (!(rated.lossPa > 0) || !Number.isFinite(rated.lossPa)) return `the rated loss must be positive (${rated.lossPa} Pa)`;
  if (!(rated.flowStdM3PerS > 0) || !Number.isFinite(rated.flowStdM3PerS)) return `the rated flow must be positive (${rated.flowStdM3PerS} m3/s)`;
  return undefined;
}

function toolProblem(law: ToolLaw | undefined): string | undefined {
  if (!law) return 'the tool has no flow law';
  if (law.kind === 'orifice') {
    if (!(law.diameterM > 0) || !Number.isFinite(law.diameterM)) return `the tool orifice has no diameter (${law.diameterM} m)`;
    if (!(law.dischargeCoefficient > 0) || !(law.dischargeCoefficient <= 1)) return `the discharge coefficient must be in (0, 1] (${law.dischargeCoefficient})`;
    return undefined;
  }
  if (!law.points?.length) return 'the tool table has no points';
  return undefined;
}
