/**
 * The entry of the extension in the browser-based editor: the language
 * server runs as a web worker (dist/browser-server.js) and the client speaks
 * LSP to it over postMessage. Everything but the command line (checks and
 * comparisons need a local folder) works as on the desktop.
 */
import { Uri, type ExtensionContext } from 'vscode';
import { LanguageClient } from 'vscode-languageclient/browser';
import { clientOptions } from './client-options.js';
import { startExtension } from './start-extension.js';

/** The browser's Worker (the DOM library is not in this package's types). */
declare const Worker: new (url: string) => ConstructorParameters<typeof LanguageClient>[3];

let client: LanguageClient | undefined;

export async function activate(context: ExtensionContext): Promise<void> {
  const serverMain = Uri.joinPath(context.extensionUri, 'dist', 'browser-server.js');
  const worker = new Worker(serverMain.toString(true));
  client = new LanguageClient('vacnet', 'vacnet language server', clientOptions(context, 'web'), worker);
  await startExtension(context, client, { kind: 'web' });
}

export async function deactivate(): Promise<void> {
  const running = client;
  client = undefined;
  if (running) await running.stop();
}
