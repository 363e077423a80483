import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

// How many folders up from the running file to look for docs/rules (the bundle's chunks sit four below the repository root).
const SEARCH_DEPTH = 6;
const CODE = /^[a-z][a-z0-9-]*$/;

/**
 * The docs/rules folder that ships with this vacnet: found by walking up
 * from the running file (a checkout, or a package that ships the docs).
 * Undefined when there is none.
 */
export function findRulesFolder(from: string = fileURLToPath(import.meta.url)): string | undefined {
  let dir = resolve(dirname(from));
  for (let i = 0; i <= SEARCH_DEPTH; i++) {
    const candidate = join(dir, 'docs', 'rules');
    if (existsSync(candidate)) return candidate;
    const parent = dirname(dir);
    if (parent === dir) break;
    dir = parent;
  }
  return undefined;
}

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
