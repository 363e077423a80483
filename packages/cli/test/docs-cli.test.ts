import { spawnSync } from 'node:child_process';
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BIN, FIXTURES, REPO_ROOT, runBin } from './run-bin.js';

// docs/cli.md and the example workflow docs/ci/vacnet-check.yml stay true:
// every option the reference lists exists in the command's --help and the
// other way round, the workflow only uses options that exist, and its
// compare step, run by bash as a CI runner runs it (bash -eo pipefail),
// posts the comparison and fails on a regression.

const reference = readFileSync(join(REPO_ROOT, 'docs/cli.md'), 'utf8');
const workflow = readFileSync(join(REPO_ROOT, 'docs/ci/vacnet-check.yml'), 'utf8');
const COMMANDS = ['check', 'fmt', 'compare', 'report', 'init'] as const;

/** The long options `vacnet <command> --help` lists, without --help itself. */
function helpOptions(command: string): string[] {
  const help = runBin([command, '--help']).stdout;
  return [...help.matchAll(/^ {2}(?:-\w, )?(--[a-z-]+)/gm)].map((m) => m[1]!).filter((o) => o !== '--help');
}

/** The long options in the options table of a command's section of docs/cli.md. */
function documentedOptions(command: string): string[] {
  const section = reference.split(/^## /m).find((s) => s.startsWith(`vacnet ${command}\n`)) ?? '';
  return [...section.matchAll(/^\| `(?:-\w, )?(--[a-z-]+)/gm)].map((m) => m[1]!);
}

describe('docs/cli.md', () => {
  for (const command of COMMANDS) {
    it(`lists exactly the options of vacnet ${command}`, () => {
      const documented = documentedOptions(command);
      expect(documented.length).toBeGreaterThan(0);
      expect(documented.sort()).toEqual(helpOptions(command).sort());
    });
  }

  it('is linked from the README, which names every command', () => {
    const readme = readFileSync(join(REPO_ROOT, 'README.md'), 'utf8');
    expect(readme).toContain('](docs/cli.md)');
    for (const command of [...COMMANDS, 'show']) expect(readme).toContain(`vacnet ${command}`);
  });
});

/** The `run: |` block of a named step, dedented. */
function stepScript(name: string): string {
  const lines = workflow.split('\n');
  const start = lines.findIndex((l) => l.trim() === `- name: ${name}`);
  expect(start, `no step named ${name}`).toBeGreaterThan(-1);
  const run = lines.findIndex((l, i) => i > start && /^\s+run: \|$/.test(l));
  const indent = lines[run + 1]!.match(/^\s*/)![0].length;
  const body: string[] = [];
  for (const line of lines.slice(run + 1)) {
    if (line.trim() !== '' && line.match(/^\s*/)![0].length < indent) break;
    body.push(line.slice(indent));
  }
  return body.join('\n');
}

describe('docs/ci/vacnet-check.yml', () => {
  it('uses only commands and options that exist', () => {
    const uses = [...workflow.matchAll(/npx vacnet (\w+)([^\n|>]*)/g)];
    expect(uses.map((m) => m[1])).toEqual(expect.arrayContaining(['check', 'compare']));
    for (const [, command, rest] of uses) {
      const options = helpOptions(command!);
      for (const option of rest!.match(/--[a-z-]+/g) ?? []) expect(options, `vacnet ${command} ${option}`).toContain(option);
    }
    expect(workflow).toMatch(/--format sarif/);
    expect(workflow).toMatch(/--format markdown/);
  });

  describe('its compare step, run by bash in a repository with a pull request', () => {
    let repo: string;
    let fakeBin: string;
    const git = (...args: string[]) => {
      const run = spawnSync('git', args, { cwd: repo, encoding: 'utf8' });
      expect(run.status, run.stderr).toBe(0);
      return run.stdout.trim();
    };
    beforeAll(() => {
      repo = mkdtempSync(join(tmpdir(), 'vacnet-workflow-'));
      fakeBin = join(repo, '.fake-bin');
      mkdirSync(fakeBin);
      // `npx vacnet ...` runs the built bin; `gh pr comment N --body-file F` keeps the body.
      writeFileSync(join(fakeBin, 'npx'), `#!/bin/sh\nshift\nexec "${process.execPath}" "${BIN}" "$@"\n`);
      writeFileSync(join(fakeBin, 'gh'), '#!/bin/sh\ncp "$5" posted-comment.md\necho "$3" > posted-pr\n');
      chmodSync(join(fakeBin, 'npx'), 0o755);
      chmodSync(join(fakeBin, 'gh'), 0o755);
      git('init', '-q');
      git('config', 'user.email', 'test@example.com');
      git('config', 'user.name', 'Test');
      writeFileSync(join(repo, '.gitignore'), '.fake-bin\nposted-*\ncomparison.md\nregressions\n');
      writeFileSync(join(repo, 'house.vacnet'), readFileSync(join(FIXTURES, 'clean-house.vacnet'), 'utf8'));
      git('add', '.');
      git('commit', '-q', '-m', 'base');
    });
    afterAll(() => rmSync(repo, { recursive: true, force: true }));

    const runStep = (base: string) =>
      spawnSync('bash', ['--noprofile', '--norc', '-eo', 'pipefail', '-c', stepScript('Compare with the base branch')], {
        cwd: repo,
        encoding: 'utf8',
        env: { ...process.env, PATH: `${fakeBin}:${process.env.PATH}`, BASE: base, PR: '42', GH_TOKEN: 'unused', NO_COLOR: '1' },
        timeout: 120_000,
      });

    it('posts the markdown comparison of each changed system and passes without regressions', () => {
      const base = git('rev-parse', 'HEAD');
      const text = readFileSync(join(repo, 'house.vacnet'), 'utf8').replace('inlet bedroom at landing room "Bedroom"', 'inlet bedroom at landing room "Bedroom"\n  inlet study on upstairs at 5 ft room "Study"');
      writeFileSync(join(repo, 'house.vacnet'), text);
      git('commit', '-q', '-am', 'a study');
      const run = runStep(base);
      expect(run.status, run.stderr + run.stdout).toBe(0);
      expect(readFileSync(join(repo, 'posted-pr'), 'utf8').trim()).toBe('42');
      const comment = readFileSync(join(repo, 'posted-comment.md'), 'utf8');
      expect(comment).toContain(`### vacnet compare: \`${base}:house.vacnet\` → \`house.vacnet\``);
      expect(comment).toContain('| added | inlet study: on upstairs at 5 ft room "Study" |');
    });

    it('fails the step after posting when an inlet falls short', () => {
      const base = git('rev-parse', 'HEAD');
      rmSync(join(repo, 'posted-comment.md'));
      writeFileSync(join(repo, 'house.vacnet'), readFileSync(join(repo, 'house.vacnet'), 'utf8').replace('length 10 ft up', 'length 600 ft up'));
      git('commit', '-q', '-am', 'a very long riser');
      const run = runStep(base);
      expect(run.status).toBe(1);
      expect(run.stdout).toContain('Regressions in: house.vacnet');
      expect(readFileSync(join(repo, 'posted-comment.md'), 'utf8')).toMatch(/\*\*\d+ regressions?\.\*\*/);
    });
  });
});
