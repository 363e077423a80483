import { EmptyFileSystem, TextDocument, URI } from 'langium';
import { createVacnetServices, type VacnetServices } from '../vacnet-module.js';
import { VacnetFormatter } from './vacnet-formatter.js';

let services: VacnetServices | undefined;

/**
 * Formats .vacnet source text headlessly (for `vacnet fmt` and tests), with
 * the same layout as the editor's Format Document. Text with syntax errors
 * comes back unchanged: a broken file is never rearranged.
 */
export function formatText(text: string): string {
  services ??= createVacnetServices(EmptyFileSystem).Vacnet;
  const formatter = services.lsp.Formatter;
  if (!(formatter instanceof VacnetFormatter)) return text;
  const document = services.shared.workspace.LangiumDocumentFactory.fromString(text, URI.parse('memory:///format-text.vacnet'));
  const edits = formatter.layoutEdits(document);
  return edits.length === 0 ? text : TextDocument.applyEdits(document.textDocument, edits);
}
