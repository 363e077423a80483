/**
 * A separator (air-material separator) indoors without explosion protection
 * on a combustible-dust system: a deflagration in it would vent into the
 * room. NFPA 654 puts such separators outdoors or asks for explosion
 * protection (venting, suppression, isolation).
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { DUST_DEFERRAL } from './dust-caution.js';

export const dustSeparatorIndoors: Rule = {
  code: 'dust-separator-indoors',
  title: 'Combustible dust: separator indoors without explosion protection',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
  check(model) {
    if (!model.dust?.combustible) return [];
    const findings: Finding[] = [];
    for (const sep of model.separators ?? []) {
      if (!sep.indoors || sep.explosionProtected) continue;
      findings.push(
        ruleFinding(
          dustSeparatorIndoors,
          { kind: 'separator', name: sep.name, property: 'placement' },
          `Caution: separator '${sep.name}' stands indoors with no explosion protection declared, on a system carrying combustible dust. A deflagration inside it would reach the room. Place it outdoors, or give it explosion protection (venting to a safe place, suppression, isolation) and mark it protected. ${DUST_DEFERRAL}`,
        ),
      );
    }
    return findings;
  },
};
