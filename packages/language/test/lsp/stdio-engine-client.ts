/**
 * A protocol-level session with the BUNDLED language server
 * (packages/extension/dist/server.cjs) for the engine-backed features:
 * collects every publishDiagnostics and waits for a document's analysis
 * through the server's `vacnet/analysisStatus` request.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { startStdioServer, type LspDiagnostic, type StdioServer } from './stdio-client.js';

export const bundledServer = fileURLToPath(new URL('../../../extension/dist/server.cjs', import.meta.url));
export const examplesDir = fileURLToPath(new URL('../../../../examples/', import.meta.url));

export interface PublishedWithVersion {
  uri: string;
  version?: number;
  diagnostics: (LspDiagnostic & { codeDescription?: { href: string }; relatedInformation?: { location: { uri: string }; message: string }[] })[];
}

export interface AnalysisStatus {
  status: string;
  version: number;
  /** The diagnostics of this analysis, engine part included, have been published. */
  published: boolean;
  engineMs: number | null;
}

export interface EngineSession {
  server: StdioServer;
  /** Every publication so far, oldest first. */
  published: PublishedWithVersion[];
  /** The latest diagnostics published for a document. */
  latest(uri: string): PublishedWithVersion | undefined;
  /** Waits until the document's analysis for `version` is in and published; returns its status. */
  settled(uri: string, version: number, timeoutMs?: number): Promise<AnalysisStatus>;
  open(uri: string, text: string, version?: number): Promise<void>;
  change(uri: string, text: string, version: number): Promise<void>;
}

/** Starts the bundled server over stdio, with `workspaceFolder` (if any) as its workspace. */
export async function startEngineSession(options: { workspaceFolder?: string; capabilities?: Record<string, unknown>; configuration?: (section: string) => unknown } = {}): Promise<EngineSession> {
  if (!existsSync(bundledServer)) throw new Error(`${bundledServer} is missing: run \`npm run build\` first`);
  const server = startStdioServer([bundledServer, '--stdio']);
  const published: PublishedWithVersion[] = [];
  server.connection.onNotification('textDocument/publishDiagnostics', (p: PublishedWithVersion) => published.push(p));
  if (options.configuration) {
    const answer = options.configuration;
    server.connection.onRequest('workspace/configuration', (params: { items: { section?: string }[] }) => params.items.map((i) => answer(i.section ?? '')));
  }
  const folder = options.workspaceFolder ? pathToFileURL(options.workspaceFolder).href.replace(/\/$/, '') : null;
  await server.request('initialize', {
    processId: process.pid,
    clientInfo: { name: 'vacnet-engine-test-client' },
    rootUri: folder,
    workspaceFolders: folder ? [{ uri: folder, name: 'workspace' }] : null,
    capabilities: {
      textDocument: { synchronization: { didSave: true }, publishDiagnostics: { relatedInformation: true, versionSupport: true, codeDescriptionSupport: true, dataSupport: true } },
      ...(options.capabilities ?? {}),
    },
  });
  await server.connection.sendNotification('initialized', {});

  const session: EngineSession = {
    server,
    published,
    latest: (uri) => published.filter((p) => p.uri === uri).at(-1),
    async settled(uri, version, timeoutMs = 60_000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const status = await server.request<AnalysisStatus | null>('vacnet/analysisStatus', { uri });
        if (status && status.version === version && status.status !== 'pending' && status.published) return status;
        if (Date.now() > deadline) throw new Error(`analysis of ${uri} v${version} not settled: ${JSON.stringify(status)}; stderr:\n${server.stderr()}`);
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
    },
    async open(uri, text, version = 1) {
      await server.connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'vacnet', version, text } });
    },
    async change(uri, text, version) {
      await server.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version }, contentChanges: [{ text }] });
    },
  };
  return session;
}
