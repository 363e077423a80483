import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runBin } from './run-bin.js';

// Exit codes as documented in the README: 0 clean, 1 errors, 2 usage or I/O error.
describe('vacnet (bin): help, version, usage errors', () => {
  it('--version prints the package version and exits 0', () => {
    const manifest = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string };
    const run = runBin(['--version']);
    expect(run.status).toBe(0);
    expect(run.stdout.trim()).toBe(manifest.version);
  });

  it('--help lists the check command and exits 0', () => {
    const run = runBin(['--help']);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Usage: vacnet/);
    expect(run.stdout).toMatch(/^\s+check\b/m);
  });

  it('check --help documents the line format and the exit codes', () => {
    const run = runBin(['check', '--help']);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('path:line:column severity code message');
    expect(run.stdout).toMatch(/Exit codes:[\s\S]*0 [\s\S]*1 [\s\S]*2 /);
  });

  it('an unknown option is a usage error: exit 2, message on stderr, nothing on stdout', () => {
    const run = runBin(['check', '--no-such-option', 'examples']);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/unknown option '--no-such-option'/);
    expect(run.stdout).toBe('');
  });

  it('an unknown command is a usage error (exit 2)', () => {
    const run = runBin(['chek', 'examples']);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/unknown command 'chek'/);
  });

  it('no command at all shows help on stderr and exits 2', () => {
    const run = runBin([]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/Usage: vacnet/);
  });

  it('check without paths is a usage error (exit 2)', () => {
    const run = runBin(['check']);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/missing required argument 'paths'/);
  });

  it('an unknown --format is a usage error (exit 2)', () => {
    const run = runBin(['check', '--format', 'xml', 'examples']);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/xml/);
  });
});
