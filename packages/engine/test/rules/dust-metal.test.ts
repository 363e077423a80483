import { describe, expect, it } from 'vitest';
import { dustMetal } from '../../src/rules/dust-metal.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { system } from './fixtures.js';
import type { SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => dustMetal.check(m, undefined, createRuleSettings(dustMetal, m));

describe('dust-metal', () => {
  // Metal dust falls under the metals standard, NFPA 484 (CHECKS.md).
  it('points metal dust to NFPA 484 without claiming compliance', () => {
    const f = run(system({ dust: { combustible: true, metal: true, bondedAndGrounded: true } }));
    expect(f).toHaveLength(1);
    expect(f[0]!.message).toMatch(/NFPA 484/);
    expect(f[0]!.message).toMatch(/not a compliance check/);
  });
  it('is silent for non-metal dust', () => {
    expect(run(system({ dust: { combustible: true, metal: false, bondedAndGrounded: true } }))).toEqual([]);
  });
});
