import { describe, expect, it } from 'vitest';
import { lowerSystem } from '../../src/lowering/lower-system.js';
import type { Document } from '../../src/generated/ast.js';
import { check, system } from '../helpers.js';

async function lower(text: string) {
  const { document, diagnostics } = await check(text);
  return { ...lowerSystem((document.parseResult.value as Document).systems[0]!), diagnostics };
}

const IN = 0.0254; // m per inch, exact (NIST SP 811)
const FT = 0.3048; // m per foot, exact (NIST SP 811)
const INHG = 3386.389; // Pa per conventional inch of mercury (NIST SP 811)

describe('lowering a system to the engine model', () => {
  it('reads trade sizes and schedules into SI', async () => {
    const { model, complete } = await lower(system('  pipe b-1 from j-1 to e-1 spec steel-10 size 1-1/2 in length 12 ft up bend 2 x 45 deg\n  inlet A1 at e-1 hose std-50 tool carpet'));
    expect(complete).toBe(true);
    const branch = model.pipes.find((p) => p.name === 'b-1')!;
    expect(branch.nominalSizeM).toBeCloseTo(1.5 * IN, 12);
    // NPS 1-1/2 schedule 10: OD 1.900 in, wall 0.109 in -> ID 1.682 in (ASME B36.10M)
    expect(branch.insideDiameterM).toBeCloseTo(1.682 * IN, 6);
    expect(branch.lengthM).toBeCloseTo(12 * FT, 12);
    expect(branch.fittings).toEqual([{ kind: 'bend', angleRad: Math.PI / 4, count: 2, radiusRatio: 1.5 }]);
  });

  it('writes pipes from the producer outward, so a pipe going up as written carries air down', async () => {
    const { model } = await lower(system('  pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length 12 ft up\n  pipe b-2 from e-1 to e-2 spec steel-10 size 2 in length 12 ft down\n  inlet A1 at e-2 hose std-50 tool carpet'));
    expect(model.pipes.find((p) => p.name === 'b-1')!.orientation).toBe('air-down');
    expect(model.pipes.find((p) => p.name === 'b-2')!.orientation).toBe('air-up');
    expect(model.pipes.find((p) => p.name === 'main-1')!.orientation).toBe('horizontal');
  });

  it('chains the plant from the producer toward the network and starts the piping at its last unit', async () => {
    const { model } = await lower(system('  inlet A1 at j-1 hose std-50 tool carpet'));
    expect(model.producers.map((p) => p.name)).toEqual(['pr.producer']);
    expect(model.separators).toMatchObject([{ name: 'pr.separator', towardProducer: 'pr.producer' }]);
    expect(model.pipes.find((p) => p.name === 'main-1')!.from).toBe('pr.separator');
  });

  it('keeps standard and actual flows apart', async () => {
    const { model } = await lower(system('  inlet A1 at j-1 hose std-50 tool carpet'));
    const producer = model.producers[0]!.model;
    expect(producer.flowBasis).toBe('standard');
    expect(producer.curve[1]!.flowM3PerS).toBeCloseTo(100 * 0.028316846592 / 60, 9); // 1 ft3 = 0.028316846592 m3 exactly
    expect(producer.curve[1]!.vacuumPa).toBeCloseTo(13 * INHG, 6);
  });

  it('keeps rule settings, severities and reasons', async () => {
    const { model } = await lower(
      system('  inlet A1 at j-1 hose std-50 tool carpet accept unlocked-public-inlet because "staff area"\n  rule short-radius-bend severity info\n  rule missing-cleanout off because "shown on drawings"'),
    );
    expect(model.inlets[0]!.rules.suppressions).toEqual([{ rule: 'unlocked-public-inlet', reason: 'staff area' }]);
    expect(model.rules.severities).toEqual([{ rule: 'short-radius-bend', severity: 'info' }]);
    expect(model.rules.suppressions).toEqual([{ rule: 'missing-cleanout', reason: 'shown on drawings' }]);
  });

  it('marks the model incomplete when a value cannot be read', async () => {
    const { complete } = await lower(system('  inlet A1 at j-1 hose std-50 tool carpet').replace('length 35 ft', 'length 35 furlongz'));
    expect(complete).toBe(false);
  });

  it('derives the ambient pressure from the site elevation', async () => {
    const { model } = await lower(system('  site elevation 1500 m temperature 20 degC\n  inlet A1 at j-1 hose std-50 tool carpet'));
    // 101325 (1 - 2.25577e-5 h)^5.25588 at 1500 m = 84,556 Pa (CHECKS.md, standard atmosphere)
    expect(model.site.ambientPressurePa).toBeCloseTo(84_556, -1);
    expect(model.site.temperatureK).toBeCloseTo(293.15, 6);
  });
});
