import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { FIXTURES, REPO_ROOT, runBin } from './run-bin.js';

// The README's tour system and its check output stay true: the system is
// this fixture, and the README shows the findings (location, severity,
// code) and the summary that checking it gives. Messages carry computed
// numbers, so only their first words are compared.

const readme = readFileSync(join(REPO_ROOT, 'README.md'), 'utf8');
const fenced = (language: string) =>
  [...readme.matchAll(new RegExp('```' + language + '\\n([\\s\\S]*?)```', 'g'))].map((match) => match[1]!);

const FIXTURE = 'readme-small-office.vacnet';
/** The stable head of a finding line: path, position, severity, code and the message's first words. */
const head = (line: string) => line.split(' ').slice(0, 5).join(' ');

describe('README', () => {
  it('the tour system is the fixture, word for word', () => {
    expect(fenced('vacnet')[0]).toBe(readFileSync(join(FIXTURES, FIXTURE), 'utf8'));
  });

  it('the text output shown is what `vacnet check` prints for the tour system', () => {
    const shown = fenced('text').find((block) => block.startsWith('small-office.vacnet:'));
    expect(shown, 'README has no output block for small-office.vacnet').toBeDefined();
    const run = runBin(['check', FIXTURE], FIXTURES);
    expect(run.status).toBe(0);
    const actual = run.stdout.replaceAll(FIXTURE, 'small-office.vacnet').trimEnd().split('\n');
    const expected = shown!.trimEnd().split('\n');
    const findings = (lines: string[]) => lines.filter((line) => /^small-office\.vacnet:\d+:\d+ /.test(line)).map(head);
    expect(findings(actual)).toEqual(findings(expected));
    expect(actual.at(-1)).toBe(expected.at(-1));
    expect(actual.filter((line) => line.startsWith('  accepted '))).toEqual(expected.filter((line) => line.startsWith('  accepted ')));
  });
});
