import { formatQuantity, formatSignificant, fromSI, type UnitSystem } from '@vacnet/engine';
import type { Comparison, ElementChange, InletMove, PipeMove, ProducerPointSummary, PropertyChange } from './comparison.js';
import { VACUUM_TOLERANCE_PA } from './comparison.js';

/** Shared wording of the compare outputs: units, element labels, summary lines. */

/** The units results are shown in: the new side's display units, else the old side's. */
export function unitsOf(c: Comparison): UnitSystem {
  return c.new.model?.displayUnits ?? c.old.model?.displayUnits ?? 'imperial';
}

export function vacuum(pa: number | null, units: UnitSystem): string {
  return pa === null ? '-' : formatQuantity(pa, 'pressure', units, 3);
}

/** `+0.12 inHg`, `-0.40 inHg`, `0` inside the tolerance. */
export function signedVacuum(deltaPa: number, units: UnitSystem): string {
  if (Math.abs(deltaPa) <= VACUUM_TOLERANCE_PA) return '0';
  const shown = fromSI(Math.abs(deltaPa), 'pressure', units);
  return `${deltaPa > 0 ? '+' : '-'}${formatSignificant(shown.value, 2)} ${shown.unit}`;
}

export function velocity(mPerS: number | null, units: UnitSystem): string {
  return mPerS === null ? '-' : formatQuantity(mPerS, 'velocity', units, 3);
}

export function flow(m3PerS: number, units: UnitSystem): string {
  return formatQuantity(m3PerS, 'flow', units, 3, { flowBasis: 'standard' });
}

export function producerPoint(p: ProducerPointSummary | null, units: UnitSystem): string {
  if (!p) return 'no operating point';
  const margin = p.marginFraction === null ? 'margin unknown' : `margin ${Math.round(p.marginFraction * 100)} %`;
  return `${flow(p.flowStdM3PerS, units)} at ${vacuum(p.vacuumPa, units)}, ${margin}`;
}

/** Whether the producer's point moved (flow by 0.1 %, vacuum by the vacuum tolerance, margin by a point). */
export function producerMoved(c: Comparison): boolean {
  const { before, after } = c.producer;
  if (!before || !after) return before !== after;
  return (
    before.name !== after.name ||
    Math.abs(before.flowStdM3PerS - after.flowStdM3PerS) > 1e-3 * Math.max(before.flowStdM3PerS, 1e-9) ||
    Math.abs(before.vacuumPa - after.vacuumPa) > VACUUM_TOLERANCE_PA ||
    Math.round((before.marginFraction ?? 0) * 100) !== Math.round((after.marginFraction ?? 0) * 100)
  );
}

/** How an element is named to people: `pipe riser`, `operators`, `rule fast-velocity limit`, `use "catalog.vacnet"`. */
export function elementLabel(e: Pick<ElementChange, 'kind' | 'name'>): string {
  switch (e.kind) {
    case 'design':
      return e.name;
    case 'system':
      return 'system title';
    case 'use':
      return `use "${e.name}"`;
    case 'cleanout':
      return `cleanout ${e.name}`;
    default:
      return `${e.kind} ${e.name}`;
  }
}

/** `size 3 in -> 2-1/2 in`, `added bend 90 deg`, `removed reducer`. */
export function propertyChange(p: PropertyChange): string {
  if (p.before === undefined) return `added ${p.after}`;
  if (p.after === undefined) return `removed ${p.before}`;
  const a = p.before.split(' ');
  const b = p.after.split(' ');
  let common = 0;
  while (common < a.length - 1 && common < b.length - 1 && a[common] === b[common]) common++;
  const head = a.slice(0, common).join(' ');
  return `${head ? `${head} ` : ''}${a.slice(common).join(' ')} -> ${b.slice(common).join(' ')}`;
}

/** One line per element change, without a leading verb column. */
export function elementChangeText(e: ElementChange): string {
  if (e.change === 'changed') return `${elementLabel(e)}: ${(e.properties ?? []).map(propertyChange).join('; ')}`;
  const detail = e.kind === 'design' || e.kind === 'rule' || e.kind === 'use' || e.kind === 'cleanout' ? '' : e.text ? `: ${e.text}` : '';
  return `${elementLabel(e)}${detail}`;
}

export function inletNote(i: InletMove, units: UnitSystem): string {
  if (i.status === 'removed') return 'removed';
  if (i.shortAfter && i.afterPa !== null && i.requiredPa !== null) return `short by ${vacuum(i.requiredPa - i.afterPa, units)}${i.regression ? ' (regression)' : ''}`;
  return '';
}

export function inletChange(i: InletMove, units: UnitSystem): string {
  if (i.status === 'added') return 'new';
  if (i.status === 'removed') return 'removed';
  if (i.beforePa === null || i.afterPa === null) return '-';
  return signedVacuum(i.afterPa - i.beforePa, units);
}

export function pipeCrossing(p: PipeMove, units: UnitSystem): string {
  const direction = p.slowAfter ? 'now too slow to carry debris with one operator' : 'now fast enough to carry debris with one operator';
  return `${velocity(p.beforeMinVelocityMPerS, units)} -> ${velocity(p.afterMinVelocityMPerS, units)}, ${direction}`;
}

export function count(n: number, noun: string, plural = `${noun}s`): string {
  return `${n} ${n === 1 ? noun : plural}`;
}

/** True when nothing differs: no element changed and every result stayed put. */
export function nothingChanged(c: Comparison): boolean {
  return (
    c.elements.length === 0 &&
    c.inlets.every((i) => i.status === 'same') &&
    !c.pipes.some((p) => p.crossed) &&
    !producerMoved(c) &&
    c.findings.new.length === 0 &&
    c.findings.resolved.length === 0
  );
}

/** `2 elements changed, 1 added, 0 removed`. */
export function elementCounts(c: Comparison): string {
  const n = (kind: ElementChange['change']) => c.elements.filter((e) => e.change === kind).length;
  return `${count(n('changed'), 'element')} changed, ${n('added')} added, ${n('removed')} removed`;
}

/** The inlet left with least vacuum over its need, after the change. */
export function worstInletAfter(c: Comparison): InletMove | undefined {
  let worst: InletMove | undefined;
  let score = Infinity;
  for (const i of c.inlets) {
    if (i.afterPa === null) continue;
    const s = i.afterPa - (i.requiredPa ?? 0);
    if (s < score) {
      score = s;
      worst = i;
    }
  }
  return worst;
}
