/**
 * The language server as a web worker, for the browser-based editor: the
 * same services as the Node server, speaking LSP over the worker's
 * postMessage. There is no file system in a browser: the server works on
 * the documents the editor opens (a catalog a system uses is found when it
 * is open too). The airflow analysis runs on this worker's own thread (the
 * Node server's separate analysis thread needs worker_threads), which is
 * already off the editor's thread.
 */
import './node-shim.js';
import { EmptyFileSystem } from 'langium';
import { startLanguageServer } from 'langium/lsp';
import { BrowserMessageReader, BrowserMessageWriter, createConnection, ProposedFeatures } from 'vscode-languageserver/browser';
import { createVacnetServices } from './vacnet-module.js';
import { InProcessEngineRunner } from './engine-bridge/engine-runner.js';

/** A request of our own, as the Node server answers it: `{ uri }` -> where the document's analysis stands, or null. */
const ANALYSIS_STATUS_REQUEST = 'vacnet/analysisStatus';

// The worker's global scope is the message port.
const port = self as unknown as DedicatedWorkerGlobalScope;
const connection = createConnection(ProposedFeatures.all, new BrowserMessageReader(port), new BrowserMessageWriter(port));
const { shared, Vacnet } = createVacnetServices(
  { connection, ...EmptyFileSystem },
  // No install folder: rule pages link through the `vacnet.rulesDocsBaseUrl` setting only.
  { liveAnalysis: true, engineRunner: () => new InProcessEngineRunner(), installDir: '' },
);
connection.onRequest(ANALYSIS_STATUS_REQUEST, (params: { uri?: unknown }) => {
  const state = typeof params?.uri === 'string' ? Vacnet.engine.AnalysisCache.state(params.uri) : undefined;
  if (!state) return null;
  const published = Vacnet.lsp.DiagnosticsPublisher.hasPublishedFinal(params.uri as string);
  return { status: state.status, version: state.version, published, engineMs: state.engineMs ?? null };
});
startLanguageServer(shared);

/** The part of a dedicated worker's global scope the connection uses (the DOM lib is not in this package's types). */
interface DedicatedWorkerGlobalScope {
  postMessage(message: unknown): void;
  addEventListener(type: 'message', listener: (event: { data: unknown }) => void): void;
}
declare const self: unknown;
