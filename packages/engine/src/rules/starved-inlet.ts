/**
 * A starved inlet: in its worst case (the set of design operators, itself
 * included, that leaves it the least vacuum) the tool gets less vacuum at
 * the hose end than it needs, so it will not clean.
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatPressure } from './rule-format.js';

/** Inch of water at 39.2 F, Pa (NIST SP 811). */
const INH2O_PA = 249.082;

/** Need assumed when neither the tool nor the design basis states one. */
export const DEFAULT_TOOL_NEED_PA = 40 * INH2O_PA;

export const starvedInlet: Rule = {
  code: 'starved-inlet',
  title: 'Tool vacuum below its need in the worst case',
  defaultSeverity: 'error',
  parameters: [
    {
      name: 'requiredVacuum',
      dimension: 'pressure',
      // 40 inH2O (about 2.9 inHg) at the hose end: from memory, a usual floor-tool figure.
      default: DEFAULT_TOOL_NEED_PA,
      source: 'from memory: about 40 inH2O at the hose end for a floor tool; state the tool\'s own need in the file',
      description: 'Vacuum a tool needs at the hose end; a setting overrides the tool kind (default: the tool kind, the design default, then this).',
      range: [0, 101325],
    },
  ],
  needsAnalysis: true,
  check(model, analysis, settings) {
    if (!analysis) return [];
    const units = model.displayUnits ?? 'imperial';
    const findings: Finding[] = [];
    for (const inlet of model.inlets ?? []) {
      const wc = analysis.inlets?.find((i) => i.name === inlet.name)?.worstCase;
      if (!wc || !Number.isFinite(wc.toolVacuumPa)) continue;
      const stated = wc.requiredToolVacuumPa ?? undefined;
      const need = settings.value('requiredVacuum', inlet.rules, stated);
      if (!(wc.toolVacuumPa < need)) continue;
      const others = (wc.openInlets ?? []).filter((n) => n !== inlet.name);
      const assumed = stated === undefined ? ` (the tool kind states no need; this is the rule's value)` : '';
      const company = others.length > 0 ? ` with ${others.map((n) => `'${n}'`).join(', ')} also open` : ' working alone';
      const hoseShare = wc.inletVacuumPa > 0 ? wc.hoseLossPa / wc.inletVacuumPa : 0;
      // Point at the larger restriction: the hose when it takes over half the valve vacuum (common practice).
      const advice =
        hoseShare > 0.5
          ? `The hose loses ${formatPressure(wc.hoseLossPa, units)} of the ${formatPressure(wc.inletVacuumPa, units)} at the valve: a shorter or larger hose helps most; otherwise enlarge the pipes on its path or choose a larger producer.`
          : 'Enlarge the pipes on its path to the producer, shorten its hose, or choose a larger producer.';
      findings.push(
        ruleFinding(
          starvedInlet,
          { kind: 'inlet', name: inlet.name, property: 'name' },
          `The tool at inlet '${inlet.name}' gets ${formatPressure(wc.toolVacuumPa, units)} at the hose end in its worst case${company}, below the ${formatPressure(need, units)} it needs${assumed}: short by ${formatPressure(need - wc.toolVacuumPa, units)}. ${advice}`,
          {
            related: others.map((name) => ({ element: { kind: 'inlet' as const, name }, message: `open in the worst case for '${inlet.name}'` })),
            fix: {
              toolVacuumPa: wc.toolVacuumPa,
              requiredToolVacuumPa: need,
              shortfallPa: need - wc.toolVacuumPa,
              openInlets: wc.openInlets ?? [],
            },
          },
        ),
      );
    }
    return findings;
  },
};
