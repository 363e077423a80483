// The project settings file (vacnet.json): read, checked with located
// problems, and placed beneath the file's own settings. Unit factors from
// NIST SP 811 (2008) appendix B: 1 ft = 0.3048 m exactly, so
// 4000 ft/min = 20.32 m/s; 1 inHg (32 F) = 3386.389 Pa.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SystemModel } from '@vacnet/engine';
import { applyProjectSettings, emptyProjectSettings, parseProjectSettings, SettingsCodes } from '../../src/settings/project-settings.js';
import { findProjectSettingsFile } from '../../src/settings/find-project-settings.js';
import { loadDocuments } from '../../src/document.js';

/** 1-based `line:column` of the first `marker` in `text`, to compare with a diagnostic's start. */
function where(text: string, marker: string): string {
  const index = text.indexOf(marker);
  const before = text.slice(0, index).split('\n');
  return `${before.length}:${before.at(-1)!.length + 1}`;
}
const start = (d: { range: { start: { line: number; character: number } } }) => `${d.range.start.line + 1}:${d.range.start.character + 1}`;

describe('parseProjectSettings', () => {
  it('reads display units, hints, severities and thresholds with their units (SI inside)', () => {
    const { settings, diagnostics } = parseProjectSettings(
      JSON.stringify({
        $schema: './vacnet.schema.json',
        displayUnits: 'si',
        rules: {
          'slow-carrying-velocity': { severity: 'error', 'min-velocity': '4000 fpm', 'vertical-factor': 0.9 },
          'hose-loss': { absolute: '8 inHg', share: '40 %' },
          'missing-cleanout': { severity: 'off', because: 'cleanouts are on the mechanical drawings' },
        },
        hints: { pipes: false },
      }),
    );
    expect(diagnostics).toEqual([]);
    expect(settings.displayUnits).toBe('si');
    expect(settings.hints).toEqual({ inlets: true, pipes: false, producer: true });
    expect(settings.severities).toEqual([
      { rule: 'slow-carrying-velocity', severity: 'error' },
      { rule: 'missing-cleanout', severity: 'off' },
    ]);
    expect(settings.offReasons).toEqual({ 'missing-cleanout': 'cleanouts are on the mechanical drawings' });
    const value = (key: string) => settings.ruleSettings.find((s) => `${s.rule}.${s.parameter}` === key)?.value;
    expect(value('slow-carrying-velocity.minVelocity')).toBeCloseTo(20.32, 12); // NIST SP 811
    expect(value('slow-carrying-velocity.verticalFactor')).toBe(0.9);
    expect(value('hose-loss.absolute')).toBeCloseTo(8 * 3386.389, 2); // NIST SP 811
    expect(value('hose-loss.share')).toBeCloseTo(0.4, 12);
  });

  it('places each problem on its key or value, by line and column, and keeps what it can use', () => {
    const text = [
      '{',
      '  "displayUnits": "metric",',
      '  "rules": {',
      '    "slow-carrying-velocty": { "severity": "error" },',
      '    "fast-velocity": { "limt": "8000 fpm", "limit": "8000 kg" },',
      '    "hose-loss": { "share": 40, "absolute": "9 inHg" },',
      '    "missing-cleanout": { "severity": "off" },',
      '    "producer-margin": { "min-margin": "2000 %" }',
      '  },',
      '  "hint": { "inlets": false }',
      '}',
    ].join('\n');
    const { settings, diagnostics } = parseProjectSettings(text);
    const found = diagnostics.map((d) => `${d.code}@${start(d)}`);
    expect(found).toEqual([
      `${SettingsCodes.invalidValue}@${where(text, '"metric"')}`,
      `${SettingsCodes.unknownName}@${where(text, '"slow-carrying-velocty"')}`,
      `${SettingsCodes.unknownName}@${where(text, '"limt"')}`,
      `${SettingsCodes.invalidValue}@${where(text, '"8000 kg"')}`,
      `${SettingsCodes.invalidValue}@${where(text, '40,')}`,
      `${SettingsCodes.invalidValue}@${where(text, '"off"')}`,
      `${SettingsCodes.invalidValue}@${where(text, '"2000 %"')}`,
      `${SettingsCodes.unknownName}@${where(text, '"hint"')}`,
    ]);
    expect(diagnostics.every((d) => d.severity === 'error')).toBe(true);
    expect(diagnostics[1]!.message).toContain("'slow-carrying-velocty'");
    expect(diagnostics[2]!.message).toContain("did you mean 'limit'");
    expect(diagnostics[3]!.message).toMatch(/'kg' is not a unit of velocity \(use one of fpm/);
    expect(diagnostics[4]!.message).toContain('"40 %"');
    expect(diagnostics[5]!.message).toContain('needs a reason');
    expect(diagnostics[7]!.message).toContain("did you mean 'hints'");
    // What could be read still applies; what could not does not.
    expect(settings.displayUnits).toBeUndefined();
    expect(settings.severities).toEqual([]);
    expect(settings.ruleSettings.map((s) => `${s.rule}.${s.parameter}`)).toEqual(['hose-loss.absolute']);
  });

  it('a JSON syntax error is one located diagnostic; nothing applies', () => {
    const text = '{\n  "rules": {\n    "hose-loss": { "share": "40 %", }\n  }\n}';
    const { settings, diagnostics } = parseProjectSettings(text);
    expect(diagnostics).toHaveLength(1);
    expect(diagnostics[0]).toMatchObject({ code: SettingsCodes.syntaxError, severity: 'error', source: 'syntax' });
    expect(start(diagnostics[0]!)).toBe(where(text, '}\n  }'));
    expect(settings).toEqual(emptyProjectSettings());
  });

  it('a key written twice is reported on the first; the last counts, as in JSON.parse (ECMA-262)', () => {
    const text = '{ "displayUnits": "si", "displayUnits": "imperial" }';
    const { settings, diagnostics } = parseProjectSettings(text);
    expect(diagnostics.map((d) => start(d))).toEqual(['1:3']);
    expect(settings.displayUnits).toBe(JSON.parse(text).displayUnits);
  });

  it('never throws on arbitrary text', () => {
    for (const text of ['', 'null', '[]', '"x"', '{"rules": []}', '{"rules": {"hose-loss": null}}', '{"hints": 3}', '\u0000', '{"rules": {"hose-loss": {"share": "1e400 %"}}}']) {
      const { diagnostics } = parseProjectSettings(text);
      expect(diagnostics.length, text).toBeGreaterThan(0);
    }
  });
});

describe('applyProjectSettings', () => {
  const model = {
    displayUnits: 'imperial',
    rules: { settings: [{ rule: 'hose-loss', parameter: 'share', value: 0.3 }], suppressions: [], severities: [{ rule: 'hose-loss', severity: 'info' }] },
  } as unknown as SystemModel;

  it('puts the project beneath the file: project entries first, so the file\'s later ones win in the engine', () => {
    const { settings } = parseProjectSettings(JSON.stringify({ displayUnits: 'si', rules: { 'hose-loss': { share: '50 %', severity: 'error' } } }));
    const applied = applyProjectSettings(model, settings, false);
    expect(applied.displayUnits).toBe('si');
    expect(applied.rules.settings).toEqual([{ rule: 'hose-loss', parameter: 'share', value: 0.5 }, { rule: 'hose-loss', parameter: 'share', value: 0.3 }]);
    expect(applied.rules.severities).toEqual([{ rule: 'hose-loss', severity: 'error' }, { rule: 'hose-loss', severity: 'info' }]);
    // A file with its own `units` line keeps it.
    expect(applyProjectSettings(model, settings, true).displayUnits).toBe('imperial');
  });

  it('returns the model itself when there is nothing to apply', () => {
    expect(applyProjectSettings(model, emptyProjectSettings(), false)).toBe(model);
  });
});

describe('the loader with a project settings file', () => {
  // The README's tour system: its riser reaches about 7949 fpm with both tools
  // lifted, over the default 7874 fpm (40 m/s) limit of fast-velocity.
  const tour = readFileSync(new URL('../../../cli/test/fixtures/readme-small-office.vacnet', import.meta.url), 'utf8');
  let work: string;
  beforeAll(() => {
    work = mkdtempSync(join(tmpdir(), 'vacnet-settings-'));
    mkdirSync(join(work, 'repo/.git'), { recursive: true });
    mkdirSync(join(work, 'repo/site/floor'), { recursive: true });
    writeFileSync(join(work, 'repo/site/floor/tour.vacnet'), tour);
    // Above the repository: never read.
    writeFileSync(join(work, 'vacnet.json'), '{ "rules": { "fast-velocity": { "severity": "info" } } }');
  });
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  const fastVelocity = async (settingsText?: string, fileText = tour) => {
    if (settingsText === undefined) rmSync(join(work, 'repo/site/vacnet.json'), { force: true });
    else writeFileSync(join(work, 'repo/site/vacnet.json'), settingsText);
    writeFileSync(join(work, 'repo/site/floor/tour.vacnet'), fileText);
    const result = await loadDocuments([join(work, 'repo/site/floor/tour.vacnet')], { analyse: true, settings: 'discover' });
    const file = result.files[0]!;
    return { file, result, findings: file.diagnostics.filter((d) => d.code === 'fast-velocity') };
  };

  it('without a settings file (the one above .git is not read), fast-velocity is a warning', async () => {
    const { findings, file, result } = await fastVelocity();
    expect(findings.map((d) => d.severity)).toEqual(['warning']);
    expect(file.settingsPath).toBeUndefined();
    expect(result.settingsFiles).toEqual([]);
  });

  it('the project severity applies, found two folders up', async () => {
    const { findings, file } = await fastVelocity('{ "rules": { "fast-velocity": { "severity": "error" } } }');
    expect(findings.map((d) => d.severity)).toEqual(['error']);
    expect(file.settingsPath).toBe(join(work, 'repo/site/vacnet.json'));
  });

  it('a project threshold above the riser velocity clears the finding', async () => {
    const { findings } = await fastVelocity('{ "rules": { "fast-velocity": { "limit": "8500 fpm" } } }');
    expect(findings).toEqual([]);
  });

  it("the file's own rule line wins over the project", async () => {
    const withLine = tour.replace('  operators 2\n', '  operators 2\n  rule fast-velocity severity info\n');
    expect(withLine).not.toBe(tour);
    const { findings } = await fastVelocity('{ "rules": { "fast-velocity": { "severity": "error" } } }', withLine);
    expect(findings.map((d) => d.severity)).toEqual(['info']);
  });

  it('off with a reason turns the rule off; display units apply when the file states none', async () => {
    const { findings, file } = await fastVelocity('{ "displayUnits": "si", "rules": { "fast-velocity": { "severity": "off", "because": "a quiet plant room" } } }');
    expect(findings).toEqual([]);
    expect(file.model?.displayUnits).toBe('si');
  });

  it("the settings file's problems come back with the result, located in it", async () => {
    const { result, findings } = await fastVelocity('{\n  "rules": {\n    "fast-velocity": { "limit": "8500 kg" }\n  }\n}');
    expect(result.settingsFiles).toEqual([{ path: join(work, 'repo/site/vacnet.json'), diagnostics: [expect.objectContaining({ code: SettingsCodes.invalidValue, range: { start: { line: 2, character: 32 }, end: { line: 2, character: 41 } } })] }]);
    expect(findings.map((d) => d.severity)).toEqual(['warning']);
  });
});

describe('findProjectSettingsFile', () => {
  it('stops at the filesystem root when there is no .git', async () => {
    expect(await findProjectSettingsFile('/', { readText: async () => undefined, exists: async () => false })).toBeUndefined();
  });

  it('takes the nearest file, and stops after the folder that holds .git', async () => {
    const files: Record<string, string> = { '/a/vacnet.json': 'outer', '/a/b/c/vacnet.json': 'inner' };
    const access = { readText: async (p: string) => files[p], exists: async (p: string) => p === '/a/b/.git' };
    expect(await findProjectSettingsFile('/a/b/c/d', access)).toEqual({ path: '/a/b/c/vacnet.json', text: 'inner' });
    expect(await findProjectSettingsFile('/a/b/x', access)).toBeUndefined();
  });
});

describe('docs/rules pages of the settings codes', () => {
  for (const code of Object.values(SettingsCodes)) {
    it(`${code} has a page that starts with its code and states its severity`, () => {
      const page = readFileSync(new URL(`../../../../docs/rules/${code}.md`, import.meta.url), 'utf8');
      expect(page.startsWith(`# ${code}\n`)).toBe(true);
      expect(page).toContain('Always **error**');
    });
  }
});
