import { MARGIN_BAND_TEXT, type MarginBand } from './margin-band.js';
import { escapeHtml as e } from './html-escape.js';
import { markdownToHtml } from './markdown-to-html.js';
import { reportPolicy, styleHash } from './content-security-policy.js';
import { REPORT_STYLE } from './report-style.js';
import type { ReportModel } from './report-model.js';
import { renderProducerCurveSvg } from './svg/producer-curve.js';
import { renderSchematicSvg } from './svg/schematic.js';
import { formatSignificant, fromSI } from '@vacnet/engine';

export interface HtmlOptions {
  /**
   * The page's Content-Security-Policy. Default: nothing may load or run,
   * the style sheet allowed by its hash (or by `styleNonce` when given).
   * An editor's webview passes its own.
   */
  contentSecurityPolicy?: string;
  /** A nonce for the style element, for a policy that allows styles by nonce. */
  styleNonce?: string;
}

/**
 * The report as one self-contained HTML page: no scripts, no external
 * files, one style sheet, the figures as inline SVG. Sections follow a
 * design deliverable: title block and cautions, summary, design basis,
 * producer curve, schematic, inlet and pipe tables, scenarios, findings,
 * bill of materials, commissioning test sheet, and the rule pages.
 */
export async function renderReportModelHtml(report: ReportModel, options: HtmlOptions = {}): Promise<string> {
  const nonce = options.styleNonce ? ` nonce="${e(options.styleNonce)}"` : '';
  const policy =
    options.contentSecurityPolicy ?? reportPolicy(options.styleNonce ? `'nonce-${options.styleNonce}'` : await styleHash(REPORT_STYLE));
  const sections: string[] = [];
  let number = 0;
  const section = (id: string, title: string, body: string, breakBefore = false) => {
    number++;
    sections.push(
      `<section id="${id}" class="vn-section${breakBefore ? ' vn-break-before' : ''}" aria-labelledby="${id}-heading">` +
        `<h2 id="${id}-heading"><span class="vn-section-number">${number}</span><span>${e(title)}</span></h2>${body}</section>`,
    );
  };

  section('summary', 'Summary', summaryHtml(report));
  section('design-basis', 'Design basis', designBasisHtml(report));
  section('producer', 'Producer and system demand', curveHtml(report));
  section('schematic', 'Network schematic', await schematicHtml(report), true);
  section('inlets', 'Inlets in their worst case', inletsHtml(report), true);
  section('pipes', 'Pipes', pipesHtml(report), true);
  if (report.scenarios.length > 0) section('scenarios', 'Named scenarios', scenariosHtml(report));
  section('findings', 'Findings', findingsHtml(report), true);
  section('materials', 'Bill of materials', materialsHtml(report), true);
  section('commissioning', 'Commissioning test sheet', commissioningHtml(report), true);
  if (report.rulePages.length > 0) {
    sections.push(
      `<section id="rules" class="vn-section vn-break-before" aria-labelledby="rules-heading"><h2 id="rules-heading"><span class="vn-section-number">A</span><span>Appendix: rule pages</span></h2>` +
        `<p class="vn-muted vn-small">The pages of the codes found above, as published with this version of vacnet (docs/rules).</p>` +
        report.rulePages
          .map(
            (p) =>
              `<article class="vn-rule-page" id="rule-${e(p.code)}">` +
              markdownToHtml(p.markdown, { headingShift: 2, linkRulePage: (code) => (report.rulePages.some((r) => r.code === code) ? `#rule-${code}` : null) }) +
              '</article>',
          )
          .join('') +
        '</section>',
    );
  }

  return [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${e(policy)}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<meta name="generator" content="vacnet ${e(report.version)}">`,
    `<title>${e(report.title)} \u2013 central vacuum design report</title>`,
    `<style${nonce}>${REPORT_STYLE}</style>`,
    '</head>',
    '<body>',
    '<main class="vn-report">',
    titleBlockHtml(report),
    cautionsHtml(report),
    ...sections,
    footerHtml(report),
    '</main>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

function titleBlockHtml(r: ReportModel): string {
  const c = r.counts;
  const statusClass = c.errors > 0 ? 'vn-status-errors' : c.warnings > 0 ? 'vn-status-warnings' : 'vn-status-clean';
  const status = c.errors > 0 ? `${plural(c.errors, 'error')}` : c.warnings > 0 ? `No errors, ${plural(c.warnings, 'warning')}` : 'No errors or warnings';
  const cell = (label: string, value: string) => `<div class="vn-title-cell"><span class="vn-title-label">${e(label)}</span><span class="vn-title-value">${value}</span></div>`;
  return (
    '<header class="vn-title-block">' +
    `<div class="vn-title-main"><div class="vn-title-kicker">Central vacuum system \u00b7 design report</div><h1>${e(r.title)}</h1></div>` +
    `<div class="vn-title-status"><span class="vn-title-label">Status</span><span class="vn-status ${statusClass}">${e(status)}</span>` +
    `<span class="vn-small vn-muted">${e(`${plural(c.warnings, 'warning')}, ${plural(c.infos, 'info')}, ${c.accepted} accepted`)}</span></div>` +
    cell('File', `<code>${e(r.file)}</code>`) +
    cell('Generated', `<time datetime="${e(r.generatedAt)}">${e(r.generatedAtText)}</time>`) +
    cell('Made with', `vacnet ${e(r.version)}`) +
    cell('Units', r.units === 'si' ? 'SI (kPa, Sm3/h, m/s)' : 'Imperial (inHg, scfm, fpm)') +
    '</header>'
  );
}

function cautionsHtml(r: ReportModel): string {
  let html = `<aside class="vn-caution" aria-label="Cautions"><strong class="vn-caution-title">Caution</strong><ul>${r.cautions.general.map((p) => `<li>${e(p)}</li>`).join('')}</ul></aside>`;
  if (r.cautions.dust) {
    html += `<aside class="vn-caution vn-caution-dust" role="note" aria-label="Combustible dust caution"><strong class="vn-caution-title">Combustible dust</strong>${r.cautions.dust.map((p) => `<p>${e(p)}</p>`).join('')}</aside>`;
  }
  return html;
}

function summaryHtml(r: ReportModel): string {
  const s = r.summary;
  const cards: string[] = [];
  const card = (label: string, value: string, note: string, cls = '') =>
    `<div class="vn-figure-card${cls ? ` ${cls}` : ''}"><div class="vn-figure-label">${e(label)}</div><div class="vn-figure-value">${value}</div><div class="vn-figure-note">${note}</div></div>`;
  if (s.producer) {
    const p = s.producer;
    cards.push(card('Operating point', e(p.flow), `at ${e(p.vacuum)} at the inlet of ${e(p.model)}${p.limited ? `; ${e(p.limited)}` : ''}`));
    const marginValue = p.si.marginFraction === null ? '\u2013' : e(p.margin.replace(/ on flow$/, ''));
    const required = p.requiredMargin ? `${e(p.requiredMargin.replace(/ on flow$/, ''))} required: ${p.marginMet ? 'met' : 'not met'}` : 'no margin required in the file';
    cards.push(card('Producer margin', marginValue, `on flow over the demand; ${required}`, p.marginMet === false ? 'vn-card-short' : p.marginMet ? 'vn-card-ample' : ''));
    cards.push(card('Air power', e(p.airPower), p.shaftPower ? `shaft power ${e(p.shaftPower)}` : 'no shaft power: the curve gives no power or efficiency'));
  }
  if (s.worstInlet) {
    const w = s.worstInlet;
    const others = w.others.length > 0 ? `with ${e(w.others.join(', '))} open` : 'alone';
    const need = w.need ? `; needs ${e(w.need)}: ${e(w.margin ?? '')}` : '; no need stated';
    cards.push(card(`Worst inlet: ${w.name}`, e(w.toolVacuum), `at the tool${w.room ? ` (${e(w.room)})` : ''}, ${others}${need}`, `vn-card-${w.band}`));
  }
  const c = r.counts;
  cards.push(
    card(
      'Findings',
      e(plural(c.errors, 'error')),
      `${e(plural(c.warnings, 'warning'))}, ${e(plural(c.infos, 'info'))}; ${c.accepted} accepted with reasons`,
      c.errors > 0 ? 'vn-card-short' : c.warnings > 0 ? 'vn-card-tight' : 'vn-card-ample',
    ),
  );
  let html = `<div class="vn-figures">${cards.join('')}</div>`;
  const facts: string[] = [];
  if (s.operators !== null) facts.push(`${plural(s.operators, 'design operator')}`);
  facts.push(plural(s.inletCount, 'inlet'), plural(s.pipeCount, 'pipe'));
  html += `<p class="vn-muted vn-small">${e(facts.join(' \u00b7 '))}. Vacuum is gauge vacuum; flows are standard air.${s.producersNote ? ` ${e(s.producersNote)}` : ''}</p>`;
  if (r.analysisNote) html += `<div class="vn-note-box">${e(r.analysisNote)}</div>`;
  return html;
}

function designBasisHtml(r: ReportModel): string {
  if (r.designBasis.length === 0) return `<div class="vn-note-box">${e(r.analysisNote ?? 'No design basis could be read.')}</div>`;
  return (
    '<table class="vn-kv"><tbody>' +
    r.designBasis.map((row) => `<tr><th scope="row">${e(row.label)}</th><td>${e(row.value)}${row.note ? `<span class="vn-note">${e(row.note)}</span>` : ''}</td></tr>`).join('') +
    '</tbody></table>'
  );
}

function curveHtml(r: ReportModel): string {
  const plot = r.curve;
  if (!plot) return `<div class="vn-note-box">${e(r.curveNote ?? 'No producer curve to plot.')}</div>`;
  let svg: string;
  try {
    svg = renderProducerCurveSvg(plot, r.units);
  } catch (error) {
    return `<div class="vn-note-box">The producer curve could not be drawn: ${e(error instanceof Error ? error.message : String(error))}</div>`;
  }
  const notes = [plot.demandCurveNote];
  if (plot.flowBasisNote) notes.push(plot.flowBasisNote);
  if (plot.exhaust) notes.push('The dotted line is the curve less the loss of the exhaust line, the vacuum the producer can hold at its inlet; the operating point lies on it.');
  notes.push(
    'The demand point is where the design case\u2019s critical tool gets exactly the vacuum it needs; the margin is the curve\u2019s flow at that vacuum over the demand flow, minus one.',
  );
  const flowUnit = fromSI(1, 'flow', r.units, { flowBasis: 'standard' }).unit;
  const vacuumUnit = fromSI(1, 'pressure', r.units).unit;
  const hasPower = plot.curvePoints.some((p) => p.powerW !== undefined);
  const value = (si: number, dimension: 'flow' | 'pressure' | 'power') =>
    formatSignificant(fromSI(si, dimension, r.units, dimension === 'flow' ? { flowBasis: 'standard' } : {}).value, 3);
  const powerUnit = fromSI(Math.max(...plot.curvePoints.map((p) => p.powerW ?? 0)), 'power', r.units).unit;
  const row = (label: string, cells: string[]) => `<tr><th scope="row">${e(label)}</th>${cells.map((c) => `<td class="vn-num">${e(c)}</td>`).join('')}</tr>`;
  const points =
    `<div class="vn-table-wrap"><table class="vn-curve-table"><caption>The maker\u2019s curve of ${e(plot.modelName)} as given in the file${plot.flowBasisNote ? ' (flow converted to standard)' : ''}</caption><tbody>` +
    row(`Flow, ${flowUnit}`, plot.curvePoints.map((p) => value(p.flowStdM3PerS, 'flow'))) +
    row(`Vacuum, ${vacuumUnit}`, plot.curvePoints.map((p) => value(p.vacuumPa, 'pressure'))) +
    (hasPower ? row(`Shaft power, ${powerUnit}`, plot.curvePoints.map((p) => (p.powerW !== undefined ? formatSignificant(fromSI(p.powerW, 'power', r.units, { unit: powerUnit }).value, 3) : '\u2013'))) : '') +
    '</tbody></table></div>';
  return (
    `<figure class="vn-figure">${svg}<figcaption><strong>Figure 1.</strong> Producer ${e(plot.producerName)} (${e(plot.modelName)}): curve, system demand and operating point. ${notes.map(e).join(' ')}</figcaption></figure>` +
    points
  );
}

async function schematicHtml(r: ReportModel): Promise<string> {
  if (!r.schematic) return `<div class="vn-note-box">${e(r.analysisNote ?? 'No schematic: the file holds no system.')}</div>`;
  let svg: string;
  try {
    svg = await renderSchematicSvg(r.schematic);
  } catch (error) {
    return `<div class="vn-note-box">The schematic could not be laid out: ${e(error instanceof Error ? error.message : String(error))}</div>`;
  }
  return (
    `<figure class="vn-figure">${svg}<figcaption><strong>Figure 2.</strong> The piping from the plant to every inlet, laid out automatically in layers from the producer. ` +
    'Pipes are labelled with name and nominal size and drawn wider for larger sizes; inlets part-way along a pipe hang from the point where they sit. ' +
    `Each inlet shows its worst-case vacuum at the tool and its margin on what the tool needs (${MARGIN_BAND_TEXT.tight.label}: under ${e(MARGIN_BAND_TEXT.tight.description.replace(/^meets the need with less than /, '').replace(/ to spare$/, ''))} over it).</figcaption></figure>`
  );
}

function bandBadge(band: MarginBand): string {
  const b = MARGIN_BAND_TEXT[band];
  return `<span class="vn-band vn-band-${band}" title="${e(b.description)}">${e(`${b.symbol ? `${b.symbol} ` : ''}${b.label}`)}</span>`;
}

function inletsHtml(r: ReportModel): string {
  if (r.inlets.length === 0) return `<div class="vn-note-box">${e(r.analysisNote ?? 'No inlets.')}</div>`;
  const rows = r.inlets
    .map(
      (i) =>
        `<tr class="${i.critical ? 'vn-row-critical' : ''}" data-inlet="${e(i.name)}">` +
        `<td><strong>${e(i.name)}</strong>${i.room ? `<span class="vn-sub">${e(i.room)}</span>` : ''}${i.kit ? `<span class="vn-sub">${e(i.kit)}</span>` : ''}</td>` +
        `<td class="vn-num"><strong>${e(i.toolVacuum)}</strong></td><td class="vn-num">${e(i.need)}</td>` +
        `<td>${bandBadge(i.band)}<span class="vn-sub">${e(i.margin)}</span></td>` +
        `<td class="vn-num">${e(i.flow)}</td><td class="vn-num">${e(i.toolAirPower)}</td><td class="vn-num">${e(i.inletVacuum)}</td><td class="vn-num">${e(i.hoseLoss)}</td>` +
        `<td>${i.others.length > 0 ? e(i.others.join(', ')) : '<span class="vn-muted">alone</span>'}</td><td class="vn-small">${e(i.method)}</td></tr>`,
    )
    .join('');
  return (
    `<p class="vn-small vn-muted">For each inlet, the set of ${r.summary.operators ?? 'design'} operators (tools working) that leaves its own tool the least vacuum. The critical inlet of the design case is marked at the left edge.</p>` +
    '<div class="vn-table-wrap"><table class="vn-inlets"><thead><tr>' +
    '<th scope="col" class="vn-name-col">Inlet</th><th scope="col" class="vn-num">Tool vacuum</th><th scope="col" class="vn-num">Tool needs</th><th scope="col">Margin</th>' +
    '<th scope="col" class="vn-num">Flow</th><th scope="col" class="vn-num">Air power at tool</th><th scope="col" class="vn-num">Valve vacuum</th><th scope="col" class="vn-num">Hose loss</th>' +
    '<th scope="col" class="vn-set-col">Also open</th><th scope="col">Search</th>' +
    `</tr></thead><tbody>${rows}</tbody></table></div>`
  );
}

function pipesHtml(r: ReportModel): string {
  if (r.pipes.length === 0) return `<div class="vn-note-box">${e(r.analysisNote ?? 'No pipes.')}</div>`;
  const rows = r.pipes
    .map(
      (p) =>
        `<tr data-pipe="${e(p.name)}"><td><strong>${e(p.name)}</strong><span class="vn-sub">${e(p.run)}</span></td>` +
        `<td class="vn-nowrap">${e(p.spec)}<span class="vn-sub">${e(p.material)}</span></td><td class="vn-num">${e(p.size)}<span class="vn-sub">bore ${e(p.insideDiameter)}</span></td>` +
        `<td class="vn-num">${e(p.length)}</td><td>${e(p.orientation)}</td>` +
        `<td class="vn-num">${e(p.minVelocity)}<span class="vn-sub">${p.minVelocityInlet ? `at ${e(p.minVelocityInlet)}` : ''}</span></td>` +
        `<td class="vn-num">${e(p.maxVelocity)}<span class="vn-sub">${p.maxVelocityInlets.length > 0 ? e(p.maxVelocityInlets.join(', ')) : ''}</span></td>` +
        `<td class="vn-num">${e(p.loss)}</td></tr>`,
    )
    .join('');
  return (
    '<p class="vn-small vn-muted">Lowest velocity: one operator working at the served inlet that gives the slowest air, at the upstream end (the carrying check). ' +
    'Highest velocity and loss: the design operators at the served inlets that draw most, tools lifted, at the producer end (the noise and wear check).</p>' +
    '<div class="vn-table-wrap"><table class="vn-pipes"><thead><tr>' +
    '<th scope="col" class="vn-name-col">Pipe</th><th scope="col">Spec</th><th scope="col" class="vn-num">Size</th><th scope="col" class="vn-num">Length</th><th scope="col">Run</th>' +
    '<th scope="col" class="vn-num">Lowest velocity, one operator</th><th scope="col" class="vn-num">Highest velocity, tools lifted</th><th scope="col" class="vn-num">Loss, highest flow</th>' +
    `</tr></thead><tbody>${rows}</tbody></table></div>`
  );
}

function scenariosHtml(r: ReportModel): string {
  const rows = r.scenarios
    .map(
      (s) =>
        `<tr><td><strong>${e(s.name)}</strong></td><td class="vn-num">${e(s.producer)}</td><td>${s.inlets
          .map((i) => `${e(i.name)}${i.state === 'lifted' ? ' <em>(lifted)</em>' : ''}: ${e(i.toolVacuum)} at the tool, ${e(i.flow)}`)
          .join('<br>')}</td></tr>`,
    )
    .join('');
  return (
    '<p class="vn-small vn-muted">The cases the file names, solved as written.</p>' +
    `<div class="vn-table-wrap"><table class="vn-scenarios"><thead><tr><th scope="col">Scenario</th><th scope="col" class="vn-num">Producer</th><th scope="col">Open inlets</th></tr></thead><tbody>${rows}</tbody></table></div>`
  );
}

function codeHtml(code: string, hasPage: boolean): string {
  return hasPage ? `<a href="#rule-${e(code)}"><code>${e(code)}</code></a>` : `<code>${e(code)}</code>`;
}

function findingsHtml(r: ReportModel): string {
  let html = '';
  if (r.findings.length === 0) html += '<p>No findings.</p>';
  else {
    html +=
      '<div class="vn-table-wrap"><table class="vn-findings"><thead><tr><th scope="col">Severity</th><th scope="col">Code</th><th scope="col">Finding</th><th scope="col" class="vn-num">Line</th></tr></thead><tbody>' +
      r.findings
        .map(
          (f) =>
            `<tr data-code="${e(f.code)}"><td><span class="vn-severity vn-severity-${f.severity}">${e(f.severity)}</span></td>` +
            `<td>${codeHtml(f.code, f.hasPage)}${f.title ? `<span class="vn-sub">${e(f.title)}</span>` : ''}</td><td>${e(f.message)}</td><td class="vn-num">${f.line}:${f.column}</td></tr>`,
        )
        .join('') +
      '</tbody></table></div>';
  }
  html += '<h3>Accepted findings</h3>';
  if (r.accepted.length === 0) html += '<p class="vn-muted">The file accepts no findings.</p>';
  else {
    html +=
      '<p class="vn-small vn-muted">Findings the file accepts, with the reason written there. They are not counted above; reviewers should agree with each reason.</p>' +
      '<div class="vn-table-wrap"><table class="vn-accepted"><thead><tr><th scope="col">Code</th><th scope="col">On</th><th scope="col">Reason given</th><th scope="col">The finding</th></tr></thead><tbody>' +
      r.accepted
        .map(
          (a) =>
            `<tr data-code="${e(a.code)}"><td>${codeHtml(a.code, a.hasPage)}${a.title ? `<span class="vn-sub">${e(a.title)}</span>` : ''}</td><td>${e(a.element)}</td><td>\u201c${e(a.reason)}\u201d</td><td class="vn-small">${e(a.message)}</td></tr>`,
        )
        .join('') +
      '</tbody></table></div>';
  }
  if (r.failures.length > 0) {
    html +=
      '<h3>Cases not solved</h3><div class="vn-table-wrap"><table class="vn-failures"><thead><tr><th scope="col">Stage</th><th scope="col">For</th><th scope="col">Cause</th><th scope="col">Message</th></tr></thead><tbody>' +
      r.failures.map((f) => `<tr><td>${e(f.stage)}</td><td>${e(f.subject)}</td><td><code>${e(f.cause)}</code></td><td>${e(f.message)}</td></tr>`).join('') +
      '</tbody></table></div>';
  }
  return html;
}

function materialsHtml(r: ReportModel): string {
  const bom = r.billOfMaterials;
  if (!bom) return `<div class="vn-note-box">${e(r.analysisNote ?? 'No bill of materials.')}</div>`;
  return (
    '<p class="vn-small vn-muted">Quantities as drawn in the file: no allowance for waste, supports, couplings or spares.</p>' +
    bom.groups
      .map(
        (g) =>
          `<div class="vn-table-wrap"><table class="vn-materials"><caption>${e(g.title)}</caption><thead><tr><th scope="col">Item</th><th scope="col">Description</th><th scope="col" class="vn-num">Quantity</th></tr></thead><tbody>` +
          g.rows.map((row) => `<tr><td>${e(row.item)}</td><td>${e(row.description)}</td><td class="vn-num">${e(row.quantity)}</td></tr>`).join('') +
          '</tbody></table></div>',
      )
      .join('')
  );
}

function commissioningHtml(r: ReportModel): string {
  const c = r.commissioning;
  if (!c) return `<div class="vn-note-box">${e(r.analysisNote ?? 'No commissioning predictions.')}</div>`;
  const alone = c.rows.some((row) => row.expectedAlone !== null);
  return (
    '<div class="vn-sheet-head"><div>System</div><div>Tested by</div><div>Date</div><div>Gauge and calibration</div></div>' +
    `<ol class="vn-steps">${c.procedure.map((p) => `<li>${e(p)}</li>`).join('')}</ol>` +
    '<div class="vn-table-wrap"><table class="vn-commissioning"><thead><tr>' +
    '<th scope="col">Inlet</th><th scope="col">Test orifice</th><th scope="col">Orifices also in</th><th scope="col" class="vn-num">Expected at the valve</th>' +
    (alone ? '<th scope="col" class="vn-num">Expected, orifice alone</th>' : '') +
    '<th scope="col" class="vn-field">Field reading</th><th scope="col" class="vn-field">Remarks</th>' +
    '</tr></thead><tbody>' +
    c.rows
      .map(
        (row) =>
          `<tr data-inlet="${e(row.name)}"><td><strong>${e(row.name)}</strong>${row.room ? `<span class="vn-sub">${e(row.room)}</span>` : ''}</td><td class="vn-nowrap">${e(row.orifice)}</td>` +
          `<td>${row.withOrificesIn.length > 0 ? e(row.withOrificesIn.join(', ')) : '<span class="vn-muted">none</span>'}</td><td class="vn-num"><strong>${e(row.expectedGauge)}</strong><span class="vn-sub">${e(row.flow)}</span></td>` +
          (alone ? `<td class="vn-num">${e(row.expectedAlone ?? '\u2013')}</td>` : '') +
          '<td class="vn-field"></td><td class="vn-field"></td></tr>',
      )
      .join('') +
    '</tbody></table></div>'
  );
}

function footerHtml(r: ReportModel): string {
  return (
    `<footer class="vn-footer"><span>${e(r.title)} \u00b7 <code>${e(r.file)}</code></span>` +
    `<span>vacnet ${e(r.version)} \u00b7 ${e(r.generatedAtText)} \u00b7 engineering estimates: see the cautions</span></footer>`
  );
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}
