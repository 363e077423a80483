import { URI } from 'langium';
import type { Connection } from 'vscode-languageserver';
import type { SystemAnalysis } from '@vacnet/engine';
import type { VacnetServices } from '../vacnet-module.js';
import type { DocumentAnalysis } from '../engine-bridge/analysis-cache.js';
import type { VacnetDiagnostic } from '../diagnostic.js';
import { toVacnetDiagnostic } from '../diagnostic-conversion.js';
import { display } from './analysis-text.js';
import {
  encodePlainData,
  REPORT_DATA_REQUEST,
  SYSTEM_SUMMARY_REQUEST,
  type ReportData,
  type SystemRequestParams,
  type SystemSummary,
} from './system-requests-protocol.js';

/**
 * How long a request waits for a pending analysis before it answers null, ms
 * (our choice: twice the longest analysis of the examples here under load;
 * the client asks again on the next change anyway).
 */
const SETTLE_LIMIT_MS = 20_000;

/**
 * Registers the server's requests about one system document (see
 * system-requests-protocol.ts): its summary for a status bar, and its report
 * input for the report and schematic views. Both answer from the analysis
 * cache for the document's current text version, waiting for a pending
 * analysis, and never start a solve of their own. Unknown documents, bad
 * parameters and timeouts answer null.
 */
export function registerSystemRequests(connection: Connection, services: VacnetServices): void {
  connection.onRequest(SYSTEM_SUMMARY_REQUEST, async (params: unknown): Promise<SystemSummary | null> => {
    const found = await settledDocument(services, params);
    return found ? summaryOf(found.state, found.diagnostics) : null;
  });
  connection.onRequest(REPORT_DATA_REQUEST, async (params: unknown): Promise<ReportData | null> => {
    const found = await settledDocument(services, params);
    if (!found) return null;
    const { state, diagnostics, uri } = found;
    const parsed = URI.parse(uri);
    const input = {
      // The client shows the path as its workspace sees it; this is a fallback.
      path: parsed.scheme === 'file' ? parsed.fsPath : parsed.path.split('/').pop() || uri,
      diagnostics,
      ...(state.model ?? state.lowered?.model ? { model: state.model ?? state.lowered!.model } : {}),
      ...(state.status === 'ready' && state.result?.analysis ? { analysis: state.result.analysis } : {}),
      accepted: state.result?.suppressed ?? [],
    };
    return { uri, version: state.version, status: state.status, input: encodePlainData(input) };
  });
}

interface SettledDocument {
  uri: string;
  state: DocumentAnalysis;
  /** Every diagnostic of this version: Langium's and the engine's, as the editor shows them. */
  diagnostics: VacnetDiagnostic[];
}

async function settledDocument(services: VacnetServices, params: unknown): Promise<SettledDocument | undefined> {
  const uri = (params as Partial<SystemRequestParams> | null)?.uri;
  if (typeof uri !== 'string') return undefined;
  const cache = services.engine.AnalysisCache;
  // A document the server has never seen has nothing to wait for.
  const known = cache.state(uri) !== undefined || services.shared.workspace.TextDocuments?.get(uri) !== undefined || hasDocument(services, uri);
  if (!known) return undefined;
  const state = await cache.whenSettled(uri, SETTLE_LIMIT_MS);
  if (!state) return undefined;
  const document = services.shared.workspace.LangiumDocuments.getDocument(URI.parse(uri));
  const structural = (document?.diagnostics ?? []).map(toVacnetDiagnostic);
  const engine = state.status === 'pending' ? [] : [...(state.result?.diagnostics ?? []), ...state.settingsDiagnostics];
  return { uri, state, diagnostics: [...structural, ...engine] };
}

function hasDocument(services: VacnetServices, uri: string): boolean {
  try {
    return services.shared.workspace.LangiumDocuments.hasDocument(URI.parse(uri));
  } catch {
    // Not a URI at all.
    return false;
  }
}

function summaryOf(state: DocumentAnalysis, diagnostics: readonly VacnetDiagnostic[]): SystemSummary {
  const count = (severity: VacnetDiagnostic['severity']) => diagnostics.filter((d) => d.severity === severity).length;
  const summary: SystemSummary = {
    uri: state.uri,
    version: state.version,
    status: state.status,
    counts: { errors: count('error'), warnings: count('warning'), infos: count('info') },
  };
  const model = state.model ?? state.lowered?.model;
  if (model) summary.system = model.name;
  const analysis = state.status === 'ready' ? state.result?.analysis : undefined;
  if (!analysis) return summary;
  const text = display(model?.displayUnits);
  const producer = analysis.producer;
  if (producer) {
    summary.producer = {
      name: producer.name,
      marginFraction: producer.marginFraction,
      marginText: producer.marginFraction === null ? 'margin unknown' : `margin ${Math.round(producer.marginFraction * 100)} %`,
      pointText: `${text.flow(producer.flowStdM3PerS)} at ${text.pressure(producer.vacuumPa)}`,
    };
  }
  const worst = worstInlet(analysis);
  if (worst?.worstCase) {
    const need = worst.worstCase.requiredToolVacuumPa;
    summary.worstInlet = {
      name: worst.name,
      text: `${text.pressure(worst.worstCase.toolVacuumPa)} at the tool${need === null ? '' : ` (needs ${text.pressure(need)})`}`,
      short: need !== null && worst.worstCase.toolVacuumPa < need,
    };
  }
  return summary;
}

/** The design case's critical inlet: the one whose tool is left with the least vacuum over what it needs (the engine's choice). */
function worstInlet(analysis: SystemAnalysis): SystemAnalysis['inlets'][number] | undefined {
  const name = analysis.designCase?.criticalInlet;
  return name === undefined ? undefined : analysis.inlets.find((inlet) => inlet.name === name && inlet.worstCase);
}
