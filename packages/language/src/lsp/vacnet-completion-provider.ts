import { ACCEPTED_UNITS, RULES } from '@vacnet/engine';
import { AstUtils, CstUtils, GrammarAST, UriUtils, type AstNodeDescription, type LangiumDocument, type MaybePromise, type ReferenceInfo } from 'langium';
import {
  DefaultCompletionProvider,
  type CompletionAcceptor,
  type CompletionContext,
  type CompletionProviderOptions,
  type CompletionValueItem,
  type NextFeature,
} from 'langium/lsp';
import {
  CompletionItemKind,
  CompletionList,
  type CancellationToken,
  type CompletionItem,
  type CompletionParams,
} from 'vscode-languageserver';
import { isQuantity, type Quantity } from '../generated/ast.js';
import { expectationFor, type Expectation } from '../semantics/quantity-expectations.js';
import { findRule, writtenParameterName } from '../semantics/rule-parameters.js';
import { ELEMENT_NOUNS } from './element-nouns.js';

/** The unit word for a bend radius in multiples of the pipe diameter (`radius 1.5 D`). */
const DIAMETERS_UNIT = 'D';

/** A number token as the grammar's NUMBER terminal writes it (decimals, exponents, trade fractions). */
const NUMBER_AT_END = /-?(\d+-\d+\/\d+|\d+\/\d+|(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?)$/;
/** Characters a unit is written with: `inHg`, `m3/h`, `ft^3/min`, `%`. */
const UNIT_CHARS = /[A-Za-z0-9_%^/*]*$/;

/**
 * Completion for .vacnet files. Langium proposes keywords and the names in
 * scope (plants, points, pipes and inlets of the system; specs, hoses, tools
 * and models of the catalogs the file `use`s). On top of that:
 *
 * - after a number, only the units that measure what that place needs (a
 *   pipe length offers lengths, a curve's second column pressures, a bend
 *   radius `D` and lengths), from the engine's list of accepted units;
 * - the design-rule codes after `rule`, `threshold` and `accept`, and a
 *   rule's parameter names after its code;
 * - no soft keywords where a new name is being written (`pipe |`).
 */
export class VacnetCompletionProvider extends DefaultCompletionProvider {
  override readonly completionOptions: CompletionProviderOptions = { triggerCharacters: [' '] };

  override async getCompletion(document: LangiumDocument, params: CompletionParams, cancelToken?: CancellationToken): Promise<CompletionList | undefined> {
    const units = this.unitCompletion(document, document.textDocument.offsetAt(params.position));
    if (units) return units;
    // A space opens the list only where a unit is due; elsewhere it would pop up after every word.
    if (params.context?.triggerCharacter === ' ') return CompletionList.create([], false);
    const rules = this.ruleCompletion(document, document.textDocument.offsetAt(params.position));
    if (rules?.only) return CompletionList.create(rules.items, false);
    const list = await super.getCompletion(document, params, cancelToken);
    if (rules && list) list.items.push(...rules.items);
    return list;
  }

  /**
   * Units for the quantity whose number stands just before the cursor (with
   * the cursor after a space, or inside the unit being typed); undefined when
   * the cursor is not at a unit.
   */
  protected unitCompletion(document: LangiumDocument, offset: number): CompletionList | undefined {
    const text = document.textDocument.getText();
    const before = text.slice(0, offset);
    const typed = UNIT_CHARS.exec(before)?.[0] ?? '';
    const unitStart = offset - typed.length;
    const gap = /[ \t]+$/.exec(text.slice(0, unitStart))?.[0] ?? '';
    if (gap.length === 0) return undefined;
    const numberEnd = unitStart - gap.length;
    const number = NUMBER_AT_END.exec(text.slice(Math.max(0, numberEnd - 40), numberEnd))?.[0];
    if (!number) return undefined;
    const quantity = this.quantityAt(document, numberEnd - number.length);
    if (!quantity) return undefined;
    const expectation = expectationFor(quantity);
    if (!expectation || expectation.dimension === 'dimensionless') return undefined;
    const unitEnd = unitStart + (/^[A-Za-z0-9_%^/*]*/.exec(text.slice(unitStart))?.[0].length ?? 0);
    const range = { start: document.textDocument.positionAt(unitStart), end: document.textDocument.positionAt(unitEnd) };
    const items: CompletionItem[] = unitsFor(expectation).map(({ unit, detail }, index) => ({
      label: unit,
      kind: CompletionItemKind.Unit,
      detail,
      // Keep the engine's order: the trade's usual spellings come first.
      sortText: String(index).padStart(3, '0'),
      textEdit: { range, newText: unit },
    }));
    if (isBendAngle(quantity) && typed.length === 0) {
      // `bend 2 x 45 deg`: a number after `bend` may be a count.
      items.push({ label: 'x', kind: CompletionItemKind.Keyword, detail: 'count of bends: bend 2 x 45 deg', sortText: '999', textEdit: { range, newText: 'x' } });
    }
    return CompletionList.create(items, false);
  }

  private quantityAt(document: LangiumDocument, numberOffset: number): Quantity | undefined {
    const root = document.parseResult.value.$cstNode;
    if (!root) return undefined;
    const leaf = CstUtils.findLeafNodeAtOffset(root, numberOffset);
    const node = leaf?.astNode;
    return node && isQuantity(node) && leaf.offset === numberOffset ? node : undefined;
  }

  /** Says what a proposed name is in trade words, and which file it comes from when it is not this one. */
  protected override createReferenceCompletionItem(description: AstNodeDescription, refInfo: ReferenceInfo, context: CompletionContext): CompletionValueItem {
    const item = super.createReferenceCompletionItem(description, refInfo, context);
    const noun = ELEMENT_NOUNS[description.type] ?? description.type;
    const elsewhere = description.documentUri.toString() !== context.document.uri.toString();
    return { ...item, detail: elsewhere ? `${noun} · ${UriUtils.basename(description.documentUri)}` : noun };
  }

  protected override completionFor(context: CompletionContext, next: NextFeature, acceptor: CompletionAcceptor): MaybePromise<void> {
    const rule = AstUtils.getContainerOfType(next.feature, GrammarAST.isParserRule);
    // A new name is being written: the soft keywords the `Name` rule admits are no proposal.
    if (GrammarAST.isKeyword(next.feature) && rule?.name === 'Name') return;
    return super.completionFor(context, next, acceptor);
  }

  /**
   * Rule codes after `rule`, `threshold` and `accept`; a rule's parameters
   * after its code. Read from the line's text: the line is incomplete while
   * it is typed, so the parser may not have built it.
   */
  protected ruleCompletion(document: LangiumDocument, offset: number): { items: CompletionItem[]; only: boolean } | undefined {
    const text = document.textDocument.getText();
    const lineStart = text.lastIndexOf('\n', offset - 1) + 1;
    const line = text.slice(lineStart, offset);
    const word = /[A-Za-z0-9_-]*$/.exec(line)![0];
    const range = { start: document.textDocument.positionAt(offset - word.length), end: document.textDocument.positionAt(offset) };
    if (/(?:^|\s)(?:rule|threshold|accept)\s+[A-Za-z0-9_-]*$/.test(line)) {
      const items = RULES.map((r) => ({
        label: r.code,
        kind: CompletionItemKind.EnumMember,
        detail: r.title,
        sortText: '0',
        textEdit: { range, newText: r.code },
      }));
      return { items, only: true };
    }
    const code = /(?:^|\s)(?:rule|threshold)\s+([A-Za-z_][A-Za-z0-9_-]*)\s+[A-Za-z0-9_-]*$/.exec(line)?.[1];
    const found = code ? findRule(code) : undefined;
    if (!found) return undefined;
    const items = found.parameters.map((parameter) => {
      const label = writtenParameterName(parameter.name);
      return { label, kind: CompletionItemKind.Property, detail: parameter.description, sortText: '0', textEdit: { range, newText: label } };
    });
    return { items, only: false };
  }
}

/** The units a place accepts, each with what it measures. */
function unitsFor(expectation: Expectation): { unit: string; detail: string }[] {
  if (expectation.dimension === 'dimensionless') return [];
  if (expectation.dimension === 'radius') {
    return [
      { unit: DIAMETERS_UNIT, detail: 'multiples of the pipe diameter' },
      ...ACCEPTED_UNITS['length'].map((unit) => ({ unit, detail: expectation.what })),
    ];
  }
  return ACCEPTED_UNITS[expectation.dimension].map((unit) => ({ unit, detail: expectation.what }));
}

function isBendAngle(quantity: Quantity): boolean {
  return quantity.$container.$type === 'Bend' && quantity.$containerProperty === 'angle';
}
