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
import { linearBackend, newtonSolve, type LocalSystem } from './newton.js';
import { fillInitialPressures } from './initial-guess.js';
import type { LawLimit, SolveEffort, SolveFailure, NetworkSolveOptions, SolveResult, SolvedState, SolverNetwork } from './solve-types.js';
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

function solveInner(net: SolverNetwork, active: ArrayLike<number>, options: NetworkSolveOptions, effort?: SolveEffort): SolveResult {
  if (effort) effort.solves++;
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  const maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  const overrides = options.fixedOverridesPa;

  // --- unique active elements, each with a law
  const seen = new Set<number>();
  const elems: number[] = [];
  for (let i = 0; i < active.length; i++) {
    const e = active[i]!;
    if (seen.has(e)) continue;
    seen.add(e);
    const law = net.laws[e];
    if (!law) {
      return fail({
        cause: 'invalid-element',
        element: net.refs[e],
        message: net.invalid[e] ?? 'element has no flow law',
      });
    }
    elems.push(e);
  }

  const fixedOf = (node: number): number => {
    const o = overrides?.get(node);
    if (o !== undefined) return o;
    return net.fixedPressurePa[node]!;
  };
  const isFree = (node: number): boolean => !Number.isFinite(fixedOf(node));

  // --- local numbering of free nodes; degrees for pruning
  const local = new Map<number, number>();
  const globalNodes: number[] = [];
  const degree: number[] = [];
  const touch = (node: number): void => {
    if (!isFree(node)) return;
    let id = local.get(node);
    if (id === undefined) {
      id = globalNodes.length;
      local.set(node, id);
      globalNodes.push(node);
      degree.push(0);
    }
    degree[id]!++;
  };
  for (const e of elems) {
    touch(net.elementA[e]!);
    touch(net.elementB[e]!);
  }
  const nodeCount = globalNodes.length;
  // Incidence lists (CSR) of free nodes.
  const incStart = new Int32Array(nodeCount + 1);
  for (const e of elems) {
    const a = local.get(net.elementA[e]!);
    const b = local.get(net.elementB[e]!);
    if (a !== undefined) incStart[a + 1]!++;
    if (b !== undefined) incStart[b + 1]!++;
  }
  for (let i = 0; i < nodeCount; i++) incStart[i + 1] = incStart[i + 1]! + incStart[i]!;
  const incPos = incStart.slice(0, nodeCount);
  const incElem = new Int32Array(incStart[nodeCount]!);
  elems.forEach((e, k) => {
    const a = local.get(net.elementA[e]!);
    const b = local.get(net.elementB[e]!);
    if (a !== undefined) incElem[incPos[a]!++] = k;
    if (b !== undefined) incElem[incPos[b]!++] = k;
  });

  // --- prune dead legs: a free node with one element, to another free node
  const removedElem = new Uint8Array(elems.length);
  const removedNode = new Uint8Array(nodeCount);
  const prunedOrder: { node: number; via: number }[] = [];
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
      const other = local.get(net.elementA[e]!) === v ? net.elementB[e]! : net.elementA[e]!;
      const u = local.get(other);
      // Only passive dead ends between free nodes go: an element to a fixed
      // pressure (an open tool, a producer) always takes part.
      if (net.drives[e] || u === undefined) continue;
      removedElem[k] = 1;
      removedNode[v] = 1;
      degree[v] = 0;
      prunedOrder.push({ node: v, via: k });
      if (u !== v) {
        degree[u]!--;
        if (degree[u] === 1) stack.push(u);
      }
    }
  }

  // --- components of the remaining free nodes; each must be able to move air
  const comp = new Int32Array(nodeCount).fill(-1);
  const compInfo: { drives: boolean; fixedMin: number; fixedMax: number; firstFixedElem: number; hasElem: boolean }[] = [];
  for (let s = 0; s < nodeCount; s++) {
    if (removedNode[s] || comp[s]! >= 0) continue;
    const c = compInfo.length;
    const info = { drives: false, fixedMin: Infinity, fixedMax: -Infinity, firstFixedElem: -1, hasElem: false };
    compInfo.push(info);
    const queue = [s];
    comp[s] = c;
    while (queue.length > 0) {
      const v = queue.pop()!;
      for (let j = incStart[v]!; j < incStart[v + 1]!; j++) {
        const k = incElem[j]!;
        if (removedElem[k]) continue;
        const e = elems[k]!;
        info.hasElem = true;
        if (net.drives[e]) info.drives = true;
        for (const end of [net.elementA[e]!, net.elementB[e]!]) {
          const u = local.get(end);
          if (u === undefined) {
            const pf = fixedOf(end);
            info.fixedMin = Math.min(info.fixedMin, pf);
            info.fixedMax = Math.max(info.fixedMax, pf);
            if (info.firstFixedElem < 0) info.firstFixedElem = e;
          } else if (comp[u]! < 0) {
            comp[u] = c;
            queue.push(u);
          }
        }
      }
    }
  }
  // Components with no fixed pressure at all carry no air: leave them out.
  // Components whose only fixed ends share one pressure and that hold no
  // producer cannot move air: the open tools in them have no path.
  const keepComp = compInfo.map((info) => Number.isFinite(info.fixedMin) && info.hasElem);
  for (let c = 0; c < compInfo.length; c++) {
    const info = compInfo[c]!;
    if (!keepComp[c]) continue;
    if (!info.drives && info.fixedMax - info.fixedMin <= 0) {
      const e = info.firstFixedElem;
      return fail({
        cause: 'no-path',
        element: net.refs[e],
        message: 'no path from this part of the network to a producer',
      });
    }
  }

  // --- local system
  const freeIndex = new Int32Array(nodeCount).fill(-1);
  const freeGlobal: number[] = [];
  for (let v = 0; v < nodeCount; v++) {
    if (removedNode[v] || !keepComp[comp[v]!]) continue;
    freeIndex[v] = freeGlobal.length;
    freeGlobal.push(globalNodes[v]!);
  }
  const sysElems: number[] = [];
  elems.forEach((e, k) => {
    if (removedElem[k]) return;
    const a = local.get(net.elementA[e]!);
    const b = local.get(net.elementB[e]!);
    const inKept = (x: number | undefined) => x === undefined || freeIndex[x]! >= 0;
    if (inKept(a) && inKept(b) && (a !== undefined || b !== undefined)) sysElems.push(e);
  });
  const m = sysElems.length;
  const n = freeGlobal.length;
  const sys: LocalSystem = {
    n,
    la: new Int32Array(m),
    lb: new Int32Array(m),
    fa: new Float64Array(m),
    fb: new Float64Array(m),
    laws: new Array<TwoPortLaw>(m),
  };
  let maxFixed = 0;
  sysElems.forEach((e, k) => {
    const A = net.elementA[e]!;
    const B = net.elementB[e]!;
    const a = local.get(A);
    const b = local.get(B);
    sys.la[k] = a === undefined ? -1 : freeIndex[a]!;
    sys.lb[k] = b === undefined ? -1 : freeIndex[b]!;
    sys.fa[k] = a === undefined ? fixedOf(A) : NaN;
    sys.fb[k] = b === undefined ? fixedOf(B) : NaN;
    if (a === undefined) maxFixed = Math.max(maxFixed, fixedOf(A));
    if (b === undefined) maxFixed = Math.max(maxFixed, fixedOf(B));
    sys.laws[k] = net.laws[e]!;
  });

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

  const backend = linearBackend(sys);
  let outcome = newtonSolve(sys, p, backend, { tolerance, maxIterations });
  if (outcome.status !== 'converged' && init) {
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
  const pressureByGlobal = new Map<number, number>();
  freeGlobal.forEach((g, i) => pressureByGlobal.set(g, p[i]!));
  for (let r = prunedOrder.length - 1; r >= 0; r--) {
    const { node, via } = prunedOrder[r]!;
    const e = elems[via]!;
    const g = globalNodes[node]!;
    const other = net.elementA[e] === g ? net.elementB[e]! : net.elementA[e]!;
    const po = local.has(other) ? pressureByGlobal.get(other) : fixedOf(other);
    pressureByGlobal.set(g, po !== undefined && Number.isFinite(po) ? po : maxFixed);
  }
  const stateNodes = Int32Array.from(pressureByGlobal.keys());
  const statePressures = Float64Array.from(pressureByGlobal.values());
  const flowByElem = new Map<number, number>();
  for (const e of elems) flowByElem.set(e, 0);
  sysElems.forEach((e, k) => flowByElem.set(e, outcome.flows[k]!));
  const limited: SolvedState['limited'] = [];
  const state = (): SolvedState => ({
    nodes: stateNodes,
    pressurePa: statePressures,
    elements: Int32Array.from(flowByElem.keys()),
    flowKgPerS: Float64Array.from(flowByElem.values()),
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
  const classify =
    net.classifyLimit ??
    ((e: number, limit: LawLimit) => (limit === 'choked' ? 'choked' : limit === 'curve-end' && net.drives[e] ? 'infeasible-demand' : null));
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

function fail(failure: SolveFailure): SolveResult {
  return { ok: false, iterations: 0, failure };
}
