import type { SystemAnalysis } from '@vacnet/engine';
import type { QuantityText } from './quantity-text.js';

/** A named scenario from the file, solved as written. */
export interface ScenarioRow {
  name: string;
  solved: boolean;
  /** `190 scfm at 8.33 inHg`, or why not. */
  producer: string;
  /** Each open inlet: `W5b lifted: 2.1 inHg at the tool, 96 scfm`. */
  inlets: { name: string; state: 'working' | 'lifted'; toolVacuum: string; flow: string }[];
}

export function scenarioRows(analysis: SystemAnalysis, text: QuantityText): ScenarioRow[] {
  return analysis.scenarios.map((s) => ({
    name: s.name,
    solved: s.ok,
    producer: s.ok && s.producer ? `${text.flow(s.producer.flowStdM3PerS)} at ${text.vacuum(s.producer.vacuumPa)}` : 'not solved (see the cases not solved)',
    inlets: s.inlets.map((i) => ({ name: i.name, state: i.toolState, toolVacuum: text.vacuum(i.toolVacuumPa), flow: text.flow(i.flowStdM3PerS) })),
  }));
}
