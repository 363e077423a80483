import { GrammarUtils } from 'langium';
import { formatQuantity, RULES } from '@vacnet/engine';
import { isProducerUnit, type Plant, type ProducerModel } from '../../generated/ast.js';
import { producersMeetingDemand, type Demand } from '../../engine-bridge/producer-candidates.js';
import { catalogItems, useEdit } from './catalog-items.js';
import { memberNamed } from './edit-text.js';
import { numberIn, quickFix, type QuickFix } from './fix-context.js';

/** Quick fixes offered at most per finding (our choice: a short menu). */
const MAX_CHOICES = 3;

/**
 * Pick a producer model from the workspace catalogs that meets the demand of
 * a producer-short or producer-margin finding with the required margin, the
 * least oversized first. The engine's producer law gives each candidate's
 * flow at the demand vacuum (engine-bridge/producer-candidates.ts).
 */
export const swapProducer: QuickFix = (context) => {
  const element = context.data.element;
  const demand = context.data.demand as Demand | null | undefined;
  const state = context.state;
  if (element?.kind !== 'producer' || !demand || typeof demand !== 'object' || !state?.model || !state.result?.analysis) return [];
  const unitModel = state.model.producers.find((p) => p.name === element.name);
  const plantName = element.name.split('.')[0];
  const plant = memberNamed<Plant>(context.document, 'Plant', plantName);
  const unit = plant?.equipment.filter(isProducerUnit)[0];
  const refNode = unit && GrammarUtils.findNodeForProperty(unit.$cstNode, 'model');
  if (!unitModel || !refNode) return [];
  const required = numberIn(context.data, 'requiredMarginFraction') ?? state.model.design.producerMarginFraction ?? defaultMargin();
  const items = catalogItems<ProducerModel>(context.services, 'ProducerModel', context.document).filter((i) => i.node.name !== unitModel.model.name);
  const air = { ambientPa: state.result.analysis.ambient.pressurePa, temperatureK: state.result.analysis.ambient.temperatureK };
  const fits = producersMeetingDemand(
    items.map((i) => i.node),
    demand,
    required,
    air,
    unitModel.exhaust,
  ).slice(0, MAX_CHOICES);
  const units = state.model.displayUnits ?? 'imperial';
  return fits.map((fit, index) => {
    const item = items.find((i) => i.node === fit.node)!;
    const edits = [{ range: refNode.range, newText: fit.node.name }];
    if (!item.visible) edits.unshift(useEdit(context.document, item.documentUri));
    const detail = `${formatQuantity(fit.flowStdM3PerS, 'flow', units, 3, { flowBasis: 'standard' })} at the demand's ${formatQuantity(demand.vacuumPa, 'pressure', units)}, margin ${formatQuantity(fit.marginFraction, 'fraction', units, 2)}`;
    return quickFix(context, `Use producer '${fit.node.name}' (${detail})`, edits, index === 0);
  });
};

/** The producer-margin rule's default required margin (engine rule table). */
function defaultMargin(): number {
  return RULES.find((r) => r.code === 'producer-margin')?.parameters.find((p) => p.name === 'minMargin')?.default ?? 0;
}
