import { existsSync } from 'node:fs';
import * as path from 'node:path';
import { URI } from 'langium';

/** How many folders up from the server's own file to look for docs/rules (server.cjs sits three below the repository root). */
const SEARCH_DEPTH = 6;

/**
 * Where a rule code's page is: `<base>/<code>.md`. The base is the
 * `vacnet.rulesDocsBaseUrl` setting when set, else the `docs/rules` folder
 * found above the server's install location (a checkout, or a package that
 * ships the docs), as a `file:` URI. Without either there is no link.
 */
export class RuleLinks {
  private readonly localBase: string | undefined;
  private readonly pages = new Map<string, string | undefined>();

  /** `installDir`: the folder of the running server's entry file. */
  constructor(installDir: string | undefined) {
    this.localBase = installDir ? findDocsFolder(installDir) : undefined;
  }

  /** The page of a code, or undefined when no base is known or the code is not a plain code. */
  href(code: string | number | undefined, configuredBase?: string): string | undefined {
    if (typeof code !== 'string' || !/^[a-z][a-z0-9-]*$/.test(code)) return undefined;
    if (configuredBase) return `${configuredBase}/${code}.md`;
    if (!this.localBase) return undefined;
    if (!this.pages.has(code)) {
      const page = path.join(this.localBase, `${code}.md`);
      this.pages.set(code, existsSync(page) ? URI.file(page).toString() : undefined);
    }
    return this.pages.get(code);
  }

  /** The docs/rules folder found from the install location, if any. */
  get folder(): string | undefined {
    return this.localBase;
  }
}

function findDocsFolder(start: string): string | undefined {
  let dir = path.resolve(start);
  for (let i = 0; i <= SEARCH_DEPTH; i++) {
    const candidate = path.join(dir, 'docs', 'rules');
    if (existsSync(candidate)) return candidate;
    const parent = path.dirname(dir);
    if (parent === dir) break;
    dir = parent;
  }
  return undefined;
}
