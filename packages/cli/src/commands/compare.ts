import { compareSides } from '../compare/comparison.js';
import { formatCompareJson } from '../compare/format-compare-json.js';
import { formatCompareMarkdown } from '../compare/format-compare-markdown.js';
import { formatCompareText } from '../compare/format-compare-text.js';
import { loadSide, resolveSide } from '../compare/load-side.js';
import { ExitCode, UsageError } from '../exit-codes.js';
import type { CommandIo } from '../io.js';

export const COMPARE_FORMATS = ['text', 'markdown', 'json'] as const;
export type CompareFormat = (typeof COMPARE_FORMATS)[number];

export interface CompareOptions {
  format: CompareFormat;
  /** Exit 1 when an inlet falls newly short of its need or a new error appears. */
  failOnRegression?: boolean;
  /** Use each side's project settings file (default true). */
  settings?: boolean;
}

/**
 * `vacnet compare <old> <new>`: each side a path or `<rev>:<path>`; loads
 * both with the airflow analysis and prints what changed element by element
 * and how the results moved. Exit 0, or 1 with --fail-on-regression when
 * there is a regression; 2 for usage and I/O errors.
 */
export async function runCompare(oldSpec: string, newSpec: string, options: CompareOptions, io: CommandIo): Promise<number> {
  try {
    const oldSource = await resolveSide(oldSpec, io.cwd);
    const newSource = await resolveSide(newSpec, io.cwd);
    const settings = { useSettings: options.settings !== false };
    // One side after the other: the loader serves one set of files at a time.
    const before = await loadSide(oldSource, settings);
    const after = await loadSide(newSource, settings);
    if (!before.exists && !after.exists) throw new UsageError(`neither ${oldSpec} nor ${newSpec} exists`);
    const comparison = compareSides(before, after);
    io.stdout(options.format === 'json' ? formatCompareJson(comparison) : options.format === 'markdown' ? formatCompareMarkdown(comparison) : formatCompareText(comparison));
    return options.failOnRegression && comparison.regressions.length > 0 ? ExitCode.findings : ExitCode.ok;
  } catch (error) {
    io.stderr(`vacnet compare: ${error instanceof Error ? error.message : String(error)}\n`);
    return ExitCode.usage;
  }
}
