// Editor settings (section `vacnet` of workspace/configuration): read,
// checked, and placed under the file's own settings. Unit factors from
// NIST SP 811 (2008) appendix B: 1 ft = 0.3048 m exactly, so
// 4000 ft/min = 20.32 m/s; 1 inHg = 3386.389 Pa.
import { describe, expect, it } from 'vitest';
import type { SystemModel } from '@vacnet/engine';
import { applySettings, readSettings } from '../../src/engine-bridge/workspace-settings.js';
import { createLive, SLOW_SYSTEM } from '../lsp/live-services.js';
import type { VacnetConfigurationProvider } from '../../src/lsp/vacnet-configuration-provider.js';

describe('reading the vacnet settings', () => {
  it('reads units, hints, thresholds with units and severities', () => {
    const settings = readSettings({
      units: 'si',
      hints: { pipeVelocity: false },
      rules: {
        'slow-carrying-velocity': { 'min-velocity': '4000 fpm', severity: 'error' },
        'hose-loss': { absolute: '8 inHg', share: '40 %' },
      },
    });
    expect(settings.problems).toEqual([]);
    expect(settings.units).toBe('si');
    expect(settings.hints).toEqual({ inletVacuum: true, pipeVelocity: false, producer: true });
    expect(settings.severities).toEqual([{ rule: 'slow-carrying-velocity', severity: 'error' }]);
    const byParameter = Object.fromEntries(settings.ruleSettings.map((s) => [`${s.rule}.${s.parameter}`, s.value]));
    expect(byParameter['slow-carrying-velocity.minVelocity']).toBeCloseTo(20.32, 12);
    expect(byParameter['hose-loss.absolute']).toBeCloseTo(8 * 3386.389, 3);
    expect(byParameter['hose-loss.share']).toBeCloseTo(0.4, 12);
  });

  it('reports what it cannot use and keeps the rest', () => {
    const settings = readSettings({
      units: 'metric',
      rules: {
        'no-such-rule': { severity: 'error' },
        'slow-carrying-velocity': { 'min-velocity': 4000, severity: 'off', 'max-speed': '1 fpm' },
        'hose-loss': { absolute: '8 kg' },
        'producer-margin': { 'min-margin': '15 %' },
      },
      analysis: { debounceMs: -5 },
    });
    expect(settings.units).toBeUndefined();
    expect(settings.problems).toHaveLength(7);
    expect(settings.problems.join('\n')).toMatch(/vacnet.units/);
    expect(settings.problems.join('\n')).toMatch(/no design rule has the code 'no-such-rule'/);
    expect(settings.problems.join('\n')).toMatch(/with its unit, e.g. "4000 fpm"/);
    expect(settings.problems.join('\n')).toMatch(/turn a rule off in the file, with a reason/);
    expect(settings.problems.join('\n')).toMatch(/no setting 'max-speed'/);
    expect(settings.problems.join('\n')).toMatch(/'kg' is not a unit of pressure/);
    expect(settings.problems.join('\n')).toMatch(/debounceMs/);
    expect(settings.ruleSettings).toEqual([{ rule: 'producer-margin', parameter: 'minMargin', value: 0.15 }]);
  });

  it('never throws on values of the wrong type', () => {
    for (const raw of [null, undefined, 42, 'si', [], { rules: 'x' }, { rules: { 'hose-loss': 3 } }, { hints: 'yes' }]) {
      expect(() => readSettings(raw)).not.toThrow();
    }
  });
});

describe('applying the settings under the file', () => {
  const model = {
    displayUnits: 'imperial',
    rules: { settings: [{ rule: 'hose-loss', parameter: 'share', value: 0.3 }], suppressions: [], severities: [{ rule: 'hose-loss', severity: 'info' }] },
  } as unknown as SystemModel;

  it('returns the model itself when there is nothing to apply (the editor then equals the headless loader)', () => {
    expect(applySettings(model, readSettings({}), false)).toBe(model);
  });

  it('puts the editor values first, so the file (read last by the engine) wins', () => {
    const applied = applySettings(model, readSettings({ units: 'si', rules: { 'hose-loss': { share: 0.6, severity: 'error' } } }), false);
    expect(applied.displayUnits).toBe('si');
    expect(applied.rules.settings.map((s) => s.value)).toEqual([0.6, 0.3]);
    expect(applied.rules.severities.map((s) => s.severity)).toEqual(['error', 'info']);
    // A `units` line in the file keeps its units.
    expect(applySettings(model, readSettings({ units: 'si' }), true)).toBe(model);
  });
});

describe('settings in the live analysis', () => {
  async function withSettings(settings: unknown, text = SLOW_SYSTEM) {
    const live = createLive();
    (live.shared.workspace.ConfigurationProvider as VacnetConfigurationProvider).updateConfiguration({ settings: { vacnet: settings } });
    await live.put({ 'file:///work/settings/system.vacnet': text });
    return live.analysed('file:///work/settings/system.vacnet');
  }

  it('a stricter velocity from the settings raises the severity; a file rule line overrides it', async () => {
    const strict = await withSettings({ rules: { 'slow-carrying-velocity': { severity: 'error' } } });
    expect(strict.result!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')?.severity).toBe('error');
    const file = await withSettings(
      { rules: { 'slow-carrying-velocity': { severity: 'error' } } },
      SLOW_SYSTEM.replace('operators 1', 'operators 1\n  rule slow-carrying-velocity severity info'),
    );
    expect(file.result!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')?.severity).toBe('info');
  });

  it('a lower velocity threshold from the settings clears the finding (the lone operator runs at about 1600 fpm)', async () => {
    const lenient = await withSettings({ rules: { 'slow-carrying-velocity': { 'min-velocity': '1000 fpm' } } });
    expect(lenient.result!.diagnostics.map((d) => d.code)).not.toContain('slow-carrying-velocity');
  });

  it('SI display units from the settings change the message units; settings problems are shown on the system', async () => {
    const si = await withSettings({ units: 'si', rules: { 'hose-loss': { absolute: 'lots' } } });
    const slow = si.result!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')!;
    expect(slow.message).toMatch(/ m\/s /);
    expect(slow.message).not.toMatch(/fpm/);
    expect(si.settingsDiagnostics.map((d) => d.code)).toEqual(['invalid-rule-setting']);
    expect(si.settingsDiagnostics[0]!.message).toMatch(/vacnet\.rules\.hose-loss\.absolute/);
  });
});
