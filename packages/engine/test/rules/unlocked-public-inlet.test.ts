import { describe, expect, it } from 'vitest';
import { unlockedPublicInlet } from '../../src/rules/unlocked-public-inlet.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { inlet, system } from './fixtures.js';
import type { SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => unlockedPublicInlet.check(m, undefined, createRuleSettings(unlockedPublicInlet, m));

describe('unlocked-public-inlet', () => {
  // Locking inlets in public areas: common practice.
  it('flags only public inlets without a lock', () => {
    const m = system({
      inlets: [
        inlet('lobby', 'a', { publicArea: true }),
        inlet('hall', 'b', { publicArea: true, locked: true }),
        inlet('store', 'c'),
      ],
    });
    const f = run(m);
    expect(f.map((x) => x.element)).toEqual([{ kind: 'inlet', name: 'lobby', property: 'locked' }]);
    expect(f[0]!.fix).toEqual({ locked: true });
  });
});
