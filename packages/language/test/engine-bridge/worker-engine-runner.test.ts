// The worker-thread engine runner, on the bundled server (whose entry serves
// engine jobs when started as a worker): results equal the engine's own run
// on this thread, a newer job cancels an older one with the same key, and a
// thread that cannot start leaves the jobs to the main thread.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { runEngine } from '../../src/engine-bridge/engine-run.js';
import { WorkerEngineRunner } from '../../src/engine-bridge/worker-engine-runner.js';
import { lowerSystem } from '../../src/lowering/lower-system.js';
import { createLive, SLOW_SYSTEM } from '../lsp/live-services.js';

const server = fileURLToPath(new URL('../../../extension/dist/server.cjs', import.meta.url));

async function slowModel() {
  const live = createLive();
  const [document] = await live.put({ 'file:///work/runner/system.vacnet': SLOW_SYSTEM });
  return lowerSystem(document!.parseResult.value.systems[0]!).model;
}

describe('worker engine runner', () => {
  let runner: WorkerEngineRunner | undefined;
  beforeAll(() => {
    if (!existsSync(server)) throw new Error(`${server} is missing: run \`npm run build\` first`);
  });
  afterEach(() => runner?.dispose());

  it('runs a job on the worker thread with the same result as on this thread', async () => {
    const model = await slowModel();
    runner = new WorkerEngineRunner(server);
    const outcome = await runner.run('a', model);
    expect(outcome.kind).toBe('done');
    const here = runEngine(model);
    if (outcome.kind !== 'done') return;
    expect(outcome.run.findings).toEqual(here.findings);
    expect(outcome.run.analysis.inlets).toEqual(here.analysis.inlets);
    expect(runner.onMainThread).toBe(false);
  });

  it('cancels a job when a newer one with the same key comes, and still answers other keys', async () => {
    const model = await slowModel();
    runner = new WorkerEngineRunner(server);
    const first = runner.run('doc', model);
    const other = runner.run('other', model);
    const second = runner.run('doc', { ...model, name: 'newer' });
    expect((await first).kind).toBe('cancelled');
    const done = await second;
    expect(done.kind).toBe('done');
    expect((await other).kind).toBe('done');
  });

  it('falls back to this thread when the worker cannot run', async () => {
    const model = await slowModel();
    runner = new WorkerEngineRunner(fileURLToPath(new URL('./no-such-entry.cjs', import.meta.url)));
    const outcomes = [];
    for (let i = 0; i < 4; i++) outcomes.push(await runner.run(`k${i}`, model));
    // Each job whose thread fails to start runs here instead; after three failed starts, all do.
    expect(outcomes.map((o) => o.kind)).toEqual(['done', 'done', 'done', 'done']);
    expect(runner.onMainThread).toBe(true);
  });
});
