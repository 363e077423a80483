import type { Diagnostic } from 'vscode-languageserver';
import { StructureCodes } from './validation/codes.js';
import type { DiagnosticSeverity, VacnetDiagnostic } from './diagnostic.js';

/** Converts a language-server diagnostic to ours (codes were given by the document validator). */
export function toVacnetDiagnostic(diagnostic: Diagnostic): VacnetDiagnostic {
  const code = typeof diagnostic.code === 'string' ? diagnostic.code : StructureCodes.syntaxError;
  const source: VacnetDiagnostic['source'] = code === StructureCodes.syntaxError ? 'syntax' : 'structure';
  return {
    severity: severityName(diagnostic.severity),
    code,
    message: typeof diagnostic.message === 'string' ? diagnostic.message : (diagnostic.message as { value: string }).value,
    range: diagnostic.range,
    source,
  };
}

function severityName(severity: number | undefined): DiagnosticSeverity {
  return severity === 1 || severity === undefined ? 'error' : severity === 2 ? 'warning' : 'info';
}
