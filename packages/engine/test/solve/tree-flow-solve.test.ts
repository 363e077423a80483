/**
 * The network solver's two methods on the same cases: a tree hanging from
 * one producer solved by its entry flows, and Newton on every node
 * pressure. Independent methods on the same equations (ENGINEERING.md,
 * network solve): they must agree within the convergence tolerance (1e-9
 * of the total flow), and fail alike.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildNetworkGraph, caseElements } from '../../src/network/graph.js';
import { defaultElementLaws } from '../../src/network/default-element-laws.js';
import { solveNetwork } from '../../src/solve/solve-network.js';
import type { SolveEffort, SolveResult } from '../../src/solve/solve-types.js';
import { randomSystem } from '../fixtures/random-systems.js';
import { exhauster, hose50, SystemBuilder, UNITS } from '../fixtures/system-builder.js';

const effort = (): SolveEffort => ({ solves: 0, newtonIterations: 0, elementEvaluations: 0 });

function differences(a: SolveResult, b: SolveResult): { flow: number; pressure: number } {
  if (!a.ok || !b.ok) throw new Error('both must solve');
  const total = Math.max(...Array.from(b.flowKgPerS, Math.abs));
  let flow = 0;
  let pressure = 0;
  b.elements.forEach((e, i) => {
    const j = a.elements.indexOf(e);
    flow = Math.max(flow, Math.abs((j < 0 ? 0 : a.flowKgPerS[j]!) - b.flowKgPerS[i]!) / total);
  });
  b.nodes.forEach((node, i) => {
    const j = a.nodes.indexOf(node);
    if (j >= 0) pressure = Math.max(pressure, Math.abs(a.pressurePa[j]! - b.pressurePa[i]!) / b.pressurePa[i]!);
  });
  return { flow, pressure };
}

describe('solveNetwork: entry flows against Newton on node pressures', () => {
  it('random trees, random open inlets, with and without dead legs: the same solution', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1e6 }),
        fc.integer({ min: 2, max: 60 }),
        fc.integer({ min: 1, max: 8 }),
        fc.boolean(),
        fc.boolean(),
        (seed, pipes, open, lifted, prune) => {
          const m = randomSystem({ seed, pipes, inlets: 10, operators: 2 });
          const g = buildNetworkGraph(m, { laws: defaultElementLaws });
          const c = caseElements(g, m.inlets.slice(0, open).map((i) => ({ inlet: i.name, toolState: lifted ? ('lifted' as const) : ('working' as const) })));
          if (!c.ok) return;
          const ef = effort();
          const en = effort();
          const auto = solveNetwork(g.net, c.elements, { prune }, ef);
          const newton = solveNetwork(g.net, c.elements, { prune, method: 'newton' }, en);
          expect(auto.ok).toBe(newton.ok);
          if (!auto.ok || !newton.ok) {
            if (!auto.ok && !newton.ok) expect(auto.failure.cause).toBe(newton.failure.cause);
            return;
          }
          const d = differences(auto, newton);
          expect(d.flow).toBeLessThan(2e-9);
          expect(d.pressure).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 120, seed: 77 },
    );
  });

  it('a large tree with a few inlets open costs a small part of Newton\'s work (dead legs cost nothing)', () => {
    const m = randomSystem({ seed: 7, pipes: 2000, inlets: 400 });
    const g = buildNetworkGraph(m, { laws: defaultElementLaws });
    const c = caseElements(g, m.inlets.slice(0, 4).map((i) => ({ inlet: i.name, toolState: 'working' as const })));
    if (!c.ok) throw new Error(c.failure.message);
    const ef = effort();
    const en = effort();
    const auto = solveNetwork(g.net, c.elements, { prune: false }, ef);
    const newton = solveNetwork(g.net, c.elements, { prune: false, method: 'newton' }, en);
    expect(differences(auto, newton).flow).toBeLessThan(2e-9);
    expect(ef.elementEvaluations).toBeLessThan(en.elementEvaluations / 10);
  });

  it('a network with loops in the case goes to Newton: the same result', () => {
    const m = randomSystem({ seed: 11, pipes: 20, inlets: 6, operators: 2, loops: 2 });
    const g = buildNetworkGraph(m, { laws: defaultElementLaws });
    const c = caseElements(g, m.inlets.slice(0, 3).map((i) => ({ inlet: i.name, toolState: 'working' as const })));
    if (!c.ok) throw new Error(c.failure.message);
    const ea = effort();
    const eb = effort();
    const a = solveNetwork(g.net, c.elements, { prune: false }, ea);
    const b = solveNetwork(g.net, c.elements, { prune: false, method: 'newton' }, eb);
    expect(a.ok && b.ok).toBe(true);
    // Nothing was tried by entry flows: the same iterations and work as Newton,
    // and the same result up to the pipe laws' warm starts (~1e-14 of a flow).
    expect(ea).toEqual(eb);
    expect(differences(a, b).flow).toBeLessThan(1e-12);
  });

  it('typed failures and accepted limits are the same either way: demand past the curve, a choked tool', () => {
    const base = () =>
      new SystemBuilder('small', { operators: 3 })
        .producer('P')
        .separator('S', 'P')
        .pipe('main', 'S', 'j', { d: 0.108, lengthM: 20 })
        .inletAt('A', 'j')
        .inletAt('B', 'j')
        .inletAt('C', 'j');
    const short = base().build();
    short.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 14 * UNITS.INHG }, { flowM3PerS: 150 * UNITS.CFM, vacuumPa: 10 * UNITS.INHG }] };
    const deep = base().build();
    deep.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 80000 }, { flowM3PerS: 2000 * UNITS.CFM, vacuumPa: 78000 }] };
    for (const i of deep.inlets) i.hose = { ...hose50, lengthM: 1, boreM: 3 * UNITS.IN };
    const solveBoth = (m: typeof short) => {
      const g = buildNetworkGraph(m, { laws: defaultElementLaws });
      const c = caseElements(g, m.inlets.map((i) => ({ inlet: i.name, toolState: 'working' as const })));
      if (!c.ok) throw new Error(c.failure.message);
      return [solveNetwork(g.net, c.elements), solveNetwork(g.net, c.elements, { method: 'newton' })] as const;
    };
    for (const r of solveBoth(short)) expect(r.ok === false && r.failure.cause).toBe('infeasible-demand');
    // A choked tool holds the critical flow: a solved case that lists the limit (the graph accepts it).
    const [a, b] = solveBoth(deep);
    for (const r of [a, b]) {
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.limited.filter((l) => l.limit === 'choked').map((l) => l.cause)).toEqual([null, null, null]);
    }
    expect(differences(a, b).flow).toBeLessThan(2e-9);
  });
});
