import { spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { progressLine } from '../../src/progress-line.js';
import { colourWanted } from '../../src/terminal-colour.js';
import { BIN, FIXTURES, runBin, SUMMARY_LINE } from '../run-bin.js';

// Gating a build pipeline on `vacnet check`, through the built bin: the exit
// codes (0 clean, 1 findings at the failing level, 2 usage or I/O),
// --max-warnings, --quiet, globs, colour and the progress line, and the
// project settings file (docs/settings.md) changing severities and
// thresholds, with its own problems located in it.

interface JsonOutput {
  files: { path: string; diagnostics: { severity: string; code: string; line: number; column: number; message: string }[] }[];
  summary: { files: number; errors: number; warnings: number; infos: number };
}
const json = (stdout: string) => JSON.parse(stdout) as JsonOutput;

let work: string;
beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'vacnet-gate-'));
  // One warning (missing-cleanout), no errors.
  cpSync(join(FIXTURES, 'clean-house.vacnet'), join(work, 'house.vacnet'));
  // One error.
  cpSync(join(FIXTURES, 'unresolved-hose.vacnet'), join(work, 'broken.vacnet'));
  // The tour system: fast-velocity warning on its riser, 7949 fpm against the 7874 fpm default.
  mkdirSync(join(work, 'project/.git'), { recursive: true });
  mkdirSync(join(work, 'project/floors/east'), { recursive: true });
  cpSync(join(FIXTURES, 'readme-small-office.vacnet'), join(work, 'project/floors/east/office.vacnet'));
  // Files for globs.
  for (const path of ['tree/a/one.vacnet', 'tree/a/b/two.vacnet', 'tree/c/three.vacnet', 'tree/.hidden/four.vacnet']) {
    mkdirSync(join(work, path, '..'), { recursive: true });
    cpSync(join(FIXTURES, 'clean-house.vacnet'), join(work, path));
  }
  writeFileSync(join(work, 'tree/a/notes.txt'), 'not a system\n');
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('exit codes, --max-warnings and --quiet', () => {
  it('warnings alone exit 0; --max-warnings 1 allows one; --max-warnings 0 fails with 1', () => {
    expect(runBin(['check', 'house.vacnet'], work).status).toBe(0);
    expect(runBin(['check', '--max-warnings', '1', 'house.vacnet'], work).status).toBe(0);
    const over = runBin(['check', '--max-warnings', '0', 'house.vacnet'], work);
    expect(over.status).toBe(1);
    expect(over.stdout.trimEnd().split('\n').at(-1)).toMatch(SUMMARY_LINE);
  });

  it('an error exits 1 whatever --max-warnings allows', () => {
    expect(runBin(['check', '--max-warnings', '100', 'broken.vacnet'], work).status).toBe(1);
  });

  it('a --max-warnings that is not a whole number is a usage error (exit 2)', () => {
    for (const bad of ['-1', 'many', '1.5']) {
      const run = runBin(['check', '--max-warnings', bad, 'house.vacnet'], work);
      expect(run.status, bad).toBe(2);
      expect(run.stderr).toMatch(/whole number/);
    }
  });

  it('--quiet prints the errors and the summary only, in every format; warnings still count for --max-warnings', () => {
    const text = runBin(['check', '--quiet', 'house.vacnet', 'broken.vacnet'], work);
    const lines = text.stdout.trimEnd().split('\n');
    expect(lines.filter((l) => / (warning|info) /.test(l) && !l.startsWith('Checked'))).toEqual([]);
    expect(lines.filter((l) => / error /.test(l))).toHaveLength(1);
    expect(lines.at(-1)).toBe('Checked 2 files: 1 error, 1 warning, 1 info.');
    expect(lines.some((l) => l.startsWith('  '))).toBe(false);
    const quietJson = json(runBin(['check', '--quiet', '--format', 'json', 'house.vacnet', 'broken.vacnet'], work).stdout);
    expect(quietJson.files.flatMap((f) => f.diagnostics.map((d) => d.severity))).toEqual(['error']);
    expect(runBin(['check', '--quiet', '--max-warnings', '0', 'house.vacnet'], work).status).toBe(1);
  });

  it('an unreadable file gets its own finding, the others are still checked, and the exit code is 2', () => {
    mkdirSync(join(work, 'mixed'));
    cpSync(join(FIXTURES, 'clean-house.vacnet'), join(work, 'mixed/ok.vacnet'));
    symlinkSync(join(work, 'mixed/gone.vacnet'), join(work, 'mixed/dangling.vacnet'));
    const text = runBin(['check', 'mixed'], work);
    expect(text.status).toBe(2);
    expect(text.stdout).toMatch(/^mixed\/dangling\.vacnet:1:1 error file-unreadable Cannot read this file: no such file\.$/m);
    expect(text.stdout).toMatch(/^mixed\/ok\.vacnet:\d+:\d+ warning missing-cleanout /m);
    const output = json(runBin(['check', '--format', 'json', 'mixed'], work).stdout);
    expect(output.files.map((f) => f.path)).toEqual(['mixed/dangling.vacnet', 'mixed/ok.vacnet']);
    expect(runBin(['check', '--format', 'github', 'mixed'], work).stdout).toMatch(/^::error file=mixed\/dangling\.vacnet,line=1,col=1,endLine=1,endColumn=1,title=file-unreadable::/m);
  });
});

describe('globs', () => {
  const paths = (args: string[]) => json(runBin(['check', '--format', 'json', ...args], work).stdout).files.map((f) => f.path);

  it('** matches any depth (none included), * and ? one segment; dot-folders and other files are left out', () => {
    expect(paths(['tree/**/*.vacnet'])).toEqual(['tree/a/b/two.vacnet', 'tree/a/one.vacnet', 'tree/c/three.vacnet']);
    expect(paths(['tree/*/*.vacnet'])).toEqual(['tree/a/one.vacnet', 'tree/c/three.vacnet']);
    expect(paths(['tree/?/t*.vacnet'])).toEqual(['tree/c/three.vacnet']);
    expect(paths(['tree/{a,c}/[ot]*.vacnet'])).toEqual(['tree/a/one.vacnet', 'tree/c/three.vacnet']);
  });

  it('a glob that matches no .vacnet file is a usage error (exit 2)', () => {
    const run = runBin(['check', 'tree/**/*.txt'], work);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/tree\/\*\*\/\*\.txt: no \.vacnet files match/);
  });
});

describe('colour', () => {
  // no-color.org: NO_COLOR present and not empty disables colour; force-color.org: FORCE_COLOR enables it.
  it('follows NO_COLOR, FORCE_COLOR and the terminal', () => {
    expect(colourWanted({}, true)).toBe(true);
    expect(colourWanted({}, false)).toBe(false);
    expect(colourWanted({ NO_COLOR: '1' }, true)).toBe(false);
    expect(colourWanted({ NO_COLOR: '' }, true)).toBe(true);
    expect(colourWanted({ FORCE_COLOR: '1' }, false)).toBe(true);
    expect(colourWanted({ FORCE_COLOR: '0' }, true)).toBe(false);
    expect(colourWanted({ NO_COLOR: '1', FORCE_COLOR: '1' }, true)).toBe(false);
    expect(colourWanted({ TERM: 'dumb' }, true)).toBe(false);
  });

  it('FORCE_COLOR colours a pipe; the text without its escapes is the plain output', () => {
    const plain = runBin(['check', 'house.vacnet', 'broken.vacnet'], work).stdout;
    const coloured = runBin(['check', 'house.vacnet', 'broken.vacnet'], work, { env: { NO_COLOR: undefined, FORCE_COLOR: '1' } }).stdout;
    expect(coloured).toContain('\u001b[31merror\u001b[39m');
    expect(coloured).toContain('\u001b[33mwarning\u001b[39m');
    expect(coloured.replace(/\u001b\[\d+m/g, '')).toBe(plain);
  });
});

describe('on a terminal (a pseudo-terminal from script(1))', () => {
  const hasScript = spawnSync('script', ['--version'], { encoding: 'utf8' }).status === 0;
  const onTerminal = (args: string[]) => {
    const command = [process.execPath, BIN, ...args].map((a) => `'${a.replace(/'/g, `'\\''`)}'`).join(' ');
    const env: Record<string, string | undefined> = { ...process.env, TERM: 'xterm' };
    delete env.NO_COLOR;
    delete env.FORCE_COLOR;
    return spawnSync('script', ['-qec', command, '/dev/null'], { cwd: work, encoding: 'utf8', env, timeout: 120_000 });
  };

  it.skipIf(!hasScript)('colour is on by default, and many files show a progress line on stderr that is cleared', () => {
    mkdirSync(join(work, 'many'));
    for (let i = 0; i < 12; i++) cpSync(join(FIXTURES, 'clean-house.vacnet'), join(work, `many/house-${String(i).padStart(2, '0')}.vacnet`));
    const run = onTerminal(['check', 'many']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('\u001b[33mwarning\u001b[39m');
    expect(run.stdout).toMatch(/\r\u001b\[KChecking 0\/12 files\.\.\./);
    expect(run.stdout).toMatch(/\r\u001b\[KChecking 12\/12 files\.\.\.\r\u001b\[K/);
  });
});

describe('progressLine', () => {
  it('stays silent off a terminal and for few files; throttles updates; clears what it wrote', () => {
    const written: string[] = [];
    const write = (t: string) => void written.push(t);
    progressLine(write, false, 100).update(1, 100);
    progressLine(write, true, 9).update(1, 9);
    expect(written).toEqual([]);
    let now = 0;
    const line = progressLine(write, true, 100, () => now);
    line.update(0, 100);
    now = 50;
    line.update(1, 100); // within 100 ms: skipped
    now = 150;
    line.update(2, 100);
    line.update(100, 100); // the last one always shows
    line.clear();
    expect(written).toEqual(['\r\u001b[KChecking 0/100 files...', '\r\u001b[KChecking 2/100 files...', '\r\u001b[KChecking 100/100 files...', '\r\u001b[K']);
  });
});

describe('the project settings file', () => {
  const office = 'project/floors/east/office.vacnet';
  const setSettings = (text: string | undefined) => {
    if (text === undefined) rmSync(join(work, 'project/vacnet.json'), { force: true });
    else writeFileSync(join(work, 'project/vacnet.json'), text);
  };
  const fast = (args: string[] = []) => {
    const run = runBin(['check', '--format', 'json', ...args, office], work);
    const output = json(run.stdout);
    return { run, output, fast: output.files[0]!.diagnostics.filter((d) => d.code === 'fast-velocity').map((d) => d.severity) };
  };

  it('without one, fast-velocity is a warning (exit 0)', () => {
    setSettings(undefined);
    const { run, fast: found } = fast();
    expect(found).toEqual(['warning']);
    expect(run.status).toBe(0);
  });

  it('"severity": "error" found two folders up makes it an error (exit 1); --no-settings ignores the file', () => {
    setSettings('{ "rules": { "fast-velocity": { "severity": "error" } } }');
    const { run, fast: found } = fast();
    expect(found).toEqual(['error']);
    expect(run.status).toBe(1);
    expect(fast(['--no-settings']).fast).toEqual(['warning']);
  });

  it('a threshold above the riser velocity clears the finding; --settings uses another file', () => {
    setSettings('{ "rules": { "fast-velocity": { "limit": "8500 fpm" } } }');
    expect(fast().fast).toEqual([]);
    writeFileSync(join(work, 'strict.json'), '{ "rules": { "fast-velocity": { "severity": "error" } } }');
    expect(fast(['--settings', 'strict.json']).fast).toEqual(['error']);
    const missing = runBin(['check', '--settings', 'nope.json', office], work);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/nope\.json: no such settings file/);
  });

  it('its problems are findings located in vacnet.json (1-based), errors, listed after the files they govern', () => {
    const text = '{\n  "rules": {\n    "fast-velocity": { "limit": "8500 kg" },\n    "fast-velocty": {}\n  }\n}\n';
    setSettings(text);
    const run = runBin(['check', office], work);
    expect(run.status).toBe(1);
    const lines = run.stdout.split('\n');
    expect(lines).toContain(`project/vacnet.json:3:33 error settings-invalid-value fast-velocity limit: 'kg' is not a unit of velocity (use one of fpm, ft/s, m/s).`);
    expect(lines.some((l) => l.startsWith(`project/vacnet.json:4:5 error settings-unknown-name No design rule has the code 'fast-velocty' (did you mean 'fast-velocity'?)`))).toBe(true);
    expect(lines.findIndex((l) => l.startsWith(office))).toBeLessThan(lines.findIndex((l) => l.startsWith('project/vacnet.json')));
    expect(lines.filter(Boolean).at(-1)).toBe('Checked 2 files: 2 errors, 1 warning, 0 infos.');
    setSettings(undefined);
  });
});
