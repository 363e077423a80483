import { describe, expect, it } from 'vitest';
import { ACCEPTED_UNITS, type Dimension, isUnitOf, toSI } from '../../src/units/quantity.js';

function si(value: number, unit: string, dimension: Dimension): number {
  const r = toSI(value, unit, dimension);
  if (!r.ok) throw new Error(`${value} ${unit} as ${dimension}: ${r.reason}`);
  return r.si;
}

describe('toSI: pressure (NIST SP 811 (2008) appendix B.8)', () => {
  it('1 inHg (conventional, 32 F) = 3386.389 Pa', () => {
    expect(si(1, 'inHg', 'pressure')).toBeCloseTo(3386.389, 6);
  });
  it('1 inH2O (39.2 F) = 249.082 Pa', () => {
    expect(si(1, 'inH2O', 'pressure')).toBeCloseTo(249.082, 6);
  });
  // 29.921 inHg = 101,325 Pa (standard atmosphere) is the rounded value: 29.921 x 3386.389
  // = 101,324.15 Pa, 0.86 Pa short. It holds to half a unit of its last digit
  // (0.0005 inHg = 1.7 Pa); to 0.5 Pa the atmosphere is 29.9213 inHg.
  it('29.921 inHg = 101,325 Pa to the stated digits', () => {
    expect(Math.abs(si(29.921, 'inHg', 'pressure') - 101325)).toBeLessThan(0.0005 * 3386.389);
    expect(Math.abs(si(29.9213, 'inHg', 'pressure') - 101325)).toBeLessThan(0.5);
  });
  it('1 mmH2O = 9.80665 Pa, 1 mbar = 100 Pa, 1 psi = 6894.757 Pa (NIST SP 811)', () => {
    expect(si(1, 'mmH2O', 'pressure')).toBeCloseTo(9.80665, 8);
    expect(si(1, 'mbar', 'pressure')).toBeCloseTo(100, 9);
    expect(si(1, 'psi', 'pressure')).toBeCloseTo(6894.757, 3);
    expect(si(12, 'kPa', 'pressure')).toBeCloseTo(12000, 9);
  });
  it('accepts caseless trade spellings', () => {
    expect(si(1, 'INHG', 'pressure')).toBeCloseTo(3386.389, 6);
    expect(si(1, 'inwc', 'pressure')).toBeCloseTo(249.082, 6);
  });
});

describe('toSI: length, area, angle (NIST SP 811: 1 ft = 0.3048 m, 1 in = 0.0254 m exactly)', () => {
  it('1 ft = 0.3048 m exactly', () => {
    expect(si(1, 'ft', 'length')).toBe(0.3048);
    expect(si(2, 'in', 'length')).toBeCloseTo(0.0508, 15);
    expect(si(45, 'um', 'length')).toBeCloseTo(45e-6, 18);
    expect(si(45, 'µm', 'length')).toBeCloseTo(45e-6, 18);
  });
  it('areas: 1 ft2 = 0.09290304 m2', () => {
    for (const u of ['sqft', 'ft2', 'ft^2', 'ft ^ 2', 'sq ft']) expect(si(1, u, 'area'), u).toBeCloseTo(0.09290304, 12);
    expect(si(3, 'm2', 'area')).toBe(3);
    expect(si(3, 'm^2', 'area')).toBe(3);
  });
  it('degrees to radians', () => {
    expect(si(90, 'deg', 'angle')).toBeCloseTo(Math.PI / 2, 14);
    expect(si(1, 'rad', 'angle')).toBe(1);
  });
});

describe('toSI: flow and its basis', () => {
  // 1 ft3/min = 0.3048^3 / 60 m3/s = 4.719474432e-4 m3/s (exact from the foot).
  const CFM = 0.3048 ** 3 / 60;
  it('scfm and Sm3/h are standard; acfm, cfm, m3/h are actual', () => {
    const cases: [string, number, 'standard' | 'actual'][] = [
      ['scfm', CFM, 'standard'],
      ['Sm3/h', 1 / 3600, 'standard'],
      ['Sm3/s', 1, 'standard'],
      ['SL/s', 0.001, 'standard'],
      ['acfm', CFM, 'actual'],
      ['cfm', CFM, 'actual'],
      ['m3/h', 1 / 3600, 'actual'],
      ['m^3/h', 1 / 3600, 'actual'],
      ['m3/s', 1, 'actual'],
      ['L/s', 0.001, 'actual'],
      ['Am3/h', 1 / 3600, 'actual'],
      ['m3 / h', 1 / 3600, 'actual'],
      ['SCFM', CFM, 'standard'],
    ];
    for (const [unit, factor, basis] of cases) {
      const r = toSI(1, unit, 'flow');
      expect(r.ok, unit).toBe(true);
      if (r.ok) {
        expect(r.si, unit).toBeCloseTo(factor, 12);
        expect(r.flowBasis, unit).toBe(basis);
      }
    }
  });
  it('velocity: 1 fpm = 0.00508 m/s', () => {
    expect(si(1, 'fpm', 'velocity')).toBeCloseTo(0.00508, 15);
    expect(si(4000, 'ft/min', 'velocity')).toBeCloseTo(20.32, 10);
    expect(si(4000, 'ft / min', 'velocity')).toBeCloseTo(20.32, 10);
  });
  it('other quantities carry no basis', () => {
    const r = toSI(1, 'm', 'length');
    expect(r.ok && r.flowBasis).toBe(undefined);
  });
});

describe('toSI: temperature with offsets (NIST SP 811: T/K = (t/F + 459.67)/1.8)', () => {
  it('68 degF = 293.15 K, 20 degC = 293.15 K, 300 K = 300 K', () => {
    expect(si(68, 'degF', 'temperature')).toBeCloseTo(293.15, 9);
    expect(si(20, 'degC', 'temperature')).toBeCloseTo(293.15, 9);
    expect(si(-40, '°F', 'temperature')).toBeCloseTo(233.15, 9);
    expect(si(300, 'K', 'temperature')).toBe(300);
  });
});

describe('toSI: power, time, fraction, area rate, mass flow', () => {
  it('converts', () => {
    expect(si(1, 'hp', 'power')).toBeCloseTo(745.6999, 3); // NIST SP 811: 1 hp = 745.6999 W
    expect(si(5, 'kW', 'power')).toBe(5000);
    expect(si(2, 'h', 'time')).toBe(7200);
    expect(si(50, '%', 'fraction')).toBe(0.5);
    expect(si(0.25, '', 'fraction')).toBe(0.25);
    expect(si(3600, 'm2/h', 'area-rate')).toBeCloseTo(1, 12);
    expect(si(1, 'sqft/h', 'area-rate')).toBeCloseTo(0.09290304 / 3600, 15);
    expect(si(1, 'lb/min', 'mass-flow')).toBeCloseTo(0.45359237 / 60, 15); // 1 lb = 0.45359237 kg exactly
  });
});

describe('toSI: failures', () => {
  it('an unknown unit lists the accepted spellings', () => {
    const r = toSI(3, 'furlongz', 'length');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.reason).toBe('unknown-unit');
      expect(r.accepted).toContain('ft');
      expect(r.accepted).toContain('mm');
    }
  });
  it('a pressure given as a length is wrong-dimension', () => {
    const r = toSI(4, 'kPa', 'length');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toBe('wrong-dimension');
    expect(toSI(4, 'scfm', 'pressure')).toMatchObject({ ok: false, reason: 'wrong-dimension' });
    expect(toSI(4, '%', 'length')).toMatchObject({ ok: false, reason: 'wrong-dimension' });
    expect(toSI(4, '', 'length')).toMatchObject({ ok: false, reason: 'wrong-dimension' });
    expect(toSI(4, 'm', 'fraction')).toMatchObject({ ok: false, reason: 'wrong-dimension' });
  });
  it('non-finite values and overflow are not-finite', () => {
    expect(toSI(Number.NaN, 'm', 'length')).toMatchObject({ ok: false, reason: 'not-finite' });
    expect(toSI(Number.POSITIVE_INFINITY, 'm', 'length')).toMatchObject({ ok: false, reason: 'not-finite' });
    expect(toSI(1e308, 'km', 'length')).toMatchObject({ ok: false, reason: 'not-finite' });
  });
  it('unit text with numbers or operators mathjs would accept is refused', () => {
    for (const u of ['5 m', 'm+1', '(m)', 'm^4', '1e400 m', 'm;', 'evaluate']) {
      expect(toSI(1, u, 'length').ok, u).toBe(false);
    }
  });
  it('every accepted spelling is accepted', () => {
    for (const [dimension, units] of Object.entries(ACCEPTED_UNITS) as [Dimension, readonly string[]][]) {
      for (const u of units) expect(isUnitOf(u, dimension), `${u} as ${dimension}`).toBe(true);
    }
  });
});

describe('toSI: memoised factor', () => {
  it('repeat conversions are fast (well under the ~20-40 us mathjs parse)', () => {
    toSI(1, 'inHg', 'pressure');
    const n = 20000;
    const t0 = performance.now();
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const r = toSI(i, 'inHg', 'pressure');
      if (r.ok) sum += r.si;
    }
    const usPerCall = ((performance.now() - t0) * 1000) / n;
    expect(sum).toBeGreaterThan(0);
    expect(usPerCall).toBeLessThan(5);
  });
});
