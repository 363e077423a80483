import { readFileSync } from 'node:fs';
import { join } from 'node:path';

const CODE = /^[a-z][a-z0-9-]*$/;

/** The Markdown text of each code's page that exists in the folder; codes that are not plain codes are skipped. */
export function readRulePages(folder: string | undefined, codes: Iterable<string>): Map<string, string> {
  const pages = new Map<string, string>();
  if (!folder) return pages;
  for (const code of codes) {
    if (pages.has(code) || !CODE.test(code)) continue;
    try {
      pages.set(code, readFileSync(join(folder, `${code}.md`), 'utf8'));
    } catch {
      // No page for this code: the report lists the code with its title only.
    }
  }
  return pages;
}
