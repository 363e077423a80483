import { AstUtils, DefaultScopeComputation, type AstNode, type AstNodeDescription, type LangiumDocument, type MultiMap } from 'langium';
import { isSystem } from '../generated/ast.js';

/**
 * Every name declared inside a system (plants, pipes, the points pipes lead
 * to, inlets, scenarios) is visible throughout that system, however deeply it
 * is nested in the syntax: a point is declared by the pipe that reaches it
 * and used by the pipes that leave it.
 */
export class VacnetScopeComputation extends DefaultScopeComputation {
  protected override addLocalSymbol(node: AstNode, document: LangiumDocument, symbols: MultiMap<AstNode, AstNodeDescription>): void {
    const system = AstUtils.getContainerOfType(node.$container, isSystem);
    const name = this.nameProvider.getName(node);
    if (system && name) {
      symbols.add(system, this.descriptions.createDescription(node, name, document));
      return;
    }
    super.addLocalSymbol(node, document, symbols);
  }
}
