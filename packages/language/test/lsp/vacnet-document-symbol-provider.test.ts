// The outline: the grouping issue 4 item 5 asks for (equipment, pipes,
// inlets, scenarios; plus the catalog and settings), with LSP 3.17
// SymbolKinds and each entry's detail read from its line.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expectSymbols } from 'langium/test';
import { SymbolKind, type DocumentSymbol } from 'vscode-languageserver';
import { describe, expect, it } from 'vitest';
import { Vacnet } from '../helpers.js';

const symbols = expectSymbols(Vacnet);
const KIND_NAMES = Object.fromEntries(Object.entries(SymbolKind).map(([name, value]) => [value, name]));

/** `name (Kind: detail)` with children indented, for whole-tree comparisons. */
function outline(list: DocumentSymbol[], depth = 0): string[] {
  return list.flatMap((s) => [
    `${'  '.repeat(depth)}${s.name} (${KIND_NAMES[s.kind]}${s.detail ? `: ${s.detail}` : ''})`,
    ...outline(s.children ?? [], depth + 1),
  ]);
}

const TEXT = `use "catalog.vacnet"
spec steel-10 material steel schedule 10 roughness 45 um
hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm
tool carpet working orifice 7/8 in needs 5 inHg
producer exh { curve { at 0 scfm 8 inHg at 300 scfm 6 inHg } }
separator cyc loss 2 inH2O at 300 scfm

system "Harbour offices" {
  operators 3
  rule missing-cleanout spacing 64 ft
  plant room-b1 {
    producer exh exhaust 1 inH2O at 250 scfm
    separator cyc indoors
  }
  pipe main-1 from room-b1 to j-1 spec steel-10 size 3 in length 35 ft horizontal
  pipe riser-a from j-1 to top-a spec steel-10 bore 2.5 in length 30 ft up
  cleanout at j-1
  inlet A1 on riser-a at 4 ft hose std-50 tool carpet room "Reading room"
  scenario far open A1 lifted
}
`;

describe('document symbols', () => {
  it('groups a file into its catalog and its system, the system into equipment, pipes, inlets, scenarios and settings', async () => {
    await symbols({
      text: TEXT,
      disposeAfterCheck: true,
      assert: (list) =>
        expect(outline(list)).toEqual([
          'Catalog (Namespace: 6)',
          '  catalog.vacnet (File: use)',
          '  steel-10 (Struct: steel · schedule 10)',
          '  std-50 (Class: hose · 50 ft · 1-1/2 in bore)',
          '  carpet (Class: tool · orifice 7/8 in · needs 5 inHg)',
          '  exh (Class: producer · curve of 2 points)',
          '  cyc (Class: separator · loss 2 inH2O at 300 scfm)',
          'Harbour offices (Module: system)',
          '  Equipment (Namespace: 1)',
          '    room-b1 (Package: producer exh)',
          '      producer (Property: exh exhaust 1 inH2O at 250 scfm)',
          '      separator (Property: cyc indoors)',
          '  Pipes (Namespace: 3)',
          '    main-1 (Field: 3 in · 35 ft)',
          '    riser-a (Field: 2.5 in bore · 30 ft)',
          '    cleanout (Key: at j-1)',
          '  Inlets (Namespace: 1)',
          '    A1 (Event: hose std-50 · tool carpet · Reading room)',
          '  Scenarios (Namespace: 1)',
          '    far (Array: open A1 lifted)',
          '  Settings (Namespace: 2)',
          '    operators (Property: 3)',
          '    rule missing-cleanout (Property: spacing 64 ft)',
        ]),
    });
  });

  it('selects the name of each element, inside its range', async () => {
    await symbols({
      text: TEXT,
      disposeAfterCheck: true,
      assert: (list) => {
        const system = list[1]!;
        const pipe = system.children!.find((g) => g.name === 'Pipes')!.children![0]!;
        // `pipe main-1 ...` is line 14 (0-based); the name starts at character 7.
        expect(pipe.selectionRange).toEqual({ start: { line: 14, character: 7 }, end: { line: 14, character: 13 } });
        const within = (s: DocumentSymbol): boolean =>
          (s.range.start.line < s.selectionRange.start.line ||
            (s.range.start.line === s.selectionRange.start.line && s.range.start.character <= s.selectionRange.start.character)) &&
          (s.children ?? []).every(within);
        expect(list.every(within)).toBe(true);
      },
    });
  });

  it('outlines a catalog-only file and an example system without gaps', async () => {
    const example = readFileSync(fileURLToPath(new URL('../../../../examples/harbour-offices.vacnet', import.meta.url)), 'utf8');
    await symbols({
      text: example,
      disposeAfterCheck: true,
      assert: (list) => {
        const system = list.find((s) => s.kind === SymbolKind.Module)!;
        const count = (name: string) => system.children!.find((g) => g.name === name)?.children?.length;
        // harbour-offices.vacnet: 1 plant; 22 pipes + 14 cleanouts; 22 inlets; 2 scenarios (counted in the file).
        expect(count('Equipment')).toBe(1);
        expect(count('Pipes')).toBe(22 + 14);
        expect(count('Inlets')).toBe(22);
        expect(count('Scenarios')).toBe(2);
      },
    });
    await symbols({ text: 'hose h length 30 ft bore 1-1/4 in roughness 0.3 mm', expectedSymbols: ['Catalog'], disposeAfterCheck: true });
  });
});
