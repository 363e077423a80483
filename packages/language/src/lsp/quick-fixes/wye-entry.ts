import { isJoins, type Pipe } from '../../generated/ast.js';
import { memberNamed, numberText } from './edit-text.js';
import { quickFix, type QuickFix } from './fix-context.js';

/** Replace a 90 deg tee entry with the wye the tee-branch-entry finding names (45 deg). */
export const wyeEntry: QuickFix = (context) => {
  const element = context.data.element;
  const joins = context.data.joins as { kind?: unknown; angleRad?: unknown } | undefined;
  if (element?.kind !== 'pipe' || joins?.kind !== 'wye' || typeof joins.angleRad !== 'number' || !Number.isFinite(joins.angleRad)) return [];
  const pipe = memberNamed<Pipe>(context.document, 'Pipe', element.name);
  const node = pipe?.properties.find(isJoins);
  if (!node?.$cstNode) return [];
  const text = `joins wye ${numberText((joins.angleRad * 180) / Math.PI, 3)} deg`;
  return [quickFix(context, `Enter through a wye: ${text}`, [{ range: node.$cstNode.range, newText: text }], true)];
};
