/**
 * A quick estimate of how much vacuum a set of partner inlets takes from an
 * inlet, to rank partner sets before solving the best few exactly.
 *
 * Partners steal vacuum from inlet i only on the path they share with it:
 * from where their paths meet up to the producer. With i alone open (flow
 * m_i), each element t on i's path loses dp_t; at flow m_i + Q it loses
 * about dp_t ((m_i + Q)/m_i)^2 (turbulent square law), and the producer's
 * vacuum falls by Q / (dm/dp_inlet) (its curve's slope). Partner j adds its
 * own lone flow q_j to every element it shares with i. The estimate
 *
 *   F(P) = Q_0 / (dm/dp) + sum_t c_t (2 m_i Q_t + Q_t^2),  c_t = dp_t / m_i^2,
 *   Q_t  = sum of q_j over partners j that share element t,
 *
 * grows with every partner's flow and with how deep it shares i's path, so
 * the worst set is among the partners not beaten on both counts by k-1
 * others (a Pareto pool), which is small. (The ranking idea only; the chosen
 * sets are then solved exactly.)
 */
import type { CaseView } from './case-runner.js';
import type { PathTree } from './path-tree.js';
import type { NetworkGraph } from '../network/graph.js';

export interface InletBasis {
  /** Lone mass flow of the inlet, kg/s. */
  m: number;
  /** Prefix sums of c_t over path positions 1..D (index t), Pa/(kg/s)^2. */
  prefixC: Float64Array;
  /** Producer's vacuum fall per unit of extra flow, Pa/(kg/s). */
  producerSlope: number;
  depth: number;
}

/** The estimate's data for one inlet, from its lone solve. */
export function inletBasis(graph: NetworkGraph, tree: PathTree, node: number, path: readonly number[], m: number, view: CaseView): InletBasis | null {
  const depth = tree.depth[node]!;
  if (depth < 0 || !(m > 0)) return null;
  const prefixC = new Float64Array(depth + 1);
  const c = new Float64Array(depth + 1);
  let producerDerivative = 0;
  for (let idx = 0; idx < path.length; idx++) {
    const e = path[idx]!;
    const a = graph.net.elementA[e]!;
    const b = graph.net.elementB[e]!;
    const pa = view.pressureAt(a) ?? graph.net.fixedPressurePa[a]!;
    const pb = view.pressureAt(b) ?? graph.net.fixedPressurePa[b]!;
    if (graph.net.drives[e]) {
      const law = graph.net.laws[e];
      if (law && Number.isFinite(pa) && Number.isFinite(pb)) producerDerivative += Math.max(0, law.flow(pa, pb).dFlowDPa);
      continue;
    }
    const t = depth - idx; // the deepest element sits at position `depth`
    if (t >= 1 && t <= depth && Number.isFinite(pa) && Number.isFinite(pb)) c[t] = Math.abs(pa - pb) / (m * m);
  }
  for (let t = 1; t <= depth; t++) prefixC[t] = prefixC[t - 1]! + c[t]!;
  return { m, prefixC, producerSlope: producerDerivative > 0 ? 1 / producerDerivative : 0, depth };
}

export interface Partner {
  /** Index in the inlet universe. */
  index: number;
  /** Deepest shared path position (0: the producer only; -1: nothing shared). */
  shared: number;
  /** Lone flow, kg/s. */
  q: number;
}

// Scratch for estimateLoss: partners in the order it sums them.
let orderShared = new Float64Array(16);
let orderQ = new Float64Array(16);

/**
 * F(P) for a set of partners (see the file comment): partners sharing
 * nothing are left out, the rest taken deepest first (ties in the order
 * given), without allocating.
 */
export function estimateLoss(basis: InletBasis, partners: readonly Partner[]): number {
  if (partners.length > orderShared.length) {
    orderShared = new Float64Array(2 * partners.length);
    orderQ = new Float64Array(2 * partners.length);
  }
  // Stable insertion by shared depth, deepest first.
  let count = 0;
  for (const p of partners) {
    if (!(p.shared >= 0)) continue;
    let at = count;
    while (at > 0 && orderShared[at - 1]! < p.shared) {
      orderShared[at] = orderShared[at - 1]!;
      orderQ[at] = orderQ[at - 1]!;
      at--;
    }
    orderShared[at] = p.shared;
    orderQ[at] = p.q;
    count++;
  }
  let f = 0;
  let q = 0;
  for (let r = 0; r < count; r++) {
    q += orderQ[r]!;
    const hi = Math.min(orderShared[r]!, basis.depth);
    const lo = r + 1 < count ? Math.min(orderShared[r + 1]!, basis.depth) : 0;
    if (hi > lo) f += (2 * basis.m * q + q * q) * (basis.prefixC[hi]! - basis.prefixC[lo]!);
  }
  return f + q * basis.producerSlope;
}

/**
 * estimateLoss for the partners idx[0..r) of a pool given as arrays of
 * shared depth and flow, with idx already in non-increasing shared depth
 * (the same sum, term for term, without sorting or allocating).
 */
export function estimateLossOrdered(basis: InletBasis, shared: Float64Array, q: Float64Array, idx: Int32Array, r: number): number {
  let count = 0;
  while (count < r && shared[idx[count]!]! >= 0) count++; // partners sharing nothing come last
  let f = 0;
  let total = 0;
  for (let j = 0; j < count; j++) {
    total += q[idx[j]!]!;
    const hi = Math.min(shared[idx[j]!]!, basis.depth);
    const lo = j + 1 < count ? Math.min(shared[idx[j + 1]!]!, basis.depth) : 0;
    if (hi > lo) f += (2 * basis.m * total + total * total) * (basis.prefixC[hi]! - basis.prefixC[lo]!);
  }
  return f + total * basis.producerSlope;
}

/** Candidates that k-1 others do not beat on both shared depth and flow. */
export function paretoPool(candidates: readonly Partner[], partnersNeeded: number): Partner[] {
  const sorted = [...candidates].sort((x, y) => y.shared - x.shared || y.q - x.q || x.index - y.index);
  const out: Partner[] = [];
  for (let c = 0; c < sorted.length; c++) {
    let beaten = 0;
    for (let d = 0; d < c && beaten < partnersNeeded; d++) {
      if (sorted[d]!.shared >= sorted[c]!.shared && sorted[d]!.q >= sorted[c]!.q) beaten++;
    }
    if (beaten < partnersNeeded) out.push(sorted[c]!);
  }
  return out;
}
