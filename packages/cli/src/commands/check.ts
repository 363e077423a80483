import { relative, resolve } from 'node:path';
import { loadDocuments, locateElement, type LoadOptions } from '@vacnet/language';
import { bySourcePosition, errorsOnly, hasUnreadableFile, summarise, type CheckedFile, type CheckResult } from '../check-result.js';
import { ExitCode, UsageError } from '../exit-codes.js';
import { expandPaths } from '../expand-paths.js';
import { formatGithub } from '../formats/github.js';
import { formatJson } from '../formats/json.js';
import { formatSarif } from '../formats/sarif.js';
import { formatText } from '../formats/text.js';
import type { CommandIo } from '../io.js';
import { progressLine } from '../progress-line.js';
import { settingsChoice } from '../settings-choice.js';
import { RuleDocs } from '../rule-docs.js';
import { colourWanted, palette } from '../terminal-colour.js';

/** The output formats of `vacnet check`. */
export const CHECK_FORMATS = ['text', 'json', 'sarif', 'github'] as const;
export type CheckFormat = (typeof CHECK_FORMATS)[number];

export interface CheckOptions {
  format: CheckFormat;
  /** Solve the airflow and apply the design rules (default true); false checks structure only. */
  analysis?: boolean;
  /** Fail (exit 1) when there are more warnings than this. */
  maxWarnings?: number;
  /** Print errors only (the exit code still counts everything). */
  quiet?: boolean;
  /** Project settings: discover vacnet.json (default), use this file, or none (false). */
  settings?: string | boolean;
  /** The version printed in SARIF's tool.driver. */
  version?: string;
}

/**
 * `vacnet check <paths...>`: loads every .vacnet file found (and the
 * catalogs they use) through the same headless loader as the editor, with
 * the project settings each file falls under, prints the findings, and
 * returns the exit code: 2 when a path or file cannot be read (the other
 * files are still checked and printed), else 1 with errors or more
 * warnings than --max-warnings, else 0.
 */
export async function runCheck(paths: readonly string[], options: CheckOptions, io: CommandIo): Promise<number> {
  let result: CheckResult;
  try {
    const settings = await settingsChoice(options.settings, io.cwd);
    const progress = (total: number) => progressLine(io.stderr, io.tty?.stderr === true, total);
    result = await check(paths, io.cwd, options.analysis !== false, { settings, progress });
  } catch (error) {
    if (error instanceof UsageError) {
      io.stderr(`vacnet check: ${error.message}\n`);
      return ExitCode.usage;
    }
    // The loader turns bad file content into findings; what reaches here is an I/O failure.
    io.stderr(`vacnet check: ${error instanceof Error ? error.message : String(error)}\n`);
    return ExitCode.usage;
  }
  const shown = options.quiet ? errorsOnly(result) : result;
  const unreadable = hasUnreadableFile(result);
  switch (options.format) {
    case 'json':
      io.stdout(formatJson(shown));
      break;
    case 'sarif':
      io.stdout(formatSarif(shown, { version: options.version ?? 'unknown', docs: new RuleDocs(), executionSuccessful: !unreadable }));
      break;
    case 'github':
      io.stdout(formatGithub(shown));
      break;
    default:
      io.stdout(formatText(shown, { palette: palette(colourWanted(io.env ?? process.env, io.tty?.stdout === true)), findingsOnly: options.quiet === true }));
  }
  return checkExitCode(result, options.maxWarnings, unreadable);
}

/** 2 when a file could not be read, 1 for errors or too many warnings, else 0. */
export function checkExitCode(result: CheckResult, maxWarnings: number | undefined, unreadable = hasUnreadableFile(result)): number {
  if (unreadable) return ExitCode.usage;
  if (result.summary.errors > 0) return ExitCode.findings;
  if (maxWarnings !== undefined && result.summary.warnings > maxWarnings) return ExitCode.findings;
  return ExitCode.ok;
}

export interface CheckRunOptions {
  settings?: LoadOptions['settings'];
  /** A progress line for this many requested files. */
  progress?: (total: number) => { update(done: number, total: number): void; clear(): void };
  /** Read files through this instead of the disk (a git revision). */
  files?: LoadOptions['files'];
}

/** Expands the paths, loads the files and gathers their findings. */
export async function check(paths: readonly string[], cwd: string, analyse = true, run: CheckRunOptions = {}): Promise<CheckResult> {
  const requested = await expandPaths(paths, cwd);
  if (requested.length === 0) {
    throw new UsageError(`no .vacnet files found in ${paths.join(', ')}`);
  }
  return checkFiles(requested, cwd, analyse, run);
}

/** Loads files already expanded (absolute paths) and gathers their findings. */
export async function checkFiles(requested: readonly string[], cwd: string, analyse = true, run: CheckRunOptions = {}): Promise<CheckResult> {
  const progress = run.progress?.(requested.length);
  progress?.update(0, requested.length);
  let loaded;
  try {
    loaded = await loadDocuments([...requested], {
      analyse,
      ...(run.settings ? { settings: run.settings } : {}),
      ...(run.files ? { files: run.files } : {}),
      ...(progress ? { onProgress: (done, total) => progress.update(done, total) } : {}),
    });
  } finally {
    progress?.clear();
  }
  const files: CheckedFile[] = [];
  const seen = new Set<string>();
  for (const file of loaded.files) {
    const absolute = resolve(cwd, file.path);
    if (seen.has(absolute)) continue;
    seen.add(absolute);
    const sources = file.lowered?.sources;
    files.push({
      path: displayPath(absolute, cwd),
      diagnostics: [...file.diagnostics].sort(bySourcePosition),
      ...(file.model ? { model: file.model } : {}),
      ...(file.analysis ? { analysis: file.analysis } : {}),
      ...(file.accepted && file.accepted.length > 0
        ? { accepted: file.accepted.map((a) => ({ ...a, ...(sources ? withRange(locateElement(sources, a.finding.element)) : {}) })) }
        : {}),
      ...(file.settingsPath ? { settingsPath: displayPath(file.settingsPath, cwd) } : {}),
    });
  }
  // A settings file is listed with its own problems, after the files it governs.
  for (const settings of loaded.settingsFiles) {
    if (settings.diagnostics.length === 0) continue;
    files.push({ path: displayPath(settings.path, cwd), diagnostics: [...settings.diagnostics].sort(bySourcePosition), settingsFile: true });
  }
  return { files, summary: summarise(files), cwd };
}

function withRange(range: ReturnType<typeof locateElement>) {
  return range ? { range } : {};
}

/** Relative to the working folder (`../` when outside it), as people typed it. */
function displayPath(absolute: string, cwd: string): string {
  return relative(cwd, absolute) || absolute;
}
