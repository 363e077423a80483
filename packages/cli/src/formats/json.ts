import type { SystemAnalysis } from '@vacnet/engine';
import type { CheckResult, CheckSummary } from '../check-result.js';

/** One finding in the JSON format. Lines and columns are 1-based, as in the text format. */
export interface JsonDiagnostic {
  severity: 'error' | 'warning' | 'info';
  code: string;
  message: string;
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  source: string;
}

/** The JSON format's document; its shape is documented in the README. */
/** A finding the file accepts, with the reason written beside it. */
export interface JsonAccepted {
  code: string;
  message: string;
  element: { kind: string; name: string };
  reason: string;
  scope: string;
}

export interface JsonFile {
  path: string;
  diagnostics: JsonDiagnostic[];
  /** The system's name, when the file holds one. */
  system?: string;
  /** The airflow analysis in SI units (every numeric key ends with its unit); absent when not run. */
  analysis?: SystemAnalysis;
  accepted?: JsonAccepted[];
}

export interface JsonCheckOutput {
  files: JsonFile[];
  summary: CheckSummary;
}

/** Converts a check result to the JSON format's document. */
export function toJson(result: CheckResult): JsonCheckOutput {
  return {
    files: result.files.map((file) => ({
      path: file.path,
      diagnostics: file.diagnostics.map((d) => ({
        severity: d.severity,
        code: d.code,
        message: d.message,
        line: d.range.start.line + 1,
        column: d.range.start.character + 1,
        endLine: d.range.end.line + 1,
        endColumn: d.range.end.character + 1,
        source: d.source,
      })),
      ...(file.model ? { system: file.model.name } : {}),
      ...(file.analysis ? { analysis: file.analysis } : {}),
      ...(file.accepted
        ? {
            accepted: file.accepted.map((a) => ({
              code: a.finding.code,
              message: a.finding.message,
              element: { kind: a.finding.element.kind, name: a.finding.element.name },
              reason: a.reason,
              scope: a.scope,
            })),
          }
        : {}),
    })),
    summary: result.summary,
  };
}

/** The JSON format, pretty-printed, ending with a newline. */
export function formatJson(result: CheckResult): string {
  return JSON.stringify(toJson(result), null, 2) + '\n';
}
