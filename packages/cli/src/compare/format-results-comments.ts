import { formatQuantity, type UnitSystem } from '@vacnet/engine';
import type { ComparedSide } from './comparison.js';

/** The line that separates a file's text from the results appended to it. */
export const RESULTS_HEADER = '// ---- vacnet: computed results (not part of the file) ----';

/**
 * A file's text followed by its computed results as `//` comment lines:
 * the producer's operating point, each inlet's worst case, each pipe's
 * lowest and highest velocity, and the findings. One line per element, so
 * `git diff` of two versions shows how each result moved beside the lines
 * that moved it. Numbers have three significant digits, so only changes a
 * reader would notice show up in a diff.
 */
export function formatResultsComments(text: string, side: ComparedSide, note?: string): string {
  const units: UnitSystem = side.model?.displayUnits ?? 'imperial';
  const v = (pa: number) => formatQuantity(pa, 'pressure', units, 3);
  const q = (m3s: number) => formatQuantity(m3s, 'flow', units, 3, { flowBasis: 'standard' });
  const lines: string[] = [RESULTS_HEADER];
  if (note) lines.push(`// ${note}`);
  const analysis = side.analysis;
  if (!analysis) {
    lines.push('// not analysed: see the findings below');
  } else {
    const p = analysis.producer;
    if (p) {
      const margin = p.marginFraction === null ? 'margin unknown' : `margin ${Math.round(p.marginFraction * 100)} %`;
      lines.push(`// producer ${p.name}: ${q(p.flowStdM3PerS)} at ${v(p.vacuumPa)}, ${margin}`);
    } else {
      lines.push('// producer: no operating point');
    }
    for (const inlet of analysis.inlets) {
      const wc = inlet.worstCase;
      if (!wc) {
        lines.push(`// inlet ${inlet.name}: worst case not computed`);
        continue;
      }
      const need = wc.requiredToolVacuumPa === null ? '' : ` (needs ${v(wc.requiredToolVacuumPa)}${wc.toolVacuumPa < wc.requiredToolVacuumPa ? ', SHORT' : ''})`;
      lines.push(`// inlet ${inlet.name}: ${v(wc.toolVacuumPa)} at the tool in its worst case${need}, ${q(wc.flowStdM3PerS)}`);
    }
    for (const pipe of analysis.pipes) {
      const low = pipe.minVelocityMPerS === null ? 'n/a' : formatQuantity(pipe.minVelocityMPerS, 'velocity', units, 3);
      const high = pipe.maxVelocityMPerS === null ? 'n/a' : formatQuantity(pipe.maxVelocityMPerS, 'velocity', units, 3);
      lines.push(`// pipe ${pipe.name}: ${low} with one operator, ${high} at most`);
    }
  }
  for (const d of side.diagnostics) {
    const element = (d.data as { element?: { kind?: string; name?: string } } | undefined)?.element;
    const where = element?.kind && element.name ? `${element.kind} ${element.name}` : `line ${d.range.start.line + 1}`;
    lines.push(`// ${d.severity} ${d.code} (${where}): ${d.message.replace(/\s*[\r\n]+\s*/g, ' ')}`);
  }
  for (const a of side.accepted) {
    lines.push(`// accepted ${a.finding.code} (${a.finding.element.kind} ${a.finding.element.name}): "${a.reason}"`);
  }
  const body = text.endsWith('\n') || text === '' ? text : `${text}\n`;
  return `${body}${lines.join('\n')}\n`;
}
