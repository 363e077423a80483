// An example opened by `vacnet: Open an Example System` is the system with
// its catalog written in: it must read exactly as the two files do, the
// same findings and the same analysis, as the headless loader (the one
// `vacnet check` uses) sees both.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadDocuments } from '@vacnet/language';
import { afterAll, describe, expect, it } from 'vitest';
import { inlineCatalog } from '../src/inline-catalog.js';

const examplesDir = fileURLToPath(new URL('../../../examples/', import.meta.url));
const catalog = readFileSync(join(examplesDir, 'catalog', 'equipment.vacnet'), 'utf8');
const folder = mkdtempSync(join(tmpdir(), 'vacnet-inline-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('an example with its catalog written in', () => {
  it.each(['detached-house', 'grinding-plant', 'harbour-offices', 'primary-school'])('%s reads as the two files do', async (name) => {
    const original = join(examplesDir, `${name}.vacnet`);
    const text = readFileSync(original, 'utf8');
    const inlined = inlineCatalog(text, 'catalog/equipment.vacnet', catalog);
    expect(inlined).not.toMatch(/^use /m);
    const file = join(folder, `${name}.vacnet`);
    writeFileSync(file, inlined);
    const [before, after] = [(await loadDocuments([original], { analyse: true })).files[0]!, (await loadDocuments([file], { analyse: true })).files[0]!];
    // Lines move by the catalog's length; codes, severities and messages stay.
    const findings = (f: typeof before) => f.diagnostics.map((d) => `${d.severity} ${d.code} ${d.message}`).sort();
    expect(findings(after)).toEqual(findings(before));
    expect(after.model).toEqual(before.model);
    expect(after.analysis).toEqual(before.analysis);
  }, 60_000);

  it('leaves a text without that use line as it is', () => {
    expect(inlineCatalog('system "a" {}\n', 'catalog/equipment.vacnet', catalog)).toBe('system "a" {}\n');
    expect(inlineCatalog('use "other.vacnet"\n', 'catalog/equipment.vacnet', catalog)).toBe('use "other.vacnet"\n');
  });
});
