// The language server's web-worker build (dist/browser-server.js) in a real
// browser: Debian's Chromium, headless, driven by playwright-core. A test
// page served from 127.0.0.1 starts the bundle as a Worker and speaks raw
// JSON-RPC to it over postMessage, as the browser language client does
// (vscode-jsonrpc's BrowserMessageReader/Writer post the message objects
// themselves). Message shapes are those of the LSP 3.17 specification. The
// same messages go to the Node server bundle over stdio, and the two must
// publish the same findings and give the same inlay hints: the engine's
// analysis runs inside the worker.
import { createServer, type Server } from 'node:http';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shutdown, startStdioServer, type StdioServer } from '../../language/test/lsp/stdio-client.js';
import { SLOW_SYSTEM } from '../../language/test/lsp/live-services.js';

const CHROMIUM = '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
if (!available && !inCi) {
  console.warn(`browser-server: skipped: ${CHROMIUM} is missing (apt-get install -y chromium). With CI set this test runs and fails instead.`);
}

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const examplesDir = fileURLToPath(new URL('../../../examples/', import.meta.url));
const workerBundle = join(extensionRoot, 'dist', 'browser-server.js');
const nodeBundle = join(extensionRoot, 'dist', 'server.cjs');

/** The documents both servers get: the catalog, every example system, a slow main with a finding, a syntax error. */
function documents(): { uri: string; text: string }[] {
  const files = [join(examplesDir, 'catalog', 'equipment.vacnet'), ...readdirSync(examplesDir).filter((f) => f.endsWith('.vacnet')).sort().map((f) => join(examplesDir, f))];
  return [
    ...files.map((file) => ({ uri: pathToFileURL(file).href, text: readFileSync(file, 'utf8') })),
    { uri: 'file:///tmp/vacnet-browser-test/slow.vacnet', text: SLOW_SYSTEM },
    { uri: 'file:///tmp/vacnet-browser-test/broken.vacnet', text: 'system "Broken" {\n  frobnicate 1\n}\n' },
  ];
}

/** The initialize request of a plain client: no workspace folder, no configuration pull. */
const INITIALIZE = {
  processId: null,
  clientInfo: { name: 'vacnet-browser-test' },
  rootUri: null,
  workspaceFolders: null,
  capabilities: {
    textDocument: { synchronization: { didSave: true }, publishDiagnostics: { relatedInformation: true, versionSupport: true }, inlayHint: {} },
  },
};

interface Diagnostic {
  range: { start: { line: number; character: number }; end: { line: number; character: number } };
  severity?: number;
  code?: string | number;
  message: string;
  codeDescription?: unknown;
}
interface InlayHint {
  position: { line: number; character: number };
  label: string | { value: string }[];
}
/** One diagnostic as text, without its rule-page link (the Node server links pages on disk; the worker has no disk). */
const key = (d: Diagnostic) => `${d.range.start.line}:${d.range.start.character}-${d.range.end.line}:${d.range.end.character} ${d.severity} ${String(d.code)} ${d.message}`;
const hintKey = (h: InlayHint) => `${h.position.line}:${h.position.character} ${typeof h.label === 'string' ? h.label : h.label.map((p) => p.value).join('')}`;

/** The test page: starts the worker and answers its requests to the client with null. */
const PAGE = `<!doctype html><html><head><meta charset="utf-8"><title>vacnet worker test</title></head><body><script>
const worker = new Worker('/browser-server.js');
const pending = new Map();
window.published = [];
window.workerErrors = [];
let next = 1;
worker.onerror = (event) => window.workerErrors.push(String(event.message || event));
worker.onmessage = (event) => {
  const message = event.data;
  if (message.id !== undefined && message.method === undefined) {
    const waiting = pending.get(message.id);
    pending.delete(message.id);
    if (waiting) waiting(message);
  } else if (message.id !== undefined) {
    worker.postMessage({ jsonrpc: '2.0', id: message.id, result: null });
  } else if (message.method === 'textDocument/publishDiagnostics') {
    window.published.push(message.params);
  }
};
window.request = (method, params) => new Promise((resolve) => {
  const id = next++;
  pending.set(id, resolve);
  worker.postMessage({ jsonrpc: '2.0', id, method, params });
});
window.notify = (method, params) => worker.postMessage({ jsonrpc: '2.0', method, params });
</script></body></html>`;

/** The two servers behind one interface: send, request, and the latest diagnostics of a document. */
interface Session {
  request<T>(method: string, params: unknown): Promise<T>;
  notify(method: string, params: unknown): Promise<void>;
  latest(uri: string): Promise<Diagnostic[] | undefined>;
}

function browserSession(page: Page): Session {
  return {
    async request<T>(method: string, params: unknown) {
      const reply = await page.evaluate(([m, p]) => (window as unknown as { request: (m: string, p: unknown) => Promise<{ result?: unknown; error?: { message: string } }> }).request(m as string, p), [method, params] as const);
      if (reply.error) throw new Error(`${method}: ${reply.error.message}`);
      return reply.result as T;
    },
    async notify(method, params) {
      await page.evaluate(([m, p]) => (window as unknown as { notify: (m: string, p: unknown) => void }).notify(m as string, p), [method, params] as const);
    },
    async latest(uri) {
      return page.evaluate((u) => (window as unknown as { published: { uri: string; diagnostics: Diagnostic[] }[] }).published.filter((p) => p.uri === u).at(-1)?.diagnostics, uri);
    },
  };
}

function nodeSession(server: StdioServer): Session {
  const published = new Map<string, Diagnostic[]>();
  server.connection.onNotification('textDocument/publishDiagnostics', (p: { uri: string; diagnostics: Diagnostic[] }) => published.set(p.uri, p.diagnostics));
  return {
    request: (method, params) => server.request(method, params),
    notify: async (method, params) => server.connection.sendNotification(method, params),
    latest: async (uri) => published.get(uri),
  };
}

/** Opens every document and waits until each one's analysis is in and published (the servers' `vacnet/analysisStatus` request). */
async function openAll(session: Session): Promise<void> {
  await session.request('initialize', INITIALIZE);
  await session.notify('initialized', {});
  for (const { uri, text } of documents()) {
    await session.notify('textDocument/didOpen', { textDocument: { uri, languageId: 'vacnet', version: 1, text } });
  }
  for (const { uri } of documents()) {
    const deadline = Date.now() + 60_000;
    for (;;) {
      const status = await session.request<{ status: string; version: number; published: boolean } | null>('vacnet/analysisStatus', { uri });
      if (status && status.version === 1 && status.status !== 'pending' && status.published) break;
      if (Date.now() > deadline) throw new Error(`${uri}: analysis not settled: ${JSON.stringify(status)}`);
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
  }
}

/** Every finding and every inlay hint each document gets. */
async function results(session: Session) {
  const out: Record<string, { diagnostics: string[]; hints: string[] }> = {};
  for (const { uri, text } of documents()) {
    const diagnostics = ((await session.latest(uri)) ?? []).map(key).sort();
    const hints = (await session.request<InlayHint[] | null>('textDocument/inlayHint', { textDocument: { uri }, range: { start: { line: 0, character: 0 }, end: { line: text.split('\n').length, character: 0 } } })) ?? [];
    out[uri.slice(uri.lastIndexOf('/') + 1)] = { diagnostics, hints: hints.map(hintKey).sort() };
  }
  return out;
}

describe.runIf(available || inCi)('the language server in a browser worker (headless Chromium)', () => {
  let http: Server;
  let origin = '';
  let browser: Browser;
  let page: Page;
  const pageProblems: string[] = [];

  beforeAll(async () => {
    if (!existsSync(workerBundle)) throw new Error(`${workerBundle} is missing: run \`npm run build\` first`);
    http = createServer((request, response) => {
      if (request.url === '/') {
        response.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
        response.end(PAGE);
      } else if (request.url === '/browser-server.js') {
        response.writeHead(200, { 'content-type': 'text/javascript; charset=utf-8' });
        response.end(readFileSync(workerBundle));
      } else if (request.url === '/favicon.ico') {
        response.writeHead(204);
        response.end();
      } else {
        response.writeHead(404);
        response.end();
      }
    });
    await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
    origin = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--headless', '--disable-gpu', '--disable-background-networking', '--no-first-run'] });
    page = await browser.newPage();
    page.on('pageerror', (error) => pageProblems.push(`page error: ${error.message}`));
    page.on('console', (message) => {
      if (message.type() === 'error') pageProblems.push(`console: ${message.text()}`);
    });
    await page.goto(`${origin}/`);
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    await new Promise<void>((resolve) => (http ? http.close(() => resolve()) : resolve()));
  });

  it('answers initialize over postMessage with the editor features', async () => {
    const session = browserSession(page);
    const result = await session.request<{ capabilities: Record<string, unknown> }>('initialize', INITIALIZE);
    expect(result.capabilities.textDocumentSync).toBeDefined();
    expect(result.capabilities.inlayHintProvider).toBeTruthy();
    expect(result.capabilities.hoverProvider).toBeTruthy();
    await page.reload();
  });

  it('publishes the same findings and gives the same inlay hints as the Node server, for every example', async () => {
    const browserSide = browserSession(page);
    await openAll(browserSide);
    const inBrowser = await results(browserSide);

    const server = startStdioServer([nodeBundle, '--stdio']);
    let onNode: Awaited<ReturnType<typeof results>>;
    try {
      const nodeSide = nodeSession(server);
      await openAll(nodeSide);
      onNode = await results(nodeSide);
      expect(await shutdown(server)).toBe(0);
    } finally {
      if (server.child.exitCode === null) server.child.kill();
    }

    expect(inBrowser).toEqual(onNode);
    // The comparison is not empty: engine findings and engine numbers came out of the worker.
    expect(inBrowser['slow.vacnet']!.diagnostics.some((d) => d.includes('slow-carrying-velocity'))).toBe(true);
    expect(inBrowser['broken.vacnet']!.diagnostics.some((d) => / 1 syntax-error /.test(d))).toBe(true);
    expect(inBrowser['harbour-offices.vacnet']!.hints.length).toBeGreaterThan(30);
    expect(inBrowser['grinding-plant.vacnet']!.diagnostics.some((d) => d.includes('dust-metal'))).toBe(true);
    expect(await page.evaluate(() => (window as unknown as { workerErrors: string[] }).workerErrors)).toEqual([]);
    expect(pageProblems).toEqual([]);
  }, 180_000);

  it('answers the status bar summary and the report data from the worker', async () => {
    const session = browserSession(page);
    const uri = pathToFileURL(join(examplesDir, 'grinding-plant.vacnet')).href;
    const summary = await session.request<{ status: string; producer?: { marginText: string }; worstInlet?: { name: string } }>('vacnet/systemSummary', { uri });
    expect(summary.status).toBe('ready');
    expect(summary.producer?.marginText).toMatch(/^margin \d+ %$/);
    expect(summary.worstInlet?.name).toBeTruthy();
    const data = await session.request<{ input: string }>('vacnet/reportData', { uri });
    expect(JSON.parse(data.input).analysis.inlets.length).toBeGreaterThan(0);
  });

  it('the worker bundle needs no Node: no require of a built-in module', () => {
    const bundle = readFileSync(workerBundle, 'utf8');
    expect(bundle).not.toMatch(/require\(["'](node:)?(fs|path|worker_threads|child_process|os)["']\)/);
  });
});
