import type { SuppressedFinding, SystemAnalysis, SystemModel } from '@vacnet/engine';
import type { DiagnosticSeverity, VacnetDiagnostic } from '@vacnet/language';

/** One checked file: its path as shown to the user and its findings, in source order. */
export interface CheckedFile {
  /** Relative to the working folder. */
  path: string;
  diagnostics: VacnetDiagnostic[];
  /** The system in the file, when there is one. */
  model?: SystemModel;
  /** Its airflow analysis, when the file was free of structural errors. */
  analysis?: SystemAnalysis;
  /** Findings the file accepts, with their written reasons. */
  accepted?: SuppressedFinding[];
}

/** Counts over all checked files. */
export interface CheckSummary {
  files: number;
  errors: number;
  warnings: number;
  infos: number;
}

/** What `vacnet check` found; every output format prints this. */
export interface CheckResult {
  files: CheckedFile[];
  summary: CheckSummary;
}

/** Counts the files and the findings by severity. */
export function summarise(files: readonly CheckedFile[]): CheckSummary {
  const summary: CheckSummary = { files: files.length, errors: 0, warnings: 0, infos: 0 };
  for (const file of files) {
    for (const diagnostic of file.diagnostics) {
      summary[countKey[diagnostic.severity]]++;
    }
  }
  return summary;
}

const countKey: Record<DiagnosticSeverity, 'errors' | 'warnings' | 'infos'> = {
  error: 'errors',
  warning: 'warnings',
  info: 'infos',
};

/** Source order: by start line, then column; the sort is stable for ties. */
export function bySourcePosition(a: VacnetDiagnostic, b: VacnetDiagnostic): number {
  return a.range.start.line - b.range.start.line || a.range.start.character - b.range.start.character;
}
