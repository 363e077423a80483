import type { SuppressedFinding, SystemAnalysis, SystemModel } from '@vacnet/engine';
import type { DiagnosticSeverity, SourceRange, VacnetDiagnostic } from '@vacnet/language';

/** A finding the file accepts, with where the accepted element is written (when it can be found). */
export type AcceptedFinding = SuppressedFinding & { range?: SourceRange };

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
  accepted?: AcceptedFinding[];
  /** The project settings file that applied to this file's system. */
  settingsPath?: string;
  /** A project settings file (vacnet.json) listed for its own problems, not a .vacnet file. */
  settingsFile?: boolean;
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
  /** The working folder the paths are relative to (absolute). */
  cwd?: string;
}

/** Code of the finding on a file that could not be read (an I/O failure: exit code 2). */
export const FILE_UNREADABLE = 'file-unreadable';

/** True when some file could not be read. */
export function hasUnreadableFile(result: CheckResult): boolean {
  return result.files.some((file) => file.diagnostics.some((d) => d.code === FILE_UNREADABLE));
}

/** The result with only its errors, for `--quiet`; the summary still counts everything. */
export function errorsOnly(result: CheckResult): CheckResult {
  return { ...result, files: result.files.map((file) => ({ ...file, diagnostics: file.diagnostics.filter((d) => d.severity === 'error') })) };
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
