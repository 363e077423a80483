import { describe, expect, it } from 'vitest';
import { airDensity } from '../../src/air/density.js';

describe('airDensity (ideal gas, R = 287.05)', () => {
  it('dry air at 20 C, 101.325 kPa: 1.2041 kg/m3 (CHECKS.md [K])', () => {
    expect(airDensity(101325, 293.15)).toBeCloseTo(1.2041, 4);
  });
  it('US Standard Atmosphere 1976 at 5000 m (54,048.3 Pa, 255.68 K): 0.73643 kg/m3 within 0.01 %', () => {
    expect(Math.abs(airDensity(54048.3, 255.676) / 0.73643 - 1)).toBeLessThan(1e-4);
  });
  it('guards: zero, negative or non-finite state gives 0', () => {
    expect(airDensity(0, 293.15)).toBe(0);
    expect(airDensity(-5, 293.15)).toBe(0);
    expect(airDensity(101325, 0)).toBe(0);
    expect(airDensity(Number.NaN, 293.15)).toBe(0);
    expect(airDensity(Number.POSITIVE_INFINITY, 293.15)).toBe(0);
  });
});
