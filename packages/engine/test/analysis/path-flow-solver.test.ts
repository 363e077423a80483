/**
 * Tree cases solved by their inlet flows against the network solver
 * (Newton on every node pressure, an independent method on the same
 * equations): the same pressures and flows within the solvers' tolerance,
 * and cases the flow solver hands back rather than answer.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { PathFlowSolver, type PathEntry } from '../../src/analysis/path-flow-solver.js';
import { buildPathTree } from '../../src/analysis/path-tree.js';
import { buildNetworkGraph, caseElements, type NetworkGraph } from '../../src/network/graph.js';
import { defaultElementLaws } from '../../src/network/default-element-laws.js';
import { solveNetwork } from '../../src/solve/solve-network.js';
import type { SolveEffort } from '../../src/solve/solve-types.js';
import { building, randomSystem } from '../fixtures/random-systems.js';
import { exhauster, UNITS } from '../fixtures/system-builder.js';

const effort = (): SolveEffort => ({ solves: 0, newtonIterations: 0, elementEvaluations: 0 });

function entriesOf(g: NetworkGraph, names: string[], mode: 'working' | 'lifted' | 'orifice'): PathEntry[] {
  return names.map((name) => {
    const ti = g.topology.inlets.get(name)!;
    const ie = g.inletElements.get(name)!;
    return mode === 'orifice'
      ? { valve: ti.node, hose: -1, hoseEnd: -1, entry: ie.testOrifice }
      : { valve: ti.node, hose: ie.hose, hoseEnd: ti.hoseEndNode, entry: mode === 'lifted' ? ie.toolLifted : ie.toolWorking };
  });
}

/** Both solvers on one case; the largest relative differences in node pressures and element flows. */
function compare(g: NetworkGraph, names: string[], mode: 'working' | 'lifted' | 'orifice', start: number) {
  const tree = buildPathTree(g);
  const solver = new PathFlowSolver(g, tree);
  const fast = solver.solve(entriesOf(g, names, mode), names.map(() => start), undefined, effort());
  const c = caseElements(
    g,
    names.map((inlet) => ({ inlet, toolState: mode === 'lifted' ? ('lifted' as const) : ('working' as const) })),
    { testOrifice: mode === 'orifice' },
  );
  if (!c.ok) throw new Error(c.failure.message);
  const plain = solveNetwork(g.net, c.elements);
  return { fast, plain };
}

function worstDifference(
  fast: { nodes: number[]; pressurePa: number[]; elements: number[]; flowKgPerS: number[] },
  plain: { nodes: Int32Array; pressurePa: Float64Array; elements: Int32Array; flowKgPerS: Float64Array },
): { pressure: number; flow: number } {
  let pressure = 0;
  let flow = 0;
  const total = Math.max(...Array.from(plain.flowKgPerS, Math.abs));
  plain.nodes.forEach((node, i) => {
    const j = fast.nodes.indexOf(node);
    if (j < 0) return; // dead legs the network solver prunes and reports
    pressure = Math.max(pressure, Math.abs(fast.pressurePa[j]! - plain.pressurePa[i]!) / plain.pressurePa[i]!);
  });
  plain.elements.forEach((e, i) => {
    const j = fast.elements.indexOf(e);
    const q = j < 0 ? 0 : fast.flowKgPerS[j]!;
    flow = Math.max(flow, Math.abs(q - plain.flowKgPerS[i]!) / total);
  });
  return { pressure, flow };
}

describe('PathFlowSolver against the network solver', () => {
  it('random trees and random open sets (tools working or lifted, or test orifices): same solution', () => {
    let solved = 0;
    let answered = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1e6 }),
        fc.integer({ min: 3, max: 30 }),
        fc.integer({ min: 1, max: 5 }),
        fc.constantFrom('working' as const, 'lifted' as const, 'orifice' as const),
        fc.double({ min: 0.005, max: 0.2, noNaN: true }),
        (seed, pipes, open, mode, start) => {
          const m = randomSystem({ seed, pipes, inlets: 8, operators: open });
          const g = buildNetworkGraph(m, { laws: defaultElementLaws, testOrifice: { diameterM: 0.625 * UNITS.IN, dischargeCoefficient: 0.61 } });
          const names = m.inlets.slice(0, open).map((i) => i.name);
          const { fast, plain } = compare(g, names, mode, start);
          if (!plain.ok) {
            // A case the network solver fails is never answered by the flow solver.
            expect(fast).toBeNull();
            return;
          }
          solved++;
          if (!fast) return; // handed back: the network solver answers
          answered++;
          // Both converge to 1e-9 of the total flow (ENGINEERING.md): agreement to ~1e-8.
          const d = worstDifference(fast, plain);
          expect(d.flow).toBeLessThan(1e-8);
          expect(d.pressure).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 150, seed: 4242 },
    );
    console.log(`flow solver answered ${answered} of ${solved} cases the network solver solved`);
    expect(answered).toBeGreaterThan(0.9 * solved);
  });

  it('answers nearly every ordinary case (it is the analysis fast path)', () => {
    const m = building({ risers: 2, floors: 3, inletsPerFloor: 4, operators: 3 });
    const g = buildNetworkGraph(m, { laws: defaultElementLaws });
    const tree = buildPathTree(g);
    const solver = new PathFlowSolver(g, tree);
    let answered = 0;
    for (let i = 0; i + 3 <= m.inlets.length; i++) {
      const names = m.inlets.slice(i, i + 3).map((x) => x.name);
      if (solver.solve(entriesOf(g, names, 'working'), [0.04, 0.04, 0.04], undefined, effort())) answered++;
    }
    expect(answered).toBe(m.inlets.length - 2);
  });

  it('the producer inlet held at a pressure (the demand search) matches the network solver with that override', () => {
    const m = building({ risers: 2, floors: 2, inletsPerFloor: 3, operators: 2 });
    const g = buildNetworkGraph(m, { laws: defaultElementLaws });
    const tree = buildPathTree(g);
    const root = [...tree.rootProducers.keys()][0]!;
    const names = [m.inlets[0]!.name, m.inlets[7]!.name];
    const fast = new PathFlowSolver(g, tree).solve(entriesOf(g, names, 'working'), [0.04, 0.04], 70000, effort());
    const c = caseElements(g, names.map((inlet) => ({ inlet, toolState: 'working' as const })));
    if (!c.ok) throw new Error(c.failure.message);
    const plain = solveNetwork(g.net, c.elements.filter((e) => !g.net.drives[e]), { fixedOverridesPa: new Map([[root, 70000]]) });
    expect(fast).not.toBeNull();
    expect(plain.ok).toBe(true);
    if (fast && plain.ok) expect(worstDifference(fast, plain).flow).toBeLessThan(1e-8);
  });

  it('hands back a case whose demand lies past the producer curve (the network solver reports it)', () => {
    const m = building({ risers: 1, floors: 2, inletsPerFloor: 3, operators: 3 });
    m.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 14 * UNITS.INHG }, { flowM3PerS: 150 * UNITS.CFM, vacuumPa: 10 * UNITS.INHG }] };
    const g = buildNetworkGraph(m, { laws: defaultElementLaws });
    const names = m.inlets.slice(0, 3).map((i) => i.name);
    const { fast, plain } = compare(g, names, 'working', 0.04);
    expect(plain.ok === false && plain.failure.cause).toBe('infeasible-demand');
    expect(fast).toBeNull();
  });
});
