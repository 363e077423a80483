import * as path from 'node:path';
import { startLanguageServer } from 'langium/lsp';
import { NodeFileSystem } from 'langium/node';
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { createVacnetServices } from './vacnet-module.js';
import { WorkerEngineRunner } from './engine-bridge/worker-engine-runner.js';

/**
 * Starts the language server on the transport given on the command line.
 * `entry` is the script this process runs (the bundled server, or the bin):
 * the engine's worker thread starts from it too.
 */
export function startServer(entry: string | undefined): void {
  const connection = createConnection(ProposedFeatures.all);
  const { shared } = createVacnetServices(
    { connection, ...NodeFileSystem },
    {
      liveAnalysis: true,
      ...(entry ? { engineRunner: () => new WorkerEngineRunner(entry), installDir: path.dirname(entry) } : {}),
    },
  );
  startLanguageServer(shared);
}
