import './node-shim.js';
import { inject, type Module } from 'langium';
import {
  createDefaultModule,
  createDefaultSharedModule,
  type DefaultSharedModuleContext,
  type LangiumServices,
  type LangiumSharedServices,
  type PartialLangiumServices,
  type PartialLangiumSharedServices,
} from 'langium/lsp';
import { VacnetGeneratedModule, VacnetGeneratedSharedModule } from './generated/module.js';
import { VacnetScopeComputation } from './references/vacnet-scope-computation.js';
import { VacnetScopeProvider } from './references/vacnet-scope-provider.js';
import { VacnetLinker } from './references/vacnet-linker.js';
import { registerValidationChecks, VacnetValidator } from './validation/vacnet-validator.js';
import { VacnetDocumentValidator } from './validation/vacnet-document-validator.js';
import { VacnetFormatter } from './lsp/vacnet-formatter.js';
import { VacnetCompletionProvider } from './lsp/vacnet-completion-provider.js';
import { VacnetRenameProvider } from './lsp/vacnet-rename-provider.js';
import { VacnetDocumentSymbolProvider } from './lsp/vacnet-document-symbol-provider.js';
import { VacnetFoldingRangeProvider } from './lsp/vacnet-folding-range-provider.js';
import { VacnetSemanticTokenProvider } from './lsp/vacnet-semantic-token-provider.js';
import { VacnetDocumentLinkProvider } from './lsp/vacnet-document-link-provider.js';
import { VacnetHoverProvider } from './lsp/vacnet-hover-provider.js';
import { VacnetInlayHintProvider } from './lsp/vacnet-inlay-hint-provider.js';
import { VacnetCodeActionProvider } from './lsp/vacnet-code-action-provider.js';
import { VacnetConfigurationProvider } from './lsp/vacnet-configuration-provider.js';
import { DiagnosticsPublisher } from './lsp/diagnostics-publisher.js';
import { VacnetLexerErrorMessages, VacnetSyntaxErrorMessages } from './parser/syntax-error-messages.js';
import { RuleLinks } from './lsp/rule-links.js';
import { registerSystemRequests } from './lsp/system-requests.js';
import { AnalysisCache } from './engine-bridge/analysis-cache.js';
import type { ProjectSettingsCache } from './engine-bridge/project-settings-cache.js';
import { InProcessEngineRunner, type EngineRunner } from './engine-bridge/engine-runner.js';

/** Services of our own, added to Langium's. */
export interface VacnetAddedServices {
  validation: {
    VacnetValidator: VacnetValidator;
  };
  engine: {
    /** Runs the airflow analysis: on a worker thread in the server, on this thread elsewhere. */
    Runner: EngineRunner;
    /** The analysis of each system document per text version. */
    AnalysisCache: AnalysisCache;
  };
  lsp: {
    DiagnosticsPublisher: DiagnosticsPublisher;
    RuleLinks: RuleLinks;
  };
}

export type VacnetServices = LangiumServices & VacnetAddedServices;

/** How the services are set up beyond Langium's context. */
export interface VacnetServiceOptions {
  /**
   * Analyse system documents as they are built (the language server). Off by
   * default without a connection: the headless loader runs the analysis itself.
   */
  liveAnalysis?: boolean;
  /** The engine runner (default: on this thread). */
  engineRunner?: () => EngineRunner;
  /** The folder of the running server's entry file, to find docs/rules for the diagnostics' links. */
  installDir?: string;
  /** Where project settings files (vacnet.json) are read; without it none apply (a browser has no disk). */
  projectSettings?: () => ProjectSettingsCache;
}

export function createVacnetModule(options: VacnetServiceOptions = {}): Module<VacnetServices, PartialLangiumServices & VacnetAddedServices> {
  return {
    parser: {
      ParserErrorMessageProvider: () => new VacnetSyntaxErrorMessages(),
      LexerErrorMessageProvider: () => new VacnetLexerErrorMessages(),
    },
    references: {
      ScopeComputation: (services) => new VacnetScopeComputation(services),
      ScopeProvider: (services) => new VacnetScopeProvider(services),
      Linker: (services) => new VacnetLinker(services),
    },
    validation: {
      VacnetValidator: () => new VacnetValidator(),
      DocumentValidator: (services) => new VacnetDocumentValidator(services),
    },
    engine: {
      Runner: () => options.engineRunner?.() ?? new InProcessEngineRunner(),
      AnalysisCache: (services) => new AnalysisCache(services, services.engine.Runner, options.liveAnalysis === true, options.projectSettings?.()),
    },
    lsp: {
      Formatter: (services) => new VacnetFormatter(services),
      CompletionProvider: (services) => new VacnetCompletionProvider(services),
      RenameProvider: (services) => new VacnetRenameProvider(services),
      DocumentSymbolProvider: () => new VacnetDocumentSymbolProvider(),
      FoldingRangeProvider: (services) => new VacnetFoldingRangeProvider(services),
      SemanticTokenProvider: (services) => new VacnetSemanticTokenProvider(services),
      DocumentLinkProvider: () => new VacnetDocumentLinkProvider(),
      HoverProvider: (services) => new VacnetHoverProvider(services),
      InlayHintProvider: (services) => new VacnetInlayHintProvider(services),
      CodeActionProvider: (services) => new VacnetCodeActionProvider(services),
      DiagnosticsPublisher: (services) => new DiagnosticsPublisher(services, services.engine.AnalysisCache, services.lsp.RuleLinks),
      RuleLinks: () => new RuleLinks(options.installDir),
    },
  };
}

/** The language's services with the defaults: no live analysis. */
export const VacnetModule: Module<VacnetServices, PartialLangiumServices & VacnetAddedServices> = createVacnetModule();

/** Shared services of our own: the configuration provider that reads the `vacnet` settings. */
export const VacnetSharedModule: Module<LangiumSharedServices, PartialLangiumSharedServices> = {
  workspace: {
    ConfigurationProvider: (shared) => new VacnetConfigurationProvider(shared),
  },
};

/**
 * Creates the shared services and the vacnet language services. The same
 * wiring serves the language server, the headless loader and the tests.
 */
export function createVacnetServices(
  context: DefaultSharedModuleContext,
  options: VacnetServiceOptions = {},
): {
  shared: LangiumSharedServices;
  Vacnet: VacnetServices;
} {
  const live = options.liveAnalysis ?? context.connection !== undefined;
  const shared = inject(createDefaultSharedModule(context), VacnetGeneratedSharedModule, VacnetSharedModule);
  const Vacnet = inject(createDefaultModule({ shared }), VacnetGeneratedModule, createVacnetModule({ ...options, liveAnalysis: live }));
  shared.ServiceRegistry.register(Vacnet);
  registerValidationChecks(Vacnet);
  if (live) {
    // Created now so that its build listener runs before Langium's diagnostics handler (registered when the server starts).
    const cache = Vacnet.engine.AnalysisCache;
    cache.useSettings(shared.workspace.ConfigurationProvider as VacnetConfigurationProvider);
    // Created now too, so it prepares the hints of each analysis as it comes in.
    void Vacnet.lsp.InlayHintProvider;
    if (context.connection) Vacnet.lsp.DiagnosticsPublisher.takeOver(context.connection);
  }
  if (live && context.connection) registerSystemRequests(context.connection, Vacnet);
  return { shared, Vacnet };
}
