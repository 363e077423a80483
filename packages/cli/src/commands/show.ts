import { readFile } from 'node:fs/promises';
import { basename, dirname, isAbsolute, relative, resolve } from 'node:path';
import { diskAccess } from '@vacnet/language';
import { formatResultsComments } from '../compare/format-results-comments.js';
import { git, repositoryRoot } from '../compare/git.js';
import { loadSide } from '../compare/load-side.js';
import { ExitCode } from '../exit-codes.js';
import type { CommandIo } from '../io.js';

/**
 * How git names the copies it hands a text conversion (diff.c,
 * prep_temp_blob): `<tmp>/git-blob-XXXXXX/<name>` since git 2.29, and
 * `<tmp>/XXXXXX_<name>` before.
 */
const GIT_TEMPORARY_FOLDER = /^git-blob-[A-Za-z0-9]{6}$/;
const GIT_TEMPORARY_NAME = /^[A-Za-z0-9]{6}_(.+\.vacnet)$/;

/**
 * `vacnet show <file>`: the file's text followed by its computed results as
 * comments. Made for git's text conversion (`git config diff.vacnet.textconv
 * "vacnet show"`), so `git diff` shows how the results moved beside the
 * lines that moved them. git hands over older versions as temporary copies
 * outside the repository; such a copy is analysed as if it stood where the
 * one tracked file of that name stands, so the catalogs it uses resolve
 * (at their working-tree version: git does not say which revision the copy
 * is from). Never fails for a bad file: the text is
 * printed with the findings. Exit 2 only when the file cannot be read.
 */
export async function runShow(file: string, io: CommandIo): Promise<number> {
  const path = resolve(io.cwd, file);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    io.stderr(`vacnet show: ${file}: cannot be read (${(error as { code?: string }).code === 'ENOENT' ? 'no such file' : error instanceof Error ? error.message : String(error)})\n`);
    return ExitCode.usage;
  }
  let standIn: string | undefined;
  try {
    standIn = await trackedPlaceOf(path, io.cwd);
  } catch {
    // No git, or no repository: analyse the file where it is.
  }
  let output: string;
  try {
    const side = await loadSide({ label: file, path: standIn ?? path, files: diskAccess, text });
    output = formatResultsComments(text, side);
  } catch (error) {
    output = `${text}${text.endsWith('\n') ? '' : '\n'}// vacnet: the results could not be computed (${error instanceof Error ? error.message : String(error)})\n`;
  }
  io.stdout(output);
  return ExitCode.ok;
}

/**
 * Where a temporary copy from git belongs: the one tracked .vacnet file of
 * the same name in the repository of the working folder. Undefined for a
 * file inside that repository, or when the name is not unique.
 */
async function trackedPlaceOf(path: string, cwd: string): Promise<string | undefined> {
  const root = await repositoryRoot(cwd);
  if (!root) return undefined;
  const rel = relative(root, path);
  if (!rel.startsWith('..') && !isAbsolute(rel)) return undefined;
  const name = GIT_TEMPORARY_FOLDER.test(basename(dirname(path))) ? basename(path) : GIT_TEMPORARY_NAME.exec(basename(path))?.[1];
  if (!name) return undefined;
  const listed = await git(['ls-files', '-z', '--', `:(glob)**/${name}`], root);
  if (listed.code !== 0) return undefined;
  const matches = listed.stdout.split('\u0000').filter(Boolean);
  return matches.length === 1 ? resolve(root, matches[0]!) : undefined;
}
