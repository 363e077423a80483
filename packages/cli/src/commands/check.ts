import { relative, resolve } from 'node:path';
import { loadDocuments } from '@vacnet/language';
import { bySourcePosition, summarise, type CheckedFile, type CheckResult } from '../check-result.js';
import { ExitCode, UsageError } from '../exit-codes.js';
import { expandPaths } from '../expand-paths.js';
import { formatJson } from '../formats/json.js';
import { formatText } from '../formats/text.js';
import type { CommandIo } from '../io.js';

/** The output formats of `vacnet check`. */
export const CHECK_FORMATS = ['text', 'json'] as const;
export type CheckFormat = (typeof CHECK_FORMATS)[number];

export interface CheckOptions {
  format: CheckFormat;
  /** Solve the airflow and apply the design rules (default true); false checks structure only. */
  analysis?: boolean;
}

/**
 * `vacnet check <paths...>`: loads every .vacnet file found (and the
 * catalogs they use) through the same headless loader as the editor, prints
 * the findings, and returns the exit code: 0 without errors, 1 with errors,
 * 2 when a path cannot be read.
 */
export async function runCheck(paths: readonly string[], options: CheckOptions, io: CommandIo): Promise<number> {
  let result: CheckResult;
  try {
    result = await check(paths, io.cwd, options.analysis !== false);
  } catch (error) {
    if (error instanceof UsageError) {
      io.stderr(`vacnet check: ${error.message}\n`);
      return ExitCode.usage;
    }
    // The loader turns bad file content into findings; what reaches here is an I/O failure.
    io.stderr(`vacnet check: ${error instanceof Error ? error.message : String(error)}\n`);
    return ExitCode.usage;
  }
  io.stdout(options.format === 'json' ? formatJson(result) : formatText(result));
  return result.summary.errors > 0 ? ExitCode.findings : ExitCode.ok;
}

/** Expands the paths, loads the files and gathers their findings. */
export async function check(paths: readonly string[], cwd: string, analyse = true): Promise<CheckResult> {
  const requested = await expandPaths(paths, cwd);
  if (requested.length === 0) {
    throw new UsageError(`no .vacnet files found in ${paths.join(', ')}`);
  }
  const loaded = await loadDocuments(requested, { analyse });
  const files: CheckedFile[] = [];
  const seen = new Set<string>();
  for (const file of loaded.files) {
    const absolute = resolve(cwd, file.path);
    if (seen.has(absolute)) continue;
    seen.add(absolute);
    files.push({
      path: displayPath(absolute, cwd),
      diagnostics: [...file.diagnostics].sort(bySourcePosition),
      ...(file.model ? { model: file.model } : {}),
      ...(file.analysis ? { analysis: file.analysis } : {}),
      ...(file.accepted && file.accepted.length > 0 ? { accepted: file.accepted } : {}),
    });
  }
  return { files, summary: summarise(files) };
}

/** Relative to the working folder (`../` when outside it), as people typed it. */
function displayPath(absolute: string, cwd: string): string {
  return relative(cwd, absolute) || absolute;
}
