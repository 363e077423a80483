import { describe, expect, it } from 'vitest';
import { fastVelocity } from '../../src/rules/fast-velocity.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analysis, IN, pipe, pipeAnalysis, system } from './fixtures.js';

const run = (m: SystemModel, a: SystemAnalysis) => fastVelocity.check(m, a, createRuleSettings(fastVelocity, m));

describe('fast-velocity', () => {
  // Limit 40 m/s (about 7900 fpm): common practice, no published limit known.
  const p = pipe('branch', 'plant', 'a', { sizeIn: 3 });
  const m = system({ pipes: [p] });
  const case_ = (max: number, min: number | null) =>
    analysis({ pipes: [pipeAnalysis(p, { maxVelocityMPerS: max, minVelocityMPerS: min, maxVelocityInlets: ['i1', 'i2'] })] });

  it('flags 45 m/s and lists the open inlets of that case; 38 m/s passes', () => {
    const f = run(m, case_(45, 30));
    expect(f).toHaveLength(1);
    expect(f[0]!.related?.map((r) => r.element.name)).toEqual(['i1', 'i2']);
    expect(run(m, case_(38, 30))).toEqual([]);
  });

  it('suggests the next size that is quiet enough and still carries with one operator', () => {
    // NPS 3 -> 4 schedule 10: 82.8 -> 108.2 mm (ASME B36.10M); 45 x (82.8/108.2)^2 = 26.4 m/s;
    // one operator: 32 x 0.586 = 18.7 m/s, above 3500 fpm = 17.8 m/s (ACGIH, general debris).
    const f = run(m, case_(45, 32));
    expect(f[0]!.fix?.['nominalSizeM']).toBeCloseTo(4 * IN, 9);
  });

  it('says when the fastest case ran past the producer curve (extrapolated, an estimate)', () => {
    const a = analysis({ pipes: [pipeAnalysis(p, { maxVelocityMPerS: 45, minVelocityMPerS: 30, maxVelocityInlets: ['i1'], maxVelocityLimited: 'curve-end' })] });
    expect(run(m, a)[0]!.message).toMatch(/past the end of the producer's curve.*estimate/);
    expect(run(m, case_(45, 30))[0]!.message).not.toMatch(/producer's curve/);
  });

  it('says when no size can be both quiet and fast enough to carry', () => {
    const f = run(m, case_(45, 25));
    expect(f[0]!.fix).toBeUndefined();
    expect(f[0]!.message).toMatch(/cannot meet both/);
  });

  it('takes a per-pipe limit', () => {
    const q = pipe('q', 'plant', 'b', { sizeIn: 3 });
    q.rules.settings.push({ rule: 'fast-velocity', parameter: 'limit', value: 50 });
    const a = analysis({ pipes: [pipeAnalysis(q, { maxVelocityMPerS: 45 })] });
    expect(run(system({ pipes: [q] }), a)).toEqual([]);
  });
});
