import { EmptyFileSystem, type LangiumDocument } from 'langium';
import { clearDocuments, parseHelper } from 'langium/test';
import type { Diagnostic } from 'vscode-languageserver';
import { createVacnetServices } from '../src/vacnet-module.js';
import type { Document } from '../src/generated/ast.js';

export const { shared, Vacnet } = createVacnetServices(EmptyFileSystem);
const parse = parseHelper<Document>(Vacnet);

/** A small catalog most tests share. */
export const CATALOG = `
spec steel-10 material steel schedule 10 roughness 45 um conductive
hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm
tool carpet working orifice 7/8 in lifted orifice 1-1/4 in needs 5 inHg
producer exh-7 { curve { at 0 scfm 15 inHg  at 100 scfm 13 inHg  at 200 scfm 9 inHg } efficiency 55 % }
separator cyc loss 2 inH2O at 300 scfm
`;

/** A valid system body; tests splice lines into it. */
export function system(body: string): string {
  return `${CATALOG}
system "Test" {
  plant pr { producer exh-7  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 3 in length 35 ft horizontal
${body}
}
`;
}

/** Parses and validates one in-memory file (and any others given first, by uri). */
export async function check(text: string, others: Record<string, string> = {}): Promise<{ document: LangiumDocument<Document>; diagnostics: Diagnostic[] }> {
  await clearDocuments(shared);
  for (const [uri, otherText] of Object.entries(others)) {
    await parse(otherText, { documentUri: uri });
  }
  const document = await parse(text, { documentUri: 'file:///work/test.vacnet', validation: true });
  return { document, diagnostics: document.diagnostics ?? [] };
}

/** Diagnostics as `code@line:col` (1-based), sorted, for compact assertions. */
export function codes(diagnostics: Diagnostic[], severities: number[] = [1, 2]): string[] {
  return diagnostics
    .filter((d) => severities.includes(d.severity ?? 1))
    .map((d) => `${typeof d.code === 'string' ? d.code : (d.data as { code?: string })?.code ?? 'syntax'}@${d.range.start.line + 1}:${d.range.start.character + 1}`)
    .sort();
}

/** `line:col` (1-based) of the first occurrence of `marker` in `text` (after `after`, if given). */
export function at(text: string, marker: string, after = ''): string {
  const start = after ? text.indexOf(after) + 1 : 0;
  const offset = text.indexOf(marker, start < 0 ? 0 : start);
  if (offset < 0) throw new Error(`marker '${marker}' not in text`);
  const before = text.slice(0, offset).split('\n');
  return `${before.length}:${before.at(-1)!.length + 1}`;
}
