import { unitConversion, formatQuantity } from '@vacnet/engine';
import { isMeasure, type Pipe } from '../../generated/ast.js';
import { memberNamed, numberText } from './edit-text.js';
import { numberIn, quickFix, type QuickFix } from './fix-context.js';

/**
 * Resize a pipe to the size the engine computed (slow-carrying-velocity:
 * the largest size of its spec that carries with one operator and whose
 * added loss the served inlets can spare; fast-velocity: the smallest
 * larger size under the limit; shrinking-pipe: the size of the pipe it
 * feeds). The new size is written in the unit the pipe's size is written in.
 */
export const resizePipe: QuickFix = (context) => {
  const nominal = numberIn(context.data, 'nominalSizeM');
  const element = context.data.element;
  if (nominal === undefined || nominal <= 0 || element?.kind !== 'pipe') return [];
  const pipe = memberNamed<Pipe>(context.document, 'Pipe', element.name);
  const size = pipe?.properties.filter(isMeasure).find((m) => m.key === 'size');
  const quantity = size?.value;
  if (!quantity?.$cstNode) return [];
  const unit = quantity.unit?.trim() || (context.state?.model?.displayUnits === 'si' ? 'mm' : 'in');
  const conversion = unitConversion(unit, 'length');
  if (!conversion) return [];
  const value = (nominal - conversion.offset) / conversion.scale;
  const text = `${numberText(value)} ${unit}`;
  const units = context.state?.model?.displayUnits ?? 'imperial';
  const velocity = numberIn(context.data, 'estimatedVelocityMPerS');
  const detail = velocity !== undefined ? ` (about ${formatQuantity(velocity, 'velocity', units)} with one operator)` : '';
  return [quickFix(context, `Resize pipe '${pipe!.name}' to ${text}${detail}`, [{ range: quantity.$cstNode.range, newText: text }], true)];
};
