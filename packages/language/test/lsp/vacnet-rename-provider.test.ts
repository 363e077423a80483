// Rename across files: a name declared in a catalog and used by a system
// through `use`, and a point declared by a pipe's `to NAME`. Expected edits
// follow the LSP 3.17 rename request (a WorkspaceEdit with one TextEdit per
// occurrence, per document).
import { clearDocuments, parseHelper } from 'langium/test';
import { TextDocument, type LangiumDocument } from 'langium';
import type { TextEdit, WorkspaceEdit } from 'vscode-languageserver';
import { beforeEach, describe, expect, it } from 'vitest';
import { shared, Vacnet } from '../helpers.js';
import type { VacnetRenameProvider } from '../../src/lsp/vacnet-rename-provider.js';

const parse = parseHelper(Vacnet);
const CATALOG_URI = 'file:///work/catalog/equipment.vacnet';
const SYSTEM_URI = 'file:///work/system.vacnet';

const CATALOG = `hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm
tool carpet working orifice 7/8 in needs 5 inHg
spec steel-10 roughness 45 um
producer exh { curve { at 0 scfm 8 inHg at 300 scfm 6 inHg } }
`;
const SYSTEM = `use "catalog/equipment.vacnet"
system "Rename" {
  defaults hose std-50 tool carpet
  plant pr { producer exh }
  pipe main from pr to j-1 spec steel-10 size 3 in length 40 ft horizontal
  pipe b1 from j-1 to e-1 spec steel-10 size 2 in length 20 ft horizontal
  pipe loop from e-1 into j-1 spec steel-10 size 2 in length 20 ft horizontal
  inlet A1 at j-1 hose std-50 tool carpet
  cleanout at j-1
}
`;

let catalog: LangiumDocument;
let system: LangiumDocument;

beforeEach(async () => {
  await clearDocuments(shared);
  catalog = await parse(CATALOG, { documentUri: CATALOG_URI });
  system = await parse(SYSTEM, { documentUri: SYSTEM_URI });
});

function apply(document: LangiumDocument, edits: TextEdit[] | undefined): string {
  return TextDocument.applyEdits(TextDocument.create('x', 'vacnet', 0, document.textDocument.getText()), edits ?? []);
}

async function rename(document: LangiumDocument, marker: string, newName: string, occurrence = 0): Promise<WorkspaceEdit | undefined> {
  const text = document.textDocument.getText();
  let offset = -1;
  for (let i = 0; i <= occurrence; i++) offset = text.indexOf(marker, offset + 1);
  return Vacnet.lsp.RenameProvider!.rename(document, {
    textDocument: { uri: document.uri.toString() },
    position: document.textDocument.positionAt(offset + 1),
    newName,
  });
}

describe('rename', () => {
  it('renames a catalog hose in the catalog and in the system that uses it, from a use in the system', async () => {
    const edit = await rename(system, 'std-50', 'std-15m', 1);
    expect(Object.keys(edit?.changes ?? {}).sort()).toEqual([CATALOG_URI, SYSTEM_URI]);
    expect(apply(catalog, edit!.changes![CATALOG_URI])).toContain('hose std-15m length 50 ft');
    const renamed = apply(system, edit!.changes![SYSTEM_URI]);
    expect(renamed).toContain('defaults hose std-15m tool carpet');
    expect(renamed).toContain('inlet A1 at j-1 hose std-15m tool carpet');
    expect(renamed).not.toContain('std-50');
  });

  it('renames from the declaration in the catalog too', async () => {
    const edit = await rename(catalog, 'std-50', 'std-15m');
    expect(edit?.changes?.[SYSTEM_URI]).toHaveLength(2);
    expect(edit?.changes?.[CATALOG_URI]).toHaveLength(1);
  });

  it('renames a point declared by `to` everywhere it is used: from, into, at', async () => {
    const edit = await rename(system, 'j-1', 'junction-1', 2);
    const renamed = apply(system, edit!.changes![SYSTEM_URI]);
    expect(renamed).toContain('pipe main from pr to junction-1 ');
    expect(renamed).toContain('pipe b1 from junction-1 to e-1');
    expect(renamed).toContain('pipe loop from e-1 into junction-1');
    expect(renamed).toContain('inlet A1 at junction-1 hose');
    expect(renamed).toContain('cleanout at junction-1');
    expect(edit!.changes![SYSTEM_URI]).toHaveLength(5);
  });

  it('renames an element whose name is a trade word (a tool called carpet)', async () => {
    const edit = await rename(system, 'carpet', 'carpet-wide');
    expect(edit?.changes?.[SYSTEM_URI]).toHaveLength(2);
    expect(apply(catalog, edit!.changes![CATALOG_URI])).toContain('tool carpet-wide working');
  });

  it('refuses a new name the grammar would not read as a name', async () => {
    const provider = Vacnet.lsp.RenameProvider as VacnetRenameProvider;
    await expect(rename(system, 'std-50', 'pipe', 1)).rejects.toThrow(/word of the language/);
    await expect(rename(system, 'std-50', 'std 50', 1)).rejects.toThrow(/not a name/);
    await expect(rename(system, 'std-50', '50-std', 1)).rejects.toThrow(/not a name/);
    expect(provider.nameProblem('riser-b')).toBeUndefined();
    // Trade words the grammar admits as names stay allowed.
    expect(provider.nameProblem('heavy')).toBeUndefined();
  });
});
