import { window, workspace, type TextDocument, type Uri } from 'vscode';

/** The .vacnet document a command is for: the one given (an editor title button, the explorer), else the active editor's. */
export async function vacnetDocument(uri?: Uri): Promise<TextDocument | undefined> {
  const document = uri ? await workspace.openTextDocument(uri) : window.activeTextEditor?.document;
  if (!document || document.languageId !== 'vacnet') {
    void window.showInformationMessage('Open a .vacnet file first.');
    return undefined;
  }
  return document;
}
