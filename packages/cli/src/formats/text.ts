import type { CheckResult, CheckSummary } from '../check-result.js';
import { PLAIN, type Palette } from '../terminal-colour.js';
import { describeSystem } from './system-summary.js';

export interface TextOptions {
  /** Styles for a terminal; plain by default. */
  palette?: Palette;
  /** Leave out the system summaries (`--quiet`: errors only). */
  findingsOnly?: boolean;
}

/**
 * The text format: one line per finding, `path:line:col severity code message`
 * with 1-based line and column (the form editors and terminals turn into
 * links); then, for each analysed system, a few indented lines on its
 * producer and its worst inlet; then a one-line summary. Colour, when on,
 * only wraps words: the text is the same without it.
 */
export function formatText(result: CheckResult, options: TextOptions = {}): string {
  const paint = options.palette ?? PLAIN;
  const lines: string[] = [];
  for (const file of result.files) {
    for (const d of file.diagnostics) {
      const line = d.range.start.line + 1;
      const column = d.range.start.character + 1;
      lines.push(`${paint.bold(`${file.path}:${line}:${column}`)} ${paint[d.severity](d.severity)} ${paint.dim(d.code)} ${oneLine(d.message)}`);
    }
  }
  if (!options.findingsOnly) {
    for (const file of result.files) {
      if (file.model && file.analysis) lines.push('', ...describeSystem(file.path, file.model, file.analysis, file.accepted ?? []));
    }
  }
  if (lines.length > 0) lines.push('');
  const summary = formatSummary(result.summary);
  lines.push(result.summary.errors > 0 ? paint.error(summary) : result.summary.warnings > 0 ? paint.warning(summary) : paint.good(summary));
  return lines.join('\n') + '\n';
}

/** `Checked 3 files: 1 error, 2 warnings, 0 infos.` */
export function formatSummary(summary: CheckSummary): string {
  return (
    `Checked ${count(summary.files, 'file')}: ` +
    `${count(summary.errors, 'error')}, ${count(summary.warnings, 'warning')}, ${count(summary.infos, 'info')}.`
  );
}

function count(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}

/** A finding stays on one line so each output line is one finding. */
export function oneLine(message: string): string {
  return message.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}
