// The snippets, expanded as accepting them without typing leaves them (every
// placeholder at its default), must make files the language reads without
// an error: parsed, linked, checked and analysed by the same loader as
// `vacnet check`. The defaults name the example catalog's equipment
// (examples/catalog/equipment.vacnet), copied beside the expanded files.
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { formatText, loadDocuments } from '@vacnet/language';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expandSnippet, finalCursor } from './snippet-expansion.js';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const catalog = fileURLToPath(new URL('../../../examples/catalog/equipment.vacnet', import.meta.url));
const snippets = JSON.parse(readFileSync(join(extensionRoot, 'snippets/vacnet.json'), 'utf8')) as Record<string, { prefix: string | string[]; body: string[]; description: string }>;
const manifest = JSON.parse(readFileSync(join(extensionRoot, 'package.json'), 'utf8'));

let folder = '';
beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'vacnet-snippets-'));
  mkdirSync(join(folder, 'catalog'));
  copyFileSync(catalog, join(folder, 'catalog', 'equipment.vacnet'));
});
afterAll(() => {
  if (folder) rmSync(folder, { recursive: true, force: true });
});

/** Loads and analyses one file; returns its findings as `severity code line:col message`. */
async function check(name: string, text: string) {
  const file = join(folder, name);
  writeFileSync(file, text);
  const loaded = (await loadDocuments([file], { analyse: true })).files.find((f) => f.path === file)!;
  return loaded;
}
const describeFindings = (diagnostics: { severity: string; code: string; message: string; range: { start: { line: number; character: number } } }[]) =>
  diagnostics.map((d) => `${d.severity} ${d.code} ${d.range.start.line + 1}:${d.range.start.character + 1} ${d.message}`);

/** The new-system snippet with another snippet at its final cursor, indented as the body of the system. */
function insideSystem(other: string): string {
  const body = snippets['New system']!.body;
  const system = expandSnippet(body);
  const at = finalCursor(body)!;
  const inserted = expandSnippet(snippets[other]!.body).replace(/\n(?=.)/g, '\n  ').replace(/\n\s*$/, '');
  // Files end with a line break, as the formatter leaves them.
  return `${system.slice(0, at)}${inserted}${system.slice(at)}\n`;
}

describe('snippets', () => {
  it('are the five the manifest contributes, each with a prefix and a description', () => {
    expect(Object.keys(snippets).sort()).toEqual(['New system', 'Pipe', 'Producer with curve', 'Riser with inlets', 'Scenario']);
    expect(manifest.contributes.snippets).toEqual([{ language: 'vacnet', path: './snippets/vacnet.json' }]);
    for (const snippet of Object.values(snippets)) {
      expect(snippet.prefix.length).toBeGreaterThan(0);
      expect(snippet.description.length).toBeGreaterThan(20);
    }
  });

  it('a new system with its defaults is read, linked and analysed without a finding', async () => {
    const loaded = await check('new-system.vacnet', expandSnippet(snippets['New system']!.body));
    expect(loaded.model?.name).toBe('New building');
    // Not even a warning: the defaults make a sound small system (2 in main, about 3,800 fpm with one operator).
    expect(describeFindings(loaded.diagnostics)).toEqual([]);
    // The analysis ran: the producer and the one inlet have results.
    expect(loaded.analysis?.producer?.name).toBeTruthy();
    expect(loaded.analysis?.inlets.map((i) => i.name)).toEqual(['A1']);
  });

  it('a producer with its default curve makes a catalog file without a finding', async () => {
    const loaded = await check('producer.vacnet', expandSnippet(snippets['Producer with curve']!.body));
    expect(describeFindings(loaded.diagnostics)).toEqual([]);
  });

  it.each(['Pipe', 'Riser with inlets', 'Scenario'])('%s, placed in a new system, is read and analysed without an error', async (name) => {
    const loaded = await check(`${name.replace(/\W+/g, '-')}.vacnet`, insideSystem(name));
    expect(loaded.diagnostics.filter((d) => d.severity === 'error').map((d) => d.message)).toEqual([]);
    expect(loaded.analysis).toBeDefined();
  });

  it('are laid out as the formatter lays them out, so accepting one leaves nothing to reformat', () => {
    for (const name of ['Pipe', 'Riser with inlets', 'Scenario']) {
      const text = insideSystem(name);
      expect(formatText(text), name).toBe(text);
    }
    const producer = expandSnippet(snippets['Producer with curve']!.body);
    expect(formatText(producer)).toBe(producer);
  });

  it('expands placeholders, nested placeholders, choices and escapes as VS Code does', () => {
    // Cases from the snippet syntax in the VS Code documentation.
    expect(expandSnippet('a ${1:one} b ${2|x,y|} c $3 d ${4:outer ${5:inner}} \\$e$0')).toBe('a one b x c  d outer inner $e');
    expect(() => expandSnippet('${TM_FILENAME}')).toThrow();
  });
});
