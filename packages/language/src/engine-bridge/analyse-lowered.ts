import { analyseSystem, runRules, type Finding, type SuppressedFinding, type SystemAnalysis } from '@vacnet/engine';
import type { LoweredSystem } from '../lowering/lower-system.js';
import type { SourceRange, VacnetDiagnostic } from '../diagnostic.js';
import { StructureCodes } from '../validation/codes.js';
import { locateElement } from './locate-element.js';

/** Codes the language itself reports from the text; the engine's copies would repeat them. */
const REPORTED_BY_THE_LANGUAGE = new Set<string>([
  StructureCodes.unknownRule,
  StructureCodes.suppressionWithoutReason,
  'invalid-rule-setting',
  StructureCodes.noPath,
  StructureCodes.danglingPipe,
  StructureCodes.loop,
]);

/** Code of a case the engine could not solve; the message says why and the element says where. */
export const ANALYSIS_FAILED = 'flow-not-solved';
/** Code of the note that the flow analysis waits for structural errors to be fixed. */
export const ANALYSIS_WAITING = 'analysis-waiting';

export interface EngineResult {
  /** Absent when the model could not be analysed (incomplete, or structural errors). */
  analysis?: SystemAnalysis;
  diagnostics: VacnetDiagnostic[];
  /** Findings accepted in the file, with their reasons. */
  suppressed: SuppressedFinding[];
}

/**
 * Runs the airflow analysis and the design rules on a lowered system and
 * places each finding on the token it concerns. Called with the structural
 * diagnostics of the same file: a file with structural errors is not
 * analysed (its numbers would rest on guesses); it gets one note saying so.
 */
export function analyseLowered(lowered: LoweredSystem, structural: readonly VacnetDiagnostic[], filePath: string): EngineResult {
  const systemRange = locateElement(lowered.sources, { kind: 'system', name: lowered.model.name }) ?? ORIGIN;
  if (!lowered.complete || structural.some((d) => d.severity === 'error')) {
    return {
      diagnostics: [
        {
          severity: 'info',
          code: ANALYSIS_WAITING,
          message: 'The airflow analysis runs once the errors in this file are fixed.',
          range: systemRange,
          source: 'engine',
        },
      ],
      suppressed: [],
    };
  }
  const analysis = analyseSystem(lowered.model);
  const { findings, suppressed } = runRules(lowered.model, analysis);
  const toDiagnostic = (finding: Finding): VacnetDiagnostic => {
    const related = (finding.related ?? [])
      .map((r) => ({ path: filePath, range: locateElement(lowered.sources, r.element), message: r.message }))
      .filter((r): r is { path: string; range: SourceRange; message: string } => r.range !== undefined);
    return {
      severity: finding.severity,
      code: finding.code,
      message: finding.message,
      range: locateElement(lowered.sources, finding.element) ?? systemRange,
      source: 'engine',
      ...(related.length > 0 ? { related } : {}),
      ...(finding.fix ? { data: { ...finding.fix, element: finding.element } } : { data: { element: finding.element } }),
    };
  };
  const diagnostics = findings.filter((f) => !REPORTED_BY_THE_LANGUAGE.has(f.code)).map(toDiagnostic);
  // producer-short already reports a demand beyond the producer; repeating it as an unsolved case says nothing new.
  const producerShortReported = findings.some((f) => f.code === 'producer-short');
  for (const failure of analysis.failures) {
    if (failure.cause === 'infeasible-demand' && producerShortReported) continue;
    diagnostics.push(
      toDiagnostic({
        code: ANALYSIS_FAILED,
        severity: 'error',
        message: `No flow solution for ${failure.stage} of ${failure.subject}: ${failure.message}`,
        element: failure.element ?? { kind: 'system', name: lowered.model.name },
      }),
    );
  }
  return { analysis, diagnostics, suppressed };
}

const ORIGIN: SourceRange = { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } };
