import './node-shim.js';
import { inject, type Module } from 'langium';
import {
  createDefaultModule,
  createDefaultSharedModule,
  type DefaultSharedModuleContext,
  type LangiumServices,
  type LangiumSharedServices,
  type PartialLangiumServices,
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

/** Services of our own, added to Langium's. */
export interface VacnetAddedServices {
  validation: {
    VacnetValidator: VacnetValidator;
  };
}

export type VacnetServices = LangiumServices & VacnetAddedServices;

export const VacnetModule: Module<VacnetServices, PartialLangiumServices & VacnetAddedServices> = {
  references: {
    ScopeComputation: (services) => new VacnetScopeComputation(services),
    ScopeProvider: (services) => new VacnetScopeProvider(services),
    Linker: (services) => new VacnetLinker(services),
  },
  validation: {
    VacnetValidator: () => new VacnetValidator(),
    DocumentValidator: (services) => new VacnetDocumentValidator(services),
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
  },
};

/**
 * Creates the shared services and the vacnet language services. The same
 * wiring serves the language server, the headless loader and the tests.
 */
export function createVacnetServices(context: DefaultSharedModuleContext): {
  shared: LangiumSharedServices;
  Vacnet: VacnetServices;
} {
  const shared = inject(createDefaultSharedModule(context), VacnetGeneratedSharedModule);
  const Vacnet = inject(createDefaultModule({ shared }), VacnetGeneratedModule, VacnetModule);
  shared.ServiceRegistry.register(Vacnet);
  registerValidationChecks(Vacnet);
  return { shared, Vacnet };
}
