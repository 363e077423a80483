import {
  DefaultScopeComputation,
  interruptAndCheck,
  MultiMap,
  type AstNode,
  type AstNodeDescription,
  type LangiumDocument,
} from 'langium';
import { CancellationToken } from 'vscode-languageserver';
import { isSystem, type System } from '../generated/ast.js';

/** Nodes visited between checks for cancellation (our choice: well under a millisecond of work). */
const NODES_PER_CANCEL_CHECK = 2048;

/**
 * Every name declared inside a system (plants, pipes, the points pipes lead
 * to, inlets, scenarios) is visible throughout that system, however deeply it
 * is nested in the syntax: a point is declared by the pipe that reaches it
 * and used by the pipes that leave it.
 */
export class VacnetScopeComputation extends DefaultScopeComputation {
  /**
   * The default walks every node through a lazy stream and yields to the
   * event loop's check once per node; a 1,000-inlet file has some 60,000
   * nodes (numbers, units, references), so that walk cost more than the
   * symbols. This one walks the tree directly, carrying the system each node
   * is in, and checks for cancellation every few thousand nodes.
   */
  override async collectLocalSymbols(document: LangiumDocument, cancelToken = CancellationToken.None): Promise<MultiMap<AstNode, AstNodeDescription>> {
    const symbols = new MultiMap<AstNode, AstNodeDescription>();
    // Each entry: a node and the system it is inside (undefined at file level).
    const stack: { node: AstNode; system: System | undefined }[] = [];
    pushChildren(document.parseResult.value, undefined, stack);
    let visited = 0;
    while (stack.length > 0) {
      if (++visited % NODES_PER_CANCEL_CHECK === 0) await interruptAndCheck(cancelToken);
      const { node, system } = stack.pop()!;
      this.addSymbolIn(node, system, document, symbols);
      pushChildren(node, isSystem(node) ? node : system, stack);
    }
    return symbols;
  }

  protected override addLocalSymbol(node: AstNode, document: LangiumDocument, symbols: MultiMap<AstNode, AstNodeDescription>): void {
    let system: AstNode | undefined = node.$container;
    while (system && !isSystem(system)) system = system.$container;
    this.addSymbolIn(node, system as System | undefined, document, symbols);
  }

  private addSymbolIn(node: AstNode, system: System | undefined, document: LangiumDocument, symbols: MultiMap<AstNode, AstNodeDescription>): void {
    const name = this.nameProvider.getName(node);
    if (!name) return;
    const scope = system ?? node.$container;
    if (scope) symbols.add(scope, this.descriptions.createDescription(node, name, document));
  }
}

/**
 * Pushes a node's child nodes (its properties that are nodes, or arrays of
 * them; references and values skipped), last first, so that they pop in
 * document order as the default walk visits them.
 */
function pushChildren(node: AstNode, system: System | undefined, stack: { node: AstNode; system: System | undefined }[]): void {
  const start = stack.length;
  for (const key in node) {
    if (key.charCodeAt(0) === 36 /* $ */) continue;
    const value = (node as unknown as Record<string, unknown>)[key];
    if (isNode(value)) stack.push({ node: value, system });
    else if (Array.isArray(value)) {
      for (const item of value as unknown[]) if (isNode(item)) stack.push({ node: item, system });
    }
  }
  // Reverse what was pushed, in place.
  for (let i = start, j = stack.length - 1; i < j; i++, j--) {
    const t = stack[i]!;
    stack[i] = stack[j]!;
    stack[j] = t;
  }
}

function isNode(value: unknown): value is AstNode {
  return typeof value === 'object' && value !== null && typeof (value as { $type?: unknown }).$type === 'string';
}
