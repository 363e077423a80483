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
import { applyProjectSettings, emptyProjectSettings, parseProjectSettings, statesDisplayUnits, type ProjectSettings } from './settings/project-settings.js';
import { diskAccess, findProjectSettingsFile, type SettingsFileAccess } from './settings/find-project-settings.js';

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
  /** The project settings file applied to this file's system, when there is one. */
  settingsPath?: string;
  /** The parsed file (absent for a file that could not be read). */
  root?: Document;
}

export interface LoadOptions {
  /** Run the airflow analysis and the design rules on each system (default: structure only). */
  analyse?: boolean;
  /**
   * Project settings (vacnet.json) for the systems: 'discover' finds the
   * file above each requested file; an object gives one file's path and
   * text for all of them. Default: none.
   */
  settings?: 'discover' | { path: string; text: string };
  /**
   * Reads a file (absolute path) instead of the disk, e.g. from a git
   * revision; also used to discover settings files. Default: the disk.
   */
  files?: SettingsFileAccess;
  /** Called after each file is checked, for a progress line. */
  onProgress?: (done: number, total: number) => void;
}

/** A project settings file that was read, with its own problems. */
export interface LoadedSettingsFile {
  path: string;
  diagnostics: VacnetDiagnostic[];
}

export interface LoadResult {
  /** The files asked for, in order, then the catalogs they use. */
  files: LoadedFile[];
  /** The project settings files that were read, in the order first used. */
  settingsFiles: LoadedSettingsFile[];
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
  // (Through the builder, so the index forgets their symbols too, not only the document store.)
  const previous = documents.all.map((d) => d.uri).toArray();
  if (previous.length > 0) await builder.update([], previous);

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
      text = options.files ? await readThrough(options.files, absolute) : await fs.readFile(absolute, 'utf-8');
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
  const settings = new ProjectSettingsSource(options);
  let done = 0;
  for (const absolute of ordered) {
    if (done > 0) options.onProgress?.(done, ordered.length);
    done++;
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
    const hasSystem = ((document.parseResult.value as Document).systems ?? []).length > 0;
    const project = hasSystem ? await settings.forFile(absolute) : undefined;
    files.push(describeDocument(document, requestedPaths.has(absolute), options.analyse === true, project));
  }
  if (ordered.length > 0) options.onProgress?.(ordered.length, ordered.length);
  return { files, settingsFiles: settings.files() };
}

function describeDocument(document: LangiumDocument, requested: boolean, analyse: boolean, project?: { path: string; settings: ProjectSettings }): LoadedFile {
  const diagnostics = (document.diagnostics ?? []).map(toVacnetDiagnostic);
  const root = document.parseResult.value as Document;
  const system = root.systems?.[0];
  const file: LoadedFile = { path: document.uri.fsPath, uri: document.uri.toString(), diagnostics, requested, root };
  if (system) {
    const written = lowerSystem(system);
    const lowered = project ? { ...written, model: applyProjectSettings(written.model, project.settings, statesDisplayUnits(system)) } : written;
    if (project) file.settingsPath = project.path;
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

/** Reads through the caller's file access; a missing file reads as ENOENT, as from the disk. */
async function readThrough(access: SettingsFileAccess, absolute: string): Promise<string> {
  const text = await access.readText(absolute);
  if (text === undefined) throw Object.assign(new Error('no such file'), { code: 'ENOENT' });
  return text;
}

/**
 * The project settings of each file: found once per folder, each settings
 * file read and checked once per load, its problems kept for the result.
 */
class ProjectSettingsSource {
  private readonly byFolder = new Map<string, Promise<{ path: string; settings: ProjectSettings } | undefined>>();
  private readonly read = new Map<string, { settings: ProjectSettings; diagnostics: VacnetDiagnostic[] }>();

  constructor(private readonly options: LoadOptions) {}

  async forFile(absolute: string): Promise<{ path: string; settings: ProjectSettings } | undefined> {
    const choice = this.options.settings;
    if (choice === undefined) return undefined;
    if (choice !== 'discover') return { path: choice.path, settings: this.parse(path.resolve(choice.path), choice.text) };
    const folder = path.dirname(absolute);
    let found = this.byFolder.get(folder);
    if (!found) {
      found = this.discover(folder);
      this.byFolder.set(folder, found);
    }
    return found;
  }

  files(): LoadedSettingsFile[] {
    return [...this.read].map(([file, { diagnostics }]) => ({ path: file, diagnostics }));
  }

  private async discover(folder: string): Promise<{ path: string; settings: ProjectSettings } | undefined> {
    try {
      const found = await findProjectSettingsFile(folder, this.options.files ?? diskAccess);
      return found ? { path: found.path, settings: this.parse(found.path, found.text) } : undefined;
    } catch (error) {
      // A settings file that exists but cannot be read: say so on it, and check with the defaults.
      const where = path.join(folder, 'vacnet.json');
      if (!this.read.has(where)) {
        this.read.set(where, {
          settings: emptyProjectSettings(),
          diagnostics: [{ severity: 'error', code: 'file-unreadable', message: `Cannot read this settings file: ${describeIoError(error)}.`, range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, source: 'structure' }],
        });
      }
      return undefined;
    }
  }

  private parse(file: string, text: string): ProjectSettings {
    let reading = this.read.get(file);
    if (!reading) {
      reading = parseProjectSettings(text);
      this.read.set(file, reading);
    }
    return reading.settings;
  }
}

function describeIoError(error: unknown): string {
  const code = (error as { code?: string }).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EISDIR') return 'it is a folder';
  if (code === 'EACCES') return 'permission denied';
  return error instanceof Error ? error.message : String(error);
}

export type { VacnetServices };
