/**
 * A finding located in a file, in the shape the command line, the tests and
 * the language server all share. Lines and characters are 0-based, as in LSP;
 * printers add 1 for people.
 */
export interface SourcePosition {
  line: number;
  character: number;
}

export interface SourceRange {
  start: SourcePosition;
  end: SourcePosition;
}

export type DiagnosticSeverity = 'error' | 'warning' | 'info';

export interface VacnetDiagnostic {
  severity: DiagnosticSeverity;
  /** Stable code; each has a page in docs/rules/<code>.md. */
  code: string;
  message: string;
  range: SourceRange;
  /** Where the finding comes from: the parser, the checks of the file itself, or the airflow engine. */
  source: 'syntax' | 'structure' | 'engine';
  /** Other places that explain the finding. */
  related?: { path: string; range: SourceRange; message: string; /** The document's URI, when known (a catalog element lives in another file). */ uri?: string }[];
  /** What a quick fix needs, plain JSON. */
  data?: Record<string, unknown>;
}
