import { describe, expect, it } from 'vitest';
import { DEFAULT_TOOL_NEED_PA, starvedInlet } from '../../src/rules/starved-inlet.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analysis, INH2O, INHG, inlet, inletAnalysis, system, worstCase } from './fixtures.js';

const run = (m: SystemModel, a: SystemAnalysis) => starvedInlet.check(m, a, createRuleSettings(starvedInlet, m));
const m = system({ inlets: [inlet('c4', 'a'), inlet('c5', 'b'), inlet('d1', 'c')] });
const worst = (tool: number, need: number | null) =>
  analysis({
    inlets: [inletAnalysis('c4', { worstCase: worstCase({ openInlets: ['c4', 'c5', 'd1'], toolVacuumPa: tool, requiredToolVacuumPa: need }) })],
  });

describe('starved-inlet', () => {
  it('flags a tool short of its need and names the others open in the worst case', () => {
    const f = run(m, worst(2.5 * INHG, 3 * INHG));
    expect(f).toHaveLength(1);
    expect(f[0]!.severity).toBe('error');
    expect(f[0]!.element).toEqual({ kind: 'inlet', name: 'c4', property: 'name' });
    expect(f[0]!.related?.map((r) => r.element.name)).toEqual(['c5', 'd1']);
    expect(f[0]!.fix!['shortfallPa'] as number).toBeCloseTo(0.5 * INHG, 6);
    expect(f[0]!.message).toMatch(/2\.50 inHg.*3\.00 inHg/);
  });
  it('passes a tool at or above its need', () => {
    expect(run(m, worst(3.5 * INHG, 3 * INHG))).toEqual([]);
    expect(run(m, worst(3 * INHG, 3 * INHG))).toEqual([]);
  });
  it('falls back to 40 inH2O when nothing states a need (from memory) and says so', () => {
    expect(DEFAULT_TOOL_NEED_PA).toBeCloseTo(40 * INH2O, 9);
    const f = run(m, worst(35 * INH2O, null));
    expect(f).toHaveLength(1);
    expect(f[0]!.message).toMatch(/states no need/);
    expect(run(m, worst(45 * INH2O, null))).toEqual([]);
  });
  it('lets an inlet threshold override the tool kind', () => {
    const i = inlet('c4', 'a');
    i.rules.settings.push({ rule: 'starved-inlet', parameter: 'requiredVacuum', value: 2 * INHG });
    expect(run(system({ inlets: [i] }), worst(2.5 * INHG, 3 * INHG))).toEqual([]);
  });
});
