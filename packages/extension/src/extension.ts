/**
 * The VS Code side of vacnet: a language client and nothing else. It starts
 * the bundled language server (dist/server.cjs) over IPC for .vacnet files;
 * all language logic lives in the server.
 */
import * as path from 'node:path';
import { workspace, type ExtensionContext } from 'vscode';
import {
  LanguageClient,
  TransportKind,
  type LanguageClientOptions,
  type ServerOptions,
} from 'vscode-languageclient/node';

let client: LanguageClient | undefined;

export async function activate(context: ExtensionContext): Promise<void> {
  const serverModule = context.asAbsolutePath(path.join('dist', 'server.cjs'));
  const serverOptions: ServerOptions = {
    run: { module: serverModule, transport: TransportKind.ipc },
    // Debug: a debugger can attach to the server on port 6009 (any free port; VS Code's LSP sample uses it).
    debug: {
      module: serverModule,
      transport: TransportKind.ipc,
      options: { execArgv: ['--nolazy', '--inspect=6009'] },
    },
  };
  // A catalog file changed on disk (or by git) re-checks the systems that use it.
  const watcher = workspace.createFileSystemWatcher('**/*.vacnet');
  context.subscriptions.push(watcher);
  const clientOptions: LanguageClientOptions = {
    documentSelector: [
      { scheme: 'file', language: 'vacnet' },
      { scheme: 'untitled', language: 'vacnet' },
    ],
    synchronize: { fileEvents: watcher },
  };
  client = new LanguageClient('vacnet', 'vacnet language server', serverOptions, clientOptions);
  await client.start();
}

export async function deactivate(): Promise<void> {
  const running = client;
  client = undefined;
  if (running) await running.stop();
}
