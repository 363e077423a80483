/**
 * Velocity too high: with all design operators open at the inlets that draw
 * most and their tools lifted, air through a small pipe gets loud and debris
 * wears through bends. The analysis gives each pipe's highest velocity at its
 * producer-side end.
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatDiameter, formatVelocity } from './rule-format.js';
import { sizeOptions, velocityAtBore } from './pipe-resize.js';
import { createRuleSettings } from './rule-settings.js';
import { carryingThreshold, slowCarryingVelocity } from './slow-carrying-velocity.js';

export const fastVelocity: Rule = {
  code: 'fast-velocity',
  title: 'Velocity above the noise and wear limit',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'limit',
      dimension: 'velocity',
      // 40 m/s (about 7900 fpm): common practice for noise and wear; no
      // published limit for vacuum cleaning piping is known to us.
      default: 40,
      source: 'common practice (about 7900 fpm); no published limit for vacuum cleaning piping',
      description: 'Highest velocity with all design operators, tools lifted.',
      range: [0, 340],
    },
  ],
  needsAnalysis: true,
  check(model, analysis, settings) {
    if (!analysis) return [];
    const units = model.displayUnits ?? 'imperial';
    const carrying = createRuleSettings(slowCarryingVelocity, model);
    const findings: Finding[] = [];
    for (const pipe of model.pipes ?? []) {
      const pa = analysis.pipes?.find((p) => p.name === pipe.name);
      const v = pa?.maxVelocityMPerS;
      if (!pa || v === null || v === undefined || !Number.isFinite(v)) continue;
      const limit = settings.value('limit', pipe.rules);
      if (v <= limit) continue;
      const d = pipe.insideDiameterM > 0 ? pipe.insideDiameterM : pa.insideDiameterM;
      const vMin = pa.minVelocityMPerS;
      const need = carryingThreshold(pipe, carrying);
      const larger = sizeOptions(pipe).find((o) => o.insideDiameterM > d && velocityAtBore(v, d, o.insideDiameterM) <= limit);
      let advice: string;
      let fix: Record<string, unknown> | undefined;
      if (larger && d > 0) {
        const slowAfter = vMin !== null && velocityAtBore(vMin, d, larger.insideDiameterM) < need;
        advice = slowAfter
          ? `A ${formatDiameter(larger.nominalSizeM, units)} pipe would be quiet enough but too slow to carry with one operator, so the size cannot meet both: limit the operators this pipe serves, or accept the noise with a reason.`
          : `Use ${formatDiameter(larger.nominalSizeM, units)} (${pipe.spec.name}): about ${formatVelocity(velocityAtBore(v, d, larger.insideDiameterM), units)} in this case (estimate).`;
        if (!slowAfter) fix = { nominalSizeM: larger.nominalSizeM, insideDiameterM: larger.insideDiameterM };
      } else {
        advice = 'No larger size of its spec brings it under the limit: limit the operators this pipe serves or use a larger spec.';
      }
      const openSet = pa.maxVelocityInlets ?? [];
      const extrapolated =
        pa.maxVelocityLimited === 'curve-end' ? " In this case the lifted tools draw past the end of the producer's curve, extrapolated along its last slope: the velocity is an estimate." : '';
      findings.push(
        ruleFinding(
          fastVelocity,
          { kind: 'pipe', name: pipe.name, property: 'size' },
          `Pipe '${pipe.name}' reaches ${formatVelocity(v, units)} with ${openSet.length || 'the design'} operators open and tools lifted, above the ${formatVelocity(limit, units)} limit: loud, and debris wears through bends. ${advice}${extrapolated}`,
          {
            related: openSet.map((name) => ({ element: { kind: 'inlet' as const, name }, message: 'open, tool lifted, in the fastest case' })),
            ...(fix ? { fix } : {}),
          },
        ),
      );
    }
    return findings;
  },
};
