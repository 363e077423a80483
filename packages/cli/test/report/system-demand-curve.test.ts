import { describe, expect, it } from 'vitest';
import { systemDemandCurve } from '../../src/report/system-demand-curve.js';
import { EXAMPLES, loadExample } from './example-reports.js';

// The system demand curve of each example's design case, solved with the
// producer inlet held at each vacuum.

describe('systemDemandCurve', () => {
  it.each(EXAMPLES)('%s: passes through the operating point and the demand point of the analysis', async (name) => {
    const input = await loadExample(name);
    const curve = systemDemandCurve(input.model, input.analysis!);
    expect(curve.ok).toBe(true);
    if (!curve.ok) return;
    const p = input.analysis!.producer!;
    // The operating point is where the producer curve meets this curve; the
    // demand point lies on it by definition (producer-point.ts). The solver's
    // tolerance is 1e-9 of the flow; allow 0.1 %.
    const at = (vacuumPa: number) => curve.points.find((q) => Math.abs(q.vacuumPa - vacuumPa) < 1e-6)!;
    expect(at(p.vacuumPa).flowStdM3PerS).toBeCloseTo(p.flowStdM3PerS, 4);
    expect(Math.abs(at(p.vacuumPa).flowStdM3PerS / p.flowStdM3PerS - 1)).toBeLessThan(1e-3);
    expect(Math.abs(at(p.demand!.vacuumPa).flowStdM3PerS / p.demand!.flowStdM3PerS - 1)).toBeLessThan(1e-3);
    expect(curve.openInlets).toEqual(input.analysis!.designCase!.openInlets);
  });

  it.each(EXAMPLES)('%s: flow rises with vacuum from zero', async (name) => {
    const input = await loadExample(name);
    const curve = systemDemandCurve(input.model, input.analysis!);
    if (!curve.ok) throw new Error(curve.reason);
    expect(curve.points[0]).toEqual({ vacuumPa: 0, flowStdM3PerS: 0 });
    for (let i = 1; i < curve.points.length; i++) {
      expect(curve.points[i]!.vacuumPa).toBeGreaterThan(curve.points[i - 1]!.vacuumPa);
      expect(curve.points[i]!.flowStdM3PerS).toBeGreaterThan(curve.points[i - 1]!.flowStdM3PerS);
    }
  });

  // The grinding plant's pickups are measured tables, not orifices: no square law to expect there.
  it.each(['harbour-offices', 'primary-school', 'detached-house'] as const)('%s (orifice tools): vacuum nearly with the square of flow at low vacuum', async (name) => {
    const input = await loadExample(name);
    const curve = systemDemandCurve(input.model, input.analysis!);
    if (!curve.ok) throw new Error(curve.reason);
    const tools = curve.openInlets.map((n) => input.model.inlets.find((i) => i.name === n)!.tool.working.kind);
    expect(tools.every((kind) => kind === 'orifice')).toBe(true);    // Turbulent pipe friction (Darcy-Weisbach: dp ~ Q^1.75 smooth, Blasius, to
    // Q^2 fully rough, Moody) and the tool orifice (dp ~ Q^2) give a loss
    // exponent between 1.75 and 2 while the air is nearly incompressible: take
    // the first two solved levels (under 15 % of ambient) and allow 1.7-2.1.
    const [, a, b] = curve.points;
    const exponent = Math.log(b!.vacuumPa / a!.vacuumPa) / Math.log(b!.flowStdM3PerS / a!.flowStdM3PerS);
    expect(b!.vacuumPa).toBeLessThan(0.15 * input.analysis!.ambient.pressurePa);
    expect(exponent).toBeGreaterThan(1.7);
    expect(exponent).toBeLessThan(2.1);
  });

  it('no design case, or several producers: a reason, not a throw', async () => {
    const input = await loadExample('detached-house');
    expect(systemDemandCurve(input.model, { ...input.analysis!, designCase: null })).toEqual({ ok: false, reason: 'the analysis found no design case' });
    const twice = { ...input.model, producers: [...input.model.producers, { ...input.model.producers[0]!, name: 'second' }] };
    expect(systemDemandCurve(twice, input.analysis!)).toEqual({ ok: false, reason: 'drawn for a system with one producer only' });
  });
});
