// The command line's public surface, for the bin and for tests.
export { main } from './main.js';
export { ExitCode, UsageError } from './exit-codes.js';
export { renderReportHtml, renderReportMarkdown, buildReportModel, REPORT_STYLE, styleHash, type ReportInput, type ReportContext, type ReportModel, type HtmlOptions, type MarkdownOptions, type MarkdownReport } from './report/report-api.js';
