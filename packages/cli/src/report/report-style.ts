/**
 * The report's one style sheet. Every colour is a CSS custom property
 * (`--vn-*`) with a default that falls back from the editor's theme
 * variables (`--vscode-*`, set by the editor in a webview) to our own light
 * or dark palette (`prefers-color-scheme`), so the same HTML follows the
 * editor's theme, a browser's light or dark mode, and prints on white.
 * Tints are mixed from those colours (`color-mix`), so they follow too.
 * No external fonts or images: system fonts only.
 */

/** Theme variables: the light palette, each behind the editor's matching variable. */
const LIGHT = `
  --vn-bg: var(--vscode-editor-background, #ffffff);
  --vn-fg: var(--vscode-editor-foreground, #1b2430);
  --vn-muted: var(--vscode-descriptionForeground, #5b6675);
  --vn-border: var(--vscode-panel-border, #d3d9e0);
  --vn-surface: var(--vscode-editorWidget-background, #f4f6f9);
  --vn-accent: var(--vscode-textLink-foreground, #1f5fa8);
  --vn-curve: var(--vscode-charts-blue, #1f5fa8);
  --vn-demand: var(--vscode-charts-orange, #c2410c);
  --vn-point: var(--vscode-editor-foreground, #111827);
  --vn-pipe: var(--vscode-editor-foreground, #3c4654);
  --vn-ample: var(--vscode-charts-green, #2e7d32);
  --vn-tight: var(--vscode-charts-yellow, #a86400);
  --vn-short: var(--vscode-charts-red, #c62828);
  --vn-unknown: var(--vscode-disabledForeground, #6b7280);
  --vn-caution: var(--vscode-editorWarning-foreground, #b7791f);
  --vn-danger: var(--vscode-editorError-foreground, #c62828);
  --vn-font: var(--vscode-font-family, system-ui, -apple-system, "Segoe UI", "Liberation Sans", "DejaVu Sans", Arial, sans-serif);
  --vn-mono: var(--vscode-editor-font-family, ui-monospace, "DejaVu Sans Mono", "Liberation Mono", Consolas, monospace);`;

/** The dark palette, for a browser in dark mode; an editor's own variables still win. */
const DARK = `
  --vn-bg: var(--vscode-editor-background, #15181d);
  --vn-fg: var(--vscode-editor-foreground, #e4e8ee);
  --vn-muted: var(--vscode-descriptionForeground, #9aa4b2);
  --vn-border: var(--vscode-panel-border, #363d48);
  --vn-surface: var(--vscode-editorWidget-background, #1c2128);
  --vn-accent: var(--vscode-textLink-foreground, #7cb3ff);
  --vn-curve: var(--vscode-charts-blue, #6ea8ff);
  --vn-demand: var(--vscode-charts-orange, #ff8a50);
  --vn-point: var(--vscode-editor-foreground, #f3f4f6);
  --vn-pipe: var(--vscode-editor-foreground, #b8c1cd);
  --vn-ample: var(--vscode-charts-green, #66bb6a);
  --vn-tight: var(--vscode-charts-yellow, #e8b339);
  --vn-short: var(--vscode-charts-red, #ef5350);
  --vn-unknown: var(--vscode-disabledForeground, #9aa4b2);
  --vn-caution: var(--vscode-editorWarning-foreground, #e0a030);
  --vn-danger: var(--vscode-editorError-foreground, #ef5350);`;

/** Paper: the light palette without the editor's variables (an editor in dark mode still prints on white). */
const PRINT = `
  --vn-bg: #ffffff; --vn-fg: #000000; --vn-muted: #4a5462; --vn-border: #b9c1cc; --vn-surface: #f2f4f7;
  --vn-accent: #1f5fa8; --vn-curve: #1f5fa8; --vn-demand: #c2410c; --vn-point: #000000; --vn-pipe: #2b3440;
  --vn-ample: #2e7d32; --vn-tight: #a86400; --vn-short: #c62828; --vn-unknown: #6b7280; --vn-caution: #b7791f; --vn-danger: #c62828;`;

/** Rules for the SVG figures (plot and schematic), shared by the page and by standalone SVG files. */
export const SVG_STYLE = `
.vn-svg { font-family: var(--vn-font); color: var(--vn-fg); }
.vn-svg text { fill: var(--vn-fg); font-size: 11px; }
.vn-svg .vn-svg-bg { fill: var(--vn-bg); }
.vn-svg .vn-muted-text, .vn-svg text.vn-muted-text { fill: var(--vn-muted); }
.vn-svg .vn-halo { paint-order: stroke; stroke: var(--vn-bg); stroke-width: 3px; stroke-linejoin: round; }
.vn-svg .vn-plot-area { fill: var(--vn-bg); stroke: var(--vn-border); }
.vn-svg .vn-grid { stroke: var(--vn-border); stroke-width: 0.6; opacity: 0.7; }
.vn-svg .vn-axis { stroke: var(--vn-muted); stroke-width: 1; }
.vn-svg .vn-tick-label { font-size: 10.5px; fill: var(--vn-muted); font-variant-numeric: tabular-nums; }
.vn-svg .vn-axis-title { font-size: 11.5px; font-weight: 600; fill: var(--vn-fg); }
.vn-svg .vn-curve-producer { fill: none; stroke: var(--vn-curve); stroke-width: 2.6; stroke-linejoin: round; }
.vn-svg .vn-curve-net { fill: none; stroke: var(--vn-curve); stroke-width: 1.3; stroke-dasharray: 2 3; }
.vn-svg .vn-curve-point { fill: var(--vn-bg); stroke: var(--vn-curve); stroke-width: 1.5; }
.vn-svg .vn-curve-system { fill: none; stroke: var(--vn-demand); stroke-width: 2.2; stroke-dasharray: 9 4; stroke-linejoin: round; }
.vn-svg .vn-relief { stroke: var(--vn-muted); stroke-width: 1.2; stroke-dasharray: 1 3; stroke-linecap: round; }
.vn-svg .vn-op-point { fill: var(--vn-point); stroke: var(--vn-bg); stroke-width: 2; }
.vn-svg .vn-demand-point { fill: var(--vn-bg); stroke: var(--vn-demand); stroke-width: 2; }
.vn-svg .vn-leader { stroke: var(--vn-muted); stroke-width: 0.8; fill: none; }
.vn-svg .vn-margin-line { stroke: var(--vn-fg); stroke-width: 1.1; fill: none; }
.vn-svg .vn-margin-arrow { fill: var(--vn-fg); }
.vn-svg .vn-callout { font-size: 11px; }
.vn-svg .vn-callout-strong { font-size: 11px; font-weight: 700; }
.vn-svg .vn-legend-box { fill: var(--vn-bg); stroke: var(--vn-border); }
.vn-svg .vn-legend-text { font-size: 10.5px; }
.vn-svg .vn-legend-title { font-size: 10.5px; font-weight: 700; }
.vn-svg .vn-pipe { fill: none; stroke: var(--vn-pipe); stroke-linejoin: round; }
.vn-svg .vn-pipe-equipment { fill: none; stroke: var(--vn-curve); stroke-width: 3.5; }
.vn-svg .vn-valve { fill: none; stroke: var(--vn-muted); stroke-width: 1; stroke-dasharray: 3 2; }
.vn-svg .vn-pipe-label { font-size: 9.5px; fill: var(--vn-muted); }
.vn-svg .vn-junction { fill: var(--vn-pipe); }
.vn-svg .vn-cleanout { fill: var(--vn-bg); stroke: var(--vn-pipe); stroke-width: 1.4; }
.vn-svg .vn-equipment rect { fill: color-mix(in srgb, var(--vn-curve) 12%, var(--vn-bg)); stroke: var(--vn-curve); stroke-width: 1.4; }
.vn-svg .vn-equipment text { font-size: 10.5px; }
.vn-svg .vn-equipment .vn-node-kind { font-weight: 700; font-size: 9.5px; letter-spacing: 0.04em; text-transform: uppercase; fill: var(--vn-curve); }
.vn-svg .vn-inlet rect { stroke-width: 1.3; }
.vn-svg .vn-inlet .vn-node-name { font-weight: 700; font-size: 11px; }
.vn-svg .vn-inlet .vn-node-value { font-size: 10.5px; font-variant-numeric: tabular-nums; }
.vn-svg .vn-inlet .vn-node-note { font-size: 9.5px; fill: var(--vn-muted); }
.vn-svg .vn-inlet.vn-critical rect { stroke-width: 2.8; }
.vn-svg .vn-band-ample rect, .vn-svg rect.vn-band-ample { fill: color-mix(in srgb, var(--vn-ample) 16%, var(--vn-bg)); stroke: var(--vn-ample); }
.vn-svg .vn-band-tight rect, .vn-svg rect.vn-band-tight { fill: url(#vn-pattern-tight); stroke: var(--vn-tight); }
.vn-svg .vn-band-short rect, .vn-svg rect.vn-band-short { fill: url(#vn-pattern-short); stroke: var(--vn-short); }
.vn-svg .vn-band-unknown rect, .vn-svg rect.vn-band-unknown { fill: color-mix(in srgb, var(--vn-unknown) 12%, var(--vn-bg)); stroke: var(--vn-unknown); stroke-dasharray: 3 2; }
.vn-svg .vn-pattern-tight-bg { fill: color-mix(in srgb, var(--vn-tight) 14%, var(--vn-bg)); }
.vn-svg .vn-pattern-tight-dot { fill: color-mix(in srgb, var(--vn-tight) 38%, var(--vn-bg)); }
.vn-svg .vn-pattern-short-bg { fill: color-mix(in srgb, var(--vn-short) 14%, var(--vn-bg)); }
.vn-svg .vn-pattern-short-line { stroke: color-mix(in srgb, var(--vn-short) 32%, var(--vn-bg)); stroke-width: 1.4; }
.vn-svg rect.vn-legend-critical { fill: var(--vn-bg); stroke: var(--vn-fg); stroke-width: 2.8; stroke-dasharray: none; }
.vn-svg .vn-band-mark { font-weight: 700; }
.vn-svg .vn-band-short .vn-band-mark { fill: var(--vn-short); }
.vn-svg .vn-band-tight .vn-band-mark { fill: var(--vn-tight); }
`;

/** Rules for the page. */
const PAGE_STYLE = `
*, *::before, *::after { box-sizing: border-box; }
html { background: var(--vn-bg); color: var(--vn-fg); }
body { margin: 0; font-family: var(--vn-font); font-size: 14px; line-height: 1.5; background: var(--vn-bg); color: var(--vn-fg); -webkit-print-color-adjust: exact; print-color-adjust: exact; }
.vn-report { max-width: 1120px; margin: 0 auto; padding: 28px 32px 48px; }
a { color: var(--vn-accent); }
h1, h2, h3, h4 { line-height: 1.25; margin: 0; }
h2 { font-size: 18px; margin: 36px 0 12px; padding-bottom: 6px; border-bottom: 2px solid var(--vn-accent); display: flex; gap: 10px; align-items: baseline; }
h2 .vn-section-number { color: var(--vn-accent); font-variant-numeric: tabular-nums; min-width: 1.6em; }
h3 { font-size: 14.5px; margin: 22px 0 8px; }
p { margin: 0 0 10px; }
.vn-muted { color: var(--vn-muted); }
.vn-small { font-size: 12.5px; }
code, .vn-code { font-family: var(--vn-mono); font-size: 0.92em; }
.vn-nowrap { white-space: nowrap; }
.vn-num { font-variant-numeric: tabular-nums; white-space: nowrap; text-align: right; }

/* Title block, after a drawing's: the system, the run, the status. */
.vn-title-block { border: 2px solid var(--vn-fg); display: grid; grid-template-columns: repeat(4, minmax(0, 1fr)); }
.vn-title-main { grid-column: 1 / 4; padding: 14px 18px; border-right: 1px solid var(--vn-fg); border-bottom: 1px solid var(--vn-fg); }
.vn-title-kicker { font-size: 11.5px; font-weight: 700; letter-spacing: 0.12em; text-transform: uppercase; color: var(--vn-muted); margin-bottom: 4px; }
.vn-title-main h1 { font-size: 25px; }
.vn-title-status { padding: 14px 16px; border-bottom: 1px solid var(--vn-fg); display: flex; flex-direction: column; justify-content: center; gap: 4px; }
.vn-title-cell { padding: 8px 14px; border-right: 1px solid var(--vn-fg); min-width: 0; overflow-wrap: anywhere; }
.vn-title-cell:last-child { border-right: 0; }
.vn-title-label { display: block; font-size: 10.5px; font-weight: 700; letter-spacing: 0.08em; text-transform: uppercase; color: var(--vn-muted); }
.vn-title-value { font-size: 13px; }
.vn-status { display: inline-flex; align-items: center; gap: 8px; font-weight: 700; font-size: 15px; }
.vn-status::before { content: ""; width: 10px; height: 10px; border-radius: 50%; background: var(--vn-ample); }
.vn-status-errors::before { background: var(--vn-short); border-radius: 0; transform: rotate(45deg); }
.vn-status-warnings::before { background: var(--vn-tight); border-radius: 0; }

/* Cautions. */
.vn-caution { margin: 18px 0 0; padding: 12px 16px; border: 1px solid var(--vn-caution); border-left-width: 6px; background: color-mix(in srgb, var(--vn-caution) 9%, var(--vn-bg)); }
.vn-caution p:last-child { margin-bottom: 0; }
.vn-caution-title { font-weight: 800; letter-spacing: 0.06em; text-transform: uppercase; font-size: 12.5px; margin-bottom: 6px; display: block; }
.vn-caution-dust { border-color: var(--vn-danger); background: color-mix(in srgb, var(--vn-danger) 9%, var(--vn-bg)); }
.vn-caution-dust .vn-caution-title { color: var(--vn-danger); font-size: 14px; }
.vn-caution ul { margin: 0; padding-left: 18px; }
.vn-caution li { margin: 2px 0; }

/* Key figures. */
.vn-figures { display: grid; grid-template-columns: repeat(auto-fit, minmax(165px, 1fr)); gap: 12px; }
.vn-figure-card { border: 1px solid var(--vn-border); border-top: 3px solid var(--vn-accent); padding: 10px 14px 12px; background: var(--vn-surface); }
.vn-figure-card.vn-card-short { border-top-color: var(--vn-short); }
.vn-figure-card.vn-card-tight { border-top-color: var(--vn-tight); }
.vn-figure-card.vn-card-ample { border-top-color: var(--vn-ample); }
.vn-figure-label { font-size: 11px; font-weight: 700; letter-spacing: 0.08em; text-transform: uppercase; color: var(--vn-muted); }
.vn-figure-value { font-size: 21px; font-weight: 700; font-variant-numeric: tabular-nums; line-height: 1.25; margin: 3px 0 2px; }
.vn-figure-note { font-size: 12.5px; color: var(--vn-muted); }

/* Tables. */
.vn-table-wrap { overflow-x: auto; }
table { border-collapse: collapse; width: 100%; font-size: 12.5px; }
caption { caption-side: top; text-align: left; font-size: 12.5px; color: var(--vn-muted); padding: 0 0 6px; }
th, td { padding: 5px 8px; border-bottom: 1px solid var(--vn-border); vertical-align: top; text-align: left; }
thead th { background: var(--vn-surface); font-size: 11px; font-weight: 700; letter-spacing: 0.02em; border-bottom: 1.5px solid var(--vn-fg); vertical-align: bottom; }
tbody tr:nth-child(even) td { background: color-mix(in srgb, var(--vn-surface) 55%, var(--vn-bg)); }
th.vn-num { text-align: right; }
.vn-kv th { width: 26%; background: transparent; font-weight: 600; border-bottom: 1px solid var(--vn-border); font-size: 12.5px; letter-spacing: 0; }
.vn-kv td .vn-note { display: block; color: var(--vn-muted); font-size: 12px; }
.vn-row-critical td:first-child { box-shadow: inset 3px 0 0 var(--vn-accent); }
.vn-sub { display: block; color: var(--vn-muted); font-size: 11.5px; }
.vn-band { display: inline-block; min-width: 4.8em; padding: 0 6px; border: 1px solid; border-radius: 3px; font-size: 11px; font-weight: 700; text-align: center; white-space: nowrap; }
.vn-band-ample { color: var(--vn-ample); border-color: var(--vn-ample); }
.vn-band-tight { color: var(--vn-tight); border-color: var(--vn-tight); border-style: dotted; }
.vn-band-short { color: var(--vn-short); border-color: var(--vn-short); border-width: 2px; }
.vn-band-unknown { color: var(--vn-unknown); border-color: var(--vn-unknown); border-style: dashed; }
.vn-severity { display: inline-block; min-width: 5.2em; font-size: 11px; font-weight: 700; text-transform: uppercase; letter-spacing: 0.04em; }
.vn-severity-error { color: var(--vn-short); }
.vn-severity-warning { color: var(--vn-tight); }
.vn-severity-info { color: var(--vn-muted); }
.vn-field { min-width: 9em; border-left: 1px solid var(--vn-border); }
.vn-name-col { min-width: 11em; }
.vn-set-col { min-width: 7em; }
.vn-table-wrap + .vn-table-wrap { margin-top: 16px; }
table.vn-curve-table { width: auto; margin-top: 10px; }
table.vn-curve-table th[scope="row"] { background: var(--vn-surface); font-size: 11px; font-weight: 700; white-space: nowrap; }
table.vn-curve-table td { min-width: 4.2em; }
.vn-sheet-head { display: grid; grid-template-columns: repeat(4, 1fr); border: 1px solid var(--vn-border); margin: 0 0 12px; }
.vn-sheet-head div { padding: 6px 10px 18px; border-right: 1px solid var(--vn-border); font-size: 11px; font-weight: 700; letter-spacing: 0.06em; text-transform: uppercase; color: var(--vn-muted); }
.vn-sheet-head div:last-child { border-right: 0; }
ol.vn-steps { margin: 0 0 12px; padding-left: 20px; font-size: 13px; }

/* Figures. */
figure.vn-figure { margin: 0 0 8px; border: 1px solid var(--vn-border); padding: 12px; background: var(--vn-bg); }
figure.vn-figure svg { display: block; max-width: 100%; height: auto; margin: 0 auto; }
figure.vn-figure figcaption { font-size: 12.5px; color: var(--vn-muted); margin-top: 8px; border-top: 1px solid var(--vn-border); padding-top: 8px; }
figure.vn-figure figcaption strong { color: var(--vn-fg); }
.vn-note-box { border: 1px dashed var(--vn-border); padding: 14px 16px; color: var(--vn-muted); background: var(--vn-surface); }

/* Rule pages. */
.vn-rule-page { border: 1px solid var(--vn-border); padding: 4px 18px 10px; margin: 0 0 14px; break-inside: avoid-page; }
.vn-rule-page h3 { font-family: var(--vn-mono); font-size: 14px; }
.vn-rule-page h4 { font-size: 13px; margin: 12px 0 4px; }
.vn-rule-page pre { background: var(--vn-surface); padding: 8px 10px; overflow-x: auto; font-size: 12px; border: 1px solid var(--vn-border); }
.vn-rule-page table { margin: 6px 0 10px; }
.vn-rule-page p, .vn-rule-page li { font-size: 13px; }

footer.vn-footer { margin-top: 40px; padding-top: 10px; border-top: 1px solid var(--vn-border); font-size: 12px; color: var(--vn-muted); display: flex; justify-content: space-between; gap: 16px; flex-wrap: wrap; }

@media screen and (max-width: 760px) {
  .vn-report { padding: 16px; }
  .vn-title-block { grid-template-columns: 1fr 1fr; }
  .vn-title-main { grid-column: 1 / 3; border-right: 0; }
  .vn-title-status { grid-column: 1 / 3; }
}

@page { size: auto; margin: 14mm 12mm 16mm; }
/* The widest tables print across the page: landscape on the paper the reader chose (A4 or Letter). */
@page vn-wide { size: landscape; }
@media print {
  #inlets, #pipes { page: vn-wide; }
  .vn-name-col { min-width: 8em; }
  .vn-set-col { min-width: 5em; }
  :root {${PRINT} }
  body { font-size: 10pt; }
  .vn-report { max-width: none; padding: 0; }
  h2 { break-after: avoid; margin-top: 22px; }
  h3 { break-after: avoid; }
  .vn-break-before { break-before: page; }
  figure.vn-figure, .vn-figures, .vn-caution, .vn-title-block { break-inside: avoid; }
  table { font-size: 8pt; }
  th, td { padding: 3px 5px; }
  td .vn-sub, td.vn-small, .vn-band, .vn-severity { font-size: 7pt; }
  table.vn-kv { font-size: 9pt; }
  .vn-kv th { font-size: 9pt; }
  .vn-kv td .vn-note { font-size: 8pt; }
  .vn-figures { grid-template-columns: repeat(5, minmax(0, 1fr)); gap: 8px; }
  .vn-figure-card { padding: 8px 10px; }
  .vn-figure-value { font-size: 15pt; }
  .vn-figure-note { font-size: 8pt; }
  /* A figure is not split across pages: a tall one is scaled to fit one (its aspect kept). */
  figure.vn-figure svg { width: auto; max-width: 100%; max-height: 225mm; }
  thead { display: table-header-group; }
  tr { break-inside: avoid; }
  .vn-table-wrap { overflow: visible; }
  a { color: inherit; text-decoration: none; }
}
`;

/** The whole sheet for the HTML page. */
export const REPORT_STYLE = `:root {${LIGHT}
  color-scheme: light dark;
}
@media (prefers-color-scheme: dark) {
  :root {${DARK} }
}
${PAGE_STYLE}${SVG_STYLE}`;

/** The sheet inside a standalone SVG file: the light palette on an opaque background, readable on any page. */
export const STANDALONE_SVG_STYLE = `:root {${PRINT}
  --vn-font: system-ui, -apple-system, "Segoe UI", "Liberation Sans", "DejaVu Sans", Arial, sans-serif;
}
${SVG_STYLE}`;
