import { describe, expect, it } from 'vitest';
import { toolChoked } from '../../src/rules/tool-choked.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { runRules } from '../../src/rules/index.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analyseSystem } from '../../src/analysis/analyse-system.js';
import { analysis, INHG, inlet, inletAnalysis, system, worstCase } from './fixtures.js';
import { exhauster, hose50, SystemBuilder, UNITS } from '../fixtures/system-builder.js';

const run = (m: SystemModel, a: SystemAnalysis) => toolChoked.check(m, a, createRuleSettings(toolChoked, m));
const m = system({ inlets: [inlet('i1', 'a')] });

describe('tool-choked', () => {
  it('reports an inlet whose tool runs choked in its worst case, with the critical vacuum', () => {
    const a = analysis({ inlets: [inletAnalysis('i1', { worstCase: worstCase({ toolVacuumPa: 16 * INHG, limited: 'choked' }) })] });
    const f = run(m, a);
    expect(f).toHaveLength(1);
    expect(f[0]!.element).toEqual({ kind: 'inlet', name: 'i1', property: 'tool' });
    // Critical vacuum (1 - 0.5283) x 101,325 Pa = 47,796 Pa = 14.1 inHg (isentropic nozzle, CHECKS.md).
    expect(f[0]!.fix!['criticalVacuumPa'] as number).toBeCloseTo((1 - 0.5283) * 101325, -1);
    expect(f[0]!.message).toMatch(/14\.1 inHg/);
    expect(f[0]!.message).toMatch(/local codes/);
  });
  it('is silent when no tool is choked', () => {
    expect(run(m, analysis({ inlets: [inletAnalysis('i1', { worstCase: worstCase() })] }))).toEqual([]);
  });
  it('fires on an analysed deep-vacuum system, and no unsolved case is reported for it', () => {
    // A producer holding about 79 kPa of vacuum and a short, wide hose: the tool chokes.
    const model = new SystemBuilder('deep', { operators: 1 })
      .producer('P')
      .separator('S', 'P')
      .pipe('main', 'S', 'j', { d: 0.108, lengthM: 10 })
      .inletAt('A', 'j', { hose: { ...hose50, lengthM: 1, boreM: 3 * UNITS.IN } })
      .build();
    model.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 80000 }, { flowM3PerS: 2000 * UNITS.CFM, vacuumPa: 78000 }] };
    const a = analyseSystem(model);
    expect(a.failures).toEqual([]);
    const codes = runRules(model, a).findings.map((f) => f.code);
    expect(codes).toContain('tool-choked');
  });
});
