import { describe, expect, it } from 'vitest';
import { producerMargin } from '../../src/rules/producer-margin.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analysis, producerPoint, system } from './fixtures.js';

const run = (m: SystemModel, a: SystemAnalysis) => producerMargin.check(m, a, createRuleSettings(producerMargin, m));
const at = (margin: number) => analysis({ producers: [producerPoint('exh', { marginFraction: margin })] });

describe('producer-margin', () => {
  // Default 10 % flow margin: common practice.
  it('flags 5 % against the default 10 %, passes 12 %, and leaves negatives to producer-short', () => {
    const f = run(system(), at(0.05));
    expect(f).toHaveLength(1);
    expect(f[0]!.message).toMatch(/5 % margin.*10 % required/);
    expect(run(system(), at(0.12))).toEqual([]);
    expect(run(system(), at(-0.05))).toEqual([]);
  });
  it('never prints a margin just under the limit as equal to it', () => {
    const f = run(system(), at(0.096));
    expect(f[0]!.message).toMatch(/has 9\.6 % margin over the demand, below the 10 % required/);
    expect(run(system(), at(0.0999))[0]!.message).toMatch(/has 9\.99 % margin over the demand, below the 10 % required/);
  });
  it('takes the design basis margin line, and a rule setting over it', () => {
    const m = system({ design: { areas: [], debris: 'general', producerMarginFraction: 0.03 } });
    expect(run(m, at(0.05))).toEqual([]);
    m.rules.settings.push({ rule: 'producer-margin', parameter: 'minMargin', value: 0.2 });
    expect(run(m, at(0.15))).toHaveLength(1);
  });
});
