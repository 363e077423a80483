// Bad input never throws (project rule): the editor providers of this
// package run on random edits of the examples (deletions, duplications,
// truncations, stray punctuation) and must answer without throwing; the
// formatter must stay idempotent and change only whitespace on whatever
// still parses. Random inputs come from fast-check with a fixed seed, so a
// failure reproduces.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { clearDocuments, parseHelper } from 'langium/test';
import { describe, expect, it } from 'vitest';
import { formatText } from '../../src/index.js';
import { shared, Vacnet } from '../helpers.js';

const parse = parseHelper(Vacnet);
const FILES = ['harbour-offices.vacnet', 'catalog/equipment.vacnet', 'grinding-plant.vacnet', 'detached-house.vacnet'].map((name) =>
  readFileSync(fileURLToPath(new URL(`../../../../examples/${name}`, import.meta.url)), 'utf8'),
);
const STRAY = ['{', '}', '/', ',', '%', '^', ' ', '1-', '\n', '"', '//', '/*'];

/** One random edit of one example. */
const editedExample = fc
  .record({
    file: fc.nat({ max: FILES.length - 1 }),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    from: fc.double({ min: 0, max: 1, noNaN: true }),
    length: fc.nat({ max: 40 }),
    op: fc.constantFrom('delete', 'duplicate', 'truncate', 'insert'),
    stray: fc.constantFrom(...STRAY),
  })
  .map(({ file, at, from, length, op, stray }) => {
    const text = FILES[file]!;
    const a = Math.floor(at * text.length);
    const b = Math.floor(from * text.length);
    switch (op) {
      case 'delete':
        return text.slice(0, a) + text.slice(a + length);
      case 'duplicate':
        return text.slice(0, a) + text.slice(b, b + length) + text.slice(a);
      case 'truncate':
        return text.slice(0, a);
      default:
        return text.slice(0, a) + stray + text.slice(a);
    }
  });

describe('providers on broken text', () => {
  it('answer every request without throwing', async () => {
    let count = 0;
    await fc.assert(
      fc.asyncProperty(editedExample, fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }), async (text, spots) => {
        await clearDocuments(shared);
        const document = await parse(text, { documentUri: `file:///work/edited-${count++}.vacnet` });
        const id = { textDocument: { uri: document.uri.toString() } };
        await Vacnet.lsp.Formatter!.formatDocument(document, { ...id, options: { tabSize: 2, insertSpaces: true } });
        await Vacnet.lsp.DocumentSymbolProvider!.getSymbols(document, id);
        await Vacnet.lsp.FoldingRangeProvider!.getFoldingRanges(document, id);
        await Vacnet.lsp.SemanticTokenProvider!.semanticHighlight(document, id);
        await Vacnet.lsp.DocumentLinkProvider!.getDocumentLinks(document, id);
        for (const spot of spots) {
          const position = document.textDocument.positionAt(Math.floor(spot * (text.length + 1)));
          const hover = await Vacnet.lsp.HoverProvider!.getHoverContent(document, { ...id, position });
          expect(JSON.stringify(hover ?? {})).not.toMatch(/NaN|undefined/);
          await Vacnet.lsp.CompletionProvider!.getCompletion(document, { ...id, position });
        }
      }),
      { numRuns: 150, seed: 4242 },
    );
  }, 120000);

  it('formats idempotently and changes only whitespace', () => {
    fc.assert(
      fc.property(editedExample, (text) => {
        const once = formatText(text);
        expect(formatText(once)).toBe(once);
        expect(once.replace(/\s+/g, '')).toBe(text.replace(/\s+/g, ''));
      }),
      { numRuns: 300, seed: 4242 },
    );
  }, 120000);
});
