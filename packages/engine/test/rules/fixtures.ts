/**
 * Small builders for rule tests: system models and hand-made analyses.
 * Analyses are written by hand so each rule is tested on exactly the numbers
 * it reads, independent of the solver.
 */
import type {
  ElementRules,
  HoseKind,
  Inlet,
  InletPosition,
  Pipe,
  PipeSpec,
  SystemModel,
  ToolKind,
} from '../../src/network/model.js';
import type {
  InletAnalysis,
  PipeAnalysis,
  ProducerPoint,
  SystemAnalysis,
  WorstCase,
} from '../../src/analysis/analysis-types.js';
import { insideDiameterFor } from '../../src/network/spec-sizes.js';

/** Inch and foot, m (exact). */
export const IN = 0.0254;
export const FT = 0.3048;
/** Feet per minute in m/s (exact). */
export const FPM = FT / 60;
/** Conventional inHg and inH2O (39.2 F), Pa (NIST SP 811). */
export const INHG = 3386.389;
export const INH2O = 249.082;
/** Standard cubic foot per minute, m^3/s. */
export const CFM = (FT * FT * FT) / 60;

export function noRules(): ElementRules {
  return { settings: [], suppressions: [] };
}

/** Steel schedule 10 spec, NPS 2 to 6 (ASME B36.10M), commercial steel roughness 45 um (ASHRAE). */
export function steel10(over: Partial<PipeSpec> = {}): PipeSpec {
  return {
    name: 'steel-10',
    material: 'steel',
    roughnessM: 45e-6,
    conductive: true,
    sizeRule: { kind: 'schedule', schedule: '10' },
    nominalSizesM: [2, 2.5, 3, 4, 5, 6].map((n) => n * IN),
    ...over,
  };
}

export function steel40(over: Partial<PipeSpec> = {}): PipeSpec {
  return steel10({ name: 'steel-40', sizeRule: { kind: 'schedule', schedule: '40' }, ...over });
}

export function pvc(over: Partial<PipeSpec> = {}): PipeSpec {
  return {
    name: 'pvc-tube',
    material: 'pvc',
    roughnessM: 9e-6,
    conductive: false,
    sizeRule: { kind: 'inside' },
    nominalSizesM: [],
    ...over,
  };
}

export interface PipeOptions extends Partial<Omit<Pipe, 'name' | 'from' | 'to'>> {
  /** Nominal size in inches (sets nominal size and bore from the spec). */
  sizeIn?: number;
  lengthFt?: number;
}

export function pipe(name: string, from: string, to: string, o: PipeOptions = {}): Pipe {
  const spec = o.spec ?? steel10();
  const nominal = o.nominalSizeM ?? (o.sizeIn ?? 3) * IN;
  const id = insideDiameterFor(spec.sizeRule, nominal);
  const { sizeIn: _s, lengthFt, ...rest } = o;
  return {
    name,
    from,
    to,
    spec,
    nominalSizeM: nominal,
    insideDiameterM: id.ok ? id.insideDiameterM : nominal,
    lengthM: lengthFt !== undefined ? lengthFt * FT : 10,
    orientation: 'horizontal',
    fittings: [],
    rules: noRules(),
    ...rest,
  };
}

export function hose(over: Partial<HoseKind> = {}): HoseKind {
  return { name: 'std-50', lengthM: 50 * FT, boreM: 1.5 * IN, roughnessM: 0.3e-3, conductive: true, ...over };
}

export function tool(over: Partial<ToolKind> = {}): ToolKind {
  return { name: 'carpet', working: { kind: 'orifice', diameterM: 0.875 * IN, dischargeCoefficient: 0.61 }, ...over };
}

export function inlet(name: string, position: InletPosition | string, over: Partial<Inlet> = {}): Inlet {
  return {
    name,
    position: typeof position === 'string' ? { kind: 'point', point: position } : position,
    hose: hose(),
    tool: tool(),
    publicArea: false,
    locked: false,
    rules: noRules(),
    ...over,
  };
}

export function system(over: Partial<SystemModel> = {}): SystemModel {
  return {
    name: 'test-system',
    site: { ambientPressurePa: 101325, temperatureK: 293.15 },
    displayUnits: 'imperial',
    design: { areas: [], debris: 'general' },
    dust: { combustible: false, metal: false, bondedAndGrounded: false },
    producers: [],
    separators: [],
    filters: [],
    pipes: [],
    inlets: [],
    cleanouts: [],
    scenarios: [],
    rules: { settings: [], suppressions: [], severities: [] },
    ...over,
  };
}

export function pipeAnalysis(p: Pipe, over: Partial<PipeAnalysis> = {}): PipeAnalysis {
  return {
    name: p.name,
    insideDiameterM: p.insideDiameterM,
    lengthM: p.lengthM,
    servedInlets: [],
    minVelocityMPerS: null,
    minVelocityInlet: null,
    maxVelocityMPerS: null,
    maxVelocityInlets: [],
    lossPa: null,
    ...over,
  };
}

export function worstCase(over: Partial<WorstCase> = {}): WorstCase {
  return {
    openInlets: [],
    method: 'exact',
    setsEvaluated: 1,
    inletVacuumPa: 8 * INHG,
    toolVacuumPa: 5 * INHG,
    flowStdM3PerS: 100 * CFM,
    toolAirPowerW: 500,
    hoseLossPa: 3 * INHG,
    requiredToolVacuumPa: 3 * INHG,
    ...over,
  };
}

export function inletAnalysis(name: string, over: Partial<InletAnalysis> = {}): InletAnalysis {
  return { name, worstCase: worstCase({ openInlets: [name] }), alone: null, ...over };
}

export function producerPoint(name: string, over: Partial<ProducerPoint> = {}): ProducerPoint {
  return {
    name,
    massFlowKgPerS: 0.1,
    flowStdM3PerS: 200 * CFM,
    inletFlowM3PerS: 0.12,
    inletPressurePa: 101325 - 10 * INHG,
    vacuumPa: 10 * INHG,
    airPowerW: 3000,
    airPowerIsothermalW: 3000,
    airPowerAdiabaticW: 3200,
    shaftPowerW: null,
    marginFraction: 0.2,
    demand: { flowStdM3PerS: 200 * CFM, vacuumPa: 10 * INHG },
    ...over,
  };
}

export function analysis(over: Partial<SystemAnalysis> = {}): SystemAnalysis {
  return {
    ambient: { pressurePa: 101325, temperatureK: 293.15 },
    operators: { count: 1, source: 'stated', fromAreas: null },
    designCase: null,
    producer: null,
    producers: [],
    inlets: [],
    pipes: [],
    scenarios: [],
    billOfMaterials: { pipes: [], fittings: [], inlets: 0, cleanouts: 0, hoses: [], tools: [], producers: [], separators: [], filters: [] },
    commissioning: null,
    failures: [],
    topology: [],
    effort: { solves: 0, newtonIterations: 0, elementEvaluations: 0 },
    ...over,
  };
}
