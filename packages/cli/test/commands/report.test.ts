import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT, runBin } from '../run-bin.js';

// `vacnet report` through the built bin, as a pipeline runs it: the files it
// writes, what it prints, and the exit codes 0 written / 1 written with
// errors in the file / 2 usage or I/O.

let work: string;
const HOUSE = 'examples/detached-house.vacnet';
const TYPO = 'packages/cli/test/fixtures/unresolved-hose.vacnet';
// A fixed report time (the reproducible-builds SOURCE_DATE_EPOCH convention): 2025-05-01 10:00 UTC.
const FIXED = { env: { SOURCE_DATE_EPOCH: '1746093600' } };

beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'vacnet-report-'));
});
afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

describe('vacnet report (bin)', () => {
  it('--out x.html: writes one self-contained page, says so, exits 0', () => {
    const out = join(work, 'house.html');
    const run = runBin(['report', HOUSE, '--out', out], REPO_ROOT, FIXED);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^Wrote .*house\.html for "Detached house, two storeys and basement": 0 errors, 0 warnings\.\n$/);
    const html = readFileSync(out, 'utf8');
    expect(html).toMatch(/^<!doctype html>/);
    expect(html).toContain('<time datetime="2025-05-01T10:00:00.000Z">');
    expect(html).toContain(`vacnet ${JSON.parse(readFileSync(join(REPO_ROOT, 'packages/cli/package.json'), 'utf8')).version}`);
    expect(html).toContain('<code>examples/detached-house.vacnet</code>');
    expect(html.match(/<svg /g)).toHaveLength(2);
  });

  it('the same file and time give the same report, byte for byte', () => {
    const a = runBin(['report', HOUSE], REPO_ROOT, FIXED);
    const b = runBin(['report', HOUSE], REPO_ROOT, FIXED);
    expect(a.status).toBe(0);
    expect(a.stdout).toBe(b.stdout);
    expect(a.stdout).toMatch(/^<!doctype html>/);
  });

  it('the appendix carries the rule pages of the accepted findings, found beside the installed command line', () => {
    const run = runBin(['report', HOUSE], REPO_ROOT, FIXED);
    const page = readFileSync(join(REPO_ROOT, 'docs/rules/missing-cleanout.md'), 'utf8');
    const title = /^\*\*(.+)\*\*$/m.exec(page)![1]!;
    expect(run.stdout).toContain('<article class="vn-rule-page" id="rule-missing-cleanout">');
    expect(run.stdout).toContain(`<p><strong>${title}</strong></p>`);
  });

  it('--out x.md: the Markdown and its two figures beside it', () => {
    const folder = join(work, 'review');
    mkdirSync(folder);
    const run = runBin(['report', HOUSE, '--out', join(folder, 'house.md')], REPO_ROOT, FIXED);
    expect(run.status).toBe(0);
    expect(readdirSync(folder).sort()).toEqual(['house.md', 'house.producer-curve.svg', 'house.schematic.svg']);
    const md = readFileSync(join(folder, 'house.md'), 'utf8');
    expect(md).toMatch(/^# Detached house, two storeys and basement\n/);
    expect(md).toContain('](house.producer-curve.svg)');
    expect(md).toContain('](house.schematic.svg)');
    expect(readFileSync(join(folder, 'house.schematic.svg'), 'utf8')).toMatch(/^<svg [^>]*class="vn-svg vn-schematic"/);
  });

  it('Markdown in a checkout: rule codes link to docs/rules relative to the report', () => {
    const folder = join(REPO_ROOT, 'tmp', `report-test-${process.pid}`);
    mkdirSync(folder, { recursive: true });
    try {
      const run = runBin(['report', HOUSE, '--out', join(folder, 'r.md')], REPO_ROOT, FIXED);
      expect(run.status).toBe(0);
      expect(readFileSync(join(folder, 'r.md'), 'utf8')).toContain('[`missing-cleanout`](../../docs/rules/missing-cleanout.md)');
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it('--format markdown to stdout: no figures written, no image links', () => {
    const run = runBin(['report', join(REPO_ROOT, HOUSE), '--format', 'markdown'], work, FIXED);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^# Detached house/);
    expect(run.stdout).not.toContain('![');
    expect(readdirSync(work).filter((f) => f.endsWith('.svg'))).toEqual([]);
  });

  it('a file with an error: the report is still written, with the error, and the exit code is 1', () => {
    const out = join(work, 'typo.html');
    const run = runBin(['report', TYPO, '--out', out], REPO_ROOT, FIXED);
    expect(run.status).toBe(1);
    expect(run.stdout).toMatch(/: 1 error, 0 warnings\.\n$/);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('data-code="unresolved-reference"');
    expect(html).toContain('The airflow analysis runs once the errors listed under Findings are fixed');
  });

  it('exit 2: a file that cannot be read, a catalog without a system, an output that cannot be written, a format that cannot be told', () => {
    const missing = runBin(['report', 'no-such-file.vacnet'], work);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toBe('vacnet report: cannot read no-such-file.vacnet: no such file.\n');
    expect(missing.stdout).toBe('');

    const catalog = runBin(['report', 'examples/catalog/equipment.vacnet']);
    expect(catalog.status).toBe(2);
    expect(catalog.stderr).toMatch(/holds no system to report on/);

    const unwritable = runBin(['report', HOUSE, '--out', join(work, 'no', 'such', 'folder', 'r.html')]);
    expect(unwritable.status).toBe(2);
    expect(unwritable.stderr).toMatch(/^vacnet report: cannot write the report: ENOENT/);

    const unknown = runBin(['report', HOUSE, '--out', join(work, 'r.pdf')]);
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/cannot tell the format from .*r\.pdf/);
    expect(existsSync(join(work, 'r.pdf'))).toBe(false);

    const clash = runBin(['report', HOUSE, '--out', join(work, 'r.html'), '--format', 'markdown']);
    expect(clash.status).toBe(2);

    const usage = runBin(['report']);
    expect(usage.status).toBe(2);
    expect(usage.stderr).toMatch(/missing required argument 'file'/);
  });

  it('--format with an explicit name: any extension', () => {
    const out = join(work, 'report.txt');
    const run = runBin(['report', HOUSE, '--out', out, '--format', 'markdown'], REPO_ROOT, FIXED);
    expect(run.status).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/^# Detached house/);
  });

  it('report --help documents the exit codes and the Markdown figures', () => {
    const run = runBin(['report', '--help']);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Exit codes:[\s\S]*0 {2}report written[\s\S]*1 {2}report written, but the file has errors[\s\S]*2 {2}usage error/);
    expect(run.stdout).toContain('report.producer-curve.svg and report.schematic.svg');
  });

  it('applies the project settings vacnet check applies (vacnet.json above the file, --settings, --no-settings)', () => {
    const folder = join(work, 'with-settings');
    cpSync(join(REPO_ROOT, 'examples'), folder, { recursive: true });
    // A stricter carrying velocity than any pipe of the house meets, as an error: the report must list the findings.
    const strict = { rules: { 'slow-carrying-velocity': { severity: 'error', 'min-velocity': '9000 fpm' } } };
    writeFileSync(join(folder, 'vacnet.json'), JSON.stringify(strict));
    const found = runBin(['report', 'detached-house.vacnet', '--format', 'markdown'], folder, FIXED);
    const check = runBin(['check', 'detached-house.vacnet', '--format', 'json'], folder, FIXED);
    const errors = JSON.parse(check.stdout).files[0].diagnostics.filter((d: { severity: string }) => d.severity === 'error').length;
    expect(errors).toBeGreaterThan(0);
    expect(found.status).toBe(1);
    expect(found.stdout.match(/slow-carrying-velocity/g)?.length ?? 0).toBeGreaterThanOrEqual(errors);
    const none = runBin(['report', 'detached-house.vacnet', '--format', 'markdown', '--no-settings'], folder, FIXED);
    expect(none.status).toBe(0);
    writeFileSync(join(work, 'lenient.json'), '{}');
    const given = runBin(['report', 'detached-house.vacnet', '--format', 'markdown', '--settings', join(work, 'lenient.json')], folder, FIXED);
    expect(given.status).toBe(0);
    const missing = runBin(['report', 'detached-house.vacnet', '--settings', join(work, 'absent.json')], folder, FIXED);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/absent\.json: no such settings file/);
  });

  it('a copied example outside the checkout reports the same numbers (no dependence on the working folder)', () => {
    const folder = join(work, 'copy');
    cpSync(join(REPO_ROOT, 'examples'), folder, { recursive: true });
    const here = runBin(['report', HOUSE, '--format', 'markdown'], REPO_ROOT, FIXED);
    const there = runBin(['report', 'detached-house.vacnet', '--format', 'markdown'], folder, FIXED);
    expect(there.status).toBe(0);
    const body = (md: string) => md.slice(md.indexOf('## 1. Summary'), md.indexOf('## 8. Findings'));
    expect(body(there.stdout)).toBe(body(here.stdout));
  });
});
