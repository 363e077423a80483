// `npm run bench`: runs the benchmark groups and merges their metrics into
// bench/results.json, keeping metrics that other groups wrote earlier.
//
//   node bench/run.mjs            every group
//   node bench/run.mjs parse      only the named groups
//
// A group is a module in bench/ exporting `run()` that resolves to
// { metrics: { <name>: { value, unit, target, higherIsBetter? } }, notes?: string[] }.
// Add a group by adding a line to GROUPS. Benchmarks need the build
// (`npm run build`): they import the packages' compiled output.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';

const GROUPS = {
  parse: './parse.mjs',
  cli: './cli-start.mjs',
  lsp: './lsp-session.mjs',
  engine: './engine.mjs',
};

const resultsFile = new URL('./results.json', import.meta.url);

const requested = process.argv.slice(2);
for (const name of requested) {
  if (!(name in GROUPS)) {
    console.error(`bench: no group '${name}' (groups: ${Object.keys(GROUPS).join(', ')})`);
    process.exit(2);
  }
}
const names = requested.length > 0 ? requested : Object.keys(GROUPS);

console.log(`node ${process.version}, ${os.cpus().length} x ${os.cpus()[0]?.model ?? 'cpu'}, ${os.platform()} ${os.arch()}`);

// A group that fails is reported and skipped; the others' results are still written.
const fresh = {};
const failed = [];
for (const name of names) {
  console.log(`\n## ${name}`);
  try {
    const group = await import(GROUPS[name]);
    const { metrics, notes = [] } = await group.run();
    for (const note of notes) console.log(note);
    Object.assign(fresh, metrics);
  } catch (error) {
    console.error(`bench: group '${name}' failed: ${error instanceof Error ? error.message : String(error)}`);
    failed.push(name);
  }
}

printTable(fresh);

const previous = readResults();
const merged = { ...previous, metrics: { ...(previous.metrics ?? {}) } };
for (const [name, metric] of Object.entries(fresh)) {
  merged.metrics[name] = { value: metric.value, unit: metric.unit, target: metric.target };
}
writeFileSync(resultsFile, JSON.stringify(merged, null, 2) + '\n');
console.log(`\nwrote ${Object.keys(fresh).length} metrics to bench/results.json (${Object.keys(merged.metrics).length} in all)`);
if (failed.length > 0) {
  console.error(`bench: failed groups: ${failed.join(', ')}`);
  process.exitCode = 1;
}

function readResults() {
  if (!existsSync(resultsFile)) return { metrics: {} };
  try {
    const parsed = JSON.parse(readFileSync(resultsFile, 'utf8'));
    return parsed && typeof parsed === 'object' && !Array.isArray(parsed) ? parsed : { metrics: {} };
  } catch {
    console.warn('bench: bench/results.json was not valid JSON; starting it afresh');
    return { metrics: {} };
  }
}

function printTable(metrics) {
  const rows = Object.entries(metrics).map(([name, m]) => {
    const met = m.higherIsBetter ? m.value >= m.target : m.value <= m.target;
    return [name, `${m.value} ${m.unit}`, `${m.higherIsBetter ? '>=' : '<='} ${m.target} ${m.unit}`, met ? 'met' : 'MISSED'];
  });
  const header = ['metric', 'value', 'target', ''];
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells) => cells.map((c, i) => c.padEnd(widths[i])).join('  ').trimEnd();
  console.log('\n' + line(header));
  console.log(line(widths.map((w) => '-'.repeat(w))));
  for (const row of rows) console.log(line(row));
}
