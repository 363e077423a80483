/**
 * Solves one case of a network: the given active elements (the piping, the
 * equipment, and the hoses and tools of the open inlets) with their laws.
 *
 * Steps: check the elements have laws; drop dead legs (a branch that ends
 * without an open tool carries no air, so its nodes sit at the pressure of
 * the point it hangs from); check that every part with open tools has a way
 * to move air; pick the linear back-end (tree elimination when the free
 * nodes form a forest, sparse LU otherwise); run damped Newton; classify
 * the outcome. Never throws and never returns NaN: failures are typed.
 */
import { linearBackend, newtonSolve, type LocalSystem, type NewtonOutcome } from './newton.js';
import { localTreeCase, TreeFlowSolver } from './tree-flow-solve.js';
import { fillInitialPressures } from './initial-guess.js';
import type { LawLimit, SolveEffort, SolveFailure, SolveFailureCause, NetworkSolveOptions, SolveResult, SolvedState, SolverNetwork } from './solve-types.js';
import type { TwoPortLaw } from '../elements/two-port-law.js';

/** Default relative mass-imbalance tolerance (ENGINEERING.md: 1e-9 of the total flow). */
export const DEFAULT_TOLERANCE = 1e-9;
/** Default Newton iteration cap (our choice; converged cases take 3-15). */
export const DEFAULT_MAX_ITERATIONS = 100;
// A node pressure below this share of the highest fixed pressure means the
// case needs (near) zero absolute pressure somewhere: not physical (our choice).
const ZERO_PRESSURE_FRACTION = 1e-3;
// A Newton run that stops with some node below 2 % of the highest fixed
// pressure was heading for zero pressure (our choice).
const STALLED_NEAR_ZERO_FRACTION = 0.02;

/** Solves a case. `active` lists element ids; duplicates are ignored. */
export function solveNetwork(
  net: SolverNetwork,
  active: ArrayLike<number>,
  options: NetworkSolveOptions = {},
  effort?: SolveEffort,
): SolveResult {
  try {
    return solveInner(net, active, options, effort);
  } catch (error) {
    // A law threw: classify rather than pass the throw on.
    return {
      ok: false,
      iterations: 0,
      failure: { cause: 'invalid-element', message: `an element law failed: ${String(error)}` },
    };
  }
}

/**
 * Scratch arrays sized to one network, reused by every solve of it (a
 * stamp marks the entries of the current solve), so that a small case of a
 * large network costs time in proportion to the case, not the network.
 */
interface Workspace {
  stamp: number;
  elemStamp: Int32Array;
  nodeStamp: Int32Array;
  /** Local id of a free node in the current solve; -1 for a fixed node. */
  localOf: Int32Array;
  /** Fixed pressure of a node in the current solve (NaN when free). */
  fixedAt: Float64Array;
  /** Scratch arrays of the setup, sized to the network (views of the first entries are used). */
  scratch: Map<string, Int32Array | Uint8Array | Float64Array>;
}

/** A scratch array of the workspace, at least `length` long, its first `length` entries set to `fill`. */
function scratchOf<T extends Int32Array | Uint8Array | Float64Array>(
  ws: Workspace,
  name: string,
  make: new (length: number) => T,
  length: number,
  fill: number,
): T {
  let a = ws.scratch.get(name) as T | undefined;
  if (!a || a.length < length) {
    a = new make(Math.max(length, 16));
    ws.scratch.set(name, a);
  }
  const view = a.subarray(0, length) as T;
  view.fill(fill);
  return view;
}

const workspaces = new WeakMap<SolverNetwork, Workspace>();

function workspaceOf(net: SolverNetwork): Workspace {
  const elementCount = net.elementA.length;
  let ws = workspaces.get(net);
  if (!ws || ws.nodeStamp.length !== net.nodeCount || ws.elemStamp.length !== elementCount) {
    ws = {
      stamp: 0,
      elemStamp: new Int32Array(elementCount),
      nodeStamp: new Int32Array(net.nodeCount),
      localOf: new Int32Array(net.nodeCount),
      fixedAt: new Float64Array(net.nodeCount),
      scratch: new Map(),
    };
    workspaces.set(net, ws);
  }
  ws.stamp++;
  if (ws.stamp >= 0x7fffffff) {
    ws.elemStamp.fill(0);
    ws.nodeStamp.fill(0);
    ws.stamp = 1;
  }
  return ws;
}

function solveInner(net: SolverNetwork, active: ArrayLike<number>, options: NetworkSolveOptions, effort?: SolveEffort): SolveResult {
  if (effort) effort.solves++;
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  const maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  const overrides = options.fixedOverridesPa;
  const ws = workspaceOf(net);
  const stamp = ws.stamp;
  const { elemStamp, nodeStamp, localOf, fixedAt } = ws;
  const elementA = net.elementA;
  const elementB = net.elementB;

  // --- unique active elements, each with a law
  const elemList: number[] = [];
  for (let i = 0; i < active.length; i++) {
    const e = active[i]!;
    if (elemStamp[e] === stamp) continue;
    if (e >= 0 && e < elemStamp.length) elemStamp[e] = stamp;
    const law = net.laws[e];
    if (!law) {
      return fail({
        cause: 'invalid-element',
        element: net.refs[e],
        message: net.invalid[e] ?? 'element has no flow law',
      });
    }
    elemList.push(e);
  }
  const elemCount = elemList.length;
  const elems = Int32Array.from(elemList);

  const fixedOf = (node: number): number => {
    const o = overrides?.get(node);
    if (o !== undefined) return o;
    return net.fixedPressurePa[node]!;
  };

  // --- local numbering of free nodes (first touch order); degrees for pruning
  const globalList: number[] = [];
  const degreeList: number[] = [];
  const touch = (node: number): void => {
    if (nodeStamp[node] !== stamp) {
      nodeStamp[node] = stamp;
      const pf = fixedOf(node);
      fixedAt[node] = pf;
      if (Number.isFinite(pf)) {
        localOf[node] = -1;
        return;
      }
      localOf[node] = globalList.length;
      globalList.push(node);
      degreeList.push(1);
      return;
    }
    const id = localOf[node]!;
    if (id >= 0) degreeList[id]!++;
  };
  for (let k = 0; k < elemCount; k++) {
    const e = elems[k]!;
    touch(elementA[e]!);
    touch(elementB[e]!);
  }
  const nodeCount = globalList.length;
  const globalNodes = scratchOf(ws, 'globalNodes', Int32Array, nodeCount, 0);
  const degree = scratchOf(ws, 'degree', Int32Array, nodeCount, 0);
  for (let v = 0; v < nodeCount; v++) {
    globalNodes[v] = globalList[v]!;
    degree[v] = degreeList[v]!;
  }
  // Local ends of each case element (-1: fixed).
  const endA = scratchOf(ws, 'endA', Int32Array, elemCount, 0);
  const endB = scratchOf(ws, 'endB', Int32Array, elemCount, 0);
  for (let k = 0; k < elemCount; k++) {
    const e = elems[k]!;
    endA[k] = localOf[elementA[e]!]!;
    endB[k] = localOf[elementB[e]!]!;
  }
  // Incidence lists (CSR) of free nodes.
  const incStart = scratchOf(ws, 'incStart', Int32Array, nodeCount + 1, 0);
  for (let k = 0; k < elemCount; k++) {
    if (endA[k]! >= 0) incStart[endA[k]! + 1]!++;
    if (endB[k]! >= 0) incStart[endB[k]! + 1]!++;
  }
  for (let i = 0; i < nodeCount; i++) incStart[i + 1] = incStart[i + 1]! + incStart[i]!;
  const incPos = scratchOf(ws, 'incPos', Int32Array, nodeCount, 0);
  incPos.set(incStart.subarray(0, nodeCount));
  const incElem = scratchOf(ws, 'incElem', Int32Array, incStart[nodeCount]!, 0);
  for (let k = 0; k < elemCount; k++) {
    if (endA[k]! >= 0) incElem[incPos[endA[k]!]!++] = k;
    if (endB[k]! >= 0) incElem[incPos[endB[k]!]!++] = k;
  }

  // --- prune dead legs: a free node with one element, to another free node
  const removedElem = scratchOf(ws, 'removedElem', Uint8Array, elemCount, 0);
  const removedNode = scratchOf(ws, 'removedNode', Uint8Array, nodeCount, 0);
  const prunedNode: number[] = [];
  const prunedVia: number[] = [];
  if (options.prune !== false) {
    const stack: number[] = [];
    for (let v = 0; v < nodeCount; v++) if (degree[v] === 1) stack.push(v);
    while (stack.length > 0) {
      const v = stack.pop()!;
      if (removedNode[v] || degree[v] !== 1) continue;
      let k = -1;
      for (let j = incStart[v]!; j < incStart[v + 1]!; j++) if (!removedElem[incElem[j]!]) k = incElem[j]!;
      if (k < 0) continue;
      const e = elems[k]!;
      const u = endA[k] === v ? endB[k]! : endA[k]!;
      // Only passive dead ends between free nodes go: an element to a fixed
      // pressure (an open tool, a producer) always takes part.
      if (net.drives[e] || u < 0) continue;
      removedElem[k] = 1;
      removedNode[v] = 1;
      degree[v] = 0;
      prunedNode.push(v);
      prunedVia.push(k);
      if (u !== v) {
        degree[u]!--;
        if (degree[u] === 1) stack.push(u);
      }
    }
  }

  // --- components of the remaining free nodes; each must be able to move air
  const comp = scratchOf(ws, 'comp', Int32Array, nodeCount, -1);
  const compDrives: boolean[] = [];
  const compFixedMin: number[] = [];
  const compFixedMax: number[] = [];
  const compFirstFixedElem: number[] = [];
  const compHasElem: boolean[] = [];
  const queue: number[] = [];
  for (let s = 0; s < nodeCount; s++) {
    if (removedNode[s] || comp[s]! >= 0) continue;
    const c = compDrives.length;
    let drives = false;
    let fixedMin = Infinity;
    let fixedMax = -Infinity;
    let firstFixedElem = -1;
    let hasElem = false;
    queue.length = 0;
    queue.push(s);
    comp[s] = c;
    while (queue.length > 0) {
      const v = queue.pop()!;
      for (let j = incStart[v]!; j < incStart[v + 1]!; j++) {
        const k = incElem[j]!;
        if (removedElem[k]) continue;
        const e = elems[k]!;
        hasElem = true;
        if (net.drives[e]) drives = true;
        for (let side = 0; side < 2; side++) {
          const u = side === 0 ? endA[k]! : endB[k]!;
          if (u < 0) {
            const pf = fixedAt[side === 0 ? elementA[e]! : elementB[e]!]!;
            if (pf < fixedMin) fixedMin = pf;
            if (pf > fixedMax) fixedMax = pf;
            if (firstFixedElem < 0) firstFixedElem = e;
          } else if (comp[u]! < 0) {
            comp[u] = c;
            queue.push(u);
          }
        }
      }
    }
    compDrives.push(drives);
    compFixedMin.push(fixedMin);
    compFixedMax.push(fixedMax);
    compFirstFixedElem.push(firstFixedElem);
    compHasElem.push(hasElem);
  }
  // Components with no fixed pressure at all carry no air: leave them out.
  // Components whose only fixed ends share one pressure and that hold no
  // producer cannot move air: the open tools in them have no path.
  const keepComp = compDrives.map((_, c) => Number.isFinite(compFixedMin[c]!) && compHasElem[c]!);
  for (let c = 0; c < keepComp.length; c++) {
    if (!keepComp[c]) continue;
    if (!compDrives[c] && compFixedMax[c]! - compFixedMin[c]! <= 0) {
      const e = compFirstFixedElem[c]!;
      return fail({
        cause: 'no-path',
        element: net.refs[e],
        message: 'no path from this part of the network to a producer',
      });
    }
  }

  // --- local system
  const freeIndex = scratchOf(ws, 'freeIndex', Int32Array, nodeCount, -1);
  const freeGlobalList: number[] = [];
  for (let v = 0; v < nodeCount; v++) {
    if (removedNode[v] || !keepComp[comp[v]!]) continue;
    freeIndex[v] = freeGlobalList.length;
    freeGlobalList.push(globalNodes[v]!);
  }
  const freeGlobal = Int32Array.from(freeGlobalList);
  const sysList: number[] = [];
  for (let k = 0; k < elemCount; k++) {
    if (removedElem[k]) continue;
    const a = endA[k]!;
    const b = endB[k]!;
    const inKept = (x: number) => x < 0 || freeIndex[x]! >= 0;
    if (inKept(a) && inKept(b) && (a >= 0 || b >= 0)) sysList.push(k);
  }
  const m = sysList.length;
  const n = freeGlobal.length;
  const sysElems = new Int32Array(m);
  const sys: LocalSystem = {
    n,
    la: new Int32Array(m),
    lb: new Int32Array(m),
    fa: new Float64Array(m),
    fb: new Float64Array(m),
    laws: new Array<TwoPortLaw>(m),
  };
  let maxFixed = 0;
  for (let j = 0; j < m; j++) {
    const k = sysList[j]!;
    const e = elems[k]!;
    sysElems[j] = e;
    const a = endA[k]!;
    const b = endB[k]!;
    sys.la[j] = a < 0 ? -1 : freeIndex[a]!;
    sys.lb[j] = b < 0 ? -1 : freeIndex[b]!;
    sys.fa[j] = a < 0 ? fixedAt[elementA[e]!]! : NaN;
    sys.fb[j] = b < 0 ? fixedAt[elementB[e]!]! : NaN;
    if (a < 0) maxFixed = Math.max(maxFixed, sys.fa[j]!);
    if (b < 0) maxFixed = Math.max(maxFixed, sys.fb[j]!);
    sys.laws[j] = net.laws[e]!;
  }

  // --- starting pressures: the caller's guess where it has one, filled in elsewhere
  const p = new Float64Array(n);
  const known = new Uint8Array(n);
  const init = options.initialPressurePa;
  if (init) {
    for (let i = 0; i < n; i++) {
      const g = init[freeGlobal[i]!];
      if (g !== undefined && Number.isFinite(g) && g > 0) {
        p[i] = g;
        known[i] = 1;
      }
    }
  }
  const fillEvaluations = fillInitialPressures(sys, p, known, maxFixed);
  if (effort) effort.elementEvaluations += fillEvaluations;

  // A tree hanging from one producer with air entering at tools: solved by
  // the entry flows (tree-flow-solve.ts); anything else, or a case that
  // solver hands back, by Newton on the node pressures.
  let outcome: NewtonOutcome | null = options.method === 'newton' ? null : solveByEntryFlows(net, sys, sysElems, p, maxFixed, tolerance, effort);
  const backend = outcome ? null : linearBackend(sys);
  if (!outcome) outcome = newtonSolve(sys, p, backend!, { tolerance, maxIterations });
  if (outcome.status !== 'converged' && init && backend) {
    // A warm start from another case can lead Newton astray: try again cold.
    const cold = new Float64Array(n);
    const coldFill = fillInitialPressures(sys, cold, new Uint8Array(n), maxFixed);
    if (effort) effort.elementEvaluations += coldFill;
    const retry = newtonSolve(sys, cold, backend, { tolerance, maxIterations });
    if (effort) effort.elementEvaluations += outcome.evaluations;
    retry.iterations += outcome.iterations;
    outcome = retry;
    p.set(cold);
  }
  if (effort) {
    effort.newtonIterations += outcome.iterations;
    effort.elementEvaluations += outcome.evaluations;
  }

  // --- the state, including pruned nodes (at the pressure they hang from) and elements (no flow)
  const prunedCount = prunedNode.length;
  const stateNodes = new Int32Array(n + prunedCount);
  const statePressures = new Float64Array(n + prunedCount);
  stateNodes.set(freeGlobal);
  statePressures.set(p.subarray(0, n));
  // Pressure of a free local node: its solved value, or (pruned) the value it was given.
  const localPressure = scratchOf(ws, 'localPressure', Float64Array, nodeCount, NaN);
  for (let v = 0; v < nodeCount; v++) if (freeIndex[v]! >= 0) localPressure[v] = p[freeIndex[v]!]!;
  for (let r = prunedCount - 1, at = n; r >= 0; r--, at++) {
    const node = prunedNode[r]!;
    const k = prunedVia[r]!;
    const other = endA[k] === node ? endB[k]! : endA[k]!;
    const e = elems[k]!;
    const po = other >= 0 ? localPressure[other]! : fixedAt[endA[k] === node ? elementB[e]! : elementA[e]!]!;
    const value = Number.isFinite(po) ? po : maxFixed;
    localPressure[node] = value;
    stateNodes[at] = globalNodes[node]!;
    statePressures[at] = value;
  }
  const stateFlows = new Float64Array(elemCount);
  for (let j = 0; j < m; j++) stateFlows[sysList[j]!] = outcome.flows[j]!;
  const limited: SolvedState['limited'] = [];
  const state = (): SolvedState => ({
    nodes: stateNodes,
    pressurePa: statePressures,
    elements: elems,
    flowKgPerS: stateFlows,
    limited,
    iterations: outcome.iterations,
    imbalanceFraction: outcome.imbalanceFraction,
  });

  if (outcome.status === 'bad-law') {
    const e = sysElems[outcome.element ?? 0]!;
    return {
      ok: false,
      iterations: outcome.iterations,
      failure: { cause: 'invalid-element', element: net.refs[e], message: 'element law gave no finite flow at these pressures' },
    };
  }
  // Limits the laws report at the final point, and what each means here.
  const baseClassify = net.classifyLimit ?? ((e: number, limit: LawLimit) => defaultLimitCause(net, e, limit));
  const classify = (e: number, limit: LawLimit, pa: number, pb: number, flow: number) =>
    options.acceptCurveEnd && limit === 'curve-end' ? null : baseClassify(e, limit, pa, pb, flow);
  for (let k = 0; k < m; k++) {
    const lim = outcome.limits[k];
    if (!lim) continue;
    const pa = sys.la[k]! >= 0 ? p[sys.la[k]!]! : sys.fa[k]!;
    const pb = sys.lb[k]! >= 0 ? p[sys.lb[k]!]! : sys.fb[k]!;
    limited.push({ element: sysElems[k]!, limit: lim, cause: classify(sysElems[k]!, lim, pa, pb, outcome.flows[k]!) });
  }
  let lowest = Infinity;
  let lowestNode = -1;
  for (let i = 0; i < n; i++) {
    if (p[i]! < lowest) {
      lowest = p[i]!;
      lowestNode = freeGlobal[i]!;
    }
  }
  const choked = limited.find((l) => l.cause === 'choked');
  const curveEnd = limited.find((l) => l.cause === 'infeasible-demand');
  const zeroPressure = n > 0 && lowest < ZERO_PRESSURE_FRACTION * maxFixed;
  const elementAtNode = (node: number) => {
    const e = sysElems.find((x) => net.elementA[x] === node || net.elementB[x] === node);
    return e === undefined ? undefined : net.refs[e];
  };

  if (outcome.status === 'converged') {
    if (zeroPressure) {
      return {
        ok: false,
        iterations: outcome.iterations,
        state: state(),
        failure: { cause: 'zero-pressure', element: elementAtNode(lowestNode), message: 'the case needs near-zero absolute pressure' },
      };
    }
    if (curveEnd) {
      return {
        ok: false,
        iterations: outcome.iterations,
        state: state(),
        failure: { cause: 'infeasible-demand', element: net.refs[curveEnd.element], message: 'the demand lies beyond the end of the producer curve' },
      };
    }
    if (choked) {
      return {
        ok: false,
        iterations: outcome.iterations,
        state: state(),
        failure: { cause: 'choked', element: net.refs[choked.element], message: 'flow is choked (sonic) in this element' },
      };
    }
    return { ok: true, ...state() };
  }
  // Not converged: say why as precisely as the last iterate allows.
  const failure: SolveFailure = curveEnd
    ? { cause: 'infeasible-demand', element: net.refs[curveEnd.element], message: 'the producer cannot deliver the demand: past the end of its curve' }
    : choked
      ? { cause: 'choked', element: net.refs[choked.element], message: 'flow is choked (sonic) in this element' }
      : zeroPressure || lowest < STALLED_NEAR_ZERO_FRACTION * maxFixed
        ? { cause: 'zero-pressure', element: elementAtNode(lowestNode), message: 'pressure falls toward zero: the demand cannot be met' }
        : {
            cause: 'not-converged',
            message: `no solution within ${outcome.iterations} iterations (${outcome.status}); largest imbalance ${outcome.imbalanceFraction.toExponential(2)} of the total flow`,
          };
  return { ok: false, iterations: outcome.iterations, state: state(), failure };
}

// Tolerance of the entry-flow solve, a share of the network tolerance: its
// last Newton step is one march, so it goes 1,000 times further, and a
// case then agrees with the analysis's path solves to ~1e-12 (our choice).
const ENTRY_FLOW_TOLERANCE_SHARE = 1e-3;
const treeFlows = new TreeFlowSolver();

/**
 * The case by its entry flows when it is a tree hanging from one producer
 * (localTreeCase), started from what the entries pass at the starting
 * pressures; the outcome in Newton's terms, or null to use Newton.
 * Writes the solved pressures into p.
 */
function solveByEntryFlows(
  net: SolverNetwork,
  sys: LocalSystem,
  sysElems: Int32Array,
  p: Float64Array,
  ceilingPa: number,
  tolerance: number,
  effort?: SolveEffort,
): NewtonOutcome | null {
  const m = sys.la.length;
  const drives = new Uint8Array(m);
  for (let j = 0; j < m; j++) drives[j] = net.drives[sysElems[j]!]!;
  const tc = localTreeCase(sys.n, sys.la, sys.lb, sys.fa, sys.fb, sys.laws, drives, ceilingPa);
  if (!tc) return null;
  const c = tc.treeCase;
  const x0 = new Float64Array(c.entries);
  for (let j = 0; j < c.entries; j++) {
    const pv = p[tc.nodeOfSlot[c.entrySlot[j]!]!]!;
    const fixed = c.entryFixedPa[j]!;
    const q = c.entryFixedIsA[j] ? c.entryLaw[j]!.flow(fixed, pv).massFlowKgPerS : -c.entryLaw[j]!.flow(pv, fixed).massFlowKgPerS;
    if (!(q > 0) || !Number.isFinite(q)) return null;
    x0[j] = q;
  }
  const r = treeFlows.solve(c, x0, { tolerance: ENTRY_FLOW_TOLERANCE_SHARE * tolerance });
  if (!r) {
    if (effort) effort.elementEvaluations += treeFlows.lastEvaluations;
    return null;
  }
  const flows = new Float64Array(m);
  const limits: (LawLimit | undefined)[] = new Array(m);
  for (let s = 0; s < c.count; s++) {
    p[tc.nodeOfSlot[s]!] = r.pressure[s]!;
    if (s === 0) continue;
    flows[tc.elementOfSlot[s]!] = c.childIsA[s] ? r.through[s]! : 0 - r.through[s]!;
  }
  const rootIsA = 'law' in c.root && c.root.rootIsA;
  flows[tc.rootElement] = rootIsA ? r.rootFlow : 0 - r.rootFlow;
  limits[tc.rootElement] = r.rootLimit;
  for (let j = 0; j < c.entries; j++) {
    const e = tc.entryElement[j]!;
    flows[e] = c.entryFixedIsA[j] ? r.entryFlow[j]! : 0 - r.entryFlow[j]!;
    limits[e] = r.entryLimit[j];
  }
  return { status: 'converged', iterations: r.iterations, flows, limits, imbalanceFraction: r.imbalanceFraction, evaluations: r.evaluations };
}

/** What a limit means when the network does not say (SolverNetwork.classifyLimit). */
export function defaultLimitCause(net: SolverNetwork, element: number, limit: LawLimit): SolveFailureCause | null {
  if (limit === 'choked') return 'choked';
  return limit === 'curve-end' && net.drives[element] ? 'infeasible-demand' : null;
}

/** A node pressure below this share of the highest fixed pressure means zero absolute pressure (see ZERO_PRESSURE_FRACTION). */
export const ZERO_PRESSURE_SHARE = ZERO_PRESSURE_FRACTION;

function fail(failure: SolveFailure): SolveResult {
  return { ok: false, iterations: 0, failure };
}
