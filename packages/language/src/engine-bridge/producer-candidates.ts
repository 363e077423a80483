import { producerLaw, STANDARD_DENSITY, type ProducerModel as EngineProducerModel, type RatedLoss } from '@vacnet/engine';
import type { ProducerModel } from '../generated/ast.js';
import { lowerProducerModel } from '../lowering/lower-system.js';

/** A catalog producer's flow at the demand vacuum, and its margin over the demand flow. */
export interface ProducerCandidate {
  node: ProducerModel;
  /** Standard flow the curve gives at the demand vacuum, m3/s. */
  flowStdM3PerS: number;
  marginFraction: number;
}

export interface Demand {
  flowStdM3PerS: number;
  vacuumPa: number;
}

/**
 * Catalog producers that meet a demand with the required margin, least
 * oversized first. Each candidate's curve is read through the engine's
 * producer law (with the plant's exhaust line, if any) at the demand
 * vacuum, as the engine computes a producer's margin: curve flow at the
 * demand vacuum over the demand flow, minus one. The demand itself belongs
 * to the piping and tools, not to the producer, so it holds for any.
 */
export function producersMeetingDemand(
  nodes: readonly ProducerModel[],
  demand: Demand,
  requiredMargin: number,
  air: { ambientPa: number; temperatureK: number },
  exhaust: RatedLoss | undefined,
): ProducerCandidate[] {
  const ok = (x: number) => Number.isFinite(x);
  if (![demand.flowStdM3PerS, demand.vacuumPa, requiredMargin, air.ambientPa, air.temperatureK].every(ok) || demand.flowStdM3PerS <= 0) return [];
  const inletPa = air.ambientPa - demand.vacuumPa;
  if (!(inletPa > 0)) return [];
  const out: ProducerCandidate[] = [];
  for (const node of nodes) {
    const lowered = lowerProducerModel(node);
    if (!lowered.complete) continue;
    const flow = flowAt(lowered.model, inletPa, air, exhaust);
    if (flow === undefined) continue;
    const margin = flow / demand.flowStdM3PerS - 1;
    if (margin >= requiredMargin) out.push({ node, flowStdM3PerS: flow, marginFraction: margin });
  }
  return out.sort((a, b) => a.marginFraction - b.marginFraction);
}

function flowAt(model: EngineProducerModel, inletPa: number, air: { ambientPa: number; temperatureK: number }, exhaust: RatedLoss | undefined): number | undefined {
  try {
    const law = producerLaw({ name: model.name, model, ...(exhaust ? { exhaust } : {}) }, air.temperatureK);
    // Past the curve's last flow the law extends it straight, as the engine's own margin does.
    const result = law.flow(inletPa, air.ambientPa);
    const q = result.massFlowKgPerS / STANDARD_DENSITY;
    return Number.isFinite(q) ? q : undefined;
  } catch {
    return undefined;
  }
}
