import { formatSignificant, fromSI, pchip, type DisplayUnits } from '@vacnet/engine';
import type { CurvePlotModel, PlotPoint } from '../curve-plot-model.js';
import { escapeHtml } from '../html-escape.js';
import { STANDALONE_SVG_STYLE } from '../report-style.js';
import { axisTicks, tickText } from './axis-ticks.js';
import type { Box, Point } from './layout.js';
import { placeLabels } from './label-placement.js';
import { textWidth } from './text-width.js';

export interface SvgOptions {
  /** A file of its own: carries its style sheet and an opaque background (for Markdown). */
  standalone?: boolean;
  /** Prefix of the ids inside the SVG, unique on the page (default `vn`). */
  idPrefix?: string;
}

// Drawing size in px (our choice: fits an A4 or Letter page width at about 100 %).
const WIDTH = 760;
const HEIGHT = 440;
const PLOT = { left: 72, right: WIDTH - 18, top: 18, bottom: HEIGHT - 58 };
// Samples of the system demand curve between its solved points (our choice: smooth at this size).
const DEMAND_SAMPLES = 80;
// Line pitch of the callouts in px, for 11 px text (our choice).
const LINE_HEIGHT = 14;

/**
 * The producer curve plot: vacuum at the producer inlet against standard
 * flow, in the display units. Draws the curve through the maker's points
 * (PCHIP samples from the model), the curve less the exhaust loss, the
 * system demand curve of the design case, the vacuum relief, the operating
 * point, the demand point and the flow margin between demand and curve,
 * with axes, ticks, a legend and text callouts (shapes and dash patterns
 * tell the lines apart, not colour alone).
 */
export function renderProducerCurveSvg(plot: CurvePlotModel, units: DisplayUnits, options: SvgOptions = {}): string {
  const id = options.idPrefix ?? 'vn';
  const flowUnit = fromSI(1, 'flow', units, { flowBasis: 'standard' }).unit;
  const vacuumUnit = fromSI(1, 'pressure', units).unit;
  const fx = (q: number) => fromSI(q, 'flow', units, { flowBasis: 'standard' }).value;
  const fy = (v: number) => fromSI(v, 'pressure', units).value;

  // The demand curve, smoothed through its solved points (flow rises monotonically with vacuum).
  let demandLine: PlotPoint[] = [];
  if (plot.demandCurve && plot.demandCurve.length >= 2) {
    const solved = plot.demandCurve;
    const smooth = pchip(
      solved.map((p) => p.vacuumPa),
      solved.map((p) => p.flowStdM3PerS),
    );
    const top = solved[solved.length - 1]!.vacuumPa;
    demandLine = smooth
      ? Array.from({ length: DEMAND_SAMPLES + 1 }, (_, i) => {
          const v = (top * i) / DEMAND_SAMPLES;
          return { vacuumPa: v, flowStdM3PerS: Math.max(0, smooth.at(v).value) };
        })
      : solved.map((p) => ({ ...p }));
  }

  const all: PlotPoint[] = [...plot.curveSamples, ...(plot.netSamples ?? []), ...demandLine];
  if (plot.operating) all.push(plot.operating);
  if (plot.demand) all.push(plot.demand);
  const maxFlow = Math.max(...all.map((p) => fx(p.flowStdM3PerS)), plot.marginFlowStdM3PerS !== null ? fx(plot.marginFlowStdM3PerS) : 0);
  const maxVacuum = Math.max(...plot.curveSamples.map((p) => fy(p.vacuumPa)), plot.reliefVacuumPa !== null ? fy(plot.reliefVacuumPa) : 0, plot.operating ? fy(plot.operating.vacuumPa) : 0);
  const xTicks = axisTicks(0, maxFlow * 1.03, 8);
  const yTicks = axisTicks(0, maxVacuum * 1.06, 6);
  const px = (q: number) => PLOT.left + ((fx(q) - xTicks.min) / (xTicks.max - xTicks.min)) * (PLOT.right - PLOT.left);
  const py = (v: number) => PLOT.bottom - ((fy(v) - yTicks.min) / (yTicks.max - yTicks.min)) * (PLOT.bottom - PLOT.top);
  const toPx = (p: PlotPoint): Point => ({ x: px(p.flowStdM3PerS), y: py(p.vacuumPa) });
  const path = (points: readonly PlotPoint[]) => points.map((p, i) => `${i === 0 ? 'M' : 'L'}${n(px(p.flowStdM3PerS))} ${n(py(p.vacuumPa))}`).join(' ');

  const vac = (pa: number) => `${formatSignificant(fy(pa), 3)} ${vacuumUnit}`;
  const flo = (q: number) => `${formatSignificant(fx(q), 3)} ${flowUnit}`;
  const parts: string[] = [];
  const titleId = `${id}-curve-title`;
  const descId = `${id}-curve-desc`;
  const title = `Producer curve of ${plot.modelName} (${plot.producerName}) with the system demand`;
  const desc = describe(plot, vac, flo);
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" class="vn-svg vn-producer-curve" width="${WIDTH}" height="${HEIGHT}" viewBox="0 0 ${WIDTH} ${HEIGHT}" role="img" aria-labelledby="${titleId} ${descId}">`,
    `<title id="${titleId}">${escapeHtml(title)}</title>`,
    `<desc id="${descId}">${escapeHtml(desc)}</desc>`,
  );
  if (options.standalone) parts.push(`<style>${STANDALONE_SVG_STYLE}</style>`);
  parts.push(
    `<defs><clipPath id="${id}-plot-clip"><rect x="${PLOT.left}" y="${PLOT.top}" width="${PLOT.right - PLOT.left}" height="${PLOT.bottom - PLOT.top}"/></clipPath></defs>`,
    `<rect class="vn-svg-bg" x="0" y="0" width="${WIDTH}" height="${HEIGHT}"/>`,
    `<rect class="vn-plot-area" x="${PLOT.left}" y="${PLOT.top}" width="${PLOT.right - PLOT.left}" height="${PLOT.bottom - PLOT.top}"/>`,
  );

  // Grid, ticks and axis titles.
  const grid: string[] = [];
  for (const v of xTicks.values) {
    const x = PLOT.left + ((v - xTicks.min) / (xTicks.max - xTicks.min)) * (PLOT.right - PLOT.left);
    grid.push(`<line class="vn-grid" x1="${n(x)}" y1="${PLOT.top}" x2="${n(x)}" y2="${PLOT.bottom}"/>`);
    grid.push(`<text class="vn-tick-label vn-tick-x" x="${n(x)}" y="${PLOT.bottom + 16}" text-anchor="middle" data-value="${v}">${tickText(v, xTicks.step)}</text>`);
  }
  for (const v of yTicks.values) {
    const y = PLOT.bottom - ((v - yTicks.min) / (yTicks.max - yTicks.min)) * (PLOT.bottom - PLOT.top);
    grid.push(`<line class="vn-grid" x1="${PLOT.left}" y1="${n(y)}" x2="${PLOT.right}" y2="${n(y)}"/>`);
    grid.push(`<text class="vn-tick-label vn-tick-y" x="${PLOT.left - 8}" y="${n(y + 3.5)}" text-anchor="end" data-value="${v}">${tickText(v, yTicks.step)}</text>`);
  }
  parts.push(`<g class="vn-grid-group">${grid.join('')}</g>`);
  parts.push(
    `<line class="vn-axis" x1="${PLOT.left}" y1="${PLOT.bottom}" x2="${PLOT.right}" y2="${PLOT.bottom}"/>`,
    `<line class="vn-axis" x1="${PLOT.left}" y1="${PLOT.top}" x2="${PLOT.left}" y2="${PLOT.bottom}"/>`,
    `<text class="vn-axis-title" x="${n((PLOT.left + PLOT.right) / 2)}" y="${HEIGHT - 16}" text-anchor="middle">Flow, ${escapeHtml(flowUnit)} (standard air)</text>`,
    `<text class="vn-axis-title" transform="translate(18 ${n((PLOT.top + PLOT.bottom) / 2)}) rotate(-90)" text-anchor="middle">Vacuum at the producer inlet, ${escapeHtml(vacuumUnit)}</text>`,
  );

  // Lines, clipped to the plot area.
  const lines: string[] = [];
  if (plot.reliefVacuumPa !== null) {
    const y = py(plot.reliefVacuumPa);
    lines.push(`<line class="vn-relief" x1="${PLOT.left}" y1="${n(y)}" x2="${PLOT.right}" y2="${n(y)}"/>`);
  }
  lines.push(`<path class="vn-curve-producer" d="${path(plot.curveSamples)}"/>`);
  if (plot.netSamples) lines.push(`<path class="vn-curve-net" d="${path(plot.netSamples)}"/>`);
  if (demandLine.length > 1) lines.push(`<path class="vn-curve-system" d="${path(demandLine)}"/>`);
  parts.push(`<g clip-path="url(#${id}-plot-clip)">${lines.join('')}</g>`);
  // The maker's points on the curve.
  parts.push(`<g class="vn-curve-points">${plot.curvePoints.map((p) => `<circle class="vn-curve-point" cx="${n(px(p.flowStdM3PerS))}" cy="${n(py(p.vacuumPa))}" r="3"/>`).join('')}</g>`);

  // Margin: from the demand point along its vacuum to the curve.
  const callouts: { lines: { text: string; strong?: boolean }[]; anchor: Point; prefer: 'right-up' | 'left-down' | 'below' | 'right' }[] = [];
  const obstacles: Box[] = [];
  if (plot.demand && plot.marginFlowStdM3PerS !== null && plot.marginFraction !== null) {
    const y = py(plot.demand.vacuumPa);
    const x1 = px(plot.demand.flowStdM3PerS);
    const x2 = px(plot.marginFlowStdM3PerS);
    if (Math.abs(x2 - x1) > 8) {
      const dir = x2 > x1 ? 1 : -1;
      parts.push(
        `<g class="vn-margin"><line class="vn-margin-line" x1="${n(x1 + dir * 7)}" y1="${n(y)}" x2="${n(x2 - dir * 6)}" y2="${n(y)}"/>` +
          `<path class="vn-margin-arrow" d="M${n(x2)} ${n(y)} l${-dir * 7} -3.5 l0 7 z"/></g>`,
      );
      const required = plot.requiredMarginFraction !== null ? ` (${Math.round(plot.requiredMarginFraction * 100)} % required)` : '';
      callouts.push({
        lines: [{ text: `${signed(plot.marginFraction)} flow margin${required}` }],
        anchor: { x: (x1 + x2) / 2, y },
        prefer: 'below',
      });
    }
  }
  if (plot.demand) {
    const c = toPx(plot.demand);
    parts.push(`<path class="vn-demand-point" d="M${n(c.x)} ${n(c.y - 6)} l6 6 l-6 6 l-6 -6 z"/>`);
    obstacles.push({ x: c.x - 7, y: c.y - 7, width: 14, height: 14 });
    callouts.push({
      lines: [{ text: 'Demand point', strong: true }, { text: `${flo(plot.demand.flowStdM3PerS)} at ${vac(plot.demand.vacuumPa)}` }, { text: plot.designInlets[0] ? `${plot.designInlets[0]} gets exactly its need` : 'the critical tool gets exactly its need' }],
      anchor: c,
      prefer: 'left-down',
    });
  }
  if (plot.operating) {
    const c = toPx(plot.operating);
    parts.push(`<circle class="vn-op-point" cx="${n(c.x)}" cy="${n(c.y)}" r="6"/>`);
    obstacles.push({ x: c.x - 7, y: c.y - 7, width: 14, height: 14 });
    const limited = plot.operating.limited === 'curve-end' ? ' (past the curve)' : plot.operating.limited === 'relief' ? ' (on relief)' : '';
    callouts.unshift({
      lines: [{ text: `Operating point${limited}`, strong: true }, { text: `${flo(plot.operating.flowStdM3PerS)} at ${vac(plot.operating.vacuumPa)}` }],
      anchor: c,
      prefer: 'right-up',
    });
  }
  if (plot.reliefVacuumPa !== null) {
    callouts.push({ lines: [{ text: `Vacuum relief ${vac(plot.reliefVacuumPa)}` }], anchor: { x: PLOT.left + 40, y: py(plot.reliefVacuumPa) }, prefer: 'right-up' });
  }

  // Legend.
  const legendRows: { kind: string; text: string }[] = [{ kind: 'producer', text: `Producer curve, ${plot.modelName}` }];
  if (plot.netSamples) legendRows.push({ kind: 'net', text: 'Curve less exhaust line loss' });
  if (demandLine.length > 1) legendRows.push({ kind: 'system', text: 'System demand, design case' });
  if (plot.operating) legendRows.push({ kind: 'op', text: 'Operating point' });
  if (plot.demand) legendRows.push({ kind: 'demand', text: 'Demand point' });
  if (plot.reliefVacuumPa !== null) legendRows.push({ kind: 'relief', text: 'Vacuum relief setting' });
  const legendWidth = Math.max(...legendRows.map((r) => textWidth(r.text, 10.5))) + 52;
  const legendHeight = legendRows.length * 17 + 10;

  const drawn: Point[] = [...plot.curveSamples, ...(plot.netSamples ?? []), ...demandLine].map(toPx);
  // Straight lines as points every 6 px, so labels keep off them too.
  const along = (x1: number, x2: number, y: number): Point[] => {
    const count = Math.max(2, Math.ceil(Math.abs(x2 - x1) / 6));
    return Array.from({ length: count }, (_, i) => ({ x: x1 + ((x2 - x1) * i) / (count - 1), y }));
  };
  if (plot.reliefVacuumPa !== null) drawn.push(...along(PLOT.left, PLOT.right, py(plot.reliefVacuumPa)));
  if (plot.demand && plot.marginFlowStdM3PerS !== null) drawn.push(...along(px(plot.demand.flowStdM3PerS), px(plot.marginFlowStdM3PerS), py(plot.demand.vacuumPa)));
  const bounds: Box = { x: PLOT.left + 2, y: PLOT.top + 2, width: PLOT.right - PLOT.left - 4, height: PLOT.bottom - PLOT.top - 4 };
  const [legendBox] = placeLabels(
    [
      {
        width: legendWidth,
        height: legendHeight,
        candidates: [
          { x: PLOT.right - legendWidth - 10, y: PLOT.top + 10 },
          { x: PLOT.right - legendWidth - 10, y: (PLOT.top + PLOT.bottom) / 2 - legendHeight / 2 },
          { x: PLOT.left + 10, y: PLOT.bottom - legendHeight - 10 },
          { x: PLOT.right - legendWidth - 10, y: PLOT.bottom - legendHeight - 10 },
        ],
      },
    ],
    bounds,
    obstacles,
    drawn,
  );
  obstacles.push(legendBox!);

  const requests = callouts.map((c) => {
    const width = Math.max(...c.lines.map((l) => textWidth(l.text, 11, l.strong))) + 8;
    const height = c.lines.length * LINE_HEIGHT + 4;
    return { width, height, candidates: candidatesAround(c.anchor, width, height, c.prefer) };
  });
  const boxes = placeLabels(requests, bounds, obstacles, drawn);
  callouts.forEach((c, i) => {
    const box = boxes[i]!;
    const near = nearestPoint(box, c.anchor);
    const far = Math.hypot(near.x - c.anchor.x, near.y - c.anchor.y);
    const leader = far > 10 ? `<line class="vn-leader" x1="${n(c.anchor.x)}" y1="${n(c.anchor.y)}" x2="${n(near.x)}" y2="${n(near.y)}"/>` : '';
    const texts = c.lines
      .map((l, k) => `<text class="${l.strong ? 'vn-callout-strong' : 'vn-callout'} vn-halo" x="${n(box.x + 4)}" y="${n(box.y + 13 + k * LINE_HEIGHT)}">${escapeHtml(l.text)}</text>`)
      .join('');
    parts.push(`<g class="vn-callout-group">${leader}${texts}</g>`);
  });

  const lx = legendBox!.x;
  const ly = legendBox!.y;
  const legend: string[] = [`<rect class="vn-legend-box" x="${n(lx)}" y="${n(ly)}" width="${n(legendWidth)}" height="${n(legendHeight)}" rx="3"/>`];
  legendRows.forEach((row, i) => {
    const y = ly + 14 + i * 17;
    const sx = lx + 10;
    legend.push(legendSymbol(row.kind, sx, y - 4));
    legend.push(`<text class="vn-legend-text" x="${n(sx + 34)}" y="${n(y)}">${escapeHtml(row.text)}</text>`);
  });
  parts.push(`<g class="vn-legend">${legend.join('')}</g>`);
  parts.push('</svg>');
  return parts.join('\n');
}

/** A one-paragraph text version of the plot, for screen readers and the figure's description. */
function describe(plot: CurvePlotModel, vac: (pa: number) => string, flo: (q: number) => string): string {
  const out = [`Vacuum at the producer inlet against standard flow for ${plot.modelName}, through ${plot.curvePoints.length} points from the curve.`];
  if (plot.operating) out.push(`Operating point: ${flo(plot.operating.flowStdM3PerS)} at ${vac(plot.operating.vacuumPa)}.`);
  if (plot.demand) out.push(`Demand point: ${flo(plot.demand.flowStdM3PerS)} at ${vac(plot.demand.vacuumPa)}.`);
  if (plot.marginFraction !== null) out.push(`Flow margin ${signed(plot.marginFraction)}.`);
  if (plot.reliefVacuumPa !== null) out.push(`Vacuum relief at ${vac(plot.reliefVacuumPa)}.`);
  if (!plot.demandCurve) out.push(plot.demandCurveNote);
  return out.join(' ');
}

function legendSymbol(kind: string, x: number, y: number): string {
  switch (kind) {
    case 'producer':
      return `<line class="vn-curve-producer" x1="${n(x)}" y1="${n(y)}" x2="${n(x + 26)}" y2="${n(y)}"/><circle class="vn-curve-point" cx="${n(x + 13)}" cy="${n(y)}" r="3"/>`;
    case 'net':
      return `<line class="vn-curve-net" x1="${n(x)}" y1="${n(y)}" x2="${n(x + 26)}" y2="${n(y)}"/>`;
    case 'system':
      return `<line class="vn-curve-system" x1="${n(x)}" y1="${n(y)}" x2="${n(x + 26)}" y2="${n(y)}"/>`;
    case 'op':
      return `<circle class="vn-op-point" cx="${n(x + 13)}" cy="${n(y)}" r="5"/>`;
    case 'demand':
      return `<path class="vn-demand-point" d="M${n(x + 13)} ${n(y - 5)} l5 5 l-5 5 l-5 -5 z"/>`;
    default:
      return `<line class="vn-relief" x1="${n(x)}" y1="${n(y)}" x2="${n(x + 26)}" y2="${n(y)}"/>`;
  }
}

/** Candidate corners for a callout of this size around its anchor, the preferred side first. */
function candidatesAround(a: Point, w: number, h: number, prefer: 'right-up' | 'left-down' | 'below' | 'right'): Point[] {
  // 10 px from the anchor, then 30 px across and 26 px up or down with a leader line (our choices).
  const gap = 10;
  const rightUp = { x: a.x + gap, y: a.y - h - gap / 2 };
  const rightDown = { x: a.x + gap, y: a.y + gap / 2 };
  const leftUp = { x: a.x - w - gap, y: a.y - h - gap / 2 };
  const leftDown = { x: a.x - w - gap, y: a.y + gap / 2 };
  const below = { x: a.x - w / 2, y: a.y + 4 };
  const above = { x: a.x - w / 2, y: a.y - h - 4 };
  const right = { x: a.x + gap, y: a.y - h / 2 };
  const left = { x: a.x - w - gap, y: a.y - h / 2 };
  const near = {
    'right-up': [rightUp, right, above, leftUp, rightDown, below, leftDown, left],
    'left-down': [leftDown, below, left, rightDown, leftUp, above, rightUp, right],
    below: [below, above, rightDown, leftDown, rightUp, leftUp],
    right: [right, rightUp, rightDown, left, above, below],
  }[prefer];
  // Then the same sides farther out, with a leader line.
  const farther = near.map((p) => ({ x: a.x + (p.x - a.x) * 1.0 + Math.sign(p.x + w / 2 - a.x) * 30, y: a.y + (p.y - a.y) + Math.sign(p.y + h / 2 - a.y) * 26 }));
  return [...near, ...farther];
}

/** The point of a box nearest to another point (for leader lines). */
function nearestPoint(box: Box, p: Point): Point {
  return { x: Math.min(Math.max(p.x, box.x), box.x + box.width), y: Math.min(Math.max(p.y, box.y + 2), box.y + box.height - 2) };
}

function signed(fraction: number): string {
  const pct = Math.round(fraction * 100);
  return `${pct >= 0 ? '+' : '\u2212'}${Math.abs(pct)} %`;
}

/** Coordinates to 0.1 px. */
function n(x: number): string {
  return Number.isFinite(x) ? String(Math.round(x * 10) / 10) : '0';
}
