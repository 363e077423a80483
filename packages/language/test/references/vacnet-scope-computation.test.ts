// The direct walk of collectLocalSymbols gives what the per-node rule gives
// when every node is visited in document order (Langium's own walk), on
// every example file, valid and invalid: the same scopes, the same names in
// the same order.
import { readFileSync } from 'node:fs';
import * as path from 'node:path';
import { AstUtils, EmptyFileSystem, MultiMap, URI, type AstNode, type AstNodeDescription, type LangiumDocument } from 'langium';
import { describe, expect, it } from 'vitest';
import { createVacnetServices } from '../../src/vacnet-module.js';
import type { VacnetScopeComputation } from '../../src/references/vacnet-scope-computation.js';
import { EXAMPLES_DIR as examples, vacnetFiles } from '../example-files.js';


const { Vacnet } = createVacnetServices(EmptyFileSystem);
const computation = Vacnet.references.ScopeComputation as VacnetScopeComputation;

/** Langium's walk: every node in document order through the per-node rule. */
function byEveryNode(document: LangiumDocument): MultiMap<AstNode, AstNodeDescription> {
  const symbols = new MultiMap<AstNode, AstNodeDescription>();
  const addLocalSymbol = (computation as unknown as { addLocalSymbol(n: AstNode, d: LangiumDocument, s: MultiMap<AstNode, AstNodeDescription>): void }).addLocalSymbol.bind(computation);
  for (const node of AstUtils.streamAllContents(document.parseResult.value)) addLocalSymbol(node, document, symbols);
  return symbols;
}

const shape = (symbols: MultiMap<AstNode, AstNodeDescription>) =>
  [...symbols.keys()].map((scope) => ({ scope: scope.$type, offset: scope.$cstNode?.offset, names: symbols.get(scope).map((d) => `${d.type}:${d.name}`) }));

describe('VacnetScopeComputation.collectLocalSymbols', () => {
  const all = vacnetFiles();
  it('has examples to compare on', () => expect(all.length).toBeGreaterThan(20));
  it.each(all.map((f) => [path.relative(examples, f), f]))('%s: the same scopes and names as a visit of every node', async (_name, file) => {
    const document = Vacnet.shared.workspace.LangiumDocumentFactory.fromString(readFileSync(file, 'utf8'), URI.file(file));
    const expected = shape(byEveryNode(document));
    expect(expected.flatMap((s) => s.names).length).toBeGreaterThan(0);
    expect(shape(await computation.collectLocalSymbols(document))).toEqual(expected);
  });
});
