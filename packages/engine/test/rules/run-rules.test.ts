import { describe, expect, it } from 'vitest';
import { ALL_RULES, RULES, runRules } from '../../src/rules/index.js';
import type { Rule } from '../../src/rules/rule.js';
import { analysis, inlet, pipe, system } from './fixtures.js';

const bend = { kind: 'bend' as const, angleRad: Math.PI / 2, count: 1, radiusRatio: 1 };

describe('runRules', () => {
  const model = () =>
    system({
      pipes: [pipe('p', 'plant', 'a', { fittings: [bend], lengthFt: 4 }), pipe('q', 'plant', 'b', { fittings: [bend], lengthFt: 4 })],
      inlets: [inlet('i', 'a', { publicArea: true })],
    });

  it('runs the model rules and returns their findings', () => {
    const r = runRules(model());
    expect(r.findings.map((f) => `${f.code}:${f.element.name}`).sort()).toEqual([
      'missing-cleanout:p',
      'missing-cleanout:q',
      'short-radius-bend:p',
      'short-radius-bend:q',
      'unlocked-public-inlet:i',
    ]);
    expect(r.suppressed).toEqual([]);
  });

  it('drops findings of a rule set off and changes severities', () => {
    const m = model();
    m.rules.severities.push({ rule: 'missing-cleanout', severity: 'off' }, { rule: 'short-radius-bend', severity: 'info' });
    const r = runRules(m);
    expect(r.findings.some((f) => f.code === 'missing-cleanout')).toBe(false);
    expect(r.findings.filter((f) => f.code === 'short-radius-bend').map((f) => f.severity)).toEqual(['info', 'info']);
    expect(r.suppressed).toEqual([]);
  });

  it('moves accepted findings, with their reason, to the suppressed list', () => {
    const m = model();
    m.pipes[0]!.rules.suppressions.push({ rule: 'short-radius-bend', reason: 'existing fitting, replaced in phase 2' });
    m.rules.suppressions.push({ rule: 'missing-cleanout', reason: 'cleanouts are on the mechanical drawings' });
    const r = runRules(m);
    expect(r.findings.map((f) => `${f.code}:${f.element.name}`).sort()).toEqual(['short-radius-bend:q', 'unlocked-public-inlet:i']);
    expect(r.suppressed.map((s) => [s.finding.code, s.finding.element.name, s.scope, s.reason])).toEqual([
      ['missing-cleanout', 'p', 'system', 'cleanouts are on the mechanical drawings'],
      ['missing-cleanout', 'q', 'system', 'cleanouts are on the mechanical drawings'],
      ['short-radius-bend', 'p', 'element', 'existing fitting, replaced in phase 2'],
    ]);
  });

  it('ignores an acceptance without a reason and says so', () => {
    const m = model();
    m.pipes[0]!.rules.suppressions.push({ rule: 'short-radius-bend', reason: '' });
    const r = runRules(m);
    expect(r.findings.filter((f) => f.code === 'short-radius-bend')).toHaveLength(2);
    const w = r.findings.find((f) => f.code === 'accept-without-reason');
    expect(w?.element).toEqual({ kind: 'pipe', name: 'p', property: 'accept' });
    expect(w?.message).toMatch(/because/);
  });

  it('reports unknown rules and parameters, unusable values and stale acceptances', () => {
    const m = model();
    m.rules.settings.push(
      { rule: 'no-such-rule', parameter: 'x', value: 1 },
      { rule: 'short-radius-bend', parameter: 'radius', value: 2 },
      { rule: 'short-radius-bend', parameter: 'minRadius', value: Number.POSITIVE_INFINITY },
    );
    m.rules.severities.push({ rule: 'typo-rule', severity: 'error' });
    m.inlets[0]!.rules.suppressions.push({ rule: 'starved-inlet', reason: 'x' }, { rule: 'tee-branch-entry', reason: 'old' });
    m.pipes[1]!.rules.suppressions.push({ rule: 'tee-branch-entry', reason: 'fixed since' });
    const r = runRules(m);
    const codes = r.findings.map((f) => f.code);
    expect(codes.filter((c) => c === 'unknown-rule')).toHaveLength(3);
    expect(codes.filter((c) => c === 'invalid-rule-setting')).toHaveLength(1);
    // tee-branch-entry ran and matched nothing: both of its acceptances are stale.
    // starved-inlet did not run (no analysis): its acceptance is not judged.
    const stale = r.findings.filter((f) => f.code === 'unused-accept').map((f) => f.element.name);
    expect(stale.sort()).toEqual(['i', 'q']);
  });

  it('skips the flow rules without an analysis and runs them with one', () => {
    const m = model();
    expect(runRules(m).findings.some((f) => f.code === 'starved-inlet')).toBe(false);
    const a = analysis({
      inlets: [
        {
          name: 'i',
          alone: null,
          worstCase: {
            openInlets: ['i'],
            method: 'exact',
            setsEvaluated: 1,
            inletVacuumPa: 5000,
            toolVacuumPa: 3000,
            flowStdM3PerS: 0.04,
            toolAirPowerW: 100,
            hoseLossPa: 2000,
            requiredToolVacuumPa: 4000,
          },
        },
      ],
    });
    expect(runRules(m, a).findings.some((f) => f.code === 'starved-inlet')).toBe(true);
  });

  it('turns a rule that throws into a rule-failed finding', () => {
    const broken: Rule = {
      code: 'broken-rule',
      title: 'Broken',
      defaultSeverity: 'warning',
      parameters: [],
      needsAnalysis: false,
      check() {
        throw new Error('boom');
      },
    };
    const r = runRules(model(), undefined, { rules: [broken] });
    expect(r.findings.map((f) => f.code)).toEqual(['rule-failed']);
    expect(r.findings[0]!.message).toMatch(/broken-rule.*boom/);
  });

  it('does not throw on a model with missing parts', () => {
    const bad = { name: 'x' } as unknown as Parameters<typeof runRules>[0];
    expect(runRules(bad, analysis())).toEqual({ findings: [], suppressed: [] });
  });
});

describe('RULES table', () => {
  it('lists every rule once with a kebab-case code, and every parameter with a sourced, usable default', () => {
    const codes = RULES.map((r) => r.code);
    expect(new Set(codes).size).toBe(codes.length);
    for (const r of ALL_RULES) expect(codes).toContain(r.code);
    for (const r of RULES) {
      expect(r.code).toMatch(/^[a-z]+(-[a-z]+)*$/);
      for (const p of r.parameters) {
        expect(p.source.length).toBeGreaterThan(5);
        expect(Number.isFinite(p.default)).toBe(true);
        const [low, high] = p.range ?? [0, Infinity];
        expect(p.default).toBeGreaterThanOrEqual(low);
        expect(p.default).toBeLessThanOrEqual(high);
        // camelCase in the engine; files write it kebab-case (the language converts).
        expect(p.name).toMatch(/^[a-z]+([A-Z][a-z]+)*$/);
      }
    }
  });
  it('names the codes the product documents', () => {
    for (const code of [
      'slow-carrying-velocity',
      'fast-velocity',
      'hose-loss',
      'starved-inlet',
      'producer-short',
      'producer-margin',
      'missing-cleanout',
      'tee-branch-entry',
      'short-radius-bend',
      'shrinking-pipe',
      'unlocked-public-inlet',
      'end-fed-header',
      'dust-nonconductive',
      'dust-bonding',
      'dust-separator-indoors',
      'dust-metal',
    ]) {
      expect(RULES.map((r) => r.code)).toContain(code);
    }
  });
});
