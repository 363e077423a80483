import { describe, expect, it } from 'vitest';
import { producerPower } from '../../src/elements/producer-power.js';
import type { ProducerModel } from '../../src/network/model.js';

const P_ATM = 101325;
const T = 293.15;
const RHO_STD = 101325 / (287.05 * T);
const CFM = 0.3048 ** 3 / 60;
const IN_HG = 3386.389; // Pa, NIST SP 811

describe('producerPower (ENGINEERING.md formulas)', () => {
  it('200 scfm at 12 inHg vacuum to 1 atm: isothermal 4.90 kW, adiabatic 5.28 kW (CHECKS.md [K])', () => {
    const p = producerPower({ massFlowKgPerS: 200 * CFM * RHO_STD, inletPressurePa: P_ATM - 12 * IN_HG, ambientPa: P_ATM, temperatureK: T });
    expect(p.isothermalAirW / 1000).toBeCloseTo(4.9, 2);
    expect(p.adiabaticAirW / 1000).toBeCloseTo(5.28, 2);
    expect(p.shaftW).toBeUndefined();
  });
  it('100 scfm at 8 inHg: 1.49 kW / 1.56 kW (CHECKS.md [K])', () => {
    const p = producerPower({ massFlowKgPerS: 100 * CFM * RHO_STD, inletPressurePa: P_ATM - 8 * IN_HG, ambientPa: P_ATM, temperatureK: T });
    expect(p.isothermalAirW / 1000).toBeCloseTo(1.49, 2);
    expect(p.adiabaticAirW / 1000).toBeCloseTo(1.56, 2);
  });
  it('isothermal compression 1e5 -> 1e6 Pa at 300 K: 5743.43 J/mol (fluids docs, CHECKS.md [C])', () => {
    // One mole of air per second: M = R_u / R_air = 8.314462618 / 287.05 kg/mol.
    const p = producerPower({ massFlowKgPerS: 8.314462618 / 287.05, inletPressurePa: 1e5, ambientPa: 1e6, temperatureK: 300 });
    expect(p.isothermalAirW).toBeCloseTo(5743.43, 1);
  });
  it('adiabatic exceeds isothermal, which exceeds zero, for any compression', () => {
    for (const v of [1000, 20000, 60000]) {
      const p = producerPower({ massFlowKgPerS: 0.1, inletPressurePa: P_ATM - v, ambientPa: P_ATM, temperatureK: T });
      expect(p.adiabaticAirW).toBeGreaterThan(p.isothermalAirW);
      expect(p.isothermalAirW).toBeGreaterThan(0);
    }
  });

  const curve = [
    { flowM3PerS: 0, vacuumPa: 50000, powerW: 3000 },
    { flowM3PerS: 0.1, vacuumPa: 44000, powerW: 5000 },
    { flowM3PerS: 0.2, vacuumPa: 27000, powerW: 6000 },
  ];
  it('shaft power from the power column, interpolated in the curve basis', () => {
    const model: ProducerModel = { name: 'p', flowBasis: 'standard', curve };
    const p = producerPower({ massFlowKgPerS: 0.1 * RHO_STD, inletPressurePa: P_ATM - 44000, ambientPa: P_ATM, temperatureK: T }, model);
    expect(p.shaftFrom).toBe('power-column');
    expect(p.shaftW).toBeCloseTo(5000, 6);
    const between = producerPower({ massFlowKgPerS: 0.15 * RHO_STD, inletPressurePa: P_ATM - 37000, ambientPa: P_ATM, temperatureK: T }, model);
    expect(between.shaftW).toBeGreaterThan(5000);
    expect(between.shaftW).toBeLessThan(6000);
  });
  it('shaft power from efficiency: adiabatic air power / efficiency', () => {
    const model: ProducerModel = { name: 'p', flowBasis: 'standard', curve: curve.map(({ flowM3PerS, vacuumPa }) => ({ flowM3PerS, vacuumPa })), efficiency: 0.5 };
    const p = producerPower({ massFlowKgPerS: 0.1, inletPressurePa: 60000, ambientPa: P_ATM, temperatureK: T }, model);
    expect(p.shaftFrom).toBe('efficiency');
    expect(p.shaftW).toBeCloseTo(p.adiabaticAirW / 0.5, 9);
  });
  it('guards: no flow, no compression or bad inputs give zero, never NaN', () => {
    for (const pt of [
      { massFlowKgPerS: 0, inletPressurePa: 6e4, ambientPa: P_ATM, temperatureK: T },
      { massFlowKgPerS: 0.1, inletPressurePa: P_ATM + 1, ambientPa: P_ATM, temperatureK: T },
      { massFlowKgPerS: 0.1, inletPressurePa: 0, ambientPa: P_ATM, temperatureK: T },
      { massFlowKgPerS: Number.NaN, inletPressurePa: 6e4, ambientPa: P_ATM, temperatureK: T },
    ]) {
      const p = producerPower(pt, { name: 'p', flowBasis: 'actual', curve });
      expect(p.isothermalAirW).toBe(0);
      expect(p.adiabaticAirW).toBe(0);
      expect(Number.isFinite(p.shaftW)).toBe(true);
    }
  });
});
