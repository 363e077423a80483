/**
 * The language server entry. The connection picks its transport from the
 * command line: `--stdio` for any editor, `--node-ipc` when the VS Code
 * client starts the bundled server. Started as a worker thread with the
 * engine role, the same file serves airflow analyses instead (see
 * engine-bridge/worker-engine-runner.ts).
 */
import './node-shim.js';
import { isEngineWorker, serveEngineWorker } from './engine-bridge/engine-worker.js';
import { startServer } from './start-server.js';

/** The file this process runs: the bundle itself (CommonJS), else the script node was started with. */
function entryFile(): string | undefined {
  return typeof __filename === 'string' ? __filename : process.argv[1];
}

if (isEngineWorker()) serveEngineWorker();
else startServer(entryFile());
