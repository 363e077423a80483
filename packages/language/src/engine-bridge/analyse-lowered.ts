import { URI } from 'langium';
import type { Finding, SuppressedFinding, SystemAnalysis } from '@vacnet/engine';
import type { LoweredSystem } from '../lowering/lower-system.js';
import type { SourceRange, VacnetDiagnostic } from '../diagnostic.js';
import { StructureCodes } from '../validation/codes.js';
import { locateElement, locateElementSource } from './locate-element.js';
import { runEngine, type EngineRun } from './engine-run.js';

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
  if (analysisBlocked(lowered, structural)) return waitingResult(lowered);
  return placeEngineRun(lowered, runEngine(lowered.model), filePath);
}

/** True when the analysis must wait: a value could not be read, or the file has structural errors. */
export function analysisBlocked(lowered: LoweredSystem, structural: readonly { severity?: VacnetDiagnostic['severity'] | number }[]): boolean {
  return !lowered.complete || structural.some((d) => d.severity === 'error' || d.severity === 1);
}

/** The one note a blocked system gets, on its title. */
export function waitingResult(lowered: LoweredSystem): EngineResult {
  return {
    diagnostics: [
      {
        severity: 'info',
        code: ANALYSIS_WAITING,
        message: 'The airflow analysis runs once the errors in this file are fixed.',
        range: systemRange(lowered),
        source: 'engine',
      },
    ],
    suppressed: [],
  };
}

/**
 * Places the engine's findings on the tokens of the lowered file: the
 * property a finding names, else the element's name, else the system title.
 * Related elements in other files (a used catalog's hose kind) keep their
 * own file.
 */
export function placeEngineRun(lowered: LoweredSystem, run: EngineRun, filePath: string): EngineResult {
  const { analysis, findings, suppressed } = run;
  const fallback = systemRange(lowered);
  // A large system names the same elements in many findings (each inlet of each worst-case set): find each place once.
  const places = new Map<string, ReturnType<typeof locateElementSource>>();
  const locate = (ref: Finding['element']) => {
    const key = `${ref.kind}\u0000${ref.name}\u0000${ref.property ?? ''}`;
    if (!places.has(key)) places.set(key, locateElementSource(lowered.sources, ref));
    return places.get(key);
  };
  const toDiagnostic = (finding: Finding): VacnetDiagnostic => {
    const related: NonNullable<VacnetDiagnostic['related']> = [];
    for (const r of finding.related ?? []) {
      const place = locate(r.element);
      if (!place) continue;
      related.push({ path: place.uri ? pathOf(place.uri, filePath) : filePath, range: place.range, message: r.message, ...(place.uri ? { uri: place.uri } : {}) });
    }
    return {
      severity: finding.severity,
      code: finding.code,
      message: finding.message,
      range: locate(finding.element)?.range ?? fallback,
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

function systemRange(lowered: LoweredSystem): SourceRange {
  return locateElement(lowered.sources, { kind: 'system', name: lowered.model.name }) ?? ORIGIN;
}

/** A file path for a document URI; other schemes (in-memory documents) keep the caller's path. */
function pathOf(uri: string, fallback: string): string {
  try {
    const parsed = URI.parse(uri);
    return parsed.scheme === 'file' ? parsed.fsPath : fallback;
  } catch {
    return fallback;
  }
}

const ORIGIN: SourceRange = { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } };
