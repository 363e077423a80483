import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseSystem } from '../../src/analysis/analyse-system.js';
import type { SystemModel } from '../../src/network/model.js';
import { randomSystem } from '../fixtures/random-systems.js';
import { SystemBuilder } from '../fixtures/system-builder.js';

/** No number in the result is NaN or infinite. */
function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value && typeof value === 'object') return Object.values(value).every(allFinite);
  return true;
}

describe('analyseSystem on odd input', () => {
  it('an empty system, one with no producer, one with no pipes: answers, no throw', () => {
    const cases: SystemModel[] = [
      new SystemBuilder().build(),
      new SystemBuilder().pipe('a', 'x', 'y').inletAt('I', 'y').build(),
      new SystemBuilder().producer('P').inletAt('I', 'P').build(),
    ];
    for (const m of cases) {
      const a = analyseSystem(m);
      expect(allFinite(a)).toBe(true);
    }
    // With no producer the inlet has no path, and the topology says so.
    const noProducer = analyseSystem(cases[1]!);
    expect(noProducer.failures[0]?.cause).toBe('no-path');
    expect(noProducer.topology.map((f) => f.code)).toContain('no-producer');
    // An inlet right at the producer point works (hose and tool only).
    expect(analyseSystem(cases[2]!).inlets[0]!.alone).not.toBeNull();
  });

  it('impossible site air is a typed failure, not NaN', () => {
    const m = new SystemBuilder('x', { ambientPa: NaN }).producer('P').pipe('a', 'P', 'y').inletAt('I', 'y').build();
    const a = analyseSystem(m);
    expect(allFinite(a)).toBe(true);
    expect(a.failures[0]?.cause).toBe('invalid-element');
  });

  it('two producers on one header share the load', () => {
    const m = new SystemBuilder('twin', { operators: 2 })
      .producer('P1')
      .producer('P2')
      .pipe('l', 'P1', 'h', { d: 0.108, lengthM: 5 })
      .pipe('r', 'P2', 'h', { d: 0.108, lengthM: 5 })
      .pipe('b', 'h', 'x', { d: 0.0828, lengthM: 20 })
      .inletOn('A', 'b', 5)
      .inletAt('B', 'x')
      .build();
    const a = analyseSystem(m);
    expect(a.failures).toEqual([]);
    expect(a.producers).toHaveLength(2);
    // Symmetric producers draw equal shares.
    expect(a.producers[0]!.massFlowKgPerS).toBeCloseTo(a.producers[1]!.massFlowKgPerS, 9);
    // Two producers on one header: no margin is claimed for either alone.
    expect(a.producers.every((p) => p.marginFraction === null)).toBe(true);
  });

  it('random systems, loops included: never throws, never NaN', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1e6 }), fc.integer({ min: 1, max: 10 }), fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 2 }), fc.integer({ min: 1, max: 5 }), (seed, pipes, inlets, loops, k) => {
        const a = analyseSystem(randomSystem({ seed, pipes, inlets, loops, operators: k }), { skip: { commissioning: true } });
        expect(allFinite(a)).toBe(true);
        expect(a.inlets).toHaveLength(inlets);
      }),
      { numRuns: 30 },
    );
  });
});
