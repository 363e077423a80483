#!/usr/bin/env node
// Launcher for the `vacnet` command: loads the bundled command line that
// `npm run build` writes to dist/vacnet.mjs (one file, so it starts fast).
import { existsSync } from 'node:fs';

const bundle = new URL('../dist/vacnet.mjs', import.meta.url);
if (!existsSync(bundle)) {
  process.stderr.write('vacnet: the command line is not built yet; run `npm run build` in the repository root.\n');
  process.exitCode = 2;
} else {
  const { main } = await import(bundle.href);
  process.exitCode = await main(process.argv);
}
