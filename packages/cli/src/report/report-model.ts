/**
 * The report as plain data: everything the HTML and Markdown renderers
 * print, built once from a loaded file (model, analysis, findings). Texts
 * are in the system's display units; the plots also carry SI numbers, which
 * their renderers convert. No I/O here and nothing that needs Node: the
 * editor's webview builds the same model.
 */
import type { DisplayUnits, SuppressedFinding, SystemAnalysis, SystemModel } from '@vacnet/engine';
import type { VacnetDiagnostic } from '@vacnet/language';
import { billOfMaterialsModel, type BillOfMaterialsModel } from './bill-of-materials-rows.js';
import { cautionsFor, type Cautions } from './cautions.js';
import { commissioningSheet, type CommissioningSheet } from './commissioning-sheet.js';
import { designBasisRows, type LabelValue } from './design-basis-rows.js';
import { acceptedRows, failureRows, findingRows, rulePagesFor, type AcceptedRow, type FailureRow, type FindingRow, type RulePage } from './finding-rows.js';
import { inletRows, type InletRow } from './inlet-rows.js';
import { pipeRows, type PipeRow } from './pipe-rows.js';
import { curvePlotModel, type CurvePlotModel } from './curve-plot-model.js';
import { quantityText } from './quantity-text.js';
import { scenarioRows, type ScenarioRow } from './scenario-rows.js';
import { schematicModel, type SchematicModel } from './schematic-model.js';
import { summaryModel, type SummaryModel } from './summary-model.js';

/** What a report is made from: one loaded file (the shape `loadDocuments` returns). */
export interface ReportInput {
  /** The file as the reader should see its name (relative to the working folder). */
  path: string;
  model?: SystemModel;
  /** Present when the file was free of structural errors. */
  analysis?: SystemAnalysis;
  diagnostics: readonly VacnetDiagnostic[];
  accepted?: readonly SuppressedFinding[];
}

/** What the report says about its own making. */
export interface ReportContext {
  /** When the report was made (default: now). */
  generatedAt?: Date;
  /** The vacnet version that made it. */
  version?: string;
  /** Rule pages (docs/rules/<code>.md text) by code, for the appendix; codes without one are listed by title. */
  rulePages?: ReadonlyMap<string, string>;
}

export interface FindingCounts {
  errors: number;
  warnings: number;
  infos: number;
  /** Findings the file accepts with a written reason. */
  accepted: number;
}

export interface ReportModel {
  title: string;
  file: string;
  /** ISO 8601, UTC. */
  generatedAt: string;
  /** `2025-03-04 09:30 UTC`. */
  generatedAtText: string;
  version: string;
  units: DisplayUnits;
  counts: FindingCounts;
  /** The file has a system and its airflow analysis ran. */
  analysed: boolean;
  /** Why there is no analysis, when there is none. */
  analysisNote: string | null;
  cautions: Cautions;
  designBasis: LabelValue[];
  summary: SummaryModel;
  curve: CurvePlotModel | null;
  /** Why there is no curve plot, when there is none. */
  curveNote: string | null;
  schematic: SchematicModel | null;
  inlets: InletRow[];
  pipes: PipeRow[];
  scenarios: ScenarioRow[];
  billOfMaterials: BillOfMaterialsModel | null;
  findings: FindingRow[];
  accepted: AcceptedRow[];
  /** Cases the analysis could not solve. */
  failures: FailureRow[];
  commissioning: CommissioningSheet | null;
  /** The pages of the codes found, in the order first listed. */
  rulePages: RulePage[];
}

/** Builds the report model of one file. Never throws: a part that cannot be built is left out with a note. */
export function buildReportModel(input: ReportInput, context: ReportContext = {}): ReportModel {
  const model = input.model;
  const analysis = input.analysis;
  const units: DisplayUnits = model?.displayUnits === 'si' ? 'si' : 'imperial';
  const text = quantityText(units);
  const at = validDate(context.generatedAt) ?? new Date();
  const diagnostics = input.diagnostics ?? [];
  const accepted = input.accepted ?? [];
  const counts: FindingCounts = {
    errors: diagnostics.filter((d) => d.severity === 'error').length,
    warnings: diagnostics.filter((d) => d.severity === 'warning').length,
    infos: diagnostics.filter((d) => d.severity === 'info').length,
    accepted: accepted.length,
  };
  const analysed = Boolean(model && analysis);
  const analysisNote = analysed
    ? null
    : !model
      ? 'The file holds no system that could be read, so there is nothing to analyse. The findings below say why.'
      : counts.errors > 0
        ? 'The airflow analysis runs once the errors listed under Findings are fixed; until then this report shows the design basis, the layout and the findings only.'
        : 'The airflow analysis was not run for this report.';

  const curve = model && analysis ? safely(() => curvePlotModel(model, analysis)) : null;
  const findings = findingRows(diagnostics, context.rulePages);
  const acceptedList = acceptedRows(accepted, context.rulePages);
  return {
    title: model?.name?.trim() || input.path,
    file: input.path,
    generatedAt: at.toISOString(),
    generatedAtText: `${at.toISOString().slice(0, 10)} ${at.toISOString().slice(11, 16)} UTC`,
    version: context.version ?? 'unknown',
    units,
    counts,
    analysed,
    analysisNote,
    cautions: cautionsFor(model),
    designBasis: model ? (safely(() => designBasisRows(model, analysis, text)) ?? []) : [],
    summary: summaryModel(model, analysis, counts, text),
    curve: curve && curve.ok ? curve.plot : null,
    curveNote: curve ? (curve.ok ? null : curve.reason) : analysisNote,
    schematic: model ? safely(() => schematicModel(model, analysis, text)) : null,
    inlets: model && analysis ? (safely(() => inletRows(model, analysis, text)) ?? []) : [],
    pipes: model && analysis ? (safely(() => pipeRows(model, analysis, text)) ?? []) : [],
    scenarios: model && analysis ? (safely(() => scenarioRows(analysis, text)) ?? []) : [],
    billOfMaterials: model && analysis ? safely(() => billOfMaterialsModel(analysis.billOfMaterials, text)) : null,
    findings,
    accepted: acceptedList,
    failures: analysis ? failureRows(analysis.failures ?? []) : [],
    commissioning: model && analysis ? safely(() => commissioningSheet(model, analysis, text)) : null,
    rulePages: rulePagesFor([...findings.map((f) => f.code), ...acceptedList.map((a) => a.code)], context.rulePages),
  };
}

/** A part of the report that fails to build is left out rather than failing the report. */
function safely<T>(build: () => T): T | null {
  try {
    return build();
  } catch {
    return null;
  }
}

function validDate(d: Date | undefined): Date | undefined {
  return d instanceof Date && Number.isFinite(d.getTime()) ? d : undefined;
}
