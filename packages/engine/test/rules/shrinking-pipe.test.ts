import { describe, expect, it } from 'vitest';
import { shrinkingPipe } from '../../src/rules/shrinking-pipe.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { IN, pipe, steel40, system } from './fixtures.js';
import type { SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => shrinkingPipe.check(m, undefined, createRuleSettings(shrinkingPipe, m));

describe('shrinking-pipe', () => {
  // Pipe never gets smaller toward the producer (trade practice, CHECKS.md: common practice).
  it('flags a 2-1/2 in pipe downstream of a 3 in pipe and suggests 3 in', () => {
    // Schedule 10 bores: NPS 3 82.8 mm, NPS 2-1/2 66.9 mm (ASME B36.10M, CHECKS.md).
    const m = system({ pipes: [pipe('down', 'plant', 'j', { sizeIn: 2.5 }), pipe('up', 'j', 'a', { sizeIn: 3 })] });
    const f = run(m);
    expect(f).toHaveLength(1);
    expect(f[0]!.element).toEqual({ kind: 'pipe', name: 'down', property: 'size' });
    expect(f[0]!.fix).toEqual({ nominalSizeM: 3 * IN });
    expect(f[0]!.related?.[0]?.element.name).toBe('up');
  });
  it('ignores a wall-schedule change at one size (NPS 4: sch 10 108.2 mm to sch 40 102.3 mm, 5.5 %, ASME B36.10M)', () => {
    const m = system({
      pipes: [pipe('down', 'plant', 'j', { sizeIn: 4, spec: steel40() }), pipe('up', 'j', 'a', { sizeIn: 4 })],
    });
    expect(run(m)).toEqual([]);
  });
  it('does not flag a branch smaller than its main (the normal case)', () => {
    const m = system({ pipes: [pipe('main', 'plant', 'j', { sizeIn: 4 }), pipe('branch', 'j', 'a', { sizeIn: 2 })] });
    expect(run(m)).toEqual([]);
  });
  it('with tolerance 0 the 5.5 % schedule change counts', () => {
    const m = system({
      pipes: [pipe('down', 'plant', 'j', { sizeIn: 4, spec: steel40() }), pipe('up', 'j', 'a', { sizeIn: 4 })],
    });
    m.rules.settings.push({ rule: 'shrinking-pipe', parameter: 'tolerance', value: 0 });
    expect(run(m)).toHaveLength(1);
  });
});
