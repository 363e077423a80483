import type { AstNode } from 'langium';
import type { ElementKind, ElementRef } from '@vacnet/engine';

/**
 * Where each element of the engine model came from in the file, so that a
 * finding about `pipe riser-b, property size` lands on the `size` token of
 * that pipe's line.
 */
export class SourceIndex {
  private readonly nodes = new Map<string, AstNode>();
  private readonly properties = new Map<string, AstNode>();

  add(kind: ElementKind, name: string, node: AstNode): void {
    const key = `${kind}:${name}`;
    if (!this.nodes.has(key)) this.nodes.set(key, node);
  }

  /** Records the node that states one property of an element (`size` of a pipe). */
  addProperty(kind: ElementKind, name: string, property: string, node: AstNode): void {
    this.properties.set(`${kind}:${name}:${property}`, node);
  }

  /** The most precise node for a reference: its property if known, else the element. */
  find(ref: ElementRef): { node: AstNode; exact: boolean } | undefined {
    if (ref.property) {
      const property = this.properties.get(`${ref.kind}:${ref.name}:${ref.property}`);
      if (property) return { node: property, exact: true };
    }
    const node = this.nodes.get(`${ref.kind}:${ref.name}`);
    return node ? { node, exact: !ref.property } : undefined;
  }
}
