import { readFile } from 'node:fs/promises';
import { formatText, syntaxErrorsOf } from '@vacnet/language';
import { writeFileAtomic } from '../atomic-write.js';
import { ExitCode, UsageError } from '../exit-codes.js';
import { expandPaths, shownPath } from '../expand-paths.js';
import { oneLine } from '../formats/text.js';
import type { CommandIo } from '../io.js';
import { unifiedDiff } from '../line-diff.js';

/** What `vacnet fmt` does with the formatted text. */
export type FmtMode = 'print' | 'check' | 'write';

/**
 * `vacnet fmt [--check | --write] <paths...>`: the editor's formatter on
 * files. `print` writes the formatted text to stdout; `check` prints a
 * unified diff for each file that would change and fails (exit 1) if any
 * would; `write` replaces each file that changes, atomically. A file with
 * syntax errors is never formatted or touched: its errors go to stderr and
 * the exit code is 1. Exit 2 for usage and I/O errors (the other files are
 * still done).
 */
export async function runFmt(paths: readonly string[], mode: FmtMode, io: CommandIo): Promise<number> {
  let files: string[];
  try {
    files = await expandPaths(paths, io.cwd);
    if (files.length === 0) throw new UsageError(`no .vacnet files found in ${paths.join(', ')}`);
  } catch (error) {
    io.stderr(`vacnet fmt: ${error instanceof Error ? error.message : String(error)}\n`);
    return ExitCode.usage;
  }

  let ioFailed = false;
  let broken = 0;
  let changed = 0;
  for (const file of files) {
    const shown = shownPath(file, io.cwd);
    let text: string;
    try {
      text = await readFile(file, 'utf8');
    } catch (error) {
      io.stderr(`vacnet fmt: ${shown}: cannot be read (${describe(error)})\n`);
      ioFailed = true;
      continue;
    }
    const errors = await syntaxErrorsOf(text);
    if (errors.length > 0) {
      for (const d of errors) io.stderr(`${shown}:${d.range.start.line + 1}:${d.range.start.character + 1} ${d.severity} ${d.code} ${oneLine(d.message)}\n`);
      io.stderr(`vacnet fmt: ${shown}: not formatted: fix its syntax errors first\n`);
      broken++;
      continue;
    }
    const formatted = formatText(text);
    if (mode === 'print') {
      io.stdout(formatted);
      continue;
    }
    if (formatted === text) continue;
    changed++;
    if (mode === 'check') {
      const name = shown.replace(/\\/g, '/');
      io.stdout(unifiedDiff(text, formatted, `a/${name}`, `b/${name}`));
      continue;
    }
    try {
      await writeFileAtomic(file, formatted);
    } catch (error) {
      io.stderr(`vacnet fmt: ${shown}: cannot be written (${describe(error)})\n`);
      ioFailed = true;
      changed--;
    }
  }

  const count = (n: number) => `${n} file${n === 1 ? '' : 's'}`;
  if (mode === 'check') io.stderr(changed === 0 ? `${count(files.length - broken)} already formatted.\n` : `${changed} of ${count(files.length)} would be reformatted.\n`);
  if (mode === 'write') io.stderr(`Formatted ${changed} of ${count(files.length)}.\n`);
  if (ioFailed) return ExitCode.usage;
  if (broken > 0 || (mode === 'check' && changed > 0)) return ExitCode.findings;
  return ExitCode.ok;
}

function describe(error: unknown): string {
  const code = (error as { code?: string }).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  return error instanceof Error ? error.message : String(error);
}
