// The status bar's text for each state of a system's analysis (the states
// of the server's analysis cache); codicon names from the VS Code product
// icon reference ($(dashboard), $(warning), $(error), $(sync~spin), $(library)).
import { describe, expect, it } from 'vitest';
import type { SystemSummary } from '../../language/src/lsp/system-requests-protocol.js';
import { summaryText } from '../src/summary-text.js';

const base: SystemSummary = { uri: 'file:///a.vacnet', version: 3, status: 'ready', system: 'Harbour offices', counts: { errors: 0, warnings: 1, infos: 0 } };
const ready: SystemSummary = {
  ...base,
  producer: { name: 'plant.producer', marginFraction: 0.29, marginText: 'margin 29 %', pointText: '244 scfm at 11.3 inHg' },
  worstInlet: { name: 'B6', text: '6.18 inHg at the tool (needs 5.00 inHg)', short: false },
};

describe('the status bar text', () => {
  it('shows the margin and the worst inlet of an analysed system, and the details on hover', () => {
    const shown = summaryText(ready);
    expect(shown.text).toBe('$(dashboard) margin 29 % \u00b7 worst B6');
    expect(shown.warning).toBe(false);
    expect(shown.tooltip).toContain('244 scfm at 11.3 inHg');
    expect(shown.tooltip).toContain('6.18 inHg at the tool (needs 5.00 inHg)');
    expect(shown.tooltip).toContain('0 errors, 1 warning, 0 infos');
  });

  it('warns when the producer falls short, a tool gets less than it needs, or the file has errors', () => {
    expect(summaryText({ ...ready, producer: { ...ready.producer!, marginFraction: -0.05, marginText: 'margin -5 %' } })).toMatchObject({ warning: true, text: '$(warning) margin -5 % \u00b7 worst B6' });
    expect(summaryText({ ...ready, worstInlet: { ...ready.worstInlet!, short: true } }).warning).toBe(true);
    expect(summaryText({ ...ready, counts: { errors: 2, warnings: 0, infos: 0 } }).warning).toBe(true);
  });

  it('says where the analysis stands when it is not in', () => {
    expect(summaryText({ ...base, status: 'pending' }).text).toBe('$(sync~spin) vacnet');
    expect(summaryText({ ...base, status: 'blocked', counts: { errors: 1, warnings: 0, infos: 0 } })).toMatchObject({ text: '$(error) 1 error', warning: true });
    expect(summaryText({ ...base, status: 'failed' }).text).toBe('$(error) no flow results');
    expect(summaryText({ ...base, status: 'no-system', system: undefined }).text).toBe('$(library) vacnet catalog');
    expect(summaryText({ ...base, producer: undefined }).text).toBe('$(dashboard) no operating point');
  });

  it('escapes names that Markdown would read as markup', () => {
    const shown = summaryText({ ...ready, system: 'Plant *A* [old]' });
    expect(shown.tooltip).toContain('Plant \\*A\\* \\[old\\]');
  });
});
