// The server's requests about one system (`vacnet/systemSummary`,
// `vacnet/reportData`), over the real protocol against the bundled server.
// The summary's producer margin, operating point and worst inlet are checked
// against the text `vacnet check` prints for the same file (the command
// line's own summary, an implementation of its own), and the report data
// against the headless loader's model and analysis.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDocuments } from '../../src/document.js';
import { decodePlainData, encodePlainData, REPORT_DATA_REQUEST, SYSTEM_SUMMARY_REQUEST, type ReportData, type SystemSummary } from '../../src/lsp/system-requests-protocol.js';
import { shutdown } from './stdio-client.js';
import { SLOW_SYSTEM } from './live-services.js';
import { examplesDir, startEngineSession, type EngineSession } from './stdio-engine-client.js';

const cli = fileURLToPath(new URL('../../../cli/bin/vacnet.js', import.meta.url));
const SYSTEMS = ['detached-house', 'grinding-plant', 'harbour-offices', 'primary-school'];

describe('the wire format of the report data', () => {
  it('keeps NaN and the infinities that JSON would turn into null', () => {
    const value = { a: Number.NaN, b: [Number.POSITIVE_INFINITY, 1.5, Number.NEGATIVE_INFINITY], c: { d: null, e: 'x' } };
    const back = decodePlainData<typeof value>(encodePlainData(value));
    expect(Number.isNaN(back.a)).toBe(true);
    expect(back.b).toEqual([Number.POSITIVE_INFINITY, 1.5, Number.NEGATIVE_INFINITY]);
    expect(back.c).toEqual({ d: null, e: 'x' });
    // An object that only looks like the marker, with more keys, is left alone.
    expect(decodePlainData('{"$vacnetNonFinite":"NaN","other":1}')).toEqual({ $vacnetNonFinite: 'NaN', other: 1 });
  });
});

describe('vacnet/systemSummary and vacnet/reportData (bundled server)', () => {
  let session: EngineSession;

  beforeAll(async () => {
    session = await startEngineSession({ workspaceFolder: examplesDir });
  });

  afterAll(async () => {
    if (session.server.child.exitCode === null) expect(await shutdown(session.server)).toBe(0);
  });

  it.each(SYSTEMS)('%s: the producer margin, operating point and worst inlet that `vacnet check` prints', async (name) => {
    const file = join(examplesDir, `${name}.vacnet`);
    const uri = pathToFileURL(file).href;
    await session.open(uri, readFileSync(file, 'utf8'));
    await session.settled(uri, 1);
    const summary = await session.server.request<SystemSummary>(SYSTEM_SUMMARY_REQUEST, { uri });
    const text = spawnSync(process.execPath, [cli, 'check', file], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' }, timeout: 120_000 }).stdout;
    // `  producer plant.producer: 244 scfm at 11.3 inHg, margin 29 % on flow; ...`
    const producer = /^ {2}producer (\S+): (.+?), (margin \S+ %) on flow;/m.exec(text);
    // `  worst inlet B6: 6.18 inHg at the tool (needs 5.00 inHg), 122 scfm ...`
    const worst = /^ {2}worst inlet (\S+): (.+?), [\d.]+ \S+/m.exec(text);
    expect(producer, text).not.toBeNull();
    expect(summary.status).toBe('ready');
    expect(summary.system).toBe(/: "(.*)"$/m.exec(text)![1]);
    expect(summary.producer).toMatchObject({ name: producer![1], pointText: producer![2], marginText: producer![3] });
    expect(summary.worstInlet).toMatchObject({ name: worst![1], text: worst![2] });
    expect(summary.counts.errors).toBe(0);
  });

  it('the report data is the model and analysis the headless loader makes', async () => {
    const file = join(examplesDir, 'harbour-offices.vacnet');
    const uri = pathToFileURL(file).href;
    await session.settled(uri, 1);
    const data = await session.server.request<ReportData>(REPORT_DATA_REQUEST, { uri });
    const input = decodePlainData<{ path: string; model: unknown; analysis: unknown; diagnostics: unknown[]; accepted: unknown[] }>(data.input);
    const loaded = (await loadDocuments([file], { analyse: true })).files[0]!;
    expect(input.path).toBe(file);
    expect(input.model).toEqual(JSON.parse(JSON.stringify(loaded.model)));
    expect(input.analysis).toEqual(JSON.parse(JSON.stringify(loaded.analysis)));
    expect(input.accepted).toEqual(JSON.parse(JSON.stringify(loaded.accepted)));
    expect(input.diagnostics).toEqual(JSON.parse(JSON.stringify(loaded.diagnostics)));
  });

  it('follows an edit: a file with an error is blocked and has no producer numbers; fixed, it is ready again', async () => {
    const uri = pathToFileURL('/tmp/vacnet-system-requests/slow.vacnet').href;
    await session.open(uri, SLOW_SYSTEM);
    await session.settled(uri, 1);
    expect((await session.server.request<SystemSummary>(SYSTEM_SUMMARY_REQUEST, { uri })).counts.warnings).toBeGreaterThan(0);
    await session.change(uri, SLOW_SYSTEM.replace('length 60 ft', 'length 60'), 2);
    await session.settled(uri, 2);
    const blocked = await session.server.request<SystemSummary>(SYSTEM_SUMMARY_REQUEST, { uri });
    expect(blocked).toMatchObject({ version: 2, status: 'blocked', system: 'Slow main' });
    expect(blocked.producer).toBeUndefined();
    expect(blocked.counts.errors).toBe(1);
    await session.change(uri, SLOW_SYSTEM, 3);
    await session.settled(uri, 3);
    expect(await session.server.request<SystemSummary>(SYSTEM_SUMMARY_REQUEST, { uri })).toMatchObject({ version: 3, status: 'ready' });
  });

  it('answers null at once for a catalog-free unknown document and for bad parameters', async () => {
    const started = Date.now();
    expect(await session.server.request(SYSTEM_SUMMARY_REQUEST, { uri: 'file:///nowhere/never-opened.vacnet' })).toBeNull();
    expect(await session.server.request(REPORT_DATA_REQUEST, { uri: 42 })).toBeNull();
    expect(await session.server.request(SYSTEM_SUMMARY_REQUEST, null)).toBeNull();
    expect(await session.server.request(SYSTEM_SUMMARY_REQUEST, { uri: '::not a uri::' })).toBeNull();
    expect(Date.now() - started).toBeLessThan(5_000);
  });

  it('a catalog file has no system to summarise', async () => {
    const uri = pathToFileURL(join(examplesDir, 'catalog', 'equipment.vacnet')).href;
    await session.open(uri, readFileSync(fileURLToPath(uri), 'utf8'));
    await session.settled(uri, 1);
    const summary = await session.server.request<SystemSummary>(SYSTEM_SUMMARY_REQUEST, { uri });
    expect(summary).toMatchObject({ status: 'no-system' });
    expect(summary.system).toBeUndefined();
  });
});
