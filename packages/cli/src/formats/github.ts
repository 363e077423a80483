import type { CheckResult } from '../check-result.js';
import { formatSummary } from './text.js';

/**
 * The `github` format: one workflow command per finding, which a CI runner
 * that understands them turns into an annotation on the line:
 *   ::error file=plant.vacnet,line=12,col=5,endLine=12,endColumn=9,title=starved-inlet::message
 * (`warning` for warnings, `notice` for infos), then the summary as a plain
 * log line. Lines and columns are 1-based. Values are escaped as the
 * workflow-command syntax requires: in the message %, CR and LF; in a
 * property also `:` and `,`.
 */
export function formatGithub(result: CheckResult): string {
  const lines: string[] = [];
  for (const file of result.files) {
    for (const d of file.diagnostics) {
      const properties = [
        ['file', file.path.replace(/\\/g, '/')],
        ['line', String(d.range.start.line + 1)],
        ['col', String(d.range.start.character + 1)],
        ['endLine', String(d.range.end.line + 1)],
        ['endColumn', String(d.range.end.character + 1)],
        ['title', d.code],
      ]
        .map(([key, value]) => `${key}=${escapeProperty(value!)}`)
        .join(',');
      lines.push(`::${COMMAND[d.severity]} ${properties}::${escapeData(d.message)}`);
    }
  }
  lines.push(formatSummary(result.summary));
  return lines.join('\n') + '\n';
}

const COMMAND = { error: 'error', warning: 'warning', info: 'notice' } as const;

/** Escapes a command's message: % first, so the escapes it adds are not escaped again. */
export function escapeData(text: string): string {
  return text.replace(/%/g, '%25').replace(/\r/g, '%0D').replace(/\n/g, '%0A');
}

/** Escapes a property value: as the message, and `:` and `,`, which end a property. */
export function escapeProperty(text: string): string {
  return escapeData(text).replace(/:/g, '%3A').replace(/,/g, '%2C');
}
