import { analyseSystem, runRules, type AnalysisOptions, type Finding, type SuppressedFinding, type SystemAnalysis, type SystemModel } from '@vacnet/engine';

/**
 * What the engine says about one system model: the analysis, the findings to
 * show and the accepted ones. Plain data (it crosses a worker-thread
 * boundary by structured clone).
 */
export interface EngineRun {
  analysis: SystemAnalysis;
  findings: Finding[];
  suppressed: SuppressedFinding[];
}

/**
 * Runs the airflow analysis and the design rules on a model. Engine only: no
 * syntax tree, no file system, so it can run on a worker thread. The
 * headless loader and the language server both come through here, so they
 * see the same findings.
 */
export function runEngine(model: SystemModel, options: AnalysisOptions = {}): EngineRun {
  const analysis = analyseSystem(model, options);
  const { findings, suppressed } = runRules(model, analysis);
  return { analysis, findings, suppressed };
}
