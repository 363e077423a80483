// Language services with the live analysis on (as in the language server,
// but the engine runs on this thread), and helpers to open, edit and read
// documents in them.
import { EmptyFileSystem, TextDocument, URI, type LangiumDocument } from 'langium';
import type { Connection, TextEdit } from 'vscode-languageserver';
import { createVacnetServices, type VacnetServiceOptions } from '../../src/vacnet-module.js';
import type { DocumentAnalysis } from '../../src/engine-bridge/analysis-cache.js';
import type { Document } from '../../src/generated/ast.js';

export type Live = ReturnType<typeof createLive>;

export function createLive(options: VacnetServiceOptions = {}, connection?: Connection) {
  const services = createVacnetServices({ ...EmptyFileSystem, ...(connection ? { connection } : {}) }, { liveAnalysis: true, ...options });
  const { shared, Vacnet } = services;
  const documents = shared.workspace.LangiumDocuments;
  const builder = shared.workspace.DocumentBuilder;
  const cache = Vacnet.engine.AnalysisCache;

  const texts = shared.workspace.TextDocuments!;
  let version = 0;

  /** Opens or changes documents (uri -> text) as an editor does, builds them and waits for their analyses. */
  async function put(files: Record<string, string>): Promise<LangiumDocument<Document>[]> {
    const changed: URI[] = [];
    for (const [uri, text] of Object.entries(files)) {
      texts.set(TextDocument.create(uri, 'vacnet', ++version, text));
      changed.push(URI.parse(uri));
    }
    await builder.update(changed, []);
    const out: LangiumDocument<Document>[] = [];
    for (const uri of changed) {
      await cache.whenSettled(uri.toString());
      out.push(documents.getDocument(uri) as LangiumDocument<Document>);
    }
    return out;
  }

  /** The settled analysis of a document. */
  async function analysed(uri: string): Promise<DocumentAnalysis> {
    const state = await cache.whenSettled(uri);
    if (!state) throw new Error(`no analysis for ${uri}`);
    return state;
  }

  return { ...services, documents, builder, cache, put, analysed };
}

/** Applies LSP text edits to a text (as an editor would). */
export function applyEdits(text: string, edits: TextEdit[]): string {
  return TextDocument.applyEdits(TextDocument.create('file:///edit.vacnet', 'vacnet', 0, text), edits);
}

/** A small catalog the engine-backed tests share. */
export const CATALOG = `spec steel-10 material steel schedule 10 roughness 45 um conductive
hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm
tool carpet working orifice 7/8 in lifted orifice 1-1/4 in needs 5 inHg
producer exh-7 { curve { at 0 scfm 15 inHg  at 100 scfm 13 inHg  at 200 scfm 9 inHg } efficiency 55 % }
separator cyc loss 2 inH2O at 300 scfm
`;

/** One operator, one inlet at the end of a 4 in main: far too slow to carry with one operator. */
export const SLOW_SYSTEM = `${CATALOG}
system "Slow main" {
  operators 1
  plant pr { producer exh-7  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 4 in length 60 ft horizontal
  inlet A1 on main-1 at 50 ft hose std-50 tool carpet
  cleanout at j-1
}
`;
