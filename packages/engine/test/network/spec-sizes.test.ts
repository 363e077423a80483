import { describe, expect, it } from 'vitest';
import { insideDiameterFor, scheduleNominalSizesM } from '../../src/network/spec-sizes.js';

const IN = 0.0254;

describe('insideDiameterFor: steel schedules', () => {
  // ASME B36.10M inside diameters, mm (CHECKS.md, tagged [C]); the published
  // millimetre values are rounded conversions, hence the 0.05 mm tolerance.
  const sch10: [number, number][] = [[2, 54.76], [2.5, 66.9], [3, 82.8], [4, 108.2], [5, 134.5], [6, 161.5]];
  const sch40: [number, number][] = [[2, 52.5], [2.5, 62.7], [3, 77.9], [4, 102.3], [5, 128.2], [6, 154.1]];

  it.each(sch10)('schedule 10, NPS %s: ID %s mm (ASME B36.10M)', (nps, idMm) => {
    const r = insideDiameterFor({ kind: 'schedule', schedule: '10' }, nps * IN);
    expect(r.ok).toBe(true);
    if (r.ok) expect(Math.abs(r.insideDiameterM * 1000 - idMm)).toBeLessThanOrEqual(0.05);
  });

  it.each(sch40)('schedule 40, NPS %s: ID %s mm (ASME B36.10M)', (nps, idMm) => {
    const r = insideDiameterFor({ kind: 'schedule', schedule: '40' }, nps * IN);
    expect(r.ok).toBe(true);
    if (r.ok) expect(Math.abs(r.insideDiameterM * 1000 - idMm)).toBeLessThanOrEqual(0.05);
  });

  it('schedule 80 NPS 2 is 1.939 in bore (ASME B36.10M, from memory)', () => {
    const r = insideDiameterFor({ kind: 'schedule', schedule: 'sch 80' }, 2 * IN);
    expect(r.ok && r.insideDiameterM / IN).toBeCloseTo(1.939, 3);
  });

  it('accepts DN (ISO 6708) for the same row: DN 100 = NPS 4', () => {
    const a = insideDiameterFor({ kind: 'schedule', schedule: '40' }, 0.1);
    const b = insideDiameterFor({ kind: 'schedule', schedule: '40' }, 4 * IN);
    expect(a).toEqual(b);
  });

  it('schedules get thinner-walled from 80 to 5 at every size', () => {
    for (const nominal of scheduleNominalSizesM('40')) {
      const ids = ['80', '40', '10', '5'].map((s) => insideDiameterFor({ kind: 'schedule', schedule: s }, nominal));
      const values = ids.map((r) => (r.ok ? r.insideDiameterM : NaN));
      for (let i = 1; i < values.length; i++) expect(values[i]).toBeGreaterThan(values[i - 1]!);
    }
  });

  it('unknown schedule and size are typed failures', () => {
    const a = insideDiameterFor({ kind: 'schedule', schedule: '160' }, 4 * IN);
    expect(a.ok === false && a.cause).toBe('unknown-schedule');
    const b = insideDiameterFor({ kind: 'schedule', schedule: '40' }, 7 * IN);
    expect(b.ok === false && b.cause).toBe('unknown-size');
    expect(b.ok === false && b.availableNominalM?.length).toBe(15);
  });
});

describe('insideDiameterFor: tube and inside rules', () => {
  it('tube by outside diameter and wall', () => {
    const r = insideDiameterFor({ kind: 'wall', wallM: 0.0016 }, 0.05);
    expect(r.ok && r.insideDiameterM).toBeCloseTo(0.0468, 10);
  });
  it('inside diameter is the nominal', () => {
    expect(insideDiameterFor({ kind: 'inside' }, 0.051)).toEqual({ ok: true, insideDiameterM: 0.051 });
  });
  it('bad input is a typed failure, never NaN or a throw', () => {
    for (const n of [0, -1, NaN, Infinity]) {
      const r = insideDiameterFor({ kind: 'inside' }, n);
      expect(r.ok === false && r.cause).toBe('invalid-size');
    }
    const thick = insideDiameterFor({ kind: 'wall', wallM: 0.03 }, 0.05);
    expect(thick.ok === false && thick.cause).toBe('wall-too-thick');
    const neg = insideDiameterFor({ kind: 'wall', wallM: NaN }, 0.05);
    expect(neg.ok === false && neg.cause).toBe('invalid-size');
  });
});
