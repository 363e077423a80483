// The packaged .vsix, made by the same vsce call as `npm run package`, read
// back as a zip (PKWARE APPNOTE): what it holds, its size, and the language
// server inside it. The server is extracted with the rest of the extension
// into a temporary folder and driven over stdio by a JSON-RPC client
// (vscode-jsonrpc, as VS Code's own client is), with a subset of the
// protocol tests of the language package: the findings the headless loader
// reports on every example, each linked to a rule page shipped in the .vsix;
// the velocity finding and its quick fix; inlay hints; formatting.
import { fork, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { createMessageConnection, IPCMessageReader, IPCMessageWriter } from 'vscode-jsonrpc/node';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDocuments } from '@vacnet/language';
import { initializeParams, shutdown, startStdioServer, type StdioServer } from '../../language/test/lsp/stdio-client.js';
import { applyEdits, SLOW_SYSTEM } from '../../language/test/lsp/live-services.js';
import { referencedFiles } from './manifest-files.js';
import { zipEntries, zipFiles } from './zip-entries.js';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const repoRoot = join(extensionRoot, '..', '..');
const examplesDir = join(repoRoot, 'examples');
const manifest = JSON.parse(readFileSync(join(extensionRoot, 'package.json'), 'utf8'));
const hasUnzip = spawnSync('unzip', ['-v']).status === 0;

/** The marketplace takes larger packages, but the issue asks for under 5 MB. */
const MAX_VSIX_BYTES = 5 * 1024 * 1024;
const bundles = ['dist/extension.cjs', 'dist/server.cjs', 'dist/browser-extension.js', 'dist/browser-server.js', 'dist/cli.mjs'];

let folder = '';
let vsix = '';
let entries: string[] = [];
/** The extension as installed: the .vsix's extension/ folder. */
let installed = '';

beforeAll(() => {
  const missing = bundles.filter((file) => !existsSyncSafe(join(extensionRoot, file)));
  if (missing.length) throw new Error(`missing ${missing.join(', ')}: run \`npm run build\` first`);
  folder = mkdtempSync(join(tmpdir(), 'vacnet-vsix-'));
  vsix = join(folder, 'vacnet.vsix');
  const vsce = join(repoRoot, 'node_modules/@vscode/vsce/vsce');
  const run = spawnSync(process.execPath, [vsce, 'package', '--no-dependencies', '--no-rewrite-relative-links', '--out', vsix], { cwd: extensionRoot, encoding: 'utf8', timeout: 120_000 });
  if (run.status !== 0) throw new Error(`vsce failed:\n${run.stdout}\n${run.stderr}`);
  if (/WARNING/i.test(run.stdout + run.stderr)) throw new Error(`vsce warned:\n${run.stdout}\n${run.stderr}`);
  entries = zipEntries(vsix);
  installed = join(folder, 'installed');
  for (const [name, content] of zipFiles(vsix)) {
    if (!name.startsWith('extension/')) continue;
    const file = join(installed, name.slice('extension/'.length));
    mkdirSync(dirname(file), { recursive: true });
    writeFileSync(file, content);
  }
}, 180_000);

afterAll(() => {
  if (folder) rmSync(folder, { recursive: true, force: true });
});

function existsSyncSafe(path: string): boolean {
  try {
    statSync(path);
    return true;
  } catch {
    return false;
  }
}

describe('the packaged .vsix', () => {
  it(`is under 5 MB`, () => {
    const size = statSync(vsix).size;
    console.log(`vsix: ${(size / 1024 / 1024).toFixed(2)} MB, ${entries.length} entries`);
    expect(size).toBeLessThan(MAX_VSIX_BYTES);
  });

  it('holds every file the manifest references, the bundles, the rule pages and the examples', () => {
    const wanted = [...referencedFiles(manifest), ...bundles, 'media/webview.css', 'examples/catalog/equipment.vacnet', 'examples/detached-house.vacnet'];
    for (const file of wanted) {
      const entry = `extension/${file}`;
      // vsce lowercases README and LICENSE and may add .txt.
      const found = entries.some((e) => e === entry || e.toLowerCase() === entry.toLowerCase() || e.toLowerCase() === `${entry.toLowerCase()}.txt`);
      expect(found, file).toBe(true);
    }
    // Every rule page the repository has, so every finding's link resolves.
    for (const page of readdirSync(join(repoRoot, 'docs', 'rules'))) expect(entries, page).toContain(`extension/docs/rules/${page}`);
  });

  it.runIf(hasUnzip)('is read by our zip reader as Info-ZIP unzip reads it', () => {
    const listed = spawnSync('unzip', ['-Z1', vsix], { encoding: 'utf8' }).stdout.trim().split('\n');
    expect(entries).toEqual(listed);
  });

  it('holds no source maps, sources, tests, scripts, dependencies or invalid examples', () => {
    const unwanted = entries.filter((entry) => /\.map$|\.ts$|\.tsbuildinfo$|^extension\/(src|test|scripts|node_modules)\/|^extension\/examples\/invalid\//.test(entry));
    expect(unwanted).toEqual([]);
  });

  it('the installed desktop client leaves vscode to the editor and carries no parser (the server has it)', () => {
    const client = readFileSync(join(installed, 'dist/extension.cjs'), 'utf8');
    expect(client).toMatch(/require\("vscode"\)/);
    expect(client).not.toMatch(/chevrotain|langium/i);
  });
});

/** A document's analysis is in and its diagnostics published (the servers' `vacnet/analysisStatus` request). */
async function settled(server: StdioServer, uri: string, version: number): Promise<void> {
  const deadline = Date.now() + 60_000;
  for (;;) {
    const status = await server.request<{ status: string; version: number; published: boolean } | null>('vacnet/analysisStatus', { uri });
    if (status && status.version === version && status.status !== 'pending' && status.published) return;
    if (Date.now() > deadline) throw new Error(`${uri} v${version} not settled: ${JSON.stringify(status)}\n${server.stderr()}`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

interface Published {
  uri: string;
  version?: number;
  diagnostics: { range: { start: { line: number; character: number }; end: { line: number; character: number } }; severity?: number; code?: string | number; message: string; codeDescription?: { href: string } }[];
}

describe('the language server inside the .vsix', () => {
  let server: StdioServer;
  const published: Published[] = [];
  const latest = (uri: string) => published.filter((p) => p.uri === uri).at(-1);
  const open = (uri: string, text: string, version = 1) => server.connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'vacnet', version, text } });
  const change = (uri: string, text: string, version: number) => server.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version }, contentChanges: [{ text }] });

  beforeAll(async () => {
    server = startStdioServer([join(installed, 'dist', 'server.cjs'), '--stdio'], installed);
    server.connection.onNotification('textDocument/publishDiagnostics', (p: Published) => published.push(p));
    const folderUri = pathToFileURL(examplesDir).href;
    await server.request('initialize', {
      ...initializeParams(),
      rootUri: folderUri,
      workspaceFolders: [{ uri: folderUri, name: 'examples' }],
      capabilities: { textDocument: { synchronization: { didSave: true }, publishDiagnostics: { relatedInformation: true, versionSupport: true, codeDescriptionSupport: true } } },
    });
    await server.connection.sendNotification('initialized', {});
  }, 60_000);

  afterAll(async () => {
    if (server?.child.exitCode === null) expect(await shutdown(server)).toBe(0);
  });

  it('publishes for every example what the headless loader reports, each linked to its rule page in the installed extension', async () => {
    const files = ['catalog/equipment.vacnet', ...readdirSync(examplesDir).filter((f) => f.endsWith('.vacnet')), ...readdirSync(join(examplesDir, 'invalid')).map((f) => `invalid/${f}`)].map((f) => join(examplesDir, f));
    const severity: Record<string, number> = { error: 1, warning: 2, info: 3 };
    const key = (d: { code?: unknown; severity?: unknown; message: string; range: Published['diagnostics'][number]['range'] }) =>
      `${String(d.code)}|${d.severity}|${d.range.start.line}:${d.range.start.character}-${d.range.end.line}:${d.range.end.character}|${d.message}`;
    let linked = 0;
    for (const file of files) {
      const uri = pathToFileURL(file).href;
      await open(uri, readFileSync(file, 'utf8'));
      await settled(server, uri, 1);
      const headless = (await loadDocuments([file], { analyse: true })).files[0]!;
      expect(latest(uri)!.diagnostics.map(key).sort(), file).toEqual(headless.diagnostics.map((d) => key({ ...d, severity: severity[d.severity] })).sort());
      for (const d of latest(uri)!.diagnostics) {
        const href = d.codeDescription?.href;
        expect(href, `${file}: ${String(d.code)}`).toBe(pathToFileURL(join(installed, 'docs', 'rules', `${String(d.code)}.md`)).href);
        expect(existsSyncSafe(fileURLToPath(href!))).toBe(true);
        linked++;
      }
    }
    expect(linked).toBeGreaterThan(20);
  }, 240_000);

  it('puts the velocity finding on the pipe size, offers a resize, and the fix clears it', async () => {
    const uri = pathToFileURL(join(folder, 'slow.vacnet')).href;
    await open(uri, SLOW_SYSTEM);
    await settled(server, uri, 1);
    const finding = latest(uri)!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')!;
    const line = SLOW_SYSTEM.split('\n')[finding.range.start.line]!;
    expect(line.slice(finding.range.start.character, finding.range.end.character)).toBe('4 in');
    const actions = await server.request<{ title: string; isPreferred?: boolean; edit?: { changes: Record<string, { range: Published['diagnostics'][number]['range']; newText: string }[]> } }[]>('textDocument/codeAction', {
      textDocument: { uri },
      range: finding.range,
      context: { diagnostics: [finding] },
    });
    const preferred = actions.find((a) => a.isPreferred)!;
    expect(preferred.title).toMatch(/^Resize pipe 'main-1' to /);
    await change(uri, applyEdits(SLOW_SYSTEM, preferred.edit!.changes[uri]!), 2);
    await settled(server, uri, 2);
    expect(latest(uri)!.diagnostics.filter((d) => d.code === 'slow-carrying-velocity')).toEqual([]);
  }, 60_000);

  it('answers inlay hints with the engine numbers for every inlet, and the status bar summary', async () => {
    const file = join(examplesDir, 'harbour-offices.vacnet');
    const uri = pathToFileURL(file).href;
    const lines = readFileSync(file, 'utf8').split('\n');
    const hints = await server.request<{ position: { line: number }; label: string }[]>('textDocument/inlayHint', { textDocument: { uri }, range: { start: { line: 0, character: 0 }, end: { line: lines.length, character: 0 } } });
    const inletLines = lines.map((l, i) => (/^\s*inlet /.test(l) ? i : -1)).filter((i) => i >= 0);
    for (const line of inletLines) expect(hints.find((h) => h.position.line === line)?.label, lines[line]).toMatch(/^[\d.]+ inHg · [\d.]+ scfm$/);
    const summary = await server.request<{ status: string; system: string; producer: { marginText: string }; worstInlet: { name: string } }>('vacnet/systemSummary', { uri });
    expect(summary).toMatchObject({ status: 'ready', system: 'Harbour offices, five floors over a basement' });
    expect(summary.producer.marginText).toMatch(/^margin \d+ %$/);
  });

  it('formats every example so that formatting again changes nothing', async () => {
    const options = { tabSize: 2, insertSpaces: true };
    for (const name of readdirSync(examplesDir).filter((f) => f.endsWith('.vacnet'))) {
      const uri = pathToFileURL(join(folder, 'format', name)).href;
      const text = readFileSync(join(examplesDir, name), 'utf8');
      await open(uri, text);
      const edits = await server.request<{ range: Published['diagnostics'][number]['range']; newText: string }[] | null>('textDocument/formatting', { textDocument: { uri }, options });
      await change(uri, applyEdits(text, edits ?? []), 2);
      expect((await server.request<unknown[] | null>('textDocument/formatting', { textDocument: { uri }, options })) ?? [], name).toEqual([]);
    }
  });

  it('starts over node IPC, as the language client starts it', async () => {
    // vscode-languageclient's TransportKind.ipc forks the module with `--node-ipc`.
    const child = fork(join(installed, 'dist', 'server.cjs'), ['--node-ipc'], { stdio: ['ignore', 'ignore', 'pipe', 'ipc'] });
    const connection = createMessageConnection(new IPCMessageReader(child), new IPCMessageWriter(child));
    connection.listen();
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    try {
      const result = await connection.sendRequest<{ capabilities: Record<string, unknown> }>('initialize', initializeParams());
      expect(result.capabilities.inlayHintProvider).toBeTruthy();
      await connection.sendRequest('shutdown');
      await connection.sendNotification('exit');
      expect(await exited).toBe(0);
    } finally {
      connection.dispose();
      if (child.exitCode === null) child.kill();
    }
  });

  it('the installed command line checks a file, finding its rule pages in the installed extension', () => {
    const run = spawnSync(process.execPath, [join(installed, 'dist', 'cli.mjs'), 'check', '--format', 'sarif', join(examplesDir, 'grinding-plant.vacnet')], { encoding: 'utf8', timeout: 120_000 });
    expect(run.status).toBe(0);
    const sarif = JSON.parse(run.stdout) as { runs: { tool: { driver: { version?: string; rules: { id: string; help?: { text: string } }[] } } }[] };
    const rule = sarif.runs[0]!.tool.driver.rules.find((r) => r.id === 'dust-metal');
    // The help text comes from docs/rules/dust-metal.md as shipped.
    expect(rule?.help?.text).toContain(readFileSync(join(installed, 'docs', 'rules', 'dust-metal.md'), 'utf8').split('\n').find((l) => l.startsWith('**'))!.replace(/\*\*/g, '').slice(0, 30));
  });
});
