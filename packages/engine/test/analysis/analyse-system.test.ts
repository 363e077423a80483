import { describe, expect, it } from 'vitest';
import { analyseSystem } from '../../src/analysis/analyse-system.js';
import type { SystemAnalysis } from '../../src/analysis/analysis-types.js';
import { runRules } from '../../src/rules/index.js';
import { SystemBuilder, UNITS, exhauster, floorTool, hose50 } from '../fixtures/system-builder.js';

const { IN, FT, INH2O, CFM } = UNITS;
const R = 287.05; // J/(kg K), dry air (ENGINEERING.md)
const RHO_STD = 101325 / (R * 293.15); // standard air, kg/m3

function library(operators = 2) {
  return new SystemBuilder('library', { operators })
    .producer('P')
    .filter('F', 'P')
    .separator('S', 'F')
    .pipe('main', 'S', 'j1', { d: 0.108, lengthM: 20 })
    .pipe('riser', 'j1', 'top', {
      d: 0.0828,
      lengthM: 12,
      joins: { kind: 'wye', angleRad: Math.PI / 4 },
      fittings: [{ kind: 'bend', angleRad: Math.PI / 2, count: 2, radiusRatio: 1.5 }],
    })
    .pipe('run', 'j1', 'east', { d: 0.108, lengthM: 15 })
    .inletOn('A1', 'riser', 3)
    .inletAt('A2', 'top')
    .inletAt('B1', 'east')
    .scenario('two', [
      { inlet: 'A1', toolState: 'working' },
      { inlet: 'B1', toolState: 'lifted' },
    ]);
}

/** Every number in the result, with the key it sits under. */
function numbers(value: unknown, key = '', out: { key: string; value: number }[] = []) {
  if (typeof value === 'number') out.push({ key, value });
  else if (Array.isArray(value)) value.forEach((v) => numbers(v, key, out));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) numbers(v, k, out);
  return out;
}

// Counts and other plain numbers that carry no unit.
const UNITLESS = new Set(['count', 'runs', 'inlets', 'cleanouts', 'setsEvaluated', 'solves', 'newtonIterations', 'elementEvaluations', 'exactOperators', 'dischargeCoefficient', 'radiusRatio']);

describe('analyseSystem: shape', () => {
  const a = analyseSystem(library().build());

  it('every numeric key ends with its SI unit, and no number is NaN or infinite', () => {
    const all = numbers(a);
    expect(all.length).toBeGreaterThan(100);
    for (const { key, value } of all) {
      expect(Number.isFinite(value), key).toBe(true);
      if (!UNITLESS.has(key)) expect(key, key).toMatch(/(Pa|M3PerS|KgPerS|MPerS|W|M|M2|S|K|Rad|Fraction)$/);
    }
  });

  it('has the parts the rules read', () => {
    expect(a.ambient.pressurePa).toBe(101325);
    expect(a.operators).toMatchObject({ count: 2, source: 'stated' });
    expect(a.inlets.map((i) => i.name)).toEqual(['A1', 'A2', 'B1']);
    expect(a.pipes.map((p) => p.name)).toEqual(['main', 'riser', 'run']);
    expect(a.scenarios.map((s) => s.name)).toEqual(['two']);
    expect(a.producer?.name).toBe('P');
    expect(a.commissioning?.inlets).toHaveLength(3);
    expect(a.failures).toEqual([]);
    expect(a.topology).toEqual([]);
  });
});

describe('analyseSystem: physics that must hold', () => {
  const a = analyseSystem(library().build());

  it('the producer draws what the open tools let in (mass balance, scenario)', () => {
    const s = a.scenarios[0]!;
    const sum = s.inlets.reduce((t, i) => t + i.massFlowKgPerS, 0);
    expect(Math.abs(s.producer!.massFlowKgPerS - sum)).toBeLessThan(1e-9 * sum);
    // Standard flow by the product's definition: 20 C, 101.325 kPa (ENGINEERING.md).
    expect(s.producer!.flowStdM3PerS).toBeCloseTo(s.producer!.massFlowKgPerS / RHO_STD, 12);
  });

  it('air power at the tool is room flow times hose-end vacuum (ASTM F558 definition)', () => {
    for (const i of a.inlets) {
      const p = i.alone!;
      expect(p.toolAirPowerW).toBeCloseTo(p.roomFlowM3PerS * p.toolVacuumPa, 9);
      expect(p.roomFlowM3PerS).toBeCloseTo((p.massFlowKgPerS * R * 293.15) / 101325, 12);
      expect(p.inletVacuumPa - p.toolVacuumPa).toBeCloseTo(p.hoseLossPa, 6);
    }
  });

  it('producer air power by the isothermal and adiabatic formulas (ENGINEERING.md)', () => {
    const p = a.producer!;
    const p1 = p.inletPressurePa;
    const q1 = p.inletFlowM3PerS;
    expect(p.airPowerIsothermalW).toBeCloseTo(p1 * q1 * Math.log(101325 / p1), 6);
    expect(p.airPowerAdiabaticW).toBeCloseTo(3.5 * p1 * q1 * ((101325 / p1) ** (0.4 / 1.4) - 1), 6);
    // Shaft power = adiabatic air power / efficiency 0.6 (fixture).
    expect(p.shaftPowerW!).toBeCloseTo(p.airPowerAdiabaticW / 0.6, 6);
  });

  it('the worst case holds the inlet and k-1 others and leaves less vacuum than working alone', () => {
    for (const i of a.inlets) {
      const wc = i.worstCase!;
      expect(wc.openInlets[0]).toBe(i.name);
      expect(new Set(wc.openInlets).size).toBe(2);
      expect(wc.method).toBe('exact');
      expect(wc.toolVacuumPa).toBeLessThan(i.alone!.toolVacuumPa);
      expect(wc.requiredToolVacuumPa).toBe(floorTool.requiredVacuumPa);
    }
    // The design case is the worst set of the inlet left with least margin.
    const least = [...a.inlets].sort((x, y) => x.worstCase!.toolVacuumPa - y.worstCase!.toolVacuumPa)[0]!;
    expect(a.designCase).toEqual({ criticalInlet: least.name, openInlets: least.worstCase!.openInlets });
  });

  it('pipe velocities: lowest with one operator at the far end, highest with k lifted tools', () => {
    const main = a.pipes.find((p) => p.name === 'main')!;
    expect(main.servedInlets.sort()).toEqual(['A1', 'A2', 'B1']);
    const riser = a.pipes.find((p) => p.name === 'riser')!;
    expect(riser.servedInlets.sort()).toEqual(['A1', 'A2']);
    for (const p of a.pipes) {
      expect(p.minVelocityMPerS!).toBeGreaterThan(0);
      expect(p.maxVelocityMPerS!).toBeGreaterThan(p.minVelocityMPerS!);
      expect(p.lossPa!).toBeGreaterThan(0);
    }
    // The riser's upstream (far) end with A2 alone: v = m R T / (p A), by hand from A2's lone case.
    const a2 = a.inlets.find((i) => i.name === 'A2')!.alone!;
    const area = (Math.PI * 0.0828 ** 2) / 4;
    const pTop = 101325 - a2.inletVacuumPa;
    expect(riser.minVelocityInlet).toBe('A2');
    expect(riser.minVelocityMPerS!).toBeCloseTo((a2.massFlowKgPerS * R * 293.15) / (pTop * area), 6);
  });

  it('the demand point gives the critical tool exactly what it needs; margin follows the curve', () => {
    const p = a.producer!;
    expect(p.demand).not.toBeNull();
    expect(p.demand!.vacuumPa).toBeLessThan(p.vacuumPa); // the producer has vacuum to spare here
    expect(p.marginFraction!).toBeGreaterThan(0);
    // A producer whose curve collapses early: margin below zero.
    const weak = library()
      .build();
    weak.producers[0]!.model = {
      ...exhauster,
      curve: [
        { flowM3PerS: 0, vacuumPa: 12 * INH2O },
        { flowM3PerS: 300 * CFM, vacuumPa: 1 * INH2O },
      ],
    };
    const b = analyseSystem(weak);
    expect(b.producer!.marginFraction!).toBeLessThan(0);
  });

  it('a smaller test orifice reads a higher gauge vacuum (orifice physics)', () => {
    const read = (d: number) => analyseSystem(library().build(), { testOrificeDiameterM: d }).commissioning!.inlets[0]!.gaugeVacuumPa;
    // Common practice (no published source): 1/2, 5/8, 7/8 in stand for narrow carpet, wide carpet, floor tools.
    const [half, fiveEighths, sevenEighths] = [0.5, 0.625, 0.875].map((x) => read(x * IN));
    expect(half!).toBeGreaterThan(fiveEighths!);
    expect(fiveEighths!).toBeGreaterThan(sevenEighths!);
    expect(analyseSystem(library().build()).commissioning!.testOrificeDiameterM).toBeCloseTo(0.625 * IN, 12);
  });
});

describe('commissioning at deep vacuum', () => {
  it('a test orifice at sonic flow still gives a reading (a choked test orifice is a sound test)', () => {
    const m = library(2).build();
    m.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 62000 }, { flowM3PerS: 400 * CFM, vacuumPa: 52000 }] };
    const a = analyseSystem(m);
    expect(a.failures.filter((f) => f.stage === 'commissioning')).toEqual([]);
    // Critical pressure ratio 0.5283 (isentropic nozzle, CHECKS.md): above (1 - 0.5283) x 101,325 Pa of vacuum the orifice is sonic.
    const sonic = (1 - 0.5283) * 101325;
    expect(a.commissioning!.inlets.every((i) => i.gaugeVacuumPa > sonic)).toBe(true);
  });
});

describe('analyseSystem: what cannot be solved is a typed failure with its element', () => {
  const causes = (a: SystemAnalysis) => a.failures.map((f) => `${f.cause}:${f.element?.kind}:${f.element?.name}`);

  it('demand beyond the producer curve is infeasible-demand on the producer', () => {
    const m = library(3).build();
    // One operator (about 90 scfm) fits on this curve, three do not.
    m.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 14 * 3386.389 }, { flowM3PerS: 150 * CFM, vacuumPa: 10 * 3386.389 }] };
    const a = analyseSystem(m);
    expect(causes(a)).toContain('infeasible-demand:producer:P');
    expect(a.failures.find((f) => f.cause === 'infeasible-demand')!.stage).toBe('worst-case');
  });

  it('a tool past the critical pressure ratio runs choked: a solved state noted on the inlet, not a failure', () => {
    // A huge producer at 95 % of its shut-off deep vacuum and a short, wide hose.
    const m = library(1).build();
    m.producers[0]!.model = { ...exhauster, curve: [{ flowM3PerS: 0, vacuumPa: 80000 }, { flowM3PerS: 2000 * CFM, vacuumPa: 78000 }] };
    for (const i of m.inlets) i.hose = { ...hose50, lengthM: 1, boreM: 3 * IN };
    const a = analyseSystem(m);
    expect(a.failures.filter((f) => f.cause === 'choked')).toEqual([]);
    const alone = a.inlets[0]!.alone!;
    expect(alone.limited).toBe('choked');
    expect(a.inlets[0]!.worstCase!.limited).toBe('choked');
    // Past the critical ratio 0.5283 (isentropic nozzle, CHECKS.md) at the hose end ...
    expect(alone.toolVacuumPa).toBeGreaterThan((1 - 0.5283) * 101325);
    // ... the flow is the choked nozzle flow, Cd A p0 sqrt(kappa/(R T)) (2/(kappa+1))^((kappa+1)/(2(kappa-1)))
    // (Shapiro 1953, ch. 4): 7/8 in working orifice, Cd 0.61 (fixture), 101,325 Pa, 20 C.
    const critical = 0.61 * ((Math.PI * (0.875 * IN) ** 2) / 4) * 101325 * Math.sqrt(1.4 / (R * 293.15)) * (2 / 2.4) ** 3;
    expect(alone.massFlowKgPerS).toBeCloseTo(critical, 10);
  });

  it('lifted tools past the end of the producer curve: the velocity case is extrapolated and flagged, not failed', () => {
    // The design case (two tools working) draws about 168 scfm; lifted tools draw more than the 200 scfm the curve states.
    const m = library(2).build();
    const INHG = 3386.389; // Pa, NIST SP 811
    m.producers[0]!.model = {
      ...exhauster,
      curve: [
        { flowM3PerS: 0, vacuumPa: 14 * INHG },
        { flowM3PerS: 100 * CFM, vacuumPa: 12.5 * INHG },
        { flowM3PerS: 200 * CFM, vacuumPa: 9 * INHG },
      ],
    };
    const a = analyseSystem(m);
    expect(a.failures).toEqual([]);
    expect(a.producer!.limited).toBeUndefined(); // the design case stays on the curve
    const flagged = a.pipes.filter((p) => p.maxVelocityLimited === 'curve-end');
    expect(flagged.length).toBeGreaterThan(0);
    for (const p of flagged) {
      expect(p.maxVelocityMPerS!).toBeGreaterThan(p.minVelocityMPerS!);
      // Extrapolated along the last slope, the lifted flow exceeds the curve's last point.
      expect(p.maxVelocityInlets.length).toBe(2);
    }
    // The producer serves the design case: producer-short stays silent.
    expect(runRules(m, a).findings.map((x) => x.code)).not.toContain('producer-short');
  });

  it('no producer vacuum gives the tools their need: infeasible-demand on the producer, from the demand search', () => {
    // A need above 90 % of the air pressure cannot be met at any vacuum (absolute pressure cannot fall below zero).
    const m = library(2).build();
    for (const i of m.inlets) i.tool = { ...i.tool!, requiredVacuumPa: 95000 };
    const a = analyseSystem(m);
    expect(a.producer!.marginFraction).toBeNull();
    const f = a.failures.find((x) => x.stage === 'demand')!;
    expect(f.cause).toBe('infeasible-demand');
    expect(f.element).toEqual({ kind: 'producer', name: 'P' });
    expect(f.openInlets).toEqual(a.designCase!.openInlets);
  });

  it('a zero-length pipe is an invalid element for every inlet behind it', () => {
    const m = library().build();
    m.pipes[1]!.lengthM = 0;
    const a = analyseSystem(m);
    expect(causes(a)).toContain('invalid-element:pipe:riser');
    expect(a.inlets.find((i) => i.name === 'A2')!.worstCase).toBeNull();
    expect(a.inlets.find((i) => i.name === 'B1')!.alone).not.toBeNull();
  });

  it('an inlet on piping that reaches no producer is no-path, and the topology says why', () => {
    const m = library().pipe('island', 'x', 'y').inletAt('Z', 'y').build();
    const a = analyseSystem(m);
    expect(a.failures.find((f) => f.subject === 'Z')?.cause).toBe('no-path');
    expect(a.topology.map((f) => f.code)).toContain('inlet-no-path');
    expect(a.inlets.find((i) => i.name === 'B1')!.worstCase).not.toBeNull();
  });
});

describe('facts of the trade (common practice, no published source)', () => {
  /** A header of n inlets 30 ft apart, fed at one end or at its centre. */
  function header(feed: 'end' | 'centre') {
    const b = new SystemBuilder(`header-${feed}`, { operators: 4 }).producer('P').separator('S', 'P');
    const n = 8;
    const spacing = 30 * FT;
    const d = 2 * IN; // a small header so that its own loss matters
    b.pipe('feed', 'S', 'c', { d: 0.108, lengthM: 10 });
    if (feed === 'end') {
      b.pipe('h', 'c', 'far', { d, lengthM: n * spacing });
      for (let i = 0; i < n; i++) b.inletOn(`I${i}`, 'h', (i + 0.5) * spacing);
    } else {
      b.pipe('hl', 'c', 'west', { d, lengthM: (n / 2) * spacing });
      b.pipe('hr', 'c', 'east', { d, lengthM: (n / 2) * spacing });
      for (let i = 0; i < n / 2; i++) {
        b.inletOn(`W${i}`, 'hl', (i + 0.5) * spacing);
        b.inletOn(`E${i}`, 'hr', (i + 0.5) * spacing);
      }
    }
    return analyseSystem(b.build(), { skip: { commissioning: true, velocities: true } });
  }
  const spread = (a: SystemAnalysis) => {
    const v = a.inlets.map((i) => i.worstCase!.toolVacuumPa);
    return { min: Math.min(...v), max: Math.max(...v) };
  };

  it('a long header fed from one end starves its far inlets; fed from the centre it balances', () => {
    const end = spread(header('end'));
    const centre = spread(header('centre'));
    // Feeding at the centre halves the run to the farthest inlet: the spread about halves.
    expect(end.max - end.min).toBeGreaterThan(1.5 * (centre.max - centre.min));
    expect(centre.min).toBeGreaterThan(end.min);
  });

  it('a longer or narrower hose passes less air, so less power reaches the tool', () => {
    const run = (hoseLengthFt: number, boreIn: number) => {
      const m = library(1).build();
      for (const i of m.inlets) i.hose = { ...hose50, lengthM: hoseLengthFt * FT, boreM: boreIn * IN };
      return analyseSystem(m, { skip: { commissioning: true, velocities: true, worstCase: true } }).inlets[1]!.alone!;
    };
    const base = run(35, 1.5);
    const longer = run(50, 1.5);
    const narrower = run(35, 1.25);
    for (const worse of [longer, narrower]) {
      expect(worse.massFlowKgPerS).toBeLessThan(base.massFlowKgPerS);
      expect(worse.toolAirPowerW).toBeLessThan(base.toolAirPowerW);
      expect(worse.hoseLossPa).toBeGreaterThan(base.hoseLossPa);
    }
  });
});
