import type { SystemAnalysis, SystemModel } from '@vacnet/engine';
import { marginBand, MARGIN_BAND_TEXT, type MarginBand } from './margin-band.js';
import { nominalSizeText } from './nominal-size-text.js';
import type { QuantityText } from './quantity-text.js';

export type SchematicNodeKind = 'producer' | 'separator' | 'filter' | 'junction' | 'tap' | 'inlet';

/** A node of the schematic: equipment, a point where pipes meet, a place part-way along a pipe, or an inlet. */
export interface SchematicNode {
  id: string;
  kind: SchematicNodeKind;
  /** The element or point it stands for. */
  name: string;
  /** Text lines drawn in the node (empty for points). */
  lines: string[];
  /** Longer text for the accessible name and the tooltip. */
  title: string;
  /** Inlets: how the worst-case tool vacuum stands against the need. */
  band: MarginBand | null;
  /** A cleanout sits here. */
  cleanout: boolean;
  /** The design case's critical inlet. */
  critical: boolean;
}

export type SchematicEdgeKind = 'pipe' | 'equipment' | 'valve';

/** An edge, from the producer side to the far side. */
export interface SchematicEdge {
  id: string;
  source: string;
  target: string;
  kind: SchematicEdgeKind;
  pipe: string | null;
  /** Nominal size, m (pipes). */
  sizeM: number | null;
  /** Drawn beside the edge: pipe name and size, on the pipe's first part only. */
  label: string | null;
}

export interface SchematicModel {
  nodes: SchematicNode[];
  edges: SchematicEdge[];
  /** Inlets carry worst-case results. */
  hasResults: boolean;
  /** Bands that occur, for the legend. */
  bands: MarginBand[];
}

// Places along a pipe closer than 1 mm are one place (as the engine's topology takes them).
const SAME_PLACE_M = 1e-3;

/**
 * The network as a graph for the schematic: the plant's units as nodes
 * joined producer first, each named point a node, each pipe a chain of
 * edges through the places where inlets (or cleanouts) sit along it, and
 * each inlet a node hung from its place, labelled with its worst-case tool
 * vacuum and its margin to need. Built from the model alone, so a file with
 * errors still gets a schematic (without results).
 */
export function schematicModel(model: SystemModel, analysis: SystemAnalysis | undefined, text: QuantityText): SchematicModel {
  const nodes = new Map<string, SchematicNode>();
  const edges: SchematicEdge[] = [];
  const units = model.displayUnits;

  const equipment = new Map<string, { kind: 'producer' | 'separator' | 'filter'; model: string }>();
  for (const p of model.producers ?? []) equipment.set(p.name, { kind: 'producer', model: p.model?.name ?? '' });
  for (const s of model.separators ?? []) equipment.set(s.name, { kind: 'separator', model: s.model?.name ?? '' });
  for (const f of model.filters ?? []) equipment.set(f.name, { kind: 'filter', model: f.model?.name ?? '' });
  const cleanoutPoints = new Set((model.cleanouts ?? []).flatMap((c) => (c.position?.kind === 'point' ? [c.position.point] : [])));

  const pointNode = (name: string): string => {
    const id = `point:${name}`;
    if (!nodes.has(id)) {
      const unit = equipment.get(name);
      nodes.set(id, {
        id,
        kind: unit?.kind ?? 'junction',
        name,
        lines: unit ? [KIND_TITLE[unit.kind], unit.model || name] : [],
        title: unit ? `${KIND_TITLE[unit.kind]} ${name} (${unit.model})` : `point ${name}${cleanoutPoints.has(name) ? ', cleanout' : ''}`,
        band: null,
        cleanout: cleanoutPoints.has(name),
        critical: false,
      });
    }
    return id;
  };

  // The plant: producers first so the layout starts from them.
  for (const p of model.producers ?? []) pointNode(p.name);
  for (const unit of [...(model.filters ?? []), ...(model.separators ?? [])]) {
    const target = pointNode(unit.name);
    const source = pointNode(unit.towardProducer);
    edges.push({ id: `equipment:${unit.name}`, source, target, kind: 'equipment', pipe: null, sizeM: null, label: null });
  }

  // Places along each pipe where inlets or cleanouts sit.
  const pipes = new Map((model.pipes ?? []).map((p) => [p.name, p]));
  const stops = new Map<string, { at: number; cleanout: boolean }[]>();
  const addStop = (pipe: string, at: number, cleanout: boolean) => {
    const list = stops.get(pipe) ?? [];
    const same = list.find((s) => Math.abs(s.at - at) <= SAME_PLACE_M);
    if (same) same.cleanout ||= cleanout;
    else list.push({ at, cleanout });
    stops.set(pipe, list);
  };
  for (const inlet of model.inlets ?? []) if (inlet.position?.kind === 'on-pipe') addStop(inlet.position.pipe, inlet.position.distanceM, false);
  for (const c of model.cleanouts ?? []) if (c.position?.kind === 'on-pipe') addStop(c.position.pipe, c.position.distanceM, true);

  /** The node at a distance along a pipe: its ends, or the tap part-way. */
  const placeNode = new Map<string, { at: number; id: string }[]>();
  for (const pipe of model.pipes ?? []) {
    const from = pointNode(pipe.from);
    const to = pointNode(pipe.to);
    const places: { at: number; id: string }[] = [{ at: 0, id: from }];
    const cuts = (stops.get(pipe.name) ?? []).filter((s) => Number.isFinite(s.at)).sort((a, b) => a.at - b.at);
    cuts.forEach((cut, i) => {
      if (cut.at <= SAME_PLACE_M || cut.at >= pipe.lengthM - SAME_PLACE_M) {
        if (cut.cleanout) {
          const end = nodes.get(cut.at <= SAME_PLACE_M ? from : to);
          if (end) end.cleanout = true;
        }
        return;
      }
      const id = `tap:${pipe.name}:${i}`;
      nodes.set(id, {
        id,
        kind: 'tap',
        name: pipe.name,
        lines: [],
        title: `${text.length(cut.at)} along ${pipe.name}${cut.cleanout ? ', cleanout' : ''}`,
        band: null,
        cleanout: cut.cleanout,
        critical: false,
      });
      places.push({ at: cut.at, id });
    });
    places.push({ at: pipe.lengthM, id: to });
    placeNode.set(pipe.name, places);
    for (let s = 0; s + 1 < places.length; s++) {
      edges.push({
        id: `pipe:${pipe.name}:${s}`,
        source: places[s]!.id,
        target: places[s + 1]!.id,
        kind: 'pipe',
        pipe: pipe.name,
        sizeM: Number.isFinite(pipe.nominalSizeM) ? pipe.nominalSizeM : null,
        label: s === 0 ? `${pipe.name} \u00b7 ${nominalSizeText(pipe.nominalSizeM, units)}` : null,
      });
    }
  }

  // Inlets, hung from their place.
  const results = new Map((analysis?.inlets ?? []).map((i) => [i.name, i]));
  const critical = analysis?.designCase?.criticalInlet;
  const bands = new Set<MarginBand>();
  for (const inlet of model.inlets ?? []) {
    let at: string | undefined;
    if (inlet.position?.kind === 'point') at = pointNode(inlet.position.point);
    else if (inlet.position?.kind === 'on-pipe') {
      const position = inlet.position;
      const places = placeNode.get(position.pipe);
      if (places && pipes.has(position.pipe)) {
        at = places.reduce((best, p) => (Math.abs(p.at - position.distanceM) < Math.abs(best.at - position.distanceM) ? p : best)).id;
      }
    }
    const id = `inlet:${inlet.name}`;
    const wc = results.get(inlet.name)?.worstCase ?? null;
    const need = wc?.requiredToolVacuumPa ?? inlet.tool?.requiredVacuumPa ?? model.design?.defaultToolVacuumPa ?? null;
    const band = analysis ? marginBand(wc?.toolVacuumPa, need) : null;
    if (band) bands.add(band);
    const lines = [inlet.name];
    if (analysis) {
      lines.push(wc ? text.vacuum(wc.toolVacuumPa) : 'no result');
      if (wc && need !== null && need > 0) lines.push(`${text.signedPercent((wc.toolVacuumPa - need) / need)} on need`);
      else if (wc) lines.push('need not stated');
    }
    const room = inlet.label ? ` (${inlet.label})` : '';
    nodes.set(id, {
      id,
      kind: 'inlet',
      name: inlet.name,
      lines,
      title:
        `inlet ${inlet.name}${room}` +
        (wc ? `: ${text.vacuum(wc.toolVacuumPa)} at the tool in its worst case` + (need !== null ? `, needs ${text.vacuum(need)}, ${MARGIN_BAND_TEXT[band ?? 'unknown'].label}` : '') : ''),
      band,
      cleanout: false,
      critical: inlet.name === critical,
    });
    if (at) edges.push({ id: `valve:${inlet.name}`, source: at, target: id, kind: 'valve', pipe: null, sizeM: null, label: null });
  }

  return { nodes: [...nodes.values()], edges, hasResults: Boolean(analysis), bands: BAND_ORDER.filter((b) => bands.has(b)) };
}

const KIND_TITLE = { producer: 'Producer', separator: 'Separator', filter: 'Filter' } as const;
const BAND_ORDER: readonly MarginBand[] = ['ample', 'tight', 'short', 'unknown'];
