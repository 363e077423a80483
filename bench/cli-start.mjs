// Benchmark group `cli`: how long `vacnet check` on a small example takes as
// a whole process, against `node -e 0` (Node's own start), alternating the
// two so load on the machine affects both alike; and how many files one
// `vacnet check` call gets through when a project holds 200 systems.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir, loadavg } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** `vacnet check` may take at most this multiple of Node's own start (issue 5). */
const START_VS_NODE_TARGET = 8;
const RUNS = 21;

const root = fileURLToPath(new URL('..', import.meta.url));
const bin = `${root}packages/cli/bin/vacnet.js`;
const example = `${root}examples/detached-house.vacnet`;

function wallMs(args) {
  const t0 = performance.now();
  const run = spawnSync(process.execPath, args, { stdio: 'ignore', cwd: root });
  const elapsed = performance.now() - t0;
  // 1 means the example has findings: still a complete check, so still a valid timing.
  if (run.status !== 0 && run.status !== 1) throw new Error(`node ${args.join(' ')} exited ${run.status}`);
  return elapsed;
}

const median = (values) => [...values].sort((a, b) => a - b)[values.length >> 1];

/** Systems in the many-files check (issue 5). */
const MANY_FILES = 200;
/** Our own budget: a 200-system project checked in 10 s in a build pipeline, so at least 20 files/s. */
const MANY_FILES_TARGET_PER_S = 20;
const MANY_RUNS = 3;

/**
 * 200 systems in four folders, each folder with the starter catalog
 * `vacnet init` writes for one to four operators and 50 variants of its
 * starter system (main lengths and titles differ), so every file is
 * analysed in full. Returns the folder.
 */
function generateProject() {
  const project = mkdtempSync(join(tmpdir(), 'vacnet-bench-many-'));
  const perFolder = MANY_FILES / 4;
  for (let operators = 1; operators <= 4; operators++) {
    const folder = join(project, `operators-${operators}`);
    mkdirSync(folder);
    const init = spawnSync(process.execPath, [bin, 'init', '--operators', String(operators), '--name', 'Generated', 'starter.vacnet'], { cwd: folder, encoding: 'utf8' });
    if (init.status !== 0) throw new Error(`vacnet init failed: ${init.stderr}`);
    const starter = readFileSync(join(folder, 'starter.vacnet'), 'utf8');
    rmSync(join(folder, 'starter.vacnet'));
    for (let i = 0; i < perFolder; i++) {
      const text = starter.replace('system "Generated"', `system "Generated ${operators}-${i}"`).replace(/length 40 ft/g, `length ${30 + (i % 23)} ft`);
      writeFileSync(join(folder, `system-${String(i).padStart(2, '0')}.vacnet`), text);
    }
  }
  return project;
}

export async function run() {
  if (!existsSync(example)) throw new Error(`${example} is missing`);
  const node = [];
  const check = [];
  wallMs(['-e', '0']);
  wallMs([bin, 'check', example]);
  for (let i = 0; i < RUNS; i++) {
    node.push(wallMs(['-e', '0']));
    check.push(wallMs([bin, 'check', example]));
  }
  const nodeMs = median(node);
  const checkMs = median(check);

  const project = generateProject();
  let manyMs;
  try {
    const runs = [];
    for (let i = 0; i < MANY_RUNS; i++) runs.push(wallMs([bin, 'check', project]));
    manyMs = median(runs);
  } finally {
    rmSync(project, { recursive: true, force: true });
  }
  const filesPerS = MANY_FILES / (manyMs / 1000);
  return {
    metrics: {
      cli_start_vs_node: { value: Number((checkMs / nodeMs).toFixed(2)), unit: 'x', target: START_VS_NODE_TARGET },
      check_many_files_per_s: { value: Number(filesPerS.toFixed(1)), unit: 'files/s', target: MANY_FILES_TARGET_PER_S, higherIsBetter: true },
    },
    notes: [
      `node -e 0: ${nodeMs.toFixed(0)} ms; vacnet check examples/detached-house.vacnet: ${checkMs.toFixed(0)} ms (medians of ${RUNS} alternating runs)`,
      `vacnet check on ${MANY_FILES} generated systems (and their 4 catalogs) in one call: ${manyMs.toFixed(0)} ms (median of ${MANY_RUNS}), load average ${loadavg()[0].toFixed(1)}`,
    ],
  };
}
