// The language package's public surface: the rest of the product imports from here, never from generated/.
export { createVacnetServices, VacnetModule, type VacnetServices } from './vacnet-module.js';
export { loadDocuments, toVacnetDiagnostic, type LoadedFile, type LoadedSettingsFile, type LoadOptions, type LoadResult } from './document.js';
export { analyseLowered, ANALYSIS_FAILED, ANALYSIS_WAITING, type EngineResult } from './engine-bridge/analyse-lowered.js';
export { locateElement } from './engine-bridge/locate-element.js';
export type { VacnetDiagnostic, SourceRange, SourcePosition, DiagnosticSeverity } from './diagnostic.js';
export { lowerSystem, type LoweredSystem } from './lowering/lower-system.js';
export { SourceIndex } from './lowering/source-index.js';
export { StructureCodes, type StructureCode } from './validation/codes.js';
export * as Ast from './generated/ast.js';
export { formatText } from './lsp/format-text.js';
export { PROJECT_SETTINGS_FILE, SettingsCodes, parseProjectSettings, applyProjectSettings, emptyProjectSettings, statesDisplayUnits, type ProjectSettings, type ProjectHints, type ProjectSettingsReading } from './settings/project-settings.js';
export { findProjectSettingsFile, diskAccess, type SettingsFileAccess, type FoundSettingsFile } from './settings/find-project-settings.js';
export { syntaxErrorsOf } from './syntax-errors.js';
