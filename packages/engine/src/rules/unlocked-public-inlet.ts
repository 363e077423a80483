/**
 * An inlet in a public area without a lock: anyone can open it, drawing air
 * (and starving the operators) or putting things into the piping. Common
 * practice is a locking inlet valve in public areas.
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';

export const unlockedPublicInlet: Rule = {
  code: 'unlocked-public-inlet',
  title: 'Public-area inlet without a lock',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
  check(model) {
    const findings: Finding[] = [];
    for (const inlet of model.inlets ?? []) {
      if (!inlet.publicArea || inlet.locked) continue;
      findings.push(
        ruleFinding(
          unlockedPublicInlet,
          { kind: 'inlet', name: inlet.name, property: 'locked' },
          `Inlet '${inlet.name}' is in a public area and has no lock: anyone can open it, starving the operators or dropping things into the piping. Fit a locking inlet valve (mark it locked).`,
          { fix: { locked: true } },
        ),
      );
    }
    return findings;
  },
};
