/**
 * Facts of the trade, told by practitioners, that the engine's physics and
 * defaults must agree with. None has a published source we could cite: each
 * is marked common practice, and the tolerances are wide on purpose. (The
 * header-feed and hose-length facts are in analysis/analyse-system.test.ts.)
 */
import { describe, expect, it } from 'vitest';
import {
  ALL_RULES,
  COMMON_PRACTICE_RATE_FT2_PER_H,
  hoseLaw,
  toolLaw,
  toSI,
  type HoseKind,
  type TwoPortLaw,
} from '@vacnet/engine';

const IN = 0.0254; // m, exact (NIST SP 811)
const FT = 0.3048; // m, exact (NIST SP 811)
const INHG = 3386.389; // Pa, conventional inch of mercury (NIST SP 811)
const INH2O = 249.082; // Pa, inch of water at 39.2 F (NIST SP 811)
const CFM = 0.028316846592 / 60; // m3/s, exact
const AMBIENT = 101_325; // Pa, standard atmosphere
const T = 293.15; // K, 20 C
const RHO = 1.2041; // kg/m3, dry air at 20 C and 101.325 kPa (ideal gas)
const FPM = FT / 60; // m/s

/** Flow through a tool and hose in series, from the room to an inlet valve held at `inletVacuumPa`. */
function toolAndHose(tool: TwoPortLaw, hose: TwoPortLaw, inletVacuumPa: number) {
  const inlet = AMBIENT - inletVacuumPa;
  // The hose-end pressure lies between the inlet's and the room's; bisect on the flow mismatch.
  let low = inlet;
  let high = AMBIENT;
  for (let i = 0; i < 200; i++) {
    const mid = (low + high) / 2;
    const mismatch = tool.flow(AMBIENT, mid).massFlowKgPerS - hose.flow(mid, inlet).massFlowKgPerS;
    if (mismatch > 0) low = mid;
    else high = mid;
  }
  const hoseEnd = (low + high) / 2;
  return { massFlow: tool.flow(AMBIENT, hoseEnd).massFlowKgPerS, hoseLossPa: hoseEnd - inlet, toolVacuumPa: AMBIENT - hoseEnd };
}

describe('facts of the trade (common practice)', () => {
  it('mercury is about 13.6 times as heavy as water, so about 135 inH2O is 10 inHg', () => {
    const inH2OPer10InHg = (10 * INHG) / INH2O;
    expect(inH2OPer10InHg).toBeGreaterThan(135);
    expect(inH2OPer10InHg).toBeLessThan(137);
    // and the engine's own unit table agrees
    const tenInHg = toSI(10, 'inHg', 'pressure');
    const inH2O = toSI(1, 'inH2O', 'pressure');
    expect(tenInHg.ok && inH2O.ok && tenInHg.si / inH2O.si).toBeCloseTo(inH2OPer10InHg, 6);
  });

  it('about 2,000 fpm (33 ft/s) is too slow to keep a horizontal pipe flushed: every default carrying velocity is above it', () => {
    const rule = ALL_RULES.find((r) => r.code === 'slow-carrying-velocity')!;
    const minVelocity = rule.parameters.find((p) => p.name === 'minVelocity')!;
    const byDebris = Object.values(minVelocity.defaultByDebris ?? { general: minVelocity.default });
    expect(byDebris.length).toBeGreaterThan(0);
    for (const v of byDebris) expect(v).toBeGreaterThan(2000 * FPM);
  });

  it('hoses of 25 to 100 ft lose up to about 10 inHg at the long, narrow end of that range', () => {
    const hose = (lengthFt: number, boreIn: number): HoseKind => ({
      name: 'h',
      lengthM: lengthFt * FT,
      boreM: boreIn * IN,
      roughnessM: 0.3e-3, // flexible hose, within ASHRAE's 0.09-0.9 mm band for flexible duct (CHECKS.md)
      conductive: false,
    });
    // A floor tool (1 in equivalent orifice) on a commercial system holding 12 inHg at the valve.
    const tool = toolLaw({ kind: 'orifice', diameterM: 1 * IN, dischargeCoefficient: 0.61 }, AMBIENT, T);
    const longNarrow = toolAndHose(tool, hoseLaw(hose(100, 1.25), AMBIENT, T), 12 * INHG);
    const shortWide = toolAndHose(tool, hoseLaw(hose(25, 1.5), AMBIENT, T), 12 * INHG);
    expect(longNarrow.hoseLossPa / INHG).toBeGreaterThan(5);
    expect(longNarrow.hoseLossPa / INHG).toBeLessThan(11);
    // At the short, wide end the same tool loses far less in its hose, though it passes more air.
    expect(shortWide.hoseLossPa).toBeLessThan(0.6 * longNarrow.hoseLossPa);
    // The hose is the largest restriction: the long narrow one passes much less air.
    expect(longNarrow.massFlow).toBeLessThan(0.8 * shortWide.massFlow);
  });

  it('a lifted tool on a low-vacuum system passes on the order of 90-110 cfm', () => {
    // An open 1-1/4 in tool end (equivalent orifice, Cd 0.61) at 20-30 inH2O at the hose end.
    const lifted = toolLaw({ kind: 'orifice', diameterM: 1.25 * IN, dischargeCoefficient: 0.61 }, AMBIENT, T);
    for (const vacuumInH2O of [20, 30]) {
      const cfm = lifted.flow(AMBIENT, AMBIENT - vacuumInH2O * INH2O).massFlowKgPerS / RHO / CFM;
      expect(cfm).toBeGreaterThan(85);
      expect(cfm).toBeLessThan(115);
    }
  });

  it('an operator cleans about 2,500 sq ft of carpet an hour (1,500 in small rooms) and 3,500-5,000 of bare floor, up to about 7,200', () => {
    expect(COMMON_PRACTICE_RATE_FT2_PER_H.carpet).toBe(2500);
    expect(COMMON_PRACTICE_RATE_FT2_PER_H['small-rooms']).toBe(1500);
    expect(COMMON_PRACTICE_RATE_FT2_PER_H.bare).toBeGreaterThanOrEqual(3500);
    expect(COMMON_PRACTICE_RATE_FT2_PER_H.bare).toBeLessThanOrEqual(5000);
    expect(COMMON_PRACTICE_RATE_FT2_PER_H['open-bare']).toBeLessThanOrEqual(7200);
  });

  it('test orifices of 1/2, 5/8 and 7/8 in: a smaller orifice passes less air, so the gauge reads more vacuum', () => {
    // Same valve vacuum, same hose: the tool-end vacuum rises as the orifice shrinks.
    const hose = hoseLaw({ name: 'h', lengthM: 35 * FT, boreM: 1.5 * IN, roughnessM: 0.3e-3, conductive: false }, AMBIENT, T);
    const readings = [0.5, 0.625, 0.875].map((d) =>
      toolAndHose(toolLaw({ kind: 'orifice', diameterM: d * IN, dischargeCoefficient: 0.61 }, AMBIENT, T), hose, 8 * INHG),
    );
    expect(readings[0]!.toolVacuumPa).toBeGreaterThan(readings[1]!.toolVacuumPa);
    expect(readings[1]!.toolVacuumPa).toBeGreaterThan(readings[2]!.toolVacuumPa);
    expect(readings[0]!.massFlow).toBeLessThan(readings[2]!.massFlow);
  });
});
