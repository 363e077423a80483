/**
 * The pages of the report and schematic views: the command line's report
 * HTML and schematic SVG (packages/cli/src/report), made for a webview. The
 * page carries the webview's Content-Security-Policy, the report's style
 * sheet behind a nonce, and a link to the extension's own sheet. Colours come
 * from the editor's theme: the report's sheet reads VS Code's CSS variables
 * (--vscode-editor-background and the rest), which the webview sets.
 */
import { buildReportModel, renderReportHtml, REPORT_STYLE, type ReportInput } from '../../cli/src/report/report-api.js';
import { renderSchematicSvg } from '../../cli/src/report/svg/schematic.js';
import { escapeHtml } from '../../cli/src/report/html-escape.js';
import { markdownToHtml } from '../../cli/src/report/markdown-to-html.js';
import { webviewPolicy, withStylesheet } from './webview-policy.js';

export interface PageOptions {
  /** The webview's resource origin (`webview.cspSource`). */
  cspSource: string;
  nonce: string;
  /** The extension's style sheet as a webview URI. */
  stylesheet: string;
  /** The vacnet version printed in the report. */
  version: string;
  generatedAt?: Date;
  /** docs/rules pages by code, for the report's appendix. */
  rulePages?: ReadonlyMap<string, string>;
}

/** The whole design report, as `vacnet report` writes it. */
export async function reportPage(input: ReportInput, options: PageOptions): Promise<string> {
  const html = await renderReportHtml(input, {
    version: options.version,
    ...(options.generatedAt ? { generatedAt: options.generatedAt } : {}),
    ...(options.rulePages ? { rulePages: options.rulePages } : {}),
    contentSecurityPolicy: webviewPolicy(options.cspSource, options.nonce),
    styleNonce: options.nonce,
  });
  return withStylesheet(html, options.stylesheet).replace('<body>', '<body class="vn-webview">');
}

/** The network schematic alone, as the report draws it, with a title line. */
export async function schematicPage(input: ReportInput, options: PageOptions): Promise<string> {
  const report = buildReportModel(input, { version: options.version, ...(options.generatedAt ? { generatedAt: options.generatedAt } : {}) });
  let figure: string;
  if (!report.schematic) {
    figure = `<div class="vn-note-box">${escapeHtml(report.analysisNote ?? 'No schematic: the file holds no system.')}</div>`;
  } else {
    try {
      figure = `<figure class="vn-figure">${await renderSchematicSvg(report.schematic)}</figure>`;
    } catch (error) {
      figure = `<div class="vn-note-box">The schematic could not be laid out: ${escapeHtml(error instanceof Error ? error.message : String(error))}</div>`;
    }
  }
  const counts = report.counts;
  const status = counts.errors > 0 ? `${counts.errors} error${counts.errors === 1 ? '' : 's'}: the results wait for them to be fixed` : `${counts.warnings} warning${counts.warnings === 1 ? '' : 's'}`;
  const html = [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${escapeHtml(webviewPolicy(options.cspSource, options.nonce))}">`,
    `<title>${escapeHtml(report.title)} \u2013 network schematic</title>`,
    `<style nonce="${escapeHtml(options.nonce)}">${REPORT_STYLE}</style>`,
    '</head>',
    '<body class="vn-webview vn-webview-schematic">',
    '<main class="vn-report">',
    `<header class="vn-webview-heading"><h1>${escapeHtml(report.title)}</h1><p class="vn-muted vn-small"><code>${escapeHtml(report.file)}</code> \u00b7 ${escapeHtml(status)}</p></header>`,
    figure,
    '</main>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
  return withStylesheet(html, options.stylesheet);
}

/** A Markdown text (a comparison) as a page in the report's style; the renderer escapes everything first, so the text cannot inject markup. */
export function markdownPage(title: string, markdown: string, options: Pick<PageOptions, 'cspSource' | 'nonce' | 'stylesheet'>): string {
  const html = [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${escapeHtml(webviewPolicy(options.cspSource, options.nonce))}">`,
    `<title>${escapeHtml(title)}</title>`,
    `<style nonce="${escapeHtml(options.nonce)}">${REPORT_STYLE}</style>`,
    '</head>',
    '<body class="vn-webview vn-webview-markdown">',
    `<main class="vn-report">${markdownToHtml(markdown, { headingShift: 0 })}</main>`,
    '</body>',
    '</html>',
    '',
  ].join('\n');
  return withStylesheet(html, options.stylesheet);
}
