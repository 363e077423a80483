import { describe, expect, it } from 'vitest';
import { buildNetworkGraph, caseElements } from '../../src/network/graph.js';
import { solveNetwork } from '../../src/solve/solve-network.js';
import { simpleLaws } from '../fixtures/simple-element-laws.js';
import { SystemBuilder } from '../fixtures/system-builder.js';

function library() {
  return new SystemBuilder('library')
    .producer('P')
    .filter('F', 'P')
    .separator('S', 'F')
    .pipe('main', 'S', 'j1', { d: 0.108, lengthM: 20 })
    .pipe('riser', 'j1', 'top', {
      d: 0.0828,
      lengthM: 12,
      joins: { kind: 'wye', angleRad: Math.PI / 4 },
      fittings: [{ kind: 'bend', angleRad: Math.PI / 2, count: 2, radiusRatio: 1.5 }],
    })
    .pipe('run', 'j1', 'east', { d: 0.108, lengthM: 15 })
    .inletOn('A1', 'riser', 3)
    .inletAt('A2', 'top')
    .inletAt('B1', 'east');
}

describe('buildNetworkGraph', () => {
  it('makes nodes for points, units, pipe splits and hose ends, and elements in the air-flow direction', () => {
    const g = buildNetworkGraph(library().build(), { laws: simpleLaws });
    const kinds = g.topology.nodes.map((n) => n.kind);
    expect(kinds.filter((k) => k === 'atmosphere')).toHaveLength(1);
    expect(kinds.filter((k) => k === 'pipe-split')).toHaveLength(1); // A1 part-way along the riser
    expect(kinds.filter((k) => k === 'hose-end')).toHaveLength(3);
    expect(g.topology.pipeSegments.get('riser')).toHaveLength(2);
    // The producer runs from its inlet to the atmosphere; a pipe from its far end to its producer side.
    const prod = g.topology.elements.find((e) => e.kind === 'producer')!;
    expect(prod.b).toBe(g.topology.atmosphere);
    const main = g.topology.elements[g.topology.pipeSegments.get('main')![0]!]!;
    expect(g.topology.nodes[main.a]!.key).toBe('j1');
    expect(g.topology.nodes[main.b]!.key).toBe('S');
    expect(g.topology.nodes[main.b]!.kind).toBe('separator-inlet');
  });

  it('spreads bends over the split pipe by length and puts the junction entry at the producer-side end', () => {
    const g = buildNetworkGraph(library().build(), { laws: simpleLaws });
    const [s0, s1] = g.topology.pipeSegments.get('riser')!;
    // simple laws: bend K 0.3 each (two bends), wye entry 0.28; A1 at 3 m of 12 m.
    expect(g.sumK[s0!]).toBeCloseTo(0.6 * (3 / 12) + 0.28, 12);
    expect(g.sumK[s1!]).toBeCloseTo(0.6 * (9 / 12), 12);
    expect(g.topology.elements[s0!]!.pipe!.lengthM).toBeCloseTo(3, 12);
  });

  it('adds a transition loss for a straight run-on into a parent of another size only', () => {
    const m = new SystemBuilder().producer('P').pipe('a', 'P', 'x', { d: 0.108 }).pipe('b', 'x', 'y', { d: 0.0828 }).inletAt('I', 'y').build();
    const g = buildNetworkGraph(m, { laws: simpleLaws });
    expect(g.sumK[g.topology.pipeSegments.get('b')![0]!]).toBeCloseTo(0.1, 12);
    expect(g.sumK[g.topology.pipeSegments.get('a')![0]!]).toBe(0);
  });

  it('solves a case with mass balance at the junction', () => {
    const g = buildNetworkGraph(library().build(), { laws: simpleLaws });
    const c = caseElements(g, [
      { inlet: 'A1', toolState: 'working' },
      { inlet: 'B1', toolState: 'working' },
    ]);
    expect(c.ok).toBe(true);
    if (!c.ok) return;
    const res = solveNetwork(g.net, c.elements);
    expect(res.ok).toBe(true);
    if (!res.ok) return;
    const flow = (e: number) => res.flowKgPerS[res.elements.indexOf(e)]!;
    const main = flow(g.topology.pipeSegments.get('main')![0]!);
    const riser0 = flow(g.topology.pipeSegments.get('riser')![0]!);
    const riser1 = flow(g.topology.pipeSegments.get('riser')![1]!);
    const run = flow(g.topology.pipeSegments.get('run')![0]!);
    expect(Math.abs(main - (riser0 + run))).toBeLessThan(1e-9 * main); // converged to 1e-9 of the total flow
    expect(riser1).toBe(0); // beyond A1 nothing is open: a dead leg
    expect(riser0).toBeGreaterThan(0);
  });

  it('a zero-bore or zero-length pipe is an invalid element, named', () => {
    const m = library().build();
    m.pipes[1]!.insideDiameterM = 0;
    const g = buildNetworkGraph(m, { laws: simpleLaws });
    const c = caseElements(g, [{ inlet: 'A2', toolState: 'working' }]);
    const res = c.ok ? solveNetwork(g.net, c.elements) : null;
    expect(res?.ok === false && res.failure.cause).toBe('invalid-element');
    expect(res?.ok === false && res.failure.element).toEqual({ kind: 'pipe', name: 'riser' });

    const m2 = library().build();
    m2.pipes[2]!.lengthM = 0;
    const g2 = buildNetworkGraph(m2, { laws: simpleLaws });
    const c2 = caseElements(g2, [{ inlet: 'B1', toolState: 'working' }]);
    const res2 = c2.ok ? solveNetwork(g2.net, c2.elements) : null;
    expect(res2?.ok === false && res2.failure.cause).toBe('invalid-element');
    expect(res2?.ok === false && res2.failure.element?.name).toBe('run');
  });

  it('an inlet on piping that reaches no producer is no-path; an unknown inlet too', () => {
    const m = library().pipe('island', 'nowhere', 'x').inletAt('X1', 'x').build();
    const g = buildNetworkGraph(m, { laws: simpleLaws });
    const c = caseElements(g, [{ inlet: 'X1', toolState: 'working' }]);
    const res = c.ok ? solveNetwork(g.net, c.elements) : null;
    expect(res?.ok === false && res.failure.cause).toBe('no-path');
    expect(res?.ok === false && res.failure.element).toEqual({ kind: 'inlet', name: 'X1', property: 'tool' });
    const c2 = caseElements(g, [{ inlet: 'nope', toolState: 'working' }]);
    expect(c2.ok === false && c2.failure.cause).toBe('no-path');
  });
});
