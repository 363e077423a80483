import { UriUtils, type AstNode, type LangiumDocument, type URI } from 'langium';
import type { LangiumServices } from 'langium/lsp';
import type { TextEdit } from 'vscode-languageserver';
import type { Document } from '../../generated/ast.js';
import { usedUris } from '../../references/use-paths.js';

/** A catalog definition somewhere in the workspace, and whether the system's file already sees it. */
export interface CatalogItem<T extends AstNode> {
  node: T;
  documentUri: URI;
  visible: boolean;
}

/** Every definition of a type in the workspace index (`HoseKind`, `ProducerModel`...), resolved to its node. */
export function catalogItems<T extends AstNode>(services: LangiumServices, type: string, from: LangiumDocument): CatalogItem<T>[] {
  const documents = services.shared.workspace.LangiumDocuments;
  const locator = services.workspace.AstNodeLocator;
  const visible = reachable(from, documents);
  const items: CatalogItem<T>[] = [];
  for (const description of services.shared.workspace.IndexManager.allElements(type)) {
    const document = documents.getDocument(description.documentUri);
    const node = description.node ?? (document ? locator.getAstNode(document.parseResult.value, description.path) : undefined);
    if (!node || node.$type !== type) continue;
    items.push({ node: node as T, documentUri: description.documentUri, visible: visible.has(description.documentUri.toString()) });
  }
  return items;
}

/** The file itself and every file it reaches through `use` (as the scope provider sees them). */
function reachable(from: LangiumDocument, documents: LangiumServices['shared']['workspace']['LangiumDocuments']): Set<string> {
  const seen = new Set<string>([from.uri.toString()]);
  const queue: URI[] = [from.uri];
  while (queue.length > 0) {
    const uri = queue.shift()!;
    const document = documents.getDocument(uri);
    if (!document) continue;
    for (const used of usedUris(document.parseResult.value as Document, uri)) {
      if (!seen.has(used.toString())) {
        seen.add(used.toString());
        queue.push(used);
      }
    }
  }
  return seen;
}

/** The `use` line that makes a catalog file visible from `from`, placed after the file's last `use` (or at the top). */
export function useEdit(from: LangiumDocument, catalog: URI): TextEdit {
  const root = from.parseResult.value as Document;
  const relative = UriUtils.relative(UriUtils.dirname(from.uri), catalog);
  const last = root.uses.at(-1)?.$cstNode;
  const line = last ? last.range.end.line + 1 : 0;
  return { range: { start: { line, character: 0 }, end: { line, character: 0 } }, newText: `use "${relative}"\n` };
}
