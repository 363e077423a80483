import * as path from 'node:path';
import { Emitter, URI, type Event } from 'langium';
import type { VacnetDiagnostic } from '../diagnostic.js';
import { diskAccess, findProjectSettingsFile, type SettingsFileAccess } from '../settings/find-project-settings.js';
import { emptyProjectSettings, parseProjectSettings, PROJECT_SETTINGS_FILE, type ProjectSettings } from '../settings/project-settings.js';

/** The project settings that govern a folder: the file found (if any), its settings, and its problems. */
export interface FolderSettings {
  /** The vacnet.json applied, absolute; undefined when there is none. */
  path?: string;
  settings: ProjectSettings;
  diagnostics: VacnetDiagnostic[];
}

/**
 * The project settings files (vacnet.json, docs/settings.md) as the language
 * server sees them, found upward from each document's folder as the headless
 * loader finds them, so that the editor judges a file as `vacnet check`
 * does. Reading is asynchronous: `forDocument` answers at once with what is
 * known and starts the search otherwise; `onDidLoad` then says which folder
 * has its settings, and the analysis of its documents runs again. A change
 * of any vacnet.json (watched files) forgets everything found.
 */
export class ProjectSettingsCache {
  private readonly byFolder = new Map<string, FolderSettings | Promise<FolderSettings>>();
  private readonly loadEmitter = new Emitter<string>();

  constructor(private readonly access: SettingsFileAccess = diskAccess) {}

  /** Fires with a folder whose settings have just been read. */
  get onDidLoad(): Event<string> {
    return this.loadEmitter.event;
  }

  /**
   * The settings for a document: `none` for documents not on disk, the
   * folder's settings when known, `loading` while they are being read.
   */
  forDocument(uri: URI): FolderSettings | 'none' | 'loading' {
    const folder = this.folderOf(uri);
    if (folder === undefined) return 'none';
    const known = this.byFolder.get(folder);
    if (known && !(known instanceof Promise)) return known;
    if (!known) {
      const reading = this.read(folder).then((settings) => {
        // A change while reading started a new search; this one is stale.
        if (this.byFolder.get(folder) === reading) {
          this.byFolder.set(folder, settings);
          this.loadEmitter.fire(folder);
        }
        return settings;
      });
      this.byFolder.set(folder, reading);
    }
    return 'loading';
  }

  /** The folder whose settings apply to a document; undefined for documents not on disk. */
  folderOf(uri: URI): string | undefined {
    return uri.scheme === 'file' ? path.dirname(uri.fsPath) : undefined;
  }

  /** The settings files now applied, with their problems (to show on them). */
  files(): FolderSettings[] {
    const seen = new Map<string, FolderSettings>();
    for (const entry of this.byFolder.values()) if (!(entry instanceof Promise) && entry.path) seen.set(entry.path, entry);
    return [...seen.values()];
  }

  /** Forgets everything found (a settings file changed, appeared or went). Returns whether anything was known. */
  forget(): boolean {
    const had = this.byFolder.size > 0;
    this.byFolder.clear();
    return had;
  }

  /** True when a changed file's name makes the settings worth reading again. */
  static isSettingsFile(uri: string): boolean {
    return uri.endsWith(`/${PROJECT_SETTINGS_FILE}`);
  }

  private async read(folder: string): Promise<FolderSettings> {
    try {
      const found = await findProjectSettingsFile(folder, this.access);
      if (!found) return { settings: emptyProjectSettings(), diagnostics: [] };
      const reading = parseProjectSettings(found.text);
      return { path: found.path, settings: reading.settings, diagnostics: reading.diagnostics };
    } catch (error) {
      // A settings file that cannot be read: the defaults apply, and the editor says so on the system.
      return {
        settings: emptyProjectSettings(),
        diagnostics: [
          {
            severity: 'error',
            code: 'file-unreadable',
            message: `Cannot read the project settings file ${PROJECT_SETTINGS_FILE} above this folder: ${error instanceof Error ? error.message : String(error)}.`,
            range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } },
            source: 'structure',
          },
        ],
      };
    }
  }
}

/** The URI of a settings file's path, for publishing its problems. */
export function settingsFileUri(file: string): string {
  return URI.file(file).toString();
}
