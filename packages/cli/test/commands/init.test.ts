import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT, runBin } from '../run-bin.js';

// `vacnet init` through the built bin: what it writes checks with no errors
// (and no warnings: a starter should not open with findings) for a range of
// operators in both unit systems, is already formatted, never overwrites a
// file without --force (a catalog never), and uses a catalog that exists.

let work: string;
beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'vacnet-init-'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

const checkJson = (file: string, cwd: string) => {
  const run = runBin(['check', '--format', 'json', file], cwd);
  return { status: run.status, output: JSON.parse(run.stdout) as { files: { path: string; diagnostics: { severity: string; code: string; message: string }[] }[]; summary: { errors: number; warnings: number } } };
};

describe('vacnet init', () => {
  for (const units of ['imperial', 'si'] as const) {
    for (const operators of [1, 2, 5]) {
      it(`--operators ${operators} --units ${units}: a system and a catalog that check clean and are already formatted`, () => {
        const folder = join(work, `${units}-${operators}`);
        mkdirSync(folder);
        const run = runBin(['init', '--operators', String(operators), '--units', units, '--name', 'Test building'], folder);
        expect(run.status, run.stderr).toBe(0);
        expect(run.stdout).toContain('Wrote system.vacnet and the starter catalog catalog.vacnet.');
        expect(run.stdout).toContain('Checked 2 files: 0 errors, 0 warnings, 0 infos.');
        const system = readFileSync(join(folder, 'system.vacnet'), 'utf8');
        expect(system).toContain('system "Test building" {');
        expect(system).toContain(`operators ${operators}`);
        expect(system).toContain(`units ${units}`);
        expect(system).toContain('use "catalog.vacnet"');
        // One zone per operator, two inlets each.
        expect(system.match(/^\s*inlet /gm)).toHaveLength(2 * operators);
        const { status, output } = checkJson('system.vacnet', folder);
        expect(status).toBe(0);
        expect(output.summary).toMatchObject({ errors: 0, warnings: 0 });
        // The analysis ran: the worst inlet meets its tool's need.
        expect(runBin(['check', 'system.vacnet'], folder).stdout).toMatch(/worst inlet \w+: [\d.]+ (inHg|kPa) at the tool \(needs/);
        expect(runBin(['fmt', '--check', '.'], folder).status).toBe(0);
      });
    }
  }

  it('never overwrites the system without --force, and never the catalog', () => {
    const folder = join(work, 'again');
    mkdirSync(folder);
    expect(runBin(['init', 'plant.vacnet'], folder).status).toBe(0);
    const catalog = readFileSync(join(folder, 'catalog.vacnet'), 'utf8');
    writeFileSync(join(folder, 'plant.vacnet'), '// my own work\n');
    const refused = runBin(['init', 'plant.vacnet'], folder);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/plant\.vacnet exists already; use --force to overwrite it/);
    expect(readFileSync(join(folder, 'plant.vacnet'), 'utf8')).toBe('// my own work\n');

    writeFileSync(join(folder, 'catalog.vacnet'), `${catalog}// edited by hand\n`);
    // The catalog written first was sized for one operator, and is reused as it is.
    const forced = runBin(['init', '--force', 'plant.vacnet'], folder);
    expect(forced.status, forced.stderr).toBe(0);
    expect(forced.stdout).toContain('Wrote plant.vacnet, using catalog.vacnet.');
    expect(readFileSync(join(folder, 'plant.vacnet'), 'utf8')).toContain('system "Plant" {');
    expect(readFileSync(join(folder, 'catalog.vacnet'), 'utf8')).toBe(`${catalog}// edited by hand\n`);
  });

  it('uses an existing catalog (the first item of each kind), with a relative use path from a subfolder', () => {
    const folder = join(work, 'own-catalog');
    mkdirSync(join(folder, 'catalog'), { recursive: true });
    cpSync(join(REPO_ROOT, 'examples/catalog/equipment.vacnet'), join(folder, 'catalog/equipment.vacnet'));
    const before = statSync(join(folder, 'catalog/equipment.vacnet')).mtimeMs;
    const run = runBin(['init', '--catalog', 'catalog/equipment.vacnet', 'systems/house.vacnet'], folder);
    expect(run.status === 0 || run.status === 1).toBe(true);
    const system = readFileSync(join(folder, 'systems/house.vacnet'), 'utf8');
    expect(system).toContain('use "../catalog/equipment.vacnet"');
    // The first spec, hose, tool and producer of examples/catalog/equipment.vacnet.
    expect(system).toMatch(/spec steel-10 /);
    expect(system).toContain('defaults hose res-30 tool carpet');
    expect(system).toMatch(/producer home-unit/);
    expect(statSync(join(folder, 'catalog/equipment.vacnet')).mtimeMs).toBe(before);
    // Whatever that equipment gives, nothing is unresolved, and the exit code says whether there are errors.
    const { output } = checkJson('systems/house.vacnet', folder);
    expect(output.files[0]!.diagnostics.filter((d) => d.code === 'unresolved-reference' || d.code === 'use-not-found')).toEqual([]);
    expect(run.status).toBe(output.summary.errors > 0 ? 1 : 0);
  });

  it('a catalog that lacks a kind is refused with what is missing (exit 2), and nothing is written', () => {
    const folder = join(work, 'thin-catalog');
    mkdirSync(folder);
    writeFileSync(join(folder, 'catalog.vacnet'), 'spec s material steel schedule 10 roughness 45 um\n');
    const run = runBin(['init'], folder);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/catalog\.vacnet has no hose, tool, producer/);
    expect(existsSync(join(folder, 'system.vacnet'))).toBe(false);
  });

  it('bad flags are usage errors (exit 2)', () => {
    const folder = join(work, 'flags');
    mkdirSync(folder);
    expect(runBin(['init', '--operators', '0'], folder).status).toBe(2);
    expect(runBin(['init', '--operators', 'two'], folder).status).toBe(2);
    expect(runBin(['init', '--units', 'metric'], folder).status).toBe(2);
    expect(runBin(['init', 'notes.txt'], folder).status).toBe(2);
    expect(existsSync(join(folder, 'system.vacnet'))).toBe(false);
  });
});
