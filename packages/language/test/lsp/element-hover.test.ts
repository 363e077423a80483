// Hovers on elements: the computed values from the cached analysis, and how
// they were computed (the formula and its source). The numbers are the
// engine's own run of the same model, formatted with its formatter.
import { formatQuantity } from '@vacnet/engine';
import { describe, expect, it } from 'vitest';
import { runEngine } from '../../src/engine-bridge/engine-run.js';
import { lowerSystem } from '../../src/lowering/lower-system.js';
import { createLive, SLOW_SYSTEM } from './live-services.js';

const URI = 'file:///work/hover/system.vacnet';

async function hoverAt(text: string, marker: string, offsetInMarker = 1): Promise<{ value: string; expected: ReturnType<typeof runEngine> }> {
  const live = createLive();
  const [document] = await live.put({ [URI]: text });
  const offset = text.indexOf(marker) + offsetInMarker;
  const hover = await live.Vacnet.lsp.HoverProvider!.getHoverContent(document!, { textDocument: { uri: URI }, position: document!.textDocument.positionAt(offset) });
  const expected = runEngine(lowerSystem(document!.parseResult.value.systems[0]!).model);
  return { value: (hover?.contents as { value: string } | undefined)?.value ?? '', expected };
}

describe('hover on an element: computed values and how', () => {
  it('an inlet: worst case, alone, and the laws used (Crane TP-410 is cited for pipes, Shapiro for the tool)', async () => {
    const { value, expected } = await hoverAt(SLOW_SYSTEM, 'inlet A1', 7);
    const wc = expected.analysis.inlets[0]!.worstCase!;
    expect(value).toContain(`**Computed for inlet \`A1\`**`);
    expect(value).toContain(`${formatQuantity(wc.toolVacuumPa, 'pressure', 'imperial')} at the tool (needs 5.00 inHg)`);
    expect(value).toContain(formatQuantity(wc.inletVacuumPa, 'pressure', 'imperial') + ' at the inlet valve');
    expect(value).toMatch(/Worst case: exact/);
    expect(value).toMatch(/isentropic nozzle flow/);
    // The declaration follows the computed part.
    expect(value).toMatch(/\*\*inlet\*\* `A1`/);
  });

  it('a pipe: lowest and highest velocity with the isothermal flow equation and its source', async () => {
    const { value, expected } = await hoverAt(SLOW_SYSTEM, 'pipe main-1', 6);
    const pipe = expected.analysis.pipes[0]!;
    expect(value).toContain(`Lowest velocity, one operator at \`A1\` (tool working): ${formatQuantity(pipe.minVelocityMPerS!, 'velocity', 'imperial')}`);
    expect(value).toMatch(/Crane Technical Paper 410/);
    expect(value).toMatch(/Churchill \(1977\)/);
  });

  it('a reference to a pipe shows the same computed values as its declaration', async () => {
    const { value } = await hoverAt(SLOW_SYSTEM, 'on main-1', 4);
    expect(value).toContain('**Computed for pipe `main-1`**');
  });

  it('the plant and the producer model: operating point, margin, and PCHIP (Fritsch and Carlson 1980)', async () => {
    const plant = await hoverAt(SLOW_SYSTEM, 'plant pr', 6);
    const producer = plant.expected.analysis.producers[0]!;
    expect(plant.value).toContain(`**Computed for producer \`pr.producer\`** in the design case: ${formatQuantity(producer.flowStdM3PerS, 'flow', 'imperial', 3, { flowBasis: 'standard' })}`);
    expect(plant.value).toMatch(/Fritsch and Carlson 1980/);
    const model = await hoverAt(SLOW_SYSTEM, 'producer exh-7  separator', 10);
    expect(model.value).toContain('**Computed for producer `pr.producer`**');
  });

  it('a hose kind used by the system: where and with what vacuum', async () => {
    const { value } = await hoverAt(SLOW_SYSTEM, 'hose std-50 tool', 6);
    expect(value).toMatch(/\*\*In this system\*\*: used at 1 inlet; tool vacuum in their worst cases/);
  });

  it('shows no computed values while the file cannot be analysed', async () => {
    const { value } = await hoverAt(SLOW_SYSTEM.replace('length 60 ft', 'length 60'), 'inlet A1', 7);
    expect(value).not.toContain('Computed');
    expect(value).toMatch(/\*\*inlet\*\* `A1`/);
  });
});
