import { describe, expect, it } from 'vitest';
import { formatPercentApart } from '../../src/rules/rule-format.js';

describe('formatPercentApart', () => {
  it('uses whole percents when they differ', () => {
    expect(formatPercentApart(0.05, 0.1)).toEqual(['5 %', '10 %']);
  });
  it('adds decimals, up to two, until a value near its limit prints apart from it', () => {
    expect(formatPercentApart(0.096, 0.1)).toEqual(['9.6 %', '10 %']);
    expect(formatPercentApart(0.4041, 0.4)).toEqual(['40.4 %', '40 %']);
    expect(formatPercentApart(0.40041, 0.4)).toEqual(['40.04 %', '40 %']);
    expect(formatPercentApart(0.40001, 0.4)).toEqual(['40 %', '40 %']);
  });
});
