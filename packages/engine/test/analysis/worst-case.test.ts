import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseSystem } from '../../src/analysis/analyse-system.js';
import { binomialUpTo } from '../../src/analysis/worst-case.js';
import { estimateLoss, paretoPool, type InletBasis, type Partner } from '../../src/analysis/shared-path-estimate.js';
import { building, randomSystem } from '../fixtures/random-systems.js';

const skip = { velocities: true, commissioning: true, scenarios: true };

describe('worst set per inlet: greedy-swap against brute force', () => {
  it('agrees with exhaustive search on random small networks (rate recorded)', () => {
    let inlets = 0;
    let agree = 0;
    let worstMiss = 0;
    let networks = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1e6 }),
        fc.integer({ min: 4, max: 12 }),
        fc.integer({ min: 6, max: 13 }),
        fc.integer({ min: 2, max: 4 }),
        fc.integer({ min: 0, max: 1 }),
        (seed, pipes, n, k, loops) => {
          const m = randomSystem({ seed, pipes, inlets: n, operators: k, loops });
          const exact = analyseSystem(m, { skip });
          const greedy = analyseSystem(m, { skip, exactSetLimit: 0 });
          networks++;
          exact.inlets.forEach((x, i) => {
            const a = x.worstCase;
            const b = greedy.inlets[i]!.worstCase;
            if (!a || !b) return;
            expect(a.method).toBe('exact');
            expect(b.method).toBe('greedy-swap');
            inlets++;
            // The greedy set is a real set: it can never beat the exhaustive worst
            // (beyond solver accuracy, 1e-9 of the flow).
            const miss = (b.toolVacuumPa - a.toolVacuumPa) / a.toolVacuumPa;
            expect(miss).toBeGreaterThanOrEqual(-1e-7);
            if (miss <= 1e-7) agree++;
            worstMiss = Math.max(worstMiss, miss);
          });
        },
      ),
      { numRuns: 40, seed: 20260101 },
    );
    const rate = agree / inlets;
    console.log(
      `worst-case search: greedy-swap agreed with brute force on ${agree} of ${inlets} inlets (${(100 * rate).toFixed(1)} %) in ${networks} random networks; worst miss ${(100 * worstMiss).toFixed(3)} % of tool vacuum`,
    );
    expect(inlets).toBeGreaterThan(200);
    expect(rate).toBeGreaterThanOrEqual(0.9);
    expect(worstMiss).toBeLessThan(0.01);
  });

  it('agrees on every inlet of small buildings (risers, floors, branches)', () => {
    for (const [risers, floors, per, k] of [
      [2, 3, 4, 3],
      [2, 4, 4, 2],
    ] as const) {
      const m = building({ risers, floors, inletsPerFloor: per, operators: k });
      const exact = analyseSystem(m, { skip, exactSetLimit: 1e9, exactTotalLimit: 1e9 });
      const greedy = analyseSystem(m, { skip, exactSetLimit: 0 });
      exact.inlets.forEach((x, i) => {
        expect(greedy.inlets[i]!.worstCase!.toolVacuumPa).toBeCloseTo(x.worstCase!.toolVacuumPa, 6);
      });
      expect(greedy.effort.solves).toBeLessThan(exact.effort.solves / 4);
    }
  });

  it('switches to greedy-swap when C(n-1, k-1) passes the limit', () => {
    const m = randomSystem({ seed: 3, pipes: 8, inlets: 10, operators: 3 });
    // C(9, 2) = 36 sets per inlet.
    expect(analyseSystem(m, { skip, exactSetLimit: 36 }).inlets[0]!.worstCase!.method).toBe('exact');
    expect(analyseSystem(m, { skip, exactSetLimit: 35 }).inlets[0]!.worstCase!.method).toBe('greedy-swap');
  });

  it('one operator: the worst case is the inlet alone; k at least n: all open', () => {
    const m = randomSystem({ seed: 5, pipes: 5, inlets: 4, operators: 1 });
    const a = analyseSystem(m, { skip });
    for (const i of a.inlets) expect(i.worstCase!.toolVacuumPa).toBeCloseTo(i.alone!.toolVacuumPa, 6);
    const all = analyseSystem(m, { skip, operators: 9 });
    for (const i of all.inlets) expect(i.worstCase!.openInlets).toHaveLength(4);
  });
});

describe('shared-path estimate', () => {
  const basis: InletBasis = { m: 0.05, prefixC: Float64Array.from([0, 1e5, 2e5, 3e5, 4e5]), producerSlope: 1e5, depth: 4 };

  it('grows with a partner\'s flow and with how deep it shares the path', () => {
    const f = (shared: number, q: number) => estimateLoss(basis, [{ index: 1, shared, q }]);
    expect(f(3, 0.05)).toBeGreaterThan(f(2, 0.05));
    expect(f(2, 0.06)).toBeGreaterThan(f(2, 0.05));
    expect(f(-1, 0.05)).toBe(0); // another producer's tree: shares nothing
    // Two partners on the same elements cost more than twice one (square law).
    const two = estimateLoss(basis, [{ index: 1, shared: 4, q: 0.05 }, { index: 2, shared: 4, q: 0.05 }]);
    expect(two).toBeGreaterThan(2 * f(4, 0.05));
  });

  it('the Pareto pool keeps only partners not beaten on both counts by k-1 others', () => {
    const c: Partner[] = [
      { index: 1, shared: 4, q: 0.04 },
      { index: 2, shared: 3, q: 0.05 },
      { index: 3, shared: 2, q: 0.03 }, // beaten by 1 and by 2 on both counts
      { index: 4, shared: 1, q: 0.06 },
    ];
    expect(paretoPool(c, 1).map((p) => p.index)).toEqual([1, 2, 4]);
    expect(paretoPool(c, 2).map((p) => p.index)).toEqual([1, 2, 4]);
    expect(paretoPool(c, 3).map((p) => p.index)).toEqual([1, 2, 3, 4]);
  });

  it('binomial coefficients, capped', () => {
    expect(binomialUpTo(999, 3, Infinity)).toBe(165668499);
    expect(binomialUpTo(10, 3, Infinity)).toBe(120);
    expect(binomialUpTo(1000, 500, 1e6)).toBeGreaterThan(1e6);
  });
});
