import type { SystemModel } from '@vacnet/engine';
import { runEngine, type EngineRun } from './engine-run.js';

/** How one engine job ended: its result, cancelled by a newer job, or failed with a message. */
export type EngineJobOutcome = { kind: 'done'; run: EngineRun; ms: number } | { kind: 'cancelled' } | { kind: 'failed'; message: string };

/**
 * Runs engine jobs for the language server. A job has a key (the document's
 * URI): a newer job with the same key cancels the older one, so stale work
 * never delays fresh work. Never rejects.
 */
export interface EngineRunner {
  /** `urgent`: the document is open in the editor; its job goes before those of closed workspace files. */
  run(key: string, model: SystemModel, urgent?: boolean): Promise<EngineJobOutcome>;
  /** Cancels the job with this key, if any (a closed document). */
  cancel(key: string): void;
  dispose(): void;
}

/**
 * Runs jobs on this thread, one at a time, after yielding once to the event
 * loop (so a newer edit can still cancel a queued job). A running job cannot
 * be interrupted: used by the headless tools and the tests; the server uses
 * the worker-thread runner.
 */
export class InProcessEngineRunner implements EngineRunner {
  private readonly latest = new Map<string, number>();
  private counter = 0;

  async run(key: string, model: SystemModel, _urgent = true): Promise<EngineJobOutcome> {
    const ticket = ++this.counter;
    this.latest.set(key, ticket);
    await new Promise<void>((resolve) => setImmediate(resolve));
    if (this.latest.get(key) !== ticket) return { kind: 'cancelled' };
    const started = performance.now();
    try {
      const run = runEngine(model);
      return this.latest.get(key) === ticket ? { kind: 'done', run, ms: performance.now() - started } : { kind: 'cancelled' };
    } catch (error) {
      return { kind: 'failed', message: error instanceof Error ? error.message : String(error) };
    }
  }

  cancel(key: string): void {
    this.latest.delete(key);
  }

  dispose(): void {
    this.latest.clear();
  }
}
