// Inlay hints: the engine's numbers at the end of the lines they belong to,
// from the cached analysis only. The expected labels are computed here from
// the engine's own run of the same model, formatted with the engine's
// display formatter (two significant digits).
import { formatQuantity } from '@vacnet/engine';
import { describe, expect, it } from 'vitest';
import type { InlayHint } from 'vscode-languageserver';
import { runEngine } from '../../src/engine-bridge/engine-run.js';
import { lowerSystem } from '../../src/lowering/lower-system.js';
import type { VacnetConfigurationProvider } from '../../src/lsp/vacnet-configuration-provider.js';
import { createLive, SLOW_SYSTEM } from './live-services.js';

const URI = 'file:///work/hints/system.vacnet';
const WHOLE = { start: { line: 0, character: 0 }, end: { line: 1000, character: 0 } };

async function hintsFor(text: string, settings?: unknown): Promise<{ hints: InlayHint[]; text: string; expected: ReturnType<typeof runEngine> }> {
  const live = createLive();
  if (settings) (live.shared.workspace.ConfigurationProvider as VacnetConfigurationProvider).updateConfiguration({ settings: { vacnet: settings } });
  const [document] = await live.put({ [URI]: text });
  const hints = (await live.Vacnet.lsp.InlayHintProvider!.getInlayHints(document!, { textDocument: { uri: URI }, range: WHOLE })) ?? [];
  const model = lowerSystem(document!.parseResult.value.systems[0]!).model;
  return { hints, text, expected: runEngine(settings ? { ...model, displayUnits: 'si' } : model) };
}

function lineOf(text: string, hint: InlayHint): string {
  return text.split('\n')[hint.position.line]!;
}

describe('inlay hints', () => {
  it('after the inlet: worst-case tool vacuum and flow, equal to the engine values', async () => {
    const { hints, text, expected } = await hintsFor(SLOW_SYSTEM);
    const wc = expected.analysis.inlets[0]!.worstCase!;
    const label = `${formatQuantity(wc.toolVacuumPa, 'pressure', 'imperial', 2)} · ${formatQuantity(wc.flowStdM3PerS, 'flow', 'imperial', 2, { flowBasis: 'standard' })}`;
    const inlet = hints.find((h) => lineOf(text, h).includes('inlet A1'))!;
    expect(inlet.label).toBe(label);
    expect(label).toMatch(/^\d+(\.\d)? inHg · \d+ scfm$/);
    // At the end of the inlet's line.
    expect(inlet.position.character).toBe(lineOf(text, inlet).trimEnd().length);
    expect(JSON.stringify(inlet.tooltip)).toContain('at the inlet valve');
  });

  it('after the pipe: its lowest single-operator velocity; on the producer: the operating point and margin', async () => {
    const { hints, text, expected } = await hintsFor(SLOW_SYSTEM);
    const pipe = expected.analysis.pipes[0]!;
    expect(hints.find((h) => lineOf(text, h).includes('pipe main-1'))!.label).toBe(`min ${formatQuantity(pipe.minVelocityMPerS!, 'velocity', 'imperial')}`);
    const producer = expected.analysis.producers[0]!;
    const point = `${formatQuantity(producer.flowStdM3PerS, 'flow', 'imperial', 2, { flowBasis: 'standard' })} at ${formatQuantity(producer.vacuumPa, 'pressure', 'imperial', 2)}`;
    expect(hints.find((h) => lineOf(text, h).includes('plant pr'))!.label).toBe(`${point} · margin ${formatQuantity(producer.marginFraction!, 'fraction', 'imperial', 2)}`);
  });

  it('shows SI units when the settings ask for them, and leaves out the kinds switched off', async () => {
    const { hints, text } = await hintsFor(SLOW_SYSTEM, { units: 'si', hints: { producer: false } });
    expect(hints.find((h) => lineOf(text, h).includes('inlet A1'))!.label).toMatch(/kPa · \d+ Sm3\/h$/);
    expect(hints.find((h) => lineOf(text, h).includes('pipe main-1'))!.label).toMatch(/^min [\d.]+ m\/s$/);
    expect(hints.some((h) => lineOf(text, h).includes('plant pr'))).toBe(false);
  });

  it('gives nothing for a file that cannot be analysed, and only hints inside the asked range', async () => {
    const blocked = await hintsFor(SLOW_SYSTEM.replace('length 60 ft', 'length 60'));
    expect(blocked.hints).toEqual([]);
    const live = createLive();
    const [document] = await live.put({ [URI]: SLOW_SYSTEM });
    const inletLine = SLOW_SYSTEM.split('\n').findIndex((l) => l.includes('inlet A1'));
    const only = await live.Vacnet.lsp.InlayHintProvider!.getInlayHints(document!, {
      textDocument: { uri: URI },
      range: { start: { line: inletLine, character: 0 }, end: { line: inletLine + 1, character: 0 } },
    });
    expect(only).toHaveLength(1);
  });

  it('never shows numbers of an older text: after an edit, nothing until the new analysis is in', async () => {
    const live = createLive();
    const [document] = await live.put({ [URI]: SLOW_SYSTEM });
    // The editor has a newer version that is not built yet.
    const { TextDocument } = await import('langium');
    live.shared.workspace.TextDocuments!.set(TextDocument.create(URI, 'vacnet', 99, SLOW_SYSTEM.replace('60 ft', '70 ft')));
    expect(await live.Vacnet.lsp.InlayHintProvider!.getInlayHints(document!, { textDocument: { uri: URI }, range: WHOLE })).toEqual([]);
  });
});
