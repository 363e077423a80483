/**
 * A real LSP client for tests: spawns a server process, speaks JSON-RPC over
 * its stdin/stdout with vscode-jsonrpc (the library VS Code's own client is
 * built on), and collects what the server publishes.
 */
import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import {
  createMessageConnection,
  StreamMessageReader,
  StreamMessageWriter,
  type MessageConnection,
} from 'vscode-jsonrpc/node';

export interface LspDiagnostic {
  range: { start: { line: number; character: number }; end: { line: number; character: number } };
  severity?: number;
  code?: string | number;
  message: string;
  data?: { code?: string } & Record<string, unknown>;
}

export interface PublishedDiagnostics {
  uri: string;
  diagnostics: LspDiagnostic[];
}

export interface StdioServer {
  connection: MessageConnection;
  child: ChildProcessWithoutNullStreams;
  /** Everything the server wrote to stderr so far (for failure messages). */
  stderr(): string;
  /** Sends a request; rejects with the server's stderr if the process ends first. */
  request<T>(method: string, params?: unknown): Promise<T>;
  /** Resolves with the next diagnostics published for `uri`. */
  nextDiagnostics(uri: string, timeoutMs: number): Promise<PublishedDiagnostics>;
  /** Resolves with the exit code once the process ends. */
  exited: Promise<number | null>;
}

/** Starts `node <args...>` and connects to it over stdio. */
export function startStdioServer(args: string[], cwd?: string): StdioServer {
  const child = spawn(process.execPath, args, { cwd, stdio: ['pipe', 'pipe', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString('utf8')));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  // A server that dies (e.g. on a broken build) must fail the test at once, with its stderr.
  const died = exited.then((code) => {
    throw new Error(`server exited with code ${code}; stderr:\n${stderr}`);
  });
  died.catch(() => undefined);

  const connection = createMessageConnection(
    new StreamMessageReader(child.stdout),
    new StreamMessageWriter(child.stdin),
  );
  const waiting = new Map<string, ((published: PublishedDiagnostics) => void)[]>();
  connection.onNotification('textDocument/publishDiagnostics', (published: PublishedDiagnostics) => {
    const waiters = waiting.get(published.uri) ?? [];
    waiting.delete(published.uri);
    for (const resolve of waiters) resolve(published);
  });
  // Requests from the server we do not model (registrations, configuration) get an empty answer.
  connection.onRequest(() => null);
  connection.listen();

  return {
    connection,
    child,
    stderr: () => stderr,
    exited,
    request<T>(method: string, params?: unknown) {
      return Promise.race([connection.sendRequest<T>(method, params), died]);
    },
    nextDiagnostics(uri, timeoutMs) {
      const published = new Promise<PublishedDiagnostics>((resolve, reject) => {
        const timer = setTimeout(
          () => reject(new Error(`no diagnostics for ${uri} within ${timeoutMs} ms; stderr:\n${stderr}`)),
          timeoutMs,
        );
        const list = waiting.get(uri) ?? [];
        list.push((published) => {
          clearTimeout(timer);
          resolve(published);
        });
        waiting.set(uri, list);
      });
      return Promise.race([published, died]);
    },
  };
}

/** The initialize request a minimal editor sends: no workspace folders, plain diagnostics. */
export function initializeParams(): Record<string, unknown> {
  return {
    processId: process.pid,
    clientInfo: { name: 'vacnet-test-client' },
    rootUri: null,
    workspaceFolders: null,
    capabilities: {
      textDocument: {
        synchronization: { didSave: true },
        publishDiagnostics: { relatedInformation: true },
      },
    },
  };
}

/** Sends shutdown then exit, and resolves with the process exit code. */
export async function shutdown(server: StdioServer): Promise<number | null> {
  await server.request('shutdown');
  await server.connection.sendNotification('exit');
  const code = await server.exited;
  server.connection.dispose();
  return code;
}
