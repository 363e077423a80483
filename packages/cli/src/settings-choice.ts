import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import type { LoadOptions } from '@vacnet/language';
import { UsageError } from './exit-codes.js';

/**
 * The project settings a command applies, from its `--settings <file>` /
 * `--no-settings` options: by default the vacnet.json found above each file
 * (as the editor finds it), a named file read once, or none.
 */
export async function settingsChoice(choice: string | boolean | undefined, cwd: string): Promise<LoadOptions['settings']> {
  if (choice === false) return undefined;
  if (choice === undefined || choice === true) return 'discover';
  const path = resolve(cwd, choice);
  try {
    return { path, text: await readFile(path, 'utf8') };
  } catch (error) {
    const code = (error as { code?: string }).code;
    throw new UsageError(`${choice}: ${code === 'ENOENT' ? 'no such settings file' : `cannot be read (${error instanceof Error ? error.message : String(error)})`}`);
  }
}
