import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { RULES } from '@vacnet/engine';
import { findRulesFolder } from './rules-folder.js';

/** A finding code's page in docs/rules, as help text for tools that show it beside the finding. */
export interface RuleDoc {
  code: string;
  /** The page's bold title line, one sentence. */
  title: string;
  /** The first paragraph under "What it checks", plain text. */
  summary: string;
  /** The whole page as Markdown. */
  markdown: string;
  /** The page as plain text (Markdown marks removed). */
  text: string;
}

/**
 * The rule pages, read at run time from the docs/rules folder found above
 * the installed command line (a checkout, or a package that ships the
 * docs). A code without a page (or no docs folder at all) still gets a
 * title: the engine's own for a design rule, else the code itself.
 */
export class RuleDocs {
  private readonly pages = new Map<string, RuleDoc>();

  constructor(readonly folder: string | undefined = findRulesFolder()) {}

  get(code: string): RuleDoc {
    let doc = this.pages.get(code);
    if (!doc) {
      doc = this.read(code);
      this.pages.set(code, doc);
    }
    return doc;
  }

  private read(code: string): RuleDoc {
    const page = this.folder && /^[a-z][a-z0-9-]*$/.test(code) ? readPage(join(this.folder, `${code}.md`)) : undefined;
    if (page) return parsePage(code, page);
    const title = RULES.find((r) => r.code === code)?.title ?? code;
    return { code, title, summary: title, markdown: `# ${code}\n\n**${title}**\n`, text: title };
  }
}

function readPage(path: string): string | undefined {
  try {
    return readFileSync(path, 'utf8');
  } catch {
    return undefined;
  }
}

/** Title, summary and plain text of one page (pages follow docs/rules' layout: `# code`, `**Title**`, `## What it checks`, ...). */
export function parsePage(code: string, markdown: string): RuleDoc {
  const normalised = markdown.replace(/\r\n?/g, '\n');
  const title = /^\*\*(.+?)\*\*\s*$/m.exec(normalised)?.[1]?.trim() ?? code;
  // The first paragraph of "What it checks": up to the next blank line or heading.
  const section = normalised.split(/^## What it checks[ \t]*\n/m)[1];
  const checks = section?.replace(/^\n+/, '').split(/\n\s*\n|\n#/)[0];
  const summary = checks ? plainText(checks).replace(/\s+/g, ' ').trim() : title;
  return { code, title, summary, markdown: normalised, text: plainText(normalised) };
}

/** Markdown to readable plain text: headings, emphasis, code marks and link targets dropped; code blocks kept. */
function plainText(markdown: string): string {
  return markdown
    .replace(/^#+\s*/gm, '')
    .replace(/\*\*(.+?)\*\*/g, '$1')
    .replace(/\[([^\]]+)\]\([^)]+\)/g, '$1')
    .replace(/`([^`\n]+)`/g, '$1')
    .replace(/^```\w*$/gm, '')
    .trim();
}
