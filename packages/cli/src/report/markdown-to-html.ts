import { escapeHtml } from './html-escape.js';

/**
 * The small part of Markdown our rule pages use, as HTML for the report's
 * appendix: headings, paragraphs, lists, tables, fenced code, and inline
 * code, bold, italics and links. Everything is escaped first; only these
 * constructs make tags, so a page cannot inject markup. Headings move down
 * `headingShift` levels to sit under the report's own.
 */
export function markdownToHtml(markdown: string, options: { headingShift?: number; linkRulePage?: (code: string) => string | null } = {}): string {
  const shift = options.headingShift ?? 2;
  const lines = markdown.replace(/\r\n?/g, '\n').split('\n');
  const out: string[] = [];
  let i = 0;
  const inline = (text: string) => inlineHtml(text, options.linkRulePage);
  while (i < lines.length) {
    const line = lines[i]!;
    if (/^\s*$/.test(line)) {
      i++;
      continue;
    }
    const fence = /^```/.exec(line);
    if (fence) {
      const body: string[] = [];
      i++;
      while (i < lines.length && !/^```/.test(lines[i]!)) body.push(lines[i++]!);
      i++;
      out.push(`<pre><code>${escapeHtml(body.join('\n'))}</code></pre>`);
      continue;
    }
    const heading = /^(#{1,6})\s+(.*)$/.exec(line);
    if (heading) {
      const level = Math.min(6, heading[1]!.length + shift);
      out.push(`<h${level}>${inline(heading[2]!.trim())}</h${level}>`);
      i++;
      continue;
    }
    if (/^\s*\|/.test(line) && i + 1 < lines.length && /^\s*\|?\s*:?-{2,}/.test(lines[i + 1]!)) {
      const header = cells(line);
      i += 2;
      const rows: string[][] = [];
      while (i < lines.length && /^\s*\|/.test(lines[i]!)) rows.push(cells(lines[i++]!));
      out.push(
        `<div class="vn-table-wrap"><table><thead><tr>${header.map((c) => `<th>${inline(c)}</th>`).join('')}</tr></thead><tbody>` +
          rows.map((r) => `<tr>${r.map((c) => `<td>${inline(c)}</td>`).join('')}</tr>`).join('') +
          '</tbody></table></div>',
      );
      continue;
    }
    if (/^\s*([-*]|\d+\.)\s+/.test(line)) {
      const ordered = /^\s*\d+\./.test(line);
      const items: string[] = [];
      while (i < lines.length && /^\s*([-*]|\d+\.)\s+/.test(lines[i]!)) {
        let item = lines[i++]!.replace(/^\s*([-*]|\d+\.)\s+/, '');
        while (i < lines.length && /^\s{2,}\S/.test(lines[i]!) && !/^\s*([-*]|\d+\.)\s+/.test(lines[i]!)) item += ` ${lines[i++]!.trim()}`;
        items.push(`<li>${inline(item)}</li>`);
      }
      out.push(ordered ? `<ol>${items.join('')}</ol>` : `<ul>${items.join('')}</ul>`);
      continue;
    }
    const paragraph: string[] = [];
    while (i < lines.length && !/^\s*$/.test(lines[i]!) && !/^(#{1,6}\s|```|\s*\||\s*([-*]|\d+\.)\s+)/.test(lines[i]!)) paragraph.push(lines[i++]!.trim());
    if (paragraph.length === 0) paragraph.push(lines[i++]!.trim());
    out.push(`<p>${inline(paragraph.join(' '))}</p>`);
  }
  return out.join('\n');
}

function cells(line: string): string[] {
  return line
    .trim()
    .replace(/^\|/, '')
    .replace(/\|$/, '')
    .split('|')
    .map((c) => c.trim());
}

/** Inline code first (its content stays literal), then bold, italics and links in the rest. */
function inlineHtml(text: string, linkRulePage?: (code: string) => string | null): string {
  return text
    .split(/(`[^`]*`)/)
    .map((part) => {
      if (/^`[^`]*`$/.test(part)) return `<code>${escapeHtml(part.slice(1, -1))}</code>`;
      let html = escapeHtml(part);
      html = html.replace(/\*\*(.+?)\*\*/g, '<strong>$1</strong>');
      html = html.replace(/(^|[\s(])[*_]([^*_\s][^*_]*?)[*_](?=[\s).,;:]|$)/g, '$1<em>$2</em>');
      html = html.replace(/\[([^\]]+)\]\(([^)\s]+)\)/g, (_m, label: string, target: string) => {
        const rule = /^(?:\.\/)?([a-z][a-z0-9-]*)\.md$/.exec(target);
        if (rule) {
          const href = linkRulePage?.(rule[1]!);
          return href ? `<a href="${href}">${label}</a>` : label;
        }
        return /^https?:\/\//.test(target) ? `<a href="${target}">${label}</a>` : label;
      });
      return html;
    })
    .join('');
}
