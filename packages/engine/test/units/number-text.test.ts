import { describe, expect, it } from 'vitest';
import { parseNumberText } from '../../src/units/number-text.js';

describe('parseNumberText', () => {
  it('reads decimals and exponents', () => {
    expect(parseNumberText('12')).toBe(12);
    expect(parseNumberText('-2.5')).toBe(-2.5);
    expect(parseNumberText('1e-3')).toBe(0.001);
    expect(parseNumberText('.5')).toBe(0.5);
    expect(parseNumberText('3.')).toBe(3);
    expect(parseNumberText(' 7 ')).toBe(7);
  });

  it('reads trade fractions and mixed numbers (pipe and hose sizes, e.g. 1-1/2 in)', () => {
    expect(parseNumberText('3/4')).toBe(0.75);
    expect(parseNumberText('1-1/2')).toBe(1.5);
    expect(parseNumberText('2-3/8')).toBe(2.375);
    expect(parseNumberText('-1-1/2')).toBe(-1.5);
    expect(parseNumberText('1 1/2')).toBe(1.5);
  });

  it('rejects everything else, infinities and division by zero', () => {
    for (const bad of ['', 'abc', '1/0', '1-1/0', '1e400', '-1e400', 'NaN', 'Infinity', '1..2', '1/2/3', '--1', '0x10', '1,5', '1-', '/2']) {
      expect(parseNumberText(bad), bad).toBeUndefined();
    }
  });
});
