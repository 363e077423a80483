import { promises as fs } from 'node:fs';
import * as path from 'node:path';
import { PROJECT_SETTINGS_FILE } from './project-settings.js';

/**
 * How discovery sees files: the disk by default; a git revision when the
 * command line compares revisions.
 */
export interface SettingsFileAccess {
  /** The file's text, or undefined when there is no such file. Other failures throw. */
  readText(absolutePath: string): Promise<string | undefined>;
  /** True when the path exists (file or folder). */
  exists(absolutePath: string): Promise<boolean>;
}

export const diskAccess: SettingsFileAccess = {
  async readText(absolutePath) {
    try {
      return await fs.readFile(absolutePath, 'utf8');
    } catch (error) {
      if ((error as { code?: string }).code === 'ENOENT' || (error as { code?: string }).code === 'ENOTDIR') return undefined;
      throw error;
    }
  },
  async exists(absolutePath) {
    try {
      await fs.stat(absolutePath);
      return true;
    } catch {
      return false;
    }
  },
};

/** A settings file found by discovery: where it is and its text. */
export interface FoundSettingsFile {
  path: string;
  text: string;
}

/**
 * The project settings file that governs a folder: `vacnet.json` in the
 * folder or the nearest folder above it. The search stops after a folder
 * that holds `.git` (the top of a repository: settings above it belong to
 * someone else) and at the filesystem root. Undefined when there is none.
 * A file that exists but cannot be read throws, so the caller can say so.
 */
export async function findProjectSettingsFile(folder: string, access: SettingsFileAccess = diskAccess): Promise<FoundSettingsFile | undefined> {
  let current = path.resolve(folder);
  for (;;) {
    const candidate = path.join(current, PROJECT_SETTINGS_FILE);
    const text = await access.readText(candidate);
    if (text !== undefined) return { path: candidate, text };
    if (await access.exists(path.join(current, '.git'))) return undefined;
    const parent = path.dirname(current);
    if (parent === current) return undefined;
    current = parent;
  }
}
