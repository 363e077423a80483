import { describe, expect, it } from 'vitest';
import { producerShort } from '../../src/rules/producer-short.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analysis, CFM, INHG, producerPoint, system } from './fixtures.js';

const run = (m: SystemModel, a: SystemAnalysis) => producerShort.check(m, a, createRuleSettings(producerShort, m));
const m = system();

describe('producer-short', () => {
  it('flags a negative margin with the demand and curve flows', () => {
    // Demand 200 scfm at 10 inHg; margin -10 % means the curve gives 180 scfm there.
    const f = run(m, analysis({ producers: [producerPoint('exh', { marginFraction: -0.1 })] }));
    expect(f).toHaveLength(1);
    expect(f[0]!.severity).toBe('error');
    expect(f[0]!.element).toEqual({ kind: 'producer', name: 'exh', property: 'model' });
    expect(f[0]!.message).toMatch(/200 scfm at 10\.0 inHg.*180 scfm/);
  });
  it('flags a case past the end of the curve', () => {
    const f = run(m, analysis({ producers: [producerPoint('exh', { marginFraction: null, limited: 'curve-end', flowStdM3PerS: 300 * CFM, vacuumPa: 2 * INHG })] }));
    expect(f[0]!.message).toMatch(/end of its curve/);
  });
  it('flags a case with no operating point', () => {
    const a = analysis({
      failures: [{ stage: 'worst-case', subject: 'i1', openInlets: ['i1', 'i2'], cause: 'infeasible-demand', element: { kind: 'producer', name: 'exh' }, message: 'flow beyond the curve' }],
    });
    const f = run(m, a);
    expect(f.map((x) => x.element.name)).toEqual(['exh']);
    expect(f[0]!.related?.map((r) => r.element.name)).toEqual(['i1', 'i2']);
  });
  it('a demand search that finds no vacuum meeting the need fires, worded as such', () => {
    const a = analysis({
      failures: [{ stage: 'demand', subject: 'exh', openInlets: ['i1', 'i2'], cause: 'infeasible-demand', element: { kind: 'producer', name: 'exh' }, message: 'no producer vacuum gives every open tool the vacuum it needs' }],
    });
    const f = run(m, a);
    expect(f.map((x) => x.element.name)).toEqual(['exh']);
    expect(f[0]!.message).toMatch(/no producer vacuum gives every open tool/);
    expect(f[0]!.message).not.toMatch(/no operating point/);
  });
  it('agrees with the failure list: only design stages (tools working) fire, not scenarios or test readings', () => {
    const failure = (stage: string) => ({ stage, subject: 's', openInlets: ['i1'], cause: 'infeasible-demand' as const, element: { kind: 'producer' as const, name: 'exh' }, message: 'past the curve' });
    for (const stage of ['single-operator', 'worst-case', 'design', 'demand']) expect(run(m, analysis({ failures: [failure(stage)] })), stage).toHaveLength(1);
    for (const stage of ['scenario', 'commissioning', 'max-velocity']) expect(run(m, analysis({ failures: [failure(stage)] })), stage).toEqual([]);
  });
  it('passes a positive margin', () => {
    expect(run(m, analysis({ producers: [producerPoint('exh', { marginFraction: 0.02 })] }))).toEqual([]);
  });
});
