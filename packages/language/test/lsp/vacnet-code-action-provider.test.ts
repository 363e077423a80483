// Quick fixes: each one's edit, applied to the file, gives a file in which
// the engine no longer reports that finding (checked by running the
// analysis again on the edited text), without new errors.
import { describe, expect, it } from 'vitest';
import type { CodeAction } from 'vscode-languageserver';
import { toLspDiagnostic } from '../../src/lsp/diagnostics-publisher.js';
import { applyEdits, CATALOG, createLive, SLOW_SYSTEM } from './live-services.js';

const URI = 'file:///work/fixes/system.vacnet';
const OTHER_CATALOG_URI = 'file:///work/fixes/more/catalog.vacnet';

/** Code actions for the first finding with `code` (optionally on the element named `on`). */
async function actionsFor(text: string, code: string, others: Record<string, string> = {}, on?: string) {
  const live = createLive();
  await live.put({ ...others, [URI]: text });
  const state = await live.analysed(URI);
  const finding = state.result!.diagnostics.find((d) => d.code === code && (!on || (d.data?.element as { name?: string })?.name === on));
  if (!finding) throw new Error(`no ${code} in ${JSON.stringify(state.result!.diagnostics.map((d) => d.code))}`);
  const diagnostic = toLspDiagnostic(finding, URI);
  const document = live.documents.getDocument(live.documents.all.find((d) => d.uri.toString() === URI)!.uri)!;
  const actions = ((await live.Vacnet.lsp.CodeActionProvider!.getCodeActions(document, {
    textDocument: { uri: URI },
    range: diagnostic.range,
    context: { diagnostics: [diagnostic] },
  })) ?? []) as CodeAction[];
  return { live, actions, state };
}

/** Applies an action's edits and analyses the result: the codes found on the element, and errors anywhere. */
async function afterApplying(text: string, action: CodeAction, code: string, element: string, others: Record<string, string> = {}) {
  const edited = applyEdits(text, action.edit!.changes![URI]!);
  const live = createLive();
  const [document] = await live.put({ ...others, [URI]: edited });
  const state = await live.analysed(URI);
  const structural = (document!.diagnostics ?? []).filter((d) => d.severity === 1).map((d) => `${d.code}: ${d.message}`);
  const remaining = state.result!.diagnostics.filter((d) => d.code === code && (d.data?.element as { name?: string })?.name === element);
  return { edited, structural, remaining, state };
}

describe('quick fixes', () => {
  it('resizes a slow pipe to the size the engine computed, and the velocity finding goes', async () => {
    const { actions } = await actionsFor(SLOW_SYSTEM, 'slow-carrying-velocity');
    const resize = actions.find((a) => a.title.startsWith('Resize pipe'))!;
    expect(resize.isPreferred).toBe(true);
    // The engine picks 2-1/2 in (the largest schedule 10 size that carries; see its finding's message).
    expect(resize.title).toMatch(/^Resize pipe 'main-1' to 2\.5 in/);
    const result = await afterApplying(SLOW_SYSTEM, resize, 'slow-carrying-velocity', 'main-1');
    expect(result.edited).toContain('size 2.5 in length 60 ft');
    expect(result.structural).toEqual([]);
    expect(result.remaining).toEqual([]);
  });

  const FIXES_SYSTEM = `${CATALOG}hose long-150 length 150 ft bore 1-1/4 in roughness 0.3 mm
system "Fixes" {
  operators 2
  plant pr { producer exh-7  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 2 in length 40 ft horizontal
  pipe branch-1 from j-1 to e-1 spec steel-10 size 1-1/2 in length 30 ft horizontal joins tee
  pipe main-2 from j-1 to e-2 spec steel-10 size 2 in length 30 ft horizontal
  inlet A1 on branch-1 at 25 ft hose long-150 tool carpet
  inlet A2 on main-2 at 25 ft hose std-50 tool carpet
  cleanout at e-2
}
`;

  it('adds the missing cleanout at the point the finding names', async () => {
    const { actions } = await actionsFor(FIXES_SYSTEM, 'missing-cleanout');
    const add = actions.find((a) => a.title.startsWith('Add a cleanout'))!;
    const result = await afterApplying(FIXES_SYSTEM, add, 'missing-cleanout', 'branch-1');
    expect(result.edited).toMatch(/joins tee\n {2}cleanout at e-1\n/);
    expect(result.structural).toEqual([]);
    expect(result.remaining).toEqual([]);
  });

  it('replaces the 90 deg tee entry with a 45 deg wye', async () => {
    const { actions } = await actionsFor(FIXES_SYSTEM, 'tee-branch-entry');
    const wye = actions.find((a) => a.title.startsWith('Enter through a wye'))!;
    const result = await afterApplying(FIXES_SYSTEM, wye, 'tee-branch-entry', 'branch-1');
    expect(result.edited).toContain('horizontal joins wye 45 deg\n');
    expect(result.structural).toEqual([]);
    expect(result.remaining).toEqual([]);
  });

  it('chooses a shorter hose from the workspace, adding the `use` for a catalog the file does not use yet', async () => {
    const others = { [OTHER_CATALOG_URI]: 'hose std-35 length 35 ft bore 1-1/2 in roughness 0.3 mm\nhose huge-200 length 200 ft bore 2 in roughness 0.3 mm\n' };
    const { actions } = await actionsFor(FIXES_SYSTEM, 'hose-loss', others, 'A1');
    const titles = actions.map((a) => a.title);
    // long-150 is 150 ft x 1-1/4 in; the engine allows about 87 ft at that bore: std-50 (in the file) and std-35 (in the other catalog) qualify; huge-200 is longer.
    expect(titles.filter((t) => t.startsWith('Use hose'))).toEqual([
      "Use hose 'std-50' (50.0 ft x 1.50 in) at inlet 'A1'",
      "Use hose 'std-35' (35.0 ft x 1.50 in) at inlet 'A1'",
    ]);
    const viaUse = actions.find((a) => a.title.startsWith("Use hose 'std-35'"))!;
    const result = await afterApplying(FIXES_SYSTEM, viaUse, 'hose-loss', 'A1', others);
    expect(result.edited.startsWith('use "more/catalog.vacnet"\n')).toBe(true);
    expect(result.edited).toContain('inlet A1 on branch-1 at 25 ft hose std-35 tool carpet');
    expect(result.structural).toEqual([]);
    expect(result.remaining).toEqual([]);
  });

  it('picks a producer from the catalogs that meets the demand with the margin, least oversized first', async () => {
    const producers = `producer exh-3 { curve { at 0 scfm 6 inHg  at 50 scfm 5 inHg  at 100 scfm 3 inHg } efficiency 55 % }
producer exh-12 { curve { at 0 scfm 16 inHg  at 200 scfm 14 inHg  at 400 scfm 10 inHg } efficiency 55 % }
`;
    const small = `${CATALOG}${producers}
system "Short" {
  operators 1
  plant pr { producer exh-3  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 2 in length 60 ft horizontal
  inlet A1 on main-1 at 50 ft hose std-50 tool carpet
  cleanout at j-1
}
`;
    const { actions, state } = await actionsFor(small, 'producer-short');
    const demand = state.result!.analysis!.producers[0]!.demand!;
    expect(demand.flowStdM3PerS).toBeGreaterThan(0);
    const picks = actions.filter((a) => a.title.startsWith('Use producer'));
    // exh-7 gives more than the demand's flow at its vacuum and is smaller than exh-12.
    expect(picks.map((a) => a.title.split("'")[1])).toEqual(['exh-7', 'exh-12']);
    const result = await afterApplying(small, picks[0]!, 'producer-short', 'pr.producer');
    expect(result.edited).toContain('plant pr { producer exh-7  separator cyc }');
    expect(result.structural).toEqual([]);
    expect(result.remaining).toEqual([]);
    expect(result.state.result!.diagnostics.map((d) => d.code)).not.toContain('producer-margin');
  });

  it('accepts a finding with a placeholder reason; the finding goes, and an empty reason is still rejected', async () => {
    const { actions } = await actionsFor(SLOW_SYSTEM, 'slow-carrying-velocity');
    const accept = actions.find((a) => a.title.startsWith("Accept 'slow-carrying-velocity' on pipe 'main-1'"))!;
    const result = await afterApplying(SLOW_SYSTEM, accept, 'slow-carrying-velocity', 'main-1');
    expect(result.edited).toContain('length 60 ft horizontal accept slow-carrying-velocity because "REASON"');
    expect(result.structural).toEqual([]);
    expect(result.remaining).toEqual([]);
    expect(result.state.result!.suppressed.map((s) => s.reason)).toEqual(['REASON']);
    // The user clears the placeholder without writing a reason: rejected, and the finding is back.
    const emptied = await afterApplying(result.edited.replace('"REASON"', '""'), { title: '', edit: { changes: { [URI]: [] } } }, 'slow-carrying-velocity', 'main-1');
    expect(emptied.structural.join('\n')).toMatch(/^accept-without-reason: /);
  });

  it('accepts a finding on an element without rules (the producer) for the whole system', async () => {
    const producers = 'producer exh-3 { curve { at 0 scfm 6 inHg  at 50 scfm 5 inHg  at 100 scfm 3 inHg } efficiency 55 % }\n';
    const small = `${CATALOG}${producers}
system "Short" {
  operators 1
  plant pr { producer exh-3  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 2 in length 60 ft horizontal
  inlet A1 on main-1 at 50 ft hose std-50 tool carpet
  cleanout at j-1
}
`;
    const { actions } = await actionsFor(small, 'producer-short');
    const accept = actions.find((a) => a.title.startsWith("Accept 'producer-short' for the whole system"))!;
    const result = await afterApplying(small, accept, 'producer-short', 'pr.producer');
    expect(result.edited).toContain('system "Short" {\n  rule producer-short off because "REASON"\n  operators 1');
    expect(result.remaining).toEqual([]);
  });

  it('offers nothing for findings of the language itself, and no fix built from missing data', async () => {
    const live = createLive();
    const [document] = await live.put({ [URI]: SLOW_SYSTEM });
    const actions = await live.Vacnet.lsp.CodeActionProvider!.getCodeActions(document!, {
      textDocument: { uri: URI },
      range: { start: { line: 0, character: 0 }, end: { line: 0, character: 1 } },
      context: {
        diagnostics: [
          { range: { start: { line: 0, character: 0 }, end: { line: 0, character: 1 } }, message: 'x', code: 'unit-missing' },
          { range: { start: { line: 0, character: 0 }, end: { line: 0, character: 1 } }, message: 'x', code: 'slow-carrying-velocity', data: { element: { kind: 'pipe', name: 'main-1' }, nominalSizeM: 'big' } },
        ],
      },
    });
    expect((actions as CodeAction[]).map((a) => a.title)).toEqual([expect.stringMatching(/^Accept 'slow-carrying-velocity' on pipe 'main-1'/)]);
  });
});
