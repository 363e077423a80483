import { commands, window, type ExtensionContext, type TextDocument, type Uri } from 'vscode';
import type { BaseLanguageClient } from 'vscode-languageclient';
import { SummaryStatusBar } from './status-bar.js';
import { ReportViews } from './report-view.js';
import { CheckTaskProvider, runWorkspaceCheck, CHECK_TASK_TYPE } from './check-task.js';
import { openExample } from './example-command.js';
import { vacnetDocument } from './active-document.js';

/** What differs between the desktop and the browser. */
export interface ExtensionHost {
  kind: 'desktop' | 'web';
  /** The bundled command line (desktop): checks run it as a task. */
  cli?: string;
  /** Compares a file with its last committed version (desktop). */
  compare?: (document: TextDocument) => Promise<void>;
}

/**
 * The editor features every host shares: commands, the status bar item,
 * the report and schematic views, the check task; then the language client.
 * Commands are registered first, so they answer even if the server fails.
 */
export async function startExtension(context: ExtensionContext, client: BaseLanguageClient, host: ExtensionHost): Promise<void> {
  const views = new ReportViews(context, client);
  const statusBar = new SummaryStatusBar(client);
  context.subscriptions.push(views, statusBar);

  context.subscriptions.push(
    commands.registerCommand('vacnet.openReport', (uri?: Uri) => views.open('report', uri)),
    commands.registerCommand('vacnet.openSchematic', (uri?: Uri) => views.open('schematic', uri)),
    commands.registerCommand('vacnet.compareWithCommitted', async (uri?: Uri) => {
      const document = await vacnetDocument(uri);
      if (!document) return;
      if (!host.compare) {
        void window.showInformationMessage('Comparing with the last commit needs git and a local folder: it is not available in the browser.');
        return;
      }
      await host.compare(document);
    }),
    commands.registerCommand('vacnet.checkWorkspace', async () => {
      if (!host.cli) {
        void window.showInformationMessage('`vacnet check` runs on a local folder: it is not available in the browser. The open files are still checked as you type.');
        return;
      }
      await runWorkspaceCheck(host.cli);
    }),
    commands.registerCommand('vacnet.openExample', () => openExample(context)),
    commands.registerCommand('vacnet.restartServer', async () => {
      await client.stop();
      await client.start();
      statusBar.refresh();
    }),
  );
  if (host.cli) context.subscriptions.push(new CheckTaskProvider(host.cli).register(CHECK_TASK_TYPE));

  await client.start();
  statusBar.refresh();
}
