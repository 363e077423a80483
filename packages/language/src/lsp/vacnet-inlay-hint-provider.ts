import { CstUtils, type AstNode, type CstNode, type LangiumDocument } from 'langium';
import type { InlayHintProvider, LangiumServices } from 'langium/lsp';
import type { InlayHint, InlayHintParams, Position, Range } from 'vscode-languageserver';
import type { InletAnalysis, PipeAnalysis, ProducerPoint } from '@vacnet/engine';
import type { AnalysisCache, DocumentAnalysis } from '../engine-bridge/analysis-cache.js';
import { display, nameList, type Display } from './analysis-text.js';

/** Significant digits of a hint: two keep it short beside the text (the hover gives three). */
const HINT_DIGITS = 2;

/**
 * Computed values at the end of the lines they belong to, from the cached
 * analysis of exactly this text version (never a solve of its own):
 *
 * - an inlet: vacuum at the tool and flow in its worst case, `7.4 inHg · 96 scfm`;
 * - a pipe: its lowest velocity with one operator, `min 3400 fpm`;
 * - the plant's producer: the design operating point and margin.
 *
 * Tooltips give the worst-case set and the vacuum at the inlet valve. Each
 * kind can be switched off in the settings (`vacnet.hints.*`).
 */
export class VacnetInlayHintProvider implements InlayHintProvider {
  private readonly cache: AnalysisCache;

  constructor(services: LangiumServices & { engine: { AnalysisCache: AnalysisCache } }) {
    this.cache = services.engine.AnalysisCache;
    // Build the hints of a new analysis as soon as it is in, so that requests only pick the lines in view.
    this.cache.onDidChange((state) => {
      if (state.status === 'ready') setImmediate(() => this.hintsOf(state));
    });
  }

  private hintsOf(state: DocumentAnalysis): InlayHint[] {
    let built = this.built.get(state);
    if (!built) {
      built = state.result?.analysis ? allHints(state) : [];
      this.built.set(state, built);
    }
    return built;
  }

  /** Every hint of an analysed version, built once (editors ask again on each scroll). */
  private readonly built = new WeakMap<DocumentAnalysis, InlayHint[]>();

  getInlayHints(document: LangiumDocument, params: InlayHintParams): InlayHint[] | undefined {
    const state = this.cache.current(document);
    if (!state?.result?.analysis || !state.lowered) return [];
    return this.hintsOf(state).filter((h) => inside(h.position, params.range));
  }
}

/** All hints of an analysis, in document order. */
function allHints(state: DocumentAnalysis): InlayHint[] {
  const analysis = state.result!.analysis!;
  // The kinds the editor settings and the project settings file both allow (set with the analysis; a change of either analyses again).
  const show = state.hints;
  const text = display(state.model?.displayUnits);
  const hints: InlayHint[] = [];
  const add = (node: AstNode | undefined, label: () => string, tooltip: () => string) => {
    const cst = node?.$cstNode;
    if (!cst) return;
    const position = cst.range.end.line === cst.range.start.line ? cst.range.end : endOfFirstLine(cst);
    hints.push({ position, label: label(), paddingLeft: true, tooltip: { kind: 'markdown', value: tooltip() } });
  };
  if (show.producer) {
    for (const producer of analysis.producers) add(nodeOf(state, 'producer', producer.name), () => producerLabel(producer, text), () => producerTooltip(producer, text));
  }
  if (show.pipeVelocity) {
    for (const pipe of analysis.pipes) {
      if (pipe.minVelocityMPerS === null || !Number.isFinite(pipe.minVelocityMPerS)) continue;
      add(nodeOf(state, 'pipe', pipe.name), () => `min ${text.velocity(pipe.minVelocityMPerS!)}`, () => pipeTooltip(pipe, text));
    }
  }
  if (show.inletVacuum) {
    for (const inlet of analysis.inlets) {
      const wc = inlet.worstCase;
      if (!wc || !Number.isFinite(wc.toolVacuumPa) || !Number.isFinite(wc.flowStdM3PerS)) continue;
      add(nodeOf(state, 'inlet', inlet.name), () => inletLabel(inlet, text), () => inletTooltip(inlet, text));
    }
  }
  return hints.sort((a, b) => a.position.line - b.position.line || a.position.character - b.position.character);
}

/** The label after an inlet: tool vacuum and flow in its worst case. */
export function inletLabel(inlet: InletAnalysis, text: Display): string {
  const wc = inlet.worstCase!;
  return `${text.pressure(wc.toolVacuumPa, HINT_DIGITS)} · ${text.flow(wc.flowStdM3PerS, 'standard', HINT_DIGITS)}`;
}

function inletTooltip(inlet: InletAnalysis, text: Display): string {
  const wc = inlet.worstCase!;
  const others = wc.openInlets.filter((n) => n !== inlet.name);
  const lines = [
    `**Inlet \`${inlet.name}\`, worst case**: ${others.length > 0 ? `with ${nameList(others)} also open` : 'its operator alone'} (${wc.method === 'exact' ? 'exact search' : 'greedy-swap search'}, ${wc.setsEvaluated} sets solved).`,
    `- at the tool: ${text.pressure(wc.toolVacuumPa)}${wc.requiredToolVacuumPa !== null ? ` (needs ${text.pressure(wc.requiredToolVacuumPa)})` : ''}`,
    `- at the inlet valve: ${text.pressure(wc.inletVacuumPa)}; the hose loses ${text.pressure(wc.hoseLossPa)}`,
    `- flow: ${text.flow(wc.flowStdM3PerS)}`,
  ];
  return lines.join('\n');
}

function pipeTooltip(pipe: PipeAnalysis, text: Display): string {
  const lines = [
    `**Pipe \`${pipe.name}\`**: lowest velocity with one operator ${text.velocity(pipe.minVelocityMPerS!)}${pipe.minVelocityInlet ? ` (tool working at \`${pipe.minVelocityInlet}\`)` : ''}, at the upstream end of the part that carries air.`,
  ];
  if (pipe.maxVelocityMPerS !== null) {
    lines.push(`Highest: ${text.velocity(pipe.maxVelocityMPerS)} with ${nameList(pipe.maxVelocityInlets)} open, tools lifted${pipe.lossPa !== null ? `; loss along the pipe then ${text.pressure(pipe.lossPa)}` : ''}.`);
  }
  return lines.join('\n\n');
}

export function producerLabel(producer: ProducerPoint, text: Display): string {
  const point = `${text.flow(producer.flowStdM3PerS, 'standard', HINT_DIGITS)} at ${text.pressure(producer.vacuumPa, HINT_DIGITS)}`;
  return producer.marginFraction !== null && Number.isFinite(producer.marginFraction) ? `${point} · margin ${text.percent(producer.marginFraction)}` : point;
}

function producerTooltip(producer: ProducerPoint, text: Display): string {
  const lines = [`**Producer \`${producer.name}\`** in the design case: ${text.flow(producer.flowStdM3PerS)} at ${text.pressure(producer.vacuumPa)} at its inlet.`];
  if (producer.demand && producer.marginFraction !== null) {
    lines.push(`Demand: ${text.flow(producer.demand.flowStdM3PerS)} at ${text.pressure(producer.demand.vacuumPa)} (the critical tool gets exactly what it needs); the curve gives ${text.percent(producer.marginFraction)} more flow there.`);
  }
  if (producer.shaftPowerW !== null) lines.push(`Shaft power: ${text.power(producer.shaftPowerW)}.`);
  if (producer.limited) lines.push(producer.limited === 'relief' ? 'Held on its vacuum relief.' : 'Beyond the end of its curve.');
  return lines.join('\n\n');
}

function nodeOf(state: DocumentAnalysis, kind: 'inlet' | 'pipe' | 'producer', name: string): AstNode | undefined {
  const found = state.lowered?.sources.find({ kind, name });
  // A plant is indexed as a producer too (by the plant's name); hints go on the producer unit.
  return found && (kind !== 'producer' || found.node.$type === 'ProducerUnit') ? found.node : undefined;
}

/** The end of the last token on an element's first line: a hint sits after the line, also when the element goes on below. */
function endOfFirstLine(cst: CstNode): Position {
  const line = cst.range.start.line;
  let end = cst.range.end;
  for (const leaf of CstUtils.flattenCst(cst)) {
    if (leaf.hidden) continue;
    if (leaf.range.start.line !== line) break;
    end = leaf.range.end;
  }
  return end;
}

function inside(position: Position, range: Range): boolean {
  const after = position.line > range.start.line || (position.line === range.start.line && position.character >= range.start.character);
  const before = position.line < range.end.line || (position.line === range.end.line && position.character <= range.end.character);
  return after && before;
}
