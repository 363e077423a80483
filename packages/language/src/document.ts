import { promises as fs } from 'node:fs';
import * as path from 'node:path';
import { URI, type LangiumDocument } from 'langium';
import { NodeFileSystem } from 'langium/node';
import type { SuppressedFinding, SystemAnalysis, SystemModel } from '@vacnet/engine';
import type { Document } from './generated/ast.js';
import { createVacnetServices, type VacnetServices } from './vacnet-module.js';
import { lowerSystem, type LoweredSystem } from './lowering/lower-system.js';
import { analyseLowered } from './engine-bridge/analyse-lowered.js';
import { usedUris } from './references/use-paths.js';
import type { VacnetDiagnostic } from './diagnostic.js';
import { toVacnetDiagnostic } from './diagnostic-conversion.js';

export { toVacnetDiagnostic };

/** One file as the loader saw it. */
export interface LoadedFile {
  /** Absolute path. */
  path: string;
  uri: string;
  diagnostics: VacnetDiagnostic[];
  /** The system's engine model, when the file holds a system. */
  model?: SystemModel;
  /** The model together with where each element came from; complete when every value could be read. */
  lowered?: LoweredSystem;
  /** The file was named by the caller (not only reached through `use`). */
  requested: boolean;
  /** The airflow analysis, when asked for and the file is free of structural errors. */
  analysis?: SystemAnalysis;
  /** Findings the file accepts, with their written reasons. */
  accepted?: SuppressedFinding[];
}

export interface LoadOptions {
  /** Run the airflow analysis and the design rules on each system (default: structure only). */
  analyse?: boolean;
}

export interface LoadResult {
  /** The files asked for, in order, then the catalogs they use. */
  files: LoadedFile[];
}

let sharedServices: ReturnType<typeof createVacnetServices> | undefined;

/** One set of language services per process: creating them costs more than checking a small file. */
function services(): ReturnType<typeof createVacnetServices> {
  sharedServices ??= createVacnetServices(NodeFileSystem);
  return sharedServices;
}

/**
 * Loads .vacnet files headlessly: parse, link (following `use`), validate,
 * and lower each system to the engine model. The command line and the tests
 * call this; the language server runs the same services, so both report the
 * same findings. Never throws for bad input: an unreadable file becomes a
 * diagnostic of its own.
 */
export async function loadDocuments(paths: string[], options: LoadOptions = {}): Promise<LoadResult> {
  const { shared } = services();
  const documents = shared.workspace.LangiumDocuments;
  const builder = shared.workspace.DocumentBuilder;

  // Start each call from a clean workspace so results never depend on earlier calls.
  for (const uri of [...documents.all.map((d) => d.uri)]) documents.deleteDocument(uri);

  const files: LoadedFile[] = [];
  const loaded = new Map<string, LangiumDocument>();
  const queue: { absolute: string; requested: boolean }[] = paths.map((p) => ({ absolute: path.resolve(p), requested: true }));
  const unreadable = new Map<string, string>();
  while (queue.length > 0) {
    const { absolute, requested } = queue.shift()!;
    const uri = URI.file(absolute);
    if (loaded.has(uri.toString()) || unreadable.has(absolute)) continue;
    let text: string;
    try {
      text = await fs.readFile(absolute, 'utf-8');
    } catch (error) {
      if (requested) unreadable.set(absolute, describeIoError(error));
      continue;
    }
    const document = documents.createDocument(uri, text);
    loaded.set(uri.toString(), document);
    for (const used of usedUris(document.parseResult.value as Document, uri)) {
      queue.push({ absolute: used.fsPath, requested: false });
    }
  }

  await builder.build([...loaded.values()], { validation: true });

  const requestedPaths = new Set(paths.map((p) => path.resolve(p)));
  const ordered = [...requestedPaths, ...[...loaded.values()].map((d) => d.uri.fsPath).filter((p) => !requestedPaths.has(p))];
  for (const absolute of ordered) {
    const reason = unreadable.get(absolute);
    if (reason !== undefined) {
      files.push({
        path: absolute,
        uri: URI.file(absolute).toString(),
        requested: true,
        diagnostics: [
          {
            severity: 'error',
            code: 'file-unreadable',
            message: `Cannot read this file: ${reason}.`,
            range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } },
            source: 'structure',
          },
        ],
      });
      continue;
    }
    const document = loaded.get(URI.file(absolute).toString());
    if (!document) continue;
    files.push(describeDocument(document, requestedPaths.has(absolute), options.analyse === true));
  }
  return { files };
}

function describeDocument(document: LangiumDocument, requested: boolean, analyse: boolean): LoadedFile {
  const diagnostics = (document.diagnostics ?? []).map(toVacnetDiagnostic);
  const root = document.parseResult.value as Document;
  const system = root.systems?.[0];
  const file: LoadedFile = { path: document.uri.fsPath, uri: document.uri.toString(), diagnostics, requested };
  if (system) {
    const lowered = lowerSystem(system);
    file.lowered = lowered;
    file.model = lowered.model;
    if (analyse) {
      const engine = analyseLowered(lowered, diagnostics, file.path);
      file.diagnostics = [...diagnostics, ...engine.diagnostics];
      if (engine.analysis) file.analysis = engine.analysis;
      file.accepted = engine.suppressed;
    }
  }
  return file;
}

function describeIoError(error: unknown): string {
  const code = (error as { code?: string }).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EISDIR') return 'it is a folder';
  if (code === 'EACCES') return 'permission denied';
  return error instanceof Error ? error.message : String(error);
}

export type { VacnetServices };
