import { describe, expect, it } from 'vitest';
import { formatQuantity, formatSignificant, fromSI } from '../../src/units/format-quantity.js';
import { type Dimension, toSI } from '../../src/units/quantity.js';

describe('fromSI / formatQuantity', () => {
  it('vacuum in inHg and kPa (NIST SP 811: 1 inHg = 3386.389 Pa)', () => {
    expect(formatQuantity(12 * 3386.389, 'pressure', 'imperial')).toBe('12.0 inHg');
    expect(formatQuantity(40637, 'pressure', 'si')).toBe('40.6 kPa');
    expect(formatQuantity(40 * 249.082, 'pressure', 'imperial', 3, { unit: 'inH2O' })).toBe('40.0 inH2O');
  });
  it('flows show their basis', () => {
    const cfm = 0.3048 ** 3 / 60;
    expect(formatQuantity(200 * cfm, 'flow', 'imperial', 3, { flowBasis: 'standard' })).toBe('200 scfm');
    expect(formatQuantity(200 * cfm, 'flow', 'imperial', 3, { flowBasis: 'actual' })).toBe('200 acfm');
    expect(formatQuantity(0.1, 'flow', 'si', 3, { flowBasis: 'standard' })).toBe('360 Sm3/h');
    expect(formatQuantity(0.1, 'flow', 'si')).toBe('360 m3/h');
  });
  it('lengths: inches for sizes, feet for runs; mm and m', () => {
    expect(formatQuantity(0.0508, 'length', 'imperial')).toBe('2.00 in');
    expect(formatQuantity(30.48, 'length', 'imperial')).toBe('100 ft');
    expect(formatQuantity(0.0525, 'length', 'si')).toBe('52.5 mm');
    expect(formatQuantity(12.5, 'length', 'si')).toBe('12.5 m');
  });
  it('power: W, hp, kW; velocity fpm and m/s', () => {
    expect(formatQuantity(368.6, 'power', 'imperial')).toBe('369 W');
    expect(formatQuantity(4900, 'power', 'imperial')).toBe('6.57 hp'); // 4900 / 745.7
    expect(formatQuantity(4900, 'power', 'si')).toBe('4.90 kW');
    expect(formatQuantity(20.32, 'velocity', 'imperial')).toBe('4000 fpm');
    expect(formatQuantity(20.32, 'velocity', 'si')).toBe('20.3 m/s');
  });
  it('temperature with offset, fraction as percent', () => {
    expect(formatQuantity(293.15, 'temperature', 'imperial')).toBe('68.0 degF');
    expect(formatQuantity(293.15, 'temperature', 'si')).toBe('20.0 degC');
    expect(formatQuantity(0.1, 'fraction', 'si')).toBe('10.0 %');
  });
  it('non-finite values print as n/a; an unknown forced unit falls back', () => {
    expect(formatQuantity(Number.NaN, 'pressure', 'si')).toBe('n/a kPa');
    expect(fromSI(1000, 'pressure', 'si', { unit: 'furlong' }).unit).toBe('kPa');
  });
  it('round-trips through toSI for every default unit', () => {
    const dims: Dimension[] = ['length', 'pressure', 'flow', 'velocity', 'angle', 'area', 'temperature', 'power', 'time', 'fraction', 'area-rate', 'mass-flow'];
    for (const d of dims) {
      for (const system of ['imperial', 'si'] as const) {
        const { value, unit } = fromSI(1.2345, d, system);
        const back = toSI(value, unit, d);
        expect(back.ok && back.si, `${d} ${system} ${unit}`).toBeCloseTo(1.2345, 9);
      }
    }
  });
  it('formatSignificant', () => {
    expect(formatSignificant(0.0012345, 3)).toBe('0.00123');
    expect(formatSignificant(123456, 3)).toBe('123456');
    expect(formatSignificant(-0.0001, 2)).toBe('-0.00010');
    expect(formatSignificant(0, 3)).toBe('0');
    expect(formatSignificant(-0.00001, 1)).toBe('-0.00001');
  });
});
