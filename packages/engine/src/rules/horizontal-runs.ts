/**
 * Horizontal runs: horizontal pipes joined end to end by straight run-ons,
 * for the cleanout spacing and the end-fed header rules.
 */
import type { Pipe, SystemModel } from '../network/model.js';
import type { PipeGraph } from './pipe-graph.js';

/** A horizontal run: pipes joined end to end by straight run-ons, producer side first. */
export interface HorizontalRun {
  pipes: Pipe[];
  /** Offset of each pipe's `from` end along the run, m. */
  offsets: number[];
  lengthM: number;
}

/**
 * Splits the horizontal pipes into runs. A pipe continues the run of the
 * horizontal pipe ending where it starts when it joins with no junction (a
 * straight run-on); a branch entry (wye, tee, sweep) or a riser starts a new run.
 */
export function horizontalRuns(model: SystemModel, graph: PipeGraph): HorizontalRun[] {
  const horizontal = (model.pipes ?? []).filter((p) => p.orientation === 'horizontal');
  const next = new Map<Pipe, Pipe>();
  const continued = new Set<Pipe>();
  for (const p of horizontal) {
    const onward = graph
      .startingAt(p.to)
      .find((q) => q !== p && q.orientation === 'horizontal' && !q.joins && !continued.has(q));
    if (onward) {
      next.set(p, onward);
      continued.add(onward);
    }
  }
  const visited = new Set<Pipe>();
  const runs: HorizontalRun[] = [];
  const walk = (start: Pipe) => {
    const run: HorizontalRun = { pipes: [], offsets: [], lengthM: 0 };
    for (let p: Pipe | undefined = start; p && !visited.has(p); p = next.get(p)) {
      visited.add(p);
      run.pipes.push(p);
      run.offsets.push(run.lengthM);
      run.lengthM += Number.isFinite(p.lengthM) && p.lengthM > 0 ? p.lengthM : 0;
    }
    if (run.pipes.length > 0) runs.push(run);
  };
  for (const p of horizontal) if (!continued.has(p)) walk(p);
  // Whatever is left lies on a closed loop of run-ons: start anywhere.
  for (const p of horizontal) if (!visited.has(p)) walk(p);
  return runs;
}

/** The pipe and distance from its `from` end at an offset along a run. */
export function positionOnRun(run: HorizontalRun, offset: number): { kind: 'on-pipe'; pipe: string; distanceM: number } {
  for (let k = run.pipes.length - 1; k >= 0; k--) {
    if (offset >= run.offsets[k]! || k === 0) {
      const pipe = run.pipes[k]!;
      const distanceM = Math.min(Math.max(offset - run.offsets[k]!, 0), pipe.lengthM);
      return { kind: 'on-pipe', pipe: pipe.name, distanceM: Number(distanceM.toFixed(3)) };
    }
  }
  return { kind: 'on-pipe', pipe: run.pipes[0]!.name, distanceM: 0 };
}
