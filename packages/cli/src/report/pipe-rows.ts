import type { Orientation, SystemAnalysis, SystemModel } from '@vacnet/engine';
import { nominalSizeText } from './nominal-size-text.js';
import type { QuantityText } from './quantity-text.js';

/** One pipe: its make, and the slowest and fastest air it sees. */
export interface PipeRow {
  name: string;
  /** `from -> to` as written (toward the producer first). */
  run: string;
  spec: string;
  material: string;
  size: string;
  insideDiameter: string;
  length: string;
  orientation: string;
  /** Lowest velocity with one operator, at the inlet that gives it. */
  minVelocity: string;
  minVelocityInlet: string;
  /** Highest velocity with the design operators, tools lifted, and the set that gives it. */
  maxVelocity: string;
  maxVelocityInlets: string[];
  loss: string;
  si: { minVelocityMPerS: number | null; maxVelocityMPerS: number | null; lossPa: number | null; lengthM: number; insideDiameterM: number };
}

const ORIENTATION_TEXT: Readonly<Record<Orientation, string>> = {
  horizontal: 'horizontal',
  'air-up': 'vertical, air up',
  'air-down': 'vertical, air down',
};

/** The pipe table, in the analysis's order (the file's). */
export function pipeRows(model: SystemModel, analysis: SystemAnalysis, text: QuantityText): PipeRow[] {
  const byName = new Map((model.pipes ?? []).map((p) => [p.name, p]));
  return analysis.pipes.map((a) => {
    const pipe = byName.get(a.name);
    return {
      name: a.name,
      run: pipe ? `${pipe.from} \u2192 ${pipe.to}` : '',
      spec: pipe?.spec?.name ?? '',
      material: pipe?.spec?.material ?? '',
      size: nominalSizeText(pipe?.nominalSizeM, model.displayUnits),
      insideDiameter: text.bore(a.insideDiameterM),
      length: text.length(a.lengthM),
      orientation: pipe ? (ORIENTATION_TEXT[pipe.orientation] ?? pipe.orientation) : '',
      minVelocity: text.velocity(a.minVelocityMPerS),
      minVelocityInlet: a.minVelocityInlet ?? '',
      maxVelocity: text.velocity(a.maxVelocityMPerS),
      maxVelocityInlets: [...a.maxVelocityInlets],
      loss: text.vacuum(a.lossPa),
      si: { minVelocityMPerS: a.minVelocityMPerS, maxVelocityMPerS: a.maxVelocityMPerS, lossPa: a.lossPa, lengthM: a.lengthM, insideDiameterM: a.insideDiameterM },
    };
  });
}
