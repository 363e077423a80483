import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReportHtml } from '../../src/report/report-api.js';
import { loadExample } from './example-reports.js';

// The HTML report in a real browser: Debian's Chromium, driven headless by
// playwright-core. The page must load without console errors or any request
// beyond its own file (its Content-Security-Policy forbids the rest, and a
// violation would be logged), its SVGs must hold their elements, the text
// must fit the schematic's boxes with real fonts, and it must follow a dark
// colour scheme and print on white. Screenshots go to a temporary folder
// for a person to look at.

const CHROMIUM = '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
if (!available && !inCi) {
  console.warn(`render-in-chromium: skipped: ${CHROMIUM} is missing (install Debian's chromium: apt-get install -y chromium). With CI set this test runs and fails instead.`);
}

const AT = new Date('2025-05-01T10:00:00Z');
let shots: string;
let browser: Browser;

/** Every rule page, as the command line reads them. */
function rulePages(): Map<string, string> {
  const folder = new URL('../../../../docs/rules/', import.meta.url);
  return new Map(readdirSync(folder).map((f) => [f.replace(/\.md$/, ''), readFileSync(new URL(f, folder), 'utf8')]));
}

async function openReport(name: 'harbour-offices' | 'grinding-plant', colorScheme: 'light' | 'dark' = 'light') {
  const html = await renderReportHtml(await loadExample(name), { generatedAt: AT, version: '0.1.0', rulePages: rulePages() });
  const file = join(shots, `${name}.html`);
  writeFileSync(file, html);
  const page = await browser.newPage({ viewport: { width: 1200, height: 900 }, colorScheme });
  const problems: string[] = [];
  const requests: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('requestfailed', (r) => problems.push(`request failed: ${r.url()}`));
  page.on('request', (r) => requests.push(r.url()));
  const url = pathToFileURL(file).href;
  await page.goto(url, { waitUntil: 'load' });
  return { page, problems, requests, url };
}

describe.runIf(available || inCi)('the HTML report in headless Chromium', () => {
  beforeAll(async () => {
    shots = mkdtempSync(join(tmpdir(), 'vacnet-report-shots-'));
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--no-sandbox', '--headless', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    console.log(`render-in-chromium: screenshots in ${shots}`);
  });

  it('loads with no console error and no request but its own file', async () => {
    const { page, problems, requests, url } = await openReport('harbour-offices');
    expect(problems).toEqual([]);
    expect(requests).toEqual([url]);
    await page.screenshot({ path: join(shots, 'harbour-offices-light.png'), fullPage: true });
    await page.close();
  }, 120_000);

  it('the producer curve SVG has its curve, system demand, operating point, axes and legend, all drawn', async () => {
    const { page } = await openReport('harbour-offices');
    const curve = await page.evaluate(() => {
      const svg = document.querySelector('svg.vn-producer-curve') as SVGSVGElement;
      const box = (selector: string) => {
        const el = svg.querySelector(selector) as SVGGraphicsElement | null;
        if (!el) return null;
        const b = el.getBBox();
        return { width: b.width, height: b.height };
      };
      return {
        producer: box('path.vn-curve-producer'),
        system: box('path.vn-curve-system'),
        operating: box('circle.vn-op-point'),
        demand: box('path.vn-demand-point'),
        xTicks: svg.querySelectorAll('text.vn-tick-x').length,
        yTicks: svg.querySelectorAll('text.vn-tick-y').length,
        legendRows: svg.querySelectorAll('.vn-legend text').length,
        title: svg.querySelector('title')?.textContent ?? '',
        labelledBy: svg.getAttribute('aria-labelledby'),
        shown: svg.getBoundingClientRect().width,
      };
    });
    expect(curve.producer!.width).toBeGreaterThan(300);
    expect(curve.system!.height).toBeGreaterThan(100);
    expect(curve.operating!.width).toBeCloseTo(12, 0);
    expect(curve.demand!.width).toBeGreaterThan(8);
    expect(curve.xTicks).toBeGreaterThanOrEqual(5);
    expect(curve.yTicks).toBeGreaterThanOrEqual(4);
    expect(curve.legendRows).toBe(5);
    expect(curve.title).toMatch(/^Producer curve of multistage-4op/);
    expect(curve.labelledBy).toBe('vn-curve-title vn-curve-desc');
    expect(curve.shown).toBeGreaterThan(600);
    const figure = await page.$('#producer figure');
    await figure!.screenshot({ path: join(shots, 'harbour-offices-curve.png') });
    await page.close();
  }, 120_000);

  it('the schematic has one labelled node per inlet, and every label fits its box in real fonts', async () => {
    const input = await loadExample('harbour-offices');
    const { page } = await openReport('harbour-offices');
    const nodes = await page.evaluate(() =>
      [...document.querySelectorAll('svg.vn-schematic g.vn-node')].map((g) => {
        const rect = g.querySelector('rect')?.getBBox();
        const texts = [...g.querySelectorAll('text')].map((t) => {
          const b = t.getBBox();
          return { text: t.textContent ?? '', left: b.x, right: b.x + b.width, top: b.y, bottom: b.y + b.height };
        });
        return { kind: g.getAttribute('data-kind'), name: g.getAttribute('data-name'), band: g.getAttribute('data-band'), rect: rect && { x: rect.x, y: rect.y, width: rect.width, height: rect.height }, texts };
      }),
    );
    const inlets = nodes.filter((n) => n.kind === 'inlet');
    expect(inlets.map((n) => n.name).sort()).toEqual(input.model.inlets.map((i) => i.name).sort());
    for (const node of nodes.filter((n) => n.rect && n.texts.length > 0)) {
      for (const t of node.texts) {
        expect(t.left, `${node.name}: "${t.text}"`).toBeGreaterThanOrEqual(node.rect!.x - 0.5);
        expect(t.right, `${node.name}: "${t.text}" overflows its box`).toBeLessThanOrEqual(node.rect!.x + node.rect!.width + 0.5);
        expect(t.bottom, `${node.name}: "${t.text}"`).toBeLessThanOrEqual(node.rect!.y + node.rect!.height + 1);
      }
    }
    for (const inlet of inlets) expect(inlet.texts[0]!.text).toBe(inlet.name);
    const labels = await page.locator('svg.vn-schematic text.vn-pipe-label').count();
    expect(labels).toBe(input.model.pipes.length);
    const figure = await page.$('#schematic figure');
    await figure!.screenshot({ path: join(shots, 'harbour-offices-schematic.png') });
    await page.close();
  }, 120_000);

  it('a dark colour scheme darkens the page and keeps the text light; print is on white', async () => {
    const { page, problems } = await openReport('grinding-plant', 'dark');
    expect(problems).toEqual([]);
    const colours = () =>
      page.evaluate(() => ({
        background: getComputedStyle(document.body).backgroundColor,
        text: getComputedStyle(document.body).color,
        caution: getComputedStyle(document.querySelector('.vn-caution-dust .vn-caution-title')!).color,
      }));
    const luminance = (rgb: string) => {
      const [r, g, b] = rgb.match(/[\d.]+/g)!.map(Number);
      return (0.2126 * r! + 0.7152 * g! + 0.0722 * b!) / 255;
    };
    const dark = await colours();
    expect(luminance(dark.background)).toBeLessThan(0.2);
    expect(luminance(dark.text)).toBeGreaterThan(0.7);
    await page.screenshot({ path: join(shots, 'grinding-plant-dark.png'), fullPage: true });
    await page.emulateMedia({ media: 'print', colorScheme: 'dark' });
    const print = await colours();
    expect(print.background).toBe('rgb(255, 255, 255)');
    expect(print.text).toBe('rgb(0, 0, 0)');
    const breaks = await page.evaluate(() => [...document.querySelectorAll('section.vn-break-before')].map((s) => getComputedStyle(s).breakBefore));
    expect(breaks.length).toBeGreaterThanOrEqual(5);
    expect(new Set(breaks)).toEqual(new Set(['page']));
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    writeFileSync(join(shots, 'grinding-plant.pdf'), pdf);
    await page.close();
  }, 120_000);
});
