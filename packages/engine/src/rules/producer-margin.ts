/**
 * The producer meets the demand but with less margin than the design basis
 * asks: filters load, hoses wear and leaks grow, so a producer sized to the
 * exact demand soon falls short.
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatPercentApart } from './rule-format.js';
import { demandWords } from './producer-short.js';

export const producerMargin: Rule = {
  code: 'producer-margin',
  title: 'Producer margin below the required share',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'minMargin',
      dimension: 'fraction',
      // 10 % flow margin over the demand: common practice (the file's `margin` line overrides).
      default: 0.1,
      source: 'common practice; the design basis margin line sets it per system',
      description: 'Flow the producer curve must give over the demand, at the demand vacuum, as a share of it.',
      range: [0, 10],
    },
  ],
  needsAnalysis: true,
  check(model, analysis, settings) {
    if (!analysis) return [];
    const units = model.displayUnits ?? 'imperial';
    const required = settings.value('minMargin', undefined, model.design?.producerMarginFraction);
    const findings: Finding[] = [];
    for (const p of analysis.producers ?? []) {
      const m = p.marginFraction;
      // Below zero is producer-short's finding.
      if (m === null || m < 0 || m >= required) continue;
      const shown = formatPercentApart(m, required);
      findings.push(
        ruleFinding(
          producerMargin,
          { kind: 'producer', name: p.name, property: 'model' },
          `Producer '${p.name}' has ${shown[0]} margin over the demand, below the ${shown[1]} required: ${demandWords(p, units)}. As filters load and hoses wear it will fall short; choose the next larger producer or lower the demand.`,
          { fix: { marginFraction: m, requiredMarginFraction: required, demand: p.demand } },
        ),
      );
    }
    return findings;
  },
};
