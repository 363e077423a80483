import { describe, expect, it } from 'vitest';
import { createRuleSettings, findAcceptance, resolveSeverity } from '../../src/rules/rule-settings.js';
import type { RuleInfo } from '../../src/rules/rule.js';
import { inlet, pipe, system } from './fixtures.js';

const info: RuleInfo = {
  code: 'demo-rule',
  title: 'Demo',
  defaultSeverity: 'warning',
  needsAnalysis: false,
  parameters: [
    { name: 'limit', dimension: 'velocity', default: 10, source: 'test', description: 'x', range: [0, 100] },
    {
      name: 'by-debris',
      dimension: 'velocity',
      default: 1,
      defaultByDebris: { fine: 2, dry: 3, general: 4, heavy: 5, moist: 6 },
      source: 'test',
      description: 'y',
    },
  ],
};

describe('rule settings: parameter values', () => {
  it('resolves element setting > system setting > stated value > default', () => {
    const m = system();
    const p = pipe('p', 'plant', 'a');
    const s = createRuleSettings(info, m);
    expect(s.value('limit', p.rules)).toBe(10);
    expect(s.value('limit', p.rules, 20)).toBe(20);
    m.rules.settings.push({ rule: 'demo-rule', parameter: 'limit', value: 30 });
    expect(s.value('limit', p.rules, 20)).toBe(30);
    p.rules.settings.push({ rule: 'demo-rule', parameter: 'limit', value: 40 });
    expect(s.value('limit', p.rules, 20)).toBe(40);
    // Another element is not affected by p's setting.
    expect(s.value('limit', pipe('q', 'a', 'b').rules)).toBe(30);
  });
  it('ignores settings of other rules, other parameters and unusable values', () => {
    const m = system();
    m.rules.settings.push(
      { rule: 'other-rule', parameter: 'limit', value: 1 },
      { rule: 'demo-rule', parameter: 'other', value: 2 },
      { rule: 'demo-rule', parameter: 'limit', value: Number.NaN },
      { rule: 'demo-rule', parameter: 'limit', value: 1000 },
      { rule: 'demo-rule', parameter: 'limit', value: -1 },
    );
    expect(createRuleSettings(info, m).value('limit')).toBe(10);
  });
  it('takes the default by debris class', () => {
    const m = system({ design: { areas: [], debris: 'heavy' } });
    expect(createRuleSettings(info, m).value('by-debris')).toBe(5);
  });
  it('gives 0, not NaN or a throw, for a parameter the rule does not declare', () => {
    expect(createRuleSettings(info, system()).value('nope')).toBe(0);
  });
});

describe('rule settings: severity and acceptance', () => {
  it('overrides severity per system, the last line winning', () => {
    const m = system();
    expect(resolveSeverity(m, 'demo-rule', 'warning')).toBe('warning');
    m.rules.severities.push({ rule: 'demo-rule', severity: 'error' }, { rule: 'demo-rule', severity: 'off' });
    expect(resolveSeverity(m, 'demo-rule', 'warning')).toBe('off');
    expect(resolveSeverity(m, 'other', 'info')).toBe('info');
  });
  it('honours acceptances only with a reason, element before system', () => {
    const p = pipe('p', 'plant', 'a');
    const i = inlet('i', 'a');
    const m = system({ pipes: [p], inlets: [i] });
    const onPipe = { code: 'demo-rule', severity: 'warning' as const, message: '', element: { kind: 'pipe' as const, name: 'p' } };
    const onInlet = { ...onPipe, element: { kind: 'inlet' as const, name: 'i' } };
    p.rules.suppressions.push({ rule: 'demo-rule', reason: '   ' });
    expect(findAcceptance(m, onPipe)).toBeUndefined();
    p.rules.suppressions.push({ rule: 'demo-rule', reason: ' existing fitting ' });
    expect(findAcceptance(m, onPipe)).toEqual({ reason: 'existing fitting', scope: 'element' });
    expect(findAcceptance(m, onInlet)).toBeUndefined();
    m.rules.suppressions.push({ rule: 'demo-rule', reason: 'shown on drawings' });
    expect(findAcceptance(m, onInlet)).toEqual({ reason: 'shown on drawings', scope: 'system' });
    expect(findAcceptance(m, onPipe)?.scope).toBe('element');
  });
});
