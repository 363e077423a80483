import { readdir, stat } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { UsageError } from './exit-codes.js';

/** The extension of vacnet files. */
export const VACNET_EXTENSION = '.vacnet';

/**
 * Turns the paths given on the command line into the .vacnet files to check:
 * a file is taken as given; a folder is searched recursively, skipping
 * `node_modules` and folders whose name starts with a dot, and its files are
 * sorted so output is the same on every machine. Order follows the
 * arguments; a file named twice is checked once. Returns absolute paths.
 *
 * Throws UsageError for a path that does not exist or a file that is not a
 * .vacnet file.
 */
export async function expandPaths(args: readonly string[], cwd: string): Promise<string[]> {
  const seen = new Set<string>();
  const files: string[] = [];
  for (const arg of args) {
    const absolute = resolve(cwd, arg);
    const found = await filesUnder(arg, absolute);
    for (const file of found) {
      if (!seen.has(file)) {
        seen.add(file);
        files.push(file);
      }
    }
  }
  return files;
}

async function filesUnder(arg: string, absolute: string): Promise<string[]> {
  let info;
  try {
    info = await stat(absolute);
  } catch (error) {
    throw new UsageError(describeFsError(arg, error));
  }
  if (info.isDirectory()) {
    const found: string[] = [];
    await walk(absolute, found);
    return found.sort(byCodeUnits);
  }
  if (!info.isFile()) {
    throw new UsageError(`${arg}: not a file or folder`);
  }
  if (!absolute.endsWith(VACNET_EXTENSION)) {
    throw new UsageError(`${arg}: not a ${VACNET_EXTENSION} file`);
  }
  return [absolute];
}

async function walk(folder: string, found: string[]): Promise<void> {
  let entries;
  try {
    entries = await readdir(folder, { withFileTypes: true });
  } catch (error) {
    throw new UsageError(describeFsError(folder, error));
  }
  for (const entry of entries) {
    const full = join(folder, entry.name);
    // Symbolic links to folders are not followed: they can form cycles.
    if (entry.isDirectory()) {
      if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
      await walk(full, found);
    } else if ((entry.isFile() || entry.isSymbolicLink()) && entry.name.endsWith(VACNET_EXTENSION)) {
      found.push(full);
    }
  }
}

/** Plain code-unit order: the same on every machine, whatever its locale. */
function byCodeUnits(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

function describeFsError(path: string, error: unknown): string {
  const code = (error as { code?: unknown } | null)?.code;
  if (code === 'ENOENT') return `${path}: no such file or folder`;
  if (code === 'EACCES' || code === 'EPERM') return `${path}: permission denied`;
  return `${path}: cannot be read (${error instanceof Error ? error.message : String(error)})`;
}
