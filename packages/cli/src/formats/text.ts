import type { CheckResult, CheckSummary } from '../check-result.js';
import { describeSystem } from './system-summary.js';

/**
 * The text format: one line per finding, `path:line:col severity code message`
 * with 1-based line and column (the form editors and terminals turn into
 * links); then, for each analysed system, a few indented lines on its
 * producer and its worst inlet; then a one-line summary.
 */
export function formatText(result: CheckResult): string {
  const lines: string[] = [];
  for (const file of result.files) {
    for (const d of file.diagnostics) {
      const line = d.range.start.line + 1;
      const column = d.range.start.character + 1;
      lines.push(`${file.path}:${line}:${column} ${d.severity} ${d.code} ${oneLine(d.message)}`);
    }
  }
  for (const file of result.files) {
    if (file.model && file.analysis) lines.push('', ...describeSystem(file.path, file.model, file.analysis, file.accepted ?? []));
  }
  if (lines.length > 0) lines.push('');
  lines.push(formatSummary(result.summary));
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
function oneLine(message: string): string {
  return message.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}
