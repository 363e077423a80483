// The JSON schema the extension contributes for vacnet.json (editor
// validation and completion) must agree with the project settings reader
// the command line and the server use (parseProjectSettings): the example
// of docs/settings.md and a file with every rule and parameter pass both;
// each kind of mistake the reader reports, the schema refuses too. The
// schema is checked by Ajv as a JSON Schema draft-07 validator (the draft
// VS Code's JSON language service reads).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Ajv from 'ajv';
import { formatQuantity, RULES } from '@vacnet/engine';
import { parseProjectSettings } from '@vacnet/language';
import { describe, expect, it } from 'vitest';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const repoRoot = join(extensionRoot, '..', '..');
const schema = JSON.parse(readFileSync(join(extensionRoot, 'schemas', 'vacnet.schema.json'), 'utf8'));
// Editor-only keywords (markdownDescription, patternErrorMessage) are not JSON Schema: strict mode off.
const validate = new Ajv({ strict: false, allErrors: true }).compile(schema);

const readerProblems = (value: unknown) => parseProjectSettings(JSON.stringify(value)).diagnostics.map((d) => d.message);

describe('the vacnet.json schema', () => {
  it('is what scripts/rule-settings-schema.mjs makes from the engine\'s rules', async () => {
    // @ts-expect-error: a plain .mjs script without type declarations
    const { projectSettingsSchema } = (await import('../scripts/rule-settings-schema.mjs')) as { projectSettingsSchema: (rules: unknown, format: unknown) => unknown };
    expect(schema, 'schemas/vacnet.schema.json is stale: run scripts/rule-settings-schema.mjs').toEqual(projectSettingsSchema(RULES, formatQuantity));
    const manifest = JSON.parse(readFileSync(join(extensionRoot, 'package.json'), 'utf8'));
    expect(manifest.contributes.jsonValidation).toEqual([{ fileMatch: 'vacnet.json', url: './schemas/vacnet.schema.json' }]);
  });

  it('accepts the example of docs/settings.md, as the reader does', () => {
    const docs = readFileSync(join(repoRoot, 'docs', 'settings.md'), 'utf8');
    const example = JSON.parse(/```json\n([\s\S]*?)\n```/.exec(docs)![1]!);
    expect(readerProblems(example)).toEqual([]);
    expect(validate(example), JSON.stringify(validate.errors)).toBe(true);
  });

  it('accepts every rule with every parameter at its default, as the reader does', () => {
    const rules: Record<string, Record<string, unknown>> = {};
    for (const rule of RULES) {
      const entry: Record<string, unknown> = { severity: 'info' };
      for (const p of rule.parameters) {
        entry[p.name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase())] =
          p.dimension === 'ratio' || p.dimension === 'count' ? p.default : p.dimension === 'fraction' ? `${p.default * 100} %` : formatQuantity(p.default, p.dimension, 'si', 6);
      }
      rules[rule.code] = entry;
    }
    const file = { displayUnits: 'si', rules, hints: false };
    expect(readerProblems(file)).toEqual([]);
    expect(validate(file), JSON.stringify(validate.errors)).toBe(true);
  });

  it.each([
    ['an unknown top-level key', { units: 'si' }],
    ['an unknown rule code', { rules: { 'no-such-rule': { severity: 'error' } } }],
    ['an unknown parameter', { rules: { 'fast-velocity': { speed: '7000 fpm' } } }],
    ['a rule off without a reason', { rules: { 'missing-cleanout': { severity: 'off' } } }],
    ['a severity that is none', { rules: { 'missing-cleanout': { severity: 'fatal' } } }],
    ['a velocity without its unit', { rules: { 'fast-velocity': { limit: 7000 } } }],
    ['display units that are none', { displayUnits: 'metric' }],
    ['an unknown kind of hint', { hints: { tools: true } }],
    ['hints that are not true or false', { hints: { inlets: 'yes' } }],
  ])('refuses %s, as the reader does', (_what, file) => {
    expect(readerProblems(file).length).toBeGreaterThan(0);
    expect(validate(file)).toBe(false);
  });
});
