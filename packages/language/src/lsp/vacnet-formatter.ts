import { CstUtils, GrammarUtils, TextDocument, type AstNode, type CstNode, type LangiumDocument, type LeafCstNode } from 'langium';
import { AbstractFormatter } from 'langium/lsp';
import type { FormattingOptions, Range, TextEdit } from 'vscode-languageserver';
import type { LangiumServices } from 'langium/lsp';

/**
 * The one layout of a .vacnet file, the same in every editor and on the
 * command line:
 *
 * - every element (use line, catalog item, system member, plant unit, curve
 *   point) starts a line; blank lines between elements are kept, at most one;
 * - two spaces of indentation per `{ }` block; closing braces start a line;
 * - one space between the tokens of a line, nothing lined up in columns (so a
 *   change to one element never re-aligns its neighbours);
 * - a number and its unit one space apart, a unit itself tight (`m3/h`,
 *   `ft^3/min`), no space before `,` and one after it;
 * - a line break the author put inside an element is kept as a continuation
 *   line indented one step further (long `accept ... because "..."` lines);
 * - comments stay where they are: a trailing comment one space after its
 *   line, a comment on its own line indented like what follows it;
 * - the file ends with exactly one newline.
 *
 * Each gap between two tokens is decided exactly once, from the tokens on
 * either side, so the result is the same however the input was laid out
 * (formatting is idempotent). Langium's region API attaches formatting to
 * nodes; here a token gap can belong to several nodes at once (an element, its
 * property, a quantity), so the formatter collects facts per node in `format`
 * and then lays out the gaps itself. Only whitespace changes: the edits are
 * checked by lexing the result, and a mismatch returns no edits at all.
 */
export class VacnetFormatter extends AbstractFormatter {
  /** Indentation per block level: fixed, so every editor writes the same file. */
  static readonly INDENT = '  ';

  private readonly lexer: LangiumServices['parser']['Lexer'];
  private facts = new LayoutFacts();

  constructor(services: LangiumServices) {
    super();
    this.lexer = services.parser.Lexer;
  }

  /** Records what the layout needs to know about one AST node. */
  protected format(node: AstNode): void {
    const cst = node.$cstNode;
    if (!cst) return;
    if (isLineElement(node)) {
      const first = firstTokenOf(cst);
      if (first) this.facts.elementStarts.add(first.offset);
    }
    if (node.$type === 'Quantity') {
      const value = GrammarUtils.findNodeForProperty(cst, 'value');
      const unit = GrammarUtils.findNodeForProperty(cst, 'unit');
      if (value && unit) {
        this.facts.unitStarts.set(unit.offset, value.end);
        this.facts.unitSpans.push([unit.offset, unit.end]);
      }
    }
  }

  protected override doDocumentFormat(document: LangiumDocument, _options: FormattingOptions, range?: Range): TextEdit[] {
    const edits = this.layoutEdits(document);
    if (!range) return edits;
    // The whitespace before a token belongs to the token's line: keep the edits that end on a line of the range.
    return edits.filter((edit) => edit.range.end.line >= range.start.line && edit.range.end.line <= range.end.line);
  }

  /**
   * The edits that lay out a whole document (no edits when it has syntax
   * errors, or when the result would not lex to the same tokens).
   */
  layoutEdits(document: LangiumDocument): TextEdit[] {
    const parse = document.parseResult;
    if (parse.lexerErrors.length > 0 || parse.parserErrors.length > 0) return [];
    const root = parse.value.$cstNode;
    if (!root) return [];
    this.facts = new LayoutFacts();
    this.iterateAstFormatting(document);
    const text = document.textDocument.getText();
    const edits = layOut(text, [...CstUtils.flattenCst(root)], this.facts, eolOf(text));
    return this.sameTokens(text, edits) ? edits : [];
  }

  /** True when the edited text lexes to the same tokens and comments (up to indentation inside block comments). */
  private sameTokens(text: string, edits: TextEdit[]): boolean {
    const after = TextDocument.applyEdits(TextDocument.create('inmemory://check', 'vacnet', 0, text), edits);
    const shape = (source: string): string[] | undefined => {
      const lexed = this.lexer.tokenize(source);
      if (lexed.errors.length > 0) return undefined;
      return [...lexed.tokens, ...(lexed.hidden ?? [])]
        .sort((a, b) => a.startOffset - b.startOffset)
        .map((t) => `${t.tokenType.name}:${t.image.replace(/\r?\n[ \t]*/g, '\n')}`);
    };
    const before = shape(text);
    const later = shape(after);
    return before !== undefined && later !== undefined && before.length === later.length && before.every((t, i) => t === later[i]);
  }
}

/** What `format` learned about the document, read by the layout. */
class LayoutFacts {
  /** Offsets of the first token of each element that starts a line. */
  readonly elementStarts = new Set<number>();
  /** Offset where a unit starts -> end offset of its number. */
  readonly unitStarts = new Map<number, number>();
  /** [start, end) of each unit as written. */
  readonly unitSpans: [number, number][] = [];
}

/** Element kinds that always start a line. */
const LINE_ELEMENTS = new Set([
  'Use', 'System',
  'PipeSpec', 'HoseKind', 'ToolKind', 'ProducerModel', 'SeparatorModel', 'FilterModel',
  'Site', 'DisplayUnits', 'Operators', 'Area', 'CleaningWindow', 'Debris', 'Dust', 'Margin', 'TestOrifice', 'Defaults',
  'RuleLine', 'Plant', 'Pipe', 'Inlet', 'Cleanout', 'Scenario',
  'ProducerUnit', 'FilterUnit', 'SeparatorUnit',
  'CurvePoint',
]);

function isLineElement(node: AstNode): boolean {
  // Inside a producer's braces every property (its curve, its efficiency) is a line of its own.
  return LINE_ELEMENTS.has(node.$type) || node.$container?.$type === 'ProducerModel';
}

function firstTokenOf(cst: CstNode): LeafCstNode | undefined {
  for (const leaf of CstUtils.flattenCst(cst)) {
    if (!leaf.hidden) return leaf;
  }
  return undefined;
}

function eolOf(text: string): string {
  return text.includes('\r\n') ? '\r\n' : '\n';
}

const LINE_COMMENT = 'SL_COMMENT';

/** Blank lines kept between elements (and before comments): at most one. */
const MAX_NEWLINES = 2;

/**
 * Decides the whitespace before every token and returns the edits that put
 * it there. `leaves` are all CST leaves in order, comments included.
 */
function layOut(text: string, leaves: LeafCstNode[], facts: LayoutFacts, eol: string): TextEdit[] {
  const doc = TextDocument.create('inmemory://layout', 'vacnet', 0, text);
  const edits: TextEdit[] = [];
  const replace = (start: number, end: number, newText: string) => {
    if (text.slice(start, end) !== newText) {
      edits.push({ range: { start: doc.positionAt(start), end: doc.positionAt(end) }, newText });
    }
  };
  const indent = (level: number) => VacnetFormatter.INDENT.repeat(Math.max(0, level));
  const lineBreaks = (count: number) => eol.repeat(count);

  // Brace depth before each code token; a closing brace sits at the depth of its opening line.
  const depth = new Map<LeafCstNode, number>();
  let level = 0;
  for (const leaf of leaves) {
    if (leaf.hidden) continue;
    if (leaf.text === '}') level = Math.max(0, level - 1);
    depth.set(leaf, level);
    if (leaf.text === '{') level++;
  }
  const nextCode = (from: number): LeafCstNode | undefined => {
    for (let j = from; j < leaves.length; j++) if (!leaves[j]!.hidden) return leaves[j];
    return undefined;
  };
  const startsElement = (leaf: LeafCstNode) => facts.elementStarts.has(leaf.offset);
  const inOneUnit = (a: LeafCstNode, b: LeafCstNode) =>
    facts.unitSpans.some(([start, end]) => a.offset >= start && b.end <= end);
  /** Where a token that begins a line goes: its block level, one more when it continues an element. */
  const ownLineIndent = (leaf: LeafCstNode | undefined): number => {
    if (!leaf) return 0;
    const d = depth.get(leaf) ?? 0;
    if (leaf.text === '}') return d + 1;
    return startsElement(leaf) ? d : d + 1;
  };

  for (let i = 0; i < leaves.length; i++) {
    const cur = leaves[i]!;
    const prev = i > 0 ? leaves[i - 1] : undefined;
    const gapStart = prev ? prev.end : 0;
    const gap = text.slice(gapStart, cur.offset);
    const newlines = countNewlines(gap);
    if (!prev) {
      replace(0, cur.offset, '');
      continue;
    }
    const afterLineComment = prev.hidden && prev.tokenType.name === LINE_COMMENT;

    if (cur.hidden) {
      if (newlines === 0) {
        replace(gapStart, cur.offset, ' ');
        continue;
      }
      const breaks = Math.min(newlines, prev.text === '{' && !prev.hidden ? 1 : MAX_NEWLINES);
      const column = ownLineIndent(nextCode(i + 1));
      const newIndent = indent(column);
      replace(gapStart, cur.offset, lineBreaks(breaks) + newIndent);
      reindentBlockComment(cur, currentColumn(text, cur.offset), newIndent.length, eol, replace);
      continue;
    }

    const d = depth.get(cur) ?? 0;
    let whitespace: string;
    if (cur.text === '}') {
      whitespace = lineBreaks(1) + indent(d);
    } else if (prev.text === '{' && !prev.hidden) {
      whitespace = lineBreaks(1) + indent(d);
    } else if (startsElement(cur)) {
      whitespace = lineBreaks(Math.min(Math.max(newlines, 1), MAX_NEWLINES)) + indent(d);
    } else if (afterLineComment || (newlines > 0 && !tightOrJoined(prev, cur, facts, inOneUnit))) {
      // A break the author made inside an element stays, as a continuation line.
      whitespace = lineBreaks(1) + indent(d + 1);
    } else if (!prev.hidden && (inOneUnit(prev, cur) || cur.text === ',')) {
      whitespace = '';
    } else {
      whitespace = ' ';
    }
    replace(gapStart, cur.offset, whitespace);
  }

  const last = leaves.at(-1);
  if (last) replace(last.end, text.length, eol);
  else replace(0, text.length, '');
  return edits;
}

/** Gaps that never hold a line break: inside a unit, between a number and its unit, before a comma or an opening brace. */
function tightOrJoined(
  prev: LeafCstNode,
  cur: LeafCstNode,
  facts: LayoutFacts,
  inOneUnit: (a: LeafCstNode, b: LeafCstNode) => boolean,
): boolean {
  if (prev.hidden) return false;
  return inOneUnit(prev, cur) || facts.unitStarts.get(cur.offset) === prev.end || cur.text === ',' || cur.text === '{';
}

function countNewlines(gap: string): number {
  let count = 0;
  for (const ch of gap) if (ch === '\n') count++;
  return count;
}

function currentColumn(text: string, offset: number): number {
  const lineStart = text.lastIndexOf('\n', offset - 1) + 1;
  return offset - lineStart;
}

/**
 * Moves the later lines of a block comment with its first line, so a
 * comment written as a box keeps its shape. Only leading whitespace changes.
 */
function reindentBlockComment(
  comment: LeafCstNode,
  oldColumn: number,
  newColumn: number,
  eol: string,
  replace: (start: number, end: number, newText: string) => void,
): void {
  const shift = newColumn - oldColumn;
  if (shift === 0 || !comment.text.includes('\n')) return;
  const lines = comment.text.split(/\r?\n/);
  const moved = lines.map((line, k) => {
    if (k === 0) return line;
    if (shift > 0) return line.length > 0 ? ' '.repeat(shift) + line : line;
    const leading = /^[ \t]*/.exec(line)![0].length;
    return line.slice(Math.min(leading, -shift));
  });
  replace(comment.offset, comment.end, moved.join(eol));
}
