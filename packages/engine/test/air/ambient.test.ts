import { describe, expect, it } from 'vitest';
import { ambientPressureAtElevation } from '../../src/air/ambient.js';

describe('ambientPressureAtElevation (ASHRAE Fundamentals ch. 1 troposphere formula)', () => {
  it('sea level is 101,325 Pa', () => {
    expect(ambientPressureAtElevation(0)).toBe(101325);
  });
  it('1500 m: 84,556 Pa (CHECKS.md [K], the formula itself)', () => {
    expect(ambientPressureAtElevation(1500)).toBeCloseTo(84556, 0);
  });
  it('5000 m: within 0.1 % of US Standard Atmosphere 1976 (54,048.3 Pa geometric)', () => {
    // The formula uses geometric height with the geopotential lapse; 0.05 % apart here.
    expect(Math.abs(ambientPressureAtElevation(5000) / 54048.3 - 1)).toBeLessThan(1e-3);
  });
  it('guards: clamps the elevation, non-finite gives sea level', () => {
    expect(ambientPressureAtElevation(Number.NaN)).toBe(101325);
    expect(ambientPressureAtElevation(1e9)).toBe(ambientPressureAtElevation(11000));
    expect(ambientPressureAtElevation(-1e9)).toBe(ambientPressureAtElevation(-500));
    expect(ambientPressureAtElevation(1e9)).toBeGreaterThan(0);
  });
});
