import { describe, expect, it } from 'vitest';
import { missingCleanout } from '../../src/rules/missing-cleanout.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { FT, pipe, system } from './fixtures.js';
import type { Cleanout, SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => missingCleanout.check(m, undefined, createRuleSettings(missingCleanout, m));
const at = (point: string): Cleanout => ({ position: { kind: 'point', point } });
const on = (p: string, ft: number): Cleanout => ({ position: { kind: 'on-pipe', pipe: p, distanceM: ft * FT } });

// Places: riser bases, far ends of horizontal runs, horizontal changes of
// direction over 45 deg, at most 100 ft apart: drainage codes and duct guide
// specifications applied by analogy (CHECKS.md trade practice; common practice).
describe('missing-cleanout', () => {
  const layout = () => [
    pipe('main-1', 'plant', 'j1', { lengthFt: 40 }),
    pipe('main-2', 'j1', 'j2', { lengthFt: 40 }),
    // Written upward from j1: air flows down toward the main, so j1 is the riser's foot.
    pipe('riser', 'j1', 'top', { lengthFt: 30, orientation: 'air-down', joins: { kind: 'wye', angleRad: Math.PI / 4 } }),
  ];

  it('asks for a cleanout at the riser base and at the far end of the run', () => {
    const f = run(system({ pipes: layout() }));
    expect(f.map((x) => x.fix)).toEqual([
      { cleanout: { kind: 'point', point: 'j1' } },
      { cleanout: { kind: 'point', point: 'j2' } },
    ]);
    expect(f[0]!.element.name).toBe('riser');
    expect(f[0]!.message).toMatch(/base of riser 'riser'/);
    expect(f[1]!.element.name).toBe('main-2');
  });

  it('is satisfied by cleanouts at the points or on a pipe within 3 ft of them', () => {
    expect(run(system({ pipes: layout(), cleanouts: [at('j1'), at('j2')] }))).toEqual([]);
    // main-2 is 40 ft: 38 ft from j1 is 2 ft from j2 (within 3 ft), 1 ft on the riser is at its foot.
    expect(run(system({ pipes: layout(), cleanouts: [on('main-2', 38), on('riser', 1)] }))).toEqual([]);
    // 5 ft away is not next to it.
    expect(run(system({ pipes: layout(), cleanouts: [on('main-2', 35), at('j1')] }))).toHaveLength(1);
  });

  it('finds the foot of a riser whose air rises to a plant above, and not of one standing on the plant', () => {
    const up = pipe('drop', 'plant', 'b', { orientation: 'air-up', lengthFt: 20 });
    expect(run(system({ pipes: [up] })).map((x) => x.fix)).toEqual([{ cleanout: { kind: 'point', point: 'b' } }]);
    const onPlant = pipe('rise', 'plant', 'c', { orientation: 'air-down', lengthFt: 20 });
    expect(run(system({ pipes: [onPlant] }))).toEqual([]);
  });

  it('asks for one cleanout at the foot of a riser made of stacked pipes', () => {
    const pipes = [
      pipe('main', 'plant', 'j1', { lengthFt: 2 }),
      pipe('r1', 'j1', 'k', { orientation: 'air-down' }),
      pipe('r2', 'k', 'top', { orientation: 'air-down' }),
    ];
    expect(run(system({ pipes })).map((x) => x.fix)).toEqual([{ cleanout: { kind: 'point', point: 'j1' } }]);
  });

  it('exempts horizontal runs under 5 ft (drainage-code exemption, from memory)', () => {
    expect(run(system({ pipes: [pipe('stub', 'plant', 'a', { lengthFt: 4 })] }))).toEqual([]);
    expect(run(system({ pipes: [pipe('stub', 'plant', 'a', { lengthFt: 6 })] }))).toHaveLength(1);
  });

  it('asks for a cleanout next to a horizontal bend over 45 deg, not at 45 deg', () => {
    const bend = (deg: number) => ({ kind: 'bend' as const, angleRad: (deg * Math.PI) / 180, count: 1, radiusRatio: 1.5 });
    const m = system({
      pipes: [pipe('p', 'plant', 'a', { lengthFt: 20, fittings: [bend(90)] }), pipe('q', 'plant', 'b', { lengthFt: 20, fittings: [bend(45)] })],
      cleanouts: [at('a'), at('b'), on('q', 10)],
    });
    const f = run(m);
    // p's far-end cleanout at 'a' is at its end: it counts as next to the bend.
    expect(f).toEqual([]);
    const m2 = system({ pipes: [pipe('p', 'plant', 'a', { lengthFt: 20, fittings: [bend(90)] })], cleanouts: [on('p', 19.5)] });
    expect(run(m2)).toEqual([]);
    const m3 = system({
      pipes: [pipe('p0', 'plant', 'j', { lengthFt: 20 }), pipe('p', 'j', 'a', { lengthFt: 20, fittings: [bend(90)], joins: { kind: 'wye', angleRad: Math.PI / 4 } })],
      cleanouts: [at('a'), on('p0', 2)],
    });
    // p's ends j and a: 'a' is served, so the bend on p is served; now move the end cleanout away.
    expect(run(m3).filter((x) => x.element.property === 'bend')).toEqual([]);
    const m4 = system({
      pipes: [pipe('p', 'plant', 'a', { lengthFt: 20, fittings: [bend(90)] }), pipe('q', 'a', 'b', { lengthFt: 20 })],
      cleanouts: [at('b')],
    });
    const bendFindings = run(m4).filter((x) => x.element.property === 'bend');
    expect(bendFindings).toHaveLength(1);
    expect(bendFindings[0]!.element.name).toBe('p');
  });

  it('spaces cleanouts at most 100 ft apart: 250 ft needs two between the ends', () => {
    const m = system({ pipes: [pipe('long', 'plant', 'end', { lengthFt: 250 })], cleanouts: [at('end')] });
    const f = run(m);
    expect(f).toHaveLength(1);
    const positions = f[0]!.fix!['cleanouts'] as { pipe: string; distanceM: number }[];
    expect(positions.map((p) => p.pipe)).toEqual(['long', 'long']);
    // 250 ft in three equal gaps of 83.3 ft.
    expect(positions[0]!.distanceM).toBeCloseTo((250 / 3) * FT, 2);
    expect(positions[1]!.distanceM).toBeCloseTo((500 / 3) * FT, 2);
  });

  it('measures spacing along a run of several pipes and counts cleanouts on it', () => {
    const pipes = [pipe('a', 'plant', 'j1', { lengthFt: 80 }), pipe('b', 'j1', 'j2', { lengthFt: 80 })];
    // 160 ft: one cleanout at j1 (80 ft) splits it into two 80 ft stretches.
    expect(run(system({ pipes, cleanouts: [at('j1'), at('j2')] }))).toEqual([]);
    const f = run(system({ pipes, cleanouts: [at('j2')] }));
    expect(f).toHaveLength(1);
    expect(f[0]!.fix!['cleanouts']).toEqual([{ kind: 'on-pipe', pipe: 'b', distanceM: 0 }]);
  });

  it('uses a system spacing setting', () => {
    const m = system({ pipes: [pipe('long', 'plant', 'end', { lengthFt: 250 })], cleanouts: [at('end')] });
    m.rules.settings.push({ rule: 'missing-cleanout', parameter: 'spacing', value: 300 * FT });
    expect(run(m)).toEqual([]);
  });

  it('survives a loop of run-ons without hanging', () => {
    const pipes = [pipe('x', 'p', 'q', { lengthFt: 10 }), pipe('y', 'q', 'p', { lengthFt: 10 })];
    expect(() => run(system({ pipes }))).not.toThrow();
  });
});
