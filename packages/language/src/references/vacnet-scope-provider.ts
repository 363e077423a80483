import { AstUtils, DefaultScopeProvider, MapScope, WorkspaceCache, type LangiumCoreServices, type LangiumDocuments, type ReferenceInfo, type Scope, type URI } from 'langium';
import type { Document } from '../generated/ast.js';
import { usedUris } from './use-paths.js';

/**
 * Names from other files are visible only through `use`: a system sees the
 * catalogs it names (and the catalogs those name), not every file that
 * happens to be open in the workspace. The cache is cleared on any change.
 */
export class VacnetScopeProvider extends DefaultScopeProvider {
  private readonly documents: LangiumDocuments;
  private readonly reachableCache: WorkspaceCache<string, Set<string>>;

  constructor(services: LangiumCoreServices) {
    super(services);
    this.documents = services.shared.workspace.LangiumDocuments;
    this.reachableCache = new WorkspaceCache(services.shared);
  }

  protected override getGlobalScope(referenceType: string, context: ReferenceInfo): Scope {
    const document = AstUtils.getDocument(context.container);
    const reachable = this.reachableCache.get(document.uri.toString(), () => this.reachableUris(document.uri));
    if (reachable.size === 0) {
      return new MapScope([]);
    }
    return this.createScope(this.indexManager.allElements(referenceType, reachable));
  }

  /** Uris reachable through `use`, transitively, excluding the document itself. */
  private reachableUris(start: URI): Set<string> {
    const seen = new Set<string>([start.toString()]);
    const queue: URI[] = [start];
    while (queue.length > 0) {
      const uri = queue.shift()!;
      const doc = this.documents.getDocument(uri);
      if (!doc) continue;
      for (const used of usedUris(doc.parseResult.value as Document, uri)) {
        const key = used.toString();
        if (!seen.has(key)) {
          seen.add(key);
          queue.push(used);
        }
      }
    }
    seen.delete(start.toString());
    return seen;
  }
}
