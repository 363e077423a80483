/**
 * The analysis's tree cases solved by the flows of their open inlets.
 *
 * When the piping is a tree with one producer point (path-tree.ts `exact`),
 * a case with k open inlets is the tree of their paths to the producer,
 * with a hose and a tool (or a test orifice in the valve) at each open
 * inlet: the case solve-by-entry-flows of solve/tree-flow-solve.ts. This
 * file builds that case straight from the path tree, with arrays reused
 * from case to case, so that the thousands of small cases of an analysis
 * cost time in proportion to their own size.
 *
 * Anything out of the ordinary (a law at a limit that fails the case, a
 * march that finds no pressure, no convergence) returns null, and the
 * caller solves the case with the network solver, which reports it.
 */
import type { TwoPortLaw } from '../elements/two-port-law.js';
import type { NetworkGraph } from '../network/graph.js';
import { defaultLimitCause, DEFAULT_TOLERANCE, ZERO_PRESSURE_SHARE } from '../solve/solve-network.js';
import type { LawLimit, SolveEffort, SolvedState } from '../solve/solve-types.js';
import { TreeFlowSolver, type TreeCase } from '../solve/tree-flow-solve.js';
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
// More open inlets than this are left to the network solver (design cases have a handful; our choice).
const MAX_ENTRIES = 64;

export class PathFlowSolver {
  private readonly ambient: number;
  private readonly nodeStamp: Int32Array;
  private stampValue = 0;
  /** Per node of the current case: its slot in the case. */
  private readonly slot: Int32Array;
  private readonly core = new TreeFlowSolver();

  constructor(
    private readonly graph: NetworkGraph,
    private readonly tree: PathTree,
  ) {
    this.ambient = graph.ambientPa;
    const n = graph.net.nodeCount;
    this.nodeStamp = new Int32Array(n);
    this.slot = new Int32Array(n);
  }

  /**
   * Solves a case from starting flows x0 (kg/s, one per entry, > 0). With
   * `rootPa` the producer point is held at that pressure and the producer
   * left out. With `acceptCurveEnd` a producer past the end of its curve
   * is an accepted state (see NetworkSolveOptions). Returns the solved
   * state, or null when the network solver should take the case.
   */
  solve(entries: readonly PathEntry[], x0: ArrayLike<number>, rootPa: number | undefined, effort: SolveEffort, acceptCurveEnd = false): PathSolved | null {
    const k = entries.length;
    if (k === 0 || k > MAX_ENTRIES || !(this.ambient > 0)) return null;
    const { tree } = this;
    const net = this.graph.net;
    const eA = net.elementA;
    const eB = net.elementB;
    const atmosphere = this.graph.topology.atmosphere;

    // --- the case's nodes: each open valve up to the producer point, parents first; then the hose ends
    if (++this.stampValue >= 0x7fffffff) {
      this.nodeStamp.fill(0);
      this.stampValue = 1;
    }
    const stamp = this.stampValue;
    const root = tree.root[entries[0]!.valve] ?? -1;
    if (root < 0) return null;
    const nodes: number[] = [];
    for (const en of entries) {
      if (en.valve < 0 || tree.root[en.valve] !== root) return null;
      let v = en.valve;
      while (v >= 0 && this.nodeStamp[v] !== stamp) {
        this.nodeStamp[v] = stamp;
        nodes.push(v);
        v = v === root ? -1 : tree.parentNode[v]!;
      }
    }
    if (this.nodeStamp[root] !== stamp) return null;
    nodes.sort((a, b) => tree.depth[a]! - tree.depth[b]!);
    if (nodes[0] !== root) return null;
    const piping = nodes.length;
    for (let i = 0; i < piping; i++) this.slot[nodes[i]!] = i;
    const hoses = entries.reduce((n, en) => n + (en.hose >= 0 ? 1 : 0), 0);
    const count = piping + hoses;
    this.reserve(count, k);
    const { parentSlot, parentElem, parentLaw, childIsA, entrySlot, entryLaw, entryFixedPa, entryFixedIsA } = this.scratch;
    parentSlot[0] = -1;
    parentElem[0] = -1;
    for (let i = 1; i < piping; i++) {
      const v = nodes[i]!;
      const e = tree.parentElem[v]!;
      const law = e >= 0 ? net.laws[e] : null;
      if (!law) return null;
      parentElem[i] = e;
      parentLaw[i] = law;
      parentSlot[i] = this.slot[tree.parentNode[v]!]!;
      childIsA[i] = eA[e] === v ? 1 : 0;
    }
    // Entries (and the hoses that lead to them).
    entryFixedPa.fill(this.ambient, 0, k);
    let at = piping;
    for (let j = 0; j < k; j++) {
      const en = entries[j]!;
      const law = net.laws[en.entry];
      if (!law || (eA[en.entry] !== atmosphere && eB[en.entry] !== atmosphere)) return null;
      entryLaw[j] = law;
      entryFixedIsA[j] = eA[en.entry] === atmosphere ? 1 : 0;
      if (en.hose >= 0) {
        const hoseLaw = net.laws[en.hose];
        if (!hoseLaw || en.hoseEnd < 0) return null;
        nodes.push(en.hoseEnd);
        parentSlot[at] = this.slot[en.valve]!;
        parentElem[at] = en.hose;
        parentLaw[at] = hoseLaw;
        childIsA[at] = eA[en.hose] === en.hoseEnd ? 1 : 0;
        entrySlot[j] = at++;
      } else {
        entrySlot[j] = this.slot[en.valve]!;
      }
    }
    // The producer at the point, unless it is held.
    let producer = -1;
    let treeCase: TreeCase;
    const common = { count, parentSlot, parentLaw, childIsA, entries: k, entrySlot, entryLaw, entryFixedPa, entryFixedIsA, ceilingPa: this.ambient };
    if (rootPa === undefined) {
      const producers = tree.rootProducers.get(root) ?? [];
      if (producers.length !== 1) return null;
      producer = producers[0]!;
      const law = net.laws[producer];
      const other = eA[producer] === root ? eB[producer]! : eA[producer]!;
      if (!law || other !== atmosphere) return null;
      treeCase = { ...common, root: { law, rootIsA: eA[producer] === root, outletPa: this.ambient } };
    } else {
      if (!(rootPa > 0 && rootPa < this.ambient)) return null;
      treeCase = { ...common, root: { fixedPa: rootPa } };
    }

    const r = this.core.solve(treeCase, x0, { tolerance: PATH_TOLERANCE });
    if (!r) return this.giveUp(effort, this.core.lastEvaluations);

    // --- limits at the solution, and what they mean for the case
    const limited: SolvedState['limited'] = [];
    const classify = (e: number, limit: LawLimit, pa: number, pb: number, flow: number) => {
      const cause =
        acceptCurveEnd && limit === 'curve-end' ? null : net.classifyLimit ? net.classifyLimit(e, limit, pa, pb, flow) : defaultLimitCause(net, e, limit);
      limited.push({ element: e, limit, cause });
      return cause;
    };
    if (producer >= 0 && r.rootLimit && classify(producer, r.rootLimit, r.pressure[0]!, this.ambient, r.rootFlow) !== null) {
      return this.giveUp(effort, r.evaluations);
    }
    for (let j = 0; j < k; j++) {
      const lim = r.entryLimit[j];
      if (lim && classify(entries[j]!.entry, lim, this.ambient, r.pressure[entrySlot[j]!]!, r.entryFlow[j]!) !== null) return this.giveUp(effort, r.evaluations);
    }
    // Pressure near zero: not physical (the network solver says so).
    for (let i = 0; i < count; i++) if (r.pressure[i]! < ZERO_PRESSURE_SHARE * this.ambient) return this.giveUp(effort, r.evaluations);

    // --- the state (plain arrays: a case's state is small and short-lived)
    const pressurePa: number[] = new Array(count);
    for (let i = 0; i < count; i++) pressurePa[i] = r.pressure[i]!;
    const elements: number[] = [];
    const flowKgPerS: number[] = [];
    for (let i = 1; i < count; i++) {
      elements.push(parentElem[i]!);
      flowKgPerS.push(childIsA[i] ? r.through[i]! : 0 - r.through[i]!);
    }
    if (producer >= 0) {
      elements.push(producer);
      flowKgPerS.push(eA[producer] === root ? r.rootFlow : 0 - r.rootFlow);
    }
    for (let j = 0; j < k; j++) {
      elements.push(entries[j]!.entry);
      flowKgPerS.push(entryFixedIsA[j] ? r.entryFlow[j]! : 0 - r.entryFlow[j]!);
    }
    effort.solves++;
    effort.newtonIterations += r.iterations;
    effort.elementEvaluations += r.evaluations;
    return { nodes, pressurePa, elements, flowKgPerS, limited, iterations: r.iterations, imbalanceFraction: r.imbalanceFraction };
  }

  /** Scratch of a case's arrays, grown on demand (the tree solver reads only `count` and `entries` of them). */
  private scratch = {
    parentSlot: new Int32Array(0),
    parentElem: new Int32Array(0),
    parentLaw: [] as TwoPortLaw[],
    childIsA: new Uint8Array(0),
    entrySlot: new Int32Array(0),
    entryLaw: [] as TwoPortLaw[],
    entryFixedPa: new Float64Array(0),
    entryFixedIsA: new Uint8Array(0),
  };

  private reserve(count: number, k: number): void {
    const s = this.scratch;
    if (count > s.parentSlot.length) {
      const n = Math.max(count, 2 * s.parentSlot.length, 64);
      s.parentSlot = new Int32Array(n);
      s.parentElem = new Int32Array(n);
      s.parentLaw = new Array(n);
      s.childIsA = new Uint8Array(n);
    }
    if (k > s.entrySlot.length) {
      const n = Math.max(k, 2 * s.entrySlot.length, 8);
      s.entrySlot = new Int32Array(n);
      s.entryLaw = new Array(n);
      s.entryFixedPa = new Float64Array(n);
      s.entryFixedIsA = new Uint8Array(n);
    }
  }

  /** Counts the work of a case handed back to the network solver, and hands it back. */
  private giveUp(effort: SolveEffort, evaluations: number): null {
    effort.elementEvaluations += evaluations;
    return null;
  }
}
