import { execFile } from 'node:child_process';
import * as path from 'node:path';
import { ProgressLocation, Uri, ViewColumn, window, type ExtensionContext, type TextDocument } from 'vscode';
import { markdownPage } from './report-page.js';
import { newNonce } from './webview-policy.js';

/** Longest a comparison may take, ms (our choice: both sides analysed, far above the examples' second or two). */
const COMPARE_LIMIT_MS = 120_000;

/**
 * Compares a file with its last committed version by running the bundled
 * `vacnet compare HEAD:<file> <file>` (elements added, removed and changed,
 * and how the results moved) and shows what it writes beside the file. The
 * saved file is compared: unsaved edits are offered a save first.
 */
export async function compareWithCommitted(context: ExtensionContext, document: TextDocument, cli: string): Promise<void> {
  if (document.uri.scheme !== 'file') {
    void window.showInformationMessage('Only a file on disk has a committed version to compare with.');
    return;
  }
  if (document.isDirty) {
    const choice = await window.showWarningMessage('Compare the saved file? Unsaved edits are not part of the comparison.', 'Save and Compare', 'Compare Saved');
    if (!choice) return;
    if (choice === 'Save and Compare' && !(await document.save())) return;
  }
  const file = document.uri.fsPath;
  const name = `./${path.basename(file)}`;
  const result = await window.withProgress({ location: ProgressLocation.Window, title: 'vacnet compare' }, () =>
    runCli(cli, ['compare', '--format', 'markdown', `HEAD:${name}`, name], path.dirname(file)),
  );
  if (result.code !== 0) {
    void window.showErrorMessage(`vacnet compare: ${result.stderr.trim().replace(/^vacnet compare: /, '') || `exit code ${result.code}`}`);
    return;
  }
  const media = Uri.joinPath(context.extensionUri, 'media');
  const panel = window.createWebviewPanel('vacnet.compare', `Changes: ${path.basename(file)}`, { viewColumn: ViewColumn.Beside, preserveFocus: true }, {
    enableScripts: false,
    enableFindWidget: true,
    localResourceRoots: [media],
  });
  panel.iconPath = Uri.joinPath(context.extensionUri, 'images', 'file-icon.png');
  panel.webview.html = markdownPage(`Changes to ${path.basename(file)} since the last commit`, result.stdout, {
    cspSource: panel.webview.cspSource,
    nonce: newNonce(),
    stylesheet: panel.webview.asWebviewUri(Uri.joinPath(media, 'webview.css')).toString(),
  });
}

/** Runs the bundled command line with the editor's runtime as plain Node; never rejects. */
function runCli(cli: string, args: string[], cwd: string): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(
      process.execPath,
      [cli, ...args],
      { cwd, env: { ...process.env, ELECTRON_RUN_AS_NODE: '1', NO_COLOR: '1' }, encoding: 'utf8', timeout: COMPARE_LIMIT_MS, maxBuffer: 16 * 1024 * 1024, windowsHide: true },
      (error, stdout, stderr) => {
        const code = error ? (typeof error.code === 'number' ? error.code : 2) : 0;
        resolve({ code, stdout, stderr: error && !stderr ? error.message : stderr });
      },
    );
  });
}
