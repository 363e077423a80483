import { EmptyFileSystem, URI } from 'langium';
import { createVacnetServices, type VacnetServices } from './vacnet-module.js';
import type { VacnetDiagnostic } from './diagnostic.js';
import { toVacnetDiagnostic } from './diagnostic-conversion.js';
import { StructureCodes } from './validation/codes.js';

let services: VacnetServices | undefined;

/**
 * The syntax errors of .vacnet source text, as `vacnet check` reports them
 * (same codes, messages and positions), without linking or any other
 * check: for tools that must know whether a text reads cleanly, such as the
 * formatter that refuses to rewrite a broken file.
 */
export async function syntaxErrorsOf(text: string): Promise<VacnetDiagnostic[]> {
  services ??= createVacnetServices(EmptyFileSystem).Vacnet;
  const document = services.shared.workspace.LangiumDocumentFactory.fromString(text, URI.parse('memory:///syntax-check.vacnet'));
  if (document.parseResult.lexerErrors.length === 0 && document.parseResult.parserErrors.length === 0) return [];
  const diagnostics = await services.validation.DocumentValidator.validateDocument(document, { categories: ['built-in'], stopAfterLexingErrors: true, stopAfterParsingErrors: true });
  return diagnostics.map(toVacnetDiagnostic).filter((d) => d.code === StructureCodes.syntaxError);
}
