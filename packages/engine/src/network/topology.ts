/**
 * The shape of a system's air path, without flow laws: which nodes exist and
 * which element joins which two nodes. Shared by the solvable graph
 * (`graph.ts`) and the connectivity checks (`connectivity.ts`).
 *
 * Nodes: the atmosphere (fixed), one node per named point, where a point
 * named like a producer, separator or filter is that unit's inlet; a node
 * where an inlet sits part-way along a pipe (the pipe is split there); a
 * hose-end node per inlet. Elements, port a -> port b in the direction air
 * normally flows: producer (inlet -> atmosphere), separator and filter
 * (inlet -> toward-producer point), pipe segment (far -> producer side),
 * hose (hose end -> inlet), tool (atmosphere -> hose end), test orifice
 * (atmosphere -> inlet).
 */
import type { ElementRef, Inlet, Pipe, PointName, SystemModel } from './model.js';

export type NodeKind = 'atmosphere' | 'point' | 'producer-inlet' | 'separator-inlet' | 'filter-inlet' | 'pipe-split' | 'hose-end';

export interface TopologyNode {
  kind: NodeKind;
  /** The point name, or a made-up key for split and hose-end nodes. */
  key: string;
}

export type TopologyElementKind = 'producer' | 'separator' | 'filter' | 'pipe' | 'hose' | 'tool' | 'test-orifice';

export interface PipeSegmentInfo {
  pipe: Pipe;
  /** Segment index from the producer-side end (0) outward. */
  segment: number;
  /** Distance of the segment's producer-side end from the pipe's `from` end, m. */
  startM: number;
  lengthM: number;
}

export interface TopologyElement {
  kind: TopologyElementKind;
  ref: ElementRef;
  a: number;
  b: number;
  /** For pipe segments. */
  pipe?: PipeSegmentInfo;
  /** For hoses, tools and test orifices: the inlet. */
  inlet?: Inlet;
}

export interface TopologyInlet {
  inlet: Inlet;
  /** The inlet valve's node, or -1 when its position does not resolve. */
  node: number;
  hoseEndNode: number;
}

export interface TopologyProblem {
  code: 'unknown-pipe' | 'inlet-off-pipe';
  element: ElementRef;
  message: string;
}

export interface Topology {
  nodes: TopologyNode[];
  elements: TopologyElement[];
  atmosphere: number;
  pointNodes: Map<PointName, number>;
  inlets: Map<string, TopologyInlet>;
  /** Segment element ids of each pipe, from its producer-side end outward. */
  pipeSegments: Map<string, number[]>;
  /** Producer, separator, filter and pipe-segment elements: present in every case. */
  structural: number[];
  problems: TopologyProblem[];
}

// Inlets closer than this to each other or to a pipe end share a node (our choice: 1 mm).
const SAME_PLACE_M = 1e-3;

/** Builds the law-free topology of a system. Never throws on bad references. */
export function buildTopology(model: SystemModel): Topology {
  const nodes: TopologyNode[] = [{ kind: 'atmosphere', key: '(atmosphere)' }];
  const elements: TopologyElement[] = [];
  const pointNodes = new Map<PointName, number>();
  const problems: TopologyProblem[] = [];
  const structural: number[] = [];

  const equipmentKind = new Map<string, NodeKind>();
  for (const p of model.producers ?? []) equipmentKind.set(p.name, 'producer-inlet');
  for (const s of model.separators ?? []) equipmentKind.set(s.name, 'separator-inlet');
  for (const f of model.filters ?? []) equipmentKind.set(f.name, 'filter-inlet');

  const point = (name: PointName): number => {
    let id = pointNodes.get(name);
    if (id === undefined) {
      id = nodes.length;
      nodes.push({ kind: equipmentKind.get(name) ?? 'point', key: name });
      pointNodes.set(name, id);
    }
    return id;
  };
  const add = (el: TopologyElement, isStructural: boolean): number => {
    elements.push(el);
    if (isStructural) structural.push(elements.length - 1);
    return elements.length - 1;
  };

  for (const p of model.producers ?? []) {
    add({ kind: 'producer', ref: { kind: 'producer', name: p.name }, a: point(p.name), b: 0 }, true);
  }
  for (const s of model.separators ?? []) {
    add({ kind: 'separator', ref: { kind: 'separator', name: s.name }, a: point(s.name), b: point(s.towardProducer) }, true);
  }
  for (const f of model.filters ?? []) {
    add({ kind: 'filter', ref: { kind: 'filter', name: f.name }, a: point(f.name), b: point(f.towardProducer) }, true);
  }

  // Where inlets sit along each pipe (distance from the producer-side end).
  const pipesByName = new Map<string, Pipe>();
  for (const p of model.pipes ?? []) pipesByName.set(p.name, p);
  const stops = new Map<string, number[]>();
  for (const inlet of model.inlets ?? []) {
    if (inlet.position.kind !== 'on-pipe') continue;
    const pipe = pipesByName.get(inlet.position.pipe);
    const ref: ElementRef = { kind: 'inlet', name: inlet.name, property: 'position' };
    if (!pipe) {
      problems.push({ code: 'unknown-pipe', element: ref, message: `inlet ${inlet.name} is on pipe ${inlet.position.pipe}, which does not exist` });
      continue;
    }
    const d = inlet.position.distanceM;
    if (!Number.isFinite(d) || d < -SAME_PLACE_M || d > pipe.lengthM + SAME_PLACE_M) {
      problems.push({
        code: 'inlet-off-pipe',
        element: ref,
        message: `inlet ${inlet.name} sits ${d} m along pipe ${pipe.name}, which is ${pipe.lengthM} m long`,
      });
      continue;
    }
    if (d > SAME_PLACE_M && d < pipe.lengthM - SAME_PLACE_M) {
      const list = stops.get(pipe.name) ?? [];
      list.push(d);
      stops.set(pipe.name, list);
    }
  }

  // Pipes, split at their inlets.
  const pipeSegments = new Map<string, number[]>();
  const splitNodes = new Map<string, { at: number; node: number }[]>();
  for (const pipe of model.pipes ?? []) {
    const from = point(pipe.from);
    const to = point(pipe.to);
    const cuts = [...new Set(stops.get(pipe.name) ?? [])].sort((x, y) => x - y);
    const merged: number[] = [];
    for (const c of cuts) if (merged.length === 0 || c - merged[merged.length - 1]! > SAME_PLACE_M) merged.push(c);
    const places: { at: number; node: number }[] = [{ at: 0, node: from }];
    for (const c of merged) {
      nodes.push({ kind: 'pipe-split', key: `${pipe.name}@${c}` });
      places.push({ at: c, node: nodes.length - 1 });
    }
    places.push({ at: pipe.lengthM, node: to });
    splitNodes.set(pipe.name, places);
    const ids: number[] = [];
    for (let s = 0; s + 1 < places.length; s++) {
      const near = places[s]!;
      const far = places[s + 1]!;
      ids.push(
        add(
          {
            kind: 'pipe',
            ref: { kind: 'pipe', name: pipe.name },
            a: far.node,
            b: near.node,
            pipe: { pipe, segment: s, startM: near.at, lengthM: far.at - near.at },
          },
          true,
        ),
      );
    }
    pipeSegments.set(pipe.name, ids);
  }

  // Inlets: the valve node, a hose-end node, hose and tool elements.
  const inlets = new Map<string, TopologyInlet>();
  for (const inlet of model.inlets ?? []) {
    let node = -1;
    if (inlet.position.kind === 'point') {
      node = point(inlet.position.point);
    } else {
      const places = splitNodes.get(inlet.position.pipe);
      const pipe = pipesByName.get(inlet.position.pipe);
      const d = inlet.position.distanceM;
      if (places && pipe && Number.isFinite(d) && d >= -SAME_PLACE_M && d <= pipe.lengthM + SAME_PLACE_M) {
        let best = places[0]!;
        for (const pl of places) if (Math.abs(pl.at - d) < Math.abs(best.at - d)) best = pl;
        node = best.node;
      }
    }
    nodes.push({ kind: 'hose-end', key: `${inlet.name}:hose-end` });
    const hoseEndNode = nodes.length - 1;
    inlets.set(inlet.name, { inlet, node, hoseEndNode });
  }

  return { nodes, elements, atmosphere: 0, pointNodes, inlets, pipeSegments, structural, problems };
}

/** Adds the hose, tool (both states) and test-orifice elements of every inlet; returns their ids. */
export interface InletElements {
  hose: number;
  toolWorking: number;
  toolLifted: number;
  testOrifice: number;
}

export function addInletElements(topology: Topology): Map<string, InletElements> {
  const out = new Map<string, InletElements>();
  for (const [name, ti] of topology.inlets) {
    const push = (el: TopologyElement): number => {
      topology.elements.push(el);
      return topology.elements.length - 1;
    };
    const valve = ti.node >= 0 ? ti.node : ti.hoseEndNode; // unresolved: a stub that fails as no-path
    const hose = push({ kind: 'hose', ref: { kind: 'inlet', name, property: 'hose' }, a: ti.hoseEndNode, b: valve, inlet: ti.inlet });
    const toolWorking = push({ kind: 'tool', ref: { kind: 'inlet', name, property: 'tool' }, a: 0, b: ti.hoseEndNode, inlet: ti.inlet });
    const toolLifted = push({ kind: 'tool', ref: { kind: 'inlet', name, property: 'tool' }, a: 0, b: ti.hoseEndNode, inlet: ti.inlet });
    const testOrifice = push({ kind: 'test-orifice', ref: { kind: 'inlet', name, property: 'test-orifice' }, a: 0, b: valve, inlet: ti.inlet });
    out.set(name, { hose, toolWorking, toolLifted, testOrifice });
  }
  return out;
}
