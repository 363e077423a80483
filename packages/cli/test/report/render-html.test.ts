import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { loadDocuments } from '@vacnet/language';
import { describe, expect, it } from 'vitest';
import { renderReportHtml } from '../../src/report/report-api.js';
import { REPORT_STYLE } from '../../src/report/report-style.js';
import { loadExample } from './example-reports.js';

// The HTML report as a file a reviewer opens offline: self-contained, no
// scripts, a Content-Security-Policy that allows nothing else, every section.

const AT = new Date('2025-05-01T10:00:00Z');
const page = (code: string) => readFileSync(new URL(`../../../../docs/rules/${code}.md`, import.meta.url), 'utf8');

describe('renderReportHtml', () => {
  it('self-contained: no script, no external reference, one style sheet and no inline style attribute', async () => {
    const html = await renderReportHtml(await loadExample('harbour-offices'), { generatedAt: AT, version: '0.1.0' });
    expect(html).toMatch(/^<!doctype html>\n<html lang="en">/);
    expect(html).not.toMatch(/<script|javascript:|\son[a-z]+=/i);
    expect(html).not.toMatch(/\s(src|href)="(?!#)/);
    expect(html.match(/<style[\s>]/g)).toHaveLength(1);
    expect(html).not.toMatch(/\sstyle="/);
    // The only URL is the SVG namespace.
    expect(html.match(/https?:\/\/[^\s"']+/g)!.every((u) => u === 'http://www.w3.org/2000/svg')).toBe(true);
  });

  it('the policy allows the style sheet by its SHA-256 (node:crypto agrees with the Web Crypto hash) and nothing else', async () => {
    const html = await renderReportHtml(await loadExample('detached-house'), { generatedAt: AT });
    const policy = /<meta http-equiv="Content-Security-Policy" content="([^"]+)">/.exec(html)![1]!.replace(/&#39;/g, "'");
    const style = /<style>([\s\S]*?)<\/style>/.exec(html)![1]!;
    expect(style).toBe(REPORT_STYLE);
    const hash = createHash('sha256').update(style, 'utf8').digest('base64');
    expect(policy).toBe(`default-src 'none'; style-src 'sha256-${hash}'; img-src data:; base-uri 'none'; form-action 'none'`);
  });

  it('an editor passes its own policy and a nonce for the style element', async () => {
    const html = await renderReportHtml(await loadExample('detached-house'), { generatedAt: AT, contentSecurityPolicy: "default-src 'none'; style-src 'nonce-abc123'", styleNonce: 'abc123' });
    expect(html).toContain('<meta http-equiv="Content-Security-Policy" content="default-src &#39;none&#39;; style-src &#39;nonce-abc123&#39;">');
    expect(html).toContain('<style nonce="abc123">');
  });

  it('every section in order, the two figures inline, the tables filled', async () => {
    const input = await loadExample('harbour-offices');
    const html = await renderReportHtml(input, { generatedAt: AT, version: '0.1.0' });
    const ids = [...html.matchAll(/<section id="([a-z-]+)"/g)].map((m) => m[1]);
    expect(ids).toEqual(['summary', 'design-basis', 'producer', 'schematic', 'inlets', 'pipes', 'scenarios', 'findings', 'materials', 'commissioning']);
    expect(html.match(/<svg /g)).toHaveLength(2);
    expect(html.match(/<tr class="[^"]*" data-inlet="/g)).toHaveLength(input.model.inlets.length);
    expect(html.match(/<tr data-pipe="/g)).toHaveLength(input.model.pipes.length);
    // The test sheet: a row per inlet with two empty columns for the field.
    expect(html.match(/<td class="vn-field"><\/td><td class="vn-field"><\/td><\/tr>/g)).toHaveLength(input.model.inlets.length);
    expect(html).toContain('<time datetime="2025-05-01T10:00:00.000Z">2025-05-01 10:00 UTC</time>');
    expect(html).toContain('vacnet 0.1.0');
  });

  it('codes link to their rule page in the appendix when the page is given', async () => {
    const html = await renderReportHtml(await loadExample('harbour-offices'), {
      generatedAt: AT,
      rulePages: new Map([['slow-carrying-velocity', page('slow-carrying-velocity')], ['fast-velocity', page('fast-velocity')]]),
    });
    expect(html).toContain('<a href="#rule-slow-carrying-velocity"><code>slow-carrying-velocity</code></a>');
    expect(html).toContain('<article class="vn-rule-page" id="rule-slow-carrying-velocity">');
    expect(html).toContain('<article class="vn-rule-page" id="rule-fast-velocity">');
    const without = await renderReportHtml(await loadExample('harbour-offices'), { generatedAt: AT });
    expect(without).not.toContain('href="#rule-');
    expect(without).not.toContain('id="rules"');
  });

  it('the combustible dust caution is prominent: its own aside, before the summary', async () => {
    const html = await renderReportHtml(await loadExample('grinding-plant'), { generatedAt: AT });
    const caution = html.indexOf('<aside class="vn-caution vn-caution-dust" role="note"');
    expect(caution).toBeGreaterThan(0);
    expect(caution).toBeLessThan(html.indexOf('<section id="summary"'));
  });

  it('names from the file are escaped', async () => {
    const input = await loadExample('detached-house');
    const model = { ...input.model, name: 'House <b>"&</b>', inlets: input.model.inlets.map((i, k) => (k === 0 ? { ...i, label: '<img src=x>' } : i)) };
    const html = await renderReportHtml({ ...input, model }, { generatedAt: AT });
    expect(html).toContain('<h1>House &lt;b&gt;&quot;&amp;&lt;/b&gt;</h1>');
    expect(html).not.toContain('<img');
    expect(html).toContain('&lt;img src=x&gt;');
  });

  it('a file with an error: the findings with the error, a note instead of the analysis', async () => {
    const html = await renderReportHtml(await loadExample('unresolved-hose'), { generatedAt: AT });
    expect(html).toContain('<tr data-code="unresolved-reference"><td><span class="vn-severity vn-severity-error">error</span>');
    expect(html).toContain('The airflow analysis runs once the errors listed under Findings are fixed');
    expect(html.match(/<svg /g)).toHaveLength(1); // the schematic, without results
  });
});

describe('renderReportHtml on every file with structural errors', () => {
  // examples/invalid: one file per structural finding. Bad input never throws and never prints NaN.
  const folder = new URL('../../../../examples/invalid/', import.meta.url);
  const files = readdirSync(folder).filter((f) => f.endsWith('.vacnet')).sort();

  it('there are such files to try', () => {
    expect(files.length).toBeGreaterThan(10);
  });

  it.each(files)('%s: a report with its findings, no NaN, no undefined', async (name) => {
    const loaded = await loadDocuments([fileURLToPath(new URL(name, folder))], { analyse: true });
    const file = loaded.files[0]!;
    const html = await renderReportHtml(
      { path: `examples/invalid/${name}`, diagnostics: file.diagnostics, ...(file.model ? { model: file.model } : {}), ...(file.analysis ? { analysis: file.analysis } : {}) },
      { generatedAt: AT },
    );
    expect(html).toMatch(/<\/html>\n$/);
    expect(html).not.toMatch(/\bNaN\b|\bundefined\b|Infinity/);
    for (const d of file.diagnostics.filter((x) => x.severity === 'error')) expect(html).toContain(`data-code="${d.code}"`);
  });
});
