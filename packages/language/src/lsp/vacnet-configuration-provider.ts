import { DefaultConfigurationProvider, Emitter, type ConfigurationSectionUpdate, type Event } from 'langium';
import type { LangiumSharedServices } from 'langium/lsp';
import type { DidChangeConfigurationParams } from 'vscode-languageserver';
import { DEFAULT_SETTINGS, readSettings, type VacnetSettings } from '../engine-bridge/workspace-settings.js';

/** The configuration section the server reads (LSP `workspace/configuration`): the language id. */
export const SETTINGS_SECTION = 'vacnet';

/**
 * Langium's configuration provider, plus the `vacnet` section read into
 * typed settings that can be had without waiting (providers answer at once,
 * with the defaults until the client has sent its settings). A change
 * notification without the settings in it (the pull model of LSP 3.17)
 * fetches the section again.
 */
export class VacnetConfigurationProvider extends DefaultConfigurationProvider {
  private settingsNow: VacnetSettings = DEFAULT_SETTINGS;
  private readonly vacnetEmitter = new Emitter<VacnetSettings>();

  constructor(private readonly shared: LangiumSharedServices) {
    super(shared);
  }

  /** The `vacnet` settings now in force. */
  get vacnet(): VacnetSettings {
    return this.settingsNow;
  }

  get onDidChangeVacnet(): Event<VacnetSettings> {
    return this.vacnetEmitter.event;
  }

  protected override updateSectionConfiguration(section: string, configuration: unknown): void {
    super.updateSectionConfiguration(section, configuration);
    if (section === SETTINGS_SECTION) {
      this.settingsNow = readSettings(configuration);
      this.vacnetEmitter.fire(this.settingsNow);
    }
  }

  override updateConfiguration(change: DidChangeConfigurationParams): void {
    const settings = change.settings as Record<string, unknown> | null | undefined;
    if (settings && typeof settings === 'object' && SETTINGS_SECTION in settings) {
      super.updateConfiguration(change);
      return;
    }
    // Pull model: the client only says that something changed.
    const connection = this.shared.lsp?.Connection;
    if (!connection || !this.workspaceConfig) return;
    connection.workspace
      .getConfiguration({ section: SETTINGS_SECTION })
      .then((configuration: unknown) => {
        this.updateSectionConfiguration(SETTINGS_SECTION, configuration);
        this.onConfigurationSectionUpdateEmitter.fire({ section: SETTINGS_SECTION, configuration } as ConfigurationSectionUpdate);
      })
      .catch(() => undefined);
  }
}
