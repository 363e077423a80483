import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BIN, runBin } from '../run-bin.js';

// `vacnet compare` on revisions of a git repository made here, through the
// built bin: a pipe resized, an inlet added, a formatting-only change that
// must show as no change, a catalog change seen at its revision, a
// regression gate, the three output formats, and `vacnet show` as git's
// text conversion. The physics direction checked is the textbook one: a
// smaller or longer pipe loses more (Darcy-Weisbach: loss grows with length
// and falls with bore), so the inlets beyond it get less vacuum.

const CATALOG = `spec pvc-2 material pvc roughness 0.0015 mm nonconductive
hose house-30 length 30 ft bore 1-1/4 in roughness 0.3 mm
tool floor-brush working orifice 3/4 in lifted orifice 1 in needs 4 inHg
producer power-unit {
  curve { at 0 scfm 120 inH2O  at 60 scfm 90 inH2O  at 120 scfm 40 inH2O }
}
`;

const HOUSE = `// A small house with one operator.
use "catalog.vacnet"

system "Fixture house" {
  operators 1
  debris dry
  defaults hose house-30 tool floor-brush

  plant garage { producer power-unit }
  pipe trunk from garage to hall spec pvc-2 size 2 in length 25 ft horizontal
  pipe upstairs from hall to landing spec pvc-2 size 2 in length 10 ft up joins wye 45 deg
  inlet kitchen on trunk at 20 ft room "Kitchen"   // by the pantry
  inlet bedroom at landing room "Bedroom"
  cleanout at hall
}
`;

let repo: string;
const gitIn = (...args: string[]) => {
  const run = spawnSync('git', args, { cwd: repo, encoding: 'utf8' });
  expect(run.status, run.stderr).toBe(0);
  return run.stdout;
};
const commit = (message: string, files: Record<string, string>) => {
  for (const [name, text] of Object.entries(files)) writeFileSync(join(repo, name), text);
  gitIn('add', '.');
  gitIn('commit', '-q', '-m', message);
  return gitIn('rev-parse', '--short', 'HEAD').trim();
};

const revs: Record<string, string> = {};
beforeAll(() => {
  repo = mkdtempSync(join(tmpdir(), 'vacnet-compare-'));
  gitIn('init', '-q');
  gitIn('config', 'user.email', 'test@example.com');
  gitIn('config', 'user.name', 'Test');
  gitIn('config', 'commit.gpgsign', 'false');
  revs.base = commit('base', { 'catalog.vacnet': CATALOG, 'house.vacnet': HOUSE });
  revs.resized = commit('resize the riser', { 'house.vacnet': HOUSE.replace('pipe upstairs from hall to landing spec pvc-2 size 2 in', 'pipe upstairs from hall to landing spec pvc-2 size 1-1/2 in') });
  revs.inlet = commit('add an inlet', {
    'house.vacnet': readFileSync(join(repo, 'house.vacnet'), 'utf8').replace('  cleanout at hall\n', '  inlet hall-1 on trunk at 5 ft room "Hall"\n  cleanout at hall\n'),
  });
  // Formatting only: the formatter's layout, spacing and the order of the two inlets changed, a unit respelt.
  const tidy = readFileSync(join(repo, 'house.vacnet'), 'utf8')
    .replace('  plant garage { producer power-unit }', '  plant garage {\n    producer power-unit\n  }')
    .replace('  inlet kitchen on trunk at 20 ft room "Kitchen"   // by the pantry\n  inlet bedroom at landing room "Bedroom"\n', '  inlet bedroom    at landing  room "Bedroom"\n  inlet kitchen on trunk at 240 in room "Kitchen" // by the pantry\n')
    .replace('size 2 in length 25 ft', 'size 2 in   length 25 ft');
  revs.tidy = commit('tidy', { 'house.vacnet': tidy });
  // The catalog's producer weakens; the system file does not change.
  revs.catalog = commit('weaker producer', { 'catalog.vacnet': CATALOG.replace('at 0 scfm 120 inH2O  at 60 scfm 90 inH2O  at 120 scfm 40 inH2O', 'at 0 scfm 100 inH2O  at 60 scfm 70 inH2O  at 120 scfm 20 inH2O') });
});
afterAll(() => rmSync(repo, { recursive: true, force: true }));

interface CompareJson {
  changed: boolean;
  elements: { change: string; kind: string; name: string; properties?: { key: string; before?: string; after?: string }[] }[];
  inlets: { name: string; status: string; beforeToolVacuumPa: number | null; afterToolVacuumPa: number | null; regression: boolean }[];
  producer: { before: { vacuumPa: number; flowStdM3PerS: number } | null; after: { vacuumPa: number; flowStdM3PerS: number } | null };
  findings: { new: { code: string }[]; resolved: { code: string }[] };
  regressions: string[];
}
const compareJson = (a: string, b: string) => {
  const run = runBin(['compare', '--format', 'json', a, b], repo);
  expect(run.status, run.stderr).toBe(0);
  return JSON.parse(run.stdout) as CompareJson;
};

describe('vacnet compare on git revisions', () => {
  it('a resized pipe: one property change, and every inlet beyond it gets less vacuum', () => {
    const c = compareJson(`${revs.base}:house.vacnet`, `${revs.resized}:house.vacnet`);
    expect(c.changed).toBe(true);
    expect(c.elements).toEqual([{ change: 'changed', kind: 'pipe', name: 'upstairs', properties: [{ key: 'size', before: 'size 2 in', after: 'size 1-1/2 in' }] }]);
    const bedroom = c.inlets.find((i) => i.name === 'bedroom')!;
    const kitchen = c.inlets.find((i) => i.name === 'kitchen')!;
    // The bedroom is beyond the smaller pipe: it must lose vacuum (Darcy-Weisbach: smaller bore, more loss).
    expect(bedroom.status).toBe('worse');
    expect(bedroom.afterToolVacuumPa!).toBeLessThan(bedroom.beforeToolVacuumPa!);
    // The kitchen is upstream of it and works alone (one operator): unchanged.
    expect(kitchen.status).toBe('same');

    const text = runBin(['compare', `${revs.base}:house.vacnet`, `${revs.resized}:house.vacnet`], repo).stdout;
    expect(text).toContain('changed pipe upstairs: size 2 in -> 1-1/2 in');
    expect(text).toMatch(/^ {2}bedroom +\d\.\d+ inHg +\d\.\d+ inHg +-0\.\d+ inHg +4\.00 inHg/m);
  });

  it('an inlet added: listed as added, with its worst case as new', () => {
    const c = compareJson(`${revs.resized}:house.vacnet`, `${revs.inlet}:house.vacnet`);
    expect(c.elements.map((e) => `${e.change} ${e.kind} ${e.name}`)).toEqual(['added inlet hall-1']);
    const added = c.inlets.find((i) => i.name === 'hall-1')!;
    expect(added.status).toBe('added');
    expect(added.beforeToolVacuumPa).toBeNull();
    expect(added.afterToolVacuumPa).toBeGreaterThan(0);
  });

  it('a formatting-only change (layout, order, spacing, a unit respelt: 240 in = 20 ft) is no change', () => {
    const diff = gitIn('diff', '--stat', revs.inlet!, revs.tidy!);
    expect(diff).toContain('house.vacnet');
    const c = compareJson(`${revs.inlet}:house.vacnet`, `${revs.tidy}:house.vacnet`);
    expect(c.changed).toBe(false);
    expect(c.elements).toEqual([]);
    expect(c.inlets.every((i) => i.status === 'same')).toBe(true);
    const text = runBin(['compare', `${revs.inlet}:house.vacnet`, `${revs.tidy}:house.vacnet`], repo).stdout;
    expect(text).toMatch(/No change: the same elements with the same properties, and the same results\./);
    const markdown = runBin(['compare', '--format', 'markdown', `${revs.inlet}:house.vacnet`, `${revs.tidy}:house.vacnet`], repo).stdout;
    expect(markdown).toContain('**No change**');
  });

  it("each side's catalog is read at its revision: a weaker producer in the catalog lowers the inlets though the system file is the same", () => {
    expect(gitIn('diff', '--name-only', revs.tidy!, revs.catalog!).trim()).toBe('catalog.vacnet');
    const c = compareJson(`${revs.tidy}:house.vacnet`, `${revs.catalog}:house.vacnet`);
    expect(c.elements).toEqual([]);
    expect(c.changed).toBe(true);
    for (const inlet of c.inlets) expect(inlet.afterToolVacuumPa!).toBeLessThan(inlet.beforeToolVacuumPa!);
    expect(c.producer.after!.vacuumPa).toBeLessThan(c.producer.before!.vacuumPa);
    // The working tree (at the last revision) against the first revision: the old side still sees its own catalog.
    const fromBase = compareJson(`${revs.base}:house.vacnet`, 'house.vacnet');
    const againstDisk = compareJson(`${revs.base}:house.vacnet`, `${revs.base}:house.vacnet`);
    expect(againstDisk.changed).toBe(false);
    expect(fromBase.producer.before).toEqual(compareJson(`${revs.base}:house.vacnet`, `${revs.resized}:house.vacnet`).producer.before);
  });

  it('--fail-on-regression exits 1 when an inlet falls newly short or a new error appears; 0 otherwise', () => {
    writeFileSync(join(repo, 'long.vacnet'), HOUSE.replace('length 10 ft up', 'length 400 ft up'));
    writeFileSync(join(repo, 'same.vacnet'), HOUSE);
    const gated = runBin(['compare', '--fail-on-regression', `${revs.base}:house.vacnet`, 'long.vacnet'], repo);
    expect(gated.status).toBe(1);
    expect(gated.stdout).toMatch(/inlet bedroom falls short of the vacuum its tool needs \(worse than before\)/);
    expect(gated.stdout).toMatch(/a new error: starved-inlet at inlet bedroom/);
    expect(runBin(['compare', `${revs.base}:house.vacnet`, 'long.vacnet'], repo).status).toBe(0);
    expect(runBin(['compare', '--fail-on-regression', `${revs.base}:house.vacnet`, `${revs.resized}:house.vacnet`], repo).status).toBe(0);
    const json = compareJson(`${revs.base}:house.vacnet`, 'long.vacnet');
    expect(json.inlets.find((i) => i.name === 'bedroom')!.regression).toBe(true);
    expect(json.findings.new.map((f) => f.code)).toContain('starved-inlet');
    // Back again (to the base revision and its stronger catalog): the finding is resolved, and nothing regressed.
    const back = compareJson('long.vacnet', `${revs.base}:house.vacnet`);
    expect(back.findings.resolved.map((f) => f.code)).toContain('starved-inlet');
    expect(back.regressions).toEqual([]);
  });

  it('markdown for a pull request: a summary line, then tables', () => {
    const run = runBin(['compare', '--format', 'markdown', `${revs.base}:house.vacnet`, `${revs.inlet}:house.vacnet`], repo);
    expect(run.status).toBe(0);
    const lines = run.stdout.split('\n');
    expect(lines[0]).toBe(`### vacnet compare: \`${revs.base}:house.vacnet\` → \`${revs.inlet}:house.vacnet\` (Fixture house)`);
    expect(lines[2]).toMatch(/^\*\*No regressions\.\*\* 1 element changed, 1 added, 0 removed; worst inlet bedroom /);
    expect(run.stdout).toContain('| changed | pipe upstairs: size 2 in -> 1-1/2 in |');
    expect(run.stdout).toContain('| added | inlet hall-1: on trunk at 5 ft room "Hall" |');
    expect(run.stdout).toMatch(/^\| bedroom \| \d\.\d+ inHg \| \d\.\d+ inHg \| -0\.\d+ inHg \| 4\.00 inHg \| {2}\|$/m);
    expect(run.stdout).toMatch(/^\| hall-1 \| - \| \d\.\d+ inHg \| new \| 4\.00 inHg \|/m);
  });

  it('usage errors exit 2: an unknown revision, a path outside the repository, a file on neither side', () => {
    const unknown = runBin(['compare', 'no-such-branch:house.vacnet', 'house.vacnet'], repo);
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/no-such-branch: not a revision/);
    expect(runBin(['compare', `${revs.base}:/etc/x.vacnet`, 'house.vacnet'], repo).status).toBe(2);
    expect(runBin(['compare', `${revs.base}:nothing.vacnet`, 'nothing.vacnet'], repo).status).toBe(2);
  });

  it('a file that did not exist at the old revision compares as everything added', () => {
    const c = compareJson(`${revs.base}:same.vacnet`, 'same.vacnet');
    expect(c.elements.filter((e) => e.change === 'added').map((e) => `${e.kind} ${e.name}`)).toContain('inlet bedroom');
  });
});

describe('vacnet show as git text conversion', () => {
  it('git diff shows the computed results beside the text, with the old revision analysed against its catalog', () => {
    writeFileSync(join(repo, '.gitattributes'), '*.vacnet diff=vacnet\n');
    gitIn('config', 'diff.vacnet.textconv', `"${process.execPath}" "${BIN}" show`);
    writeFileSync(join(repo, 'house.vacnet'), readFileSync(join(repo, 'house.vacnet'), 'utf8').replace('size 1-1/2 in', 'size 2 in'));
    const diff = gitIn('diff', 'house.vacnet');
    expect(diff).toContain('-  pipe upstairs from hall to landing spec pvc-2 size 1-1/2 in length 10 ft up joins wye 45 deg');
    expect(diff).toContain(' // ---- vacnet: computed results (not part of the file) ----');
    // Both versions analysed (no unresolved catalog on the old side): the bedroom's line changes.
    expect(diff).toMatch(/^-\/\/ inlet bedroom: \d\.\d+ inHg at the tool in its worst case \(needs 4\.00 inHg(, SHORT)?\), /m);
    expect(diff).toMatch(/^\+\/\/ inlet bedroom: \d\.\d+ inHg at the tool in its worst case \(needs 4\.00 inHg(, SHORT)?\), /m);
    expect(diff).not.toContain('unresolved-reference');
    gitIn('checkout', '--', 'house.vacnet');
  });

  it('vacnet show prints the text unchanged, then the results as comments; a broken file still prints', () => {
    const run = runBin(['show', 'house.vacnet'], repo);
    expect(run.status).toBe(0);
    const text = readFileSync(join(repo, 'house.vacnet'), 'utf8');
    expect(run.stdout.startsWith(text)).toBe(true);
    const results = run.stdout.slice(text.length).trimEnd().split('\n');
    expect(results[0]).toBe('// ---- vacnet: computed results (not part of the file) ----');
    expect(results.every((line) => line.startsWith('// '))).toBe(true);
    expect(results.some((line) => line.startsWith('// producer garage.producer: '))).toBe(true);
    writeFileSync(join(repo, 'broken.vacnet'), 'system "x" {\n  pipe\n');
    const broken = runBin(['show', 'broken.vacnet'], repo);
    expect(broken.status).toBe(0);
    expect(broken.stdout).toContain('// error syntax-error');
    expect(runBin(['show', 'missing.vacnet'], repo).status).toBe(2);
  });
});
