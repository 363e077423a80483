/**
 * Velocities for the carrying and the noise/wear checks, per pipe.
 *
 * Lowest: with one operator (tool working) at any single inlet the pipe
 * serves, at the upstream (far, higher-pressure) end of the part that
 * carries air, where the velocity is lowest: a main sized for four
 * operators runs slow with one (ENGINEERING.md).
 *
 * Highest: with the design operators open at the served inlets that draw
 * most air alone (the k strongest; tools lifted, which draws most), at the
 * producer-side end, where it is highest. Operators elsewhere only take
 * vacuum from this pipe, so they are left closed. Pipes whose strongest
 * served inlets are the same share one solve. Lifted tools may draw past
 * the end of the producer's curve: that case is extrapolated along the
 * curve's last slope and flagged (`maxVelocityLimited`), not failed.
 */
import type { AnalysisFailure, InletPoint, PipeAnalysis } from './analysis-types.js';
import type { CaseRunner, CaseView } from './case-runner.js';

/** A pipe serves an inlet when it carries at least this share of the inlet's lone flow (our choice: 1 %). */
export const SERVES_SHARE = 0.01;

export interface VelocityInput {
  runner: CaseRunner;
  names: readonly string[];
  lone: readonly (InletPoint | null)[];
  loneViews: readonly (CaseView | null)[];
  k: number;
  /** Compute the highest velocities (k lifted tools); false leaves them null. */
  withMax: boolean;
}

export function pipeVelocities(input: VelocityInput): { pipes: PipeAnalysis[]; failures: AnalysisFailure[] } {
  const { runner } = input;
  const g = runner.graph;
  const pipes = g.model.pipes ?? [];
  const served = new Map<string, number[]>(pipes.map((p) => [p.name, []]));
  const minV = new Map<string, { v: number; inlet: number }>();
  const failures: AnalysisFailure[] = [];

  input.names.forEach((name, i) => {
    const view = input.loneViews[i];
    const lone = input.lone[i];
    if (!view || !lone || !(lone.massFlowKgPerS > 0)) return;
    for (const pipe of pipesIn(runner, view, name)) {
      const pt = runner.pipePoint(view, pipe);
      if (!pt || pt.massFlowKgPerS < SERVES_SHARE * lone.massFlowKgPerS) continue;
      served.get(pipe)?.push(i);
      const cur = minV.get(pipe);
      if (!cur || pt.upstreamVelocityMPerS < cur.v) minV.set(pipe, { v: pt.upstreamVelocityMPerS, inlet: i });
    }
  });

  // Highest: group pipes by their k strongest served inlets.
  const groups = new Map<string, { members: number[]; pipes: string[] }>();
  if (input.withMax) {
    for (const p of pipes) {
      const list = [...(served.get(p.name) ?? [])];
      if (list.length === 0) continue;
      list.sort((a, b) => input.lone[b]!.massFlowKgPerS - input.lone[a]!.massFlowKgPerS || a - b);
      const members = list.slice(0, Math.max(1, input.k)).sort((a, b) => a - b);
      const key = members.join(',');
      const gr = groups.get(key) ?? { members, pipes: [] };
      gr.pipes.push(p.name);
      groups.set(key, gr);
    }
  }
  const maxV = new Map<string, { v: number; loss: number; members: number[]; curveEnd: boolean }>();
  for (const { members, pipes: groupPipes } of groups.values()) {
    const openings = members.map((i) => ({ inlet: input.names[i]!, toolState: 'lifted' as const }));
    // Lifted tools can draw past the last point of the producer's curve. This
    // case only bounds velocities: the producer is extrapolated along its
    // last slope toward zero vacuum and the result flagged, not failed; the
    // design case (tools working) is what judges the producer.
    const out = runner.solve(openings, 'tool', undefined, false, true);
    if (!out.ok) {
      failures.push({
        stage: 'max-velocity',
        subject: groupPipes[0]!,
        openInlets: openings.map((o) => o.inlet),
        cause: out.failure.cause,
        element: out.failure.element,
        message: out.failure.message,
      });
      continue;
    }
    const curveEnd = (out.view.state.limited ?? []).some((l) => l.limit === 'curve-end' && g.net.drives[l.element] === 1);
    for (const pipe of groupPipes) {
      const pt = runner.pipePoint(out.view, pipe);
      if (pt) maxV.set(pipe, { v: pt.downstreamVelocityMPerS, loss: pt.lossPa, members, curveEnd });
    }
  }

  const result: PipeAnalysis[] = pipes.map((p) => {
    const lo = minV.get(p.name);
    const hi = maxV.get(p.name);
    const out: PipeAnalysis = {
      name: p.name,
      insideDiameterM: p.insideDiameterM,
      lengthM: p.lengthM,
      servedInlets: (served.get(p.name) ?? []).map((i) => input.names[i]!),
      minVelocityMPerS: lo ? lo.v : null,
      minVelocityInlet: lo ? input.names[lo.inlet]! : null,
      maxVelocityMPerS: hi ? hi.v : null,
      maxVelocityInlets: hi ? hi.members.map((i) => input.names[i]!) : [],
      lossPa: hi ? hi.loss : null,
    };
    if (hi?.curveEnd) out.maxVelocityLimited = 'curve-end';
    return out;
  });
  return { pipes: result, failures };
}

/** Pipes that took part in a lone case: the inlet's path in a tree, else every pipe. */
function pipesIn(runner: CaseRunner, view: CaseView, inlet: string): string[] {
  const g = runner.graph;
  if (runner.tree.exact) {
    const names = new Set<string>();
    for (const e of runner.pathOf(inlet)) {
      const el = g.topology.elements[e]!;
      if (el.kind === 'pipe') names.add(el.ref.name);
    }
    return [...names];
  }
  return (g.model.pipes ?? []).map((p) => p.name).filter((name) => (g.topology.pipeSegments.get(name) ?? []).some((e) => view.has(e)));
}
