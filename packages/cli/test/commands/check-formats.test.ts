import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { escapeData, escapeProperty } from '../../src/formats/github.js';
import { FIXTURES, REPO_ROOT, runBin } from '../run-bin.js';
import { sarifValidator } from '../sarif-schema.js';

// The pipeline formats of `vacnet check`, through the built bin: SARIF
// 2.1.0 validated against the official schema (see sarif-schema.ts for its
// origin) and checked against the JSON format's findings, and the workflow
// annotation commands with their escaping.

interface JsonOutput {
  files: { path: string; diagnostics: { severity: string; code: string; message: string; line: number; column: number; endLine: number; endColumn: number }[] }[];
  summary: { files: number; errors: number; warnings: number; infos: number };
}

let work: string;
beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'vacnet-formats-'));
  mkdirSync(join(work, 'with space'));
  cpSync(join(FIXTURES, 'unresolved-hose.vacnet'), join(work, 'with space/unresolved hose.vacnet'));
  cpSync(join(FIXTURES, 'clean-house.vacnet'), join(work, 'clean-house.vacnet'));
  cpSync(join(FIXTURES, 'readme-small-office.vacnet'), join(work, 'office.vacnet'));
  // Characters the annotation properties must escape, in a file name.
  cpSync(join(FIXTURES, 'unresolved-hose.vacnet'), join(work, 'a,b:c%d.vacnet'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('vacnet check --format sarif', () => {
  const validate = sarifValidator();

  it('the validator is strict enough to fail: it refuses a log with a level SARIF does not have', () => {
    const bad = { version: '2.1.0', runs: [{ tool: { driver: { name: 'x' } }, results: [{ message: { text: 'm' }, level: 'info' }] }] };
    expect(validate(bad)).toBe(false);
  });

  it('is a valid SARIF 2.1.0 log for every example and fixture, with the findings of the JSON format', () => {
    const paths = ['examples', 'packages/cli/test/fixtures'];
    const run = runBin(['check', '--format', 'sarif', ...paths]);
    expect(run.status).toBe(1);
    const log = JSON.parse(run.stdout);
    const valid = validate(log);
    expect(valid, JSON.stringify(validate.errors?.slice(0, 5), null, 2)).toBe(true);
    expect(log.version).toBe('2.1.0');

    const json = JSON.parse(runBin(['check', '--format', 'json', ...paths]).stdout) as JsonOutput;
    const sarifRun = log.runs[0];
    const shown = sarifRun.results.filter((r: { suppressions?: unknown }) => !r.suppressions);
    const expected = json.files.flatMap((f) =>
      f.diagnostics.map((d) => `${f.path}|${d.line}:${d.column}-${d.endLine}:${d.endColumn}|${{ error: 'error', warning: 'warning', info: 'note' }[d.severity]}|${d.code}|${d.message}`),
    );
    const actual = shown.map((r: { ruleId: string; level: string; message: { text: string }; locations: { physicalLocation: { artifactLocation: { uri: string }; region: Record<string, number> } }[] }) => {
      const { artifactLocation, region } = r.locations[0]!.physicalLocation;
      return `${decodeURIComponent(artifactLocation.uri)}|${region.startLine}:${region.startColumn}-${region.endLine}:${region.endColumn}|${r.level}|${r.ruleId}|${r.message.text}`;
    });
    expect(actual).toEqual(expected);

    // Every result's rule is described, at the index it names, with the title of its docs/rules page.
    const rules = sarifRun.tool.driver.rules as { id: string; shortDescription: { text: string }; fullDescription: { text: string }; help: { markdown: string } }[];
    for (const result of sarifRun.results) expect(rules[result.ruleIndex]!.id).toBe(result.ruleId);
    expect(new Set(rules.map((r) => r.id)).size).toBe(rules.length);
    for (const rule of rules) {
      const page = readFileSync(join(REPO_ROOT, 'docs/rules', `${rule.id}.md`), 'utf8');
      expect(page).toContain(`**${rule.shortDescription.text}**`);
      expect(rule.help.markdown).toBe(page);
      expect(rule.fullDescription.text.length).toBeGreaterThan(20);
    }
    // Related places (the inlet behind a slow pipe, the worst-case set...) are located too, relative to SRCROOT.
    const related = sarifRun.results.flatMap((r: { relatedLocations?: { id: number; message: { text: string }; physicalLocation: { artifactLocation: { uri: string; uriBaseId: string }; region: { startLine: number } } }[] }) => r.relatedLocations ?? []);
    expect(related.length).toBeGreaterThan(0);
    for (const place of related) {
      expect(place.physicalLocation.artifactLocation.uriBaseId).toBe('SRCROOT');
      expect(place.physicalLocation.region.startLine).toBeGreaterThanOrEqual(1);
      expect(place.message.text.length).toBeGreaterThan(0);
    }
    // Fingerprints are unique within the run.
    const prints = sarifRun.results.map((r: { partialFingerprints: Record<string, string> }) => r.partialFingerprints['vacnetFinding/v1']);
    expect(new Set(prints).size).toBe(prints.length);
  });

  it('a finding the file accepts is a result with an in-source suppression that carries the written reason', () => {
    const run = runBin(['check', '--format', 'sarif', 'office.vacnet'], work);
    const log = JSON.parse(run.stdout);
    expect(validate(log)).toBe(true);
    const suppressed = log.runs[0].results.filter((r: { suppressions?: unknown[] }) => r.suppressions);
    expect(suppressed).toHaveLength(1);
    expect(suppressed[0].ruleId).toBe('fast-velocity');
    expect(suppressed[0].suppressions).toEqual([{ kind: 'inSource', status: 'accepted', justification: 'loud only with both tools lifted at once; runs above the storeroom ceiling' }]);
    // Placed on the accepted pipe, `main`, on line 20 of the tour system.
    const text = readFileSync(join(work, 'office.vacnet'), 'utf8').split('\n');
    const line = text.findIndex((l) => l.startsWith('  pipe main ')) + 1;
    expect(suppressed[0].locations[0].physicalLocation.region.startLine).toBe(line);
  });

  it('paths are relative URIs against SRCROOT (the working folder), percent-encoded', () => {
    const log = JSON.parse(runBin(['check', '--format', 'sarif', 'with space'], work).stdout);
    expect(validate(log)).toBe(true);
    const uri = log.runs[0].results[0].locations[0].physicalLocation.artifactLocation;
    expect(uri).toEqual({ uri: 'with%20space/unresolved%20hose.vacnet', uriBaseId: 'SRCROOT' });
    expect(new URL(uri.uri, log.runs[0].originalUriBaseIds.SRCROOT.uri).pathname).toBe(encodeURI(join(work, 'with space/unresolved hose.vacnet')));
  });

  it('fingerprints survive a line inserted above the findings', () => {
    const prints = () =>
      JSON.parse(runBin(['check', '--format', 'sarif', 'clean-house.vacnet'], work).stdout).runs[0].results.map((r: { ruleId: string; partialFingerprints: Record<string, string>; locations: { physicalLocation: { region: { startLine: number } } }[] }) => ({
        rule: r.ruleId,
        print: r.partialFingerprints['vacnetFinding/v1'],
        line: r.locations[0]!.physicalLocation.region.startLine,
      }));
    const before = prints();
    const original = readFileSync(join(work, 'clean-house.vacnet'), 'utf8');
    writeFileSync(join(work, 'clean-house.vacnet'), `// a new first line\n${original}`);
    const after = prints();
    writeFileSync(join(work, 'clean-house.vacnet'), original);
    expect(before.length).toBeGreaterThan(0);
    expect(after.map((r: { line: number }) => r.line)).toEqual(before.map((r: { line: number }) => r.line + 1));
    expect(after.map((r: { print: string }) => r.print)).toEqual(before.map((r: { print: string }) => r.print));
  });

  it('a file that cannot be read is a result too, and the invocation says the run did not succeed (exit 2)', () => {
    const folder = join(work, 'unreadable');
    mkdirSync(folder);
    cpSync(join(FIXTURES, 'clean-house.vacnet'), join(folder, 'ok.vacnet'));
    // A link to nothing: found by the folder walk, unreadable for the loader.
    symlinkSync(join(folder, 'gone.vacnet'), join(folder, 'dangling.vacnet'));
    const run = runBin(['check', '--format', 'sarif', 'unreadable'], work);
    expect(run.status).toBe(2);
    const log = JSON.parse(run.stdout);
    expect(validate(log)).toBe(true);
    expect(log.runs[0].invocations).toEqual([{ executionSuccessful: false }]);
    const byFile = (name: string) => log.runs[0].results.filter((r: { locations: { physicalLocation: { artifactLocation: { uri: string } } }[] }) => r.locations[0]!.physicalLocation.artifactLocation.uri === `unreadable/${name}`);
    expect(byFile('dangling.vacnet').map((r: { ruleId: string; level: string }) => `${r.level} ${r.ruleId}`)).toEqual(['error file-unreadable']);
    expect(byFile('ok.vacnet').map((r: { ruleId: string }) => r.ruleId)).toEqual(['missing-cleanout']);
  });
});

describe('vacnet check --format github', () => {
  it('escapes as the workflow-command syntax requires: % CR LF in messages, and : , in properties', () => {
    expect(escapeData('50 % of it\r\nnext: a, b')).toBe('50 %25 of it%0D%0Anext: a, b');
    expect(escapeProperty('a,b:c%d\ne')).toBe('a%2Cb%3Ac%25d%0Ae');
  });

  it('prints one annotation per finding with 1-based positions, then the summary line', () => {
    const run = runBin(['check', '--format', 'github', 'a,b:c%d.vacnet', 'clean-house.vacnet'], work);
    expect(run.status).toBe(1);
    const json = JSON.parse(runBin(['check', '--format', 'json', 'a,b:c%d.vacnet', 'clean-house.vacnet'], work).stdout) as JsonOutput;
    const lines = run.stdout.trimEnd().split('\n');
    expect(lines.at(-1)).toMatch(/^Checked 2 files: 1 error, 1 warning, 1 info\.$/);
    const annotation = /^::(error|warning|notice) file=([^,]*),line=(\d+),col=(\d+),endLine=(\d+),endColumn=(\d+),title=([a-z0-9-]+)::(.*)$/;
    const parsed = lines.slice(0, -1).map((line) => {
      const m = annotation.exec(line);
      expect(m, line).not.toBeNull();
      return m!;
    });
    const expected = json.files.flatMap((f) => f.diagnostics.map((d) => ({ f, d })));
    expect(parsed).toHaveLength(expected.length);
    parsed.forEach((m, i) => {
      const { f, d } = expected[i]!;
      expect(m[1]).toBe({ error: 'error', warning: 'warning', info: 'notice' }[d.severity]);
      expect(m[2]).toBe(f.path === 'a,b:c%d.vacnet' ? 'a%2Cb%3Ac%25d.vacnet' : f.path);
      expect([Number(m[3]), Number(m[4]), Number(m[5]), Number(m[6])]).toEqual([d.line, d.column, d.endLine, d.endColumn]);
      expect(m[7]).toBe(d.code);
      expect(m[8]).toBe(escapeData(d.message));
    });
  });
});
