/**
 * Sparse LU factorisation for matrices with a symmetric nonzero pattern
 * (the network Jacobian: node i touches node j through an element exactly
 * when j touches i), unsymmetric values, no pivoting.
 *
 * No pivoting is safe here: the negated Jacobian of a network of monotone
 * two-port laws is column diagonally dominant (each element adds +d to a
 * diagonal and -d to the same column), and Gaussian elimination on such a
 * matrix, in any symmetric order, is stable and keeps that property
 * (Golub and Van Loan, Matrix Computations, 4th ed., sec. 3.4.3).
 *
 * Ordering: minimum degree (Tinney scheme 2; George and Liu, Computer
 * Solution of Large Sparse Positive Definite Systems, 1981) on the
 * elimination graph, which on a tree eliminates leaves first: no fill and
 * linear time.
 *
 * Use: `analyseLU(n, edgesP, edgesQ)` once per pattern (symbolic phase), then
 * per numeric matrix fill `values` through `diagIndex`/`offIndex`, call
 * `factorLU` and `solveLU`.
 */

export interface SymbolicLU {
  n: number;
  /** Edges of the filled pattern: first the input edges, then fill. */
  edgeCount: number;
  inputEdgeCount: number;
  /** Elimination order (pivot sequence). */
  order: Int32Array;
  /** Per pivot step s (CSR over `stepNeighbourStart`): later neighbours and the value slots. */
  stepNeighbourStart: Int32Array;
  /** Slot of A[u][k] (column below the pivot), per neighbour. */
  stepLowerSlot: Int32Array;
  /** Slot of A[k][u] (row right of the pivot), per neighbour. */
  stepUpperSlot: Int32Array;
  stepNeighbour: Int32Array;
  /** Per pivot step (CSR over `stepUpdateStart`): A[t] -= A[l] * A[u] triples. */
  stepUpdateStart: Int32Array;
  updateTarget: Int32Array;
  updateLower: Int32Array;
  updateUpper: Int32Array;
  /** Size of the value array: n diagonal slots then two per edge. */
  valueCount: number;
  edgeP: Int32Array;
  edgeQ: Int32Array;
}

/** Value slot of the diagonal entry A[i][i]. */
export function diagIndex(i: number): number {
  return i;
}

/** Value slot of A[from][to] on edge e (e joins edgeP[e] and edgeQ[e]). */
export function offIndex(sym: SymbolicLU, e: number, from: number): number {
  return sym.n + 2 * e + (sym.edgeP[e] === from ? 0 : 1);
}

/** A binary min-heap of (key, node) pairs with lazy deletion. */
class MinHeap {
  private keys: number[] = [];
  private items: number[] = [];
  get size(): number {
    return this.items.length;
  }
  push(key: number, item: number): void {
    const k = this.keys;
    const it = this.items;
    let i = it.length;
    k.push(key);
    it.push(item);
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (k[parent]! <= key) break;
      k[i] = k[parent]!;
      it[i] = it[parent]!;
      i = parent;
    }
    k[i] = key;
    it[i] = item;
  }
  /** Removes the smallest; returns [key, item]. */
  pop(): [number, number] {
    const k = this.keys;
    const it = this.items;
    const topKey = k[0]!;
    const topItem = it[0]!;
    const lastKey = k.pop()!;
    const lastItem = it.pop()!;
    const n = it.length;
    if (n > 0) {
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        if (l >= n) break;
        const r = l + 1;
        const c = r < n && k[r]! < k[l]! ? r : l;
        if (k[c]! >= lastKey) break;
        k[i] = k[c]!;
        it[i] = it[c]!;
        i = c;
      }
      k[i] = lastKey;
      it[i] = lastItem;
    }
    return [topKey, topItem];
  }
}

/**
 * Symbolic phase: minimum-degree order and the fill pattern.
 * Inputs: n unknowns; undirected edges (edgesP[e], edgesQ[e]), no self
 * loops, no duplicates (merge parallel elements first).
 */
export function analyseLU(n: number, edgesP: ArrayLike<number>, edgesQ: ArrayLike<number>): SymbolicLU {
  const inputEdgeCount = edgesP.length;
  const edgeP: number[] = Array.from(edgesP);
  const edgeQ: number[] = Array.from(edgesQ);
  // Elimination graph: neighbour -> edge id, per node.
  const adj: Map<number, number>[] = new Array(n);
  for (let i = 0; i < n; i++) adj[i] = new Map();
  for (let e = 0; e < inputEdgeCount; e++) {
    adj[edgeP[e]!]!.set(edgeQ[e]!, e);
    adj[edgeQ[e]!]!.set(edgeP[e]!, e);
  }
  const eliminated = new Uint8Array(n);
  const heap = new MinHeap();
  for (let i = 0; i < n; i++) heap.push(adj[i]!.size, i);

  const order = new Int32Array(n);
  const nbStart: number[] = [0];
  const nbNode: number[] = [];
  const nbEdge: number[] = [];
  const upStart: number[] = [0];
  const upTarget: number[] = [];
  const upL: number[] = [];
  const upU: number[] = [];
  // Slots refer to final edge ids; the value layout is n + 2e (+1).
  const slot = (e: number, from: number): number => n + 2 * e + (edgeP[e] === from ? 0 : 1);

  for (let step = 0; step < n; step++) {
    let k = -1;
    while (heap.size > 0) {
      const [deg, node] = heap.pop();
      if (eliminated[node] || adj[node]!.size !== deg) continue;
      k = node;
      break;
    }
    if (k < 0) {
      // Unreachable with a consistent heap; take any remaining node.
      for (let i = 0; i < n; i++) if (!eliminated[i]) { k = i; break; }
    }
    order[step] = k;
    eliminated[k] = 1;
    const neighbours = Array.from(adj[k]!.entries());
    for (const [u, e] of neighbours) {
      nbNode.push(u);
      nbEdge.push(e);
    }
    nbStart.push(nbNode.length);
    // Updates A[u][v] -= L[u][k] * U[k][v] for all later neighbour pairs.
    for (const [u, eu] of neighbours) {
      for (const [v, ev] of neighbours) {
        let target: number;
        if (u === v) {
          target = u;
        } else {
          let e = adj[u]!.get(v);
          if (e === undefined) {
            e = edgeP.length;
            edgeP.push(u);
            edgeQ.push(v);
            adj[u]!.set(v, e);
            adj[v]!.set(u, e);
          }
          target = slot(e, u);
        }
        upTarget.push(target);
        upL.push(slot(eu, u));
        upU.push(slot(ev, k));
      }
    }
    upStart.push(upTarget.length);
    for (const [u] of neighbours) {
      adj[u]!.delete(k);
      heap.push(adj[u]!.size, u);
    }
    adj[k]!.clear();
  }

  const stepLowerSlot = new Int32Array(nbNode.length);
  const stepUpperSlot = new Int32Array(nbNode.length);
  for (let s = 0; s < n; s++) {
    const k = order[s]!;
    for (let j = nbStart[s]!; j < nbStart[s + 1]!; j++) {
      stepLowerSlot[j] = slot(nbEdge[j]!, nbNode[j]!);
      stepUpperSlot[j] = slot(nbEdge[j]!, k);
    }
  }
  return {
    n,
    edgeCount: edgeP.length,
    inputEdgeCount,
    order,
    stepNeighbourStart: Int32Array.from(nbStart),
    stepLowerSlot,
    stepUpperSlot,
    stepNeighbour: Int32Array.from(nbNode),
    stepUpdateStart: Int32Array.from(upStart),
    updateTarget: Int32Array.from(upTarget),
    updateLower: Int32Array.from(upL),
    updateUpper: Int32Array.from(upU),
    valueCount: n + 2 * edgeP.length,
    edgeP: Int32Array.from(edgeP),
    edgeQ: Int32Array.from(edgeQ),
  };
}

/**
 * Numeric factorisation in place: on return the diagonal slots hold the
 * pivots, lower slots hold L (unit lower, scaled by the pivot), upper slots U.
 * Fill slots must be zero on entry. Returns false when a pivot is zero or
 * not finite (a part of the network with no fixed pressure: singular).
 */
export function factorLU(sym: SymbolicLU, values: Float64Array): boolean {
  const { n, order, stepNeighbourStart, stepLowerSlot, stepUpdateStart, updateTarget, updateLower, updateUpper } = sym;
  for (let s = 0; s < n; s++) {
    const k = order[s]!;
    const pivot = values[k]!;
    if (!(Math.abs(pivot) > 0) || !Number.isFinite(pivot)) return false;
    for (let j = stepNeighbourStart[s]!; j < stepNeighbourStart[s + 1]!; j++) {
      values[stepLowerSlot[j]!]! /= pivot;
    }
    for (let t = stepUpdateStart[s]!; t < stepUpdateStart[s + 1]!; t++) {
      values[updateTarget[t]!] = values[updateTarget[t]!]! - values[updateLower[t]!]! * values[updateUpper[t]!]!;
    }
  }
  return true;
}

/** Solves A x = b with the factors from `factorLU`; b is overwritten with x. */
export function solveLU(sym: SymbolicLU, values: Float64Array, b: Float64Array): void {
  const { n, order, stepNeighbourStart, stepLowerSlot, stepUpperSlot, stepNeighbour } = sym;
  for (let s = 0; s < n; s++) {
    const k = order[s]!;
    const bk = b[k]!;
    if (bk === 0) continue;
    for (let j = stepNeighbourStart[s]!; j < stepNeighbourStart[s + 1]!; j++) {
      b[stepNeighbour[j]!] = b[stepNeighbour[j]!]! - values[stepLowerSlot[j]!]! * bk;
    }
  }
  for (let s = n - 1; s >= 0; s--) {
    const k = order[s]!;
    let sum = b[k]!;
    for (let j = stepNeighbourStart[s]!; j < stepNeighbourStart[s + 1]!; j++) {
      sum -= values[stepUpperSlot[j]!]! * b[stepNeighbour[j]!]!;
    }
    b[k] = sum / values[k]!;
  }
}
