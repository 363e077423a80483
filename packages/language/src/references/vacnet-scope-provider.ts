import {
  AstUtils,
  DefaultScopeProvider,
  EMPTY_SCOPE,
  MapScope,
  WorkspaceCache,
  type AstNode,
  type LangiumCoreServices,
  type LangiumDocuments,
  type ReferenceInfo,
  type Scope,
  type URI,
} from 'langium';
import { isSystem, type Document } from '../generated/ast.js';
import { usedUris } from './use-paths.js';

/**
 * Scopes for references in a .vacnet file:
 * - names declared in the system, then the file's own definitions, then
 *   the definitions of the files it names with `use` (and those they use);
 * - not every file that happens to be open in the workspace.
 *
 * Each scope is a hash map built once per container and reference type
 * and kept until the workspace changes, so linking a system of thousands of
 * elements costs one lookup per reference instead of a scan of all names.
 */
export class VacnetScopeProvider extends DefaultScopeProvider {
  private readonly documents: LangiumDocuments;
  private readonly scopes: WorkspaceCache<string, Scope>;

  constructor(services: LangiumCoreServices) {
    super(services);
    this.documents = services.shared.workspace.LangiumDocuments;
    this.scopes = new WorkspaceCache(services.shared);
  }

  override getScope(context: ReferenceInfo): Scope {
    const referenceType = this.reflection.getReferenceType(context);
    const document = AstUtils.getDocument(context.container);
    const uri = document.uri.toString();
    const global = this.scopes.get(`${uri}|use|${referenceType}`, () => this.usedScope(referenceType, document.uri));
    const root = document.parseResult.value;
    const fileScope = this.scopes.get(`${uri}|file|${referenceType}`, () => this.localScope(root, referenceType, global));
    const system = AstUtils.getContainerOfType(context.container, isSystem);
    if (!system) return fileScope;
    const index = (root as Document).systems.indexOf(system);
    return this.scopes.get(`${uri}|system ${index}|${referenceType}`, () => this.localScope(system, referenceType, fileScope));
  }

  /** The names a container declares (see VacnetScopeComputation), of one reference type, over an outer scope. */
  private localScope(container: AstNode, referenceType: string, outer: Scope): Scope {
    const symbols = AstUtils.getDocument(container).localSymbols;
    if (!symbols?.has(container)) return outer;
    const matching = symbols.getStream(container).filter((d) => this.reflection.isSubtype(d.type, referenceType));
    return new MapScope(matching, outer);
  }

  /** Definitions reachable through `use`. */
  private usedScope(referenceType: string, uri: URI): Scope {
    const reachable = this.reachableUris(uri);
    if (reachable.size === 0) return EMPTY_SCOPE;
    return new MapScope(this.indexManager.allElements(referenceType, reachable));
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
