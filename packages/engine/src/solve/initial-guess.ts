/**
 * Starting pressures for Newton.
 *
 * Nodes with a given guess (the previous solution) keep it. Others take the
 * pressure of the nearest guessed node (breadth-first through the network);
 * a part with no guess at all starts at a modest vacuum below the highest
 * fixed pressure. Then every unguessed node that hangs between a fixed
 * pressure and one other node (a hose end between room and inlet valve)
 * gets the pressure that balances its two elements, so a newly opened tool
 * starts with a sensible flow instead of none or far too much; and when new
 * series nodes join it to a guessed node (a newly opened branch), they are
 * raised so that each element passes that flow. Roots by regula falsi.
 */
import type { LocalSystem } from './newton.js';

// Start at 10 % vacuum below the highest fixed pressure (our choice: the
// middle of the range of ordinary central vacuum systems, 10-50 kPa).
const START_VACUUM_FRACTION = 0.1;
// Root-finding steps for a starting guess (our choice; usually 5-10 suffice).
const BISECTION_STEPS = 40;

/**
 * Fills `p` (length n) in place. `known[i]` = 1 where p[i] holds a guess.
 * Returns the number of law evaluations it spent.
 */
export function fillInitialPressures(sys: LocalSystem, p: Float64Array, known: Uint8Array, maxFixedPa: number): number {
  const count = { n: 0 };
  const { n, la, lb, fa, fb } = sys;
  const m = la.length;
  const start = maxFixedPa > 0 ? maxFixedPa * (1 - START_VACUUM_FRACTION) : 1;
  // Incidence (CSR) of free nodes.
  const deg = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) {
    if (la[e]! >= 0) deg[la[e]! + 1]!++;
    if (lb[e]! >= 0) deg[lb[e]! + 1]!++;
  }
  for (let i = 0; i < n; i++) deg[i + 1] = deg[i + 1]! + deg[i]!;
  const pos = deg.slice(0, n);
  const inc = new Int32Array(deg[n]!);
  for (let e = 0; e < m; e++) {
    if (la[e]! >= 0) inc[pos[la[e]!]!++] = e;
    if (lb[e]! >= 0) inc[pos[lb[e]!]!++] = e;
  }
  const has = Uint8Array.from(known);
  const queue: number[] = [];
  for (let i = 0; i < n; i++) if (has[i]) queue.push(i);
  const spread = () => {
    for (let qi = 0; qi < queue.length; qi++) {
      const v = queue[qi]!;
      for (let j = deg[v]!; j < deg[v + 1]!; j++) {
        const e = inc[j]!;
        const u = la[e] === v ? lb[e]! : la[e]!;
        if (u >= 0 && !has[u]) {
          has[u] = 1;
          p[u] = p[v]!;
          queue.push(u);
        }
      }
    }
  };
  spread();
  for (let i = 0; i < n; i++) {
    if (!has[i]) {
      has[i] = 1;
      p[i] = start;
      queue.length = 0;
      queue.push(i);
      spread();
    }
  }
  // Hanging nodes: one element to a fixed pressure, one to another node.
  // Balance each; then, when a chain of new series nodes joins it to a
  // guessed node, raise the chain so that each element passes that flow,
  // and balance the hanging node again.
  for (let v = 0; v < n; v++) {
    if (known[v] || deg[v + 1]! - deg[v]! !== 2) continue;
    const e1 = inc[deg[v]!]!;
    const e2 = inc[deg[v]! + 1]!;
    const fixedEnd = (e: number) => (la[e] === v ? (lb[e]! < 0 ? fb[e]! : NaN) : la[e]! < 0 ? fa[e]! : NaN);
    const otherNode = (e: number, from: number) => (la[e] === from ? lb[e]! : la[e]!);
    let eFixed = -1;
    let eOther = -1;
    if (Number.isFinite(fixedEnd(e1)) && otherNode(e2, v) >= 0) [eFixed, eOther] = [e1, e2];
    else if (Number.isFinite(fixedEnd(e2)) && otherNode(e1, v) >= 0) [eFixed, eOther] = [e2, e1];
    if (eFixed < 0) continue;
    const flowIn = balanceHanging(sys, p, v, eFixed, eOther, count);
    if (flowIn === null || !(Math.abs(flowIn) > 0)) continue;
    // The chain of new series nodes from v's neighbour to a guessed node.
    const chain: { node: number; toward: number }[] = [];
    let prevElem = eOther;
    let node = otherNode(eOther, v);
    while (node >= 0 && !known[node] && deg[node + 1]! - deg[node]! === 2 && chain.length < n) {
      const a = inc[deg[node]!]!;
      const b = inc[deg[node]! + 1]!;
      const next = a === prevElem ? b : a;
      chain.push({ node, toward: next });
      prevElem = next;
      node = otherNode(next, node);
    }
    if (node < 0 || !known[node] || chain.length === 0) continue;
    // Walk out from the guessed node: each chain node gets the pressure at
    // which its element toward the guessed node passes the hanging flow.
    for (let c = chain.length - 1; c >= 0; c--) {
      const { node: x, toward } = chain[c]!;
      const solved = passFlow(sys, p, x, toward, flowIn, Math.max(p[v]!, fixedEnd(eFixed)), count);
      if (solved === null) break;
      p[x] = solved;
    }
    balanceHanging(sys, p, v, eFixed, eOther, count);
  }
  return count.n;
}

/** Net inflow into node v from its elements, with v at pressure x. */
function inflowAt(sys: LocalSystem, p: Float64Array, v: number, elems: readonly number[], x: number, count: { n: number }): number {
  const { la, lb, fa, fb } = sys;
  let s = 0;
  for (const e of elems) {
    const pa = la[e] === v ? x : la[e]! < 0 ? fa[e]! : p[la[e]!]!;
    const pb = lb[e] === v ? x : lb[e]! < 0 ? fb[e]! : p[lb[e]!]!;
    const f = sys.laws[e]!.flow(pa, pb).massFlowKgPerS;
    count.n++;
    s += la[e] === v ? -f : f;
  }
  return s;
}

/** Balances a hanging node between its two end pressures; returns the flow in from the fixed side. */
function balanceHanging(sys: LocalSystem, p: Float64Array, v: number, eFixed: number, eOther: number, count: { n: number }): number | null {
  const { la, lb, fa, fb } = sys;
  const pFixed = la[eFixed] === v ? fb[eFixed]! : fa[eFixed]!;
  const other = la[eOther] === v ? lb[eOther]! : la[eOther]!;
  const pOther = p[other]!;
  if (!(pFixed > 0) || !(pOther > 0) || pFixed === pOther) return null;
  const x = falsePosition((y) => inflowAt(sys, p, v, [eFixed, eOther], y, count), Math.min(pFixed, pOther), Math.max(pFixed, pOther));
  if (x === null) return null;
  p[v] = x;
  count.n++;
  const r = sys.laws[eFixed]!.flow(la[eFixed] === v ? p[v]! : fa[eFixed]!, lb[eFixed] === v ? p[v]! : fb[eFixed]!);
  return la[eFixed] === v ? -r.massFlowKgPerS : r.massFlowKgPerS;
}

/**
 * The pressure at node x at which element e (joining x to an already
 * placed node) carries `flowIn` from x toward that node; bracketed
 * bisection between that node's pressure and `ceiling`. Null if no root.
 */
function passFlow(sys: LocalSystem, p: Float64Array, x: number, e: number, flowIn: number, ceiling: number, count: { n: number }): number | null {
  const { la, lb, fa, fb } = sys;
  const otherP = la[e] === x ? (lb[e]! < 0 ? fb[e]! : p[lb[e]!]!) : la[e]! < 0 ? fa[e]! : p[la[e]!]!;
  const g = (px: number) => {
    const r = sys.laws[e]!.flow(la[e] === x ? px : otherP, lb[e] === x ? px : otherP);
    count.n++;
    const out = la[e] === x ? r.massFlowKgPerS : -r.massFlowKgPerS; // flow leaving x through e
    return out - flowIn;
  };
  return falsePosition(g, Math.min(otherP, ceiling), Math.max(otherP, ceiling));
}

/**
 * A root of f in [lo, hi] where f changes sign, by the Illinois variant of
 * regula falsi (Dowell and Jarratt 1971): superlinear, never leaves the
 * bracket. Null when f does not change sign or is not finite. For starting
 * guesses only: stops at 1e-6 of the bracket or after 40 steps.
 */
function falsePosition(f: (x: number) => number, lo: number, hi: number): number | null {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb) || fa * fb > 0) return null;
  if (fa === 0) return a;
  if (fb === 0) return b;
  const tol = 1e-6 * (hi - lo);
  let side = 0;
  for (let it = 0; it < BISECTION_STEPS; it++) {
    const c = (a * fb - b * fa) / (fb - fa);
    const fc = f(c);
    if (!Number.isFinite(fc)) return null;
    if (fc === 0 || Math.abs(b - a) < tol) return c;
    if (fc * fb > 0) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
    if (Math.abs(fc) < 1e-6 * (Math.abs(fa) + Math.abs(fb))) return c;
  }
  return (a * fb - b * fa) / (fb - fa);
}
