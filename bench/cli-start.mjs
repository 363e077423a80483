// Benchmark group `cli`: how long `vacnet check` on a small example takes as
// a whole process, against `node -e 0` (Node's own start), alternating the
// two so load on the machine affects both alike.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
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
  return {
    metrics: {
      cli_start_vs_node: { value: Number((checkMs / nodeMs).toFixed(2)), unit: 'x', target: START_VS_NODE_TARGET },
    },
    notes: [`node -e 0: ${nodeMs.toFixed(0)} ms; vacnet check examples/detached-house.vacnet: ${checkMs.toFixed(0)} ms (medians of ${RUNS} alternating runs)`],
  };
}
