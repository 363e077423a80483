import { AstUtils, CstUtils, GrammarAST, GrammarUtils, type AstNode, type CstNode } from 'langium';
import { AbstractSemanticTokenProvider, type SemanticTokenAcceptor } from 'langium/lsp';
import { SemanticTokenModifiers, SemanticTokenTypes } from 'vscode-languageserver';

/**
 * Semantic tokens, in the standard token types every theme colours:
 *
 * - a quantity's number `number`, its unit `type` (so `35 ft` reads as two
 *   colours and a missing unit shows), a plain count `number`;
 * - a name where it is declared `variable` + `declaration` (a point declared
 *   by `to NAME` too), a name used `variable`;
 * - a design-rule code `macro`, a rule parameter `property`;
 * - keywords `keyword`, value words (`up`, `wye`, `general`, `lifted`)
 *   `enumMember`, strings `string`.
 *
 * Trade words used as names (a tool called `carpet`, a point called `up`)
 * are names here, not keywords: that is what the grammar's TextMate
 * colouring cannot tell apart.
 */
export class VacnetSemanticTokenProvider extends AbstractSemanticTokenProvider {
  protected highlightElement(node: AstNode, acceptor: SemanticTokenAcceptor): void {
    const cst = node.$cstNode;
    if (!cst) return;
    this.highlightKeywords(node, cst, acceptor);
    const property = (name: string, type: string, modifier?: string) => {
      for (const target of GrammarUtils.findNodesForProperty(cst, name)) {
        acceptor({ cst: target, type, ...(modifier ? { modifier } : {}) });
      }
    };
    if (typeof (node as { name?: unknown }).name === 'string') {
      property('name', SemanticTokenTypes.variable, SemanticTokenModifiers.declaration);
    }
    for (const reference of REFERENCES[node.$type] ?? []) property(reference, SemanticTokenTypes.variable);
    for (const text of STRINGS[node.$type] ?? []) property(text, SemanticTokenTypes.string);
    switch (node.$type) {
      case 'Quantity':
        property('value', SemanticTokenTypes.number);
        property('unit', SemanticTokenTypes.type);
        break;
      case 'Operators':
        property('count', SemanticTokenTypes.number);
        break;
      case 'Schedule':
        property('schedule', SemanticTokenTypes.number);
        break;
      case 'Bend':
        property('count', SemanticTokenTypes.number);
        break;
      case 'Material':
        property('material', SemanticTokenTypes.enumMember);
        break;
      case 'RuleLine':
      case 'Threshold':
      case 'Accept':
        property('rule', SemanticTokenTypes.macro);
        property('parameter', SemanticTokenTypes.property);
        break;
    }
  }

  /** The node's own keywords: value words as `enumMember`, the rest as `keyword`; none inside a name or a unit. */
  private highlightKeywords(node: AstNode, cst: CstNode, acceptor: SemanticTokenAcceptor): void {
    for (const leaf of CstUtils.flattenCst(cst)) {
      if (leaf.hidden || leaf.astNode !== node || !GrammarAST.isKeyword(leaf.grammarSource)) continue;
      if (insideRule(leaf, cst, NOT_KEYWORDS)) continue;
      if (!/\p{L}/u.test(leaf.text)) continue; // braces and commas stay plain punctuation
      const assignment = AstUtils.getContainerOfType(leaf.grammarSource, GrammarAST.isAssignment);
      const rule = AstUtils.getContainerOfType(leaf.grammarSource, GrammarAST.isParserRule);
      const isValue = assignment !== undefined && rule !== undefined && VALUE_WORDS.has(`${rule.name}.${assignment.feature}`);
      acceptor({ cst: leaf, type: isValue ? SemanticTokenTypes.enumMember : SemanticTokenTypes.keyword });
    }
  }
}

/** Datatype rules whose keywords are not keywords where they stand: names and units. */
const NOT_KEYWORDS = new Set(['Name', 'Unit', 'UnitFactor']);

/** Assignments whose keyword is a value chosen from a list (`debris general`, `joins wye`). */
const VALUE_WORDS = new Set([
  'Orientation.direction', 'Debris.debris', 'Dust.hazard', 'Joins.kind', 'Opening.state', 'SeparatorUnit.placement',
  'RuleLine.severity', 'DisplayUnits.system', 'Area.surface',
]);

/** Cross-reference properties per element. */
const REFERENCES: Record<string, string[]> = {
  Pipe: ['from', 'into'],
  Inlet: ['at', 'pipe'],
  Cleanout: ['at', 'pipe'],
  Opening: ['inlet'],
  ProducerUnit: ['model'],
  FilterUnit: ['model'],
  SeparatorUnit: ['model'],
  SpecRef: ['spec'],
  HoseRef: ['hose'],
  ToolRef: ['tool'],
};

/** String properties per element. */
const STRINGS: Record<string, string[]> = {
  Use: ['path'],
  System: ['title'],
  Room: ['label'],
  RuleLine: ['reason'],
  Accept: ['reason'],
};

/** True when a composite between `leaf` and `top` was produced by one of `rules` (a datatype rule call). */
function insideRule(leaf: CstNode, top: CstNode, rules: ReadonlySet<string>): boolean {
  for (let node = leaf.container; node && node !== top.container; node = node.container) {
    const source = node.grammarSource;
    if (GrammarAST.isRuleCall(source) && rules.has(source.rule.ref?.name ?? '')) return true;
    if (GrammarAST.isCrossReference(source)) return true;
  }
  return false;
}
