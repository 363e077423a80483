// Project settings files (vacnet.json, docs/settings.md) in the live
// analysis: found upward from a document's folder as the headless loader
// finds them, applied beneath the file's own settings and above the
// editor's, read again when one changes.
import { URI } from 'langium';
import { describe, expect, it } from 'vitest';
import type { SettingsFileAccess } from '../../src/settings/find-project-settings.js';
import { ProjectSettingsCache } from '../../src/engine-bridge/project-settings-cache.js';
import type { VacnetConfigurationProvider } from '../../src/lsp/vacnet-configuration-provider.js';
import { createLive, SLOW_SYSTEM } from '../lsp/live-services.js';

/** A disk of a few files: `/proj/.git` stops the upward search, as a repository's top does. */
function disk(files: Record<string, string>): SettingsFileAccess & { reads: string[] } {
  const reads: string[] = [];
  return {
    reads,
    async readText(file) {
      reads.push(file);
      return files[file];
    },
    async exists(file) {
      return file === '/proj/.git' || Object.keys(files).some((f) => f === file || f.startsWith(`${file}/`));
    },
  };
}

const SYSTEM_URI = URI.file('/proj/systems/slow.vacnet').toString();
const slowSeverity = (diagnostics: { code: string; severity: string }[]) => diagnostics.find((d) => d.code === 'slow-carrying-velocity')?.severity;

describe('project settings in the live analysis', () => {
  it('applies the nearest vacnet.json above the file, and the file still wins', async () => {
    const access = disk({ '/proj/vacnet.json': '{ "rules": { "slow-carrying-velocity": { "severity": "error" } }, "hints": { "pipes": false } }' });
    const live = createLive({ projectSettings: () => new ProjectSettingsCache(access) });
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM });
    const state = await live.analysed(SYSTEM_URI);
    expect(state.settingsPath).toBe('/proj/vacnet.json');
    expect(slowSeverity(state.result!.diagnostics)).toBe('error');
    expect(state.hints).toEqual({ inletVacuum: true, pipeVelocity: false, producer: true });
    // Looked in the file's folder first, then above, and stopped at the repository's top.
    expect(access.reads.slice(0, 2)).toEqual(['/proj/systems/vacnet.json', '/proj/vacnet.json']);

    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM.replace('operators 1', 'operators 1\n  rule slow-carrying-velocity severity info') });
    expect(slowSeverity((await live.analysed(SYSTEM_URI)).result!.diagnostics)).toBe('info');
  });

  it('puts the editor settings beneath the project file', async () => {
    const access = disk({ '/proj/vacnet.json': '{ "rules": { "slow-carrying-velocity": { "severity": "error" } } }' });
    const live = createLive({ projectSettings: () => new ProjectSettingsCache(access) });
    (live.shared.workspace.ConfigurationProvider as VacnetConfigurationProvider).updateConfiguration({ settings: { vacnet: { units: 'si', rules: { 'slow-carrying-velocity': { severity: 'info' } } } } });
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM });
    const state = await live.analysed(SYSTEM_URI);
    expect(slowSeverity(state.result!.diagnostics)).toBe('error');
    // The project says nothing about units: the editor's SI units apply.
    expect(state.model!.displayUnits).toBe('si');
  });

  it('reads the settings again when a vacnet.json changes', async () => {
    const files: Record<string, string> = {};
    const access = disk(files);
    const live = createLive({ projectSettings: () => new ProjectSettingsCache(access) });
    await live.put({ [SYSTEM_URI]: SLOW_SYSTEM });
    expect(slowSeverity((await live.analysed(SYSTEM_URI)).result!.diagnostics)).toBe('warning');
    files['/proj/vacnet.json'] = '{ "rules": { "slow-carrying-velocity": { "severity": "error" } } }';
    const before = live.cache.state(SYSTEM_URI)!.generation;
    const handler = live.shared.lsp.DocumentUpdateHandler as unknown as { onWatchedFilesChangeEmitter: { fire(p: unknown): void } };
    handler.onWatchedFilesChangeEmitter.fire({ changes: [{ uri: URI.file('/proj/vacnet.json').toString(), type: 1 }] });
    for (let i = 0; i < 100 && !(live.cache.state(SYSTEM_URI)!.generation > before && live.cache.state(SYSTEM_URI)!.status === 'ready'); i++) await new Promise((r) => setTimeout(r, 20));
    expect(slowSeverity(live.cache.state(SYSTEM_URI)!.result!.diagnostics)).toBe('error');
  });

  it('applies nothing to a document not on disk', () => {
    const cache = new ProjectSettingsCache(disk({}));
    expect(cache.forDocument(URI.parse('untitled:Untitled-1'))).toBe('none');
  });
});
