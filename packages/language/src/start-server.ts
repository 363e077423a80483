import * as path from 'node:path';
import { startLanguageServer } from 'langium/lsp';
import { NodeFileSystem } from 'langium/node';
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { createVacnetServices } from './vacnet-module.js';
import { WorkerEngineRunner } from './engine-bridge/worker-engine-runner.js';
import { ProjectSettingsCache } from './engine-bridge/project-settings-cache.js';
import { idleCollector } from './idle-collection.js';

/**
 * Starts the language server on the transport given on the command line.
 * `entry` is the script this process runs (the bundled server, or the bin):
 * the engine's worker thread starts from it too.
 */
export function startServer(entry: string | undefined): void {
  const connection = createConnection(ProposedFeatures.all);
  const { shared, Vacnet } = createVacnetServices(
    { connection, ...NodeFileSystem },
    {
      liveAnalysis: true,
      projectSettings: () => new ProjectSettingsCache(),
      ...(entry ? { engineRunner: () => new WorkerEngineRunner(entry), installDir: path.dirname(entry) } : {}),
    },
  );
  // Where a document's analysis stands, for clients that show progress (and for tests): see docs/editor-settings.md.
  connection.onRequest(ANALYSIS_STATUS_REQUEST, (params: { uri?: unknown }) => {
    const state = typeof params?.uri === 'string' ? Vacnet.engine.AnalysisCache.state(params.uri) : undefined;
    if (!state) return null;
    const published = Vacnet.lsp.DiagnosticsPublisher.hasPublishedFinal(params.uri as string);
    return { status: state.status, version: state.version, published, engineMs: state.engineMs ?? null };
  });
  const collector = idleCollector();
  Vacnet.engine.AnalysisCache.onDidChange((state) => {
    if (state.status !== 'pending') collector.activity();
  });
  startLanguageServer(shared);
}

/** A request of our own: `{ uri }` -> `{ status, version, published, engineMs }` of the document's analysis, or null. */
export const ANALYSIS_STATUS_REQUEST = 'vacnet/analysisStatus';
