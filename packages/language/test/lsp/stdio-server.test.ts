// The `vacnet-lsp` bin speaks the Language Server Protocol 3.17 over stdio:
// initialize / initialized, didOpen -> publishDiagnostics, shutdown / exit
// (message flow as the LSP specification defines it).
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import {
  initializeParams,
  shutdown,
  startStdioServer,
  type PublishedDiagnostics,
  type StdioServer,
} from './stdio-client.js';

const bin = fileURLToPath(new URL('../../bin/vacnet-lsp.js', import.meta.url));
const built = fileURLToPath(new URL('../../dist/main.js', import.meta.url));

// LSP DiagnosticSeverity.Error (LSP specification 3.17).
const ERROR = 1;
// The unbundled server takes about 2 s to start here; leave room on slow CI machines.
const STARTUP_MS = 20000;

describe('vacnet-lsp --stdio', () => {
  let server: StdioServer | undefined;

  beforeAll(() => {
    if (!existsSync(built)) throw new Error(`${built} is missing: run \`npm run build\` first`);
  });

  afterEach(() => {
    if (server && server.child.exitCode === null) server.child.kill();
    server = undefined;
  });

  it('publishes a syntax error at its line and shuts down cleanly', async () => {
    server = startStdioServer([bin, '--stdio']);
    const result = await server.request<{ capabilities: Record<string, unknown> }>('initialize', initializeParams());
    expect(result.capabilities.textDocumentSync).toBeDefined();
    await server.connection.sendNotification('initialized', {});

    const uri = pathToFileURL('/tmp/vacnet-lsp-test/broken.vacnet').href;
    // Line 2 (0-based) holds a word the grammar does not know where `}` or a member is expected.
    const text = ['system "Syntax check" {', '  operators 1', '  frobnicate 42', '}', ''].join('\n');
    const diagnostics = server.nextDiagnostics(uri, STARTUP_MS);
    await server.connection.sendNotification('textDocument/didOpen', {
      textDocument: { uri, languageId: 'vacnet', version: 1, text },
    });
    const published = await diagnostics;

    const errors = published.diagnostics.filter((d) => d.severity === ERROR);
    const atLine2 = errors.filter((d) => d.range.start.line === 2);
    expect(atLine2.length, JSON.stringify(published.diagnostics, null, 2)).toBeGreaterThan(0);
    // The parser reports the unexpected word where it starts: line 2, character 2.
    const parsing = atLine2.filter((d) => d.data?.code === 'parsing-error');
    expect(parsing.map((d) => d.range.start.character)).toContain(2);
    // Nothing before the bad word is blamed on the parser.
    expect(errors.filter((d) => d.data?.code === 'parsing-error' && d.range.start.line < 2)).toEqual([]);

    // LSP: exit after shutdown ends the process with code 0.
    expect(await shutdown(server)).toBe(0);
  });

  it('clears the syntax error once the edit fixes it', async () => {
    server = startStdioServer([bin, '--stdio']);
    await server.request('initialize', initializeParams());
    await server.connection.sendNotification('initialized', {});
    const uri = pathToFileURL('/tmp/vacnet-lsp-test/edited.vacnet').href;
    const broken = ['system "Edit check" {', '  operators 1', '  operators', '}', ''].join('\n');
    const fixed = ['system "Edit check" {', '  operators 1', '}', ''].join('\n');

    const first = server.nextDiagnostics(uri, STARTUP_MS);
    await server.connection.sendNotification('textDocument/didOpen', {
      textDocument: { uri, languageId: 'vacnet', version: 1, text: broken },
    });
    const parsing = (published: PublishedDiagnostics) =>
      published.diagnostics.filter((d) => d.data?.code === 'parsing-error');
    expect(parsing(await first).length).toBeGreaterThan(0);

    const second = server.nextDiagnostics(uri, STARTUP_MS);
    // A change without a range replaces the whole text (LSP TextDocumentContentChangeEvent).
    await server.connection.sendNotification('textDocument/didChange', {
      textDocument: { uri, version: 2 },
      contentChanges: [{ text: fixed }],
    });
    expect(parsing(await second)).toEqual([]);
    expect(await shutdown(server)).toBe(0);
  });

  it('without a transport prints usage and exits 2', () => {
    const run = spawnSync(process.execPath, [bin], { encoding: 'utf8', timeout: STARTUP_MS });
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/usage: vacnet-lsp --stdio/);
  });
});
