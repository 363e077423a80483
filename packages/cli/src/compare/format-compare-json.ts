import type { Comparison } from './comparison.js';
import { nothingChanged } from './compare-words.js';

/**
 * The JSON output of `vacnet compare`: the comparison as data, values in SI
 * (keys end with their unit, as in `vacnet check --format json`).
 */
export function toCompareJson(c: Comparison): Record<string, unknown> {
  const side = (s: Comparison['old']) => ({ label: s.label, exists: s.exists, system: s.model?.name ?? null, analysed: s.analysis !== undefined });
  return {
    old: side(c.old),
    new: side(c.new),
    changed: !nothingChanged(c),
    elements: c.elements,
    inlets: c.inlets.map((i) => ({
      name: i.name,
      status: i.status,
      beforeToolVacuumPa: i.beforePa,
      afterToolVacuumPa: i.afterPa,
      changePa: i.beforePa !== null && i.afterPa !== null ? i.afterPa - i.beforePa : null,
      requiredToolVacuumPa: i.requiredPa,
      beforeFlowStdM3PerS: i.flowBeforeStdM3PerS,
      afterFlowStdM3PerS: i.flowAfterStdM3PerS,
      shortBefore: i.shortBefore,
      shortAfter: i.shortAfter,
      regression: i.regression,
    })),
    pipes: c.pipes,
    producer: c.producer,
    findings: c.findings,
    regressions: c.regressions,
  };
}

export function formatCompareJson(c: Comparison): string {
  return JSON.stringify(toCompareJson(c), null, 2) + '\n';
}
