/**
 * A bend tighter than the long-radius standard. Short bends lose more (ASHRAE
 * Fundamentals ch. 21 CD3-12: 3-gore 90 deg K 0.42 at R/D 1 vs 0.34 at 1.5)
 * and are where debris lands and wear starts; trade practice calls for
 * long-radius fittings (UFGS guide specifications).
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatAngle } from './rule-format.js';

export const shortRadiusBend: Rule = {
  code: 'short-radius-bend',
  title: 'Bend radius below the long-radius standard',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'minRadius',
      dimension: 'ratio',
      // ASME B16.9 long-radius elbows are 1.5 D; UFGS asks for long-radius fittings.
      default: 1.5,
      source: 'ASME B16.9 long-radius elbow (centreline radius 1.5 D); UFGS: long-radius fittings for turns',
      description: 'Smallest centreline radius of a bend, in pipe diameters (R/D).',
      range: [0, 20],
    },
  ],
  needsAnalysis: false,
  check(model, _analysis, settings) {
    const findings: Finding[] = [];
    for (const pipe of model.pipes ?? []) {
      const least = settings.value('minRadius', pipe.rules);
      (pipe.fittings ?? []).forEach((fitting, index) => {
        if (fitting.kind !== 'bend') return;
        if (!(fitting.radiusRatio < least)) return;
        const count = fitting.count > 1 ? `${fitting.count} x ` : '';
        findings.push(
          ruleFinding(
            shortRadiusBend,
            { kind: 'pipe', name: pipe.name, property: 'bend' },
            `Pipe '${pipe.name}' has a ${count}${formatAngle(fitting.angleRad)} bend at radius ${Number(fitting.radiusRatio.toFixed(2))} D, below ${least} D: it loses more and wears and clogs first. Use a long-radius bend (radius ${least} D) or a sweep.`,
            { fix: { fittingIndex: index, radiusRatio: least } },
          ),
        );
      });
    }
    return findings;
  },
};
