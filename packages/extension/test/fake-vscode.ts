/**
 * A stand-in for the `vscode` module, with only what the extension's own
 * code calls, shaped after the VS Code API reference (vscode.d.ts 1.91):
 * enough to run the commands, the status bar item, the webviews and the
 * task provider in Node and look at what they did. VS Code itself cannot
 * be downloaded here. The test bundles the extension's sources with this
 * file in place of `vscode`; the state lives on globalThis so the test and
 * the bundle share it.
 */
import { readFileSync } from 'node:fs';
import * as path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

type Listener<T> = (event: T) => void;

/** An event source in the shape of vscode.EventEmitter. */
export class EventEmitter<T> {
  private listeners: Listener<T>[] = [];
  readonly event = (listener: Listener<T>) => {
    this.listeners.push(listener);
    return { dispose: () => (this.listeners = this.listeners.filter((l) => l !== listener)) };
  };
  fire(value: T): void {
    for (const listener of [...this.listeners]) listener(value);
  }
}

export class Uri {
  private constructor(
    readonly scheme: string,
    readonly path: string,
  ) {}
  static file(fsPath: string): Uri {
    return new Uri('file', fsPath.split(path.sep).join('/'));
  }
  static parse(text: string): Uri {
    if (text.startsWith('file://')) return Uri.file(fileURLToPath(text));
    const colon = text.indexOf(':');
    return new Uri(text.slice(0, colon), text.slice(colon + 1));
  }
  static joinPath(base: Uri, ...parts: string[]): Uri {
    return new Uri(base.scheme, path.posix.join(base.path, ...parts));
  }
  get fsPath(): string {
    return this.path;
  }
  toString(): string {
    return this.scheme === 'file' ? pathToFileURL(this.path).href : `${this.scheme}:${this.path}`;
  }
}

export class ThemeColor {
  constructor(readonly id: string) {}
}
export class MarkdownString {
  constructor(readonly value: string) {}
}
export class ProcessExecution {
  constructor(
    readonly process: string,
    readonly args: string[],
    readonly options: { cwd?: string; env?: Record<string, string> },
  ) {}
}
export class Task {
  detail?: string;
  constructor(
    readonly definition: Record<string, unknown>,
    readonly scope: unknown,
    readonly name: string,
    readonly source: string,
    readonly execution: ProcessExecution,
    readonly problemMatchers: string | string[],
  ) {}
}
export const TaskScope = { Workspace: 2 };
export const StatusBarAlignment = { Left: 1, Right: 2 };
export const ViewColumn = { Active: -1, Beside: -2, One: 1 };
export const ProgressLocation = { SourceControl: 1, Window: 10, Notification: 15 };

export interface FakeDocument {
  uri: Uri;
  languageId: string;
  isDirty: boolean;
  getText(): string;
  save(): Promise<boolean>;
}

export interface FakePanel {
  viewType: string;
  title: string;
  options: { enableScripts?: boolean; localResourceRoots?: Uri[] };
  webview: { html: string; cspSource: string; asWebviewUri(uri: Uri): Uri };
  iconPath?: Uri;
  disposed: boolean;
  reveal(): void;
  onDidDispose(listener: () => void): void;
  dispose(): void;
}

/** What the extension did, for the test to look at; and the knobs the test turns. */
export interface FakeState {
  commands: Map<string, (...args: unknown[]) => unknown>;
  statusItems: { text: string; tooltip?: MarkdownString; backgroundColor?: ThemeColor; command?: string; visible: boolean }[];
  panels: FakePanel[];
  messages: string[];
  opened: { language?: string; content?: string }[];
  executedTasks: Task[];
  taskProviders: Map<string, unknown>;
  activeEditor: { document: FakeDocument } | undefined;
  quickPick: (items: { label: string }[]) => unknown;
  warningChoice: string | undefined;
  workspaceFolders: { uri: Uri; name: string; index: number }[] | undefined;
  onActiveEditor: EventEmitter<unknown>;
  onChangeDocument: EventEmitter<{ document: FakeDocument }>;
  onDiagnostics: EventEmitter<{ uris: Uri[] }>;
}

const global = globalThis as unknown as { __vacnetFakeVscode?: FakeState };
export const state: FakeState = (global.__vacnetFakeVscode ??= {
  commands: new Map(),
  statusItems: [],
  panels: [],
  messages: [],
  opened: [],
  executedTasks: [],
  taskProviders: new Map(),
  activeEditor: undefined,
  quickPick: (items) => items[0],
  warningChoice: undefined,
  workspaceFolders: undefined,
  onActiveEditor: new EventEmitter(),
  onChangeDocument: new EventEmitter(),
  onDiagnostics: new EventEmitter(),
});

/** A document on disk, as openTextDocument would give it. */
export function documentOf(uri: Uri, languageId = 'vacnet'): FakeDocument {
  return { uri, languageId, isDirty: false, getText: () => readFileSync(uri.fsPath, 'utf8'), save: async () => true };
}

const disposable = { dispose: () => undefined };
const message = async (text: string, ...choices: string[]) => {
  state.messages.push(text);
  return choices.length > 0 ? state.warningChoice : undefined;
};

export const commands = {
  registerCommand(id: string, handler: (...args: unknown[]) => unknown) {
    if (state.commands.has(id)) throw new Error(`command ${id} registered twice`);
    state.commands.set(id, handler);
    return { dispose: () => state.commands.delete(id) };
  },
  async executeCommand(id: string, ...args: unknown[]) {
    return state.commands.get(id)?.(...args);
  },
};

export const window = {
  get activeTextEditor() {
    return state.activeEditor;
  },
  onDidChangeActiveTextEditor: state.onActiveEditor.event,
  createStatusBarItem() {
    const item = { text: '', visible: false, show: () => (item.visible = true), hide: () => (item.visible = false), dispose: () => (item.visible = false) } as FakeState['statusItems'][number] & { name?: string; show(): void; hide(): void; dispose(): void };
    state.statusItems.push(item);
    return item;
  },
  createWebviewPanel(viewType: string, title: string, _column: unknown, options: FakePanel['options']): FakePanel {
    const disposeListeners: (() => void)[] = [];
    const panel: FakePanel = {
      viewType,
      title,
      options,
      disposed: false,
      webview: { html: '', cspSource: 'https://webview.test', asWebviewUri: (uri: Uri) => new (Uri as unknown as new (s: string, p: string) => Uri)('https', `//webview.test${uri.path}`) },
      reveal: () => undefined,
      onDidDispose: (listener) => disposeListeners.push(listener),
      dispose: () => {
        if (panel.disposed) return;
        panel.disposed = true;
        for (const listener of disposeListeners) listener();
      },
    };
    state.panels.push(panel);
    return panel;
  },
  showInformationMessage: message,
  showWarningMessage: message,
  showErrorMessage: message,
  async showQuickPick(items: { label: string }[]) {
    return state.quickPick(items);
  },
  async showWorkspaceFolderPick() {
    return state.workspaceFolders?.[0];
  },
  async showTextDocument(document: FakeDocument) {
    state.activeEditor = { document };
    return state.activeEditor;
  },
  async withProgress<T>(_options: unknown, task: () => Promise<T>): Promise<T> {
    return task();
  },
};

export const workspace = {
  get workspaceFolders() {
    return state.workspaceFolders;
  },
  onDidChangeTextDocument: state.onChangeDocument.event,
  async openTextDocument(what: Uri | { language?: string; content?: string }): Promise<FakeDocument> {
    if (what instanceof Uri) return documentOf(what);
    state.opened.push(what);
    return { uri: Uri.parse(`untitled:Untitled-${state.opened.length}`), languageId: what.language ?? 'plaintext', isDirty: true, getText: () => what.content ?? '', save: async () => false };
  },
  asRelativePath(uri: Uri): string {
    const folder = state.workspaceFolders?.find((f) => uri.path.startsWith(`${f.uri.path}/`));
    return folder ? uri.path.slice(folder.uri.path.length + 1) : uri.path;
  },
  createFileSystemWatcher() {
    return { ...disposable, onDidCreate: () => disposable, onDidChange: () => disposable, onDidDelete: () => disposable };
  },
  fs: {
    async readFile(uri: Uri): Promise<Uint8Array> {
      return readFileSync(uri.fsPath);
    },
  },
};

export const languages = {
  onDidChangeDiagnostics: state.onDiagnostics.event,
};

export const tasks = {
  registerTaskProvider(type: string, provider: unknown) {
    state.taskProviders.set(type, provider);
    return { dispose: () => state.taskProviders.delete(type) };
  },
  async executeTask(task: Task) {
    state.executedTasks.push(task);
    return {};
  },
};
