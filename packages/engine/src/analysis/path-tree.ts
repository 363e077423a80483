/**
 * The piping as a tree rooted at the producers: for every node, the element
 * toward its producer. When the piping is a forest with one producer point
 * per part (the usual system), the path from an inlet to its producer is the
 * only way its air can go, a case needs only the paths of its open inlets,
 * and two inlets share exactly the path from where their paths meet. When
 * the piping has loops the tree is a spanning tree (breadth-first from the
 * producers) and serves only to rank candidates; cases then take all piping.
 */
import type { NetworkGraph } from '../network/graph.js';

export interface PathTree {
  /** The tree is the piping itself (no loops, one producer point per part). */
  exact: boolean;
  /** Element from each node toward its producer (-1 at roots and unreached nodes). */
  parentElem: Int32Array;
  parentNode: Int32Array;
  /** Elements between the node and its producer point (-1 when unreached). */
  depth: Int32Array;
  /** Producer elements at each root node. */
  rootProducers: Map<number, number[]>;
  /** Root (producer point) of each reached node, -1 if unreached. */
  root: Int32Array;
  children: number[][];
  /** Reached nodes, parents before children. */
  order: number[];
}

export function buildPathTree(graph: NetworkGraph): PathTree {
  const { topology } = graph;
  const n = topology.nodes.length;
  const adj: { u: number; e: number }[][] = Array.from({ length: n }, () => []);
  const rootProducers = new Map<number, number[]>();
  for (const e of topology.structural) {
    const el = topology.elements[e]!;
    if (el.kind === 'producer') {
      const list = rootProducers.get(el.a) ?? [];
      list.push(e);
      rootProducers.set(el.a, list);
      continue;
    }
    if (el.a === topology.atmosphere || el.b === topology.atmosphere || el.a === el.b) continue;
    adj[el.a]!.push({ u: el.b, e });
    adj[el.b]!.push({ u: el.a, e });
  }
  const parentElem = new Int32Array(n).fill(-1);
  const parentNode = new Int32Array(n).fill(-1);
  const depth = new Int32Array(n).fill(-1);
  const root = new Int32Array(n).fill(-1);
  const children: number[][] = Array.from({ length: n }, () => []);
  const order: number[] = [];
  for (const r of rootProducers.keys()) {
    depth[r] = 0;
    root[r] = r;
    order.push(r);
  }
  let treeEdges = 0;
  for (let qi = 0; qi < order.length; qi++) {
    const v = order[qi]!;
    for (const { u, e } of adj[v]!) {
      if (depth[u]! >= 0) continue;
      depth[u] = depth[v]! + 1;
      parentElem[u] = e;
      parentNode[u] = v;
      root[u] = root[v]!;
      children[v]!.push(u);
      order.push(u);
      treeEdges++;
    }
  }
  // Piping elements among reached nodes that are not tree edges close loops
  // (or join two producer points): then paths are not the only way.
  let reachedPiping = 0;
  for (const e of topology.structural) {
    const el = topology.elements[e]!;
    if (el.kind === 'producer' || el.a === topology.atmosphere || el.b === topology.atmosphere || el.a === el.b) continue;
    if (depth[el.a]! >= 0 || depth[el.b]! >= 0) reachedPiping++;
  }
  return { exact: reachedPiping === treeEdges, parentElem, parentNode, depth, rootProducers, root, children, order };
}

/** Elements from a node up to its producer point, then the producer(s) there. */
export function pathElements(tree: PathTree, node: number): number[] {
  const out: number[] = [];
  let v = node;
  while (v >= 0 && tree.parentElem[v]! >= 0) {
    out.push(tree.parentElem[v]!);
    v = tree.parentNode[v]!;
  }
  if (v >= 0) out.push(...(tree.rootProducers.get(v) ?? []));
  return out;
}

/** The node where the paths of u and v meet, or -1 when they lead to different producer points. */
export function meetingNode(tree: PathTree, u: number, v: number): number {
  if (u < 0 || v < 0 || tree.root[u] !== tree.root[v] || tree.root[u]! < 0) return -1;
  let a = u;
  let b = v;
  while (tree.depth[a]! > tree.depth[b]!) a = tree.parentNode[a]!;
  while (tree.depth[b]! > tree.depth[a]!) b = tree.parentNode[b]!;
  while (a !== b) {
    a = tree.parentNode[a]!;
    b = tree.parentNode[b]!;
  }
  return a;
}
