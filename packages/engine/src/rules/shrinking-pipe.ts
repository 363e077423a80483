/**
 * A pipe that gets smaller in the direction of air flow (toward the
 * producer): debris sized to pass the larger pipe jams at the step. Trade
 * practice is that the pipe never gets smaller toward the producer.
 */
import type { Finding, Pipe } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { pipeGraph } from './pipe-graph.js';
import { formatDiameter } from './rule-format.js';

/** Nominal size to suggest for `smaller` so that it is no smaller than `larger`. */
function suggestedNominal(smaller: Pipe, larger: Pipe): number {
  if (smaller.spec?.name === larger.spec?.name) return larger.nominalSizeM;
  const sizes = [...(smaller.spec?.nominalSizesM ?? [])].sort((a, b) => a - b);
  return sizes.find((s) => s >= larger.nominalSizeM) ?? larger.nominalSizeM;
}

export const shrinkingPipe: Rule = {
  code: 'shrinking-pipe',
  title: 'Pipe gets smaller toward the producer',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'tolerance',
      dimension: 'fraction',
      // Schedule 10 vs 40 at one NPS differs 4-6 % in bore for NPS 2-6 (ASME B36.10M);
      // such a wall change is not a reduction. One size step is 15-25 %. Common practice.
      default: 0.08,
      source: 'common practice: above the 4-6 % bore change of a wall-schedule change at one size (ASME B36.10M)',
      description: 'Bore reduction toward the producer, as a share of the larger bore, that is ignored.',
      range: [0, 0.5],
    },
  ],
  needsAnalysis: false,
  check(model, _analysis, settings) {
    const graph = pipeGraph(model);
    const units = model.displayUnits ?? 'imperial';
    const findings: Finding[] = [];
    for (const downstream of model.pipes ?? []) {
      const tolerance = settings.value('tolerance', downstream.rules);
      // Pipes that discharge into `downstream` at its far end.
      for (const upstream of graph.startingAt(downstream.to)) {
        if (upstream === downstream) continue;
        const dUp = upstream.insideDiameterM;
        const dDown = downstream.insideDiameterM;
        if (!(dUp > 0 && dDown > 0)) continue;
        if (dDown >= dUp * (1 - tolerance)) continue;
        const nominal = suggestedNominal(downstream, upstream);
        findings.push(
          ruleFinding(
            shrinkingPipe,
            { kind: 'pipe', name: downstream.name, property: 'size' },
            `Pipe '${downstream.name}' (bore ${formatDiameter(dDown, units)}) is smaller than '${upstream.name}' (bore ${formatDiameter(dUp, units)}) which discharges into it: debris that passes '${upstream.name}' can jam at the step. Make '${downstream.name}' at least ${formatDiameter(nominal, units)} nominal, or reduce '${upstream.name}'.`,
            {
              related: [{ element: { kind: 'pipe', name: upstream.name, property: 'size' }, message: 'the larger pipe upstream' }],
              fix: { nominalSizeM: nominal },
            },
          ),
        );
      }
    }
    return findings;
  },
};
