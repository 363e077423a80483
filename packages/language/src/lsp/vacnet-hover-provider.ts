import { formatQuantity, RULES, type Dimension, type RuleInfo, type RuleParameter, type UnitSystem } from '@vacnet/engine';
import { AstUtils, CstUtils, GrammarAST, UriUtils, type AstNode, type CstNode, type LangiumDocument, type MaybePromise } from 'langium';
import { AstNodeHoverProvider, type LangiumServices } from 'langium/lsp';
import type { Hover, HoverParams } from 'vscode-languageserver';
import { isQuantity, type Quantity } from '../generated/ast.js';
import { expectationFor } from '../semantics/quantity-expectations.js';
import { readQuantity } from '../semantics/read-quantity.js';
import { findRule, writtenParameterName } from '../semantics/rule-parameters.js';
import type { AnalysisCache } from '../engine-bridge/analysis-cache.js';
import { ELEMENT_NOUNS } from './element-nouns.js';
import { elementHover } from './element-hover.js';
import { keywordDoc } from './keyword-docs.js';

/** Lines of a declaration shown in a hover before it is cut short. */
const MAX_DECLARATION_LINES = 8;
/** Comment lines above a declaration shown with it. */
const MAX_COMMENT_LINES = 6;

/**
 * Hovers that need no flow analysis:
 *
 * - on a keyword, what it means (keyword-docs.ts);
 * - on a quantity, the value in the other unit system (imperial <-> SI) and
 *   what it measures;
 * - on a name, where it is declared (the declaration's line, the comment
 *   above it, and the file when it is another one);
 * - on a design-rule code, the rule's title and parameters with defaults.
 *
 * Computed values of an element (vacuum at an inlet, velocity in a pipe) come
 * from the engine's analysis: `getElementHoverContent` is where they go.
 */
export class VacnetHoverProvider extends AstNodeHoverProvider {
  private readonly engineServices: { engine?: { AnalysisCache?: AnalysisCache } };

  constructor(services: LangiumServices) {
    super(services);
    this.engineServices = services as LangiumServices & { engine?: { AnalysisCache?: AnalysisCache } };
  }

  override async getHoverContent(document: LangiumDocument, params: HoverParams): Promise<Hover | undefined> {
    const root = document.parseResult?.value?.$cstNode;
    if (!root) return undefined;
    const offset = document.textDocument.offsetAt(params.position);
    // The token under the cursor, or the one just before it (the cursor right after a word).
    const leaf = CstUtils.findLeafNodeAtOffset(root, offset) ?? (offset > 0 ? CstUtils.findLeafNodeAtOffset(root, offset - 1) : undefined);
    if (!leaf || leaf.hidden) return undefined;
    const markdown = await this.hoverFor(document, leaf);
    return markdown ? { contents: { kind: 'markdown', value: markdown }, range: leaf.range } : undefined;
  }

  private async hoverFor(document: LangiumDocument, leaf: CstNode): Promise<string | undefined> {
    const node = leaf.astNode;
    if (isQuantity(node)) return quantityHover(node, document);
    const targets = this.references.findDeclarations(leaf);
    if (targets.length > 0) {
      const parts: string[] = [];
      for (const target of targets) {
        const computed = await this.getElementHoverContent(target, document);
        if (computed) parts.push(computed);
        const declared = await this.getAstNodeHoverContent(target);
        if (declared) parts.push(declared);
      }
      return parts.length > 0 ? parts.join('\n\n') : undefined;
    }
    const ruleCode = ruleCodeAt(leaf);
    if (ruleCode) return ruleHover(ruleCode);
    if (GrammarAST.isKeyword(leaf.grammarSource)) return keywordHover(leaf.grammarSource.value, node, document);
    return undefined;
  }

  /**
   * The computed values of an element (its vacuum and flow, its velocity,
   * how they were computed) in markdown, shown above its declaration: from
   * the cached analysis of the hovered document's text version only; nothing
   * while it is being computed.
   */
  protected getElementHoverContent(node: AstNode, document: LangiumDocument): MaybePromise<string | undefined> {
    const cache = this.engineServices.engine?.AnalysisCache;
    const state = cache?.current(document);
    return state ? elementHover(node, state) : undefined;
  }

  /** Where a named element is declared: its noun and name, the comment above it, and its line(s). */
  protected override getAstNodeHoverContent(node: AstNode): MaybePromise<string | undefined> {
    const name = (node as { name?: unknown }).name;
    if (typeof name !== 'string') return undefined;
    const declaration = node.$type === 'PointDecl' && node.$container ? node.$container : node;
    const cst = declaration.$cstNode;
    if (!cst) return undefined;
    const document = AstUtils.getDocument(declaration);
    const noun = ELEMENT_NOUNS[node.$type] ?? node.$type;
    const line = cst.range.start.line + 1;
    let title = `**${noun}** \`${name}\``;
    if (node.$type === 'PointDecl') title += `, the far end of pipe \`${(declaration as { name?: string }).name ?? ''}\``;
    title += ` — ${UriUtils.basename(document.uri)} line ${line}`;
    const parts = [title];
    const comment = commentAbove(document.textDocument.getText(), cst.offset);
    if (comment) parts.push(comment);
    parts.push('```vacnet\n' + declarationText(document.textDocument.getText(), cst) + '\n```');
    return parts.join('\n\n');
  }
}

// -------------------------------------------------------------- keywords

function keywordHover(keyword: string, node: AstNode, _document: LangiumDocument): string | undefined {
  const doc = keywordDoc(keyword, placeOf(keyword, node));
  if (!doc) return undefined;
  const parts = [`**${keyword}**`, doc];
  const velocity = debrisVelocity(keyword, node);
  if (velocity) parts.push(velocity);
  return parts.join('\n\n');
}

/** The element type a keyword's meaning depends on (`at` on an inlet means a point or a distance). */
function placeOf(keyword: string, node: AstNode): string {
  if (keyword === 'at' && (node.$type === 'Inlet' || node.$type === 'Cleanout')) {
    return (node as { pipe?: unknown }).pipe ? 'InletOnPipe' : 'InletAtPoint';
  }
  return node.$type;
}

/** For a debris class: the carrying velocity the velocity rule expects by default, from the engine's rule table. */
function debrisVelocity(keyword: string, node: AstNode): string | undefined {
  if (node.$type !== 'Debris') return undefined;
  const rule = findRule('slow-carrying-velocity');
  const parameter = rule?.parameters.find((p) => p.name === 'minVelocity');
  const si = parameter?.defaultByDebris?.[keyword as keyof NonNullable<RuleParameter['defaultByDebris']>];
  if (si === undefined || !parameter) return undefined;
  return `Lowest carrying velocity with one operator in a horizontal run, by default: ${bothSystems(si, 'velocity')} (${parameter.source}).`;
}

// ------------------------------------------------------------- quantities

/** Units read as imperial; a quantity in any other unit is shown in imperial, one in these in SI. */
const IMPERIAL_WORDS = /(^|[^A-Za-z])(in|inHg|inH2O|inWC|ft|ft2|ft3|sqft|psi|scfm|acfm|cfm|fpm|degF|hp|lb|yd|mi|gal)(?=$|[^A-Za-z])/;
/** Dimensions written the same in both systems: no conversion is shown. */
const SHARED_DIMENSIONS = new Set<string>(['angle', 'fraction', 'time']);

function quantityHover(quantity: Quantity, document: LangiumDocument): string | undefined {
  const expectation = expectationFor(quantity);
  const written = quantityText(quantity, document);
  if (!expectation) return `**${written}**`;
  const reading = readQuantity(quantity, expectation);
  const what = capitalise(expectation.what);
  if (!reading.ok) return `**${written}**\n\n${what}. ${reading.message}`;
  if (expectation.dimension === 'dimensionless') return `**${written}**\n\n${what}: a plain number.`;
  if (reading.inDiameters) return `**${written}**\n\n${what} of ${written.replace(/\s*D$/, '')} pipe diameters.`;
  const dimension = (expectation.dimension === 'radius' ? 'length' : expectation.dimension) as Dimension;
  if (SHARED_DIMENSIONS.has(dimension)) return `**${written}**\n\n${what}.`;
  const unit = quantity.unit ?? '';
  const other: UnitSystem = IMPERIAL_WORDS.test(unit) ? 'si' : 'imperial';
  const options = reading.flowBasis ? { flowBasis: reading.flowBasis } : {};
  const converted = formatQuantity(reading.si, dimension, other, 3, options);
  const basis = reading.flowBasis === 'standard' ? ' (standard air)' : '';
  return `**${written}** = ${converted}${basis}\n\n${what}.`;
}

function bothSystems(si: number, dimension: Dimension): string {
  return `${formatQuantity(si, dimension, 'imperial')} (${formatQuantity(si, dimension, 'si')})`;
}

function quantityText(quantity: Quantity, document: LangiumDocument): string {
  const cst = quantity.$cstNode;
  const text = cst ? document.textDocument.getText().slice(cst.offset, cst.end) : `${quantity.value} ${quantity.unit ?? ''}`;
  return text.replace(/\s+/g, ' ').trim();
}

// ------------------------------------------------------------------ rules

/** The rule code a leaf stands for (`rule CODE`, `threshold CODE`, `accept CODE`), if any. */
function ruleCodeAt(leaf: CstNode): string | undefined {
  const node = leaf.astNode as AstNode & { rule?: unknown };
  if (!['RuleLine', 'Threshold', 'Accept'].includes(node.$type) || typeof node.rule !== 'string') return undefined;
  const assignment = AstUtils.getContainerOfType(leaf.grammarSource, GrammarAST.isAssignment);
  return assignment?.feature === 'rule' ? node.rule : undefined;
}

function ruleHover(code: string): string | undefined {
  const rule: RuleInfo | undefined = findRule(code) ?? RULES.find((r) => r.code === code);
  if (!rule) return `**${code}**\n\nNo design rule has this code.`;
  const lines = [`**${rule.code}**: ${rule.title}`, `Reported as ${rule.defaultSeverity} unless set otherwise.`];
  for (const parameter of rule.parameters) {
    lines.push(`- \`${writtenParameterName(parameter.name)}\`: ${parameter.description} Default ${parameterDefault(parameter)} (${parameter.source}).`);
  }
  return lines.join('\n\n');
}

function parameterDefault(parameter: RuleParameter): string {
  if (parameter.defaultByDebris) return 'by debris class';
  switch (parameter.dimension) {
    case 'velocity':
    case 'pressure':
    case 'length':
      return bothSystems(parameter.default, parameter.dimension);
    case 'angle':
      return formatQuantity(parameter.default, 'angle', 'si');
    case 'fraction':
      return formatQuantity(parameter.default, 'fraction', 'si');
    default:
      return `${parameter.default}`;
  }
}

// ----------------------------------------------------------- declarations

/** The declaration's lines as written, cut after a few lines. */
function declarationText(text: string, cst: CstNode): string {
  const lineStart = text.lastIndexOf('\n', cst.offset - 1) + 1;
  const lines = text.slice(lineStart, cst.end).split(/\r?\n/);
  const shown = lines.slice(0, MAX_DECLARATION_LINES);
  const indent = Math.min(...shown.filter((l) => l.trim().length > 0).map((l) => /^[ \t]*/.exec(l)![0].length));
  const body = shown.map((l) => l.slice(Number.isFinite(indent) ? indent : 0)).join('\n');
  return lines.length > shown.length ? `${body}\n...` : body;
}

/** The `//` lines directly above an offset's line (no blank line between), without their slashes. */
function commentAbove(text: string, offset: number): string | undefined {
  const lines = text.slice(0, text.lastIndexOf('\n', offset - 1) + 1).split(/\r?\n/);
  lines.pop(); // the empty piece after the last newline
  const comment: string[] = [];
  while (lines.length > 0 && comment.length < MAX_COMMENT_LINES) {
    const line = lines.pop()!.trim();
    if (!line.startsWith('//')) break;
    comment.unshift(line.replace(/^\/\/\s?/, ''));
  }
  return comment.length > 0 ? comment.join(' ') : undefined;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
