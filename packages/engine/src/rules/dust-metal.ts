/**
 * Combustible metal dust: aluminium, magnesium, titanium and similar dusts
 * fall under the metals standard (NFPA 484), whose demands differ from those
 * for other dusts (some metal dusts react with water; collection is often
 * wet or needs special separators). One caution per system.
 * Shown whenever the dust is metal, even if the file forgot to call it combustible.
 */
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { DUST_DEFERRAL } from './dust-caution.js';

export const dustMetal: Rule = {
  code: 'dust-metal',
  title: 'Combustible metal dust: metals standard applies',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
  check(model) {
    if (!model.dust?.metal) return [];
    return [
      ruleFinding(
        dustMetal,
        { kind: 'system', name: model.name, property: 'dust' },
        `Caution: this system carries combustible metal dust, which falls under NFPA 484 as well as NFPA 652. Its separator, filter, fan placement and any water contact need review against that standard: this tool checks none of it. ${DUST_DEFERRAL}`,
      ),
    ];
  },
};
