/**
 * A long header fed from one end whose far inlets are starved while its near
 * inlets have vacuum to spare: feeding it at the centre halves the run to the
 * farthest inlet and the loss along it (loss ~ length at a given flow), so
 * the two ends would roughly balance. Reported when the near end's spare is
 * at least the far end's shortfall, so that averaging them could work.
 */
import type { Finding, SystemModel } from '../network/model.js';
import type { SystemAnalysis } from '../analysis/analysis-types.js';
import type { Rule, RuleSettings } from './rule.js';
import { ruleFinding } from './finding.js';
import { pipeGraph } from './pipe-graph.js';
import { horizontalRuns, positionOnRun, type HorizontalRun } from './horizontal-runs.js';
import { formatLength, formatPressure } from './rule-format.js';
import { DEFAULT_TOOL_NEED_PA } from './starved-inlet.js';

/** International foot, m (exact). */
const FOOT_M = 0.3048;

interface HeaderInlet {
  name: string;
  /** Distance along the header from its fed end, where the inlet's air enters it, m. */
  positionM: number;
  toolVacuumPa: number;
  needPa: number;
}

/** Inlets along a run, each placed where its air enters the run. */
function inletsAlong(run: HorizontalRun, model: SystemModel, analysis: SystemAnalysis): HeaderInlet[] {
  const served = run.pipes.map((p) => new Set(analysis.pipes?.find((a) => a.name === p.name)?.servedInlets ?? []));
  const out: HeaderInlet[] = [];
  for (const name of served[0] ?? []) {
    let k = 0;
    for (let j = 0; j < run.pipes.length; j++) if (served[j]!.has(name)) k = j;
    const pipe = run.pipes[k]!;
    const inlet = model.inlets?.find((i) => i.name === name);
    const onThisPipe = inlet?.position.kind === 'on-pipe' && inlet.position.pipe === pipe.name;
    const along = onThisPipe && inlet.position.kind === 'on-pipe' ? Math.min(Math.max(inlet.position.distanceM, 0), pipe.lengthM) : pipe.lengthM;
    const wc = analysis.inlets?.find((i) => i.name === name)?.worstCase;
    if (!wc || !Number.isFinite(wc.toolVacuumPa)) continue;
    out.push({ name, positionM: run.offsets[k]! + along, toolVacuumPa: wc.toolVacuumPa, needPa: wc.requiredToolVacuumPa ?? DEFAULT_TOOL_NEED_PA });
  }
  return out;
}

function least(list: HeaderInlet[]): HeaderInlet {
  return list.reduce((a, b) => (b.toolVacuumPa - b.needPa < a.toolVacuumPa - a.needPa ? b : a));
}

export const endFedHeader: Rule = {
  code: 'end-fed-header',
  title: 'Long header fed from one end starves its far inlets',
  defaultSeverity: 'info',
  parameters: [
    {
      name: 'minLength',
      dimension: 'length',
      // 50 ft: below this the header's own loss is small next to the hose; common practice.
      default: 50 * FOOT_M,
      source: 'common practice',
      description: 'Shortest header this rule looks at.',
      range: [0, 1e4],
    },
    {
      name: 'minInlets',
      dimension: 'count',
      // Three inlets: one at each end and one between; common practice.
      default: 3,
      source: 'common practice',
      description: 'Fewest inlets along the header for the rule to look at it.',
      range: [2, 1e4],
    },
  ],
  needsAnalysis: true,
  check(model, analysis, settings) {
    if (!analysis) return [];
    return checkHeaders(model, analysis, settings);
  },
};

function checkHeaders(model: SystemModel, analysis: SystemAnalysis, settings: RuleSettings): Finding[] {
  const units = model.displayUnits ?? 'imperial';
  const findings: Finding[] = [];
  for (const run of horizontalRuns(model, pipeGraph(model))) {
    const first = run.pipes[0]!;
    if (run.lengthM < settings.value('minLength', first.rules)) continue;
    const inlets = inletsAlong(run, model, analysis);
    if (inlets.length < settings.value('minInlets', first.rules)) continue;
    const half = run.lengthM / 2;
    const near = inlets.filter((i) => i.positionM <= half);
    const far = inlets.filter((i) => i.positionM > half);
    if (near.length === 0 || far.length === 0) continue;
    const farWorst = least(far);
    const nearWorst = least(near);
    const shortfall = farWorst.needPa - farWorst.toolVacuumPa;
    const spare = nearWorst.toolVacuumPa - nearWorst.needPa;
    if (!(shortfall > 0) || !(spare >= shortfall)) continue;
    const centre = positionOnRun(run, half);
    const last = run.pipes[run.pipes.length - 1]!;
    findings.push(
      ruleFinding(
        endFedHeader,
        { kind: 'pipe', name: first.name },
        `The header from '${first.from}' to '${last.to}' (${formatLength(run.lengthM, units)}) is fed from one end: its far inlets are starved while the near ones have vacuum to spare. Worst far-end tool vacuum ${formatPressure(farWorst.toolVacuumPa, units)} at '${farWorst.name}' (needs ${formatPressure(farWorst.needPa, units)}) against ${formatPressure(nearWorst.toolVacuumPa, units)} at near-end '${nearWorst.name}' (needs ${formatPressure(nearWorst.needPa, units)}). Feed it at its centre (on '${centre.pipe}' at ${formatLength(centre.distanceM, units)}): the run to the farthest inlet halves and the ends would roughly balance; rerun the analysis after moving the feed.`,
        {
          related: [
            { element: { kind: 'inlet', name: farWorst.name }, message: 'the most starved inlet at the far end' },
            { element: { kind: 'inlet', name: nearWorst.name }, message: 'the least spared inlet at the near end' },
          ],
          fix: {
            feedAt: centre,
            farEnd: { inlet: farWorst.name, toolVacuumPa: farWorst.toolVacuumPa, needPa: farWorst.needPa },
            nearEnd: { inlet: nearWorst.name, toolVacuumPa: nearWorst.toolVacuumPa, needPa: nearWorst.needPa },
          },
        },
      ),
    );
  }
  return findings;
}
