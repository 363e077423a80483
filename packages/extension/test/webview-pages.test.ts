// The report and schematic views' pages, as the extension makes them from
// what the language server answers (the `vacnet/reportData` request of the
// bundled server, decoded as the client decodes it), shown in headless
// Chromium the way a VS Code webview shows them: served from one origin
// that is the page's `cspSource`, with the editor's theme given as CSS
// variables on the root element (the webview sets --vscode-* variables
// there; the values below are those of VS Code's Dark+ and Light+ themes,
// from memory). The page must load with its strict Content-Security-Policy
// unbroken (a violation is logged as a console error), follow both themes,
// and equal the command line's report of the same file.
//
// With VACNET_WRITE_SCREENSHOTS=1 the run writes the README's screenshots
// to packages/extension/images/.
import { createServer, type Server } from 'node:http';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDocuments } from '@vacnet/language';
import { renderReportHtml, type ReportInput } from '../../cli/src/report/report-api.js';
import { decodePlainData, REPORT_DATA_REQUEST, type ReportData } from '../../language/src/lsp/system-requests-protocol.js';
import { shutdown, startStdioServer } from '../../language/test/lsp/stdio-client.js';
import { markdownPage, reportPage, schematicPage, type PageOptions } from '../src/report-page.js';
import { webviewPolicy } from '../src/webview-policy.js';

const CHROMIUM = '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
if (!available && !inCi) console.warn(`webview-pages: skipped: ${CHROMIUM} is missing (apt-get install -y chromium). With CI set this test runs and fails instead.`);
const writeScreenshots = process.env.VACNET_WRITE_SCREENSHOTS === '1';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const examplesDir = fileURLToPath(new URL('../../../examples/', import.meta.url));
const AT = new Date('2025-05-01T10:00:00Z');

/** Theme colours the webview sets (VS Code's Dark+ and Light+ defaults, from memory). */
const THEMES = {
  dark: { '--vscode-editor-background': '#1e1e1e', '--vscode-editor-foreground': '#d4d4d4', '--vscode-textLink-foreground': '#3794ff', '--vscode-panel-border': '#80808059', '--vscode-editorWidget-background': '#252526', '--vscode-descriptionForeground': '#ccccccb3' },
  light: { '--vscode-editor-background': '#ffffff', '--vscode-editor-foreground': '#000000', '--vscode-textLink-foreground': '#006ab1', '--vscode-panel-border': '#80808059', '--vscode-editorWidget-background': '#f3f3f3', '--vscode-descriptionForeground': '#717171' },
} as const;
const rgb = (hex: string) => `rgb(${[1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)).join(', ')})`;

/** The report input the server gives for a file, decoded as the client decodes it. */
async function fromServer(file: string): Promise<ReportInput> {
  const server = startStdioServer([join(extensionRoot, 'dist', 'server.cjs'), '--stdio']);
  try {
    await server.request('initialize', { processId: null, rootUri: null, workspaceFolders: null, capabilities: {} });
    await server.connection.sendNotification('initialized', {});
    for (const f of [join(examplesDir, 'catalog', 'equipment.vacnet'), file]) {
      await server.connection.sendNotification('textDocument/didOpen', { textDocument: { uri: pathToFileURL(f).href, languageId: 'vacnet', version: 1, text: readFileSync(f, 'utf8') } });
    }
    const data = await server.request<ReportData | null>(REPORT_DATA_REQUEST, { uri: pathToFileURL(file).href });
    expect(data?.status).toBe('ready');
    expect(await shutdown(server)).toBe(0);
    return decodePlainData<ReportInput>(data!.input);
  } finally {
    if (server.child.exitCode === null) server.child.kill();
  }
}

/** The same file as `vacnet report` loads it. */
async function fromLoader(file: string): Promise<ReportInput> {
  const loaded = (await loadDocuments([file], { analyse: true })).files[0]!;
  return { path: loaded.path, diagnostics: loaded.diagnostics, ...(loaded.model ? { model: loaded.model } : {}), ...(loaded.analysis ? { analysis: loaded.analysis } : {}), accepted: loaded.accepted ?? [] };
}

describe('the report and schematic pages', () => {
  it('the server\'s report data makes the same report as the command line\'s loader', async () => {
    const file = join(examplesDir, 'grinding-plant.vacnet');
    const [server, loader] = await Promise.all([fromServer(file), fromLoader(file)]);
    server.path = loader.path = 'grinding-plant.vacnet';
    const options = { generatedAt: AT, version: '0.1.0' };
    expect(await renderReportHtml(server, options)).toBe(await renderReportHtml(loader, options));
  }, 120_000);

  it('carry a policy with no script source, no unsafe-inline, the style by nonce, and no style attributes', async () => {
    const input = await fromLoader(join(examplesDir, 'harbour-offices.vacnet'));
    const options: PageOptions = { cspSource: 'https://webview.test', nonce: 'bm9uY2Vub25jZW5vbmNl', stylesheet: 'https://webview.test/media/webview.css', version: '0.1.0', generatedAt: AT };
    const policy = webviewPolicy(options.cspSource, options.nonce);
    expect(policy).toMatch(/^default-src 'none'; /);
    expect(policy).not.toMatch(/unsafe|script-src/);
    for (const html of [await reportPage(input, options), await schematicPage(input, options), markdownPage('Changes', '# Title\n\n| a | b |\n|---|---|\n| 1 | 2 |\n', options)]) {
      expect(html).toContain(`content="${policy.replace(/'/g, '&#39;')}"`);
      expect(html).not.toMatch(/<script/i);
      expect(html).not.toMatch(/\sstyle="/i);
      expect(html).toContain(`<style nonce="${options.nonce}">`);
      expect(html).toContain('<link rel="stylesheet" href="https://webview.test/media/webview.css">');
    }
  }, 60_000);
});

describe.runIf(available || inCi)('the pages in headless Chromium, as a webview shows them', () => {
  let http: Server;
  let origin = '';
  let browser: Browser;
  const pages = new Map<string, string>();

  beforeAll(async () => {
    http = createServer((request, response) => {
      const page = pages.get(request.url ?? '');
      if (page !== undefined) {
        response.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
        response.end(page);
      } else if (request.url === '/media/webview.css') {
        response.writeHead(200, { 'content-type': 'text/css' });
        response.end(readFileSync(join(extensionRoot, 'media', 'webview.css')));
      } else {
        response.writeHead(request.url === '/favicon.ico' ? 204 : 404);
        response.end();
      }
    });
    await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve));
    origin = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--headless', '--disable-gpu', '--disable-background-networking', '--no-first-run'] });
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    await new Promise<void>((resolve) => (http ? http.close(() => resolve()) : resolve()));
  });

  async function show(path: string, html: string, theme: keyof typeof THEMES, viewport = { width: 1000, height: 700 }) {
    pages.set(path, html);
    const page = await browser.newPage({ viewport });
    const problems: string[] = [];
    const requests: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(m.text());
    });
    page.on('pageerror', (e) => problems.push(e.message));
    page.on('request', (r) => requests.push(r.url().slice(origin.length)));
    await page.goto(`${origin}${path}`, { waitUntil: 'load' });
    // As the webview host does: the theme's colours as variables on the root element (through the CSSOM, which the policy allows).
    await page.evaluate((vars) => {
      for (const [name, value] of Object.entries(vars)) document.documentElement.style.setProperty(name, value);
    }, THEMES[theme]);
    return { page, problems, requests };
  }

  const options = (): PageOptions => ({ cspSource: origin, nonce: 'dGVzdG5vbmNldGVzdG5vbmNl', stylesheet: `${origin}/media/webview.css`, version: '0.1.0', generatedAt: AT });
  const colours = (page: Page) =>
    page.evaluate(() => {
      const body = getComputedStyle(document.body);
      return { background: body.backgroundColor, text: body.color, padding: body.paddingLeft };
    });

  it('the report follows the dark and the light theme, loads only its style sheet, and breaks no policy', async () => {
    const input = await fromLoader(join(examplesDir, 'harbour-offices.vacnet'));
    input.path = 'examples/harbour-offices.vacnet';
    const html = await reportPage(input, options());
    for (const theme of ['dark', 'light'] as const) {
      const { page, problems, requests } = await show(`/report-${theme}.html`, html, theme);
      expect(problems).toEqual([]);
      expect(requests).toEqual([`/report-${theme}.html`, '/media/webview.css']);
      expect(await colours(page)).toEqual({ background: rgb(THEMES[theme]['--vscode-editor-background']), text: rgb(THEMES[theme]['--vscode-editor-foreground']), padding: '12px' });
      expect(await page.locator('svg.vn-producer-curve').count()).toBe(1);
      if (writeScreenshots && theme === 'dark') writeFileSync(join(extensionRoot, 'images', `screenshot-report-${theme}.png`), await page.screenshot({ clip: { x: 0, y: 0, width: 1000, height: 700 } }));
      await page.close();
    }
  }, 120_000);

  it('the schematic page draws the network with every inlet, in the dark theme', async () => {
    const input = await fromLoader(join(examplesDir, 'detached-house.vacnet'));
    input.path = 'examples/detached-house.vacnet';
    const { page, problems } = await show('/schematic.html', await schematicPage(input, options()), 'dark', { width: 1000, height: 700 });
    expect(problems).toEqual([]);
    const drawn = await page.evaluate(() => {
      const svg = document.querySelector('svg');
      const box = svg?.getBoundingClientRect();
      return { width: box?.width ?? 0, text: svg?.textContent ?? '' };
    });
    expect(drawn.width).toBeGreaterThan(500);
    for (const inlet of input.model!.inlets.map((i) => i.name)) expect(drawn.text, inlet).toContain(inlet);
    expect((await colours(page)).background).toBe(rgb(THEMES.dark['--vscode-editor-background']));
    if (writeScreenshots) writeFileSync(join(extensionRoot, 'images', 'screenshot-schematic-dark.png'), await page.screenshot({ fullPage: true }));
    await page.close();
  }, 120_000);

  it('a comparison page shows its table, escaped', async () => {
    const markdown = '### Changes\n\n| element | before | after |\n|---|---|---|\n| pipe `main-1` | 3 in | 2-1/2 in |\n| <img src=x> | a | b |\n';
    const { page, problems } = await show('/compare.html', markdownPage('Changes', markdown, options()), 'light');
    expect(problems).toEqual([]);
    expect(await page.locator('table td').count()).toBe(6);
    expect(await page.locator('img').count()).toBe(0);
    await page.close();
  });
});
