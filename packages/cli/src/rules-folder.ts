import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

// How many folders up from the running file to look for docs/rules (a bundle's chunks sit up to four below the repository root).
const SEARCH_DEPTH = 6;

/**
 * The docs/rules folder that ships with this vacnet: found by walking up
 * from the running file (a checkout, or a package that ships the docs).
 * Undefined when there is none. The SARIF help texts and the report's rule
 * pages both read it.
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
