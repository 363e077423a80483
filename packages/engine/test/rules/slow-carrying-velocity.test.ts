import { describe, expect, it } from 'vitest';
import { HORIZONTAL_CARRYING_VELOCITY, slowCarryingVelocity } from '../../src/rules/slow-carrying-velocity.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import type { Pipe, SystemModel } from '../../src/network/model.js';
import { analysis, FPM, IN, INHG, inletAnalysis, pipe, pipeAnalysis, pvc, system, worstCase } from './fixtures.js';

// Hand-made analyses: the rule is tested on the numbers it reads, not on a solve.
const run = (m: SystemModel, a: SystemAnalysis) => slowCarryingVelocity.check(m, a, createRuleSettings(slowCarryingVelocity, m));
const one = (p: Pipe, v: number, over = {}) => analysis({ pipes: [pipeAnalysis(p, { minVelocityMPerS: v, minVelocityInlet: 'i1', ...over })] });

describe('slow-carrying-velocity thresholds', () => {
  // ACGIH Industrial Ventilation minimum duct design velocities (CHECKS.md), low end of each band:
  // fine 2500 fpm (12-15 m/s), dry 3000 (15-20), general 3500 (18-20), heavy 4000 (20-23), moist 4500 (> 23).
  it('takes the low end of each ACGIH band in fpm', () => {
    expect(HORIZONTAL_CARRYING_VELOCITY.fine / FPM).toBeCloseTo(2500, 6);
    expect(HORIZONTAL_CARRYING_VELOCITY.dry / FPM).toBeCloseTo(3000, 6);
    expect(HORIZONTAL_CARRYING_VELOCITY.general / FPM).toBeCloseTo(3500, 6);
    expect(HORIZONTAL_CARRYING_VELOCITY.heavy / FPM).toBeCloseTo(4000, 6);
    expect(HORIZONTAL_CARRYING_VELOCITY.moist / FPM).toBeCloseTo(4500, 6);
    // and agrees with the band's rounded m/s column in CHECKS.md
    expect(HORIZONTAL_CARRYING_VELOCITY.fine).toBeCloseTo(12.7, 1);
    expect(HORIZONTAL_CARRYING_VELOCITY.general).toBeCloseTo(17.8, 1);
    expect(HORIZONTAL_CARRYING_VELOCITY.heavy).toBeCloseTo(20.3, 1);
  });

  it('flags a horizontal pipe below 3500 fpm for general debris, not above (ACGIH)', () => {
    const p = pipe('main', 'plant', 'a', { sizeIn: 4 });
    const m = system({ pipes: [p] });
    const f = run(m, one(p, 3400 * FPM));
    expect(f).toHaveLength(1);
    expect(f[0]!.element).toEqual({ kind: 'pipe', name: 'main', property: 'size' });
    expect(f[0]!.related?.[0]?.element).toEqual({ kind: 'inlet', name: 'i1' });
    expect(f[0]!.message).toMatch(/3400 fpm.*3500 fpm/);
    expect(run(m, one(p, 3600 * FPM))).toEqual([]);
  });

  it('uses the debris class: 3800 fpm is enough for general (3500) but not heavy (4000) (ACGIH)', () => {
    const p = pipe('main', 'plant', 'a', { sizeIn: 4 });
    expect(run(system({ pipes: [p] }), one(p, 3800 * FPM))).toEqual([]);
    expect(run(system({ pipes: [p], design: { areas: [], debris: 'heavy' } }), one(p, 3800 * FPM))).toHaveLength(1);
  });

  it('lets a vertical run go to 0.875 of the horizontal value (from memory, common practice)', () => {
    // 0.875 x 3500 = 3062.5 fpm
    const riser = pipe('riser', 'plant', 'a', { sizeIn: 4, orientation: 'air-up' });
    const flat = pipe('flat', 'plant', 'b', { sizeIn: 4 });
    const m = system({ pipes: [riser, flat] });
    const a = analysis({
      pipes: [pipeAnalysis(riser, { minVelocityMPerS: 3100 * FPM }), pipeAnalysis(flat, { minVelocityMPerS: 3100 * FPM })],
    });
    expect(run(m, a).map((f) => f.element.name)).toEqual(['flat']);
    expect(run(m, analysis({ pipes: [pipeAnalysis(riser, { minVelocityMPerS: 3000 * FPM })] }))).toHaveLength(1);
  });

  it('takes the system setting `min-velocity 4000 fpm` and a per-pipe setting over it', () => {
    const p = pipe('main', 'plant', 'a', { sizeIn: 4 });
    const m = system({ pipes: [p] });
    m.rules.settings.push({ rule: 'slow-carrying-velocity', parameter: 'minVelocity', value: 4000 * FPM });
    expect(run(m, one(p, 3800 * FPM))).toHaveLength(1);
    p.rules.settings.push({ rule: 'slow-carrying-velocity', parameter: 'minVelocity', value: 3000 * FPM });
    expect(run(m, one(p, 3800 * FPM))).toEqual([]);
  });

  it('adds the NFPA 654 note on combustible dust', () => {
    const p = pipe('main', 'plant', 'a', { sizeIn: 4 });
    const m = system({ pipes: [p], dust: { combustible: true, metal: false, bondedAndGrounded: true } });
    expect(run(m, one(p, 3000 * FPM))[0]!.message).toMatch(/NFPA 654/);
    expect(run(system({ pipes: [p] }), one(p, 3000 * FPM))[0]!.message).not.toMatch(/NFPA/);
  });

  it('skips pipes with no single-operator velocity', () => {
    const p = pipe('main', 'plant', 'a');
    expect(run(system({ pipes: [p] }), analysis({ pipes: [pipeAnalysis(p)] }))).toEqual([]);
  });
});

describe('slow-carrying-velocity fix', () => {
  // Bores: NPS 4 / 3 / 2-1/2 / 2 schedule 10 = 108.2 / 82.8 / 66.9 / 54.8 mm (ASME B36.10M, CHECKS.md).
  // Estimates: velocity ~ 1/D^2 (continuity), loss ~ 1/D^5 (Darcy-Weisbach at fixed f).
  const p = pipe('main', 'plant', 'a', { sizeIn: 4 });
  const withSpare = (toolInHg: number): SystemAnalysis =>
    analysis({
      pipes: [pipeAnalysis(p, { minVelocityMPerS: 12, minVelocityInlet: 'i1', lossPa: 500, servedInlets: ['i1'] })],
      inlets: [inletAnalysis('i1', { worstCase: worstCase({ toolVacuumPa: toolInHg * INHG, requiredToolVacuumPa: 3 * INHG }) })],
    });

  it('suggests the largest spec size that carries, and the smallest that still spares the inlets', () => {
    const f = run(system({ pipes: [p] }), withSpare(5));
    const fix = f[0]!.fix!;
    // 12 m/s x (108.2/82.8)^2 = 20.5 m/s >= 17.8: NPS 3 carries.
    expect(fix['nominalSizeM']).toBeCloseTo(3 * IN, 9);
    expect(fix['estimatedVelocityMPerS'] as number).toBeCloseTo(12 * (108.204 / 82.804) ** 2, 1);
    // NPS 2 would add 500 x ((108.2/54.8)^5 - 1) = ~15 kPa, more than the 2 inHg (6.8 kPa) to spare; NPS 2-1/2 adds ~5 kPa.
    expect(fix['smallestNominalSizeM']).toBeCloseTo(2.5 * IN, 9);
    expect(f[0]!.message).toMatch(/Use 3 in/);
  });

  it('offers no resize when the carrying size would starve the inlets', () => {
    // 0.1 inHg (339 Pa) to spare; NPS 3 adds ~1.4 kPa.
    const f = run(system({ pipes: [p] }), withSpare(3.1));
    expect(f).toHaveLength(1);
    expect(f[0]!.fix).toBeUndefined();
    expect(f[0]!.message).toMatch(/would cost/);
  });

  it('gives the largest bore that carries when the spec lists no sizes', () => {
    const tube = pipe('tube', 'plant', 'a', { spec: pvc(), nominalSizeM: 0.1 });
    const f = run(system({ pipes: [tube] }), analysis({ pipes: [pipeAnalysis(tube, { minVelocityMPerS: 12 })] }));
    // D sqrt(v / v_min) = 0.1 sqrt(12 / 17.78)
    expect(f[0]!.fix!['maxInsideDiameterM'] as number).toBeCloseTo(0.1 * Math.sqrt(12 / (3500 * FPM)), 6);
  });
});
