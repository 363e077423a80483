/**
 * Properties of the solver on random valid systems (fast-check), with the
 * engine's own element physics.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildNetworkGraph, caseElements, type NetworkGraph } from '../../src/network/graph.js';
import { defaultElementLaws } from '../../src/network/default-element-laws.js';
import type { ScenarioOpening } from '../../src/network/model.js';
import { solveNetwork } from '../../src/solve/solve-network.js';
import type { SolveResult, SolvedState } from '../../src/solve/solve-types.js';
import { randomSystem } from '../fixtures/random-systems.js';
import { SystemBuilder, UNITS, hose50 } from '../fixtures/system-builder.js';

const CAUSES = ['infeasible-demand', 'choked', 'no-path', 'zero-pressure', 'not-converged', 'invalid-element'];

function solve(g: NetworkGraph, open: ScenarioOpening[]): SolveResult {
  const c = caseElements(g, open);
  if (!c.ok) throw new Error(c.failure.message);
  return solveNetwork(g.net, c.elements);
}

/** Net inflow at every free node of a solved state, and the total flow. */
function imbalances(g: NetworkGraph, st: SolvedState): { worst: number; total: number } {
  const net = new Map<number, number>();
  let fixedSum = 0;
  st.elements.forEach((e, i) => {
    const m = st.flowKgPerS[i]!;
    const a = g.net.elementA[e]!;
    const b = g.net.elementB[e]!;
    if (Number.isFinite(g.net.fixedPressurePa[a]!) || Number.isFinite(g.net.fixedPressurePa[b]!)) fixedSum += Math.abs(m);
    net.set(a, (net.get(a) ?? 0) - m);
    net.set(b, (net.get(b) ?? 0) + m);
  });
  let worst = 0;
  for (const [node, v] of net) if (!Number.isFinite(g.net.fixedPressurePa[node]!)) worst = Math.max(worst, Math.abs(v));
  return { worst, total: fixedSum / 2 };
}

const arbSystem = fc.record({
  seed: fc.integer({ min: 1, max: 1e6 }),
  pipes: fc.integer({ min: 1, max: 14 }),
  inlets: fc.integer({ min: 2, max: 8 }),
  loops: fc.integer({ min: 0, max: 2 }),
});

describe('solver properties on random systems', () => {
  it('mass balances at every node to 1e-9 of the total flow', () => {
    let solved = 0;
    fc.assert(
      fc.property(arbSystem, fc.integer({ min: 1, max: 4 }), (spec, k) => {
        const m = randomSystem(spec);
        const g = buildNetworkGraph(m, { laws: defaultElementLaws });
        const open = m.inlets.slice(0, k).map((i) => ({ inlet: i.name, toolState: 'working' as const }));
        const r = solve(g, open);
        if (!r.ok) return; // typed failures are another property
        const { worst, total } = imbalances(g, r);
        expect(total).toBeGreaterThan(0);
        expect(worst).toBeLessThanOrEqual(1e-9 * total + 1e-15);
        solved++;
      }),
      { numRuns: 60 },
    );
    expect(solved).toBeGreaterThan(50); // ordinary systems solve: the property is not vacuous
  });

  it('opening one more inlet never raises the vacuum at any other open inlet', () => {
    let compared = 0;
    fc.assert(
      fc.property(arbSystem, fc.integer({ min: 1, max: 3 }), fc.boolean(), (spec, k, lifted) => {
        const m = randomSystem(spec);
        const g = buildNetworkGraph(m, { laws: defaultElementLaws });
        const toolState = lifted ? ('lifted' as const) : ('working' as const);
        const open = m.inlets.slice(0, k).map((i) => ({ inlet: i.name, toolState }));
        const extra = m.inlets[k];
        if (!extra) return;
        const before = solve(g, open);
        const after = solve(g, [...open, { inlet: extra.name, toolState }]);
        if (!before.ok || !after.ok) return;
        const p = (st: SolvedState, node: number) => st.pressurePa[st.nodes.indexOf(node)]!;
        for (const o of open) {
          const ti = g.topology.inlets.get(o.inlet)!;
          // Vacuum falls (pressure rises) or stays, to rounding.
          expect(p(after, ti.node)).toBeGreaterThanOrEqual(p(before, ti.node) - 1e-6);
          expect(p(after, ti.hoseEndNode)).toBeGreaterThanOrEqual(p(before, ti.hoseEndNode) - 1e-6);
        }
        compared++;
      }),
      { numRuns: 60 },
    );
    expect(compared).toBeGreaterThan(40);
  });

  it('two symmetric inlets get equal results', () => {
    let compared = 0;
    fc.assert(
      fc.property(
        fc.double({ min: 3, max: 40, noNaN: true }),
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        fc.constantFrom(0.05479, 0.06693, 0.0828, 0.1082),
        fc.double({ min: 15, max: 60, noNaN: true }),
        (branchM, at, d, hoseFt) => {
          const hose = { ...hose50, lengthM: hoseFt * UNITS.FT };
          const m = new SystemBuilder()
            .producer('P')
            .separator('S', 'P')
            .pipe('main', 'S', 'j', { d: 0.1082, lengthM: 12 })
            .pipe('left', 'j', 'l', { d, lengthM: branchM, joins: { kind: 'wye', angleRad: Math.PI / 4 } })
            .pipe('right', 'j', 'r', { d, lengthM: branchM, joins: { kind: 'wye', angleRad: Math.PI / 4 } })
            .inletOn('L', 'left', at * branchM, { hose })
            .inletOn('R', 'right', at * branchM, { hose })
            .build();
          const g = buildNetworkGraph(m, { laws: defaultElementLaws });
          const r = solve(g, [
            { inlet: 'L', toolState: 'working' },
            { inlet: 'R', toolState: 'working' },
          ]);
          if (!r.ok) return;
          const flow = (name: string) => r.flowKgPerS[r.elements.indexOf(g.inletElements.get(name)!.toolWorking)]!;
          const p = (name: string) => r.pressurePa[r.nodes.indexOf(g.topology.inlets.get(name)!.hoseEndNode)]!;
          expect(Math.abs(flow('L') - flow('R'))).toBeLessThanOrEqual(1e-9 * flow('L'));
          expect(Math.abs(p('L') - p('R'))).toBeLessThanOrEqual(1e-6);
          compared++;
        },
      ),
      { numRuns: 40 },
    );
    expect(compared).toBe(40);
  });

  it('converges or returns a typed failure, never NaN, even with extreme sizes', () => {
    fc.assert(
      fc.property(
        arbSystem,
        fc.constantFrom(0.003, 0.01, 0.05, 0.3),
        fc.double({ min: 0.3, max: 200, noNaN: true }),
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        (spec, d, hoseM, producerScale) => {
          const m = randomSystem(spec);
          for (const p of m.pipes) if (p.name.endsWith('1')) p.insideDiameterM = d;
          for (const i of m.inlets) i.hose = { ...i.hose, lengthM: hoseM };
          m.producers[0]!.model = {
            ...m.producers[0]!.model,
            curve: m.producers[0]!.model.curve.map((c) => ({ ...c, flowM3PerS: c.flowM3PerS * producerScale, vacuumPa: Math.min(95000, c.vacuumPa * Math.sqrt(producerScale)) })),
          };
          const g = buildNetworkGraph(m, { laws: defaultElementLaws });
          const r = solve(g, m.inlets.slice(0, 3).map((i) => ({ inlet: i.name, toolState: 'lifted' as const })));
          if (r.ok) {
            for (const v of r.pressurePa) expect(Number.isFinite(v) && v > 0).toBe(true);
            for (const v of r.flowKgPerS) expect(Number.isFinite(v)).toBe(true);
          } else {
            expect(CAUSES).toContain(r.failure.cause);
            expect(r.failure.message.length).toBeGreaterThan(0);
          }
        },
      ),
      { numRuns: 80 },
    );
  });
});
