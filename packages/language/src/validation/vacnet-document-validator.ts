import { CstUtils, DefaultDocumentValidator, type AstNode, type LangiumDocument, type ParseResult, type ValidationOptions } from 'langium';
import type { CancellationToken, Diagnostic } from 'vscode-languageserver';
import { isDocument, isSystem } from '../generated/ast.js';
import { END_OF_FILE_EXPECTED } from '../parser/syntax-error-messages.js';
import { StructureCodes } from './codes.js';

/**
 * A file of random bytes can yield a syntax error per character. Past this
 * many, more of them tell the user nothing (our choice).
 */
const MAX_SYNTAX_ERRORS = 100;

/** Checks that judge the network as a whole: any misread line can make them wrong, wherever they report. */
const WHOLE_NETWORK_CHECKS: ReadonlySet<unknown> = new Set<string>([
  StructureCodes.noProducer,
  StructureCodes.noPath,
  StructureCodes.danglingPipe,
  StructureCodes.loop,
  StructureCodes.oneSystemPerFile,
]);

/**
 * Gives the parser's and the linker's findings stable codes of our own (so
 * the editor, the command line and the docs name them alike) and keeps a
 * garbage file from flooding the problem list.
 *
 * After a syntax error the parser recovers by skipping ahead, often out of
 * the system block, and reads the lines that follow as something else: a
 * pipe's `spec` becomes a catalog item, every later line "cannot start an
 * item here", and the pipe cut short "needs a length". So the first syntax
 * error is kept with every later one that is not such an echo, and the other
 * checks report only on the items before the one where reading failed (and
 * those that judge the whole network, not at all).
 */
export class VacnetDocumentValidator extends DefaultDocumentValidator {
  override async validateDocument(document: LangiumDocument, options?: ValidationOptions, cancelToken?: CancellationToken): Promise<Diagnostic[]> {
    const diagnostics = await super.validateDocument(document, options, cancelToken);
    const trustedBefore = firstUnreadableItemLine(document);
    let syntaxErrors = 0;
    const kept: Diagnostic[] = [];
    for (const diagnostic of diagnostics) {
      const origin = (diagnostic.data as { code?: string } | undefined)?.code;
      if (diagnostic.code === undefined) {
        if (origin === 'linking-error') diagnostic.code = StructureCodes.unresolvedReference;
        else if (origin === 'lexing-error' || origin === 'parsing-error') diagnostic.code = StructureCodes.syntaxError;
      }
      if (diagnostic.code === StructureCodes.syntaxError) {
        if (++syntaxErrors > MAX_SYNTAX_ERRORS) continue;
      } else if (diagnostic.range.start.line >= trustedBefore || (trustedBefore < Infinity && WHOLE_NETWORK_CHECKS.has(diagnostic.code))) {
        continue;
      }
      kept.push(diagnostic);
    }
    if (syntaxErrors > MAX_SYNTAX_ERRORS) {
      kept.push({
        severity: 3,
        code: StructureCodes.syntaxError,
        message: `${syntaxErrors - MAX_SYNTAX_ERRORS} more syntax errors are not shown; fix the first ones and check again.`,
        range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } },
        source: this.getSource(),
      });
    }
    return kept;
  }

  protected override processParsingErrors(parseResult: ParseResult, diagnostics: Diagnostic[], options: ValidationOptions): void {
    // The tokens after an unreadable character on its line are read out of step: their errors are echoes of the lexer's.
    const lexerLines = new Set(parseResult.lexerErrors.map((e) => e.line));
    const echoes = (error: (typeof parseResult.parserErrors)[number], index: number) =>
      (index > 0 && (error.name === 'NotAllInputParsedException' || error.message.startsWith(END_OF_FILE_EXPECTED))) ||
      (error.token.startLine !== undefined && lexerLines.has(error.token.startLine));
    const parserErrors = parseResult.parserErrors.filter((error, index) => !echoes(error, index));
    super.processParsingErrors({ ...parseResult, parserErrors }, diagnostics, options);
  }

  protected override getSource(): string {
    return 'vacnet';
  }
}

/**
 * The first line of the item (a catalog item, a system's element, a system's
 * own line) in which reading first failed; Infinity when the file reads
 * cleanly. Checks other than the syntax report only above it.
 */
function firstUnreadableItemLine(document: LangiumDocument): number {
  const { lexerErrors, parserErrors } = document.parseResult;
  if (lexerErrors.length === 0 && parserErrors.length === 0) return Infinity;
  // A token the parser made up in recovery has no offset: the error then sits after the token before it.
  const parserOffset = (e: (typeof parserErrors)[number]) =>
    Number.isFinite(e.token.startOffset) && e.token.startOffset >= 0 ? e.token.startOffset : ((e as { previousToken?: { endOffset?: number } }).previousToken?.endOffset ?? NaN);
  const offsets = [...lexerErrors.map((e) => e.offset), ...parserErrors.map(parserOffset)].filter((o) => Number.isFinite(o) && o >= 0);
  if (offsets.length === 0) return 0;
  const offset = Math.min(...offsets);
  const root = document.parseResult.value.$cstNode;
  const leaf = root ? (CstUtils.findLeafNodeAtOffset(root, offset) ?? CstUtils.findLeafNodeBeforeOffset(root, offset)) : undefined;
  let node: AstNode | undefined = leaf?.astNode;
  // Up to the item: the node whose container is the file or a system.
  while (node?.$container && !isDocument(node.$container) && !isSystem(node.$container)) node = node.$container;
  const line = node?.$cstNode?.range.start.line ?? document.textDocument.positionAt(offset).line;
  return Math.min(line, document.textDocument.positionAt(offset).line);
}
