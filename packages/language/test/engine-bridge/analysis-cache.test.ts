// The analysis cache: engine findings per text version, placed on the
// tokens they concern, equal to what the headless loader reports; stale
// results are dropped; catalogs re-check the systems that use them.
// Expected values come from the engine itself (runEngine on the same
// model): these tests check the plumbing, not the physics.
import { TextDocument, URI } from 'langium';
import { describe, expect, it } from 'vitest';
import type { SystemModel } from '@vacnet/engine';
import type { EngineJobOutcome, EngineRunner } from '../../src/engine-bridge/engine-runner.js';
import { runEngine } from '../../src/engine-bridge/engine-run.js';
import { analyseLowered } from '../../src/engine-bridge/analyse-lowered.js';
import { toVacnetDiagnostic } from '../../src/diagnostic-conversion.js';
import { lowerSystem } from '../../src/lowering/lower-system.js';
import { CATALOG, createLive, SLOW_SYSTEM } from '../lsp/live-services.js';

const SYSTEM_URI = 'file:///work/cache/system.vacnet';
const CATALOG_URI = 'file:///work/cache/catalog.vacnet';

describe('analysis cache', () => {
  it('puts the velocity finding on the size of the slow pipe, as the headless analysis does', async () => {
    const live = createLive();
    const [document] = await live.put({ [SYSTEM_URI]: SLOW_SYSTEM });
    const state = await live.analysed(SYSTEM_URI);
    expect(state.status).toBe('ready');
    const slow = state.result!.diagnostics.filter((d) => d.code === 'slow-carrying-velocity');
    expect(slow).toHaveLength(1);
    // `size 4 in` on line 11 (0-based 10): the finding underlines `4 in`.
    const line = SLOW_SYSTEM.split('\n')[slow[0]!.range.start.line]!;
    expect(line.slice(slow[0]!.range.start.character, slow[0]!.range.end.character)).toBe('4 in');
    expect(line).toContain('pipe main-1');
    // The same model through the headless path gives the same findings.
    const system = document!.parseResult.value.systems[0]!;
    const headless = analyseLowered(lowerSystem(system), (document!.diagnostics ?? []).map(toVacnetDiagnostic), '/work/cache/system.vacnet');
    expect(state.result!.diagnostics.map(strip)).toEqual(headless.diagnostics.map(strip));
  });

  it('holds back the analysis while the file has structural errors, and says so once', async () => {
    const live = createLive();
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM.replace('length 60 ft', 'length 60') });
    const state = await live.analysed(SYSTEM_URI);
    expect(state.status).toBe('blocked');
    expect(state.result!.diagnostics.map((d) => d.code)).toEqual(['analysis-waiting']);
  });

  it('has nothing to analyse in a catalog file', async () => {
    const live = createLive();
    await live.put({ [CATALOG_URI]: CATALOG });
    expect((await live.analysed(CATALOG_URI)).status).toBe('no-system');
  });

  it('keeps only the newest version: a result for an older text is never current', async () => {
    const live = createLive();
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM });
    const first = await live.analysed(SYSTEM_URI);
    // Fix the size (2 in carries: the engine suggested 2.5 in, 2 in is its smallest that spares the inlet).
    const [fixed] = await live.put({ [SYSTEM_URI]: SLOW_SYSTEM.replace('size 4 in', 'size 2 in') });
    const second = await live.analysed(SYSTEM_URI);
    expect(second.version).toBeGreaterThan(first.version);
    expect(second.result!.diagnostics.map((d) => d.code)).not.toContain('slow-carrying-velocity');
    expect(live.cache.current(fixed!)).toBe(second);
  });

  it('reuses the last run for an edit that leaves the model unchanged (a comment)', async () => {
    const live = createLive();
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM });
    const before = await live.analysed(SYSTEM_URI);
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM.replace('system "Slow main" {', '// a note\nsystem "Slow main" {') });
    const after = await live.analysed(SYSTEM_URI);
    expect(after.engineMs).toBe(0);
    expect(after.result!.diagnostics.map((d) => d.message)).toEqual(before.result!.diagnostics.map((d) => d.message));
    // The finding moved down one line with the text.
    expect(after.result!.diagnostics[0]!.range.start.line).toBe(before.result!.diagnostics[0]!.range.start.line + 1);
  });

  it('re-checks a system when a catalog it uses changes', async () => {
    const live = createLive();
    const system = SLOW_SYSTEM.replace(CATALOG, 'use "catalog.vacnet"\n');
    await live.put({ [CATALOG_URI]: CATALOG, [SYSTEM_URI]: system });
    const before = await live.analysed(SYSTEM_URI);
    expect(before.status).toBe('ready');
    const toolBefore = before.result!.analysis!.inlets[0]!.worstCase!.toolVacuumPa;
    // A hose three times as long loses more: the tool gets less vacuum.
    await live.put({ [CATALOG_URI]: CATALOG.replace('hose std-50 length 50 ft', 'hose std-50 length 150 ft') });
    const after = await live.analysed(SYSTEM_URI);
    expect(after.generation).toBeGreaterThan(before.generation);
    expect(after.result!.analysis!.inlets[0]!.worstCase!.toolVacuumPa).toBeLessThan(toolBefore);
  });

  it('drops a result that arrives after a newer version was built, and publishes the newer one', async () => {
    // A runner whose jobs finish only when the test says so, in any order.
    const jobs: { model: SystemModel; finish: (outcome: EngineJobOutcome) => void }[] = [];
    const runner: EngineRunner = {
      run: (_key, model) => new Promise((resolve) => jobs.push({ model, finish: resolve })),
      cancel: () => undefined,
      dispose: () => undefined,
    };
    const live = createLive({ engineRunner: () => runner });
    const texts = live.shared.workspace.TextDocuments!;
    const uri = URI.parse(SYSTEM_URI);
    texts.set(TextDocument.create(SYSTEM_URI, 'vacnet', 1, SLOW_SYSTEM));
    await live.builder.update([uri], []);
    await new Promise((resolve) => setTimeout(resolve, 200)); // past the debounce: the first job started
    texts.set(TextDocument.create(SYSTEM_URI, 'vacnet', 2, SLOW_SYSTEM.replace('size 4 in', 'size 2 in')));
    await live.builder.update([uri], []);
    await new Promise((resolve) => setTimeout(resolve, 200)); // the second job started
    expect(jobs).toHaveLength(2);
    const done = (model: SystemModel): EngineJobOutcome => ({ kind: 'done', run: runEngine(model), ms: 1 });
    jobs[1]!.finish(done(jobs[1]!.model));
    jobs[0]!.finish(done(jobs[0]!.model)); // the old one last
    await new Promise((resolve) => setTimeout(resolve, 10));
    const state = live.cache.state(SYSTEM_URI)!;
    expect(state.version).toBe(2);
    expect(state.status).toBe('ready');
    // Version 2 has the 2 in main: no velocity finding; the late result of version 1 (which had it) was dropped.
    expect(state.result!.diagnostics.map((d) => d.code)).not.toContain('slow-carrying-velocity');
  });
});

function strip(d: { code: string; severity: string; message: string; range: unknown }) {
  return { code: d.code, severity: d.severity, message: d.message, range: d.range };
}
