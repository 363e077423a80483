import { DocumentState, Emitter, URI, type Event, type LangiumDocument } from 'langium';
import type { LangiumServices } from 'langium/lsp';
import type { SystemModel } from '@vacnet/engine';
import type { Document, System } from '../generated/ast.js';
import { lowerSystem, type LoweredSystem } from '../lowering/lower-system.js';
import { toVacnetDiagnostic } from '../diagnostic-conversion.js';
import type { VacnetDiagnostic } from '../diagnostic.js';
import { analysisBlocked, ANALYSIS_FAILED, placeEngineRun, waitingResult, type EngineResult } from './analyse-lowered.js';
import type { EngineRun } from './engine-run.js';
import type { EngineRunner } from './engine-runner.js';
import { applySettings, DEFAULT_SETTINGS, type VacnetSettings } from './workspace-settings.js';
import { applyProjectSettings } from '../settings/project-settings.js';
import { ProjectSettingsCache } from './project-settings-cache.js';

/** Where a document's analysis stands. */
export type AnalysisStatus =
  /** The file holds no system (a catalog). */
  | 'no-system'
  /** Structural errors or unreadable values: the analysis waits (`result` holds the note saying so). */
  | 'blocked'
  /** Queued or running. */
  | 'pending'
  /** `result` holds the engine's findings for this version. */
  | 'ready'
  /** The engine could not run; `result` holds a finding saying why. */
  | 'failed';

/** One document's analysis, for one version of its text. */
export interface DocumentAnalysis {
  uri: string;
  /** The text version it belongs to. */
  version: number;
  /** Counts the builds of the document: a result is kept only for the latest. */
  generation: number;
  status: AnalysisStatus;
  lowered?: LoweredSystem;
  /** The model the engine saw: the lowered one with the project's and the editor's settings beneath the file's. */
  model?: SystemModel;
  /** Findings placed on this version's tokens (for `ready`, `blocked`, `failed`). */
  result?: EngineResult;
  /** Editor settings that could not be used, placed on the system's title. */
  settingsDiagnostics: VacnetDiagnostic[];
  /** How long the engine took, ms (`ready` only; 0 when reused). */
  engineMs?: number;
  /** What started it: a build of the document, or a change of the editor settings (the text and Langium's diagnostics unchanged). */
  trigger: 'build' | 'settings';
  /** Which hints the editor shows for it: the editor settings and the project settings file must both allow a kind. */
  hints: VacnetSettings['hints'];
  /** The project settings file applied (vacnet.json), when there is one. */
  settingsPath?: string;
}

/** With VACNET_TRACE set, the phases of each analysis go to stderr with their times (ms since the server started). */
const TRACE = typeof process !== 'undefined' && !!process.env?.VACNET_TRACE;
function trace(uri: string, generation: number, phase: string): void {
  if (TRACE) process.stderr.write(`vacnet-trace ${performance.now().toFixed(0)} ${uri.split('/').pop()} #${generation} ${phase}\n`);
}

/** The editor settings the cache reads; the configuration provider supplies them in the server. */
export interface SettingsSource {
  readonly vacnet: VacnetSettings;
  readonly onDidChangeVacnet?: Event<VacnetSettings>;
}

/**
 * The analysis of each system document, kept per text version. After
 * Langium validates a document, the cache lowers it, applies the editor's
 * settings and hands the model to the engine runner (a worker thread in the
 * server), after a short debounce. A newer build of the same document
 * supersedes the older job (the runner cancels it) and a result that
 * arrives for an outdated version is dropped. A model equal to the last one
 * analysed (a comment edited, a catalog entry the system does not use)
 * reuses that run at once. Catalog changes reach dependent systems through
 * Langium's relinking, which validates them again.
 *
 * Providers read `current(document)`: the analysis of exactly that text
 * version, or nothing. They never start a solve.
 */
export class AnalysisCache {
  private readonly states = new Map<string, DocumentAnalysis>();
  /** The last engine run per document, with the model it was for. */
  private readonly runs = new Map<string, { fingerprint: string; run: EngineRun; ms: number }>();
  private readonly timers = new Map<string, NodeJS.Timeout>();
  private readonly changeEmitter = new Emitter<DocumentAnalysis>();
  private generations = 0;
  private settingsSource: SettingsSource = { vacnet: DEFAULT_SETTINGS };

  /**
   * `live`: analyse documents as they are built; otherwise the cache stays
   * empty (headless use). `project`: where the project settings files are
   * read (the Node server); without it none apply (the browser).
   */
  constructor(
    private readonly services: LangiumServices,
    private readonly runner: EngineRunner,
    readonly live: boolean,
    readonly project?: ProjectSettingsCache,
  ) {
    if (!live) return;
    if (project) {
      project.onDidLoad((folder) => this.reanalyse((uri) => project.folderOf(uri) === folder));
      services.shared.lsp?.DocumentUpdateHandler?.onWatchedFilesChange?.((params) => {
        if (params.changes.some((c) => ProjectSettingsCache.isSettingsFile(c.uri)) && project.forget()) this.reanalyse(() => true);
      });
    }
    const builder = services.shared.workspace.DocumentBuilder;
    builder.onDocumentPhase(DocumentState.Validated, (document) => this.validated(document));
    builder.onUpdate((_changed, deleted) => {
      for (const uri of deleted) this.forget(uri.toString());
    });
  }

  /** Fires when a document's analysis changes state (queued, ready, blocked...). */
  get onDidChange(): Event<DocumentAnalysis> {
    return this.changeEmitter.event;
  }

  /** Where the editor settings come from; a change re-analyses every system document. */
  useSettings(source: SettingsSource): void {
    this.settingsSource = source;
    source.onDidChangeVacnet?.(() => this.reanalyseAll());
  }

  get settings(): VacnetSettings {
    return this.settingsSource.vacnet;
  }

  /** The state for a document, whatever its version. */
  state(uri: string): DocumentAnalysis | undefined {
    return this.states.get(uri);
  }

  /** The analysis of exactly this document's text version, when it is ready. */
  current(document: LangiumDocument): DocumentAnalysis | undefined {
    const state = this.states.get(document.uri.toString());
    if (!state || state.status !== 'ready') return undefined;
    if (state.version !== this.versionOf(document.uri.toString())) return undefined;
    if (state.lowered && document.parseResult.value !== rootOf(state.lowered)) return undefined;
    return state;
  }

  /** Resolves once the document's analysis for its current version is no longer pending (for tests and tools). */
  whenSettled(uri: string, timeoutMs = 60_000): Promise<DocumentAnalysis | undefined> {
    const settled = () => {
      const state = this.states.get(uri);
      return state && state.status !== 'pending' && state.version === this.versionOf(uri) ? state : undefined;
    };
    const now = settled();
    if (now) return Promise.resolve(now);
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        listener.dispose();
        resolve(undefined);
      }, timeoutMs);
      const listener = this.onDidChange(() => {
        const state = settled();
        if (!state) return;
        clearTimeout(timer);
        listener.dispose();
        resolve(state);
      });
    });
  }

  dispose(): void {
    for (const timer of this.timers.values()) clearTimeout(timer);
    this.timers.clear();
    this.runner.dispose();
  }

  // ------------------------------------------------------------------ builds

  private validated(document: LangiumDocument, trigger: DocumentAnalysis['trigger'] = 'build'): void {
    const uri = document.uri.toString();
    const generation = ++this.generations;
    trace(uri, generation, `validated v${document.textDocument.version}`);
    const settings = this.settings;
    const base = { uri, version: document.textDocument.version, generation, settingsDiagnostics: [] as VacnetDiagnostic[], trigger, hints: settings.hints };
    this.clearTimer(uri);
    const system = (document.parseResult.value as Document | undefined)?.systems?.[0];
    if (!system) {
      this.runner.cancel(uri);
      this.set({ ...base, status: 'no-system' });
      return;
    }
    let lowered: LoweredSystem;
    try {
      lowered = lowerSystem(system);
    } catch (error) {
      // A defect in the lowering: say so on the file rather than break the server.
      this.runner.cancel(uri);
      this.set({ ...base, status: 'failed', result: failure(undefined, `the file could not be prepared for the analysis (${messageOf(error)})`) });
      return;
    }
    const structural = (document.diagnostics ?? []).map(toVacnetDiagnostic);
    if (analysisBlocked(lowered, structural)) {
      this.runner.cancel(uri);
      this.set({ ...base, status: 'blocked', lowered, result: waitingResult(lowered) });
      return;
    }
    // The project settings file (vacnet.json) beneath the file's own settings, as `vacnet check` applies it, and the editor's beneath both.
    const project = this.project?.forDocument(document.uri) ?? 'none';
    if (project === 'loading') {
      // Analysed once the file is read (onDidLoad).
      this.set({ ...base, status: 'pending', lowered });
      return;
    }
    const fileUnits = statesUnits(system);
    const projected = project === 'none' ? lowered.model : applyProjectSettings(lowered.model, project.settings, fileUnits);
    const model = applySettings(projected, settings, fileUnits || (project !== 'none' && project.settings.displayUnits !== undefined));
    const settingsDiagnostics = [...settingsProblems(settings, lowered), ...(project === 'none' ? [] : unreadableSettings(project.diagnostics, lowered))];
    if (project !== 'none') {
      const allowed = project.settings.hints;
      base.hints = { inletVacuum: settings.hints.inletVacuum && allowed.inlets, pipeVelocity: settings.hints.pipeVelocity && allowed.pipes, producer: settings.hints.producer && allowed.producer };
      if (project.path) Object.assign(base, { settingsPath: project.path });
    }
    const fingerprint = fingerprintOf(model);
    trace(uri, generation, 'lowered');
    const known = this.runs.get(uri);
    const state: DocumentAnalysis = { ...base, status: 'pending', lowered, model, settingsDiagnostics };
    if (known && known.fingerprint === fingerprint) {
      this.runner.cancel(uri);
      this.set({ ...state, status: 'ready', result: placeEngineRun(lowered, known.run, pathOf(document.uri)), engineMs: 0 });
      return;
    }
    this.set(state);
    const start = () => {
      this.timers.delete(uri);
      if (this.states.get(uri)?.generation !== generation) return;
      trace(uri, generation, 'engine job sent');
      void this.runner.run(uri, model, this.services.shared.workspace.TextDocuments?.get(uri) !== undefined).then((outcome) => {
        trace(uri, generation, `engine job ${outcome.kind}${outcome.kind === 'done' ? ` (${outcome.ms.toFixed(0)} ms in the engine)` : ''}`);
        const latest = this.states.get(uri);
        // A newer build took over, or the text moved on since: this result is stale.
        if (!latest || latest.generation !== generation || latest.version !== this.versionOf(uri)) return;
        if (outcome.kind === 'cancelled') return;
        if (outcome.kind === 'failed') {
          this.set({ ...latest, status: 'failed', result: failure(lowered, `the airflow analysis could not run (${outcome.message})`) });
          return;
        }
        this.runs.set(uri, { fingerprint, run: outcome.run, ms: outcome.ms });
        let result: EngineResult;
        try {
          result = placeEngineRun(lowered, outcome.run, pathOf(document.uri));
        } catch (error) {
          this.set({ ...latest, status: 'failed', result: failure(lowered, `the findings could not be placed (${messageOf(error)})`) });
          return;
        }
        trace(uri, generation, 'findings placed');
        this.set({ ...latest, status: 'ready', result, engineMs: outcome.ms });
        trace(uri, generation, 'published');
      });
    };
    const delay = settings.debounceMs;
    if (delay > 0) {
      const timer = setTimeout(start, delay);
      this.timers.set(uri, timer);
    } else {
      start();
    }
  }

  /** Re-analyses every document the cache knows, with the settings now in force (their text is unchanged). */
  private reanalyseAll(): void {
    this.reanalyse(() => true);
  }

  private reanalyse(which: (uri: URI) => boolean): void {
    const documents = this.services.shared.workspace.LangiumDocuments;
    for (const uri of [...this.states.keys()]) {
      const parsed = URI.parse(uri);
      if (!which(parsed)) continue;
      const document = documents.getDocument(parsed);
      if (document && document.state >= DocumentState.Validated) this.validated(document, 'settings');
    }
  }

  private forget(uri: string): void {
    this.clearTimer(uri);
    this.runner.cancel(uri);
    this.states.delete(uri);
    this.runs.delete(uri);
  }

  private clearTimer(uri: string): void {
    const timer = this.timers.get(uri);
    if (timer) clearTimeout(timer);
    this.timers.delete(uri);
  }

  private set(state: DocumentAnalysis): void {
    this.states.set(state.uri, state);
    this.changeEmitter.fire(state);
  }

  /** The newest version of a document's text: the editor's open copy, else the loaded one. */
  versionOf(uri: string): number | undefined {
    const open = this.services.shared.workspace.TextDocuments?.get(uri);
    if (open) return open.version;
    return this.services.shared.workspace.LangiumDocuments.getDocument(URI.parse(uri))?.textDocument.version;
  }
}

function rootOf(lowered: LoweredSystem): unknown {
  const found = lowered.sources.find({ kind: 'system', name: lowered.model.name });
  let node = found?.node;
  while (node?.$container) node = node.$container;
  return node;
}

function statesUnits(system: System): boolean {
  return system.members.some((m) => m.$type === 'DisplayUnits');
}

/** Identifies a model by its content (JSON of plain data): equal models give equal analyses. */
function fingerprintOf(model: SystemModel): string {
  return JSON.stringify(model);
}

function settingsProblems(settings: VacnetSettings, lowered: LoweredSystem): VacnetDiagnostic[] {
  if (settings.problems.length === 0) return [];
  const range = waitingResult(lowered).diagnostics[0]!.range;
  return settings.problems.map((problem) => ({
    severity: 'warning',
    code: 'invalid-rule-setting',
    message: `Editor setting ${problem} (Settings written in the file are not affected.)`,
    range,
    source: 'engine',
  }));
}

/** A settings file that could not be read is said on the system (its own problems are shown on the settings file). */
function unreadableSettings(diagnostics: VacnetDiagnostic[], lowered: LoweredSystem): VacnetDiagnostic[] {
  const range = waitingResult(lowered).diagnostics[0]!.range;
  return diagnostics.filter((d) => d.code === 'file-unreadable').map((d) => ({ ...d, range }));
}

function failure(lowered: LoweredSystem | undefined, message: string): EngineResult {
  const range = lowered ? waitingResult(lowered).diagnostics[0]!.range : { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } };
  return {
    diagnostics: [{ severity: 'error', code: ANALYSIS_FAILED, message: `No flow results: ${message}. Please report this.`, range, source: 'engine' }],
    suppressed: [],
  };
}

function pathOf(uri: URI): string {
  return uri.scheme === 'file' ? uri.fsPath : uri.toString();
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
