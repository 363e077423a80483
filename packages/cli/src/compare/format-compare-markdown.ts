import type { Comparison, InletMove } from './comparison.js';
import {
  elementChangeText,
  elementCounts,
  inletChange,
  inletNote,
  nothingChanged,
  pipeCrossing,
  producerMoved,
  producerPoint,
  signedVacuum,
  unitsOf,
  vacuum,
  worstInletAfter,
} from './compare-words.js';


/**
 * The Markdown output of `vacnet compare`, for a pull-request comment: a
 * one-line summary, then tables of the element changes, the inlets whose
 * worst-case vacuum moved (the unchanged ones folded away, so a long
 * system stays readable), pipes that crossed
 * the carrying velocity, the producer, and the findings new and resolved.
 */
export function formatCompareMarkdown(c: Comparison): string {
  const units = unitsOf(c);
  const out: string[] = [];
  const system = c.new.model?.name ?? c.old.model?.name;
  out.push(`### vacnet compare: ${code(c.old.label)} → ${code(c.new.label)}${system ? ` (${escape(system)})` : ''}`, '');
  out.push(summaryLine(c), '');
  if (nothingChanged(c)) return out.join('\n');

  if (c.elements.length > 0) {
    out.push(`#### Elements: ${elementCounts(c)}`, '', '| change | element |', '|---|---|');
    for (const e of c.elements) out.push(`| ${e.change} | ${escape(elementChangeText(e))} |`);
    out.push('');
  }

  const analysed = c.inlets.filter((i) => i.beforePa !== null || i.afterPa !== null);
  const moved = analysed.filter((i) => i.status !== 'same');
  const still = analysed.filter((i) => i.status === 'same');
  if (analysed.length > 0) {
    out.push('#### Worst-case vacuum at each inlet\'s tool', '');
    if (moved.length > 0) out.push(...inletTable(moved, c), '');
    else out.push('No inlet moved.', '');
    if (still.length > 0) {
      out.push(`<details><summary>${still.length} inlet${still.length === 1 ? '' : 's'} unchanged</summary>`, '', ...inletTable(still, c), '', '</details>', '');
    }
  }

  const crossed = c.pipes.filter((p) => p.crossed);
  if (crossed.length > 0) {
    out.push('#### Pipes that crossed the carrying velocity', '', '| pipe | lowest velocity, one operator |', '|---|---|');
    for (const p of crossed) out.push(`| ${escape(p.name)} | ${escape(pipeCrossing(p, units))} |`);
    out.push('');
  }

  if (producerMoved(c)) {
    const name = c.producer.after?.name ?? c.producer.before?.name ?? 'producer';
    out.push(`#### Producer ${escape(name)}`, '', '| | operating point |', '|---|---|');
    out.push(`| before | ${escape(producerPoint(c.producer.before, units))} |`, `| after | ${escape(producerPoint(c.producer.after, units))} |`, '');
  }

  const { new: added, resolved } = c.findings;
  if (added.length + resolved.length > 0) {
    out.push(`#### Findings: ${added.length} new, ${resolved.length} resolved`, '', '| | severity | code | where | message |', '|---|---|---|---|---|');
    for (const f of added) out.push(`| new | ${f.severity} | ${code(f.code)} | ${escape(f.where)} | ${escape(f.message)} |`);
    for (const f of resolved) out.push(`| resolved | ${f.severity} | ${code(f.code)} | ${escape(f.where)} | ${escape(f.message)} |`);
    out.push('');
  }

  if (c.regressions.length > 0) {
    out.push('#### Regressions', '');
    for (const r of c.regressions) out.push(`- ${escape(r)}`);
    out.push('');
  }
  return out.join('\n');
}

function summaryLine(c: Comparison): string {
  if (nothingChanged(c)) return '**No change**: the same elements with the same properties, and the same results.';
  const units = unitsOf(c);
  const parts = [elementCounts(c)];
  const worst = worstInletAfter(c);
  if (worst && worst.afterPa !== null) {
    const need = worst.requiredPa === null ? '' : `, needs ${vacuum(worst.requiredPa, units)}`;
    const move = worst.beforePa === null ? 'new' : `${vacuum(worst.beforePa, units)} → ${vacuum(worst.afterPa, units)}`;
    parts.push(`worst inlet ${escape(worst.name)} ${worst.beforePa === null ? `${vacuum(worst.afterPa, units)} (new)` : move}${need}`);
  }
  const worse = c.inlets.filter((i) => i.status === 'worse').length;
  const better = c.inlets.filter((i) => i.status === 'better').length;
  if (worse + better > 0) parts.push(`${better} inlet${better === 1 ? '' : 's'} better, ${worse} worse`);
  const errors = c.findings.new.filter((f) => f.severity === 'error').length;
  if (c.findings.new.length + c.findings.resolved.length > 0) parts.push(`${c.findings.new.length} new finding${c.findings.new.length === 1 ? '' : 's'}${errors > 0 ? ` (${errors} error${errors === 1 ? '' : 's'})` : ''}, ${c.findings.resolved.length} resolved`);
  const verdict = c.regressions.length === 0 ? '**No regressions.**' : `**${c.regressions.length} regression${c.regressions.length === 1 ? '' : 's'}.**`;
  return `${verdict} ${parts.join('; ')}.`;
}

function inletTable(inlets: InletMove[], c: Comparison): string[] {
  const units = unitsOf(c);
  const rows = ['| inlet | before | after | change | needs | |', '|---|---:|---:|---:|---:|---|'];
  for (const i of inlets) {
    const note = inletNote(i, units);
    const mark = i.regression ? '❌ ' : i.shortAfter ? '⚠️ ' : '';
    const change = i.beforePa !== null && i.afterPa !== null ? signedVacuum(i.afterPa - i.beforePa, units) : inletChange(i, units);
    rows.push(`| ${escape(i.name)} | ${vacuum(i.beforePa, units)} | ${vacuum(i.afterPa, units)} | ${change} | ${vacuum(i.requiredPa, units)} | ${mark}${escape(note)} |`);
  }
  return rows;
}

function code(text: string): string {
  return `\`${text.replace(/`/g, "'")}\``;
}

/** Escapes what would break a table cell or start Markdown markup. */
function escape(text: string): string {
  return text
    .replace(/\s*[\r\n]+\s*/g, ' ')
    .replace(/([\\`*_[\]<|])/g, '\\$1');
}
