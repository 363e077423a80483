import { MARGIN_BAND_TEXT, type MarginBand } from '../margin-band.js';
import { escapeHtml } from '../html-escape.js';
import { STANDALONE_SVG_STYLE } from '../report-style.js';
import type { SchematicEdge, SchematicModel, SchematicNode } from '../schematic-model.js';
import { layoutGraph, type LayoutDirection, type LayoutResult, type Point } from './layout.js';
import type { SvgOptions } from './producer-curve.js';
import { textWidth } from './text-width.js';

// Font sizes in px, as in the style sheet's schematic rules.
const NAME_PX = 11;
const VALUE_PX = 10.5;
const NOTE_PX = 9.5;
const KIND_PX = 9.5;
const LABEL_PX = 9.5;
const LINE = 13;
// The page width a figure gets before it is scaled down, and the height beyond which a tall drawing is scaled (our choices: about an A4 page).
const PAGE_WIDTH = 1040;
const PAGE_HEIGHT = 1250;
// 1 in = 0.0254 m (NIST SP 811); pipe strokes widen with size (our choice: 1.2 px plus 0.6 px an inch, at most 4.5 px).
const M_PER_IN = 0.0254;

interface Sized {
  node: SchematicNode;
  width: number;
  height: number;
}

/**
 * The network schematic: laid out by elkjs (layout.ts) in layers from the
 * plant, in whichever direction (plant on the left or on top) lets the
 * drawing fit a page at the larger scale. Inlets are boxes with their name,
 * worst-case tool vacuum and margin on need, filled by margin band with a
 * pattern (dots tight, hatching short) and marked with a symbol, so the
 * bands read without colour; pipes are labelled with name and size and
 * drawn wider for larger sizes. A legend inside the drawing explains it.
 */
export async function renderSchematicSvg(schematic: SchematicModel, options: SvgOptions = {}): Promise<string> {
  const id = options.idPrefix ?? 'vn';
  const sized = schematic.nodes.map(sizeNode);
  const layoutNodes = sized.map((s) => ({ id: s.node.id, width: s.width, height: s.height, first: s.node.kind === 'producer' }));
  const layoutEdges = schematic.edges.map((e) => ({
    id: e.id,
    source: e.source,
    target: e.target,
    ...(e.label ? { label: { width: textWidth(e.label, LABEL_PX) + 6, height: 12 } } : {}),
  }));
  const legend = legendItems(schematic);
  const legendHeight = legend.height;

  let best: LayoutResult | undefined;
  let bestScale = -1;
  for (const direction of ['RIGHT', 'DOWN'] as LayoutDirection[]) {
    const layout = await layoutGraph(layoutNodes, layoutEdges, direction);
    const width = Math.max(layout.width, legend.width);
    const height = layout.height + legendHeight;
    const scale = Math.min(1, PAGE_WIDTH / width, PAGE_HEIGHT / height);
    // Prefer the plant on the left unless the other way reads clearly larger (our choice: 10 %).
    if (scale > bestScale * 1.1) {
      best = layout;
      bestScale = scale;
    }
  }
  const layout = best!;
  const width = Math.ceil(Math.max(layout.width, legend.width));
  const height = Math.ceil(layout.height + legendHeight);
  const oy = legendHeight;

  const titleId = `${id}-schematic-title`;
  const descId = `${id}-schematic-desc`;
  const inlets = schematic.nodes.filter((n) => n.kind === 'inlet');
  const counts = new Map<MarginBand, number>();
  for (const n of inlets) if (n.band) counts.set(n.band, (counts.get(n.band) ?? 0) + 1);
  const desc =
    `Schematic of the piping from the plant (${layout.direction === 'RIGHT' ? 'left' : 'top'}) to ${inlets.length} inlets. ` +
    (schematic.hasResults
      ? `Each inlet shows its worst-case vacuum at the tool and its margin on what the tool needs: ` +
        [...counts].map(([band, c]) => `${c} ${MARGIN_BAND_TEXT[band].label}`).join(', ') +
        '.'
      : 'No results: the file has errors.');

  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" class="vn-svg vn-schematic" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" aria-labelledby="${titleId} ${descId}" data-direction="${layout.direction}">`,
    `<title id="${titleId}">Network schematic</title>`,
    `<desc id="${descId}">${escapeHtml(desc)}</desc>`,
  ];
  if (options.standalone) parts.push(`<style>${STANDALONE_SVG_STYLE}</style>`);
  parts.push(patterns(), `<rect class="vn-svg-bg" x="0" y="0" width="${width}" height="${height}"/>`);
  parts.push(legend.svg);

  // Edges under the nodes.
  const edgeParts: string[] = [];
  const labelParts: string[] = [];
  for (const edge of schematic.edges) {
    const laid = layout.edges.get(edge.id);
    if (!laid || laid.points.length < 2) continue;
    edgeParts.push(edgePath(edge, laid.points, oy));
    if (edge.label && laid.label) {
      labelParts.push(
        `<text class="vn-pipe-label vn-halo" x="${n(laid.label.x + 3)}" y="${n(oy + laid.label.y + 9.5)}" data-pipe="${escapeHtml(edge.pipe ?? '')}">${escapeHtml(edge.label)}</text>`,
      );
    }
  }
  parts.push(`<g class="vn-edges">${edgeParts.join('')}</g>`);

  const nodeParts: string[] = [];
  for (const s of sized) {
    const box = layout.nodes.get(s.node.id);
    if (!box) continue;
    nodeParts.push(drawNode(s.node, box.x, oy + box.y, box.width, box.height));
  }
  parts.push(`<g class="vn-nodes">${nodeParts.join('')}</g>`);
  parts.push(`<g class="vn-pipe-labels">${labelParts.join('')}</g>`);
  parts.push('</svg>');
  return parts.join('\n');
}

/** Node sizes in px from their text: 7 px padding each side, 12 px for a band mark, 13 px a line; points 5-9 px (our choices). */
function sizeNode(node: SchematicNode): Sized {
  switch (node.kind) {
    case 'inlet': {
      const widths = node.lines.map((line, i) => textWidth(line, i === 0 ? NAME_PX : i === 1 ? VALUE_PX : NOTE_PX, i === 0));
      const mark = node.band && MARGIN_BAND_TEXT[node.band].symbol ? 12 : 0;
      return { node, width: Math.max(44, Math.max(...widths) + 14 + mark), height: 8 + node.lines.length * LINE };
    }
    case 'producer':
    case 'separator':
    case 'filter': {
      const widths = [textWidth(node.lines[0] ?? '', KIND_PX, true) * 1.1, textWidth(node.lines[1] ?? '', VALUE_PX)];
      return { node, width: Math.max(...widths) + 18, height: 36 };
    }
    case 'junction':
      return { node, width: node.cleanout ? 9 : 7, height: node.cleanout ? 9 : 7 };
    case 'tap':
      return { node, width: node.cleanout ? 9 : 5, height: node.cleanout ? 9 : 5 };
  }
}

function drawNode(node: SchematicNode, x: number, y: number, w: number, h: number): string {
  const title = `<title>${escapeHtml(node.title)}</title>`;
  const data = `data-kind="${node.kind}" data-name="${escapeHtml(node.name)}"`;
  switch (node.kind) {
    case 'inlet': {
      const band = node.band ?? 'unknown';
      const cls = `vn-node vn-inlet vn-band-${band}${node.critical ? ' vn-critical' : ''}`;
      const symbol = node.band ? MARGIN_BAND_TEXT[node.band].symbol : '';
      const texts = node.lines
        .map((line, i) => {
          const c = i === 0 ? 'vn-node-name' : i === 1 ? 'vn-node-value' : 'vn-node-note';
          return `<text class="${c}" x="${n(x + 7)}" y="${n(y + 4 + LINE * (i + 1) - 3)}">${escapeHtml(line)}</text>`;
        })
        .join('');
      const mark = symbol ? `<text class="vn-band-mark" x="${n(x + w - 6)}" y="${n(y + LINE + 1)}" text-anchor="end">${escapeHtml(symbol)}</text>` : '';
      return `<g class="${cls}" ${data} data-band="${band}">${title}<rect x="${n(x)}" y="${n(y)}" width="${n(w)}" height="${n(h)}" rx="3"/>${texts}${mark}</g>`;
    }
    case 'producer':
    case 'separator':
    case 'filter':
      return (
        `<g class="vn-node vn-equipment vn-equipment-${node.kind}" ${data}>${title}` +
        `<rect x="${n(x)}" y="${n(y)}" width="${n(w)}" height="${n(h)}" rx="${node.kind === 'producer' ? 8 : 2}"/>` +
        `<text class="vn-node-kind" x="${n(x + 9)}" y="${n(y + 14)}">${escapeHtml(node.lines[0] ?? '')}</text>` +
        `<text x="${n(x + 9)}" y="${n(y + 28)}">${escapeHtml(node.lines[1] ?? '')}</text></g>`
      );
    case 'junction':
    case 'tap':
      if (node.cleanout) {
        return `<g class="vn-node vn-point" ${data}>${title}<rect class="vn-cleanout" x="${n(x)}" y="${n(y)}" width="${n(w)}" height="${n(h)}"/></g>`;
      }
      return `<g class="vn-node vn-point" ${data}>${title}<circle class="vn-junction" cx="${n(x + w / 2)}" cy="${n(y + h / 2)}" r="${n(w / 2)}"/></g>`;
  }
}

function edgePath(edge: SchematicEdge, points: readonly Point[], oy: number): string {
  const d = points.map((p, i) => `${i === 0 ? 'M' : 'L'}${n(p.x)} ${n(oy + p.y)}`).join(' ');
  if (edge.kind === 'pipe') {
    const inches = edge.sizeM !== null ? edge.sizeM / M_PER_IN : 2;
    const stroke = Math.min(4.5, 1.2 + 0.6 * inches);
    return `<path class="vn-pipe" d="${d}" stroke-width="${n(stroke)}" data-pipe="${escapeHtml(edge.pipe ?? '')}"/>`;
  }
  return `<path class="${edge.kind === 'equipment' ? 'vn-pipe-equipment' : 'vn-valve'}" d="${d}"/>`;
}

/** Fill patterns of the bands that need one: dots for tight, hatching for short. */
function patterns(): string {
  return (
    '<defs>' +
    '<pattern id="vn-pattern-tight" patternUnits="userSpaceOnUse" width="6" height="6"><rect class="vn-pattern-tight-bg" width="6" height="6"/><circle class="vn-pattern-tight-dot" cx="3" cy="3" r="1.1"/></pattern>' +
    '<pattern id="vn-pattern-short" patternUnits="userSpaceOnUse" width="7" height="7" patternTransform="rotate(45)"><rect class="vn-pattern-short-bg" width="7" height="7"/><line class="vn-pattern-short-line" x1="0" y1="0" x2="0" y2="7"/></pattern>' +
    '</defs>'
  );
}

/** The legend strip at the top: the bands present, then the symbols. */
function legendItems(schematic: SchematicModel): { svg: string; width: number; height: number } {
  const items: { swatch: string; text: string; width: number }[] = [];
  const x0 = 12;
  for (const band of schematic.bands) {
    const b = MARGIN_BAND_TEXT[band];
    const text = `${b.symbol ? `${b.symbol} ` : ''}${capital(b.label)}: ${b.description}`;
    items.push({ swatch: `<rect class="vn-band-${band}" x="0" y="-9" width="22" height="12" rx="2"/>`, text, width: 30 + textWidth(text, 10.5) });
  }
  if (schematic.nodes.some((n) => n.critical)) {
    items.push({ swatch: '<rect class="vn-band-unknown vn-legend-critical" x="0" y="-9" width="22" height="12" rx="2"/>', text: 'Heavy outline: the design case\u2019s critical inlet', width: 30 + textWidth('Heavy outline: the design case\u2019s critical inlet', 10.5) });
  }
  items.push({ swatch: '<rect class="vn-cleanout" x="7" y="-8" width="9" height="9"/>', text: 'Cleanout', width: 30 + textWidth('Cleanout', 10.5) });
  items.push({ swatch: '<line class="vn-valve" x1="0" y1="-3" x2="22" y2="-3"/>', text: 'Inlet valve on its pipe', width: 30 + textWidth('Inlet valve on its pipe', 10.5) });

  // Wrap the items into rows no wider than a page.
  const rows: { items: typeof items; width: number }[] = [];
  for (const item of items) {
    const row = rows[rows.length - 1];
    if (row && row.width + item.width + 18 <= PAGE_WIDTH - 2 * x0) {
      row.items.push(item);
      row.width += item.width + 18;
    } else rows.push({ items: [item], width: item.width });
  }
  const title = schematic.hasResults ? 'Inlets: worst-case vacuum at the tool and margin on what the tool needs' : 'Inlets (no results: the file has errors)';
  const parts = [`<g class="vn-legend" transform="translate(${x0} 0)"><text class="vn-legend-title" x="0" y="16">${escapeHtml(title)}</text>`];
  rows.forEach((row, r) => {
    let x = 0;
    const y = 36 + r * 20;
    for (const item of row.items) {
      parts.push(`<g transform="translate(${n(x)} ${y})">${item.swatch}<text class="vn-legend-text" x="30" y="1">${escapeHtml(item.text)}</text></g>`);
      x += item.width + 18;
    }
  });
  parts.push('</g>');
  const width = Math.max(textWidth(title, 10.5, true), ...rows.map((r) => r.width)) + 2 * x0;
  return { svg: parts.join(''), width, height: 36 + rows.length * 20 + 4 };
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function n(x: number): string {
  return Number.isFinite(x) ? String(Math.round(x * 10) / 10) : '0';
}
