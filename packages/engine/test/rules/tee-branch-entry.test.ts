import { describe, expect, it } from 'vitest';
import { teeBranchEntry } from '../../src/rules/tee-branch-entry.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { pipe, system } from './fixtures.js';
import type { SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => teeBranchEntry.check(m, undefined, createRuleSettings(teeBranchEntry, m));

describe('tee-branch-entry', () => {
  // Trade practice: wye fittings for branches (UFGS guide specifications, CHECKS.md);
  // ACGIH branch entry loss 1.00 VP at 90 deg vs 0.28 VP at 45 deg [from memory].
  const main = pipe('main', 'plant', 'j1');
  it('flags a branch joining through a tee and offers a 45 deg wye', () => {
    const m = system({ pipes: [main, pipe('branch', 'j1', 'a', { joins: { kind: 'tee' } })] });
    const f = run(m);
    expect(f).toHaveLength(1);
    expect(f[0]!.element).toEqual({ kind: 'pipe', name: 'branch', property: 'joins' });
    expect(f[0]!.fix).toEqual({ joins: { kind: 'wye', angleRad: Math.PI / 4 } });
    expect(f[0]!.related?.[0]?.element.name).toBe('main');
    expect(f[0]!.message).toMatch(/wye/);
  });
  it('treats a 90 deg wye as a tee', () => {
    const m = system({ pipes: [main, pipe('branch', 'j1', 'a', { joins: { kind: 'wye', angleRad: Math.PI / 2 } })] });
    expect(run(m)).toHaveLength(1);
  });
  it('accepts 45 deg wyes, sweeps and straight run-ons', () => {
    const m = system({
      pipes: [
        main,
        pipe('b1', 'j1', 'a', { joins: { kind: 'wye', angleRad: Math.PI / 4 } }),
        pipe('b2', 'j1', 'b', { joins: { kind: 'sweep' } }),
        pipe('b3', 'j1', 'c'),
      ],
    });
    expect(run(m)).toEqual([]);
  });
});
