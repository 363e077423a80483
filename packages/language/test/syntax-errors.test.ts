// syntaxErrorsOf gives exactly the syntax findings the headless loader
// gives for the same text (same code, message and position), and nothing
// for text that parses, whatever else is wrong with it.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { syntaxErrorsOf } from '../src/syntax-errors.js';
import { loadDocuments } from '../src/document.js';

const example = (name: string) => fileURLToPath(new URL(`../../../examples/invalid/${name}`, import.meta.url));

describe('syntaxErrorsOf', () => {
  it('matches the loader on the syntax-error example', async () => {
    const path = example('syntax-error.vacnet');
    const loaded = (await loadDocuments([path])).files[0]!.diagnostics.filter((d) => d.code === 'syntax-error');
    expect(loaded.length).toBeGreaterThan(0);
    expect(await syntaxErrorsOf(readFileSync(path, 'utf8'))).toEqual(loaded.map(({ severity, code, message, range, source }) => ({ severity, code, message, range, source })));
  });

  it('is empty for a file whose only errors are not syntax (an unresolved name, a bad unit)', async () => {
    expect(await syntaxErrorsOf(readFileSync(example('unresolved-reference.vacnet'), 'utf8'))).toEqual([]);
    expect(await syntaxErrorsOf(readFileSync(example('unit-unknown.vacnet'), 'utf8'))).toEqual([]);
  });

  it('finds a character the lexer cannot read', async () => {
    const found = await syntaxErrorsOf('system "x" {\n  operators 1 §\n}\n');
    expect(found.map((d) => `${d.code}@${d.range.start.line + 1}:${d.range.start.character + 1}`)).toContain('syntax-error@2:15');
  });
});
