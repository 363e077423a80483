// The editor features over the real protocol: the built `vacnet-lsp --stdio`
// driven by a JSON-RPC client (vscode-jsonrpc, as VS Code's own client is).
// Message shapes are those of the LSP 3.17 specification:
// textDocument/formatting returns TextEdit[]; textDocument/documentSymbol
// returns DocumentSymbol[] (hierarchical).
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { TextDocument } from 'langium';
import type { DocumentSymbol, TextEdit } from 'vscode-languageserver';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { initializeParams, shutdown, startStdioServer, type StdioServer } from './stdio-client.js';
import { vacnetFiles } from '../example-files.js';

const bin = fileURLToPath(new URL('../../bin/vacnet-lsp.js', import.meta.url));
const built = fileURLToPath(new URL('../../dist/main.js', import.meta.url));
const examples = fileURLToPath(new URL('../../../../examples/', import.meta.url));
// The unbundled server takes about 2 s to start here; leave room on slow CI machines.
const STARTUP_MS = 20000;
// LSP SymbolKind (specification 3.17): Namespace 3, Module 2, Field 8, Event 24.
const KIND = { Module: 2, Namespace: 3, Field: 8, Event: 24 } as const;

function comments(text: string): string[] {
  return (text.match(/\/\/[^\n\r]*|\/\*[\s\S]*?\*\//g) ?? []).map((c) => c.replace(/\r?\n[ \t]*/g, '\n').trimEnd());
}

async function start(): Promise<StdioServer> {
  const server = startStdioServer([bin, '--stdio']);
  await server.request('initialize', initializeParams());
  await server.connection.sendNotification('initialized', {});
  return server;
}

/** Opens a document and waits until the server has built it (its first diagnostics). */
async function open(server: StdioServer, uri: string, text: string): Promise<void> {
  const built = server.nextDiagnostics(uri, STARTUP_MS);
  await server.connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'vacnet', version: 1, text } });
  await built;
}

describe('vacnet-lsp --stdio: editor features', () => {
  let server: StdioServer | undefined;

  beforeAll(() => {
    if (!existsSync(built)) throw new Error(`${built} is missing: run \`npm run build\` first`);
  });

  afterEach(() => {
    if (server && server.child.exitCode === null) server.child.kill();
    server = undefined;
  });

  it('formats every example so that formatting again changes nothing, keeping every comment', async () => {
    server = await start();
    const options = { tabSize: 2, insertSpaces: true };
    let changedSome = false;
    for (const file of vacnetFiles(examples)) {
      const uri = pathToFileURL(join('/tmp/vacnet-lsp-format', file.slice(examples.length))).href;
      const text = readFileSync(file, 'utf8');
      await open(server, uri, text);
      const edits = await server.request<TextEdit[] | null>('textDocument/formatting', { textDocument: { uri }, options });
      const once = TextDocument.applyEdits(TextDocument.create(uri, 'vacnet', 1, text), edits ?? []);
      if (once !== text) changedSome = true;
      expect(comments(once), file).toEqual(comments(text));
      expect(once.replace(/\s+/g, ''), file).toBe(text.replace(/\s+/g, ''));

      const rebuilt = server.nextDiagnostics(uri, STARTUP_MS);
      await server.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version: 2 }, contentChanges: [{ text: once }] });
      await rebuilt;
      const again = await server.request<TextEdit[] | null>('textDocument/formatting', { textDocument: { uri }, options });
      expect(again ?? [], file).toEqual([]);
    }
    // The bundled examples line some columns up; formatting must have removed that somewhere.
    expect(changedSome).toBe(true);
    expect(await shutdown(server)).toBe(0);
  });

  it('answers document symbols with the outline of an example', async () => {
    server = await start();
    const file = join(examples, 'harbour-offices.vacnet');
    const uri = pathToFileURL('/tmp/vacnet-lsp-symbols/harbour-offices.vacnet').href;
    await open(server, uri, readFileSync(file, 'utf8'));
    const symbols = await server.request<DocumentSymbol[]>('textDocument/documentSymbol', { textDocument: { uri } });

    expect(symbols.map((s) => `${s.name}:${s.kind}`)).toEqual([`Catalog:${KIND.Namespace}`, `Harbour offices, five floors over a basement:${KIND.Module}`]);
    const groups = symbols[1]!.children!;
    expect(groups.map((g) => g.name)).toEqual(['Equipment', 'Pipes', 'Inlets', 'Scenarios', 'Settings']);
    const pipes = groups.find((g) => g.name === 'Pipes')!.children!;
    // `pipe main-1 ... size 3 in length 40 ft` is line 29 (1-based) of the example.
    expect(pipes[0]).toMatchObject({ name: 'main-1', kind: KIND.Field, detail: '3 in · 40 ft' });
    expect(pipes[0]!.selectionRange.start).toEqual({ line: 28, character: 7 });
    const inlets = groups.find((g) => g.name === 'Inlets')!.children!;
    expect(inlets.find((i) => i.name === 'L1-lobby')).toMatchObject({ kind: KIND.Event, detail: 'hose std-30 · tool floor · Entrance lobby' });
    expect(await shutdown(server)).toBe(0);
  });
});
