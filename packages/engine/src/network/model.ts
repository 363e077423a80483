/**
 * The network model: what one central vacuum system is, as plain data in SI
 * units. The language package lowers a parsed file into this shape; the
 * engine reads nothing else. No parser, editor or file-system types here.
 *
 * Units inside the engine: Pa (absolute unless the name says vacuum), m, m^2,
 * kg/s, m^3/s, K, W, rad for angles, dimensionless ratios as fractions (0..1).
 */

/** A unique, user-chosen element name, e.g. `riser-b`. */
export type ElementName = string;

/** Which element (and which of its properties) a finding concerns. */
export interface ElementRef {
  kind: ElementKind;
  name: ElementName;
  /** The property the finding is about (`size`, `hose`, `length`...), if any. */
  property?: string;
}

export type ElementKind =
  | 'system'
  | 'producer'
  | 'separator'
  | 'filter'
  | 'pipe'
  | 'inlet'
  | 'cleanout'
  | 'scenario'
  | 'pipe-spec'
  | 'hose-kind'
  | 'tool-kind'
  | 'producer-model'
  | 'separator-model'
  | 'filter-model';

export type Severity = 'error' | 'warning' | 'info';

/** Site air. Ambient pressure is resolved by the lowering (from elevation or stated). */
export interface SiteAir {
  /** Ambient absolute pressure at the site, Pa. */
  ambientPressurePa: number;
  /** Site elevation above sea level, m, when the file gave one. */
  elevationM?: number;
  /** Air temperature in the piping (isothermal flow), K. */
  temperatureK: number;
}

export type DisplayUnits = 'imperial' | 'si';

/** Debris classes for the carrying-velocity threshold (ACGIH material groups). */
export type DebrisClass = 'fine' | 'dry' | 'general' | 'heavy' | 'moist';

/** A floor area to be cleaned, by surface kind, for the operator count. */
export interface CleaningArea {
  surface: 'carpet' | 'small-rooms' | 'bare' | 'open-bare';
  areaM2: number;
  /** Override of the hourly rate for this area, m^2/s per operator. */
  rateM2PerS?: number;
}

export interface DesignBasis {
  /** Simultaneous design operators stated in the file; undefined when derived from areas. */
  operators?: number;
  /** Areas to clean, from which the operator count follows with the window. */
  areas: CleaningArea[];
  /** The cleaning window, s. */
  cleaningWindowS?: number;
  debris: DebrisClass;
  /** Required producer margin over demand, as a fraction of flow (0.1 = 10 %). */
  producerMarginFraction?: number;
  /** The vacuum a tool needs at the hose end, Pa (gauge), where the tool kind does not say. */
  defaultToolVacuumPa?: number;
  /** The standard tool orifice for commissioning predictions (test orifice), m. */
  testOrificeDiameterM?: number;
}

export interface CombustibleDust {
  /** The dust can burn or explode. */
  combustible: boolean;
  /** Metal dust falls under the metals standard (NFPA 484). */
  metal: boolean;
  /** The file declares that all conductive parts are bonded and grounded. */
  bondedAndGrounded: boolean;
}

// ---------------------------------------------------------------- catalog

/** How a pipe spec gives inside diameters from a nominal size. */
export type SizeRule =
  /** ASME B36.10M steel pipe schedule (5, 10, 40, 80): ID from the NPS table. */
  | { kind: 'schedule'; schedule: string }
  /** Tubing sized by outside diameter with a stated wall: ID = nominal - 2 wall. */
  | { kind: 'wall'; wallM: number }
  /** Nominal size is the inside diameter. */
  | { kind: 'inside' };

export interface PipeSpec {
  name: ElementName;
  material: string;
  /** Absolute roughness, m. */
  roughnessM: number;
  conductive: boolean;
  sizeRule: SizeRule;
  /** Sizes this spec is made in (nominal, m), for the resize quick fix; may be empty. */
  nominalSizesM: number[];
}

export interface HoseKind {
  name: ElementName;
  lengthM: number;
  boreM: number;
  /** Absolute roughness, m (when no measured point is given). */
  roughnessM?: number;
  /** One measured loss point at this hose's length: vacuum drop and standard flow. */
  measuredLoss?: { lossPa: number; flowStdM3PerS: number };
  conductive: boolean;
}

/** A tool's flow law in one state. */
export type ToolLaw =
  /** Equivalent sharp-edged orifice: diameter and discharge coefficient. */
  | { kind: 'orifice'; diameterM: number; dischargeCoefficient: number }
  /** Measured flow (standard) against vacuum at the hose end (gauge Pa), ascending vacuum. */
  | { kind: 'table'; points: { vacuumPa: number; flowStdM3PerS: number }[] };

export interface ToolKind {
  name: ElementName;
  /** On the surface being cleaned: the design state for vacuum and carrying. */
  working: ToolLaw;
  /** Off the surface (open): the state that draws most air. Defaults to working. */
  lifted?: ToolLaw;
  /** Vacuum this tool needs at the hose end, Pa (gauge). */
  requiredVacuumPa?: number;
}

export interface CurvePoint {
  /** Flow through the producer; basis given by the curve. */
  flowM3PerS: number;
  /** Vacuum at the producer inlet, Pa (gauge). */
  vacuumPa: number;
  /** Shaft power at this point, W, when the curve has a power column. */
  powerW?: number;
}

export interface ProducerModel {
  name: ElementName;
  /** Curve flows are standard (at 20 C, 101.325 kPa) or actual at the producer inlet. */
  flowBasis: 'standard' | 'actual';
  /** Ascending flow; vacuum non-increasing with flow. */
  curve: CurvePoint[];
  /** Overall efficiency (air power / shaft power), when no power column. */
  efficiency?: number;
  /** Vacuum relief set point, Pa (gauge): bleed air holds the vacuum at or below it. */
  reliefVacuumPa?: number;
}

/** A quadratic loss scaled from one rated point: dp = dpRef (m/mRef)^2 (rhoRef/rho). */
export interface RatedLoss {
  lossPa: number;
  flowStdM3PerS: number;
}

export interface SeparatorModel {
  name: ElementName;
  rated: RatedLoss;
}

export interface FilterModel {
  name: ElementName;
  clean: RatedLoss;
  /** Loaded (dirty) rating; the design case uses it. */
  loaded?: RatedLoss;
}

// --------------------------------------------------------------- placement

/** A named point where pipes, equipment and inlets meet. */
export type PointName = string;

export interface ProducerUnit {
  name: ElementName;
  model: ProducerModel;
  /** Loss of the exhaust line on the discharge side, from a rated point. */
  exhaust?: RatedLoss;
}

export interface SeparatorUnit {
  name: ElementName;
  model: SeparatorModel;
  /** The point on the producer side (the element it discharges into). */
  towardProducer: PointName;
  indoors: boolean;
  explosionProtected: boolean;
}

export interface FilterUnit {
  name: ElementName;
  model: FilterModel;
  towardProducer: PointName;
}

export type Orientation = 'horizontal' | 'air-up' | 'air-down';

/** A fitting on a pipe; losses are on the pipe's own velocity pressure. */
export type Fitting =
  | { kind: 'bend'; angleRad: number; count: number; /** centreline radius / diameter */ radiusRatio: number }
  | { kind: 'reducer'; /** included angle, rad; undefined = standard concentric */ angleRad?: number };

/** How a pipe joins the pipe it discharges into (at its producer-side end). */
export type Junction =
  | { kind: 'wye'; angleRad: number }
  | { kind: 'tee' }
  | { kind: 'sweep' };

export interface Pipe {
  name: ElementName;
  /** Producer-side end. */
  from: PointName;
  /** Far end (away from the producer, as written). */
  to: PointName;
  spec: PipeSpec;
  /** Nominal size as written, m. */
  nominalSizeM: number;
  /** Inside diameter, m (from the spec's size rule, or stated). */
  insideDiameterM: number;
  lengthM: number;
  orientation: Orientation;
  fittings: Fitting[];
  /** How it joins its parent at `from`; undefined for a straight run-on. */
  joins?: Junction;
  /** Per-pipe rule settings and suppressions. */
  rules: ElementRules;
}

export type InletPosition =
  | { kind: 'point'; point: PointName }
  | { kind: 'on-pipe'; pipe: ElementName; distanceM: number };

export interface Inlet {
  name: ElementName;
  position: InletPosition;
  hose: HoseKind;
  tool: ToolKind;
  label?: string;
  /** The inlet is in a public area. */
  publicArea: boolean;
  locked: boolean;
  rules: ElementRules;
}

export type CleanoutPosition =
  | { kind: 'point'; point: PointName }
  | { kind: 'on-pipe'; pipe: ElementName; distanceM: number };

export interface Cleanout {
  name?: ElementName;
  position: CleanoutPosition;
}

export interface ScenarioOpening {
  inlet: ElementName;
  toolState: 'working' | 'lifted';
}

export interface Scenario {
  name: ElementName;
  open: ScenarioOpening[];
}

// ------------------------------------------------------------ rule settings

/** A threshold override: rule code, parameter name, SI value. */
export interface RuleSetting {
  rule: string;
  parameter: string;
  value: number;
}

export interface Suppression {
  rule: string;
  reason: string;
}

export interface ElementRules {
  settings: RuleSetting[];
  suppressions: Suppression[];
}

export interface SeverityOverride {
  rule: string;
  severity: Severity | 'off';
}

export interface SystemRules extends ElementRules {
  severities: SeverityOverride[];
}

// ---------------------------------------------------------------- system

export interface SystemModel {
  name: string;
  site: SiteAir;
  displayUnits: DisplayUnits;
  design: DesignBasis;
  dust: CombustibleDust;
  producers: ProducerUnit[];
  separators: SeparatorUnit[];
  filters: FilterUnit[];
  pipes: Pipe[];
  inlets: Inlet[];
  cleanouts: Cleanout[];
  scenarios: Scenario[];
  rules: SystemRules;
}

/** A finding from the engine: structural, numerical or a design rule. */
export interface Finding {
  /** Stable kebab-case code; each has a page in docs/rules/. */
  code: string;
  severity: Severity;
  message: string;
  element: ElementRef;
  /** Other elements that explain the finding (the worst-case set, the slowest inlet...). */
  related?: { element: ElementRef; message: string }[];
  /** What a quick fix needs (suggested size, cleanout location...), plain JSON. */
  fix?: Record<string, unknown>;
}
