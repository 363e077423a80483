import { describe, expect, it } from 'vitest';
import { EXIT_K, SHARP_ENTRY_K, roundedEntryK } from '../../../src/friction/fittings/entries-exits.js';

describe('entries and exits (Crane TP-410; Idelchik; CHECKS.md [C])', () => {
  it('sharp entry 0.5, exit 1.0, rounded entry r/D >= 0.15: 0.04', () => {
    expect(SHARP_ENTRY_K).toBe(0.5);
    expect(EXIT_K).toBe(1.0);
    expect(roundedEntryK(0.15)).toBeCloseTo(0.04, 12);
    expect(roundedEntryK(0.3)).toBeCloseTo(0.04, 12);
    expect(roundedEntryK(0)).toBe(0.5);
  });
  it('rounding never makes an entry worse; bad input is a sharp entry', () => {
    let prev = 1;
    for (let r = 0; r <= 0.2; r += 0.01) {
      const k = roundedEntryK(r);
      expect(k).toBeLessThanOrEqual(prev);
      prev = k;
    }
    expect(roundedEntryK(Number.NaN)).toBe(0.5);
  });
});
