import { readdir, stat } from 'node:fs/promises';
import { join, relative, resolve } from 'node:path';
import { UsageError } from './exit-codes.js';
import { globBase, globToRegExp, hasGlob, toSlashes } from './glob-match.js';

/** The extension of vacnet files. */
export const VACNET_EXTENSION = '.vacnet';

/**
 * Turns the paths given on the command line into the .vacnet files to check:
 * a file is taken as given; a folder is searched recursively, skipping
 * `node_modules` and folders whose name starts with a dot, and its files are
 * sorted so output is the same on every machine; a glob (with `*`, `**`,
 * `?`, `[...]` or `{a,b}`, quoted so the shell leaves it alone) gives the
 * .vacnet files it matches, sorted. Order follows the arguments; a file
 * named twice is checked once. Returns absolute paths.
 *
 * Throws UsageError for a path that does not exist, a file that is not a
 * .vacnet file, or a glob that matches no .vacnet file.
 */
export async function expandPaths(args: readonly string[], cwd: string): Promise<string[]> {
  const seen = new Set<string>();
  const files: string[] = [];
  for (const arg of args) {
    const absolute = resolve(cwd, arg);
    const found = hasGlob(arg) && !(await exists(absolute)) ? await globFiles(arg, cwd) : await filesUnder(arg, absolute);
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

async function exists(path: string): Promise<boolean> {
  try {
    await stat(path);
    return true;
  } catch {
    return false;
  }
}

/** The .vacnet files a glob matches, searched from the folder its plain leading segments name. */
async function globFiles(pattern: string, cwd: string): Promise<string[]> {
  const plain = globBase(pattern);
  const base = resolve(cwd, plain);
  // Match below the plain folder only, so glob characters in the folder's own name do not count.
  const rest = plain === '.' ? toSlashes(pattern).replace(/^(\.\/)+/, '') : toSlashes(pattern).slice(plain.length).replace(/^\/+/, '');
  const matcher = globToRegExp(rest);
  const candidates: string[] = [];
  try {
    if ((await stat(base)).isDirectory()) await walk(base, candidates);
  } catch {
    // A base folder that does not exist matches nothing; said below.
  }
  const found = candidates.filter((file) => matcher.test(toSlashes(relative(base, file)))).sort(byCodeUnits);
  if (found.length === 0) throw new UsageError(`${pattern}: no ${VACNET_EXTENSION} files match`);
  return found;
}

/** A path as the user would write it from the working folder (for messages). */
export function shownPath(absolute: string, cwd: string): string {
  return relative(cwd, absolute) || absolute;
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
