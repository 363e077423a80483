import { describe, expect, it } from 'vitest';
import { renderReportMarkdown } from '../../src/report/report-api.js';
import { loadExample } from './example-reports.js';

// The Markdown report for pull requests (GitHub Flavored Markdown tables and
// alerts), with its figures as SVG files to write beside it.

const AT = new Date('2025-05-01T10:00:00Z');

describe('renderReportMarkdown', () => {
  it('with a figure stem: two standalone SVG figures, linked relative to the Markdown file', async () => {
    const { markdown, figures } = await renderReportMarkdown(await loadExample('harbour-offices'), { generatedAt: AT, version: '0.1.0', figureStem: 'plant report' });
    expect(figures.map((f) => f.fileName)).toEqual(['plant report.producer-curve.svg', 'plant report.schematic.svg']);
    expect(markdown).toContain('](plant%20report.producer-curve.svg)');
    expect(markdown).toContain('](plant%20report.schematic.svg)');
    for (const f of figures) {
      expect(f.svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
      expect(f.svg).toContain('<style>');
    }
  });

  it('without one: the figures are left out and the text says where they are', async () => {
    const { markdown, figures } = await renderReportMarkdown(await loadExample('harbour-offices'), { generatedAt: AT });
    expect(figures).toEqual([]);
    expect(markdown).not.toMatch(/!\[/);
    expect(markdown).toContain('_The plot is in the HTML report');
  });

  it('tables have a header, a rule and one row per inlet, each row with as many cells', async () => {
    const input = await loadExample('harbour-offices');
    const { markdown } = await renderReportMarkdown(input, { generatedAt: AT });
    const lines = markdown.split('\n');
    const start = lines.findIndex((l) => l.startsWith('| Inlet | Room |'));
    const header = lines[start]!;
    const cells = (l: string) => l.replace(/\\\|/g, '').split('|').length;
    expect(lines[start + 1]).toMatch(/^\|( -{3}:? \|| -{3} \|)+$/);
    const rows = lines.slice(start + 2, start + 2 + input.model.inlets.length);
    expect(rows.every((r) => r.startsWith('| ') && cells(r) === cells(header))).toBe(true);
    expect(lines[start + 2 + input.model.inlets.length]).toBe('');
  });

  it('cautions as GitHub alerts; the dust caution where the file declares combustible dust', async () => {
    const { markdown } = await renderReportMarkdown(await loadExample('grinding-plant'), { generatedAt: AT });
    expect(markdown).toContain('> [!CAUTION]');
    expect(markdown).toMatch(/> \[!WARNING\]\n> \*\*Combustible dust\.\*\*\n> This system is declared to handle combustible metal dust/);
    expect(markdown).toContain('NFPA 484');
  });

  it('rule codes link where the caller says the pages are, else stay plain code', async () => {
    const input = await loadExample('harbour-offices');
    const linked = await renderReportMarkdown(input, { generatedAt: AT, rulePageHref: (code) => `../docs/rules/${code}.md` });
    expect(linked.markdown).toContain('| [`slow-carrying-velocity`](../docs/rules/slow-carrying-velocity.md) | pipe main-1 |');
    const plain = await renderReportMarkdown(input, { generatedAt: AT });
    expect(plain.markdown).toContain('| `slow-carrying-velocity` | pipe main-1 |');
  });

  it('a pipe character in a name does not break a table', async () => {
    const input = await loadExample('detached-house');
    const model = { ...input.model, inlets: input.model.inlets.map((i, k) => (k === 0 ? { ...i, label: 'Garage | workshop' } : i)) };
    const { markdown } = await renderReportMarkdown({ ...input, model }, { generatedAt: AT });
    expect(markdown).toContain('Garage \\| workshop');
  });
});
