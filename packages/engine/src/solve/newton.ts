/**
 * Damped Newton-Raphson on node pressures (the global gradient idea of
 * Todini and Pilati 1988, here with pressures as the only unknowns since
 * every element law gives flow from its end pressures).
 *
 * Unknowns: absolute pressure at each free node. Residual: net mass inflow
 * at each free node (kg/s). Jacobian: analytic, assembled from each law's
 * d(flow)/d(pa), d(flow)/d(pb). Step: solve J dp = -F, shorten it so that no
 * pressure falls below a fraction of its value, then backtrack on the
 * residual norm (Armijo condition; Dennis and Schnabel, Numerical Methods for
 * Unconstrained Optimization and Nonlinear Equations, 1983, sec. 6.3).
 * Converged when every node's imbalance is below `tolerance` x total flow.
 */
import type { PortFlow, TwoPortLaw } from '../elements/two-port-law.js';
import type { LawLimit } from './solve-types.js';
import { analyseLU, factorLU, offIndex, solveLU, type SymbolicLU } from './sparse-lu.js';
import { forestOrder, solveForest, type ForestOrder } from './tree-elimination.js';

/** A compact system of n free nodes; element ends are a free node index or -1 (then fixed). */
export interface LocalSystem {
  n: number;
  la: Int32Array;
  lb: Int32Array;
  /** Fixed pressure at an end that is not free, Pa. */
  fa: Float64Array;
  fb: Float64Array;
  laws: TwoPortLaw[];
}

export interface NewtonOptions {
  tolerance: number;
  maxIterations: number;
}

export type NewtonOutcome =
  | { status: 'converged'; iterations: number; flows: Float64Array; limits: (LawLimit | undefined)[]; imbalanceFraction: number; evaluations: number }
  | {
      status: 'singular' | 'stalled' | 'max-iterations' | 'bad-law';
      iterations: number;
      flows: Float64Array;
      /** The limit each law reported at the last point evaluated. */
      limits: (LawLimit | undefined)[];
      imbalanceFraction: number;
      evaluations: number;
      /** Local element index whose law returned a non-finite flow, for 'bad-law'. */
      element?: number;
    };

// No pressure drops below this fraction of its value in one step (our choice:
// keeps pressures positive while allowing a 5x drop per step).
const MIN_PRESSURE_RATIO_PER_STEP = 0.2;
// Armijo sufficient-decrease constant (Dennis and Schnabel 1983: 1e-4).
const ARMIJO_C = 1e-4;
// A step that leaves more than this share of |F|^2 (half the residual norm)
// is poor progress: try the interpolated step too (our choice).
const POOR_PROGRESS = 0.25;
// Backtracking limits (our choice): at most 30 halvings.
const MAX_BACKTRACKS = 30;
// A node's imbalance below this many units of rounding of its pressure times
// its total conductance cannot be reduced by any step (our choice, with a
// margin over the few roundings in one law evaluation).
const PRECISION_FLOOR_ULPS = 64;
// Conductance used when a law returns an infinite derivative (e.g. a
// square-root law at exactly zero flow), kg/(s Pa): large, finite (our choice).
const FALLBACK_CONDUCTANCE = 1e-2;

/** The linear back-end for one sparsity pattern: a forest elimination or a sparse LU. */
interface LinearBackend {
  valueCount: number;
  /** Slots of J[a][a], J[a][b], J[b][a], J[b][b] per element (-1 where an end is fixed). */
  sAA: Int32Array;
  sAB: Int32Array;
  sBA: Int32Array;
  sBB: Int32Array;
  solve(values: Float64Array, rhs: Float64Array): boolean;
}

/** Builds the back-end for the pattern of the system's free-free elements. */
export function linearBackend(sys: LocalSystem): LinearBackend {
  const { n, la, lb } = sys;
  const m = la.length;
  const sAA = new Int32Array(m).fill(-1);
  const sAB = new Int32Array(m).fill(-1);
  const sBA = new Int32Array(m).fill(-1);
  const sBB = new Int32Array(m).fill(-1);
  for (let e = 0; e < m; e++) {
    if (la[e]! >= 0) sAA[e] = la[e]!;
    if (lb[e]! >= 0) sBB[e] = lb[e]!;
  }
  // A forest of free-free elements (the usual tree case) needs no merging:
  // parallel elements would close a loop, so the forest test rules them out.
  const directP: number[] = [];
  const directQ: number[] = [];
  const directOf = new Int32Array(m).fill(-1);
  for (let e = 0; e < m; e++) {
    const a = la[e]!;
    const b = lb[e]!;
    if (a < 0 || b < 0 || a === b) continue;
    directOf[e] = directP.length;
    directP.push(a);
    directQ.push(b);
  }
  const direct = forestOrder(n, directP, directQ);
  if (direct) return forestBackend(sys, direct, directOf, sAA, sAB, sBA, sBB);
  // Merge parallel elements into one edge.
  const edgeOf = new Int32Array(m).fill(-1);
  const edgeP: number[] = [];
  const edgeQ: number[] = [];
  const key = new Map<number, number>();
  for (let e = 0; e < m; e++) {
    const a = la[e]!;
    const b = lb[e]!;
    if (a < 0 || b < 0 || a === b) continue;
    const lo = a < b ? a : b;
    const hi = a < b ? b : a;
    const k = lo * n + hi;
    let id = key.get(k);
    if (id === undefined) {
      id = edgeP.length;
      key.set(k, id);
      edgeP.push(lo);
      edgeQ.push(hi);
    }
    edgeOf[e] = id;
  }
  const forest: ForestOrder | null = forestOrder(n, edgeP, edgeQ);
  if (forest) return forestBackend(sys, forest, edgeOf, sAA, sAB, sBA, sBB);
  const sym: SymbolicLU = analyseLU(n, edgeP, edgeQ);
  for (let e = 0; e < m; e++) {
    const id = edgeOf[e]!;
    if (id < 0) continue;
    sAB[e] = offIndex(sym, id, la[e]!);
    sBA[e] = offIndex(sym, id, lb[e]!);
  }
  return {
    valueCount: sym.valueCount,
    sAA,
    sAB,
    sBA,
    sBB,
    solve: (values, rhs) => {
      if (!factorLU(sym, values)) return false;
      solveLU(sym, values, rhs);
      return true;
    },
  };
}

/** The back-end of a forest pattern: slots of each element's off-diagonal entries by child and parent. */
function forestBackend(
  sys: LocalSystem,
  forest: ForestOrder,
  edgeOf: Int32Array,
  sAA: Int32Array,
  sAB: Int32Array,
  sBA: Int32Array,
  sBB: Int32Array,
): LinearBackend {
  const { n, la, lb } = sys;
  for (let e = 0; e < la.length; e++) {
    if (edgeOf[e]! < 0) continue;
    const a = la[e]!;
    const b = lb[e]!;
    if (forest.parent[a] === b) {
      sAB[e] = n + a; // J[child][parent]
      sBA[e] = 2 * n + a; // J[parent][child]
    } else {
      sAB[e] = 2 * n + b;
      sBA[e] = n + b;
    }
  }
  return {
    valueCount: 3 * n,
    sAA,
    sAB,
    sBA,
    sBB,
    solve: (values, rhs) => solveForest(forest, values, rhs),
  };
}

interface Evaluation {
  /** Sum of squared residuals. */
  norm2: number;
  maxImbalance: number;
  /** Total flow: half the sum of |flow| over elements with a fixed end. */
  total: number;
  /** Local element with a non-finite flow, or -1. */
  badElement: number;
  /**
   * Every node is within tolerance of the total flow, or within what the
   * rounding of its pressure can resolve (tiny drops across large
   * conductances): no further step can do better.
   */
  withinFloor: boolean;
}

/**
 * Runs damped Newton from `p` (free-node pressures, updated in place).
 * Never throws; the outcome says whether it converged.
 */
export function newtonSolve(sys: LocalSystem, p: Float64Array, backend: LinearBackend, opts: NewtonOptions): NewtonOutcome {
  const { n, la, lb, fa, fb, laws } = sys;
  const m = la.length;
  let F = new Float64Array(n);
  let values = new Float64Array(backend.valueCount);
  let flows = new Float64Array(m);
  const trialP = new Float64Array(n);
  let trialF = new Float64Array(n);
  let trialValues = new Float64Array(backend.valueCount);
  let trialFlows = new Float64Array(m);
  const step = new Float64Array(n);
  const { sAA, sAB, sBA, sBB } = backend;
  let evaluations = 0;
  const scratch: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0, limited: undefined };

  let limits: (LawLimit | undefined)[] = new Array(m);
  let trialLimits: (LawLimit | undefined)[] = new Array(m);
  const evaluate = (pp: Float64Array, out: Float64Array, q: Float64Array, jac: Float64Array | null, lim: (LawLimit | undefined)[]): Evaluation => {
    out.fill(0);
    if (jac) jac.fill(0);
    let fixedSum = 0;
    let badElement = -1;
    evaluations += m;
    for (let e = 0; e < m; e++) {
      const a = la[e]!;
      const b = lb[e]!;
      const pa = a >= 0 ? pp[a]! : fa[e]!;
      const pb = b >= 0 ? pp[b]! : fb[e]!;
      const law = laws[e]!;
      let r: PortFlow;
      if (law.flowInto) {
        law.flowInto(pa, pb, scratch);
        r = scratch;
      } else {
        r = law.flow(pa, pb);
      }
      lim[e] = r.limited;
      const flow = r.massFlowKgPerS;
      if (!Number.isFinite(flow)) {
        badElement = e;
        q[e] = 0;
        continue;
      }
      q[e] = flow;
      if (a >= 0) out[a] = out[a]! - flow;
      if (b >= 0) out[b] = out[b]! + flow;
      if (a < 0 || b < 0) fixedSum += Math.abs(flow);
      if (jac) {
        let dA = r.dFlowDPa;
        let dB = r.dFlowDPb;
        if (!Number.isFinite(dA)) dA = FALLBACK_CONDUCTANCE;
        if (!Number.isFinite(dB)) dB = -FALLBACK_CONDUCTANCE;
        // Residual at a: -flow; at b: +flow.
        if (a >= 0) {
          jac[sAA[e]!] = jac[sAA[e]!]! - dA;
          if (b >= 0) jac[sAB[e]!] = jac[sAB[e]!]! - dB;
        }
        if (b >= 0) {
          jac[sBB[e]!] = jac[sBB[e]!]! + dB;
          if (a >= 0) jac[sBA[e]!] = jac[sBA[e]!]! + dA;
        }
      }
    }
    let norm2 = 0;
    let maxImbalance = 0;
    let withinFloor = true;
    const total = fixedSum / 2;
    for (let i = 0; i < n; i++) {
      const f = out[i]!;
      norm2 += f * f;
      const af = Math.abs(f);
      if (af > maxImbalance) maxImbalance = af;
      // The imbalance that rounding of this node's pressure alone can cause.
      if (jac && af > opts.tolerance * total && af > PRECISION_FLOOR_ULPS * Number.EPSILON * pp[i]! * Math.abs(jac[i]!)) {
        withinFloor = false;
      }
    }
    return { norm2, maxImbalance, total, badElement, withinFloor: jac !== null && withinFloor };
  };

  const fraction = (ev: Evaluation): number => (ev.total > 0 ? ev.maxImbalance / ev.total : ev.maxImbalance > 0 ? Infinity : 0);

  let ev = evaluate(p, F, flows, values, limits);
  let iterations = 0;
  for (;;) {
    if (ev.badElement >= 0) {
      return { status: 'bad-law', iterations, flows, limits, imbalanceFraction: fraction(ev), evaluations, element: ev.badElement };
    }
    // Converged: imbalance below tolerance of total flow (or nothing flows and
    // nothing is out of balance), node by node down to the rounding floor.
    if (ev.maxImbalance <= opts.tolerance * ev.total || ev.maxImbalance === 0 || ev.withinFloor) {
      return { status: 'converged', iterations, flows, limits, imbalanceFraction: fraction(ev), evaluations };
    }
    if (iterations >= opts.maxIterations) {
      return { status: 'max-iterations', iterations, flows, limits, imbalanceFraction: fraction(ev), evaluations };
    }
    iterations++;
    for (let i = 0; i < n; i++) step[i] = -F[i]!;
    if (!backend.solve(values, step)) {
      return { status: 'singular', iterations, flows, limits, imbalanceFraction: fraction(ev), evaluations };
    }
    // Fraction to the boundary: keep every pressure above a share of its value.
    let alpha = 1;
    for (let i = 0; i < n; i++) {
      const d = step[i]!;
      if (!Number.isFinite(d)) return { status: 'singular', iterations, flows, limits, imbalanceFraction: fraction(ev), evaluations };
      if (d < 0) {
        const limit = ((1 - MIN_PRESSURE_RATIO_PER_STEP) * p[i]!) / -d;
        if (limit < alpha) alpha = limit;
      }
    }
    let accepted = false;
    let trialEv: Evaluation | null = null;
    for (let bt = 0; bt <= MAX_BACKTRACKS; bt++) {
      for (let i = 0; i < n; i++) trialP[i] = p[i]! + alpha * step[i]!;
      trialEv = evaluate(trialP, trialF, trialFlows, trialValues, trialLimits);
      if (trialEv.badElement < 0 && trialEv.norm2 <= (1 - 2 * ARMIJO_C * alpha) * ev.norm2) {
        accepted = true;
        break;
      }
      alpha *= 0.5;
    }
    if (!accepted) {
      // No decrease along the Newton direction even for tiny steps: stuck at a
      // kink or a limit of some law.
      return { status: 'stalled', iterations, flows, limits, imbalanceFraction: fraction(ev), evaluations };
    }
    // Accepted but little progress: Newton may be overshooting a square-root
    // law near zero flow (it then jumps to the mirror point). Try the minimum
    // of the quadratic through phi(0), phi'(0) = -2 phi(0) and phi(alpha),
    // phi = |F|^2 (Dennis and Schnabel 1983, sec. 6.3.2), and keep the better.
    if (trialEv!.norm2 > POOR_PROGRESS * ev.norm2) {
      const phi0 = ev.norm2;
      const phi1 = trialEv!.norm2;
      const best = alpha * (phi0 / (phi0 + phi1));
      if (best < 0.9 * alpha && best > 0) {
        const keepP = Float64Array.from(trialP);
        for (let i = 0; i < n; i++) trialP[i] = p[i]! + best * step[i]!;
        const altF = new Float64Array(n);
        const altFlows = new Float64Array(m);
        const altValues = new Float64Array(backend.valueCount);
        const altLimits: (LawLimit | undefined)[] = new Array(m);
        const alt = evaluate(trialP, altF, altFlows, altValues, altLimits);
        if (alt.badElement < 0 && alt.norm2 < trialEv!.norm2) {
          trialEv = alt;
          trialF = altF;
          trialFlows = altFlows;
          trialValues = altValues;
          trialLimits = altLimits;
        } else {
          trialP.set(keepP);
        }
      }
    }
    // Take the trial point; its residual and Jacobian are already assembled.
    p.set(trialP);
    [F, trialF] = [trialF, F];
    [flows, trialFlows] = [trialFlows, flows];
    [values, trialValues] = [trialValues, values];
    [limits, trialLimits] = [trialLimits, limits];
    ev = trialEv!;
  }
}
