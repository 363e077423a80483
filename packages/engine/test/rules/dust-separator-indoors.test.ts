import { describe, expect, it } from 'vitest';
import { dustSeparatorIndoors } from '../../src/rules/dust-separator-indoors.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { system } from './fixtures.js';
import type { SeparatorUnit, SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => dustSeparatorIndoors.check(m, undefined, createRuleSettings(dustSeparatorIndoors, m));
const sep = (name: string, indoors: boolean, explosionProtected: boolean): SeparatorUnit => ({
  name,
  model: { name: 'cyclone', rated: { lossPa: 500, flowStdM3PerS: 0.1 } },
  towardProducer: 'plant',
  indoors,
  explosionProtected,
});

describe('dust-separator-indoors', () => {
  // NFPA 654: air-material separator outside or with explosion protection (CHECKS.md).
  const dust = { combustible: true, metal: false, bondedAndGrounded: true };
  it('cautions only about an unprotected indoor separator', () => {
    const m = system({ dust, separators: [sep('a', true, false), sep('b', true, true), sep('c', false, false)] });
    const f = run(m);
    expect(f.map((x) => x.element.name)).toEqual(['a']);
    expect(f[0]!.message).toMatch(/NFPA 660/);
  });
  it('is silent for ordinary dust', () => {
    expect(run(system({ separators: [sep('a', true, false)] }))).toEqual([]);
  });
});
