import { describe, expect, it } from 'vitest';
import { nominalSizeText } from '../../src/report/nominal-size-text.js';

// Nominal sizes as the trade writes them. Inch sizes: the NPS designations of
// ASME B36.10M (1/2, 3/4, 1-1/4, 2-1/2, 3-1/2 ...) and test-orifice sizes in
// eighths and sixteenths (common practice); 1 in = 25.4 mm exactly (NIST SP 811).
const IN = 0.0254;

describe('nominalSizeText', () => {
  it.each([
    [0.5, '1/2 in'],
    [0.75, '3/4 in'],
    [1.25, '1-1/4 in'],
    [2, '2 in'],
    [2.5, '2-1/2 in'],
    [3.5, '3-1/2 in'],
    [0.625, '5/8 in'],
    [0.9375, '15/16 in'],
    [12, '12 in'],
  ])('%f in is written %s', (inches, text) => {
    expect(nominalSizeText(inches * IN, 'imperial')).toBe(text);
  });

  it('a size off the sixteenths prints as a decimal inch', () => {
    // 2.07 in: the bore of 2 NPS schedule 40 (ASME B36.10M, 2.067 in) is no trade size.
    expect(nominalSizeText(2.067 * IN, 'imperial')).toBe('2.07 in');
  });

  it('SI sizes in millimetres', () => {
    expect(nominalSizeText(0.05, 'si')).toBe('50.0 mm');
    expect(nominalSizeText(2.5 * IN, 'si')).toBe('63.5 mm');
  });

  it('no size, a dash: never NaN', () => {
    for (const bad of [Number.NaN, 0, -1, Number.POSITIVE_INFINITY, undefined, null]) {
      expect(nominalSizeText(bad as number, 'imperial')).toBe('\u2013');
    }
  });
});
