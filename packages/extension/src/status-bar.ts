import { languages, MarkdownString, StatusBarAlignment, ThemeColor, window, type Disposable, type StatusBarItem, type TextEditor } from 'vscode';
import type { BaseLanguageClient } from 'vscode-languageclient';
import { SYSTEM_SUMMARY_REQUEST, type SystemSummary } from '../../language/src/lsp/system-requests-protocol.js';
import { debounce } from './debounce.js';
import { summaryText } from './summary-text.js';

/** Wait after new diagnostics before asking for the summary, ms (our choice: after a burst of publications). */
const REFRESH_DELAY_MS = 250;

/**
 * A status bar item with the active system's producer margin and worst
 * inlet, from the server's analysis of the text as it is (the
 * `vacnet/systemSummary` request). It follows the active editor and the
 * diagnostics the server publishes; a click opens the design report.
 */
export class SummaryStatusBar implements Disposable {
  private readonly item: StatusBarItem;
  private readonly subscriptions: Disposable[] = [];
  /** Counts requests, so an older answer never overwrites a newer one. */
  private asked = 0;

  constructor(private readonly client: BaseLanguageClient) {
    this.item = window.createStatusBarItem('vacnet.systemSummary', StatusBarAlignment.Left, 50);
    this.item.name = 'vacnet system summary';
    this.item.command = 'vacnet.openReport';
    const later = debounce(() => this.refresh(), REFRESH_DELAY_MS);
    this.subscriptions.push(
      window.onDidChangeActiveTextEditor(() => this.refresh()),
      languages.onDidChangeDiagnostics((event) => {
        const active = activeVacnet();
        if (active && event.uris.some((uri) => uri.toString() === active.document.uri.toString())) later();
      }),
      { dispose: () => later.cancel() },
    );
  }

  /** Asks the server for the active system's summary and shows it (hidden for other editors). */
  refresh(): void {
    const editor = activeVacnet();
    const ticket = ++this.asked;
    if (!editor || !this.client.isRunning()) {
      this.item.hide();
      return;
    }
    const uri = editor.document.uri.toString();
    this.client.sendRequest<SystemSummary | null>(SYSTEM_SUMMARY_REQUEST, { uri }).then(
      (summary) => {
        if (ticket !== this.asked) return;
        if (!summary) {
          this.item.hide();
          return;
        }
        const shown = summaryText(summary);
        this.item.text = shown.text;
        this.item.tooltip = new MarkdownString(shown.tooltip);
        this.item.backgroundColor = shown.warning ? new ThemeColor('statusBarItem.warningBackground') : undefined;
        this.item.show();
      },
      () => {
        if (ticket === this.asked) this.item.hide();
      },
    );
  }

  dispose(): void {
    for (const subscription of this.subscriptions) subscription.dispose();
    this.item.dispose();
  }
}

function activeVacnet(): TextEditor | undefined {
  const editor = window.activeTextEditor;
  return editor?.document.languageId === 'vacnet' ? editor : undefined;
}
