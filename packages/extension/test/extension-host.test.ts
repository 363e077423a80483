// The extension's own code run in Node against a stand-in for the `vscode`
// module (fake-vscode.ts; VS Code cannot be downloaded here) and the real
// bundled language server over stdio in place of the language client: the
// commands it registers, the status bar item, the report and schematic
// webviews and their redraw after an edit, the example command, the check
// task and the comparison with the last commit (the bundled command line
// and git). What only VS Code can show (the rendering of the status bar,
// the webview host, the task terminal) is not covered here.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { build } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shutdown, startStdioServer, type StdioServer } from '../../language/test/lsp/stdio-client.js';
import { SLOW_SYSTEM } from '../../language/test/lsp/live-services.js';
import type * as Fake from './fake-vscode.js';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const repoRoot = join(extensionRoot, '..', '..');
const examplesDir = join(repoRoot, 'examples');
const manifest = JSON.parse(readFileSync(join(extensionRoot, 'package.json'), 'utf8'));
const hasGit = spawnSync('git', ['--version']).status === 0;

interface Bundle {
  startExtension: (context: unknown, client: unknown, host: { kind: 'desktop' | 'web'; cli?: string; compare?: (document: unknown) => Promise<void> }) => Promise<void>;
  compareWithCommitted: (context: unknown, document: unknown, cli: string) => Promise<void>;
  vscode: typeof Fake;
}

let folder = '';
let bundle: Bundle;
let vscode: typeof Fake;
let server: StdioServer;
let context: { subscriptions: { dispose(): void }[]; extensionUri: Fake.Uri; extension: { packageJSON: unknown }; asAbsolutePath(p: string): string };
const cli = join(extensionRoot, 'dist', 'cli.mjs');
const opened = new Map<string, number>();

/** Opens or changes a document in the server, as the language client would after the editor did. */
async function put(uri: string, text: string): Promise<void> {
  const version = (opened.get(uri) ?? 0) + 1;
  opened.set(uri, version);
  if (version === 1) await server.connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'vacnet', version, text } });
  else await server.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version }, contentChanges: [{ text }] });
}

async function until<T>(probe: () => T | undefined | false, what: string, limitMs = 30_000): Promise<T> {
  const deadline = Date.now() + limitMs;
  for (;;) {
    const value = probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'vacnet-host-'));
  const outfile = join(folder, 'extension-under-test.mjs');
  await build({
    stdin: {
      contents: "export { startExtension } from './src/start-extension.ts';\nexport { compareWithCommitted } from './src/compare-command.ts';\nexport * as vscode from 'vscode';\n",
      resolveDir: extensionRoot,
      loader: 'ts',
    },
    bundle: true,
    platform: 'node',
    format: 'esm',
    outfile,
    alias: { vscode: join(extensionRoot, 'test', 'fake-vscode.ts'), '@vacnet/engine': join(repoRoot, 'packages/engine/src/index.ts') },
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
    logLevel: 'error',
  });
  bundle = (await import(pathToFileURL(outfile).href)) as Bundle;
  vscode = bundle.vscode;

  server = startStdioServer([join(extensionRoot, 'dist', 'server.cjs'), '--stdio']);
  await server.request('initialize', { processId: null, rootUri: null, workspaceFolders: null, capabilities: {} });
  await server.connection.sendNotification('initialized', {});
  const client = {
    start: async () => undefined,
    stop: async () => undefined,
    isRunning: () => server.child.exitCode === null,
    sendRequest: (method: string, params: unknown) => server.request(method, params),
  };
  context = { subscriptions: [], extensionUri: vscode.Uri.file(extensionRoot), extension: { packageJSON: manifest }, asAbsolutePath: (p) => join(extensionRoot, p) };
  vscode.state.workspaceFolders = [{ uri: vscode.Uri.file(examplesDir), name: 'examples', index: 0 }];
  await bundle.startExtension(context, client, { kind: 'desktop', cli, compare: (document) => bundle.compareWithCommitted(context, document, cli) });
}, 120_000);

afterAll(async () => {
  for (const subscription of context?.subscriptions ?? []) subscription.dispose();
  if (server?.child.exitCode === null) expect(await shutdown(server)).toBe(0);
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe('the extension in a stand-in editor', () => {
  it('registers every command the manifest declares, and the check task provider', () => {
    expect([...vscode.state.commands.keys()].sort()).toEqual(manifest.contributes.commands.map((c: { command: string }) => c.command).sort());
    expect(vscode.state.taskProviders.has('vacnet')).toBe(true);
  });

  it('shows the active system\'s producer margin and worst inlet in the status bar, and hides it for other files', async () => {
    const file = join(examplesDir, 'grinding-plant.vacnet');
    await put(pathToFileURL(join(examplesDir, 'catalog', 'equipment.vacnet')).href, readFileSync(join(examplesDir, 'catalog', 'equipment.vacnet'), 'utf8'));
    await put(pathToFileURL(file).href, readFileSync(file, 'utf8'));
    vscode.state.activeEditor = { document: vscode.documentOf(vscode.Uri.file(file)) };
    vscode.state.onActiveEditor.fire(vscode.state.activeEditor);
    const item = vscode.state.statusItems[0]!;
    await until(() => item.visible && item.text.includes('margin'), 'the status bar item');
    const check = spawnSync(process.execPath, [cli, 'check', file], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } }).stdout;
    const margin = /margin (\S+ %) on flow/.exec(check)![1];
    const worst = /worst inlet (\S+):/.exec(check)![1];
    // A margin to spare, no tool short and no error: no warning colour.
    expect(item.text).toBe(`$(dashboard) margin ${margin} \u00b7 worst ${worst}`);
    expect(item.backgroundColor).toBeUndefined();
    expect(item.command).toBe('vacnet.openReport');
    vscode.state.activeEditor = { document: { ...vscode.documentOf(vscode.Uri.file(join(repoRoot, 'README.md'))), languageId: 'markdown' } };
    vscode.state.onActiveEditor.fire(vscode.state.activeEditor);
    expect(item.visible).toBe(false);
  });

  it('opens the report beside the file, without scripts, and redraws it after an edit', async () => {
    const file = join(folder, 'slow.vacnet');
    writeFileSync(file, SLOW_SYSTEM);
    const uri = vscode.Uri.file(file);
    await put(uri.toString(), SLOW_SYSTEM);
    vscode.state.activeEditor = { document: vscode.documentOf(uri) };
    await vscode.commands.executeCommand('vacnet.openReport');
    const panel = vscode.state.panels.at(-1)!;
    expect(panel).toMatchObject({ viewType: 'vacnet.report', title: 'Report: slow.vacnet' });
    expect(panel.options.enableScripts).toBe(false);
    expect(panel.options.localResourceRoots!.map((r) => r.path)).toEqual([join(extensionRoot, 'media').split('\\').join('/')]);
    expect(panel.webview.html).toContain('<h1>Slow main</h1>');
    expect(panel.webview.html).toContain('content="default-src &#39;none&#39;; style-src https://webview.test &#39;nonce-');
    expect(panel.webview.html).toContain('slow-carrying-velocity');
    // The rule pages of its findings, read from the extension's docs/rules.
    expect(panel.webview.html).toContain('id="rule-slow-carrying-velocity"');
    // The same command again shows the same panel.
    await vscode.commands.executeCommand('vacnet.openReport');
    expect(vscode.state.panels.filter((p) => p.viewType === 'vacnet.report' && !p.disposed)).toHaveLength(1);

    const edited = SLOW_SYSTEM.replace('system "Slow main"', 'system "Slow main, edited"').replace('size 4 in', 'size 2 in');
    await put(uri.toString(), edited);
    vscode.state.onChangeDocument.fire({ document: vscode.documentOf(uri) });
    await until(() => panel.webview.html.includes('<h1>Slow main, edited</h1>'), 'the redrawn report');
    expect(panel.webview.html).not.toContain('id="rule-slow-carrying-velocity"');
    panel.dispose();
  });

  it('shows the schematic beside the file', async () => {
    const file = join(examplesDir, 'grinding-plant.vacnet');
    vscode.state.activeEditor = { document: vscode.documentOf(vscode.Uri.file(file)) };
    await vscode.commands.executeCommand('vacnet.openSchematic');
    const panel = vscode.state.panels.at(-1)!;
    expect(panel.viewType).toBe('vacnet.schematic');
    expect(panel.webview.html).toMatch(/<svg[^>]*>/);
    expect(panel.webview.html).toContain('grinding-plant.vacnet');
    panel.dispose();
  });

  it('asks for a .vacnet file when another is active', async () => {
    vscode.state.activeEditor = { document: { ...vscode.documentOf(vscode.Uri.file(join(repoRoot, 'README.md'))), languageId: 'markdown' } };
    const panels = vscode.state.panels.length;
    await vscode.commands.executeCommand('vacnet.openReport');
    expect(vscode.state.panels.length).toBe(panels);
    expect(vscode.state.messages.at(-1)).toBe('Open a .vacnet file first.');
  });

  it('opens an example as an untitled file with its catalog written in', async () => {
    vscode.state.quickPick = (items) => items.find((i) => i.label === 'Detached house');
    await vscode.commands.executeCommand('vacnet.openExample');
    const example = vscode.state.opened.at(-1)!;
    expect(example.language).toBe('vacnet');
    expect(example.content).toContain('system "Detached house, two storeys and basement"');
    expect(example.content).toContain('producer home-unit {');
    expect(example.content).not.toMatch(/^use /m);
  });

  it('checks the workspace as a task with the $vacnet problem matcher, run by the editor\'s runtime as Node', async () => {
    await vscode.commands.executeCommand('vacnet.checkWorkspace');
    const task = vscode.state.executedTasks.at(-1)!;
    expect(task.problemMatchers).toBe('$vacnet');
    expect(task.definition).toEqual({ type: 'vacnet', paths: ['.'] });
    expect(task.execution.args).toEqual([cli, 'check', '--', '.']);
    expect(task.execution.options).toEqual({ cwd: examplesDir, env: { ELECTRON_RUN_AS_NODE: '1', NO_COLOR: '1' } });
    // A task from tasks.json is resolved with its own paths and options.
    const provider = vscode.state.taskProviders.get('vacnet') as { resolveTask(task: unknown): Fake.Task | undefined };
    const resolved = provider.resolveTask(new vscode.Task({ type: 'vacnet', paths: ['systems'], args: ['--max-warnings', '0'] }, vscode.state.workspaceFolders![0], 'mine', 'vacnet', new vscode.ProcessExecution('', [], {}), '$vacnet'));
    expect(resolved?.execution.args).toEqual([cli, 'check', '--max-warnings', '0', '--', 'systems']);
  });

  it.runIf(hasGit)('compares a file with its last commit and shows the changes beside it', async () => {
    const repo = mkdtempSync(join(folder, 'repo-'));
    const git = (...args: string[]) => spawnSync('git', ['-c', 'user.name=test', '-c', 'user.email=test@example.test', '-c', 'commit.gpgsign=false', ...args], { cwd: repo, encoding: 'utf8' });
    git('init', '-q');
    const file = join(repo, 'plant.vacnet');
    writeFileSync(file, SLOW_SYSTEM);
    git('add', 'plant.vacnet');
    expect(git('commit', '-q', '-m', 'first').status).toBe(0);
    writeFileSync(file, SLOW_SYSTEM.replace('size 4 in', 'size 2 in'));
    vscode.state.activeEditor = { document: vscode.documentOf(vscode.Uri.file(file)) };
    await vscode.commands.executeCommand('vacnet.compareWithCommitted');
    const panel = vscode.state.panels.at(-1)!;
    expect(panel.viewType).toBe('vacnet.compare');
    expect(panel.webview.html).toContain('main-1');
    expect(panel.webview.html).toMatch(/4 in/);
    expect(panel.webview.html).toMatch(/2 in/);
    expect(panel.webview.html).not.toMatch(/<script/i);
  }, 120_000);
});
