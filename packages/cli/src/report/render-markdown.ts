import { MARGIN_BAND_TEXT, type MarginBand } from './margin-band.js';
import type { ReportModel } from './report-model.js';
import { renderProducerCurveSvg } from './svg/producer-curve.js';
import { renderSchematicSvg } from './svg/schematic.js';

export interface MarkdownOptions {
  /**
   * File name stem for the figures (`report` gives `report.producer-curve.svg`
   * and `report.schematic.svg`, linked relative to the Markdown file). Without
   * it the figures are left out and the text says so.
   */
  figureStem?: string;
  /** Where a rule code's page is, as a link target; null or absent: the code is printed without a link. */
  rulePageHref?: (code: string) => string | null;
}

/** A figure to write beside the Markdown file. */
export interface MarkdownFigure {
  fileName: string;
  svg: string;
}

export interface MarkdownReport {
  markdown: string;
  figures: MarkdownFigure[];
}

/**
 * The report as Markdown for a pull request or a wiki: the same sections as
 * the HTML, as tables and text. Figures are standalone SVG files (with their
 * own styles, on white) written beside the Markdown and linked as images.
 */
export async function renderReportModelMarkdown(r: ReportModel, options: MarkdownOptions = {}): Promise<MarkdownReport> {
  const out: string[] = [];
  const figures: MarkdownFigure[] = [];
  const code = (c: string) => {
    const href = options.rulePageHref?.(c);
    return href ? `[\`${c}\`](${href})` : `\`${c}\``;
  };
  let n = 0;
  const h2 = (title: string) => out.push('', `## ${++n}. ${title}`, '');

  out.push(`# ${cell(r.title)}`, '');
  out.push(`Central vacuum system design report \u00b7 \`${r.file}\` \u00b7 ${r.generatedAtText} \u00b7 vacnet ${r.version} \u00b7 ${r.units === 'si' ? 'SI units' : 'imperial units'}`, '');
  out.push('> [!CAUTION]');
  for (const p of r.cautions.general) out.push(`> - ${p}`);
  if (r.cautions.dust) {
    out.push('', '> [!WARNING]', '> **Combustible dust.**');
    r.cautions.dust.forEach((p, i) => out.push(i === 0 ? `> ${p}` : `>\n> ${p}`));
  }

  h2('Summary');
  const s = r.summary;
  const rows: [string, string][] = [];
  if (s.producer) {
    const p = s.producer;
    rows.push(['Operating point', `${p.flow} at ${p.vacuum} at the inlet of ${p.model} (${p.name})${p.limited ? `; ${p.limited}` : ''}`]);
    rows.push(['Producer margin', `${p.margin}${p.requiredMargin ? `; ${p.requiredMargin} required: **${p.marginMet ? 'met' : 'not met'}**` : ''}`]);
    rows.push(['Power', `air ${p.airPower}${p.shaftPower ? `, shaft ${p.shaftPower}` : ''}`]);
  }
  if (s.worstInlet) {
    const w = s.worstInlet;
    rows.push([
      'Worst inlet',
      `**${w.name}**${w.room ? ` (${w.room})` : ''}: ${w.toolVacuum} at the tool${w.need ? `, needs ${w.need}, ${w.margin}` : ''}; ${w.others.length > 0 ? `with ${w.others.join(', ')} open` : 'alone'}`,
    ]);
  }
  rows.push(['Findings', `${plural(r.counts.errors, 'error')}, ${plural(r.counts.warnings, 'warning')}, ${plural(r.counts.infos, 'info')}; ${r.counts.accepted} accepted with reasons`]);
  out.push(table(['', 'Value'], rows));
  if (r.analysisNote) out.push('', `_${r.analysisNote}_`);

  h2('Design basis');
  out.push(r.designBasis.length > 0 ? table(['', 'Value'], r.designBasis.map((d) => [d.label, d.note ? `${d.value} (${d.note})` : d.value])) : `_${r.analysisNote ?? 'No design basis.'}_`);

  h2('Producer and system demand');
  if (r.curve) {
    if (options.figureStem) {
      const fileName = `${options.figureStem}.producer-curve.svg`;
      figures.push({ fileName, svg: renderProducerCurveSvg(r.curve, r.units, { standalone: true }) });
      out.push(`![Producer curve of ${r.curve.modelName} with the system demand and the operating point](${encodeURI(fileName)})`, '');
    } else out.push('_The plot is in the HTML report; written to a file, the Markdown report links it as an SVG beside it._', '');
    out.push(r.curve.demandCurveNote);
  } else out.push(`_${r.curveNote ?? 'No producer curve.'}_`);

  h2('Network schematic');
  if (r.schematic && options.figureStem) {
    const fileName = `${options.figureStem}.schematic.svg`;
    try {
      figures.push({ fileName, svg: await renderSchematicSvg(r.schematic, { standalone: true }) });
      out.push(`![Network schematic: each inlet with its worst-case vacuum at the tool and its margin on need](${encodeURI(fileName)})`);
    } catch (error) {
      out.push(`_The schematic could not be laid out: ${error instanceof Error ? error.message : String(error)}_`);
    }
  } else out.push(r.schematic ? '_The schematic is in the HTML report; written to a file, the Markdown report links it as an SVG beside it._' : `_${r.analysisNote ?? 'No schematic.'}_`);

  h2('Inlets in their worst case');
  if (r.inlets.length > 0) {
    out.push(
      table(
        ['Inlet', 'Room', 'Vacuum at the tool', 'Tool needs', 'Margin', 'Flow', 'Air power at the tool', 'Vacuum at the valve', 'Hose loss', 'Also open', 'Search'],
        r.inlets.map((i) => [
          i.critical ? `**${i.name}** (critical)` : i.name,
          i.room,
          i.toolVacuum,
          i.need,
          `${bandWord(i.band)} ${i.margin}`,
          i.flow,
          i.toolAirPower,
          i.inletVacuum,
          i.hoseLoss,
          i.others.join(', ') || 'alone',
          i.method,
        ]),
        [false, false, true, true, false, true, true, true, true, false, false],
      ),
    );
  } else out.push(`_${r.analysisNote ?? 'No inlets.'}_`);

  h2('Pipes');
  if (r.pipes.length > 0) {
    out.push(
      table(
        ['Pipe', 'Spec', 'Size', 'Length', 'Run', 'Lowest velocity, one operator', 'at', 'Highest velocity, tools lifted', 'Loss at highest flow'],
        r.pipes.map((p) => [p.name, p.spec, p.size, p.length, p.orientation, p.minVelocity, p.minVelocityInlet, p.maxVelocity, p.loss]),
        [false, false, true, true, false, true, false, true, true],
      ),
    );
  } else out.push(`_${r.analysisNote ?? 'No pipes.'}_`);

  if (r.scenarios.length > 0) {
    h2('Named scenarios');
    out.push(
      table(
        ['Scenario', 'Producer', 'Open inlets'],
        r.scenarios.map((sc) => [sc.name, sc.producer, sc.inlets.map((i) => `${i.name}${i.state === 'lifted' ? ' (lifted)' : ''}: ${i.toolVacuum}, ${i.flow}`).join('; ')]),
      ),
    );
  }

  h2('Findings');
  out.push(
    r.findings.length > 0
      ? table(
          ['Severity', 'Code', 'Finding', 'Line'],
          r.findings.map((f) => [f.severity, code(f.code), f.message, `${f.line}:${f.column}`]),
        )
      : 'No findings.',
  );
  out.push('', '### Accepted findings', '');
  out.push(r.accepted.length > 0 ? table(['Code', 'On', 'Reason given'], r.accepted.map((a) => [code(a.code), a.element, `\u201c${a.reason}\u201d`])) : 'The file accepts no findings.');
  if (r.failures.length > 0) {
    out.push('', '### Cases not solved', '');
    out.push(table(['Stage', 'For', 'Cause', 'Message'], r.failures.map((f) => [f.stage, f.subject, `\`${f.cause}\``, f.message])));
  }

  h2('Bill of materials');
  if (r.billOfMaterials) {
    for (const g of r.billOfMaterials.groups) {
      out.push(`**${g.title}**`, '', table(['Item', 'Description', 'Quantity'], g.rows.map((row) => [row.item, row.description, row.quantity]), [false, false, true]), '');
    }
  } else out.push(`_${r.analysisNote ?? 'No bill of materials.'}_`);

  h2('Commissioning test sheet');
  if (r.commissioning) {
    const c = r.commissioning;
    c.procedure.forEach((p, i) => out.push(`${i + 1}. ${p}`));
    out.push(
      '',
      table(
        ['Inlet', 'Test orifice', 'Orifices also in', 'Expected at the valve', 'Field reading', 'Remarks'],
        c.rows.map((row) => [row.name, row.orifice, row.withOrificesIn.join(', ') || 'none', row.expectedGauge, ' ', ' ']),
        [false, false, false, true, false, false],
      ),
    );
  } else out.push(`_${r.analysisNote ?? 'No commissioning predictions.'}_`);

  out.push('', '---', '', `_Made with vacnet ${r.version} from \`${r.file}\` on ${r.generatedAtText}. Engineering estimates: see the cautions above._`, '');
  return { markdown: out.join('\n'), figures };
}

function bandWord(band: MarginBand): string {
  const b = MARGIN_BAND_TEXT[band];
  return b.symbol ? `${b.label} (${b.symbol})` : b.label;
}

/** A Markdown table; `right` marks the columns to align right. */
function table(header: string[], rows: string[][], right: boolean[] = []): string {
  const line = (cells: string[]) => `| ${cells.map(cell).join(' | ')} |`;
  const rule = `|${header.map((_, i) => (right[i] ? ' ---: ' : ' --- ')).join('|')}|`;
  return [line(header), rule, ...rows.map(line)].join('\n');
}

/** A table cell on one line, its pipes escaped. */
function cell(text: string): string {
  return text.replace(/\s*[\r\n]+\s*/g, ' ').replace(/\|/g, '\\|');
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}
