import { CstUtils, type AstNode, type LangiumDocument } from 'langium';
import { DefaultFoldingRangeProvider, type FoldingRangeAcceptor } from 'langium/lsp';
import { FoldingRange, FoldingRangeKind } from 'vscode-languageserver';

/** Elements written with a `{ }` block: the ones worth folding. */
const BLOCKS = new Set(['System', 'Plant', 'ProducerModel', 'Curve']);

/**
 * Folding: each `{ }` block (a system, a plant, a producer, a curve) folds to
 * its first line; a block comment, or a run of two or more `//` lines with
 * nothing else on them, folds as a comment. One-line elements never fold,
 * even when continued on a second line.
 */
export class VacnetFoldingRangeProvider extends DefaultFoldingRangeProvider {
  protected override shouldProcess(node: AstNode): boolean {
    return BLOCKS.has(node.$type);
  }

  protected override collectCommentFolding(document: LangiumDocument, node: AstNode, acceptor: FoldingRangeAcceptor): void {
    super.collectCommentFolding(document, node, acceptor);
    const cst = node.$cstNode;
    if (!cst) return;
    const text = document.textDocument.getText();
    let runStart: number | undefined;
    let runEnd = -1;
    const flush = () => {
      if (runStart !== undefined && runEnd > runStart) {
        acceptor(FoldingRange.create(runStart, runEnd, undefined, undefined, FoldingRangeKind.Comment));
      }
      runStart = undefined;
    };
    for (const leaf of CstUtils.flattenCst(cst)) {
      const ownLine = leaf.hidden && leaf.tokenType.name === 'SL_COMMENT' && startsLine(text, leaf.offset);
      if (!ownLine) {
        flush();
        continue;
      }
      const line = leaf.range.start.line;
      if (runStart !== undefined && line === runEnd + 1) {
        runEnd = line;
      } else {
        flush();
        runStart = line;
        runEnd = line;
      }
    }
    flush();
  }
}

/** True when only spaces or tabs stand between the start of the line and `offset`. */
function startsLine(text: string, offset: number): boolean {
  for (let i = offset - 1; i >= 0; i--) {
    const ch = text[i];
    if (ch === '\n') return true;
    if (ch !== ' ' && ch !== '\t' && ch !== '\r') return false;
  }
  return true;
}
