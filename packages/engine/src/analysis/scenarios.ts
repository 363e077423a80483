/**
 * Named scenarios: the user's own sets of open inlets and tool states,
 * each solved exactly.
 */
import type { Scenario } from '../network/model.js';
import type { AnalysisFailure, PipePoint, ScenarioAnalysis } from './analysis-types.js';
import type { CaseRunner } from './case-runner.js';
import { producerPoints } from './producer-point.js';

export function scenarioResults(runner: CaseRunner, scenarios: readonly Scenario[]): { scenarios: ScenarioAnalysis[]; failures: AnalysisFailure[] } {
  const out: ScenarioAnalysis[] = [];
  const failures: AnalysisFailure[] = [];
  for (const sc of scenarios) {
    const openings = sc.open ?? [];
    const res = runner.solve(openings);
    if (!res.ok) {
      failures.push({
        stage: 'scenario',
        subject: sc.name,
        openInlets: openings.map((o) => o.inlet),
        cause: res.failure.cause,
        element: res.failure.element,
        message: res.failure.message,
      });
      out.push({ name: sc.name, ok: false, producer: null, producers: [], inlets: [], pipes: [] });
      continue;
    }
    const producers = producerPoints(runner, res.view);
    const inlets = openings.map((o) => runner.inletPoint(res.view, o.inlet, o.toolState)).filter((p) => p !== null);
    // The pipes that carry air in this scenario.
    const pipes = (runner.graph.model.pipes ?? [])
      .map((p) => runner.pipePoint(res.view, p.name))
      .filter((p): p is PipePoint => p !== null && p.massFlowKgPerS > 0);
    out.push({ name: sc.name, ok: true, producer: producers[0] ?? null, producers, inlets, pipes });
  }
  return { scenarios: out, failures };
}
