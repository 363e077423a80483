/**
 * Linear solve for a Jacobian whose off-diagonal pattern is a forest (a tree
 * network with any number of elements to fixed pressures): eliminate each
 * node into its parent, leaves first, then substitute back root to leaves.
 * Linear in the number of nodes, no fill. Stability as for `sparse-lu.ts`
 * (column diagonally dominant, any symmetric order).
 *
 * Value layout (length 3n): [0, n) diagonal J[v][v]; [n, 2n) J[v][parent v];
 * [2n, 3n) J[parent v][v]. Roots have no parent slots in use.
 */

export interface ForestOrder {
  n: number;
  /** Parent of each node, -1 for a root. */
  parent: Int32Array;
  /** Nodes in breadth-first order from the roots (parents before children). */
  order: Int32Array;
}

/**
 * The forest order of n nodes joined by the given undirected edges, or null
 * when the edges close a loop (then the general sparse LU is needed).
 */
export function forestOrder(n: number, edgeP: ArrayLike<number>, edgeQ: ArrayLike<number>): ForestOrder | null {
  const m = edgeP.length;
  if (m > n - 1) return null;
  // Adjacency in CSR form.
  const degree = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) {
    degree[edgeP[e]!]!++;
    degree[edgeQ[e]!]!++;
  }
  const start = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) start[i + 1] = start[i]! + degree[i]!;
  const fillPos = start.slice(0, n);
  const nbr = new Int32Array(2 * m);
  for (let e = 0; e < m; e++) {
    nbr[fillPos[edgeP[e]!]!++] = edgeQ[e]!;
    nbr[fillPos[edgeQ[e]!]!++] = edgeP[e]!;
  }
  const parent = new Int32Array(n).fill(-2);
  const order = new Int32Array(n);
  let head = 0;
  let tail = 0;
  for (let root = 0; root < n; root++) {
    if (parent[root] !== -2) continue;
    parent[root] = -1;
    order[tail++] = root;
    while (head < tail) {
      const v = order[head++]!;
      let seenParent = false;
      for (let j = start[v]!; j < start[v + 1]!; j++) {
        const u = nbr[j]!;
        if (u === parent[v] && !seenParent) {
          seenParent = true; // one edge back to the parent is the tree edge
          continue;
        }
        if (parent[u] !== -2) return null; // reached twice: a loop (or a parallel pair)
        parent[u] = v;
        order[tail++] = u;
      }
    }
  }
  return { n, parent, order };
}

/**
 * Solves J x = b in place (b becomes x); `values` is destroyed.
 * Returns false when a pivot is zero or not finite (singular part).
 */
export function solveForest(forest: ForestOrder, values: Float64Array, b: Float64Array): boolean {
  const { n, parent, order } = forest;
  for (let s = n - 1; s >= 0; s--) {
    const v = order[s]!;
    const d = values[v]!;
    if (!(Math.abs(d) > 0) || !Number.isFinite(d)) return false;
    const u = parent[v]!;
    if (u < 0) continue;
    const jUV = values[2 * n + v]!; // J[u][v]
    const jVU = values[n + v]!; // J[v][u]
    const f = jUV / d;
    values[u] = values[u]! - f * jVU;
    b[u] = b[u]! - f * b[v]!;
  }
  for (let s = 0; s < n; s++) {
    const v = order[s]!;
    const u = parent[v]!;
    const rhs = u < 0 ? b[v]! : b[v]! - values[n + v]! * b[u]!;
    b[v] = rhs / values[v]!;
  }
  return true;
}
