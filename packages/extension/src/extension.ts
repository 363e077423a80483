/**
 * The desktop entry of the extension: starts the bundled language server
 * (dist/server.cjs) as a Node process over IPC, then the editor features
 * every host shares (start-extension.ts). All language logic lives in the
 * server; the bundled command line (dist/cli.mjs) runs checks and
 * comparisons as tasks and child processes.
 */
import * as path from 'node:path';
import type { ExtensionContext } from 'vscode';
import { LanguageClient, TransportKind, type ServerOptions } from 'vscode-languageclient/node';
import { clientOptions } from './client-options.js';
import { startExtension } from './start-extension.js';
import { compareWithCommitted } from './compare-command.js';

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
  client = new LanguageClient('vacnet', 'vacnet language server', serverOptions, clientOptions(context, 'desktop'));
  const cli = context.asAbsolutePath(path.join('dist', 'cli.mjs'));
  await startExtension(context, client, {
    kind: 'desktop',
    cli,
    compare: (document) => compareWithCommitted(context, document, cli),
  });
}

export async function deactivate(): Promise<void> {
  const running = client;
  client = undefined;
  if (running) await running.stop();
}
