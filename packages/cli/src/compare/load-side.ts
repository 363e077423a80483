import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { diskAccess, loadDocuments, type LoadOptions, type SettingsFileAccess } from '@vacnet/language';
import { UsageError } from '../exit-codes.js';
import { VACNET_EXTENSION } from '../expand-paths.js';
import type { ComparedSide } from './comparison.js';
import { indexElements } from './element-index.js';
import { parseSide, RevisionFiles, revisionPathToAbsolute } from './revision-files.js';

/** Where a side's file is and how to read it. */
export interface SideSource {
  label: string;
  /** Absolute path (at a revision: where the file sits in the working tree). */
  path: string;
  files: SettingsFileAccess;
  /** A file read instead of `path`'s own text (git's text-conversion copies). */
  text?: string;
}

/** Resolves `<rev>:<path>` or a plain path. UsageError for an unknown revision or a path that is not a .vacnet file. */
export async function resolveSide(spec: string, cwd: string): Promise<SideSource> {
  const side = parseSide(spec, (path) => existsSync(resolve(cwd, path)));
  if (!side.path.endsWith(VACNET_EXTENSION)) throw new UsageError(`${spec}: not a ${VACNET_EXTENSION} file`);
  if (side.revision === undefined) return { label: spec, path: resolve(cwd, side.path), files: diskAccess };
  const files = await RevisionFiles.open(side.revision, cwd);
  const path = revisionPathToAbsolute(side.path, files.root, cwd);
  if (files.repositoryPath(path) === undefined) throw new UsageError(`${spec}: the path is outside the repository at ${files.root}`);
  return { label: spec, path, files };
}

export interface LoadSideOptions {
  /** Apply the project settings file found above the file on that side (default true). */
  useSettings?: boolean;
}

/**
 * Loads one side with the airflow analysis, the catalogs it uses and the
 * project settings it falls under, all read the same way (disk or revision).
 */
export async function loadSide(source: SideSource, options: LoadSideOptions = {}): Promise<ComparedSide> {
  const text = source.text ?? (await source.files.readText(source.path));
  if (text === undefined) return { label: source.label, exists: false, diagnostics: [], accepted: [], elements: new Map() };
  const files: SettingsFileAccess =
    source.text === undefined
      ? source.files
      : { readText: (p) => (resolve(p) === source.path ? Promise.resolve(source.text) : source.files.readText(p)), exists: (p) => source.files.exists(p) };
  const settings: LoadOptions = options.useSettings === false ? {} : { settings: 'discover' };
  const loaded = await loadDocuments([source.path], { analyse: true, files, ...settings });
  const file = loaded.files[0];
  if (!file) return { label: source.label, exists: false, diagnostics: [], accepted: [], elements: new Map() };
  return {
    label: source.label,
    exists: true,
    ...(file.model ? { model: file.model } : {}),
    ...(file.analysis ? { analysis: file.analysis } : {}),
    diagnostics: file.diagnostics,
    accepted: file.accepted ?? [],
    elements: indexElements(file.root),
  };
}
