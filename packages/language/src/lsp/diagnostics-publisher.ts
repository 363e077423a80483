import { DocumentState, URI } from 'langium';
import type { LangiumServices } from 'langium/lsp';
import type { Connection, Diagnostic, DiagnosticRelatedInformation, PublishDiagnosticsParams } from 'vscode-languageserver';
import type { VacnetDiagnostic } from '../diagnostic.js';
import type { AnalysisCache, DocumentAnalysis } from '../engine-bridge/analysis-cache.js';
import type { RuleLinks } from './rule-links.js';
import { settingsFileUri } from '../engine-bridge/project-settings-cache.js';

/**
 * How long structural diagnostics wait for a pending analysis, ms, so that a
 * quick analysis arrives in the same notification and the squiggles do not
 * flicker (our choice; well under the 0.1 s of "immediate", Nielsen 1993).
 */
export const STRUCTURAL_GRACE_MS = 80;

/** LSP DiagnosticSeverity (specification 3.17). */
const SEVERITY = { error: 1, warning: 2, info: 3 } as const;

/**
 * Publishes one set of diagnostics per document: Langium's (syntax, names,
 * units, structure) together with the engine's findings for the same text
 * version, each with a link to its rule page (`codeDescription`).
 *
 * It takes over the connection's `sendDiagnostics`, which Langium calls
 * after validating a document: the structural diagnostics go out at once
 * when the file cannot be analysed or its analysis is known, after a short
 * grace while an analysis runs, and again with the engine's findings when
 * they arrive. A result for an outdated version is never published.
 */
export class DiagnosticsPublisher {
  private readonly structural = new Map<string, Diagnostic[]>();
  /** The analysis generation current when Langium last published a document: engine results join only that build's diagnostics. */
  private readonly structuralGeneration = new Map<string, number>();
  private readonly grace = new Map<string, NodeJS.Timeout>();
  /** Per document: the analysis generation of the last publication, and whether it held the engine's part. */
  private readonly lastPublished = new Map<string, { generation: number | undefined; complete: boolean }>();
  private send: ((params: PublishDiagnosticsParams) => void) | undefined;
  private inlayHintRefresh = false;

  constructor(
    private readonly services: LangiumServices,
    private readonly cache: AnalysisCache,
    private readonly links: RuleLinks,
  ) {
    cache.onDidChange((state) => this.analysisChanged(state));
    cache.project?.onDidLoad(() => this.publishSettingsFiles());
    services.shared.lsp.LanguageServer.onInitialize((params) => {
      this.inlayHintRefresh = params.capabilities.workspace?.inlayHint?.refreshSupport === true;
    });
  }

  /** Routes the connection's diagnostics through this publisher. */
  takeOver(connection: Connection): void {
    if (this.send) return;
    const original = connection.sendDiagnostics.bind(connection);
    this.send = (params) => void original(params).catch(() => undefined);
    connection.sendDiagnostics = async (params: PublishDiagnosticsParams) => this.fromLangium(params);
  }

  /** The project settings files whose problems were published last, by URI. */
  private settingsFilesShown = new Set<string>();

  /** Publishes the problems of each project settings file (vacnet.json) in use, on that file; clears those no longer in use. */
  private publishSettingsFiles(): void {
    if (!this.send || !this.cache.project) return;
    const base = this.cache.settings.rulesDocsBaseUrl;
    const shown = new Set<string>();
    for (const file of this.cache.project.files()) {
      const uri = settingsFileUri(file.path!);
      shown.add(uri);
      this.send({ uri, diagnostics: file.diagnostics.map((d) => this.withLink(toLspDiagnostic(d, uri), base)) });
    }
    for (const uri of this.settingsFilesShown) if (!shown.has(uri)) this.send({ uri, diagnostics: [] });
    this.settingsFilesShown = shown;
  }

  /** Whether the diagnostics of the document's latest analysis, engine part included, have gone out. */
  hasPublishedFinal(uri: string): boolean {
    const state = this.cache.state(uri);
    const last = this.lastPublished.get(uri);
    return !!state && !!last && last.generation === state.generation && last.complete;
  }

  private fromLangium(params: PublishDiagnosticsParams): void {
    const uri = params.uri;
    this.structural.set(uri, params.diagnostics);
    const state = this.cache.state(uri);
    if (state) this.structuralGeneration.set(uri, state.generation);
    else this.structuralGeneration.delete(uri);
    if (state && state.status === 'pending') {
      if (!this.grace.has(uri)) {
        const timer = setTimeout(() => {
          this.grace.delete(uri);
          this.publish(uri);
        }, STRUCTURAL_GRACE_MS);
        this.grace.set(uri, timer);
      }
      return;
    }
    this.publish(uri);
  }

  private analysisChanged(state: DocumentAnalysis): void {
    // New settings re-analyse unchanged text: Langium's last diagnostics still hold.
    if (state.trigger === 'settings' && this.structural.has(state.uri)) this.structuralGeneration.set(state.uri, state.generation);
    if (state.status === 'pending') return;
    // Join Langium's diagnostics of the same build only; when they have not come yet, their arrival publishes both.
    if (this.structuralGeneration.get(state.uri) !== state.generation) {
      this.adoptIfNeverSent(state);
      return;
    }
    const timer = this.grace.get(state.uri);
    if (timer) {
      clearTimeout(timer);
      this.grace.delete(state.uri);
    }
    this.publish(state.uri);
    if (state.status === 'ready' && this.inlayHintRefresh) {
      void this.services.shared.lsp.Connection?.languages.inlayHint.refresh().catch(() => undefined);
    }
  }

  /**
   * Langium skips its own publication of a validated document when the build
   * is cancelled between the document's listeners (a new edit or file
   * arriving), and the document, already validated, is not published again.
   * When Langium's diagnostics of a settled analysis's build have not come
   * within the grace, they are taken from the document itself, so a document
   * is never left without its diagnostics.
   */
  private adoptIfNeverSent(settled: DocumentAnalysis): void {
    const uri = settled.uri;
    setTimeout(() => {
      const state = this.cache.state(uri);
      if (!state || state.generation !== settled.generation || this.structuralGeneration.get(uri) === state.generation) return;
      const document = this.services.shared.workspace.LangiumDocuments.getDocument(URI.parse(uri));
      if (!document || document.state < DocumentState.Validated || document.textDocument.version !== state.version) return;
      this.structural.set(uri, document.diagnostics ?? []);
      this.structuralGeneration.set(uri, state.generation);
      this.publish(uri);
    }, STRUCTURAL_GRACE_MS);
  }

  /**
   * Publishes Langium's diagnostics of the document's last build with the
   * engine's findings of the same build (when in), labelled with the text
   * version that build read.
   */
  private publish(uri: string): void {
    if (!this.send) return;
    const state = this.cache.state(uri);
    const sameBuild = state !== undefined && this.structuralGeneration.get(uri) === state.generation;
    const engine = sameBuild && state.status !== 'pending' ? state : undefined;
    const version = sameBuild ? state.version : this.cache.versionOf(uri);
    this.send({ uri, ...(version !== undefined && version > 0 ? { version } : {}), diagnostics: this.combine(uri, engine) });
    this.lastPublished.set(uri, { generation: sameBuild ? state.generation : undefined, complete: engine !== undefined });
  }

  private combine(uri: string, state: DocumentAnalysis | undefined): Diagnostic[] {
    const base = this.cache.settings.rulesDocsBaseUrl;
    const langium = this.structural.get(uri) ?? this.services.shared.workspace.LangiumDocuments.getDocument(URI.parse(uri))?.diagnostics ?? [];
    const out = langium.map((d) => this.withLink(d, base));
    if (state && state.status !== 'pending') {
      for (const d of [...(state.result?.diagnostics ?? []), ...state.settingsDiagnostics]) out.push(this.withLink(toLspDiagnostic(d, uri), base));
    }
    return out;
  }

  private withLink(diagnostic: Diagnostic, base: string | undefined): Diagnostic {
    if (diagnostic.codeDescription) return diagnostic;
    const href = this.links.href(diagnostic.code, base);
    return href ? { ...diagnostic, codeDescription: { href } } : diagnostic;
  }
}

/** One of our diagnostics in LSP form, its related places as locations. */
export function toLspDiagnostic(d: VacnetDiagnostic, uri: string): Diagnostic {
  const related: DiagnosticRelatedInformation[] = (d.related ?? []).map((r) => ({
    location: { uri: r.uri ?? (r.path ? URI.file(r.path).toString() : uri), range: r.range },
    message: r.message,
  }));
  return {
    range: d.range,
    severity: SEVERITY[d.severity],
    code: d.code,
    source: 'vacnet',
    message: d.message,
    ...(related.length > 0 ? { relatedInformation: related } : {}),
    data: { ...(d.data ?? {}), code: d.code, origin: 'engine' },
  };
}
