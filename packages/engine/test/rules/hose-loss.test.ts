import { describe, expect, it } from 'vitest';
import { hoseLoss } from '../../src/rules/hose-loss.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analysis, FT, IN, INHG, inlet, inletAnalysis, system, worstCase } from './fixtures.js';

const run = (m: SystemModel, a: SystemAnalysis) => hoseLoss.check(m, a, createRuleSettings(hoseLoss, m));
const m = system({ inlets: [inlet('i1', 'a')] });
const withLoss = (valveInHg: number, lossInHg: number) =>
  analysis({
    inlets: [inletAnalysis('i1', { worstCase: worstCase({ inletVacuumPa: valveInHg * INHG, hoseLossPa: lossInHg * INHG, toolVacuumPa: (valveInHg - lossInHg) * INHG }) })],
  });

describe('hose-loss', () => {
  // Defaults: half the valve vacuum (common practice) and 10 inHg absolute
  // (trade figure: 25-100 ft hoses lose up to about 10 inHg at the long, narrow end).
  it('flags a hose losing 7 of 12 inHg (58 %) and estimates a length and bore that would do', () => {
    const f = run(m, withLoss(12, 7));
    expect(f).toHaveLength(1);
    expect(f[0]!.element).toEqual({ kind: 'inlet', name: 'i1', property: 'hose' });
    // allowed 6 inHg: 50 ft x 6/7 = 42.9 ft; bore 1.5 in x (7/6)^(1/5) = 1.547 in (loss ~ L, ~ D^-5).
    expect(f[0]!.fix!['maxHoseLengthM'] as number).toBeCloseTo(((50 * 6) / 7) * FT, 6);
    expect(f[0]!.fix!['minHoseBoreM'] as number).toBeCloseTo(1.5 * IN * (7 / 6) ** 0.2, 6);
  });
  it('flags 11 inHg lost of 25 (44 %) by the 10 inHg absolute limit', () => {
    const f = run(m, withLoss(25, 11));
    expect(f).toHaveLength(1);
    expect(f[0]!.message).toMatch(/more than 10\.0 inHg/);
  });
  it('passes 4 of 10 inHg', () => {
    expect(run(m, withLoss(10, 4))).toEqual([]);
  });
  it('checks the lone-operator case too, where the hose carries most air', () => {
    const a = withLoss(10, 4);
    a.inlets[0]!.alone = {
      name: 'i1',
      toolState: 'working',
      inletVacuumPa: 12 * INHG,
      toolVacuumPa: 5 * INHG,
      massFlowKgPerS: 0.05,
      flowStdM3PerS: 0.04,
      roomFlowM3PerS: 0.04,
      toolAirPowerW: 400,
      hoseLossPa: 7 * INHG,
    };
    const f = run(m, a);
    expect(f).toHaveLength(1);
    expect(f[0]!.message).toMatch(/alone/);
  });
  it('takes an inlet setting for the share', () => {
    const i = inlet('i1', 'a');
    i.rules.settings.push({ rule: 'hose-loss', parameter: 'share', value: 0.7 });
    expect(run(system({ inlets: [i] }), withLoss(12, 7))).toEqual([]);
  });
});
