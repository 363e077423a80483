import { describe, expect, it } from 'vitest';
import { commonPracticeRateM2PerS, operatorCount } from '../../src/analysis/operators.js';
import { SystemBuilder } from '../fixtures/system-builder.js';

const FT2 = 0.09290304; // m2 per ft2 (exact)
const H = 3600;

describe('operatorCount', () => {
  it('derives operators from areas, common-practice rates and the window', () => {
    // Common practice (no published source): carpet 2,500 ft2/h per operator,
    // bare floor 4,000 (3,500-5,000). 20,000 ft2 carpet = 8 operator-hours;
    // 12,000 ft2 bare = 3 operator-hours; 11 h in a 4 h window -> 2.75 -> 3.
    const m = new SystemBuilder()
      .design({
        areas: [
          { surface: 'carpet', areaM2: 20000 * FT2 },
          { surface: 'bare', areaM2: 12000 * FT2 },
        ],
        cleaningWindowS: 4 * H,
      })
      .build();
    const c = operatorCount(m);
    expect(c.source).toBe('areas');
    expect(c.count).toBe(3);
    expect(c.fromAreas!.exactOperators).toBeCloseTo(2.75, 10);
    expect(c.fromAreas!.areas.map((a) => a.rateSource)).toEqual(['common-practice', 'common-practice']);
  });

  it('a rate in the file wins over common practice; an exact whole number is not rounded up', () => {
    const m = new SystemBuilder()
      .design({ areas: [{ surface: 'carpet', areaM2: 1000, rateM2PerS: 1000 / (2 * H) }], cleaningWindowS: H })
      .build();
    const c = operatorCount(m);
    expect(c.count).toBe(2);
    expect(c.fromAreas!.areas[0]!.rateSource).toBe('file');
  });

  it('options beat the file, the file beats areas, default is one', () => {
    const m = new SystemBuilder('x', { operators: 5 }).design({ areas: [{ surface: 'carpet', areaM2: 1e6 }], cleaningWindowS: H }).build();
    expect(operatorCount(m).count).toBe(5);
    expect(operatorCount(m, { operators: 2 }).source).toBe('options');
    expect(operatorCount(new SystemBuilder().build())).toMatchObject({ count: 1, source: 'default', fromAreas: null });
  });

  it('bad numbers fall back instead of throwing', () => {
    const m = new SystemBuilder('x', { operators: NaN }).design({ areas: [{ surface: 'carpet', areaM2: 100 }], cleaningWindowS: 0 }).build();
    expect(operatorCount(m, { operators: -3 })).toMatchObject({ count: 1, source: 'default' });
  });

  it('common-practice rates, in trade units', () => {
    expect(commonPracticeRateM2PerS('carpet') * H / FT2).toBeCloseTo(2500, 9);
    expect(commonPracticeRateM2PerS('small-rooms') * H / FT2).toBeCloseTo(1500, 9);
    expect(commonPracticeRateM2PerS('open-bare') * H / FT2).toBeCloseTo(7200, 9);
  });
});
