#!/usr/bin/env node
// The vacnet language server for any editor: `vacnet-lsp --stdio`.
// Runs the compiled server of this package (build first: `npm run build`).
import { isMainThread } from 'node:worker_threads';

const usage = `usage: vacnet-lsp --stdio | --node-ipc | --socket=<port> | --pipe=<name>
Speaks the Language Server Protocol for .vacnet files over the chosen transport.`;

const args = process.argv.slice(2);
const transport = args.some(
  (arg) => arg === '--stdio' || arg === '--node-ipc' || /^--(socket|pipe)(=|$)/.test(arg),
);

if (!isMainThread) {
  // The server's analysis thread starts from this same script (see src/main.ts).
  await import('../dist/main.js');
} else if (args.includes('--help') || args.includes('-h')) {
  process.stdout.write(`${usage}\n`);
} else if (!transport) {
  // Without a transport the connection cannot start: say how, exit as a usage error.
  process.stderr.write(`vacnet-lsp: no transport given\n${usage}\n`);
  process.exitCode = 2;
} else {
  await import('../dist/main.js');
}
