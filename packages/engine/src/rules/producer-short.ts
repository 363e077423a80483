/**
 * The producer cannot deliver the demand: at the vacuum the design case
 * needs, its curve gives less flow than the system draws (negative margin),
 * the case runs past the end of the curve, or no operating point exists.
 */
import type { Finding } from '../network/model.js';
import type { ProducerPoint } from '../analysis/analysis-types.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatFlow, formatPercent, formatPressure } from './rule-format.js';

/** "demand X at Y; the curve gives Z there" for a producer point with a demand. */
export function demandWords(p: ProducerPoint, units: 'imperial' | 'si'): string {
  if (!p.demand || p.marginFraction === null) return '';
  const curveFlow = p.demand.flowStdM3PerS * (1 + p.marginFraction);
  return `the design case needs ${formatFlow(p.demand.flowStdM3PerS, units)} at ${formatPressure(p.demand.vacuumPa, units)}, where its curve gives ${formatFlow(curveFlow, units)} (margin ${formatPercent(p.marginFraction)})`;
}

/** Analysis stages whose cases are the design operators with tools working. */
const DESIGN_STAGES = new Set(['single-operator', 'worst-case', 'design', 'demand']);

export const producerShort: Rule = {
  code: 'producer-short',
  title: 'Producer cannot deliver the demand',
  defaultSeverity: 'error',
  parameters: [],
  needsAnalysis: true,
  check(model, analysis) {
    if (!analysis) return [];
    const units = model.displayUnits ?? 'imperial';
    const advice = 'Choose a larger producer, or lower the demand: larger pipes, shorter hoses, or fewer design operators.';
    const findings: Finding[] = [];
    const reported = new Set<string>();
    for (const p of analysis.producers ?? []) {
      let why: string | undefined;
      if (p.marginFraction !== null && p.marginFraction < 0) why = demandWords(p, units);
      else if (p.limited === 'curve-end') why = `the design case runs past the end of its curve (${formatFlow(p.flowStdM3PerS, units)} at ${formatPressure(p.vacuumPa, units)})`;
      if (!why) continue;
      reported.add(p.name);
      findings.push(
        ruleFinding(producerShort, { kind: 'producer', name: p.name, property: 'model' }, `Producer '${p.name}' cannot deliver the demand: ${why}. ${advice}`, {
          fix: { marginFraction: p.marginFraction, demand: p.demand },
        }),
      );
    }
    // Design cases (tools working: one operator, the worst sets, the design
    // case, the demand search) the producer cannot serve. Other cases (named
    // scenarios, test-orifice readings) stay unsolved cases of their own; the
    // lifted-tool velocity case never fails this way (it is extrapolated).
    for (const f of analysis.failures ?? []) {
      if (f.cause !== 'infeasible-demand' || !DESIGN_STAGES.has(f.stage)) continue;
      const name = f.element?.kind === 'producer' ? f.element.name : (model.producers?.[0]?.name ?? model.name);
      if (reported.has(name)) continue;
      reported.add(name);
      const kind = f.element?.kind === 'producer' || model.producers?.length ? 'producer' : 'system';
      findings.push(
        ruleFinding(
          producerShort,
          { kind, name, ...(kind === 'producer' ? { property: 'model' } : {}) },
          `${kind === 'producer' ? `Producer '${name}'` : 'The producer'} cannot deliver the demand: with ${f.openInlets.map((n) => `'${n}'`).join(', ') || 'the design inlets'} open ${f.stage === 'demand' ? f.message : `there is no operating point (${f.message})`}. ${advice}`,
          { related: f.openInlets.map((n) => ({ element: { kind: 'inlet' as const, name: n }, message: 'open in the case that failed' })) },
        ),
      );
    }
    return findings;
  },
};
