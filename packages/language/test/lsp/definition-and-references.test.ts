// Go to definition and find references rest on Langium's defaults and our
// scope rules (references/): a point is declared by the pipe that reaches it
// (`to NAME`); names from another file are visible through `use` only.
// Expected locations follow the LSP 3.17 definition and references requests.
import { clearDocuments, expectFindReferences, expectGoToDefinition, parseHelper } from 'langium/test';
import type { LangiumDocument } from 'langium';
import { beforeEach, describe, expect, it } from 'vitest';
import { shared, Vacnet } from '../helpers.js';

const parse = parseHelper(Vacnet);
const goTo = expectGoToDefinition(Vacnet);
const findReferences = expectFindReferences(Vacnet);

const CATALOG_URI = 'file:///work/catalog/equipment.vacnet';
const CATALOG = `hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm
tool carpet working orifice 7/8 in needs 5 inHg
spec steel-10 roughness 45 um
producer exh { curve { at 0 scfm 8 inHg at 300 scfm 6 inHg } }
`;

beforeEach(async () => {
  await clearDocuments(shared);
});

describe('go to definition', () => {
  it('goes from a use of a point to the `to` of the pipe that declares it', async () => {
    await goTo({
      text: `system "D" {
  plant pr { }
  pipe main from pr to <|j-1|> size 3 in length 40 ft
  pipe b1 from j<|>-1 to e-1 size 2 in length 20 ft
}`,
      index: 0,
      rangeIndex: 0,
      disposeAfterCheck: true,
    });
  });

  it('goes from an inlet on a pipe to the pipe, and from a point to the plant', async () => {
    await goTo({
      text: `system "D" {
  plant <|pr|> { }
  pipe <|main|> from p<|>r to j-1 size 3 in length 40 ft
  inlet A1 on ma<|>in at 3 ft
}`,
      index: 1,
      rangeIndex: 1,
      disposeAfterCheck: true,
    });
    await goTo({
      text: `system "D" {
  plant <|pr|> { }
  pipe main from p<|>r to j-1 size 3 in length 40 ft
}`,
      index: 0,
      rangeIndex: 0,
      disposeAfterCheck: true,
    });
  });

  it('goes from a hose in a system to its definition in the used catalog', async () => {
    const catalog = await parse(CATALOG, { documentUri: CATALOG_URI });
    const text = `use "catalog/equipment.vacnet"
system "D" {
  defaults hose std-50 tool carpet
}`;
    const system = await parse(text, { documentUri: 'file:///work/system.vacnet' });
    const links = await Vacnet.lsp.DefinitionProvider!.getDefinition(system, {
      textDocument: { uri: system.uri.toString() },
      position: system.textDocument.positionAt(text.indexOf('std-50') + 2),
    });
    expect(links).toHaveLength(1);
    expect(links![0]!.targetUri).toBe(CATALOG_URI);
    const target = links![0]!.targetSelectionRange;
    expect(catalog.textDocument.getText(target)).toBe('std-50');
    expect(target.start).toEqual({ line: 0, character: 5 });

    // A soft keyword as a name: the tool called `carpet`.
    const toTool = await Vacnet.lsp.DefinitionProvider!.getDefinition(system, {
      textDocument: { uri: system.uri.toString() },
      position: system.textDocument.positionAt(text.indexOf('carpet') + 1),
    });
    expect(toTool?.[0]?.targetUri).toBe(CATALOG_URI);
    expect(catalog.textDocument.getText(toTool![0]!.targetSelectionRange)).toBe('carpet');
  });

  it('does not resolve a hose from a file the system does not use', async () => {
    await parse(CATALOG, { documentUri: CATALOG_URI });
    const text = `system "D" {
  defaults hose std-50
}`;
    const system = await parse(text, { documentUri: 'file:///work/system.vacnet' });
    const links = await Vacnet.lsp.DefinitionProvider!.getDefinition(system, {
      textDocument: { uri: system.uri.toString() },
      position: system.textDocument.positionAt(text.indexOf('std-50') + 2),
    });
    expect(links ?? []).toEqual([]);
  });
});

describe('find references', () => {
  it('finds every use of a point: from, into, at, and its declaration', async () => {
    await findReferences({
      text: `system "R" {
  plant pr { }
  pipe main from pr to <|j<|>-1|> size 3 in length 40 ft
  pipe b1 from <|j-1|> to e-1 size 2 in length 20 ft
  pipe loop from e-1 into <|j-1|> size 2 in length 20 ft
  inlet A1 at <|j-1|>
  cleanout at <|j-1|>
}`,
      includeDeclaration: true,
      disposeAfterCheck: true,
    });
  });

  it('finds the uses of a catalog hose in the systems that use the catalog', async () => {
    const catalog = await parse(CATALOG, { documentUri: CATALOG_URI });
    const text = `use "catalog/equipment.vacnet"
system "R" {
  defaults hose std-50
  plant pr { }
  pipe main from pr to j-1 size 3 in length 40 ft
  inlet A1 at j-1 hose std-50
}`;
    await parse(text, { documentUri: 'file:///work/system.vacnet' });
    const references = await Vacnet.lsp.ReferencesProvider!.findReferences(catalog, {
      textDocument: { uri: CATALOG_URI },
      position: { line: 0, character: 6 },
      context: { includeDeclaration: false },
    });
    expect(references.map((r) => `${r.uri}@${r.range.start.line}:${r.range.start.character}`).sort()).toEqual([
      'file:///work/system.vacnet@2:16',
      'file:///work/system.vacnet@5:23',
    ]);
  });
});
