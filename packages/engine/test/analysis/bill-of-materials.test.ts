import { describe, expect, it } from 'vitest';
import { billOfMaterials } from '../../src/analysis/bill-of-materials.js';
import { SystemBuilder, hose50, floorTool } from '../fixtures/system-builder.js';

describe('billOfMaterials', () => {
  const bend = { kind: 'bend' as const, angleRad: Math.PI / 2, count: 2, radiusRatio: 1.5 };
  const m = new SystemBuilder()
    .producer('P')
    .separator('S', 'P')
    .pipe('main', 'S', 'j', { d: 0.108, nominal: 0.1016, lengthM: 20, fittings: [bend] })
    .pipe('a', 'j', 'x', { d: 0.0828, nominal: 0.0762, lengthM: 7, joins: { kind: 'wye', angleRad: Math.PI / 4 }, fittings: [bend] })
    .pipe('b', 'j', 'y', { d: 0.0828, nominal: 0.0762, lengthM: 5, joins: { kind: 'tee' }, fittings: [{ kind: 'reducer' }] })
    .inletAt('A', 'x')
    .inletAt('B', 'y')
    .inletOn('C', 'a', 3, { hose: { ...hose50, name: 'hose-35', lengthM: 10.67 } })
    .cleanoutAt('j')
    .build();
  const bom = billOfMaterials(m, 2);

  it('sums pipe length by spec and nominal size', () => {
    expect(bom.pipes).toEqual([
      { spec: 'steel-10', material: 'steel', nominalSizeM: 0.0762, insideDiameterM: 0.0828, lengthM: 12, runs: 2 },
      { spec: 'steel-10', material: 'steel', nominalSizeM: 0.1016, insideDiameterM: 0.108, lengthM: 20, runs: 1 },
    ]);
  });

  it('counts fittings by kind, size and angle', () => {
    const bends = bom.fittings.filter((f) => f.kind === 'bend');
    expect(bends.map((b) => [b.nominalSizeM, b.count])).toEqual([
      [0.0762, 2],
      [0.1016, 2],
    ]);
    expect(bom.fittings.filter((f) => f.kind === 'wye')).toHaveLength(1);
    expect(bom.fittings.filter((f) => f.kind === 'tee')).toHaveLength(1);
    expect(bom.fittings.filter((f) => f.kind === 'reducer')).toHaveLength(1);
  });

  it('counts inlets and cleanouts, and enough hoses and tools for the design operators', () => {
    expect(bom.inlets).toBe(3);
    expect(bom.cleanouts).toBe(1);
    // Two inlets use hose-50 but only k = 2 operators work at once: 2; hose-35 serves one inlet: 1.
    expect(bom.hoses).toEqual([
      { kind: 'hose-50', lengthM: hose50.lengthM, boreM: hose50.boreM, count: 2 },
      { kind: 'hose-35', lengthM: 10.67, boreM: hose50.boreM, count: 1 },
    ]);
    expect(bom.tools).toEqual([{ kind: floorTool.name, count: 2 }]);
    expect(bom.producers).toEqual([{ model: 'exhauster-400', count: 1 }]);
    expect(bom.separators).toEqual([{ model: 'S-model', count: 1 }]);
  });
});
