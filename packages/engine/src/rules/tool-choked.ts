/**
 * A tool running choked: the vacuum at the hose end is past the critical
 * pressure ratio of nozzle flow (0.5283 of the air pressure for kappa 1.4;
 * Shapiro 1953, ch. 4), so the air through the tool is sonic and its flow
 * is the critical flow, fixed by the room side alone. A physical state, not
 * a failed solve (ENGINEERING.md asks for a diagnostic): more vacuum passes
 * no more air, and what the producer gives beyond it is spent as noise at
 * the tool. At such vacuum a hose or tool can trap a hand.
 */
import type { Finding } from '../network/model.js';
import { CRITICAL_PRESSURE_RATIO } from '../elements/tool-law.js';
import type { InletPoint, WorstCase } from '../analysis/analysis-types.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatPressure } from './rule-format.js';

export const toolChoked: Rule = {
  code: 'tool-choked',
  title: 'Tool running choked (sonic)',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: true,
  check(model, analysis) {
    if (!analysis) return [];
    const units = model.displayUnits ?? 'imperial';
    const critical = (1 - CRITICAL_PRESSURE_RATIO) * (analysis.ambient?.pressurePa ?? 0);
    const findings: Finding[] = [];
    for (const inlet of analysis.inlets ?? []) {
      // The case with the most vacuum at the tool that runs choked: the operator alone first.
      const cases: { point: InletPoint | WorstCase | null; words: string }[] = [
        { point: inlet.alone, words: 'with its operator alone' },
        { point: inlet.worstCase, words: 'in its worst case' },
      ];
      const hit = cases.find((c) => c.point?.limited === 'choked');
      if (!hit || !hit.point) continue;
      findings.push(
        ruleFinding(
          toolChoked,
          { kind: 'inlet', name: inlet.name, property: 'tool' },
          `The tool at inlet '${inlet.name}' runs choked (sonic) ${hit.words}: ${formatPressure(hit.point.toolVacuumPa, units)} at the hose end is past the critical ${formatPressure(critical, units)}, so it passes no more air however much more vacuum it gets, and the rest is spent as noise at the tool. ` +
            `Check that the tool is rated for this vacuum, or hold the vacuum lower (a vacuum relief set below ${formatPressure(critical, units)}, or a producer of lower vacuum). ` +
            'At this vacuum a hose or tool can trap a hand: follow the maker\'s data and local codes.',
          { fix: { toolVacuumPa: hit.point.toolVacuumPa, criticalVacuumPa: critical } },
        ),
      );
    }
    return findings;
  },
};
