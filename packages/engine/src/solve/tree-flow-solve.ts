/**
 * A tree case solved by the flows that enter it.
 *
 * When the elements of a case form a tree hanging from one driving element
 * (the producer, or a node held at a pressure), and air enters only through
 * elements from fixed pressures ("entries": tools, test orifices), the only
 * unknowns are the k entry flows x_j: every element carries the sum of the
 * x_j below it, so mass balances at every node but the entry nodes by
 * construction. Given x, the pressures follow by marching out from the
 * root: the root's pressure is the one at which the producer passes the
 * total, and each element's far-end pressure the one at which it passes its
 * flow toward the near end (pipes, hoses and rated losses invert their law
 * in closed form, other laws are inverted numerically). What remains is k
 * equations: each entry passes x_j at the pressure the march gave its node.
 * Newton on x, with the k x k Jacobian carried along the march by the chain
 * rule, damped to keep flows positive, and an Armijo line search on the
 * residual (Dennis and Schnabel 1983, sec. 6.3) as in newton.ts.
 *
 * The equations and the convergence test (every node's imbalance below a
 * share of the total flow) are the network solver's, so a converged case is
 * the same solution within that tolerance, found with k unknowns instead of
 * one per node and no inner iteration per pipe. A march that finds no
 * pressure (choking, a demand past what the producer can give), a flow that
 * wants to reverse, or no convergence returns null: the caller then uses
 * Newton on node pressures, which reports such cases.
 */
import type { PortFlow, TwoPortLaw, UpstreamPressure } from '../elements/two-port-law.js';
import type { LawLimit } from './solve-types.js';

/** The case, nodes in slots 0..count-1: the root at 0, parents before children. */
export interface TreeCase {
  count: number;
  /** Parent slot of each node (-1 at the root). */
  parentSlot: Int32Array;
  /** Law of the element joining each node to its parent (unused at the root). */
  parentLaw: TwoPortLaw[];
  /** 1 when port a of that element is the node itself (the far end). */
  childIsA: Uint8Array;
  /** The driving element at the root (port `rootIsA` the root, the other port at `outletPa`), or the root held at `fixedPa`. */
  root: { law: TwoPortLaw; rootIsA: boolean; outletPa: number } | { fixedPa: number };
  /** Entries: the node each feeds, its law, the fixed pressure it draws from, and whether that is port a. */
  entries: number;
  entrySlot: Int32Array;
  entryLaw: TwoPortLaw[];
  entryFixedPa: Float64Array;
  entryFixedIsA: Uint8Array;
  /** No node pressure may exceed this (the highest fixed pressure: air cannot be pushed above it). */
  ceilingPa: number;
}

/** The solution; its arrays are the solver's scratch, valid until its next call. */
export interface TreeFlowResult {
  /** Pressure of each node, Pa. */
  pressure: Float64Array;
  /** Flow from each node toward its parent, kg/s. */
  through: Float64Array;
  /** Flow through each entry by its law at the solution, kg/s. */
  entryFlow: Float64Array;
  entryLimit: (LawLimit | undefined)[];
  /** Flow through the driving element (the sum of the x_j), kg/s; 0 with a held root. */
  rootFlow: number;
  rootLimit: LawLimit | undefined;
  iterations: number;
  /** Law evaluations spent, including those of a try that failed. */
  evaluations: number;
  /** Largest node imbalance over the total flow. */
  imbalanceFraction: number;
}

export interface TreeFlowOptions {
  /** Node imbalance tolerance as a share of the total flow. */
  tolerance: number;
  /** Newton iteration cap (default 40). */
  maxIterations?: number;
}

// Newton iteration cap on the entry flows (our choice; converged cases take 2-6).
const MAX_ITERATIONS = 40;
// Armijo constant and backtracking halvings (as newton.ts).
const ARMIJO_C = 1e-4;
const MAX_BACKTRACKS = 30;
// No flow falls below this share of its value in one step (as newton.ts keeps pressures: 0.2).
const MIN_FLOW_RATIO_PER_STEP = 0.2;
// Halvings of a starting flow that the piping cannot pass (our choice: down to 2^-20).
const START_HALVINGS = 20;
// Numerical inversion of a law: iteration cap and relative stop (our choices).
const INVERT_STEPS = 60;
const INVERT_STOP = 1e-15;

export class TreeFlowSolver {
  private cap = { nodes: 0, entries: 0 };
  private pressure = new Float64Array(0);
  private through = new Float64Array(0);
  private below = new Uint32Array(0);
  private dp = new Float64Array(0);
  private entryFlow = new Float64Array(0);
  private entryDeriv = new Float64Array(0);
  private residual = new Float64Array(0);
  private x = new Float64Array(0);
  private step = new Float64Array(0);
  private trial = new Float64Array(0);
  private jac = new Float64Array(0);
  private entryLimit: (LawLimit | undefined)[] = [];
  private nodeImbalance = new Float64Array(0);
  private readonly scratch: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0, limited: undefined };
  private readonly up: UpstreamPressure = { pressurePa: 0, dPressureDFlow: 0, dPressureDDown: 0 };
  /** The root pressure each driving law last had: the start of its inversion. */
  private readonly lastRoot = new WeakMap<TwoPortLaw, number>();

  /** Solves the case from starting flows x0 (kg/s, > 0); null when it cannot (see the file comment). */
  solve(c: TreeCase, x0: ArrayLike<number>, options: TreeFlowOptions): TreeFlowResult | null {
    const k = c.entries;
    const count = c.count;
    if (k === 0 || count === 0 || !(c.ceilingPa > 0)) return null;
    const words = (k + 31) >>> 5;
    this.reserve(count, k, words);
    const { pressure: p, through, below, dp, entryFlow, entryDeriv, residual, x, step, trial, jac, entryLimit } = this;
    const parentSlot = c.parentSlot;
    const ceiling = c.ceilingPa;
    const rootFixed = 'fixedPa' in c.root ? c.root.fixedPa : Number.NaN;
    const rootDrive = 'law' in c.root ? c.root : null;
    if (!rootDrive && !(rootFixed > 0 && rootFixed <= ceiling)) return null;
    let evaluations = 0;
    const fail = (): null => {
      this.lastEvaluations = evaluations;
      return null;
    };

    // Entries below each node, as bits.
    below.fill(0, 0, count * words);
    for (let j = 0; j < k; j++) {
      let s = c.entrySlot[j]!;
      if (!(s >= 0 && s < count)) return fail();
      const bit = 1 << (j & 31);
      const w = j >>> 5;
      for (;;) {
        below[s * words + w] = below[s * words + w]! | bit;
        if (s === 0) break;
        s = parentSlot[s]!;
      }
    }
    const isBelow = (s: number, j: number): boolean => (below[s * words + (j >>> 5)]! & (1 << (j & 31))) !== 0;

    let rootFlow = 0;
    let rootDerivative = 0;
    const march = (xs: Float64Array): boolean => {
      let total = 0;
      for (let j = 0; j < k; j++) total += xs[j]!;
      through.fill(0, 0, count);
      for (let j = 0; j < k; j++) {
        let s = c.entrySlot[j]!;
        for (;;) {
          through[s] = through[s]! + xs[j]!;
          if (s === 0) break;
          s = parentSlot[s]!;
        }
      }
      rootFlow = total;
      if (rootDrive) {
        evaluations++;
        if (rootDrive.rootIsA && rootDrive.law.inletPressureInto && rootDrive.law.inletPressureInto(total, rootDrive.outletPa, this.up)) {
          p[0] = this.up.pressurePa;
          rootDerivative = this.up.dPressureDFlow;
        } else {
          const start = this.lastRoot.get(rootDrive.law);
          const r = this.invert(rootDrive.law, rootDrive.rootIsA, rootDrive.outletPa, total, 1, ceiling, start ?? 0.8 * ceiling, true);
          evaluations += r.evaluations;
          if (!r.ok) return false;
          p[0] = r.pressure;
          rootDerivative = r.dFlow;
        }
        if (!(p[0]! > 0) || p[0]! > ceiling) return false;
      } else {
        p[0] = rootFixed;
        rootDerivative = 0;
      }
      for (let j = 0; j < k; j++) dp[j] = rootDerivative;
      for (let i = 1; i < count; i++) {
        const u = parentSlot[i]!;
        const pu = p[u]!;
        const f = through[i]!;
        if (f === 0) {
          // A branch no entry feeds: its nodes sit at the pressure it hangs from.
          p[i] = pu;
          continue;
        }
        const law = c.parentLaw[i]!;
        let pressure: number;
        let dFlow: number;
        let dDown: number;
        evaluations++;
        if (law.upstreamPressureInto && law.upstreamPressureInto(f, pu, this.up)) {
          pressure = this.up.pressurePa;
          dFlow = this.up.dPressureDFlow;
          dDown = this.up.dPressureDDown;
        } else {
          const r = this.invert(law, c.childIsA[i] === 1, pu, f, pu, ceiling, Number.NaN, false);
          evaluations += r.evaluations;
          if (!r.ok) return false;
          pressure = r.pressure;
          dFlow = r.dFlow;
          dDown = r.dDown;
        }
        if (!(pressure > 0) || pressure > ceiling) return false;
        p[i] = pressure;
        if (words === 1) {
          const bits = below[i]!;
          for (let j = 0; j < k; j++) dp[i * k + j] = dDown * dp[u * k + j]! + ((bits >>> j) & 1 ? dFlow : 0);
        } else {
          for (let j = 0; j < k; j++) dp[i * k + j] = dDown * dp[u * k + j]! + (isBelow(i, j) ? dFlow : 0);
        }
      }
      for (let j = 0; j < k; j++) {
        const s = c.entrySlot[j]!;
        const law = c.entryLaw[j]!;
        const fixed = c.entryFixedPa[j]!;
        const fixedIsA = c.entryFixedIsA[j] === 1;
        evaluations++;
        const out = fixedIsA ? this.evaluate(law, fixed, p[s]!) : this.evaluate(law, p[s]!, fixed);
        const q = fixedIsA ? out.massFlowKgPerS : 0 - out.massFlowKgPerS;
        if (!Number.isFinite(q)) return false;
        entryFlow[j] = q;
        entryDeriv[j] = fixedIsA ? out.dFlowDPb : 0 - out.dFlowDPa; // d q / d p(node)
        entryLimit[j] = out.limited;
        residual[j] = q - xs[j]!;
      }
      return true;
    };
    const norm2 = (): number => {
      let s = 0;
      for (let j = 0; j < k; j++) s += residual[j]! * residual[j]!;
      return s;
    };
    // Node imbalances: only entry nodes can be out of balance (several entries may share one).
    const imbalance = (): { worst: number; total: number } => {
      let total = rootFlow;
      for (let j = 0; j < k; j++) total += Math.abs(entryFlow[j]!);
      for (let j = 0; j < k; j++) this.nodeImbalance[c.entrySlot[j]!] = 0;
      let worst = 0;
      for (let j = 0; j < k; j++) {
        const s = c.entrySlot[j]!;
        const v = this.nodeImbalance[s]! + residual[j]!;
        this.nodeImbalance[s] = v;
        worst = Math.max(worst, Math.abs(v));
      }
      return { worst, total: total / 2 }; // half the flow through elements with a fixed end, as newton.ts
    };

    for (let j = 0; j < k; j++) {
      const v = x0[j]!;
      if (!(v > 0) || !Number.isFinite(v)) return fail();
      x[j] = v;
    }
    // A start too large for the piping or the producer: scale it down until a march goes through.
    let started = march(x);
    for (let tries = 0; !started && tries < START_HALVINGS; tries++) {
      for (let j = 0; j < k; j++) x[j] = 0.5 * x[j]!;
      started = march(x);
    }
    if (!started) return fail();
    const maxIterations = options.maxIterations ?? MAX_ITERATIONS;
    let iterations = 0;
    let state = imbalance();
    while (!(state.worst <= options.tolerance * state.total || state.worst === 0)) {
      if (iterations >= maxIterations) return fail();
      iterations++;
      // J = d(entry flow)/dx - I; solve J step = -R.
      for (let j = 0; j < k; j++) {
        const s = c.entrySlot[j]!;
        for (let l = 0; l < k; l++) jac[j * k + l] = entryDeriv[j]! * dp[s * k + l]! - (j === l ? 1 : 0);
        step[j] = -residual[j]!;
      }
      if (!solveDense(jac, step, k)) return fail();
      const before = norm2();
      let alpha = 1;
      for (let j = 0; j < k; j++) if (step[j]! < 0) alpha = Math.min(alpha, ((1 - MIN_FLOW_RATIO_PER_STEP) * x[j]!) / -step[j]!);
      let accepted = false;
      for (let bt = 0; bt <= MAX_BACKTRACKS; bt++) {
        for (let j = 0; j < k; j++) trial[j] = x[j]! + alpha * step[j]!;
        if (march(trial) && norm2() <= (1 - 2 * ARMIJO_C * alpha) * before) {
          accepted = true;
          break;
        }
        alpha *= 0.5;
      }
      if (!accepted) return fail();
      for (let j = 0; j < k; j++) x[j] = trial[j]!;
      state = imbalance();
    }
    let rootLimit: LawLimit | undefined;
    if (rootDrive) {
      evaluations++;
      const out = rootDrive.rootIsA ? this.evaluate(rootDrive.law, p[0]!, rootDrive.outletPa) : this.evaluate(rootDrive.law, rootDrive.outletPa, p[0]!);
      rootLimit = out.limited;
      this.lastRoot.set(rootDrive.law, p[0]!);
    }
    this.lastEvaluations = evaluations;
    return {
      pressure: p,
      through,
      entryFlow,
      entryLimit,
      rootFlow,
      rootLimit,
      iterations,
      evaluations,
      imbalanceFraction: state.total > 0 ? state.worst / state.total : state.worst > 0 ? Infinity : 0,
    };
  }

  /** Law evaluations of the last call, also when it returned null. */
  lastEvaluations = 0;

  private reserve(nodes: number, entries: number, words: number): void {
    if (nodes > this.cap.nodes) {
      const n = Math.max(nodes, 2 * this.cap.nodes, 64);
      this.pressure = new Float64Array(n);
      this.through = new Float64Array(n);
      this.nodeImbalance = new Float64Array(n);
      this.cap.nodes = n;
    }
    if (entries > this.cap.entries) {
      const k = Math.max(entries, 2 * this.cap.entries, 4);
      this.entryFlow = new Float64Array(k);
      this.entryDeriv = new Float64Array(k);
      this.residual = new Float64Array(k);
      this.x = new Float64Array(k);
      this.step = new Float64Array(k);
      this.trial = new Float64Array(k);
      this.jac = new Float64Array(k * k);
      this.entryLimit = new Array(k);
      this.cap.entries = k;
    }
    if (this.below.length < this.cap.nodes * words) this.below = new Uint32Array(this.cap.nodes * words);
    if (this.dp.length < this.cap.nodes * entries) this.dp = new Float64Array(this.cap.nodes * this.cap.entries);
  }

  private evaluate(law: TwoPortLaw, pa: number, pb: number): PortFlow {
    if (law.flowInto) {
      law.flowInto(pa, pb, this.scratch);
      return this.scratch;
    }
    return law.flow(pa, pb);
  }

  /**
   * The pressure x at one end of an element whose other end is held at
   * `known`, such that the flow from x's end toward the known end is
   * `target` (x's end is port a when `xIsA`), by Newton on the law kept
   * inside [lo, hi] with bisection. `driving`: the element moves air
   * itself (a producer), so zero flow is not at x = known.
   */
  private invert(
    law: TwoPortLaw,
    xIsA: boolean,
    known: number,
    target: number,
    loIn: number,
    hiIn: number,
    start: number,
    driving: boolean,
  ): { ok: boolean; pressure: number; dFlow: number; dDown: number; evaluations: number } {
    let lo = loIn;
    let hi = hiIn;
    let evaluations = 0;
    let q = 0;
    let dq = 0;
    let dKnown = 0;
    const at = (x: number): void => {
      evaluations++;
      const r = xIsA ? this.evaluate(law, x, known) : this.evaluate(law, known, x);
      q = xIsA ? r.massFlowKgPerS : 0 - r.massFlowKgPerS;
      dq = xIsA ? r.dFlowDPa : 0 - r.dFlowDPb;
      dKnown = xIsA ? r.dFlowDPb : 0 - r.dFlowDPa;
    };
    let x = Number.isFinite(start) ? start : driving ? 0.5 * (lo + hi) : known * 1.01;
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
      const size = Math.abs(next - x);
      x = next;
      if (size <= INVERT_STOP * x) {
        at(x);
        ok = Number.isFinite(q) && Math.abs(q - target) <= 1e-12 * Math.max(Math.abs(target), Math.abs(q));
        break;
      }
      if (hi - lo <= INVERT_STOP * hi) break;
    }
    if (!ok || !(dq > 0)) return { ok: false, pressure: x, dFlow: 0, dDown: 0, evaluations };
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

/** A network solver's case as a tree case, with the maps back to its local numbering. */
export interface LocalTreeCase {
  treeCase: TreeCase;
  /** Local node index of each slot. */
  nodeOfSlot: Int32Array;
  /** Local element joining each slot to its parent (-1 at the root). */
  elementOfSlot: Int32Array;
  /** The driving element. */
  rootElement: number;
  /** The local element of each entry. */
  entryElement: Int32Array;
}

/** Largest number of entries solved this way by the network solver (the dense k x k solve grows as k^3; our choice). */
export const MAX_TREE_ENTRIES = 128;

/**
 * The case of a network solver's local system when it has the shape this
 * solver takes: its free nodes joined into one tree by free-free elements,
 * exactly one driving element (`drives`) with one free end (the root),
 * and every other element with a fixed end an entry. Null otherwise.
 */
export function localTreeCase(
  n: number,
  la: Int32Array,
  lb: Int32Array,
  fa: Float64Array,
  fb: Float64Array,
  laws: TwoPortLaw[],
  drives: Uint8Array,
  ceilingPa: number,
): LocalTreeCase | null {
  const m = la.length;
  if (n === 0) return null;
  let rootElement = -1;
  const entryList: number[] = [];
  const degree = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) {
    const a = la[e]!;
    const b = lb[e]!;
    if (a >= 0 && b >= 0) {
      if (a === b || drives[e]) return null;
      degree[a + 1]!++;
      degree[b + 1]!++;
    } else if (drives[e]) {
      if (rootElement >= 0) return null;
      rootElement = e;
    } else {
      entryList.push(e);
    }
  }
  const k = entryList.length;
  if (rootElement < 0 || k === 0 || k > MAX_TREE_ENTRIES) return null;
  // Adjacency (CSR) of the free-free elements.
  for (let i = 0; i < n; i++) degree[i + 1] = degree[i + 1]! + degree[i]!;
  const fill = degree.slice(0, n);
  const adjElem = new Int32Array(degree[n]!);
  for (let e = 0; e < m; e++) {
    const a = la[e]!;
    const b = lb[e]!;
    if (a < 0 || b < 0) continue;
    adjElem[fill[a]!++] = e;
    adjElem[fill[b]!++] = e;
  }
  // Breadth first from the root: parents before children; a node reached twice closes a loop.
  const rootNode = la[rootElement]! >= 0 ? la[rootElement]! : lb[rootElement]!;
  const slotOf = new Int32Array(n).fill(-1);
  const nodeOfSlot = new Int32Array(n);
  const elementOfSlot = new Int32Array(n).fill(-1);
  const parentSlot = new Int32Array(n);
  const parentLaw: TwoPortLaw[] = new Array(n);
  const childIsA = new Uint8Array(n);
  slotOf[rootNode] = 0;
  nodeOfSlot[0] = rootNode;
  parentSlot[0] = -1;
  let tail = 1;
  for (let head = 0; head < tail; head++) {
    const v = nodeOfSlot[head]!;
    for (let j = degree[v]!; j < degree[v + 1]!; j++) {
      const e = adjElem[j]!;
      if (e === elementOfSlot[head]) continue;
      const u = la[e] === v ? lb[e]! : la[e]!;
      if (slotOf[u]! >= 0) return null;
      slotOf[u] = tail;
      nodeOfSlot[tail] = u;
      elementOfSlot[tail] = e;
      parentSlot[tail] = head;
      parentLaw[tail] = laws[e]!;
      childIsA[tail] = la[e] === u ? 1 : 0;
      tail++;
    }
  }
  if (tail !== n) return null; // more than one tree
  const entrySlot = new Int32Array(k);
  const entryLaw: TwoPortLaw[] = new Array(k);
  const entryFixedPa = new Float64Array(k);
  const entryFixedIsA = new Uint8Array(k);
  const entryElement = Int32Array.from(entryList);
  for (let j = 0; j < k; j++) {
    const e = entryList[j]!;
    const fixedIsA = la[e]! < 0;
    entrySlot[j] = slotOf[fixedIsA ? lb[e]! : la[e]!]!;
    entryLaw[j] = laws[e]!;
    entryFixedPa[j] = fixedIsA ? fa[e]! : fb[e]!;
    entryFixedIsA[j] = fixedIsA ? 1 : 0;
    if (!(entryFixedPa[j]! > 0) || entryFixedPa[j]! > ceilingPa) return null;
  }
  const rootIsA = la[rootElement]! >= 0;
  const outletPa = rootIsA ? fb[rootElement]! : fa[rootElement]!;
  return {
    treeCase: {
      count: n,
      parentSlot,
      parentLaw,
      childIsA,
      root: { law: laws[rootElement]!, rootIsA, outletPa },
      entries: k,
      entrySlot,
      entryLaw,
      entryFixedPa,
      entryFixedIsA,
      ceilingPa,
    },
    nodeOfSlot,
    elementOfSlot,
    rootElement,
    entryElement,
  };
}
