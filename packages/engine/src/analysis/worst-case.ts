/**
 * For every inlet, the worst set of k design operators that contains it:
 * the set of open inlets (tools working) that leaves the least vacuum at its
 * tool.
 *
 * Exact: while the sets per inlet, C(n-1, k-1), stay within a limit (and
 * all k-sets, C(n, k), within a total), every k-set is solved once and
 * answers for each of its members.
 *
 * Greedy-swap, beyond that: partners are ranked by the path they share with
 * the inlet and by how much air they draw alone (shared-path-estimate.ts);
 * over the small pool of partners that no k-1 others beat on both counts, a
 * greedy choice plus swap improvement (or every subset, when few) picks the
 * sets the estimate rates worst, and the best few are solved exactly. A set
 * solved for one inlet answers for its other members too.
 */
import type { SolveFailure } from '../solve/solve-types.js';
import type { InletPoint, WorstCase, WorstCaseMethod } from './analysis-types.js';
import { meetingNode, type PathTree } from './path-tree.js';
import { SetEvaluator } from './set-evaluator.js';
import { estimateLoss, estimateLossOrdered, paretoPool, type InletBasis, type Partner } from './shared-path-estimate.js';

export interface WorstCaseInput {
  evaluator: SetEvaluator;
  tree: PathTree;
  /** Inlet node of each inlet in the universe. */
  nodes: readonly number[];
  /** Each inlet alone (tool working), null where that failed. */
  lone: readonly (InletPoint | null)[];
  /** The estimate's data per inlet (from its lone solve), null where unavailable. */
  bases: readonly (InletBasis | null)[];
  k: number;
  /** Largest C(n-1, k-1) searched exhaustively (default 2,000). */
  exactSetLimit: number;
  /** Largest C(n, k) solved exhaustively (default 5,000). */
  exactTotalLimit: number;
  /** Sets per inlet solved exactly in greedy-swap mode (default 2). */
  verify: number;
  required: readonly (number | null)[];
}

export interface WorstCaseOutput {
  method: WorstCaseMethod;
  results: (WorstCase | null)[];
  /** Sets that could not be solved (each once). */
  failures: { members: number[]; failure: SolveFailure }[];
}

/**
 * Default limits: 2,000 sets per inlet (ENGINEERING.md asks for exact search
 * while the sets are few); 5,000 sets in all, about five seconds of solving
 * at most, so that an editor stays responsive (our choice).
 */
export const DEFAULT_EXACT_SET_LIMIT = 2000;
export const DEFAULT_EXACT_TOTAL_LIMIT = 5000;
export const DEFAULT_VERIFY_SETS = 2;
// Exact swap passes per inlet when the piping has loops, and the partners
// they try (our choice).
const EXACT_SWAP_PASSES = 2;
const LOOP_SWAP_POOL = 12;
// A runner-up set is solved too when its estimate is within this share of the best (our choice).
const CLOSE_CALL = 0.02;
// Enumerate every partner subset of the pool up to this many subsets (our choice).
const ENUMERATE_POOL_LIMIT = 400;

/** C(n, r) as a float, stopping early once it passes `cap`. */
export function binomialUpTo(n: number, r: number, cap: number): number {
  if (r < 0 || r > n) return 0;
  const rr = Math.min(r, n - r);
  let c = 1;
  for (let i = 1; i <= rr; i++) {
    c = (c * (n - rr + i)) / i;
    if (c > cap) return c;
  }
  return Math.round(c);
}

export function worstCases(input: WorstCaseInput): WorstCaseOutput {
  const n = input.nodes.length;
  const k = Math.max(1, Math.min(input.k, n));
  const perInlet = binomialUpTo(n - 1, k - 1, Number.MAX_VALUE);
  const total = binomialUpTo(n, k, Number.MAX_VALUE);
  if (perInlet <= input.exactSetLimit && total <= input.exactTotalLimit) return exactSearch(input, k);
  return greedySwapSearch(input, k);
}

interface Tracker {
  best: (WorstCase | null)[];
  failures: Map<string, { members: number[]; failure: SolveFailure }>;
}

function record(input: WorstCaseInput, t: Tracker, members: number[], method: WorstCaseMethod): void {
  const res = input.evaluator.evaluate(members);
  if (!res.ok) {
    const key = SetEvaluator.key(members);
    if (!t.failures.has(key)) t.failures.set(key, { members: [...members], failure: res.failure });
    return;
  }
  res.points.forEach((p, idx) => {
    // Every member learns from the set, not only the inlet it was solved for.
    const i = members[idx]!;
    const cur = t.best[i];
    if (!cur || p.toolVacuumPa < cur.toolVacuumPa) {
      t.best[i] = {
        openInlets: [input.evaluator.names[i]!, ...members.filter((j) => j !== i).map((j) => input.evaluator.names[j]!)],
        method,
        setsEvaluated: cur?.setsEvaluated ?? 0,
        inletVacuumPa: p.inletVacuumPa,
        toolVacuumPa: p.toolVacuumPa,
        flowStdM3PerS: p.flowStdM3PerS,
        toolAirPowerW: p.toolAirPowerW,
        hoseLossPa: p.hoseLossPa,
        requiredToolVacuumPa: input.required[i] ?? null,
      };
      if (p.limited) t.best[i]!.limited = p.limited;
    }
  });
}

function exactSearch(input: WorstCaseInput, k: number): WorstCaseOutput {
  const n = input.nodes.length;
  const t: Tracker = { best: new Array(n).fill(null), failures: new Map() };
  const counts = new Array<number>(n).fill(0);
  // Every k-subset in lexicographic order (neighbours differ little: good warm starts).
  const idx = Array.from({ length: k }, (_, i) => i);
  for (;;) {
    const members = [...idx];
    record(input, t, members, 'exact');
    for (const i of members) counts[i]!++;
    let pos = k - 1;
    while (pos >= 0 && idx[pos] === n - k + pos) pos--;
    if (pos < 0) break;
    idx[pos]!++;
    for (let j = pos + 1; j < k; j++) idx[j] = idx[j - 1]! + 1;
  }
  t.best.forEach((b, i) => {
    if (b) b.setsEvaluated = counts[i]!;
  });
  return { method: 'exact', results: t.best, failures: [...t.failures.values()] };
}

function greedySwapSearch(input: WorstCaseInput, k: number): WorstCaseOutput {
  const n = input.nodes.length;
  const r = k - 1;
  const { tree } = input;
  const q = input.lone.map((p) => (p ? Math.max(0, p.massFlowKgPerS) : 0));
  // Inlets at each node, and the r strongest (by lone flow) in each subtree.
  const atNode = new Map<number, number[]>();
  input.nodes.forEach((node, i) => {
    if (node < 0) return;
    const list = atNode.get(node) ?? [];
    list.push(i);
    atNode.set(node, list);
  });
  const byFlow = (a: number, b: number) => q[b]! - q[a]! || a - b;
  const top = new Map<number, number[]>();
  for (let s = tree.order.length - 1; s >= 0; s--) {
    const v = tree.order[s]!;
    const list = [...(atNode.get(v) ?? [])];
    for (const c of tree.children[v]!) list.push(...(top.get(c) ?? []));
    list.sort(byFlow);
    top.set(v, list.slice(0, r));
  }

  const t: Tracker = { best: new Array(n).fill(null), failures: new Map() };
  for (let i = 0; i < n; i++) {
    const candidates = poolFor(input, i, r, atNode, top, q);
    const sets = rankSets(input.bases[i] ?? null, candidates, r, Math.max(1, input.verify));
    let evaluated = 0;
    for (const partners of sets) {
      record(input, t, [i, ...partners], 'greedy-swap');
      evaluated++;
    }
    if (!tree.exact && t.best[i]) evaluated += exactSwaps(input, t, i, widerPool(input, i, candidates, q));
    if (t.best[i]) t.best[i]!.setsEvaluated = evaluated;
  }
  return { method: 'greedy-swap', results: t.best, failures: [...t.failures.values()] };
}

/**
 * With loops a partner may share i's air path round the loop, which the
 * spanning tree does not see: add the strongest others by a rough score
 * (shared depth + 1) x flow, up to LOOP_SWAP_POOL.
 */
function widerPool(input: WorstCaseInput, i: number, pool: readonly Partner[], q: readonly number[]): Partner[] {
  const out = [...pool];
  const taken = new Set(pool.map((p) => p.index));
  const others: Partner[] = [];
  for (let j = 0; j < input.nodes.length; j++) {
    if (j === i || taken.has(j)) continue;
    const w = meetingNode(input.tree, input.nodes[i]!, input.nodes[j]!);
    others.push({ index: j, shared: w >= 0 ? input.tree.depth[w]! : -1, q: q[j]! });
  }
  others.sort((a, b) => (b.shared + 2) * b.q - (a.shared + 2) * a.q || a.index - b.index);
  for (const o of others) {
    if (out.length >= LOOP_SWAP_POOL) break;
    out.push(o);
  }
  return out;
}

/**
 * With loops the estimate (on a spanning tree) is rougher: improve the best
 * set by exact swaps with pool members, first improvement, at most
 * EXACT_SWAP_PASSES passes. Returns the sets solved.
 */
function exactSwaps(input: WorstCaseInput, t: Tracker, i: number, pool: readonly Partner[]): number {
  const index = new Map(input.evaluator.names.map((n, j) => [n, j]));
  let solved = 0;
  for (let pass = 0; pass < EXACT_SWAP_PASSES; pass++) {
    const best = t.best[i]!;
    const members = best.openInlets.map((n) => index.get(n)!);
    let improved = false;
    for (let s = 1; s < members.length && !improved; s++) {
      for (const c of pool) {
        if (members.includes(c.index)) continue;
        const trial = [...members];
        trial[s] = c.index;
        const before = t.best[i]!.toolVacuumPa;
        record(input, t, trial, 'greedy-swap');
        solved++;
        if (t.best[i]!.toolVacuumPa < before) {
          improved = true;
          break;
        }
      }
    }
    if (!improved) break;
  }
  return solved;
}

/** Partners of inlet i that may belong to its worst set: the Pareto pool, filled up when short. */
function poolFor(
  input: WorstCaseInput,
  i: number,
  r: number,
  atNode: Map<number, number[]>,
  top: Map<number, number[]>,
  q: readonly number[],
): Partner[] {
  const { tree } = input;
  const out: Partner[] = [];
  const u = input.nodes[i]!;
  let child = -1;
  let w = u;
  while (w >= 0) {
    const shared = tree.depth[w]!;
    const list: number[] = [];
    for (const j of atNode.get(w) ?? []) if (j !== i) list.push(j);
    for (const c of tree.children[w]!) if (c !== child) list.push(...(top.get(c) ?? []));
    list.sort((a, b) => q[b]! - q[a]! || a - b);
    for (const j of list.slice(0, r)) out.push({ index: j, shared, q: q[j]! });
    child = w;
    w = tree.parentNode[w]!;
  }
  const pool = paretoPool(out, r);
  if (pool.length < r) {
    // Too few partners share anything with i: any others make up the set.
    const taken = new Set(pool.map((p) => p.index));
    for (let j = 0; j < input.nodes.length && pool.length < r; j++) {
      if (j !== i && !taken.has(j)) pool.push({ index: j, shared: -1, q: q[j]! });
    }
  }
  return pool;
}

/** The partner sets the estimate rates worst, best first (at most `want`). */
function rankSets(basis: InletBasis | null, pool: Partner[], r: number, want: number): number[][] {
  if (pool.length <= r) return [pool.map((p) => p.index)];
  // Without a basis (the inlet's lone solve failed) rank by shared depth and flow alone.
  const score = basis
    ? (set: Partner[]) => estimateLoss(basis, set)
    : (set: Partner[]) => set.reduce((s, p) => s + (p.shared + 1) * p.q, 0);
  const seen = new Map<number | string, { set: Partner[]; f: number }>();
  // A set's key: its size, then its inlet indices in ascending order, as
  // digits of a number while that stays exact, else as text.
  let base = 2;
  for (const p of pool) base = Math.max(base, p.index + 2);
  const numericKeys = (r + 1) * Math.log2(base) < 52;
  const sorted: number[] = [];
  const keyOf = (set: Partner[]): number | string => {
    sorted.length = 0;
    for (const p of set) {
      // Insertion: sets are a handful of partners.
      let at = sorted.length;
      sorted.push(p.index);
      while (at > 0 && sorted[at - 1]! > p.index) {
        sorted[at] = sorted[at - 1]!;
        at--;
      }
      sorted[at] = p.index;
    }
    if (!numericKeys) return sorted.join(',');
    let key = set.length;
    for (const i of sorted) key = key * base + i + 1;
    return key;
  };
  const note = (set: Partner[]): number => {
    const key = keyOf(set);
    let hit = seen.get(key);
    if (!hit) {
      hit = { set: [...set], f: score(set) };
      seen.set(key, hit);
    }
    return hit.f;
  };
  if (binomialUpTo(pool.length, r, ENUMERATE_POOL_LIMIT + 1) <= ENUMERATE_POOL_LIMIT) {
    return enumerateSets(basis, pool, r, want);
  } else {
    // Greedy: add the partner that raises the estimate most.
    const chosen: Partner[] = [];
    while (chosen.length < r) {
      let best: Partner | null = null;
      let bestF = -Infinity;
      for (const c of pool) {
        if (chosen.includes(c)) continue;
        const f = note([...chosen, c]);
        if (f > bestF) {
          bestF = f;
          best = c;
        }
      }
      chosen.push(best!);
    }
    // Swap improvement: replace a member by an outsider while the estimate rises.
    let current = note(chosen);
    let improved = true;
    while (improved) {
      improved = false;
      for (let s = 0; s < chosen.length; s++) {
        for (const c of pool) {
          if (chosen.includes(c)) continue;
          const trial = [...chosen];
          trial[s] = c;
          const f = note(trial);
          if (f > current * (1 + 1e-12)) {
            chosen.splice(0, chosen.length, ...trial);
            current = f;
            improved = true;
          }
        }
      }
    }
  }
  // The `want` best full sets, an earlier one first on a tie (as a stable sort would).
  const ranked: { set: Partner[]; f: number }[] = [];
  for (const x of seen.values()) {
    if (x.set.length !== r) continue;
    let at = ranked.length;
    while (at > 0 && ranked[at - 1]!.f < x.f) at--;
    if (at >= want) continue;
    ranked.splice(at, 0, x);
    if (ranked.length > want) ranked.pop();
  }
  // Runners-up are solved only when the estimate rates them close to the best.
  const top = ranked[0]?.f ?? 0;
  return ranked.filter((x, idx) => idx === 0 || x.f >= (1 - CLOSE_CALL) * top).map((x) => x.set.map((p) => p.index));
}

/**
 * rankSets over every r-subset of the pool, without keys or copies: the
 * subsets are distinct by construction (the pool holds each partner once),
 * and the pool is ordered by shared depth, deepest first, so each subset
 * taken in pool order is already in the order estimateLoss sorts into.
 * Keeps the `want` best with the same ties as a stable sort of the
 * enumeration order (an earlier subset wins a tie).
 */
function enumerateSets(basis: InletBasis | null, pool: Partner[], r: number, want: number): number[][] {
  const n = pool.length;
  const shared = Float64Array.from(pool, (p) => p.shared);
  const q = Float64Array.from(pool, (p) => p.q);
  const ordered = shared.every((x, j) => j === 0 || x <= shared[j - 1]!);
  const subset: Partner[] = new Array(r);
  const score = (idx: Int32Array): number => {
    if (!basis) {
      let f = 0;
      for (let j = 0; j < r; j++) f += (shared[idx[j]!]! + 1) * q[idx[j]!]!;
      return f;
    }
    if (!ordered) {
      for (let j = 0; j < r; j++) subset[j] = pool[idx[j]!]!;
      return estimateLoss(basis, subset);
    }
    return estimateLossOrdered(basis, shared, q, idx, r);
  };
  const bestF: number[] = [];
  const bestSet: Int32Array[] = [];
  const idx = new Int32Array(r);
  for (let j = 0; j < r; j++) idx[j] = j;
  for (;;) {
    const f = score(idx);
    // Insert after every kept subset with f >= this one (stable order).
    let at = bestF.length;
    while (at > 0 && bestF[at - 1]! < f) at--;
    if (at < want) {
      bestF.splice(at, 0, f);
      bestSet.splice(at, 0, idx.slice());
      if (bestF.length > want) {
        bestF.pop();
        bestSet.pop();
      }
    }
    let pos = r - 1;
    while (pos >= 0 && idx[pos] === n - r + pos) pos--;
    if (pos < 0) break;
    idx[pos]!++;
    for (let j = pos + 1; j < r; j++) idx[j] = idx[j - 1]! + 1;
  }
  const top = bestF[0] ?? 0;
  const out: number[][] = [];
  bestSet.forEach((set, k) => {
    if (k === 0 || bestF[k]! >= (1 - CLOSE_CALL) * top) out.push(Array.from(set, (j) => pool[j]!.index));
  });
  return out;
}
