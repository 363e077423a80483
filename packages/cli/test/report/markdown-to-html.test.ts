import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { markdownToHtml } from '../../src/report/markdown-to-html.js';

// The rule pages' Markdown (CommonMark constructs: ATX headings, pipe tables
// as GitHub writes them, fenced code, emphasis, links) as escaped HTML.

describe('markdownToHtml', () => {
  it('headings move down under the report, paragraphs join their lines', () => {
    expect(markdownToHtml('# code\n\nOne line\nand the next.', { headingShift: 2 })).toBe('<h3>code</h3>\n<p>One line and the next.</p>');
  });

  it('a pipe table becomes a table with a header row', () => {
    const html = markdownToHtml('| setting | default |\n|---|---|\n| `min-velocity` | 2500 fpm |');
    expect(html).toContain('<thead><tr><th>setting</th><th>default</th></tr></thead>');
    expect(html).toContain('<td><code>min-velocity</code></td><td>2500 fpm</td>');
  });

  it('fenced code keeps its text literally, escaped', () => {
    expect(markdownToHtml('```\nrule x <y> & "z"\n```')).toBe('<pre><code>rule x &lt;y&gt; &amp; &quot;z&quot;</code></pre>');
  });

  it('markup in the text is escaped, never passed through', () => {
    const html = markdownToHtml('Say <script>alert(1)</script> and <img src=x onerror=y>.');
    expect(html).not.toMatch(/<script|<img/);
    expect(html).toContain('&lt;script&gt;');
  });

  it('bold, emphasis, lists; links to other rule pages only where the report has them', () => {
    const html = markdownToHtml('- **Bold** and *em*\n- see [the other](unused-accept.md) and [ours](fast-velocity.md)', {
      linkRulePage: (code) => (code === 'fast-velocity' ? '#rule-fast-velocity' : null),
    });
    expect(html).toBe('<ul><li><strong>Bold</strong> and <em>em</em></li><li>see the other and <a href="#rule-fast-velocity">ours</a></li></ul>');
  });

  it('every published rule page converts with its title and every fenced block closed', () => {
    const page = readFileSync(new URL('../../../../docs/rules/slow-carrying-velocity.md', import.meta.url), 'utf8');
    const html = markdownToHtml(page);
    expect(html).toMatch(/^<h3>slow-carrying-velocity<\/h3>/);
    expect(html.match(/<pre>/g)?.length).toBe(page.match(/^```/gm)!.length / 2);
    expect(html).toContain('<strong>Carrying velocity too low with one operator</strong>');
  });
});
