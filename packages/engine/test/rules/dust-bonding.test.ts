import { describe, expect, it } from 'vitest';
import { dustBonding } from '../../src/rules/dust-bonding.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { system } from './fixtures.js';
import type { SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => dustBonding.check(m, undefined, createRuleSettings(dustBonding, m));

describe('dust-bonding', () => {
  // NFPA 652/654: all conductive parts bonded and grounded (CHECKS.md).
  it('cautions when combustible dust is carried and bonding is not declared', () => {
    const f = run(system({ dust: { combustible: true, metal: false, bondedAndGrounded: false } }));
    expect(f).toHaveLength(1);
    expect(f[0]!.element).toEqual({ kind: 'system', name: 'test-system', property: 'dust' });
    expect(f[0]!.message).toMatch(/NFPA 654/);
    expect(f[0]!.message).toMatch(/authority having jurisdiction/);
  });
  it('is silent when bonding is declared or the dust is ordinary', () => {
    expect(run(system({ dust: { combustible: true, metal: false, bondedAndGrounded: true } }))).toEqual([]);
    expect(run(system({ dust: { combustible: false, metal: false, bondedAndGrounded: false } }))).toEqual([]);
  });
});
