/**
 * Solves cases of one system for the analysis: picks the elements of a case
 * (only the paths of its open inlets when the piping is a tree), starts
 * Newton from the pressures of the previous solve, counts the work, and
 * reads inlet and pipe results out of a solved state.
 */
import { R_AIR, STANDARD_DENSITY } from '../air/standard-air.js';
import { caseElements, type NetworkGraph } from '../network/graph.js';
import type { ScenarioOpening } from '../network/model.js';
import { solveNetwork } from '../solve/solve-network.js';
import type { LawLimit, SolveEffort, SolveFailure, SolveResult } from '../solve/solve-types.js';
import type { InletPoint, PipePoint, ToolState } from './analysis-types.js';
import { PathFlowSolver, type PathEntry, type PathSolved } from './path-flow-solver.js';
import { pathElements, type PathTree } from './path-tree.js';

export type CaseMode = 'tool' | 'orifice';

// Cases of up to this many open inlets keep their own starting-flow scale (our choice; larger share one).
const MAX_SCALED_SIZE = 64;

/** What a case view reads: node pressures and element flows (the solver's state, or the path solver's). */
export interface CaseState {
  nodes: ArrayLike<number>;
  pressurePa: ArrayLike<number>;
  elements: ArrayLike<number>;
  flowKgPerS: ArrayLike<number>;
  /** Elements whose law held a limit at the solution (an accepted state, when the case solved). */
  limited?: readonly { element: number; limit: LawLimit }[];
}

/** A solved state with lookups by node and element. */
export class CaseView {
  private readonly pressure = new Map<number, number>();
  private readonly flow = new Map<number, number>();
  constructor(readonly state: CaseState) {
    for (let i = 0; i < state.nodes.length; i++) this.pressure.set(state.nodes[i]!, state.pressurePa[i]!);
    for (let i = 0; i < state.elements.length; i++) this.flow.set(state.elements[i]!, state.flowKgPerS[i]!);
  }
  pressureAt(node: number): number | undefined {
    return this.pressure.get(node);
  }
  flowOf(element: number): number | undefined {
    return this.flow.get(element);
  }
  has(element: number): boolean {
    return this.flow.has(element);
  }
  /** The limit an element's law held at the solution, if any. */
  limitOf(element: number): LawLimit | undefined {
    return this.state.limited?.find((l) => l.element === element)?.limit;
  }
}

export type CaseOutcome = { ok: true; view: CaseView } | { ok: false; failure: SolveFailure; view?: CaseView };

export class CaseRunner {
  readonly effort: SolveEffort = { solves: 0, newtonIterations: 0, elementEvaluations: 0 };
  /** Starting pressures for the next solve: the last solution wherever there was one. */
  private readonly guess: Float64Array;
  private readonly inletPath = new Map<string, number[]>();
  private readonly stamp: Int32Array;
  private stampValue = 0;
  // What the last solves taught, for starting guesses in a tree: each
  // element's last flow and drop, each producer's last point and slope,
  // each inlet's last flow in each state.
  private readonly lastFlow: Float64Array;
  private readonly lastDrop: Float64Array;
  private readonly producerMemory = new Map<number, { flow: number; inletPa: number; slope: number }>();
  /**
   * Each inlet's entry flow by state (working, lifted, orifice): the last
   * seen [0..3) and the one it had open alone [3..6) (NaN unknown); any
   * inlet's last; and, per state and number of open inlets, how the flows
   * of the last such case compared with the inlets' flows alone.
   */
  private readonly entryFlow = new Map<string, Float64Array>();
  private readonly anyEntryFlow = new Float64Array(3).fill(Number.NaN);
  private readonly sizeScale = new Float64Array(3 * (MAX_SCALED_SIZE + 1)).fill(1);
  private readonly treeStart: Float64Array;
  private readonly pathSolver: PathFlowSolver;

  constructor(
    readonly graph: NetworkGraph,
    readonly tree: PathTree,
  ) {
    const n = graph.net.nodeCount;
    const m = graph.topology.elements.length;
    this.guess = new Float64Array(n).fill(NaN);
    this.treeStart = new Float64Array(n).fill(NaN);
    this.stamp = new Int32Array(m);
    this.lastFlow = new Float64Array(m);
    this.lastDrop = new Float64Array(m);
    this.pathSolver = new PathFlowSolver(graph, tree);
  }

  /** The piping path of an inlet (tree mode), cached. */
  pathOf(inlet: string): number[] {
    let p = this.inletPath.get(inlet);
    if (!p) {
      const ti = this.graph.topology.inlets.get(inlet);
      p = ti && ti.node >= 0 ? pathElements(this.tree, ti.node) : [];
      this.inletPath.set(inlet, p);
    }
    return p;
  }

  /** Solves one case: the given inlets open with their tools (or the test orifice in the valve). */
  solve(
    openings: readonly ScenarioOpening[],
    mode: CaseMode = 'tool',
    fixedOverridesPa?: ReadonlyMap<number, number>,
    dropProducers = false,
    acceptCurveEnd = false,
  ): CaseOutcome {
    const exact = this.tree.exact;
    if (exact) {
      const fast = this.solveByFlows(openings, mode, fixedOverridesPa, dropProducers, acceptCurveEnd);
      if (fast) {
        for (let i = 0; i < fast.nodes.length; i++) this.guess[fast.nodes[i]!] = fast.pressurePa[i]!;
        const view = new CaseView(fast);
        this.learnEntryFlows(view, openings, mode, fixedOverridesPa === undefined || fixedOverridesPa.size === 0);
        return { ok: true, view };
      }
    }
    const base = caseElements(this.graph, openings, { testOrifice: mode === 'orifice', withoutPiping: exact });
    if (!base.ok) return { ok: false, failure: base.failure };
    let elements = base.elements;
    if (exact) {
      // Only the paths of the open inlets carry air.
      this.stampValue++;
      for (const e of elements) this.stamp[e] = this.stampValue;
      for (const o of openings) {
        for (const e of this.pathOf(o.inlet)) {
          if (this.stamp[e] !== this.stampValue) {
            this.stamp[e] = this.stampValue;
            elements.push(e);
          }
        }
      }
    }
    if (dropProducers) elements = elements.filter((e) => !this.graph.net.drives[e]);
    const touched = exact ? this.treeGuess(openings, mode, fixedOverridesPa) : null;
    const res: SolveResult = solveNetwork(
      this.graph.net,
      elements,
      { initialPressurePa: touched ? this.treeStart : this.guess, fixedOverridesPa, prune: !this.tree.exact, acceptCurveEnd },
      this.effort,
    );
    if (touched) for (const node of touched) this.treeStart[node] = NaN;
    if (!res.ok) return { ok: false, failure: res.failure, view: res.state ? new CaseView(res.state) : undefined };
    res.nodes.forEach((node, i) => (this.guess[node] = res.pressurePa[i]!));
    const view = new CaseView(res);
    this.learn(view, openings, mode, fixedOverridesPa);
    return { ok: true, view };
  }

  /**
   * A tree case by its inlet flows (path-flow-solver.ts), started from each
   * inlet's last flow in its state; null when that solver cannot take it
   * (no flows seen yet, other held pressures, a repeated inlet, or a case
   * it hands back), and the network solver then does.
   */
  private solveByFlows(
    openings: readonly ScenarioOpening[],
    mode: CaseMode,
    fixed: ReadonlyMap<number, number> | undefined,
    dropProducers: boolean,
    acceptCurveEnd: boolean,
  ): PathSolved | null {
    const g = this.graph;
    let rootPa: number | undefined;
    if (fixed && fixed.size > 0) {
      if (!dropProducers || fixed.size !== 1) return null;
      const [[node, pa]] = [...fixed.entries()] as [[number, number]];
      if (!this.tree.rootProducers.has(node)) return null;
      rootPa = pa;
    } else if (dropProducers) {
      return null;
    }
    const entries: PathEntry[] = [];
    const x0: number[] = [];
    const seen = new Set<string>();
    for (const o of openings) {
      if (seen.has(o.inlet)) return null;
      seen.add(o.inlet);
      const ti = g.topology.inlets.get(o.inlet);
      const ie = g.inletElements.get(o.inlet);
      if (!ti || !ie || ti.node < 0) return null;
      if (rootPa !== undefined && this.tree.root[ti.node] !== [...fixed!.keys()][0]) return null;
      const q = this.startFlow(o, mode, openings.length);
      if (q === undefined || !(q > 0)) return null;
      x0.push(q);
      entries.push(
        mode === 'orifice'
          ? { valve: ti.node, hose: -1, hoseEnd: -1, entry: ie.testOrifice }
          : { valve: ti.node, hose: ie.hose, hoseEnd: ti.hoseEndNode, entry: o.toolState === 'lifted' ? ie.toolLifted : ie.toolWorking },
      );
    }
    return this.pathSolver.solve(entries, x0, rootPa, this.effort, acceptCurveEnd);
  }

  private static stateIndex(o: ScenarioOpening, mode: CaseMode): number {
    return mode === 'orifice' ? 2 : o.toolState === 'lifted' ? 1 : 0;
  }

  /** This inlet's last entry flow in this state, else the last any inlet had in it. */
  private lastEntryFlow(o: ScenarioOpening, mode: CaseMode): number | undefined {
    const s = CaseRunner.stateIndex(o, mode);
    const own = this.entryFlow.get(o.inlet)?.[s];
    const q = own !== undefined && !Number.isNaN(own) ? own : this.anyEntryFlow[s]!;
    return Number.isNaN(q) ? undefined : q;
  }

  /**
   * A starting flow for an inlet in a case of `size` open inlets: its flow
   * alone scaled as the last case of that size and state fell from its
   * inlets' flows alone, else its last flow in this state.
   */
  private startFlow(o: ScenarioOpening, mode: CaseMode, size: number): number | undefined {
    const s = CaseRunner.stateIndex(o, mode);
    const alone = this.entryFlow.get(o.inlet)?.[3 + s];
    if (alone !== undefined && alone > 0) return alone * this.sizeScale[s * (MAX_SCALED_SIZE + 1) + Math.min(size, MAX_SCALED_SIZE)]!;
    return this.lastEntryFlow(o, mode);
  }

  /**
   * A starting guess for a tree case: each open inlet's flow as last seen
   * (in that state), summed down every path; the producer inlet pressure
   * moved along its last slope; each element's drop scaled from its last
   * (square law). Hose ends are left to the solver's own fill. Returns the
   * nodes it set, or null when it knows too little (then the last solution
   * is the guess).
   */
  private treeGuess(openings: readonly ScenarioOpening[], mode: CaseMode, fixed?: ReadonlyMap<number, number>): number[] | null {
    const g = this.graph;
    const net = g.net;
    const flows = new Map<number, number>();
    const roots = new Map<number, number>();
    for (const o of openings) {
      // This inlet's last flow in this state, else the last any inlet had in it.
      const q = this.lastEntryFlow(o, mode);
      if (q === undefined || !(q > 0)) return null;
      for (const e of this.pathOf(o.inlet)) flows.set(e, (flows.get(e) ?? 0) + q);
      const node = g.topology.inlets.get(o.inlet)!.node;
      const r = this.tree.root[node]!;
      roots.set(r, (roots.get(r) ?? 0) + q);
    }
    const touched: number[] = [];
    const set = (node: number, p: number) => {
      if (Number.isNaN(this.treeStart[node]!)) touched.push(node);
      this.treeStart[node] = p;
    };
    const ambient = g.ambientPa;
    for (const [r, total] of roots) {
      const f = fixed?.get(r);
      if (f !== undefined) {
        set(r, f);
        continue;
      }
      const mem = this.producerMemory.get(r);
      if (!mem) return this.clearStart(touched);
      // Held inside 5 %..99.9 % of ambient (our choice: a guess, not a result).
      set(r, Math.min(0.999 * ambient, Math.max(0.05 * ambient, mem.inletPa + (total - mem.flow) * mem.slope)));
    }
    for (const o of openings) {
      const path = this.pathOf(o.inlet);
      // From the producer point down to the inlet.
      for (let idx = path.length - 1; idx >= 0; idx--) {
        const e = path[idx]!;
        if (net.drives[e]) continue;
        const a = net.elementA[e]!;
        const b = net.elementB[e]!;
        const childIsA = this.tree.parentElem[a] === e;
        const parent = childIsA ? b : a;
        const child = childIsA ? a : b;
        if (!Number.isNaN(this.treeStart[child]!)) continue;
        const pParent = this.treeStart[parent]!;
        if (Number.isNaN(pParent)) return this.clearStart(touched);
        const m = flows.get(e) ?? 0;
        let drop: number; // rise from parent to child
        const lf = Math.abs(this.lastFlow[e]!);
        if (lf > 0) {
          drop = Math.abs(this.lastDrop[e]!) * (m / lf) ** 2;
        } else {
          // Never carried air yet: one probe of 100 Pa, scaled by the square law (our choice).
          const probe = net.laws[e]?.flow(childIsA ? pParent + 100 : pParent, childIsA ? pParent : pParent + 100);
          const mp = probe ? Math.abs(probe.massFlowKgPerS) : 0;
          drop = mp > 0 ? 100 * (m / mp) ** 2 : 0;
        }
        set(child, Math.min(ambient, pParent + drop));
      }
    }
    return touched;
  }

  private clearStart(touched: number[]): null {
    for (const node of touched) this.treeStart[node] = NaN;
    return null;
  }

  /** Remembers flows and drops of a solved case for later starting guesses. */
  private learn(view: CaseView, openings: readonly ScenarioOpening[], mode: CaseMode, fixed?: ReadonlyMap<number, number>): void {
    const g = this.graph;
    const net = g.net;
    const st = view.state;
    const pressure = (node: number) => view.pressureAt(node) ?? fixed?.get(node) ?? net.fixedPressurePa[node]!;
    for (let i = 0; i < st.elements.length; i++) {
      const e = st.elements[i]!;
      const m = st.flowKgPerS[i]!;
      if (m === 0) continue;
      const pa = pressure(net.elementA[e]!);
      const pb = pressure(net.elementB[e]!);
      if (!Number.isFinite(pa) || !Number.isFinite(pb)) continue;
      this.lastFlow[e] = m;
      this.lastDrop[e] = pa - pb;
      if (net.drives[e]) {
        const d = net.laws[e]?.flow(pa, pb).dFlowDPa ?? 0;
        const prev = this.producerMemory.get(net.elementA[e]!);
        // Several producers at one point: add flows, keep the last slope.
        const flow = (prev && prev.inletPa === pa ? prev.flow : 0) + m;
        this.producerMemory.set(net.elementA[e]!, { flow, inletPa: pa, slope: d > 0 ? 1 / d : 0 });
      }
    }
    this.learnEntryFlows(view, openings, mode, fixed === undefined || fixed.size === 0);
  }

  /** Remembers each open inlet's entry flow, the start of the next case by flows. */
  private learnEntryFlows(view: CaseView, openings: readonly ScenarioOpening[], mode: CaseMode, plain: boolean): void {
    const size = openings.length;
    const ratioSum = [0, 0, 0];
    const ratioCount = [0, 0, 0];
    for (const o of openings) {
      const ie = this.graph.inletElements.get(o.inlet);
      if (!ie) continue;
      const entry = mode === 'orifice' ? ie.testOrifice : o.toolState === 'lifted' ? ie.toolLifted : ie.toolWorking;
      const m = view.flowOf(entry);
      if (m !== undefined && m > 0) {
        const s = CaseRunner.stateIndex(o, mode);
        let own = this.entryFlow.get(o.inlet);
        if (!own) {
          own = new Float64Array(6).fill(Number.NaN);
          this.entryFlow.set(o.inlet, own);
        }
        own[s] = m;
        this.anyEntryFlow[s] = m;
        // The producer held at a pressure (demand search) is no ordinary case.
        if (plain && size === 1) own[3 + s] = m;
        const alone = own[3 + s]!;
        if (plain && size > 1 && alone > 0) {
          ratioSum[s]! += m / alone;
          ratioCount[s]!++;
        }
      }
    }
    for (let s = 0; s < 3; s++) {
      if (ratioCount[s]! > 0 && size <= MAX_SCALED_SIZE) this.sizeScale[s * (MAX_SCALED_SIZE + 1) + size] = ratioSum[s]! / ratioCount[s]!;
    }
  }

  /** Results at an open inlet (tool mode: hose and tool; orifice mode: orifice in the valve). */
  inletPoint(view: CaseView, inlet: string, toolState: ToolState, mode: CaseMode = 'tool'): InletPoint | null {
    const g = this.graph;
    const ti = g.topology.inlets.get(inlet);
    const ie = g.inletElements.get(inlet);
    if (!ti || !ie || ti.node < 0) return null;
    const ambient = g.ambientPa;
    const pInlet = view.pressureAt(ti.node);
    const entry = mode === 'orifice' ? ie.testOrifice : toolState === 'lifted' ? ie.toolLifted : ie.toolWorking;
    const m = view.flowOf(entry);
    const pEnd = mode === 'orifice' ? pInlet : view.pressureAt(ti.hoseEndNode);
    if (pInlet === undefined || pEnd === undefined || m === undefined) return null;
    const roomFlow = (m * R_AIR * g.temperatureK) / ambient;
    const toolVacuum = ambient - pEnd;
    const point: InletPoint = {
      name: inlet,
      toolState,
      inletVacuumPa: ambient - pInlet,
      toolVacuumPa: toolVacuum,
      massFlowKgPerS: m,
      flowStdM3PerS: m / STANDARD_DENSITY,
      roomFlowM3PerS: roomFlow,
      toolAirPowerW: m > 0 && toolVacuum > 0 ? roomFlow * toolVacuum : 0,
      hoseLossPa: pEnd - pInlet,
    };
    if (mode === 'tool' && view.limitOf(entry) === 'choked') point.limited = 'choked';
    return point;
  }

  /** Results along a pipe that took part in a case; null when no part of it did. */
  pipePoint(view: CaseView, pipe: string): PipePoint | null {
    const g = this.graph;
    const segs = g.topology.pipeSegments.get(pipe);
    if (!segs) return null;
    const t = g.temperatureK;
    let maxFlow = 0;
    let upstream = NaN;
    let downstream = 0;
    let farPressure: number | undefined;
    let nearPressure: number | undefined;
    let anyFlow = false;
    let carried = false;
    // Segments from the producer side outward: the upstream end of the
    // farthest segment that carries air is where air enters the pipe.
    const flows: number[] = [];
    for (const e of segs) flows.push(Math.abs(view.flowOf(e) ?? 0));
    const largest = Math.max(0, ...flows);
    segs.forEach((e, s) => {
      const el = g.topology.elements[e]!;
      const pa = view.pressureAt(el.a);
      const pb = view.pressureAt(el.b);
      if (s === 0 && pb !== undefined) nearPressure = pb;
      if (pa !== undefined) farPressure = pa;
      const m = flows[s]!;
      if (pa === undefined || pb === undefined) return;
      anyFlow = true;
      const area = (Math.PI * g.diameterM[e]! ** 2) / 4;
      const high = Math.max(pa, pb);
      const low = Math.min(pa, pb);
      maxFlow = Math.max(maxFlow, m);
      downstream = Math.max(downstream, (m * R_AIR * t) / (low * area));
      // A segment carries air when it takes a real share of the pipe's flow (our choice: 0.1 %).
      if (m > 1e-3 * largest && m > 0) {
        upstream = (m * R_AIR * t) / (high * area);
        carried = true;
      }
    });
    if (!anyFlow) return null;
    return {
      name: pipe,
      massFlowKgPerS: maxFlow,
      upstreamVelocityMPerS: carried ? upstream : 0,
      downstreamVelocityMPerS: downstream,
      lossPa: farPressure !== undefined && nearPressure !== undefined ? farPressure - nearPressure : 0,
    };
  }
}
