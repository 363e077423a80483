/**
 * The report for other hosts (the editor's webview) and the command line:
 * one loaded file in, a self-contained HTML page or Markdown out. Nothing
 * here reads or writes files.
 */
import { buildReportModel, type ReportContext, type ReportInput } from './report-model.js';
import { renderReportModelHtml, type HtmlOptions } from './render-html.js';
import { renderReportModelMarkdown, type MarkdownOptions } from './render-markdown.js';

export type { ReportContext, ReportInput, ReportModel } from './report-model.js';
export type { HtmlOptions } from './render-html.js';
export type { MarkdownOptions, MarkdownReport } from './render-markdown.js';
export { buildReportModel } from './report-model.js';
export { REPORT_STYLE } from './report-style.js';
export { styleHash } from './content-security-policy.js';

/** The HTML report of a loaded file (model, analysis, findings). */
export async function renderReportHtml(input: ReportInput, options: ReportContext & HtmlOptions = {}): Promise<string> {
  return renderReportModelHtml(buildReportModel(input, options), options);
}

/** The Markdown report of a loaded file, with its figures as standalone SVG texts to write beside it. */
export async function renderReportMarkdown(input: ReportInput, options: ReportContext & MarkdownOptions = {}) {
  return renderReportModelMarkdown(buildReportModel(input, options), options);
}
