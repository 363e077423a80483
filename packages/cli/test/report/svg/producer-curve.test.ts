import { describe, expect, it } from 'vitest';
import { curvePlotModel } from '../../../src/report/curve-plot-model.js';
import { renderProducerCurveSvg } from '../../../src/report/svg/producer-curve.js';
import { agreesToThreeDigits, loadExample, M3S_PER_CFM, PA_PER_INHG } from '../example-reports.js';
import { axisMap, elementsWithClass, pathPoints } from './svg-parts.js';

// The producer curve plot, read back through its own axes: the drawn points
// must land on the analysis's numbers in display units (NIST SP 811 factors).

async function plotOf(name: 'harbour-offices' | 'grinding-plant' | 'detached-house', units: 'imperial' | 'si' = 'imperial') {
  const input = await loadExample(name);
  const model = { ...input.model, displayUnits: units };
  const result = curvePlotModel(model, input.analysis!);
  if (!result.ok) throw new Error(result.reason);
  const svg = renderProducerCurveSvg(result.plot, units);
  const x = axisMap(elementsWithClass(svg, 'vn-tick-x'), 'x');
  const y = axisMap(elementsWithClass(svg, 'vn-tick-y'), 'y');
  return { input, plot: result.plot, svg, x, y };
}

describe('producer curve SVG', () => {
  it('the operating point sits at the analysis flow and vacuum, in scfm and inHg', async () => {
    const { input, svg, x, y } = await plotOf('harbour-offices');
    const [op] = elementsWithClass(svg, 'vn-op-point').filter((e) => e.tag === 'circle' && Number(e.attributes.r) === 6);
    const p = input.analysis!.producer!;
    // Coordinates are written to 0.1 px: about 0.1 scfm and 0.003 inHg here.
    expect(Math.abs(x(Number(op!.attributes.cx)) - p.flowStdM3PerS / M3S_PER_CFM)).toBeLessThan(0.3);
    expect(Math.abs(y(Number(op!.attributes.cy)) - p.vacuumPa / PA_PER_INHG)).toBeLessThan(0.01);
    const label = elementsWithClass(svg, 'vn-callout-group').find((g) => g.text.startsWith('Operating point'))!;
    const [flow, vacuum] = label.text.split('\n')[1]!.split(' at ');
    expect(agreesToThreeDigits(flow!, p.flowStdM3PerS / M3S_PER_CFM)).toBe(true);
    expect(agreesToThreeDigits(vacuum!, p.vacuumPa / PA_PER_INHG)).toBe(true);
  });

  it('the curve is one path through every maker point, falling all the way (PCHIP keeps monotone data monotone)', async () => {
    const { plot, svg, x, y } = await plotOf('harbour-offices');
    const [curve] = elementsWithClass(svg, 'vn-curve-producer').filter((e) => e.tag === 'path');
    const points = pathPoints(curve!.attributes.d!);
    expect(points.length).toBeGreaterThan(50);
    // Fritsch and Carlson (1980): monotone data give a monotone interpolant; vacuum falls, so y grows downward.
    for (let i = 1; i < points.length; i++) {
      expect(points[i]!.x).toBeGreaterThan(points[i - 1]!.x);
      expect(points[i]!.y).toBeGreaterThanOrEqual(points[i - 1]!.y - 0.05);
    }
    // The catalog's points (examples/catalog/equipment.vacnet, multistage-4op: 0 scfm at 9 inHg ... 550 scfm at 0).
    const markers = elementsWithClass(svg, 'vn-curve-point').filter((e) => e.tag === 'circle' && e.attributes.r === '3');
    const drawn = markers.slice(0, plot.curvePoints.length).map((m) => ({ flow: x(Number(m.attributes.cx)), vacuum: y(Number(m.attributes.cy)) }));
    expect(drawn[0]!.flow).toBeCloseTo(0, 1);
    expect(drawn[0]!.vacuum).toBeCloseTo(9, 2);
    expect(drawn[drawn.length - 1]!.flow).toBeCloseTo(550, 0);
    expect(drawn[drawn.length - 1]!.vacuum).toBeCloseTo(0, 2);
    // An interpolant passes through its data: each marker lies on the path (within 0.5 px).
    for (const m of markers.slice(0, plot.curvePoints.length)) {
      const cx = Number(m.attributes.cx);
      const cy = Number(m.attributes.cy);
      expect(distanceToPolyline({ x: cx, y: cy }, points)).toBeLessThan(0.5);
    }
  });

  it('the system demand curve and the demand point are drawn; the flow margin is labelled as the analysis gives it', async () => {
    const { input, svg } = await plotOf('harbour-offices');
    expect(elementsWithClass(svg, 'vn-curve-system').filter((e) => e.tag === 'path')).toHaveLength(1);
    expect(elementsWithClass(svg, 'vn-demand-point').filter((e) => e.tag === 'path').length).toBeGreaterThanOrEqual(1);
    const margin = Math.round(input.analysis!.producer!.marginFraction! * 100);
    expect(svg).toContain(`+${margin} % flow margin (15 % required)`);
  });

  it('accessible: a title and a description that state the operating point in words', async () => {
    const { svg, input } = await plotOf('detached-house');
    expect(svg).toMatch(/^<svg [^>]*role="img" aria-labelledby="vn-curve-title vn-curve-desc"/);
    const desc = /<desc id="vn-curve-desc">([^<]*)<\/desc>/.exec(svg)![1]!;
    const p = input.analysis!.producer!;
    const stated = /Operating point: ([\d.]+ scfm) at ([\d.]+ inHg)/.exec(desc)!;
    expect(agreesToThreeDigits(stated[1]!, p.flowStdM3PerS / M3S_PER_CFM)).toBe(true);
    expect(agreesToThreeDigits(stated[2]!, p.vacuumPa / PA_PER_INHG)).toBe(true);
  });

  it('a vacuum relief is drawn and labelled at its setting (the grinding plant: 14 inHg)', async () => {
    const { svg, y } = await plotOf('grinding-plant');
    const [relief] = elementsWithClass(svg, 'vn-relief').filter((e) => e.tag === 'line' && e.attributes.x1 !== e.attributes.x2 && Number(e.attributes.x2) - Number(e.attributes.x1) > 100);
    expect(y(Number(relief!.attributes.y1))).toBeCloseTo(14, 1);
    expect(svg).toContain('Vacuum relief 14.0 inHg');
  });

  it('SI display units: flow in Sm3/h and vacuum in kPa (1 m3/s = 3600 m3/h; 1 kPa = 1000 Pa)', async () => {
    const { input, svg, x, y } = await plotOf('harbour-offices', 'si');
    expect(svg).toContain('Flow, Sm3/h (standard air)');
    expect(svg).toContain('Vacuum at the producer inlet, kPa');
    const [op] = elementsWithClass(svg, 'vn-op-point').filter((e) => e.tag === 'circle' && Number(e.attributes.r) === 6);
    const p = input.analysis!.producer!;
    expect(Math.abs(x(Number(op!.attributes.cx)) / (p.flowStdM3PerS * 3600) - 1)).toBeLessThan(0.003);
    expect(Math.abs(y(Number(op!.attributes.cy)) / (p.vacuumPa / 1000) - 1)).toBeLessThan(0.003);
  });

  it('standalone: carries its own style sheet and an opaque background', async () => {
    const { plot } = await plotOf('detached-house');
    const svg = renderProducerCurveSvg(plot, 'imperial', { standalone: true });
    expect(svg).toMatch(/<style>[\s\S]*--vn-bg: #ffffff[\s\S]*<\/style>/);
    expect(elementsWithClass(svg, 'vn-svg-bg')).toHaveLength(1);
    expect(svg).not.toMatch(/https?:\/\/(?!www\.w3\.org\/2000\/svg)/);
  });
});

function distanceToPolyline(p: { x: number; y: number }, line: { x: number; y: number }[]): number {
  let best = Infinity;
  for (let i = 1; i < line.length; i++) {
    const a = line[i - 1]!;
    const b = line[i]!;
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const t = Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / (dx * dx + dy * dy || 1)));
    best = Math.min(best, Math.hypot(a.x + t * dx - p.x, a.y + t * dy - p.y));
  }
  return best;
}
