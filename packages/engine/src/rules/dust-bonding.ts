/**
 * Combustible dust with no declaration that the conductive parts are bonded
 * and grounded: an isolated conductor charges up and sparks (NFPA 652, 654).
 */
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { DUST_DEFERRAL } from './dust-caution.js';

export const dustBonding: Rule = {
  code: 'dust-bonding',
  title: 'Combustible dust: bonding and grounding not declared',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
  check(model) {
    if (!model.dust?.combustible || model.dust.bondedAndGrounded) return [];
    return [
      ruleFinding(
        dustBonding,
        { kind: 'system', name: model.name, property: 'dust' },
        `Caution: this system carries combustible dust and does not declare that all conductive parts (pipe, fittings, inlets, hose ends, separator) are bonded together and grounded. An isolated conductor can charge and spark. Bond and ground them, check continuity at commissioning, and declare it (add bonded to the dust line). ${DUST_DEFERRAL}`,
        { fix: { bondedAndGrounded: true } },
      ),
    ];
  },
};
