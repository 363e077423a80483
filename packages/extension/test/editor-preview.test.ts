// A picture of what the extension puts in the editor, for the README: an
// example's lines coloured by the extension's TextMate grammar (through
// vscode-textmate and vscode-oniguruma) with the inlay hints the bundled
// server gives for them, drawn in headless Chromium in the colours of VS
// Code's Dark+ theme (from memory). It is a rendering of the grammar's and
// the server's real output, not a capture of VS Code. The test checks what
// the picture rests on: every hint sits at the end of a line it belongs to
// (an inlet, a pipe or the producer) after its text, and every token has a
// theme colour.
// With VACNET_WRITE_SCREENSHOTS=1 the run writes images/screenshot-editor.png.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { shutdown, startStdioServer } from '../../language/test/lsp/stdio-client.js';
import { innermost, tokenise } from './textmate-tokens.js';

const CHROMIUM = '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const examplesDir = fileURLToPath(new URL('../../../examples/', import.meta.url));
/** The lines of the example shown: the plant room and the first pipes and inlets. */
const FIRST_LINE = 23;
const LAST_LINE = 40;

/** Dark+ colours by scope prefix, longest prefix first (VS Code's default dark theme, from memory). */
const DARK_PLUS: [string, string][] = [
  ['comment', '#6A9955'],
  ['punctuation.definition.comment', '#6A9955'],
  ['string', '#CE9178'],
  ['punctuation.definition.string', '#CE9178'],
  ['constant.numeric', '#B5CEA8'],
  ['keyword.other.unit', '#B5CEA8'],
  ['keyword.control', '#C586C0'],
  ['keyword', '#569CD6'],
  ['constant.language', '#569CD6'],
  ['entity.name.type', '#4EC9B0'],
  ['entity.name.variable', '#9CDCFE'],
  ['variable', '#9CDCFE'],
  ['support.constant', '#4FC1FF'],
  ['constant.other', '#4FC1FF'],
  ['punctuation', '#D4D4D4'],
];
const colourOf = (scope: string) => DARK_PLUS.find(([prefix]) => scope === prefix || scope.startsWith(`${prefix}.`))?.[1];
const escape = (text: string) => text.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);

describe.runIf(available || inCi)('the editor picture', () => {
  it('every hint sits after a line of its element, every token has a colour, and the picture is drawn', async () => {
    const file = join(examplesDir, 'detached-house.vacnet');
    const catalog = join(examplesDir, 'catalog', 'equipment.vacnet');
    const text = readFileSync(file, 'utf8');
    const lines = text.split('\n');
    const server = startStdioServer([join(extensionRoot, 'dist', 'server.cjs'), '--stdio']);
    let hints: { position: { line: number; character: number }; label: string }[];
    try {
      await server.request('initialize', { processId: null, rootUri: null, workspaceFolders: null, capabilities: {} });
      await server.connection.sendNotification('initialized', {});
      for (const f of [catalog, file]) await server.connection.sendNotification('textDocument/didOpen', { textDocument: { uri: pathToFileURL(f).href, languageId: 'vacnet', version: 1, text: readFileSync(f, 'utf8') } });
      await server.request('vacnet/systemSummary', { uri: pathToFileURL(file).href });
      hints = await server.request('textDocument/inlayHint', { textDocument: { uri: pathToFileURL(file).href }, range: { start: { line: 0, character: 0 }, end: { line: lines.length, character: 0 } } });
      expect(await shutdown(server)).toBe(0);
    } finally {
      if (server.child.exitCode === null) server.child.kill();
    }
    expect(hints.length).toBeGreaterThan(10);
    for (const hint of hints) {
      expect(lines[hint.position.line], hint.label).toMatch(/^\s*(inlet|pipe|plant|producer)\b/);
      // At the end of the line, or of the producer's part of a one-line plant (`plant p { producer x ... }`).
      const before = lines[hint.position.line]!.slice(0, hint.position.character);
      expect(hint.position.character === lines[hint.position.line]!.length || /producer [\w-]+$/.test(before), `${hint.label} after '${before}'`).toBe(true);
    }

    const tokens = await tokenise(text);
    const uncoloured = tokens.flat().filter((t) => t.text.trim() !== '' && !colourOf(innermost(t)));
    expect(uncoloured.map((t) => `${t.text} ${innermost(t)}`)).toEqual([]);
    const rows = [];
    for (let i = FIRST_LINE - 1; i < LAST_LINE; i++) {
      const spans = tokens[i]!.map((t) => (t.text.trim() === '' ? escape(t.text) : `<span style="color:${colourOf(innermost(t))}">${escape(t.text)}</span>`)).join('');
      const hint = hints.filter((h) => h.position.line === i).map((h) => `<span class="hint">${escape(h.label)}</span>`).join('');
      rows.push(`<div class="line"><span class="number">${i + 1}</span>${spans}${hint}</div>`);
    }
    const html = `<!doctype html><html><head><meta charset="utf-8"><style>
      body { margin: 0; background: #1e1e1e; color: #d4d4d4; font: 13px/19px "DejaVu Sans Mono", monospace; }
      .editor { padding: 10px 0; white-space: pre; }
      .number { display: inline-block; width: 40px; padding-right: 18px; text-align: right; color: #858585; }
      .hint { margin-left: 6px; padding: 0 4px; border-radius: 3px; background: #8b8b8b26; color: #969696; font-size: 12px; }
    </style></head><body><div class="editor">${rows.join('')}</div></body></html>`;
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--headless', '--disable-gpu', '--no-first-run'] });
    try {
      const page = await browser.newPage({ viewport: { width: 1180, height: 380 } });
      await page.setContent(html);
      expect(await page.locator('.hint').count()).toBe(hints.filter((h) => h.position.line >= FIRST_LINE - 1 && h.position.line < LAST_LINE).length);
      if (process.env.VACNET_WRITE_SCREENSHOTS === '1') writeFileSync(join(extensionRoot, 'images', 'screenshot-editor.png'), await page.screenshot({ fullPage: true }));
    } finally {
      await browser.close();
    }
  }, 120_000);
});
