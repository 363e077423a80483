import { writeFileSync } from 'node:fs';
import { basename, dirname, extname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import { loadDocuments } from '@vacnet/language';
import { ExitCode } from '../exit-codes.js';
import { settingsChoice } from '../settings-choice.js';
import type { CommandIo } from '../io.js';
import { renderReportHtml, renderReportMarkdown } from '../report/report-api.js';
import type { ReportInput } from '../report/report-model.js';
import { readRulePages } from '../report/rule-pages.js';
import { findRulesFolder } from '../rules-folder.js';

/** The formats of `vacnet report`. */
export const REPORT_FORMATS = ['html', 'markdown'] as const;
export type ReportFormat = (typeof REPORT_FORMATS)[number];

export interface ReportOptions {
  /** Where to write the report; without it the report goes to stdout. */
  out?: string;
  /** The format; without it, from the extension of `out` (.html, .htm, .md, .markdown), else HTML. */
  format?: ReportFormat;
  /** The vacnet version to print in the report. */
  version?: string;
  /** When the report is made (default: SOURCE_DATE_EPOCH when set, else now). */
  now?: Date;
  /** Project settings: discover vacnet.json above the file (default), use this file, or none (false); as `vacnet check`. */
  settings?: string | boolean;
}

const FORMAT_BY_EXTENSION: Readonly<Record<string, ReportFormat>> = { '.html': 'html', '.htm': 'html', '.md': 'markdown', '.markdown': 'markdown' };

/**
 * `vacnet report <file> [--out report.html|report.md]`: analyses one file
 * and writes its design report. HTML is one self-contained page; Markdown
 * links its two figures as SVG files written beside it
 * (`<name>.producer-curve.svg`, `<name>.schematic.svg`) and, on stdout,
 * leaves them out. A file with errors still gets a report (its findings,
 * design basis and layout, without results). Exit codes: 0 written, 1
 * written but the file has errors, 2 usage error or a file that cannot be
 * read or written.
 */
export async function runReport(file: string, options: ReportOptions, io: CommandIo): Promise<number> {
  const out = options.out !== undefined ? resolve(io.cwd, options.out) : undefined;
  const byExtension = out ? FORMAT_BY_EXTENSION[extname(out).toLowerCase()] : undefined;
  if (out && !byExtension && !options.format) {
    io.stderr(`vacnet report: cannot tell the format from "${options.out}": name it .html or .md, or pass --format html|markdown\n`);
    return ExitCode.usage;
  }
  if (options.format && byExtension && options.format !== byExtension) {
    io.stderr(`vacnet report: --format ${options.format} does not match the file name "${options.out}"\n`);
    return ExitCode.usage;
  }
  const format: ReportFormat = options.format ?? byExtension ?? 'html';

  const absolute = resolve(io.cwd, file);
  let input: ReportInput;
  try {
    const settings = await settingsChoice(options.settings, io.cwd);
    const loaded = await loadDocuments([absolute], { analyse: true, ...(settings ? { settings } : {}) });
    const found = loaded.files.find((f) => resolve(f.path) === absolute) ?? loaded.files[0];
    const unreadable = found?.diagnostics.find((d) => d.code === 'file-unreadable');
    if (!found || unreadable) {
      io.stderr(`vacnet report: ${unreadable ? unreadable.message.replace(/^Cannot read this file/, `cannot read ${file}`) : `cannot read ${file}`}\n`);
      return ExitCode.usage;
    }
    if (!found.model && !found.diagnostics.some((d) => d.severity === 'error')) {
      io.stderr(`vacnet report: ${file} holds no system to report on (a catalog file?)\n`);
      return ExitCode.usage;
    }
    input = {
      path: shownPath(file, absolute, io.cwd),
      diagnostics: found.diagnostics,
      ...(found.model ? { model: found.model } : {}),
      ...(found.analysis ? { analysis: found.analysis } : {}),
      ...(found.accepted ? { accepted: found.accepted } : {}),
    };
  } catch (error) {
    io.stderr(`vacnet report: ${error instanceof Error ? error.message : String(error)}\n`);
    return ExitCode.usage;
  }

  const rulesFolder = findRulesFolder();
  const codes = [...input.diagnostics.map((d) => d.code), ...(input.accepted ?? []).map((a) => a.finding.code)];
  const context = { version: options.version ?? 'unknown', generatedAt: options.now ?? reportTime(), rulePages: readRulePages(rulesFolder, codes) };
  const hasErrors = input.diagnostics.some((d) => d.severity === 'error');

  try {
    if (format === 'html') {
      const html = await renderReportHtml(input, context);
      if (out) writeFileSync(out, html);
      else io.stdout(html);
    } else {
      const stem = out ? basename(out, extname(out)) : undefined;
      const md = await renderReportMarkdown(input, {
        ...context,
        ...(stem ? { figureStem: stem } : {}),
        rulePageHref: (code) => rulePageLink(rulesFolder, code, out ? dirname(out) : io.cwd, io.cwd, context.rulePages.has(code)),
      });
      if (out) {
        writeFileSync(out, md.markdown);
        for (const figure of md.figures) writeFileSync(join(dirname(out), figure.fileName), figure.svg);
      } else io.stdout(md.markdown);
    }
  } catch (error) {
    io.stderr(`vacnet report: cannot write the report: ${error instanceof Error ? error.message : String(error)}\n`);
    return ExitCode.usage;
  }
  if (out) {
    const shown = relative(io.cwd, out) || out;
    const counts = ['error', 'warning'].map((s) => input.diagnostics.filter((d) => d.severity === s).length);
    io.stdout(`Wrote ${shown}${input.model ? ` for "${input.model.name}"` : ''}: ${counts[0]} ${counts[0] === 1 ? 'error' : 'errors'}, ${counts[1]} ${counts[1] === 1 ? 'warning' : 'warnings'}.\n`);
  }
  return hasErrors ? ExitCode.findings : ExitCode.ok;
}

/** The file as the reader knows it: relative to the working folder when inside it, else as typed. */
function shownPath(typed: string, absolute: string, cwd: string): string {
  const inside = relative(cwd, absolute);
  return inside && !inside.startsWith('..') && !isAbsolute(inside) ? inside.split(sep).join('/') : typed;
}

/** SOURCE_DATE_EPOCH (seconds), the reproducible-builds convention, when set; else now. */
function reportTime(): Date {
  const epoch = process.env.SOURCE_DATE_EPOCH;
  if (epoch && /^\d+$/.test(epoch)) return new Date(Number(epoch) * 1000);
  return new Date();
}

/**
 * A link from the Markdown file to a rule page: relative, and only when the
 * docs folder lies inside the working folder (a checkout of the project
 * whose pages a pull request can show); otherwise the code stays plain.
 */
function rulePageLink(folder: string | undefined, code: string, from: string, cwd: string, exists: boolean): string | null {
  if (!folder || !exists) return null;
  const inside = relative(cwd, folder);
  if (inside.startsWith('..') || isAbsolute(inside)) return null;
  return relative(from, join(folder, `${code}.md`)).split(sep).join('/');
}
