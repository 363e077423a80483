import { describe, expect, it } from 'vitest';
import { quantityText } from '../../../src/report/quantity-text.js';
import { schematicModel } from '../../../src/report/schematic-model.js';
import { renderSchematicSvg } from '../../../src/report/svg/schematic.js';
import { agreesToThreeDigits, loadExample, PA_PER_INHG } from '../example-reports.js';
import { elementsWithClass } from './svg-parts.js';

// The network schematic of the examples, laid out by elkjs: one labelled
// node per inlet with its worst-case tool vacuum (NIST SP 811 inHg), a band
// that agrees with the tool's stated need, every pipe labelled with its size.

async function schematicOf(name: 'harbour-offices' | 'grinding-plant' | 'unresolved-hose') {
  const input = await loadExample(name);
  const model = schematicModel(input.model, input.analysis, quantityText('imperial'));
  return { input, model, svg: await renderSchematicSvg(model) };
}

const box = (g: string) => {
  const m = /<rect x="([-\d.]+)" y="([-\d.]+)" width="([\d.]+)" height="([\d.]+)"/.exec(g)!;
  return { x: Number(m[1]), y: Number(m[2]), w: Number(m[3]), h: Number(m[4]) };
};

describe('schematic SVG', () => {
  it('one node per inlet, named, with its worst-case tool vacuum and margin on need', async () => {
    const { input, svg } = await schematicOf('harbour-offices');
    const nodes = elementsWithClass(svg, 'vn-inlet');
    expect(nodes.map((n) => n.attributes['data-name']).sort()).toEqual(input.model.inlets.map((i) => i.name).sort());
    for (const node of nodes) {
      const name = node.attributes['data-name']!;
      const wc = input.analysis!.inlets.find((i) => i.name === name)!.worstCase!;
      const need = input.model.inlets.find((i) => i.name === name)!.tool.requiredVacuumPa!;
      const [label, vacuum, margin] = node.text.split('\n');
      expect(label).toBe(name);
      expect(vacuum).toMatch(/ inHg$/);
      expect(agreesToThreeDigits(vacuum!, wc.toolVacuumPa / PA_PER_INHG), name).toBe(true);
      expect(margin).toBe(`+${Math.round(((wc.toolVacuumPa - need) / need) * 100)} % on need`);
      // Bands: below the need short, within 10 % of it tight, else ample (margin-band.ts).
      const band = wc.toolVacuumPa < need ? 'short' : wc.toolVacuumPa < 1.1 * need ? 'tight' : 'ample';
      expect(node.attributes['data-band'], name).toBe(band);
      expect(node.attributes.class).toContain(`vn-band-${band}`);
    }
    // The bands present are in the legend, with words and not colour alone.
    for (const band of new Set(nodes.map((n) => n.attributes['data-band']))) {
      expect(svg).toMatch(new RegExp(`<rect class="vn-band-${band}"`));
    }
    expect(svg).toContain('Tight: meets the need with less than 10 % to spare');
  });

  it('the critical inlet of the design case is the one drawn heavy', async () => {
    const { input, svg } = await schematicOf('harbour-offices');
    const heavy = elementsWithClass(svg, 'vn-critical').map((n) => n.attributes['data-name']);
    expect(heavy).toEqual([input.analysis!.designCase!.criticalInlet]);
  });

  it('every pipe labelled once with name and size, every part of it drawn', async () => {
    const { input, model, svg } = await schematicOf('grinding-plant');
    const labels = elementsWithClass(svg, 'vn-pipe-label').map((l) => l.text);
    expect(labels).toHaveLength(input.model.pipes.length);
    expect(labels).toContain('main-1 \u00b7 3-1/2 in'); // "pipe main-1 ... size 3-1/2 in"
    expect(labels).toContain('drop-b6 \u00b7 3 in');
    const drawn = elementsWithClass(svg, 'vn-pipe').filter((e) => e.tag === 'path');
    expect(drawn).toHaveLength(model.edges.filter((e) => e.kind === 'pipe').length);
    // Larger pipes are drawn wider: 3-1/2 in over 3 in.
    const width = (pipe: string) => Number(drawn.find((d) => d.attributes['data-pipe'] === pipe)!.attributes['stroke-width']);
    expect(width('main-1')).toBeGreaterThan(width('ha-2'));
  });

  it('laid out without overlaps, the plant first (left or top)', async () => {
    const { svg } = await schematicOf('harbour-offices');
    const groups = [...svg.matchAll(/<g class="vn-node [^"]*"[^>]*>[\s\S]*?<\/g>/g)].map((m) => m[0]).filter((g) => g.includes('<rect x='));
    const boxes = groups.map(box);
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i]!;
        const b = boxes[j]!;
        const apart = a.x + a.w <= b.x + 0.5 || b.x + b.w <= a.x + 0.5 || a.y + a.h <= b.y + 0.5 || b.y + b.h <= a.y + 0.5;
        expect(apart, `${groups[i]!.slice(0, 80)} overlaps ${groups[j]!.slice(0, 80)}`).toBe(true);
      }
    }
    const direction = /data-direction="(RIGHT|DOWN)"/.exec(svg)![1];
    const producer = box(groups.find((g) => g.includes('data-kind="producer"'))!);
    const key = direction === 'RIGHT' ? 'x' : 'y';
    expect(Math.min(...boxes.map((b) => b[key]))).toBe(producer[key]);
  });

  it('accessible: role, title and a description that counts the inlets by band', async () => {
    const { svg, input } = await schematicOf('harbour-offices');
    expect(svg).toMatch(/^<svg [^>]*role="img" aria-labelledby="vn-schematic-title vn-schematic-desc"/);
    expect(svg).toContain(`to ${input.model.inlets.length} inlets`);
    // Each inlet node names itself in a <title> (a tooltip and its accessible name).
    expect(svg.match(/<title>inlet [^<]+<\/title>/g)).toHaveLength(input.model.inlets.length);
  });

  it('a file with errors: the layout from the model, inlets without results', async () => {
    const { svg } = await schematicOf('unresolved-hose');
    const nodes = elementsWithClass(svg, 'vn-inlet');
    expect(nodes.map((n) => n.text)).toEqual(['kitchen']);
    expect(svg).toContain('no results: the file has errors');
  });
});
