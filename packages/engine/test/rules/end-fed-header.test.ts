import { describe, expect, it } from 'vitest';
import { endFedHeader } from '../../src/rules/end-fed-header.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import type { SystemModel } from '../../src/network/model.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { analysis, FT, INHG, inlet, inletAnalysis, pipe, pipeAnalysis, system, worstCase } from './fixtures.js';

const run = (m: SystemModel, a: SystemAnalysis) => endFedHeader.check(m, a, createRuleSettings(endFedHeader, m));

// A 200 ft header in two 100 ft pipes, fed at 'plant'; inlets at 10, 90, 150 and 200 ft.
const h1 = pipe('h1', 'plant', 'j1', { lengthFt: 100 });
const h2 = pipe('h2', 'j1', 'j2', { lengthFt: 100 });
const model = system({
  pipes: [h1, h2],
  inlets: [
    inlet('a', { kind: 'on-pipe', pipe: 'h1', distanceM: 10 * FT }),
    inlet('b', { kind: 'on-pipe', pipe: 'h1', distanceM: 90 * FT }),
    inlet('c', { kind: 'on-pipe', pipe: 'h2', distanceM: 50 * FT }),
    inlet('d', 'j2'),
  ],
});
const header = (toolInHg: Record<string, number>) =>
  analysis({
    pipes: [
      pipeAnalysis(h1, { servedInlets: ['a', 'b', 'c', 'd'] }),
      pipeAnalysis(h2, { servedInlets: ['c', 'd'] }),
    ],
    inlets: Object.entries(toolInHg).map(([name, v]) =>
      inletAnalysis(name, { worstCase: worstCase({ openInlets: [name], toolVacuumPa: v * INHG, requiredToolVacuumPa: 3 * INHG }) }),
    ),
  });

describe('end-fed-header', () => {
  // Thresholds (50 ft, 3 inlets) and the balance test (near spare >= far shortfall): common practice.
  it('suggests a centre feed with the far and near numbers when the near end can spare the far shortfall', () => {
    const f = run(model, header({ a: 5, b: 4.5, c: 3.2, d: 2.6 }));
    expect(f).toHaveLength(1);
    expect(f[0]!.severity).toBe('info');
    expect(f[0]!.message).toMatch(/2\.60 inHg at 'd'.*4\.50 inHg at near-end 'b'/);
    expect(f[0]!.fix!['feedAt']).toEqual({ kind: 'on-pipe', pipe: 'h2', distanceM: 0 });
    expect(f[0]!.related?.map((r) => r.element.name)).toEqual(['d', 'b']);
  });
  it('stays silent when the near end cannot spare the shortfall (a centre feed would not fix it)', () => {
    expect(run(model, header({ a: 3.3, b: 3.2, c: 3.1, d: 2.6 }))).toEqual([]);
  });
  it('stays silent when nothing is starved', () => {
    expect(run(model, header({ a: 5, b: 4.5, c: 3.2, d: 3.1 }))).toEqual([]);
  });
  it('ignores headers shorter than the minimum length', () => {
    const m = structuredClone(model);
    m.rules.settings.push({ rule: 'end-fed-header', parameter: 'minLength', value: 250 * FT });
    expect(run(m, header({ a: 5, b: 4.5, c: 3.2, d: 2.6 }))).toEqual([]);
  });
});
