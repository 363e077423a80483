// Benchmark group `parse`: how long the language takes to read a system
// (parse + link + the validation the headless loader runs) compared with
// JSON.parse of the same network written as JSON, in the same process; and
// how much heap a large system holds.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { EmptyFileSystem, URI } from 'langium';
import { createVacnetServices, lowerSystem } from '@vacnet/language';
import { generateSystem } from './generate-system.mjs';

/** The language's time may be at most this multiple of JSON.parse's on the 1,000-inlet file (issue 2). */
const PARSE_VS_JSON_TARGET = 20;
/** 0.1 s: the limit for a response to feel immediate (Nielsen, Usability Engineering, 1993, ch. 5). */
const AS_YOU_TYPE_MS_TARGET = 100;
/** Our own budget for the heap of a process holding a 5,000-inlet system: well inside Node's default old-space limit. */
const HEAP_MB_TARGET = 512;

/** Timed runs per size after `warmup` untimed ones; fewer for the large file, whose runs take longest. */
const SIZES = [
  { inlets: 100, label: '100', warmup: 5, runs: 15 },
  { inlets: 1000, label: '1k', warmup: 3, runs: 9 },
  { inlets: 5000, label: '5k', warmup: 1, runs: 5 },
];
const JSON_WARMUP_RUNS = 3;

const median = (values) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};
const round = (value, digits) => Number(value.toFixed(digits));

/** Heap of a separate process holding a generated system (bench/hold-system.mjs), after full collections. */
function holdSystem(inlets) {
  const script = fileURLToPath(new URL('./hold-system.mjs', import.meta.url));
  const child = spawnSync(process.execPath, ['--expose-gc', script, String(inlets)], { encoding: 'utf8' });
  if (child.status !== 0) throw new Error(`hold-system.mjs failed: ${child.stderr}`);
  const result = JSON.parse(child.stdout);
  if (result.errors > 0) throw new Error(`the generated ${inlets}-inlet system has ${result.errors} errors`);
  return result;
}

/**
 * A reader on its own language services. `read(text)` parses, then links and
 * validates, and lowers the system; the document stays loaded until
 * `unload()`, which removes it through the builder so the index and caches
 * let go of it too.
 */
function createReader() {
  const { shared } = createVacnetServices(EmptyFileSystem);
  const documents = shared.workspace.LangiumDocuments;
  const builder = shared.workspace.DocumentBuilder;
  let counter = 0;
  return async function read(text) {
    const uri = URI.parse(`memory:///bench/system-${counter++}.vacnet`);
    const t0 = performance.now();
    const document = documents.createDocument(uri, text);
    const t1 = performance.now();
    await builder.build([document], { validation: true });
    const t2 = performance.now();
    lowerSystem(document.parseResult.value.systems[0]);
    const t3 = performance.now();
    const errors = (document.diagnostics ?? []).filter((d) => d.severity === 1);
    // Only numbers are kept, so no document outlives its run.
    return { parse: t1 - t0, linkValidate: t2 - t1, lower: t3 - t2, errors, unload: () => builder.update([], [uri]) };
  };
}

export async function run() {
  const readSystem = createReader();

  const metrics = {};
  const notes = [];
  const table = [['inlets', 'pipes', 'text KB', 'parse ms', 'link+validate ms', 'total ms', 'JSON KB', 'JSON.parse ms', 'ratio', '(lowering ms)']];
  for (const size of SIZES) {
    const system = generateSystem(size.inlets);

    // A benchmark of a file with errors would measure error recovery, not reading.
    const first = await readSystem(system.text);
    await first.unload();
    if (first.errors.length > 0) {
      throw new Error(`the generated ${size.inlets}-inlet system has errors, e.g. line ${first.errors[0].range.start.line + 1}: ${first.errors[0].message}`);
    }

    const samples = [];
    for (let i = 0; i < size.warmup + size.runs; i++) {
      const sample = await readSystem(system.text);
      await sample.unload();
      if (i >= size.warmup) samples.push(sample);
    }
    const parse = median(samples.map((s) => s.parse));
    const linkValidate = median(samples.map((s) => s.linkValidate));
    const total = median(samples.map((s) => s.parse + s.linkValidate));
    const lower = median(samples.map((s) => s.lower));

    // JSON.parse is fast: time batches so the clock's resolution does not matter.
    const batch = Math.max(1, Math.round(2e6 / system.json.length));
    const jsonSamples = [];
    let sink = 0;
    for (let i = 0; i < JSON_WARMUP_RUNS + 15; i++) {
      const t0 = performance.now();
      for (let j = 0; j < batch; j++) sink += JSON.parse(system.json).system.pipes.length;
      const elapsed = (performance.now() - t0) / batch;
      if (i >= JSON_WARMUP_RUNS) jsonSamples.push(elapsed);
    }
    if (sink === 0) throw new Error('JSON.parse produced no pipes');
    const json = median(jsonSamples);
    const ratio = total / json;

    table.push([
      String(system.counts.inlets), String(system.counts.pipes), (system.counts.bytes / 1024).toFixed(0),
      parse.toFixed(1), linkValidate.toFixed(1), total.toFixed(1),
      (system.counts.jsonBytes / 1024).toFixed(0), json.toFixed(3), ratio.toFixed(1), lower.toFixed(1),
    ]);
    metrics[`parse_vs_json_${size.label}`] = { value: round(ratio, 1), unit: 'x', target: PARSE_VS_JSON_TARGET };
    // The as-you-type budget applies to a large but ordinary building.
    if (size.label === '1k') metrics.parse_ms_1k = { value: round(total, 1), unit: 'ms', target: AS_YOU_TYPE_MS_TARGET };
  }

  // Heap: a process of its own holding the 5,000-inlet system.
  const held = holdSystem(5000);
  metrics.heap_used_mb_5k = { value: round(held.heapUsedMB, 1), unit: 'MB', target: HEAP_MB_TARGET };
  notes.push(printable(table));
  notes.push(`heap used by a process holding the 5,000-inlet system: ${held.heapUsedMB.toFixed(1)} MB (the document itself: ${held.documentMB.toFixed(1)} MB)`);
  notes.push('ratio = (parse + link + validate) / JSON.parse of the same network as JSON; medians after warm-up');
  return { metrics, notes };
}

function printable(rows) {
  const widths = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  return rows.map((r) => r.map((c, i) => c.padStart(widths[i])).join('  ')).join('\n');
}
