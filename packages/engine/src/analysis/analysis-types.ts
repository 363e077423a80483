/**
 * The design analysis of one system: what `analyseSystem` returns and what
 * the design rules read. Plain JSON-able data in SI units; every numeric key
 * ends with its unit (`Pa`, `M3PerS`, `KgPerS`, `MPerS`, `W`, `M`, `M2`, `S`),
 * dimensionless fractions end with `Fraction`, counts are plain numbers.
 * Pressures called `...VacuumPa` are gauge vacuum (ambient minus absolute);
 * `...PressurePa` is absolute. `null` means "not computed" (the case failed
 * or does not apply); the reason is in `failures`.
 */
import type { ElementName, ElementRef, Finding } from '../network/model.js';
import type { SolveFailureCause } from '../solve/solve-types.js';

/** How the worst partner set of an inlet was found. */
export type WorstCaseMethod = 'exact' | 'greedy-swap';

export type ToolState = 'working' | 'lifted';

/** Why a case could not be solved (the solver's failure causes). */
export type { SolveFailureCause };

export interface AnalysisOptions {
  /** Design operators; overrides the file and the area derivation. */
  operators?: number;
  /** Largest number of partner sets per inlet searched exhaustively (default 2,000). */
  exactSetLimit?: number;
  /** Test orifice for the commissioning predictions, m (default: design basis, else 5/8 in). */
  testOrificeDiameterM?: number;
  /** Discharge coefficient of the test orifice (default 0.61, sharp-edged). */
  testOrificeDischargeCoefficient?: number;
  /** Also predict each inlet's gauge reading with its test orifice alone (one more solve per inlet). */
  commissioningAlone?: boolean;
  /** Skip parts of the analysis (for editors that want a quick answer). */
  skip?: {
    worstCase?: boolean;
    velocities?: boolean;
    commissioning?: boolean;
    scenarios?: boolean;
  };
}

/** The producer at one solved operating point. */
export interface ProducerPoint {
  name: ElementName;
  massFlowKgPerS: number;
  /** Flow at standard conditions (20 C, 101.325 kPa, 1.2041 kg/m3). */
  flowStdM3PerS: number;
  /** Actual flow at the producer inlet (local pressure and temperature). */
  inletFlowM3PerS: number;
  /** Absolute pressure at the producer inlet. */
  inletPressurePa: number;
  /** Vacuum at the producer inlet. */
  vacuumPa: number;
  /** Isothermal air power, p1 Q1 ln(p_atm/p1). */
  airPowerW: number;
  airPowerIsothermalW: number;
  airPowerAdiabaticW: number;
  /** From the curve's power column or air power / efficiency; null when neither is given. */
  shaftPowerW: number | null;
  /**
   * Margin of the curve over the demand, as a fraction of flow: the curve's
   * flow at the demand vacuum over the demand flow, minus one. The demand is
   * the point at which the critical tool of the case gets exactly the
   * vacuum it needs. Null when no tool states a need and the design basis
   * gives no default.
   */
  marginFraction: number | null;
  /** The demand point behind `marginFraction`. */
  demand: { flowStdM3PerS: number; vacuumPa: number } | null;
  /** The law held the producer at a limit: past the end of its curve, or on its relief. */
  limited?: 'curve-end' | 'relief';
}

/** One open inlet in one solved case. */
export interface InletPoint {
  name: ElementName;
  toolState: ToolState;
  /** Vacuum at the inlet valve (where the hose plugs in). */
  inletVacuumPa: number;
  /** Vacuum at the hose end (at the tool). */
  toolVacuumPa: number;
  massFlowKgPerS: number;
  flowStdM3PerS: number;
  /** Room air entering the tool, at ambient density. */
  roomFlowM3PerS: number;
  /** Air power at the tool: room flow x vacuum at the hose end (ASTM F558 definition). */
  toolAirPowerW: number;
  /** Vacuum lost along the hose (tool vacuum is inlet vacuum minus this). */
  hoseLossPa: number;
  /**
   * Present when the tool runs choked (sonic: the hose-end pressure below
   * 0.5283 of ambient). The flow is then the nozzle's critical flow, fixed
   * by the room side alone, and does not rise with more vacuum: a physical
   * state of the design, reported (rule tool-choked), not a failed solve.
   */
  limited?: 'choked';
}

/** One pipe in one solved case (a pipe split by inlets is reported whole). */
export interface PipePoint {
  name: ElementName;
  /** Mass flow entering the pipe at its far end side (largest segment flow). */
  massFlowKgPerS: number;
  /** Velocity at the upstream (far, higher-pressure) end of the part that carries air. */
  upstreamVelocityMPerS: number;
  /** Velocity at the producer-side end (the highest in the pipe). */
  downstreamVelocityMPerS: number;
  /** Pressure loss from the far end to the producer-side end. */
  lossPa: number;
}

/** A case that could not be solved. */
export interface AnalysisFailure {
  /**
   * What was being solved: `single-operator`, `worst-case`, `design` (the
   * design case), `demand` (the search for the producer vacuum at which the
   * design case's tools get what they need; `infeasible-demand` there means
   * no vacuum does), `max-velocity` (never `infeasible-demand`: that case is
   * extrapolated past the curve, see PipeAnalysis.maxVelocityLimited),
   * `scenario`, `commissioning`. The design stages (the first four) are
   * what the rule producer-short reads.
   */
  stage: string;
  /** The inlet, scenario or pipe the case was for. */
  subject: ElementName;
  openInlets: ElementName[];
  cause: SolveFailureCause;
  /** The element that made the case fail, when one did. */
  element?: ElementRef;
  message: string;
}

export interface WorstCase {
  /** The open inlets of the worst set, this inlet first. */
  openInlets: ElementName[];
  method: WorstCaseMethod;
  /** Partner sets solved to find it. */
  setsEvaluated: number;
  inletVacuumPa: number;
  toolVacuumPa: number;
  flowStdM3PerS: number;
  toolAirPowerW: number;
  hoseLossPa: number;
  /** What the tool needs at the hose end (tool kind, else design default); null when neither says. */
  requiredToolVacuumPa: number | null;
  /** Present when this inlet's tool runs choked in its worst case (see InletPoint.limited). */
  limited?: 'choked';
}

export interface InletAnalysis {
  name: ElementName;
  /** The worst set of design operators containing this inlet (tools working). */
  worstCase: WorstCase | null;
  /** This inlet alone, tool working. */
  alone: InletPoint | null;
}

export interface PipeAnalysis {
  name: ElementName;
  insideDiameterM: number;
  lengthM: number;
  /** Inlets whose air passes through this pipe. */
  servedInlets: ElementName[];
  /**
   * Lowest velocity with one operator (tool working) at any single inlet it
   * serves, at the upstream end of the part that carries air.
   */
  minVelocityMPerS: number | null;
  /** The inlet that gives `minVelocityMPerS`. */
  minVelocityInlet: ElementName | null;
  /**
   * Highest velocity with the design operators open at the served inlets
   * that draw most (tools lifted), at the producer-side end.
   */
  maxVelocityMPerS: number | null;
  /** The open set that gives `maxVelocityMPerS`. */
  maxVelocityInlets: ElementName[];
  /** Pressure loss along the pipe in that same highest-flow case. */
  lossPa: number | null;
  /**
   * Present when that case draws past the last point of the producer's
   * curve: the producer is then extrapolated along the curve's last slope
   * toward zero vacuum. The case only bounds velocities, so this is a note,
   * not a failure; the design case (tools working) judges the producer.
   */
  maxVelocityLimited?: 'curve-end';
}

export type OperatorSource = 'options' | 'stated' | 'areas' | 'default';

export interface OperatorCount {
  /** Design operators k used by the analysis (a whole number, at least 1). */
  count: number;
  source: OperatorSource;
  /** The area derivation, when the design basis lists areas and a window. */
  fromAreas: {
    areas: {
      surface: string;
      areaM2: number;
      /** Area one operator cleans per second. */
      rateM2PerS: number;
      /** Where the rate comes from: the file, or common practice. */
      rateSource: 'file' | 'common-practice';
      /** Operator time the area takes. */
      operatorTimeS: number;
    }[];
    totalOperatorTimeS: number;
    cleaningWindowS: number;
    /** Operator time over window, before rounding up. */
    exactOperators: number;
  } | null;
}

export interface ScenarioAnalysis {
  name: ElementName;
  ok: boolean;
  /** The first producer (the usual single-producer system); all of them in `producers`. */
  producer: ProducerPoint | null;
  producers: ProducerPoint[];
  inlets: InletPoint[];
  /** The pipes that carry air in this scenario. */
  pipes: PipePoint[];
}

export interface BillOfMaterials {
  pipes: {
    spec: ElementName;
    material: string;
    nominalSizeM: number;
    insideDiameterM: number;
    lengthM: number;
    /** Number of pipe runs of this spec and size. */
    runs: number;
  }[];
  fittings: {
    kind: 'bend' | 'reducer' | 'wye' | 'tee' | 'sweep';
    spec: ElementName;
    nominalSizeM: number;
    /** Bend or wye angle, rad. */
    angleRad?: number;
    /** Bend centreline radius over diameter. */
    radiusRatio?: number;
    count: number;
  }[];
  inlets: number;
  cleanouts: number;
  hoses: { kind: ElementName; lengthM: number; boreM: number; count: number }[];
  tools: { kind: ElementName; count: number }[];
  producers: { model: ElementName; count: number }[];
  separators: { model: ElementName; count: number }[];
  filters: { model: ElementName; count: number }[];
}

export interface CommissioningPrediction {
  /** The inlet under test. */
  name: ElementName;
  /**
   * The vacuum a gauge at this inlet's valve should read with the test
   * orifice in the valve, while the partner inlets of its worst case each
   * also hold a test orifice (a set-up repeatable on site without operators).
   */
  gaugeVacuumPa: number;
  flowStdM3PerS: number;
  /** The inlets holding orifices, this inlet first. */
  openInlets: ElementName[];
  /** The same orifice with only this inlet open (when asked for: `commissioningAlone`). */
  aloneGaugeVacuumPa: number | null;
}

export interface Commissioning {
  testOrificeDiameterM: number;
  dischargeCoefficient: number;
  inlets: CommissioningPrediction[];
}

export interface SystemAnalysis {
  ambient: { pressurePa: number; temperatureK: number };
  operators: OperatorCount;
  /**
   * The design case: the worst set of the inlet whose tool is left with the
   * least vacuum (its margin to need, where tools state a need).
   */
  designCase: { criticalInlet: ElementName; openInlets: ElementName[] } | null;
  /** The (first) producer in the design case; all producers in `producers`. */
  producer: ProducerPoint | null;
  producers: ProducerPoint[];
  inlets: InletAnalysis[];
  pipes: PipeAnalysis[];
  scenarios: ScenarioAnalysis[];
  billOfMaterials: BillOfMaterials;
  commissioning: Commissioning | null;
  /** Cases that could not be solved, with the element at fault. */
  failures: AnalysisFailure[];
  /** Structural findings met while building the network (no path, dangling pipe, loop...). */
  topology: Finding[];
  /** Work done, for benchmarks and editors: counts, not timings. */
  effort: {
    /** Network solves of any size. */
    solves: number;
    newtonIterations: number;
    /** Element law evaluations, the unit of solver work. */
    elementEvaluations: number;
  };
}
