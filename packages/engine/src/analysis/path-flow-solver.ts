/**
 * Cases of a tree-shaped system solved by the flows of their open inlets.
 *
 * When the piping is a tree with one producer point (path-tree.ts `exact`),
 * a case with k open inlets is a tree whose only unknowns are the k flows
 * x_j entering at the tools (or test orifices): every pipe carries the sum
 * of the x_j below it, so mass balances at every piping node by
 * construction. Given x, the pressures follow by marching out from the
 * producer: its inlet pressure is the one at which it draws the total,
 * and each element's far-end pressure the one at which it passes its flow
 * toward the near end (pipes and hoses invert their law in closed form
 * with one friction evaluation, other laws numerically). What remains is k
 * equations, one per open inlet: the tool passes x_j at the hose-end
 * pressure the march gave. Newton on x, with the k x k Jacobian carried
 * along the march by the chain rule and an Armijo line search (Dennis and
 * Schnabel 1983, sec. 6.3) as in the network solver.
 *
 * The equations and the convergence test are the network solver's (every
 * node's imbalance below 1e-9 of the total flow: here only the hose-end or
 * valve nodes of the open inlets can be out of balance), so a converged
 * case is the same solution within that tolerance; it just has k unknowns
 * instead of one per node and no inner iteration per pipe. Anything out of
 * the ordinary (a law at a limit that fails the case, a march that finds
 * no pressure, no convergence) returns null, and the caller solves the
 * case with the network solver, which reports it.
 */
import type { PortFlow, TwoPortLaw, UpstreamPressure } from '../elements/two-port-law.js';
import type { NetworkGraph } from '../network/graph.js';
import { defaultLimitCause, DEFAULT_TOLERANCE, ZERO_PRESSURE_SHARE } from '../solve/solve-network.js';
import type { SolveEffort, SolvedState } from '../solve/solve-types.js';
import type { PathTree } from './path-tree.js';

/** A solved case: as the network solver's state, in plain arrays. */
export interface PathSolved {
  nodes: number[];
  pressurePa: number[];
  elements: number[];
  flowKgPerS: number[];
  limited: SolvedState['limited'];
  iterations: number;
  imbalanceFraction: number;
}

/** One open inlet of a case: air enters at `entry` (tool or test orifice). */
export interface PathEntry {
  /** The inlet valve's node. */
  valve: number;
  /** The hose (tool mode) or -1 (test orifice in the valve). */
  hose: number;
  /** The hose-end node, or -1. */
  hoseEnd: number;
  /** The tool or test-orifice element (port a the room, port b the hose end or valve). */
  entry: number;
}

// Imbalance tolerance, a share of the total flow: the network solver's 1e-9
// (ENGINEERING.md) tightened to 1e-12, which costs at most one more step here
// (Newton is quadratic by then, and a step is one march), so that a case
// solved from different starts gives the same numbers to ~1e-12 (our choice).
const PATH_TOLERANCE = 1e-3 * DEFAULT_TOLERANCE;
// Newton iteration cap on the inlet flows (our choice; converged cases take 2-6).
const MAX_ITERATIONS = 40;
// Armijo constant and backtracking halvings (as the network solver, newton.ts).
const ARMIJO_C = 1e-4;
const MAX_BACKTRACKS = 30;
// More open inlets than this are left to the network solver (a set's
// membership is held as bits; design cases have a handful).
const MAX_ENTRIES = 30;
// Halvings of a starting flow that the piping cannot pass (our choice: 2^-20).
const START_HALVINGS = 20;
// Numerical inversion of a law: iteration cap and relative stop (our choices).
const INVERT_STEPS = 60;
const INVERT_STOP = 1e-15;

export class PathFlowSolver {
  private readonly net;
  private readonly ambient: number;
  private readonly nodeStamp: Int32Array;
  private stampValue = 0;
  /** Per node of the current case: its position in the case's node list. */
  private readonly slot: Int32Array;
  private readonly scratch: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0, limited: undefined };
  private readonly up: UpstreamPressure = { pressurePa: 0, dPressureDFlow: 0, dPressureDDown: 0 };
  /** Last drop per squared flow of each element (a start for numerical inversion). */
  private readonly dropPerFlow2: Float64Array;
  /** Last inlet pressure of each producer point (a start for its inversion). */
  private readonly rootPressure: Float64Array;
  // Scratch reused by every case (grown on demand): per case node, per entry, per node and entry.
  private cap = { nodes: 0, entries: 0, cross: 0 };
  private nodeI32 = { parentSlot: new Int32Array(0), parentElem: new Int32Array(0), below: new Int32Array(0) };
  private childIsA = new Uint8Array(0);
  private nodeF64 = { p: new Float64Array(0), through: new Float64Array(0) };
  private dp = new Float64Array(0);
  private entryF64 = {
    endP: new Float64Array(0),
    entryFlow: new Float64Array(0),
    entryDeriv: new Float64Array(0),
    residual: new Float64Array(0),
    x: new Float64Array(0),
    step: new Float64Array(0),
    trial: new Float64Array(0),
  };
  private entryI32 = new Int32Array(0);
  private square = { dEnd: new Float64Array(0), jac: new Float64Array(0) };
  private entryLimit: PortFlow['limited'][] = [];

  constructor(
    private readonly graph: NetworkGraph,
    private readonly tree: PathTree,
  ) {
    this.net = graph.net;
    this.ambient = graph.ambientPa;
    const n = graph.net.nodeCount;
    this.nodeStamp = new Int32Array(n);
    this.slot = new Int32Array(n);
    this.dropPerFlow2 = new Float64Array(graph.net.elementA.length).fill(Number.NaN);
    this.rootPressure = new Float64Array(n).fill(Number.NaN);
  }

  /**
   * Solves a case from starting flows x0 (kg/s, one per entry, > 0). With
   * `rootPa` the producer point is held at that pressure and the producer
   * left out. Returns the solved state, or null when the network solver
   * should take the case.
   */
  solve(entries: readonly PathEntry[], x0: ArrayLike<number>, rootPa: number | undefined, effort: SolveEffort): PathSolved | null {
    const k = entries.length;
    if (k === 0 || k > MAX_ENTRIES || !(this.ambient > 0)) return null;
    const { tree, net } = this;
    const eA = net.elementA;
    const eB = net.elementB;

    // --- the case's piping nodes: each open valve up to the producer point
    if (++this.stampValue >= 0x7fffffff) {
      this.nodeStamp.fill(0);
      this.stampValue = 1;
    }
    const stamp = this.stampValue;
    const root = tree.root[entries[0]!.valve] ?? -1;
    if (root < 0) return null;
    const list: number[] = [];
    for (const en of entries) {
      if (en.valve < 0 || tree.root[en.valve] !== root) return null;
      let v = en.valve;
      while (v >= 0 && this.nodeStamp[v] !== stamp) {
        this.nodeStamp[v] = stamp;
        list.push(v);
        v = v === root ? -1 : tree.parentNode[v]!;
      }
    }
    if (this.nodeStamp[root] !== stamp) return null;
    // Parents before children.
    list.sort((a, b) => tree.depth[a]! - tree.depth[b]!);
    const count = list.length;
    this.reserve(count, k);
    const nodes = list;
    for (let i = 0; i < count; i++) this.slot[nodes[i]!] = i;
    const { parentSlot, parentElem, below } = this.nodeI32;
    const childIsA = this.childIsA;
    parentSlot[0] = -1;
    parentElem[0] = -1;
    for (let i = 1; i < count; i++) {
      const v = nodes[i]!;
      const e = tree.parentElem[v]!;
      if (e < 0 || !net.laws[e]) return null;
      parentElem[i] = e;
      parentSlot[i] = this.slot[tree.parentNode[v]!]!;
      childIsA[i] = eA[e] === v ? 1 : 0;
    }
    if (nodes[0] !== root) return null;
    // The producer at the point, unless it is held.
    let producer = -1;
    if (rootPa === undefined) {
      const producers = tree.rootProducers.get(root) ?? [];
      if (producers.length !== 1) return null;
      producer = producers[0]!;
      if (!net.laws[producer] || eB[producer] !== this.graph.topology.atmosphere) return null;
    } else if (!(rootPa > 0 && rootPa < this.ambient)) {
      return null;
    }
    // Which entries each node's air comes from (bits), and the entries' slots.
    below.fill(0, 0, count);
    const valveSlot = this.entryI32;
    for (let j = 0; j < k; j++) {
      const en = entries[j]!;
      if (!net.laws[en.entry] || (en.hose >= 0 && (!net.laws[en.hose] || en.hoseEnd < 0))) return null;
      let s = this.slot[en.valve]!;
      valveSlot[j] = s;
      for (;;) {
        below[s] = below[s]! | (1 << j);
        if (s === 0) break;
        s = parentSlot[s]!;
      }
    }

    // --- march state
    // p: node pressures; dp[i k + j] = d p_i / d x_j; through: flow from each node toward its parent;
    // endP: pressure where air enters the hose (or the valve) and dEnd its derivatives;
    // entryDeriv: d(entry flow)/d(its downstream pressure).
    const { p, through } = this.nodeF64;
    const dp = this.dp;
    const { endP, entryFlow, entryDeriv, residual } = this.entryF64;
    const dEnd = this.square.dEnd;
    const entryLimit = this.entryLimit;
    let evaluations = 0;

    const march = (x: Float64Array): boolean => {
      let total = 0;
      for (let j = 0; j < k; j++) total += x[j]!;
      for (let i = count - 1; i >= 0; i--) {
        const bits = below[i]!;
        let f = 0;
        for (let j = 0; j < k; j++) if (bits & (1 << j)) f += x[j]!;
        through[i] = f;
      }
      // The producer point.
      if (producer >= 0) {
        const law = net.laws[producer]!;
        const start = this.rootPressure[root]!;
        const r = this.invert(law, true, this.ambient, total, 1, this.ambient, Number.isFinite(start) ? start : 0.8 * this.ambient, producer);
        evaluations += r.evaluations;
        if (!r.ok) return false;
        p[0] = r.pressure;
        for (let j = 0; j < k; j++) dp[j] = r.dFlow;
      } else {
        p[0] = rootPa!;
        for (let j = 0; j < k; j++) dp[j] = 0;
      }
      // Out along the piping.
      for (let i = 1; i < count; i++) {
        const e = parentElem[i]!;
        const u = parentSlot[i]!;
        const pu = p[u]!;
        const f = through[i]!;
        let pressure: number;
        let dFlow: number;
        let dDown: number;
        const law = net.laws[e]!;
        evaluations++;
        if (law.upstreamPressureInto) {
          if (!law.upstreamPressureInto(f, pu, this.up)) return false;
          pressure = this.up.pressurePa;
          dFlow = this.up.dPressureDFlow;
          dDown = this.up.dPressureDDown;
        } else {
          const r = this.invert(law, childIsA[i] === 1, pu, f, pu, this.ambient, Number.NaN, e);
          evaluations += r.evaluations - 1;
          if (!r.ok) return false;
          pressure = r.pressure;
          dFlow = r.dFlow;
          dDown = r.dDown;
        }
        if (!(pressure > 0) || pressure > this.ambient) return false;
        p[i] = pressure;
        const bits = below[i]!;
        for (let j = 0; j < k; j++) dp[i * k + j] = dDown * dp[u * k + j]! + (bits & (1 << j) ? dFlow : 0);
      }
      // Hoses, then what the tools (or orifices) pass at those pressures.
      for (let j = 0; j < k; j++) {
        const en = entries[j]!;
        const s = valveSlot[j]!;
        if (en.hose >= 0) {
          const law = net.laws[en.hose]!;
          evaluations++;
          let pressure: number;
          let dFlow: number;
          let dDown: number;
          if (law.upstreamPressureInto) {
            if (!law.upstreamPressureInto(x[j]!, p[s]!, this.up)) return false;
            pressure = this.up.pressurePa;
            dFlow = this.up.dPressureDFlow;
            dDown = this.up.dPressureDDown;
          } else {
            const r = this.invert(law, eA[en.hose] === en.hoseEnd, p[s]!, x[j]!, p[s]!, this.ambient, Number.NaN, en.hose);
            evaluations += r.evaluations - 1;
            if (!r.ok) return false;
            pressure = r.pressure;
            dFlow = r.dFlow;
            dDown = r.dDown;
          }
          if (!(pressure > 0) || pressure > this.ambient) return false;
          endP[j] = pressure;
          for (let l = 0; l < k; l++) dEnd[j * k + l] = dDown * dp[s * k + l]! + (l === j ? dFlow : 0);
        } else {
          endP[j] = p[s]!;
          for (let l = 0; l < k; l++) dEnd[j * k + l] = dp[s * k + l]!;
        }
        // Port a the room (ambient), port b where air enters.
        const law = net.laws[en.entry]!;
        evaluations++;
        const out = this.evaluate(law, this.ambient, endP[j]!);
        if (!Number.isFinite(out.massFlowKgPerS)) return false;
        entryFlow[j] = out.massFlowKgPerS;
        entryDeriv[j] = out.dFlowDPb;
        entryLimit[j] = out.limited;
        residual[j] = out.massFlowKgPerS - x[j]!;
      }
      return true;
    };
    const norm2 = (): number => {
      let s = 0;
      for (let j = 0; j < k; j++) s += residual[j]! * residual[j]!;
      return s;
    };
    const converged = (x: Float64Array): { done: boolean; fraction: number } => {
      let total = 0;
      let worst = 0;
      for (let j = 0; j < k; j++) {
        total += x[j]! + Math.abs(entryFlow[j]!);
        worst = Math.max(worst, Math.abs(residual[j]!));
      }
      total /= 2; // half the flow through elements with a fixed end (producer + entries), as newton.ts
      const fraction = total > 0 ? worst / total : worst > 0 ? Infinity : 0;
      return { done: worst <= PATH_TOLERANCE * total || worst === 0, fraction };
    };

    const { x, step, trial } = this.entryF64;
    for (let j = 0; j < k; j++) {
      const v = x0[j]!;
      if (!(v > 0) || !Number.isFinite(v)) return null;
      x[j] = v;
    }
    // A start too large for the piping or the producer: scale it down until a march goes through.
    let started = march(x);
    for (let tries = 0; !started && tries < START_HALVINGS; tries++) {
      for (let j = 0; j < k; j++) x[j] = 0.5 * x[j]!;
      started = march(x);
    }
    if (!started) return this.giveUp(effort, 0, evaluations);
    const jac = this.square.jac;
    let iterations = 0;
    let state = converged(x);
    while (!state.done) {
      if (iterations >= MAX_ITERATIONS) return this.giveUp(effort, iterations, evaluations);
      iterations++;
      // J = d(entry flow)/dx - I; solve J step = -R.
      for (let j = 0; j < k; j++) {
        for (let l = 0; l < k; l++) jac[j * k + l] = entryDeriv[j]! * dEnd[j * k + l]! - (j === l ? 1 : 0);
        step[j] = -residual[j]!;
      }
      if (!solveDense(jac, step, k)) return this.giveUp(effort, iterations, evaluations);
      const before = norm2();
      let alpha = 1;
      // Keep every flow positive: at most 80 % of the way to zero in one step (as newton.ts keeps pressures).
      for (let j = 0; j < k; j++) if (step[j]! < 0) alpha = Math.min(alpha, (0.8 * x[j]!) / -step[j]!);
      let accepted = false;
      for (let bt = 0; bt <= MAX_BACKTRACKS; bt++) {
        for (let j = 0; j < k; j++) trial[j] = x[j]! + alpha * step[j]!;
        if (march(trial) && norm2() <= (1 - 2 * ARMIJO_C * alpha) * before) {
          accepted = true;
          break;
        }
        alpha *= 0.5;
      }
      if (!accepted) return this.giveUp(effort, iterations, evaluations);
      for (let j = 0; j < k; j++) x[j] = trial[j]!;
      state = converged(x);
    }

    // --- limits at the solution, and what they mean for the case
    const limited: SolvedState['limited'] = [];
    const classify = (e: number, limit: 'choked' | 'curve-end' | 'relief', pa: number, pb: number, flow: number) => {
      const cause = net.classifyLimit ? net.classifyLimit(e, limit, pa, pb, flow) : defaultLimitCause(net, e, limit);
      limited.push({ element: e, limit, cause });
      return cause;
    };
    let totalFlow = 0;
    for (let j = 0; j < k; j++) totalFlow += x[j]!;
    if (producer >= 0) {
      evaluations++;
      const out = this.evaluate(net.laws[producer]!, p[0]!, this.ambient);
      if (out.limited && classify(producer, out.limited, p[0]!, this.ambient, out.massFlowKgPerS) !== null) return this.giveUp(effort, iterations, evaluations);
      this.rootPressure[root] = p[0]!;
    }
    for (let j = 0; j < k; j++) {
      const lim = entryLimit[j];
      if (lim && classify(entries[j]!.entry, lim, this.ambient, endP[j]!, entryFlow[j]!) !== null) return this.giveUp(effort, iterations, evaluations);
    }
    // Pressure near zero: not physical (the network solver says so).
    let lowest = Infinity;
    for (let i = 0; i < count; i++) lowest = Math.min(lowest, p[i]!);
    for (let j = 0; j < k; j++) lowest = Math.min(lowest, endP[j]!);
    if (lowest < ZERO_PRESSURE_SHARE * this.ambient) return this.giveUp(effort, iterations, evaluations);

    // --- the state: piping nodes, then hose ends; path elements, producer, hoses, entries
    // (Plain arrays: a case's state is small and short-lived.)
    const stateNodes: number[] = list;
    const statePressure: number[] = new Array(count);
    for (let i = 0; i < count; i++) statePressure[i] = p[i]!;
    const stateElems: number[] = [];
    const stateFlows: number[] = [];
    for (let i = 1; i < count; i++) {
      const e = parentElem[i]!;
      stateElems.push(e);
      stateFlows.push(childIsA[i] ? through[i]! : 0 - through[i]!);
      this.remember(e, through[i]!, p[i]! - p[parentSlot[i]!]!);
    }
    if (producer >= 0) {
      stateElems.push(producer);
      stateFlows.push(totalFlow);
    }
    for (let j = 0; j < k; j++) {
      const en = entries[j]!;
      if (en.hose >= 0) {
        stateNodes.push(en.hoseEnd);
        statePressure.push(endP[j]!);
        stateElems.push(en.hose);
        stateFlows.push(eA[en.hose] === en.hoseEnd ? x[j]! : 0 - x[j]!);
      }
    }
    for (let j = 0; j < k; j++) {
      stateElems.push(entries[j]!.entry);
      stateFlows.push(entryFlow[j]!);
    }
    effort.solves++;
    effort.newtonIterations += iterations;
    effort.elementEvaluations += evaluations;
    return {
      nodes: stateNodes,
      pressurePa: statePressure,
      elements: stateElems,
      flowKgPerS: stateFlows,
      limited,
      iterations,
      imbalanceFraction: state.fraction,
    };
  }

  /** Grows the scratch arrays to hold a case of `nodes` piping nodes and `entries` open inlets. */
  private reserve(nodes: number, entries: number): void {
    if (nodes > this.cap.nodes) {
      const n = Math.max(nodes, 2 * this.cap.nodes, 64);
      this.nodeI32 = { parentSlot: new Int32Array(n), parentElem: new Int32Array(n), below: new Int32Array(n) };
      this.childIsA = new Uint8Array(n);
      this.nodeF64 = { p: new Float64Array(n), through: new Float64Array(n) };
      this.cap.nodes = n;
    }
    if (entries > this.cap.entries) {
      const k = Math.max(entries, 4);
      this.entryF64 = {
        endP: new Float64Array(k),
        entryFlow: new Float64Array(k),
        entryDeriv: new Float64Array(k),
        residual: new Float64Array(k),
        x: new Float64Array(k),
        step: new Float64Array(k),
        trial: new Float64Array(k),
      };
      this.entryI32 = new Int32Array(k);
      this.square = { dEnd: new Float64Array(k * k), jac: new Float64Array(k * k) };
      this.entryLimit = new Array(k);
      this.cap.entries = k;
    }
    if (nodes * entries > this.cap.cross) {
      this.cap.cross = Math.max(nodes * entries, 2 * this.cap.cross, 256);
      this.dp = new Float64Array(this.cap.cross);
    }
  }

  /** Counts the work of a case handed back to the network solver, and hands it back. */
  private giveUp(effort: SolveEffort, iterations: number, evaluations: number): null {
    effort.newtonIterations += iterations;
    effort.elementEvaluations += evaluations;
    return null;
  }

  private remember(e: number, flow: number, drop: number): void {
    if (flow > 0 && drop > 0) this.dropPerFlow2[e] = drop / (flow * flow);
  }

  private evaluate(law: TwoPortLaw, pa: number, pb: number): PortFlow {
    if (law.flowInto) {
      law.flowInto(pa, pb, this.scratch);
      return this.scratch;
    }
    return law.flow(pa, pb);
  }

  /**
   * The pressure x at the far end of an element whose near end is held at
   * `known`, such that the flow from the far end toward the near end is
   * `target` (port a the far end when `farIsA`), by Newton on the law kept
   * inside [lo, hi] with bisection. For the producer (far end its inlet,
   * near end the atmosphere) the same, flow from its inlet to the air.
   */
  private invert(
    law: TwoPortLaw,
    farIsA: boolean,
    known: number,
    target: number,
    loIn: number,
    hiIn: number,
    startIn: number,
    element: number,
  ): { ok: boolean; pressure: number; dFlow: number; dDown: number; evaluations: number } {
    let lo = loIn;
    let hi = hiIn;
    let evaluations = 0;
    const flowAt = (x: number): PortFlow => {
      evaluations++;
      return farIsA ? this.evaluate(law, x, known) : this.evaluate(law, known, x);
    };
    // q(x) = flow from far to near end, rising in x; q' and d q/d known.
    let q = 0;
    let dq = 0;
    let dKnown = 0;
    const at = (x: number): void => {
      const r = flowAt(x);
      q = farIsA ? r.massFlowKgPerS : 0 - r.massFlowKgPerS;
      dq = farIsA ? r.dFlowDPa : 0 - r.dFlowDPb;
      dKnown = farIsA ? r.dFlowDPb : 0 - r.dFlowDPa;
    };
    let x = startIn;
    if (!Number.isFinite(x)) {
      const c = this.dropPerFlow2[element]!;
      x = known + (Number.isFinite(c) ? c * target * target : 0.01 * known);
    }
    if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
    let ok = false;
    for (let i = 0; i < INVERT_STEPS; i++) {
      at(x);
      if (!Number.isFinite(q)) break;
      const miss = q - target;
      if (miss === 0) {
        ok = true;
        break;
      }
      if (miss > 0) hi = x;
      else lo = x;
      let next = dq > 0 ? x - miss / dq : Number.NaN;
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
      const stepSize = Math.abs(next - x);
      x = next;
      if (stepSize <= INVERT_STOP * x) {
        at(x);
        ok = Number.isFinite(q) && Math.abs(q - target) <= 1e-12 * Math.max(Math.abs(target), Math.abs(q));
        break;
      }
      if (hi - lo <= INVERT_STOP * hi) break;
    }
    if (!ok || !(dq > 0)) return { ok: false, pressure: x, dFlow: 0, dDown: 0, evaluations };
    if (element >= 0 && target > 0) this.dropPerFlow2[element] = Math.abs(x - known) / (target * target);
    return { ok: true, pressure: x, dFlow: 1 / dq, dDown: -dKnown / dq, evaluations };
  }
}

/** Solves the dense k x k system a y = b in place (b becomes y) by Gaussian elimination with partial pivoting. */
function solveDense(a: Float64Array, b: Float64Array, k: number): boolean {
  for (let c = 0; c < k; c++) {
    let pivot = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(a[r * k + c]!) > Math.abs(a[pivot * k + c]!)) pivot = r;
    const d = a[pivot * k + c]!;
    if (!(Math.abs(d) > 0) || !Number.isFinite(d)) return false;
    if (pivot !== c) {
      for (let l = 0; l < k; l++) {
        const t = a[c * k + l]!;
        a[c * k + l] = a[pivot * k + l]!;
        a[pivot * k + l] = t;
      }
      const t = b[c]!;
      b[c] = b[pivot]!;
      b[pivot] = t;
    }
    for (let r = c + 1; r < k; r++) {
      const f = a[r * k + c]! / d;
      if (f === 0) continue;
      for (let l = c; l < k; l++) a[r * k + l] = a[r * k + l]! - f * a[c * k + l]!;
      b[r] = b[r]! - f * b[c]!;
    }
  }
  for (let c = k - 1; c >= 0; c--) {
    let s = b[c]!;
    for (let l = c + 1; l < k; l++) s -= a[c * k + l]! * b[l]!;
    b[c] = s / a[c * k + c]!;
  }
  return true;
}
