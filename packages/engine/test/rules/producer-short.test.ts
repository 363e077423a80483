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
  it('passes a positive margin', () => {
    expect(run(m, analysis({ producers: [producerPoint('exh', { marginFraction: 0.02 })] }))).toEqual([]);
  });
});
