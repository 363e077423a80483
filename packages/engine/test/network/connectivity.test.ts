import { describe, expect, it } from 'vitest';
import { connectivityFindings } from '../../src/network/connectivity.js';
import { SystemBuilder } from '../fixtures/system-builder.js';

const base = () =>
  new SystemBuilder('c').producer('P').separator('S', 'P').pipe('main', 'S', 'j').pipe('b1', 'j', 'a').inletAt('A', 'a');

describe('connectivity checks (no solving)', () => {
  it('a clean tree has no findings', () => {
    expect(connectivityFindings(base().build())).toEqual([]);
  });

  it('finds an inlet and a pipe with no path to a producer', () => {
    const f = connectivityFindings(base().pipe('lost', 'q', 'r').inletAt('Z', 'r').build());
    expect(f.map((x) => `${x.code}:${x.element.name}`).sort()).toEqual(['inlet-no-path:Z', 'pipe-no-path:lost']);
  });

  it('finds a separator that leads nowhere and a system with no producer', () => {
    const m = base().build();
    m.separators[0]!.towardProducer = 'elsewhere';
    const codes = connectivityFindings(m).map((x) => `${x.code}:${x.element.name}`);
    expect(codes).toContain('unit-no-path:S');
    expect(codes).toContain('inlet-no-path:A');
    m.producers = [];
    expect(connectivityFindings(m).map((x) => x.code)).toContain('no-producer');
  });

  it('reports a dead branch once, on the pipe where it leaves the live piping', () => {
    const f = connectivityFindings(base().pipe('dead1', 'j', 'd1').pipe('dead2', 'd1', 'd2').pipe('dead3', 'd1', 'd3').build());
    expect(f).toHaveLength(1);
    expect(f[0]!.code).toBe('dangling-pipe');
    expect(f[0]!.element.name).toBe('dead1');
    expect(f[0]!.related?.map((r) => r.element.name).sort()).toEqual(['dead2', 'dead3']);
  });

  it('an inlet part-way along a pipe keeps the pipe live up to it only if something lies beyond', () => {
    const m = base().pipe('stub', 'j', 's').inletOn('M', 'stub', 4).build();
    // The stub beyond M serves nothing, but the pipe as a whole serves M: no finding.
    expect(connectivityFindings(m)).toEqual([]);
  });

  it('finds each independent loop, naming the pipes in it', () => {
    const f = connectivityFindings(base().pipe('b2', 'j', 'k').pipe('tie', 'a', 'k').inletAt('K', 'k').build());
    const loops = f.filter((x) => x.code === 'pipe-loop');
    expect(loops).toHaveLength(1);
    const names = [loops[0]!.element.name, ...loops[0]!.related!.map((r) => r.element.name)].sort();
    expect(names).toEqual(['b1', 'b2', 'tie']);
  });
});
