// Document links (LSP 3.17 textDocument/documentLink): the path of each
// `use` line, resolved as RFC 3986 section 5.2 resolves a relative
// reference against the file's own URI.
import { parseHelper } from 'langium/test';
import { describe, expect, it } from 'vitest';
import { Vacnet } from '../helpers.js';

const parse = parseHelper(Vacnet);

describe('document links', () => {
  it('links the path of each use line, without its quotes, to the file it names', async () => {
    const text = `use "catalog/equipment.vacnet"\nuse "../shared/hoses.vacnet"\nsystem "L" { }\n`;
    const document = await parse(text, { documentUri: 'file:///work/site/system.vacnet' });
    const links = await Vacnet.lsp.DocumentLinkProvider!.getDocumentLinks(document, { textDocument: { uri: document.uri.toString() } });
    expect(links.map((l) => l.target)).toEqual(['file:///work/site/catalog/equipment.vacnet', 'file:///work/shared/hoses.vacnet']);
    expect(links.map((l) => document.textDocument.getText(l.range))).toEqual(['catalog/equipment.vacnet', '../shared/hoses.vacnet']);
    expect(links[0]!.range.start).toEqual({ line: 0, character: 5 });
  });

  it('gives no link for a file without use lines', async () => {
    const document = await parse('system "L" { }', { documentUri: 'file:///work/site/empty.vacnet' });
    expect(await Vacnet.lsp.DocumentLinkProvider!.getDocumentLinks(document, { textDocument: { uri: document.uri.toString() } })).toEqual([]);
  });
});
