import { GrammarUtils, type AstNode, type CstNode } from 'langium';
import type { ElementRef } from '@vacnet/engine';
import type { SourceIndex } from '../lowering/source-index.js';
import type { SourceRange } from '../diagnostic.js';

/**
 * The text range an engine finding should underline: the value of the
 * property it is about (`3 in` of `size 3 in`), else the element's name,
 * else the whole element.
 */
export function locateElement(sources: SourceIndex, ref: ElementRef): SourceRange | undefined {
  return locateElementSource(sources, ref)?.range;
}

/**
 * Like locateElement, with the URI of the document the element is written
 * in: a hose kind of a used catalog lives in the catalog's file.
 */
export function locateElementSource(sources: SourceIndex, ref: ElementRef): { range: SourceRange; uri?: string } | undefined {
  const found = sources.find(ref);
  if (!found) return undefined;
  const cst = found.exact ? valueOf(found.node) : nameOf(found.node);
  if (!cst) return undefined;
  const uri = documentUriOf(found.node);
  return uri ? { range: cst.range, uri } : { range: cst.range };
}

function documentUriOf(node: AstNode): string | undefined {
  let root: AstNode = node;
  while (root.$container) root = root.$container;
  return (root as AstNode & { $document?: { uri?: { toString(): string } } }).$document?.uri?.toString();
}

function valueOf(node: AstNode): CstNode | undefined {
  const withValue = node as AstNode & { value?: AstNode };
  // A Measure (`size 3 in`): point at the quantity, which is what a fix changes.
  if (node.$type === 'Measure' && withValue.value?.$cstNode) return withValue.value.$cstNode;
  if (node.$type === 'Inlet' || node.$type === 'Pipe') return nameOf(node);
  return node.$cstNode;
}

function nameOf(node: AstNode): CstNode | undefined {
  const property = node.$type === 'System' ? 'title' : 'name';
  return GrammarUtils.findNodeForProperty(node.$cstNode, property) ?? node.$cstNode;
}
