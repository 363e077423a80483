/**
 * Combustible dust through non-conductive pipe or hose: moving dust charges
 * the wall and a spark can ignite a dust cloud. NFPA 652 asks for conductive
 * or static-dissipative hose and NFPA 654 for metallic, bonded ducts.
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { DUST_DEFERRAL } from './dust-caution.js';

export const dustNonconductive: Rule = {
  code: 'dust-nonconductive',
  title: 'Combustible dust: non-conductive pipe or hose',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
  check(model) {
    if (!model.dust?.combustible) return [];
    const findings: Finding[] = [];
    for (const pipe of model.pipes ?? []) {
      if (pipe.spec?.conductive !== false) continue;
      findings.push(
        ruleFinding(
          dustNonconductive,
          { kind: 'pipe', name: pipe.name, property: 'spec' },
          `Caution: pipe '${pipe.name}' (spec '${pipe.spec.name}', ${pipe.spec.material}) does not conduct, and this system carries combustible dust: static charge can build on it and ignite a dust cloud. Consider metallic pipe, bonded and grounded. ${DUST_DEFERRAL}`,
          { related: [{ element: { kind: 'pipe-spec', name: pipe.spec.name }, message: 'the non-conductive spec' }] },
        ),
      );
    }
    for (const inlet of model.inlets ?? []) {
      if (inlet.hose?.conductive !== false) continue;
      findings.push(
        ruleFinding(
          dustNonconductive,
          { kind: 'inlet', name: inlet.name, property: 'hose' },
          `Caution: the hose at inlet '${inlet.name}' ('${inlet.hose.name}') does not conduct, and this system carries combustible dust: static charge can build on it and ignite a dust cloud. Consider a conductive or static-dissipative hose. ${DUST_DEFERRAL}`,
          { related: [{ element: { kind: 'hose-kind', name: inlet.hose.name }, message: 'the non-conductive hose' }] },
        ),
      );
    }
    return findings;
  },
};
