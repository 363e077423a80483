import { GrammarUtils } from 'langium';
import { formatQuantity } from '@vacnet/engine';
import { isHoseRef, isMeasure, type HoseKind, type Inlet } from '../../generated/ast.js';
import { expectationFor } from '../../semantics/quantity-expectations.js';
import { readQuantity } from '../../semantics/read-quantity.js';
import { catalogItems, useEdit } from './catalog-items.js';
import { appendTo, memberNamed } from './edit-text.js';
import { numberIn, quickFix, type QuickFix } from './fix-context.js';

/** Quick fixes offered at most per finding (our choice: a short menu). */
const MAX_CHOICES = 3;

/**
 * Choose another hose kind from the workspace catalogs for an inlet whose
 * hose loses too much. A hose qualifies by the engine's own estimates in the
 * finding (friction loss grows with length and falls with bore to the
 * fifth): no longer than `maxHoseLengthM` at a bore no smaller than the
 * current one, or a bore of at least `minHoseBoreM` at no greater length.
 * The closest to the current hose comes first; the analysis reruns on it.
 */
export const swapHose: QuickFix = (context) => {
  const element = context.data.element;
  const maxLength = numberIn(context.data, 'maxHoseLengthM');
  const minBore = numberIn(context.data, 'minHoseBoreM');
  if (element?.kind !== 'inlet' || (maxLength === undefined && minBore === undefined)) return [];
  const inlet = memberNamed<Inlet>(context.document, 'Inlet', element.name);
  const current = context.state?.model?.inlets.find((i) => i.name === element.name)?.hose;
  if (!inlet?.$cstNode || !current) return [];
  const units = context.state?.model?.displayUnits ?? 'imperial';
  const candidates = catalogItems<HoseKind>(context.services, 'HoseKind', context.document)
    .map((item) => ({ item, size: hoseSize(item.node) }))
    .filter(({ item, size }) => size && item.node.name !== current.name)
    .filter(({ size }) => {
      const { lengthM, boreM } = size!;
      const shorter = maxLength !== undefined && lengthM <= maxLength && boreM >= current.boreM;
      const wider = minBore !== undefined && boreM >= minBore && lengthM <= current.lengthM;
      return shorter || wider;
    })
    .sort((a, b) => distance(a.size!, current) - distance(b.size!, current))
    .slice(0, MAX_CHOICES);
  const ref = inlet.properties.find(isHoseRef);
  const refNode = ref && GrammarUtils.findNodeForProperty(ref.$cstNode, 'hose');
  return candidates.map(({ item, size }, index) => {
    const name = item.node.name;
    const edits = [refNode ? { range: refNode.range, newText: name } : appendTo(inlet.$cstNode!, `hose ${name}`)];
    if (!item.visible) edits.unshift(useEdit(context.document, item.documentUri));
    const label = `${formatQuantity(size!.lengthM, 'length', units)} x ${formatQuantity(size!.boreM, 'length', units)}`;
    return quickFix(context, `Use hose '${name}' (${label}) at inlet '${inlet.name}'`, edits, index === 0);
  });
};

function hoseSize(node: HoseKind): { lengthM: number; boreM: number } | undefined {
  const read = (key: string) => {
    const q = node.properties.filter(isMeasure).find((m) => m.key === key)?.value;
    const expectation = q && expectationFor(q);
    const reading = q && expectation ? readQuantity(q, expectation) : undefined;
    return reading?.ok ? reading.si : undefined;
  };
  const lengthM = read('length');
  const boreM = read('bore');
  return lengthM !== undefined && boreM !== undefined && lengthM > 0 && boreM > 0 ? { lengthM, boreM } : undefined;
}

/** How far a hose is from the current one, as relative changes of length and bore. */
function distance(size: { lengthM: number; boreM: number }, current: { lengthM: number; boreM: number }): number {
  return Math.abs(size.lengthM - current.lengthM) / current.lengthM + Math.abs(size.boreM - current.boreM) / current.boreM;
}
