import type { Comparison } from './comparison.js';
import {
  count,
  elementChangeText,
  elementCounts,
  inletChange,
  inletNote,
  nothingChanged,
  pipeCrossing,
  producerMoved,
  producerPoint,
  unitsOf,
  vacuum,
} from './compare-words.js';

/** The text output of `vacnet compare`: what changed in the file, then how the results moved. */
export function formatCompareText(c: Comparison): string {
  const units = unitsOf(c);
  const lines: string[] = [];
  const system = c.new.model?.name ?? c.old.model?.name;
  lines.push(`Comparing ${c.old.label} -> ${c.new.label}${system ? ` ("${system}")` : ''}`);
  if (!c.old.exists) lines.push(`  ${c.old.label} does not exist: everything in the new file is added.`);
  if (!c.new.exists) lines.push(`  ${c.new.label} does not exist: everything in the old file is removed.`);
  if (nothingChanged(c)) {
    lines.push('', 'No change: the same elements with the same properties, and the same results.');
    return lines.join('\n') + '\n';
  }

  lines.push('', `Elements: ${elementCounts(c)}`);
  for (const e of c.elements) lines.push(`  ${e.change.padEnd(7)} ${elementChangeText(e)}`);

  const analysed = c.inlets.filter((i) => i.beforePa !== null || i.afterPa !== null);
  if (analysed.length > 0) {
    lines.push('', 'Worst-case vacuum at each inlet\'s tool:');
    const rows = [['inlet', 'before', 'after', 'change', 'needs', ''], ...analysed.map((i) => [i.name, vacuum(i.beforePa, units), vacuum(i.afterPa, units), inletChange(i, units), vacuum(i.requiredPa, units), inletNote(i, units)])];
    lines.push(...table(rows).map((row) => `  ${row}`));
  } else if (c.inlets.length > 0) {
    lines.push('', 'Inlets: not analysed on either side (see the findings).');
  }

  const crossed = c.pipes.filter((p) => p.crossed);
  if (crossed.length > 0) {
    lines.push('', 'Pipes that crossed the carrying velocity:');
    for (const p of crossed) lines.push(`  ${p.name}: ${pipeCrossing(p, units)}`);
  }

  if (producerMoved(c)) {
    const name = c.producer.after?.name ?? c.producer.before?.name ?? 'producer';
    lines.push('', `Producer ${name}: ${producerPoint(c.producer.before, units)} -> ${producerPoint(c.producer.after, units)}`);
  }

  const { new: added, resolved } = c.findings;
  if (added.length + resolved.length > 0) {
    lines.push('', `Findings: ${added.length} new, ${resolved.length} resolved`);
    for (const f of added) lines.push(`  new      ${f.severity} ${f.code} (${f.where}): ${oneLine(f.message)}`);
    for (const f of resolved) lines.push(`  resolved ${f.severity} ${f.code} (${f.where}): ${oneLine(f.message)}`);
  }

  lines.push('', c.regressions.length === 0 ? 'No regressions.' : `${count(c.regressions.length, 'regression')}:`);
  for (const r of c.regressions) lines.push(`  ${r}`);
  return lines.join('\n') + '\n';
}

/** Columns padded to their widest cell; trailing spaces trimmed. */
function table(rows: string[][]): string[] {
  const widths = rows[0]!.map((_, i) => Math.max(...rows.map((r) => r[i]!.length)));
  return rows.map((r) => r.map((cell, i) => cell.padEnd(widths[i]!)).join('  ').trimEnd());
}

function oneLine(text: string): string {
  return text.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}
