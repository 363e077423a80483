/**
 * The flow rules on real analyses (analyseSystem on small systems), checked
 * against bounds that follow from published physics, not from the solver:
 * the isentropic nozzle's choked mass flow (ENGINEERING.md, tool law) and the
 * producer curve's shut-off vacuum.
 */
import { describe, expect, it } from 'vitest';
import { analyseSystem } from '../../src/analysis/analyse-system.js';
import { runRules } from '../../src/rules/index.js';
import { floorTool, SystemBuilder, UNITS } from '../fixtures/system-builder.js';

const { IN, INHG, CFM } = UNITS;
/** Schedule 10 bores (ASME B36.10M, CHECKS.md): NPS 6 161.5 mm, NPS 2-1/2 66.9 mm. */
const NPS6 = 0.1615;
const NPS2_5 = 0.0669;
const R = 287.05; // J/(kg K), dry air (ENGINEERING.md)
const KAPPA = 1.4; // dry air

/** Choked mass flow of a sharp-edged orifice from ambient air (isentropic nozzle, r = 0.5283). */
function chokedFlow(d: number, cd: number, p0: number, t: number): number {
  const a = (Math.PI / 4) * d * d;
  return cd * a * p0 * Math.sqrt(KAPPA / (R * t)) * (2 / (KAPPA + 1)) ** ((KAPPA + 1) / (2 * (KAPPA - 1)));
}

describe('flow rules on analysed systems', () => {
  it('finds a 6 in main too slow with one operator, at no more than the choked-tool bound', () => {
    const m = new SystemBuilder('oversized', { operators: 1 })
      .producer('P')
      .separator('S', 'P')
      .pipe('main', 'S', 'n1', { d: NPS6, nominal: 6 * IN, lengthM: 30 })
      .inletAt('i1', 'n1')
      .build();
    const a = analyseSystem(m);
    const f = runRules(m, a).findings.find((x) => x.code === 'slow-carrying-velocity' && x.element.name === 'main');
    expect(f).toBeDefined();
    // Upper bound: the tool passes at most its choked flow (7/8 in orifice, Cd 0.61, 101,325 Pa, 20 C),
    // at a pressure no lower than ambient minus the curve's 14 inHg shut-off vacuum.
    const mMax = chokedFlow(0.875 * IN, 0.61, 101325, 293.15);
    const rhoMin = (101325 - 14 * INHG) / (R * 293.15);
    const vMax = mMax / (rhoMin * (Math.PI / 4) * NPS6 ** 2);
    const v = a.pipes.find((p) => p.name === 'main')!.minVelocityMPerS!;
    expect(v).toBeGreaterThan(0);
    expect(v).toBeLessThanOrEqual(vMax);
    // and well under the 3500 fpm (17.8 m/s) ACGIH low end for general debris
    expect(vMax).toBeLessThan(17.78);
  });

  it('calls a tool starved when it needs the curve\'s shut-off vacuum', () => {
    // The curve gives 14 inHg only at zero flow; a tool drawing air can never see it.
    const greedy = { ...floorTool, requiredVacuumPa: 14 * INHG };
    const m = new SystemBuilder('impossible', { operators: 1 })
      .producer('P')
      .separator('S', 'P')
      .pipe('main', 'S', 'n1', { d: NPS2_5, nominal: 2.5 * IN, lengthM: 10 })
      .inletAt('i1', 'n1', { tool: greedy })
      .build();
    const f = runRules(m, analyseSystem(m)).findings.find((x) => x.code === 'starved-inlet');
    expect(f?.element.name).toBe('i1');
    expect(f!.fix!['toolVacuumPa'] as number).toBeLessThan(14 * INHG);
  });

  it('calls a producer short when its curve gives less than one tool draws at its need', () => {
    // Tool: 7/8 in orifice, Cd 0.61, needs 3 inHg. Scaling the CHECKS.md tool-law value (1.0 in,
    // Cd 0.60, 40 inH2O: 78.38 cfm of room air) by area and Cd gives about 61 cfm at its need.
    // This curve gives at most 52.9 scfm at any vacuum of 3 inHg or more, so the margin is negative.
    const small = {
      name: 'small',
      flowBasis: 'standard' as const,
      curve: [
        { flowM3PerS: 0, vacuumPa: 14 * INHG },
        { flowM3PerS: 30 * CFM, vacuumPa: 10 * INHG },
        { flowM3PerS: 50 * CFM, vacuumPa: 4 * INHG },
        { flowM3PerS: 60 * CFM, vacuumPa: 0.5 * INHG },
      ],
      efficiency: 0.5,
    };
    const tool = { ...floorTool, requiredVacuumPa: 3 * INHG };
    const m = new SystemBuilder('small producer', { operators: 1 })
      .producer('P', small)
      .separator('S', 'P')
      .pipe('main', 'S', 'n1', { d: NPS2_5, nominal: 2.5 * IN, lengthM: 10 })
      .inletAt('i1', 'n1', { tool })
      .build();
    const a = analyseSystem(m);
    const f = runRules(m, a).findings.find((x) => x.code === 'producer-short');
    expect(f?.element).toEqual({ kind: 'producer', name: 'P', property: 'model' });
    expect(a.producers[0]!.marginFraction!).toBeLessThan(52.9 / 61 - 1 + 0.02);
  });

  it('stays quiet about vacuum on a short 2-1/2 in run to one inlet with an ordinary tool need', () => {
    const m = new SystemBuilder('plain', { operators: 1 })
      .producer('P')
      .separator('S', 'P')
      .pipe('main', 'S', 'n1', { d: NPS2_5, nominal: 2.5 * IN, lengthM: 10 })
      .inletAt('i1', 'n1')
      .build();
    const codes = runRules(m, analyseSystem(m)).findings.map((x) => x.code);
    // The floor tool needs 30 inH2O (about 2.2 inHg) against a producer of 10-14 inHg.
    expect(codes).not.toContain('starved-inlet');
    expect(codes).not.toContain('producer-short');
  });
});
