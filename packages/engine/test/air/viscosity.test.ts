import { describe, expect, it } from 'vitest';
import { airViscosity } from '../../src/air/viscosity.js';

describe('airViscosity (Sutherland, US Standard Atmosphere 1976 constants)', () => {
  it('20 C: 1.8134e-5 Pa s (CHECKS.md [K])', () => {
    expect(airViscosity(293.15)).toBeCloseTo(1.8134e-5, 9);
  });
  it('0 C: mu_ref 1.716e-5 Pa s (ENGINEERING.md reference form) within 0.01 %', () => {
    expect(Math.abs(airViscosity(273.15) / 1.716e-5 - 1)).toBeLessThan(1e-4);
  });
  it('US Standard Atmosphere 1976 table: 1.7894e-5 Pa s at 288.15 K', () => {
    expect(airViscosity(288.15)).toBeCloseTo(1.7894e-5, 9);
  });
  it('guards: clamps temperature, non-finite gives 20 C', () => {
    expect(airViscosity(Number.NaN)).toBe(airViscosity(293.15));
    expect(airViscosity(-10)).toBe(airViscosity(100));
    expect(airViscosity(-10)).toBeGreaterThan(0);
  });
});
