/**
 * Connectivity checks on a system's piping, without solving anything:
 * which inlets, pipes and units have no path to a producer, which pipes
 * lead nowhere (serve no inlet), where the piping closes a loop. Each check
 * is a plain function returning findings.
 *
 * Paths run through pipes, separators and filters only; the atmosphere
 * joins every producer and tool but is not a path for the system's air.
 */
import type { ElementRef, Finding, SystemModel } from './model.js';
import { buildTopology, type Topology } from './topology.js';

/** Stable finding codes of the connectivity checks. */
export const CONNECTIVITY_CODES = {
  noProducer: 'no-producer',
  inletNoPath: 'inlet-no-path',
  pipeNoPath: 'pipe-no-path',
  unitNoPath: 'unit-no-path',
  danglingPipe: 'dangling-pipe',
  pipeLoop: 'pipe-loop',
  unknownPipe: 'unknown-pipe',
  inletOffPipe: 'inlet-off-pipe',
} as const;

/** All connectivity findings of a system. */
export function connectivityFindings(model: SystemModel, topology: Topology = buildTopology(model)): Finding[] {
  return [
    ...positionFindings(topology),
    ...noPathFindings(model, topology),
    ...danglingPipeFindings(topology),
    ...loopFindings(topology),
  ];
}

/** Inlets placed on a pipe that does not exist, or beyond its ends. */
export function positionFindings(topology: Topology): Finding[] {
  return topology.problems.map((p) => ({ code: p.code, severity: 'error', message: p.message, element: p.element }));
}

/** Nodes reachable from any producer inlet through structural elements (not through the atmosphere). */
export function nodesReachingProducer(topology: Topology): Uint8Array {
  const { nodes, elements, structural } = topology;
  const adj: number[][] = nodes.map(() => []);
  for (const e of structural) {
    const el = elements[e]!;
    if (el.a === topology.atmosphere || el.b === topology.atmosphere) continue;
    adj[el.a]!.push(el.b);
    adj[el.b]!.push(el.a);
  }
  const seen = new Uint8Array(nodes.length);
  const stack: number[] = [];
  for (const e of structural) {
    const el = elements[e]!;
    if (el.kind === 'producer' && !seen[el.a]) {
      seen[el.a] = 1;
      stack.push(el.a);
    }
  }
  while (stack.length > 0) {
    const v = stack.pop()!;
    for (const u of adj[v]!) {
      if (!seen[u]) {
        seen[u] = 1;
        stack.push(u);
      }
    }
  }
  return seen;
}

/** Inlets, pipes, separators and filters with no path to a producer; or no producer at all. */
export function noPathFindings(model: SystemModel, topology: Topology): Finding[] {
  const out: Finding[] = [];
  if ((model.producers ?? []).length === 0) {
    out.push({
      code: CONNECTIVITY_CODES.noProducer,
      severity: 'error',
      message: 'the system has no producer: no inlet can draw air',
      element: { kind: 'system', name: model.name },
    });
  }
  const reach = nodesReachingProducer(topology);
  for (const [name, ti] of topology.inlets) {
    if (ti.node < 0) continue; // reported by positionFindings
    if (!reach[ti.node]) {
      out.push({
        code: CONNECTIVITY_CODES.inletNoPath,
        severity: 'error',
        message: `inlet ${name} has no path through the piping to a producer`,
        element: { kind: 'inlet', name },
      });
    }
  }
  const reportedPipes = new Set<string>();
  for (const e of topology.structural) {
    const el = topology.elements[e]!;
    if (el.kind === 'producer') continue;
    if (reach[el.a] || reach[el.b]) continue;
    if (el.kind === 'pipe') {
      if (reportedPipes.has(el.ref.name)) continue;
      reportedPipes.add(el.ref.name);
      out.push({
        code: CONNECTIVITY_CODES.pipeNoPath,
        severity: 'error',
        message: `pipe ${el.ref.name} is not connected to a producer`,
        element: el.ref,
      });
    } else {
      out.push({
        code: CONNECTIVITY_CODES.unitNoPath,
        severity: 'error',
        message: `${el.kind} ${el.ref.name} does not lead to a producer`,
        element: el.ref,
      });
    }
  }
  return out;
}

/**
 * Pipes that serve no inlet: dead ends found by trimming, again and again,
 * every end point that holds no inlet and is no unit's inlet. One finding
 * per dead branch, on the pipe where it leaves the live piping.
 */
export function danglingPipeFindings(topology: Topology): Finding[] {
  const { nodes, elements, structural } = topology;
  const pipeIds = structural.filter((e) => elements[e]!.kind === 'pipe');
  const keep = new Uint8Array(nodes.length);
  for (const ti of topology.inlets.values()) if (ti.node >= 0) keep[ti.node] = 1;
  for (const e of structural) {
    const el = elements[e]!;
    if (el.kind !== 'pipe') {
      keep[el.a] = 1; // unit inlets
      keep[el.b] = 1;
    }
  }
  const degree = new Int32Array(nodes.length);
  const inc: number[][] = nodes.map(() => []);
  for (const e of pipeIds) {
    const el = elements[e]!;
    degree[el.a]!++;
    degree[el.b]!++;
    inc[el.a]!.push(e);
    inc[el.b]!.push(e);
  }
  const removed = new Set<number>();
  const attachedTo = new Map<number, number>(); // pipe segment -> node it hung from
  const stack: number[] = [];
  for (let v = 0; v < nodes.length; v++) if (degree[v] === 1 && !keep[v]) stack.push(v);
  while (stack.length > 0) {
    const v = stack.pop()!;
    if (degree[v] !== 1 || keep[v]) continue;
    const e = inc[v]!.find((x) => !removed.has(x));
    if (e === undefined) continue;
    removed.add(e);
    const el = elements[e]!;
    const u = el.a === v ? el.b : el.a;
    attachedTo.set(e, u);
    degree[v] = 0;
    degree[u]!--;
    if (degree[u] === 1 && !keep[u]) stack.push(u);
  }
  // Group the removed segments into branches by the node they hang from.
  const removedNodes = new Set<number>();
  for (const e of removed) {
    const el = elements[e]!;
    const u = attachedTo.get(e)!;
    removedNodes.add(el.a === u ? el.b : el.a);
  }
  // A pipe part of which still serves an inlet is live (its stub beyond the last inlet is normal).
  const livePipes = new Set(pipeIds.filter((e) => !removed.has(e)).map((e) => elements[e]!.ref.name));
  const out: Finding[] = [];
  const reportedPipes = new Set<string>(livePipes);
  for (const e of removed) {
    const u = attachedTo.get(e)!;
    if (removedNodes.has(u) || degree[u] === 0) continue; // not where the branch leaves live piping
    const name = elements[e]!.ref.name;
    if (reportedPipes.has(name)) continue;
    reportedPipes.add(name);
    // Everything beyond: walk removed segments away from u.
    const beyond = new Set<string>();
    const walk = [e];
    const visited = new Set<number>([e]);
    while (walk.length > 0) {
      const x = walk.pop()!;
      beyond.add(elements[x]!.ref.name);
      const ex = elements[x]!;
      const far = attachedTo.get(x) === ex.a ? ex.b : ex.a;
      for (const y of inc[far]!) {
        if (removed.has(y) && !visited.has(y)) {
          visited.add(y);
          walk.push(y);
        }
      }
    }
    beyond.delete(name);
    for (const live of livePipes) beyond.delete(live);
    const related = [...beyond].map((p) => ({ element: { kind: 'pipe', name: p } as ElementRef, message: `beyond ${name}, also serves no inlet` }));
    const f: Finding = {
      code: CONNECTIVITY_CODES.danglingPipe,
      severity: 'warning',
      message: beyond.size > 0 ? `pipe ${name} and ${beyond.size} pipe(s) beyond it serve no inlet` : `pipe ${name} serves no inlet`,
      element: { kind: 'pipe', name },
    };
    if (related.length > 0) f.related = related;
    out.push(f);
  }
  return out;
}

/** Each independent loop in the piping (pipes, separators, filters), on the pipe that closes it. */
export function loopFindings(topology: Topology): Finding[] {
  const { nodes, elements, structural } = topology;
  const parent = new Int32Array(nodes.length).fill(-1);
  const parentElem = new Int32Array(nodes.length).fill(-1);
  const depth = new Int32Array(nodes.length).fill(-1);
  const adj: { u: number; e: number }[][] = nodes.map(() => []);
  const loopElems = structural.filter((e) => {
    const el = elements[e]!;
    return el.a !== topology.atmosphere && el.b !== topology.atmosphere;
  });
  for (const e of loopElems) {
    const el = elements[e]!;
    adj[el.a]!.push({ u: el.b, e });
    adj[el.b]!.push({ u: el.a, e });
  }
  const treeElem = new Set<number>();
  for (let s = 0; s < nodes.length; s++) {
    if (depth[s]! >= 0) continue;
    depth[s] = 0;
    const queue = [s];
    for (let qi = 0; qi < queue.length; qi++) {
      const v = queue[qi]!;
      for (const { u, e } of adj[v]!) {
        if (depth[u]! >= 0) continue;
        depth[u] = depth[v]! + 1;
        parent[u] = v;
        parentElem[u] = e;
        treeElem.add(e);
        queue.push(u);
      }
    }
  }
  const out: Finding[] = [];
  // Segments of one pipe split at inlets are never chords of each other; a
  // chord is any element outside the spanning forest.
  const reported = new Set<string>();
  for (const e of loopElems) {
    if (treeElem.has(e)) continue;
    const el = elements[e]!;
    let x = el.a;
    let y = el.b;
    const path = new Set<string>();
    while (x !== y) {
      if (depth[x]! >= depth[y]!) {
        path.add(elements[parentElem[x]!]!.ref.name);
        x = parent[x]!;
      } else {
        path.add(elements[parentElem[y]!]!.ref.name);
        y = parent[y]!;
      }
    }
    const key = el.ref.name;
    if (reported.has(key)) continue;
    reported.add(key);
    path.delete(key);
    out.push({
      code: CONNECTIVITY_CODES.pipeLoop,
      severity: 'info',
      message: `${el.ref.name} closes a loop with ${[...path].join(', ')}: air may take either way round`,
      element: el.ref,
      related: [...path].map((p) => ({ element: refOf(topology, p), message: 'part of the loop' })),
    });
  }
  return out;
}

function refOf(topology: Topology, name: string): ElementRef {
  const el = topology.elements.find((x) => x.ref.name === name);
  return el ? el.ref : { kind: 'pipe', name };
}
