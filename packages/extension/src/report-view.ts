import { languages, Uri, ViewColumn, window, workspace, type Disposable, type ExtensionContext, type TextDocument, type WebviewPanel } from 'vscode';
import type { BaseLanguageClient } from 'vscode-languageclient';
import type { ReportInput } from '../../cli/src/report/report-api.js';
import { decodePlainData, REPORT_DATA_REQUEST, type ReportData } from '../../language/src/lsp/system-requests-protocol.js';
import { vacnetDocument } from './active-document.js';
import { debounce } from './debounce.js';
import { reportPage, schematicPage, type PageOptions } from './report-page.js';
import { readRulePages } from './rule-pages.js';
import { newNonce } from './webview-policy.js';

export type ViewKind = 'report' | 'schematic';

/** Wait after a change before redrawing, ms (our choice: after a burst of typing, and the analysis is usually in by then). */
const UPDATE_DELAY_MS = 400;

const TITLES: Record<ViewKind, string> = { report: 'Report', schematic: 'Schematic' };

/**
 * The report and schematic views: one webview beside the file per document
 * and kind, drawn from the server's analysis of the text as it is (the
 * `vacnet/reportData` request), and redrawn shortly after the text or its
 * findings change (a used catalog edited). No scripts run in them.
 */
export class ReportViews implements Disposable {
  private readonly panels = new Map<string, ReportPanel>();

  constructor(
    private readonly context: ExtensionContext,
    private readonly client: BaseLanguageClient,
  ) {}

  async open(kind: ViewKind, uri?: Uri): Promise<void> {
    const document = await vacnetDocument(uri);
    if (!document) return;
    const key = `${kind} ${document.uri.toString()}`;
    const open = this.panels.get(key);
    if (open) {
      open.reveal();
      return;
    }
    const panel = new ReportPanel(this.context, this.client, kind, document, () => this.panels.delete(key));
    this.panels.set(key, panel);
    await panel.update();
  }

  dispose(): void {
    for (const panel of [...this.panels.values()]) panel.dispose();
    this.panels.clear();
  }
}

class ReportPanel implements Disposable {
  private readonly panel: WebviewPanel;
  private readonly subscriptions: Disposable[] = [];
  /** Counts updates, so a slower older one never replaces a newer page. */
  private drawn = 0;
  private disposed = false;

  constructor(
    private readonly context: ExtensionContext,
    private readonly client: BaseLanguageClient,
    private readonly kind: ViewKind,
    private readonly document: TextDocument,
    onDispose: () => void,
  ) {
    const media = Uri.joinPath(context.extensionUri, 'media');
    this.panel = window.createWebviewPanel(
      `vacnet.${kind}`,
      `${TITLES[kind]}: ${baseName(document.uri)}`,
      { viewColumn: ViewColumn.Beside, preserveFocus: true },
      { enableScripts: false, enableFindWidget: true, localResourceRoots: [media] },
    );
    this.panel.iconPath = Uri.joinPath(context.extensionUri, 'images', 'file-icon.png');
    const later = debounce(() => void this.update(), UPDATE_DELAY_MS);
    const uri = document.uri.toString();
    this.subscriptions.push(
      workspace.onDidChangeTextDocument((event) => {
        if (event.document.uri.toString() === uri) later();
      }),
      languages.onDidChangeDiagnostics((event) => {
        if (event.uris.some((u) => u.toString() === uri)) later();
      }),
      { dispose: () => later.cancel() },
    );
    this.panel.onDidDispose(() => {
      this.dispose();
      onDispose();
    });
  }

  reveal(): void {
    this.panel.reveal(ViewColumn.Beside, true);
  }

  /** Asks the server for the document's report data and draws the page. */
  async update(): Promise<void> {
    const ticket = ++this.drawn;
    let html: string;
    try {
      const data = await this.client.sendRequest<ReportData | null>(REPORT_DATA_REQUEST, { uri: this.document.uri.toString() });
      if (this.disposed || ticket !== this.drawn) return;
      html = data ? await this.page(data) : notice('The analysis of this file is not available yet: it appears here once the server has read the file.');
    } catch (error) {
      html = notice(`The ${this.kind} could not be made: ${error instanceof Error ? error.message : String(error)}`);
    }
    if (this.disposed || ticket !== this.drawn) return;
    this.panel.webview.html = html;
  }

  private async page(data: ReportData): Promise<string> {
    const input = decodePlainData<ReportInput>(data.input);
    input.path = this.document.uri.scheme === 'file' ? workspace.asRelativePath(this.document.uri) : baseName(this.document.uri);
    const webview = this.panel.webview;
    const options: PageOptions = {
      cspSource: webview.cspSource,
      nonce: newNonce(),
      stylesheet: webview.asWebviewUri(Uri.joinPath(this.context.extensionUri, 'media', 'webview.css')).toString(),
      version: String((this.context.extension.packageJSON as { version?: unknown }).version ?? 'unknown'),
    };
    if (this.kind === 'schematic') return schematicPage(input, options);
    const codes = [...input.diagnostics.map((d) => d.code), ...(input.accepted ?? []).map((a) => a.finding.code)];
    options.rulePages = await readRulePages(this.context.extensionUri, codes);
    return reportPage(input, options);
  }

  dispose(): void {
    if (this.disposed) return;
    this.disposed = true;
    for (const subscription of this.subscriptions) subscription.dispose();
    this.panel.dispose();
  }
}

function baseName(uri: Uri): string {
  return uri.path.split('/').pop() || uri.toString();
}

/** A page with one sentence, for when there is nothing to draw (no scripts, no styles needed). */
function notice(text: string): string {
  const escaped = text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta http-equiv="Content-Security-Policy" content="default-src 'none'"></head><body><p>${escaped}</p></body></html>`;
}
