import { spawnSync } from 'node:child_process';
import { chmodSync, cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FIXTURES, REPO_ROOT, runBin } from '../run-bin.js';

// `vacnet fmt` through the built bin: idempotent and keeping every comment on
// every example; --check prints a diff that GNU patch applies and exits 1
// when a file would change; --write replaces files whole (a new inode by
// rename, permissions kept, no temporary file left) and never touches a
// file with syntax errors.

/** Every .vacnet file under examples/ and the CLI fixtures. */
function allExamples(): string[] {
  const found: string[] = [];
  const walk = (folder: string) => {
    for (const entry of readdirSync(folder, { withFileTypes: true })) {
      const full = join(folder, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name.endsWith('.vacnet')) found.push(full);
    }
  };
  walk(join(REPO_ROOT, 'examples'));
  walk(FIXTURES);
  return found.sort();
}

/** The comments of a .vacnet text in order, each with its inner whitespace collapsed (strings are skipped, as the grammar's terminals say). */
function comments(text: string): string[] {
  const found: string[] = [];
  const token = /"(?:\\.|[^"\\\r\n])*"|\/\*[\s\S]*?\*\/|\/\/[^\r\n]*/g;
  for (const match of text.matchAll(token)) {
    if (!match[0].startsWith('"')) found.push(match[0].replace(/\s+/g, ' ').trim());
  }
  return found;
}

let work: string;
beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'vacnet-fmt-'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('vacnet fmt on every example', () => {
  // All examples copied (folders kept, so `use` paths still resolve), formatted in one run, then checked in one run.
  const examples = allExamples();
  const copyOf = (example: string) => join(work, 'all', relative(REPO_ROOT, example));
  const SYNTAX_ERROR = 'examples/invalid/syntax-error.vacnet';
  let written: ReturnType<typeof runBin>;
  let checked: ReturnType<typeof runBin>;
  beforeAll(() => {
    for (const example of examples) {
      mkdirSync(join(copyOf(example), '..'), { recursive: true });
      cpSync(example, copyOf(example));
    }
    written = runBin(['fmt', '--write', 'all'], work);
    checked = runBin(['fmt', '--check', 'all'], work);
  }, 180_000);

  it('finds the examples, formats all but the one with a syntax error (exit 1 for it)', () => {
    expect(examples.length).toBeGreaterThan(20);
    expect(written.status).toBe(1);
    expect(written.stderr).toContain(`all/${SYNTAX_ERROR}: not formatted: fix its syntax errors first`);
    expect(written.stderr.match(/not formatted/g)).toHaveLength(1);
  });

  it('is idempotent: a second run finds nothing to change (--check prints no diff)', () => {
    expect(checked.stdout).toBe('');
    expect(checked.stderr).toContain('not formatted');
  });

  for (const example of examples) {
    const name = relative(REPO_ROOT, example);
    it(`${name}: every comment kept, the same words in the same order`, () => {
      const original = readFileSync(example, 'utf8');
      const formatted = readFileSync(copyOf(example), 'utf8');
      if (name === SYNTAX_ERROR) {
        expect(formatted).toBe(original);
        return;
      }
      expect(comments(formatted)).toEqual(comments(original));
      // Formatting changes layout only.
      const words = (text: string) => text.replace(/\/\*[\s\S]*?\*\/|\/\/[^\r\n]*/g, ' ').split(/\s+/).filter(Boolean);
      expect(words(formatted)).toEqual(words(original));
    });
  }

  it('prints the formatted text to stdout without flags, and leaves the file alone', () => {
    const example = join(REPO_ROOT, 'examples/detached-house.vacnet');
    const run = runBin(['fmt', example]);
    expect(run.status).toBe(0);
    expect(run.stdout).toBe(readFileSync(copyOf(example), 'utf8'));
  });
});

describe('vacnet fmt --check', () => {
  it('exits 0 with no output for a formatted file, 1 with a unified diff for one that would change', () => {
    const messy = join(work, 'messy.vacnet');
    const original = readFileSync(join(FIXTURES, 'clean-house.vacnet'), 'utf8');
    writeFileSync(messy, original);
    const formatted = runBin(['fmt', messy]).stdout;
    expect(formatted).not.toBe(original);

    const run = runBin(['fmt', '--check', 'messy.vacnet'], work);
    expect(run.status).toBe(1);
    expect(run.stdout.startsWith('--- a/messy.vacnet\n+++ b/messy.vacnet\n@@ ')).toBe(true);
    expect(run.stderr).toMatch(/1 of 1 file would be reformatted/);
    expect(readFileSync(messy, 'utf8')).toBe(original);

    // The diff is a real patch: GNU patch turns the file into the formatted text.
    writeFileSync(join(work, 'check.diff'), run.stdout);
    const patch = spawnSync('patch', ['-p1', '--quiet', '-i', 'check.diff'], { cwd: work, encoding: 'utf8' });
    expect(patch.status, patch.stderr).toBe(0);
    expect(readFileSync(messy, 'utf8')).toBe(formatted);

    const again = runBin(['fmt', '--check', 'messy.vacnet'], work);
    expect(again.status).toBe(0);
    expect(again.stdout).toBe('');
  });

  it('--check and --write together, or no paths, are usage errors (exit 2)', () => {
    expect(runBin(['fmt', '--check', '--write', 'x.vacnet'], work).status).toBe(2);
    expect(runBin(['fmt'], work).status).toBe(2);
    expect(runBin(['fmt', 'no-such.vacnet'], work).status).toBe(2);
  });
});

describe('vacnet fmt --write', () => {
  it('replaces a file whole by rename (new inode), keeps its permissions, leaves no temporary file', () => {
    const folder = join(work, 'write');
    mkdirSync(folder);
    const file = join(folder, 'house.vacnet');
    cpSync(join(FIXTURES, 'clean-house.vacnet'), file);
    chmodSync(file, 0o640);
    const expected = runBin(['fmt', file]).stdout;
    const before = statSync(file);
    const run = runBin(['fmt', '--write', 'write/house.vacnet'], work);
    expect(run.status, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/Formatted 1 of 1 file/);
    const after = statSync(file);
    expect(readFileSync(file, 'utf8')).toBe(expected);
    expect(after.ino).not.toBe(before.ino);
    expect(after.mode & 0o777).toBe(0o640);
    expect(readdirSync(folder)).toEqual(['house.vacnet']);

    // Already formatted: not rewritten at all.
    const again = runBin(['fmt', '--write', 'write/house.vacnet'], work);
    expect(again.status).toBe(0);
    expect(statSync(file).ino).toBe(after.ino);
  });

  it('never touches a file with syntax errors: reports them, exits 1, and still formats the others', () => {
    const folder = join(work, 'broken');
    mkdirSync(folder);
    const broken = join(folder, 'a-broken.vacnet');
    const good = join(folder, 'b-good.vacnet');
    const brokenText = readFileSync(join(REPO_ROOT, 'examples/invalid/syntax-error.vacnet'), 'utf8').replace('system', 'system   ');
    writeFileSync(broken, brokenText);
    cpSync(join(FIXTURES, 'clean-house.vacnet'), good);
    const before = statSync(broken);
    const run = runBin(['fmt', '--write', 'broken'], work);
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/^broken\/a-broken\.vacnet:\d+:\d+ error syntax-error /m);
    expect(run.stderr).toMatch(/broken\/a-broken\.vacnet: not formatted: fix its syntax errors first/);
    expect(readFileSync(broken, 'utf8')).toBe(brokenText);
    expect(statSync(broken).ino).toBe(before.ino);
    expect(statSync(broken).mtimeMs).toBe(before.mtimeMs);
    expect(runBin(['fmt', '--check', 'broken/b-good.vacnet'], work).status).toBe(0);
  });
});
