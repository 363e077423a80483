/**
 * A branch that enters its main through a 90 deg tee: the air turns square
 * into the main stream, losing about a full velocity pressure where a 45 deg
 * wye loses under a third of one (ACGIH Industrial Ventilation branch entry
 * losses, from memory: 1.00 VP at 90 deg vs 0.28 VP at 45 deg), and debris
 * thrown against the far wall of the tee collects there. Trade practice is a
 * wye (lateral) or a sweep entry (UFGS guide specifications for central vacuum).
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { pipeGraph } from './pipe-graph.js';

/** Angle a wye should have as the fix: 45 deg (UFGS wye fittings; the usual lateral). */
const FIX_WYE_ANGLE_RAD = Math.PI / 4;
/** A wye written at 90 deg or more is a tee; 0.5 deg tolerance for rounding. */
const SQUARE_ENTRY_RAD = (89.5 * Math.PI) / 180;

export const teeBranchEntry: Rule = {
  code: 'tee-branch-entry',
  title: 'Branch enters through a 90 deg tee',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
  check(model) {
    const graph = pipeGraph(model);
    const findings: Finding[] = [];
    for (const pipe of model.pipes ?? []) {
      const j = pipe.joins;
      if (!j) continue;
      const square = j.kind === 'tee' || (j.kind === 'wye' && j.angleRad >= SQUARE_ENTRY_RAD);
      if (!square) continue;
      const parents = graph.parentsOf(pipe);
      findings.push(
        ruleFinding(
          teeBranchEntry,
          { kind: 'pipe', name: pipe.name, property: 'joins' },
          `Pipe '${pipe.name}' joins the main through a 90 deg tee, which costs about a velocity pressure and catches debris. Use a 45 deg wye (joins wye 45 deg) or a sweep entry.`,
          {
            related: parents.map((q) => ({ element: { kind: 'pipe' as const, name: q.name }, message: `the pipe '${pipe.name}' enters` })),
            fix: { joins: { kind: 'wye', angleRad: FIX_WYE_ANGLE_RAD } },
          },
        ),
      );
    }
    return findings;
  },
};
