/**
 * Solves sets of open inlets once each and remembers the results: a set
 * solved while searching one inlet's worst case also answers for every other
 * inlet in it.
 */
import type { SolveFailure } from '../solve/solve-types.js';
import type { InletPoint, ToolState } from './analysis-types.js';
import type { CaseMode, CaseRunner } from './case-runner.js';

export type SetResult = { ok: true; points: InletPoint[] } | { ok: false; failure: SolveFailure };

export class SetEvaluator {
  private readonly cache = new Map<string, SetResult>();
  /** Distinct sets actually solved. */
  solved = 0;

  constructor(
    private readonly runner: CaseRunner,
    /** The inlet universe: index -> name. */
    readonly names: readonly string[],
    readonly toolState: ToolState = 'working',
    readonly mode: CaseMode = 'tool',
  ) {}

  static key(members: readonly number[]): string {
    return [...members].sort((a, b) => a - b).join(',');
  }

  /** The set's result, with points in the order of `members`. */
  evaluate(members: readonly number[]): SetResult {
    const key = SetEvaluator.key(members);
    const hit = this.cache.get(key);
    if (hit) return hit.ok ? { ok: true, points: members.map((i) => hit.points.find((p) => p.name === this.names[i])!) } : hit;
    const openings = members.map((i) => ({ inlet: this.names[i]!, toolState: this.toolState }));
    const out = this.runner.solve(openings, this.mode);
    let result: SetResult;
    if (!out.ok) {
      result = { ok: false, failure: out.failure };
    } else {
      const points: InletPoint[] = [];
      for (const o of openings) {
        const p = this.runner.inletPoint(out.view, o.inlet, this.toolState, this.mode);
        if (p) points.push(p);
      }
      result = points.length === openings.length
        ? { ok: true, points }
        : { ok: false, failure: { cause: 'not-converged', message: 'the solved case lacks an open inlet' } };
    }
    this.solved++;
    this.cache.set(key, result);
    return result;
  }

  /** A set's result if it was solved already. */
  peek(members: readonly number[]): SetResult | undefined {
    return this.cache.get(SetEvaluator.key(members));
  }
}
