/**
 * Graph layout for the schematic by elkjs (the Eclipse Layout Kernel's
 * "layered" algorithm, after Sugiyama, Tagawa and Toda 1981), run in-process:
 * the bundled build carries its own worker emulation, so no worker thread,
 * file or network is needed, in Node or in a browser.
 */
import ElkImport from 'elkjs/lib/elk.bundled.js';
import type { ElkExtendedEdge, ElkNode, ELK } from 'elkjs/lib/elk-api.js';

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Point {
  x: number;
  y: number;
}

export interface LayoutNodeInput {
  id: string;
  width: number;
  height: number;
  /** Keep in the first layer (the plant). */
  first?: boolean;
}

export interface LayoutEdgeInput {
  id: string;
  source: string;
  target: string;
  /** Size of a label to place beside the edge. */
  label?: { width: number; height: number };
}

export type LayoutDirection = 'RIGHT' | 'DOWN';

export interface LayoutResult {
  width: number;
  height: number;
  direction: LayoutDirection;
  nodes: Map<string, Box>;
  /** Each edge as a polyline from source to target, and its label's box. */
  edges: Map<string, { points: Point[]; label: Box | null }>;
}

/** The constructor, whether the bundle's CommonJS export arrives as the module itself or as its default. */
const ElkConstructor = ((ElkImport as unknown as { default?: unknown }).default ?? ElkImport) as unknown as new () => ELK;

let shared: ELK | undefined;

// Spacing in px at the schematic's scale (our choices: room for labels, compact enough to print).
const SPACING = {
  nodeNode: 12,
  betweenLayers: 18,
  edgeNode: 10,
  edgeEdge: 8,
  edgeLabel: 3,
  padding: 12,
};

/**
 * Lays out a directed graph in layers (sources first) with orthogonal
 * edges, keeping the input order where it can, so the drawing follows the
 * file. Deterministic: the same graph gives the same drawing.
 */
export async function layoutGraph(
  nodes: readonly LayoutNodeInput[],
  edges: readonly LayoutEdgeInput[],
  direction: LayoutDirection,
  overrides: Readonly<Record<string, string>> = {},
): Promise<LayoutResult> {
  shared ??= new ElkConstructor();
  const known = new Set(nodes.map((n) => n.id));
  const graph: ElkNode = {
    id: 'root',
    layoutOptions: {
      'elk.algorithm': 'layered',
      'elk.direction': direction,
      'elk.edgeRouting': 'ORTHOGONAL',
      'elk.layered.nodePlacement.strategy': 'NETWORK_SIMPLEX',
      'elk.layered.considerModelOrder.strategy': 'NODES_AND_EDGES',
      'elk.layered.crossingMinimization.forceNodeModelOrder': 'false',
      'elk.layered.spacing.nodeNodeBetweenLayers': String(SPACING.betweenLayers),
      'elk.spacing.nodeNode': String(SPACING.nodeNode),
      'elk.spacing.edgeNode': String(SPACING.edgeNode),
      'elk.spacing.edgeEdge': String(SPACING.edgeEdge),
      'elk.layered.spacing.edgeNodeBetweenLayers': String(SPACING.edgeNode),
      'elk.spacing.edgeLabel': String(SPACING.edgeLabel),
      'elk.edgeLabels.placement': 'CENTER',
      'elk.padding': `[top=${SPACING.padding},left=${SPACING.padding},bottom=${SPACING.padding},right=${SPACING.padding}]`,
      'elk.separateConnectedComponents': 'true',
      'elk.randomSeed': '1',
      ...overrides,
    },
    children: nodes.map((n) => ({
      id: n.id,
      width: n.width,
      height: n.height,
      ...(n.first ? { layoutOptions: { 'elk.layered.layering.layerConstraint': 'FIRST' } } : {}),
    })),
    edges: edges
      .filter((e) => known.has(e.source) && known.has(e.target))
      .map(
        (e): ElkExtendedEdge => ({
          id: e.id,
          sources: [e.source],
          targets: [e.target],
          ...(e.label ? { labels: [{ id: `${e.id}#label`, text: ' ', width: e.label.width, height: e.label.height }] } : {}),
        }),
      ),
  };
  const laid = await shared.layout(graph);
  const out: LayoutResult = { width: laid.width ?? 0, height: laid.height ?? 0, direction, nodes: new Map(), edges: new Map() };
  for (const n of laid.children ?? []) out.nodes.set(n.id, { x: n.x ?? 0, y: n.y ?? 0, width: n.width ?? 0, height: n.height ?? 0 });
  for (const e of (laid.edges ?? []) as ElkExtendedEdge[]) {
    const points: Point[] = [];
    for (const section of e.sections ?? []) {
      points.push(section.startPoint, ...(section.bendPoints ?? []), section.endPoint);
    }
    const label = e.labels?.[0];
    out.edges.set(e.id, {
      points,
      label: label ? { x: label.x ?? 0, y: label.y ?? 0, width: label.width ?? 0, height: label.height ?? 0 } : null,
    });
  }
  return out;
}
