import { GrammarUtils, UriUtils, type LangiumDocument } from 'langium';
import type { DocumentLinkProvider } from 'langium/lsp';
import type { DocumentLink } from 'vscode-languageserver';
import type { Document } from '../generated/ast.js';

/**
 * Each `use "path"` line links its path (the text between the quotes) to the
 * file it names, resolved relative to the file that says it, the way the
 * scope provider resolves it. A path that names no file still links: the
 * `use-not-found` diagnostic says what is wrong.
 */
export class VacnetDocumentLinkProvider implements DocumentLinkProvider {
  getDocumentLinks(document: LangiumDocument): DocumentLink[] {
    const root = document.parseResult.value as Document;
    const base = UriUtils.dirname(document.uri);
    const links: DocumentLink[] = [];
    for (const use of root.uses ?? []) {
      const node = use.$cstNode ? GrammarUtils.findNodeForProperty(use.$cstNode, 'path') : undefined;
      const path = use.path;
      if (!node || typeof path !== 'string' || path.length === 0) continue;
      const quoted = node.text.length >= 2 && node.text.startsWith('"') && node.text.endsWith('"');
      const start = document.textDocument.positionAt(node.offset + (quoted ? 1 : 0));
      const end = document.textDocument.positionAt(node.end - (quoted ? 1 : 0));
      const target = UriUtils.resolvePath(base, path);
      links.push({ range: { start, end }, target: target.toString(), tooltip: `Open ${path}` });
    }
    return links;
  }
}
