import type { AstNode } from 'langium';
import {
  ambientPressureAtElevation,
  insideDiameterFor,
  scheduleNominalSizesM,
  standardFromActual,
  STANDARD_TEMPERATURE_K,
  type CleaningArea,
  type CurvePoint as ModelCurvePoint,
  type ElementRules,
  type Fitting,
  type FilterModel as ModelFilterModel,
  type HoseKind as ModelHoseKind,
  type Inlet as ModelInlet,
  type Junction,
  type PipeSpec as ModelPipeSpec,
  type ProducerModel as ModelProducerModel,
  type RatedLoss as ModelRatedLoss,
  type SeparatorModel as ModelSeparatorModel,
  type SizeRule,
  type SystemModel,
  type ToolKind as ModelToolKind,
  type ToolLaw,
} from '@vacnet/engine';
import * as ast from '../generated/ast.js';
import { expectationFor } from '../semantics/quantity-expectations.js';
import { readQuantity } from '../semantics/read-quantity.js';
import { parameterName } from '../semantics/rule-parameters.js';
import { unquote } from '../references/use-paths.js';
import { SourceIndex } from './source-index.js';

/** The engine model of one system, where each element came from, and whether every value could be read. */
export interface LoweredSystem {
  model: SystemModel;
  sources: SourceIndex;
  /**
   * False when a value the flow analysis needs could not be read (a bad
   * unit, a missing property, an unresolved name). The structural
   * diagnostics say what; the analysis is skipped rather than run on guesses.
   */
  complete: boolean;
}

// Defaults the language applies when a file is silent.
/** 20 C: the standard air temperature of ENGINEERING.md. */
const DEFAULT_TEMPERATURE_K = STANDARD_TEMPERATURE_K;
/** A bend with no stated radius is taken as a long sweep of 1.5 D (common practice for vacuum piping). */
const DEFAULT_BEND_RADIUS_RATIO = 1.5;
/** Discharge coefficient of a sharp-edged orifice (ENGINEERING.md; ISO 5167-2 gives about 0.6). */
const DEFAULT_DISCHARGE_COEFFICIENT = 0.61;
/** A wye with no stated angle is a 45 deg wye, the common fitting (common practice). */
const DEFAULT_WYE_ANGLE_RAD = Math.PI / 4;

/**
 * Turns a linked system into the engine's network model (SI units). This is
 * the only place that knows both the syntax tree and the engine's types.
 * Total: it never throws; anything it cannot read it leaves at a neutral
 * value and marks the result incomplete.
 */
export function lowerSystem(system: ast.System): LoweredSystem {
  return new Lowering(system).run();
}

/**
 * The engine model of one producer model from a catalog, on its own (to
 * compare catalog producers against a demand). `complete` is false when a
 * curve value could not be read.
 */
export function lowerProducerModel(node: ast.ProducerModel): { model: ModelProducerModel; complete: boolean } {
  const lowering = new Lowering({ members: [] } as unknown as ast.System);
  const model = lowering.producerModelAlone(node);
  return { model, complete: lowering.isComplete };
}

class Lowering {
  private readonly sources = new SourceIndex();
  private complete = true;
  private ambientPa = 101_325;
  private temperatureK = DEFAULT_TEMPERATURE_K;
  private readonly specs = new Map<ast.PipeSpec, ModelPipeSpec>();
  private readonly hoses = new Map<ast.HoseKind, ModelHoseKind>();
  private readonly tools = new Map<ast.ToolKind, ModelToolKind>();

  constructor(private readonly system: ast.System) {}

  get isComplete(): boolean {
    return this.complete;
  }

  producerModelAlone(node: ast.ProducerModel): ModelProducerModel {
    return this.producerModel(node);
  }

  run(): LoweredSystem {
    const members = this.system.members;
    this.readSite(members.filter(ast.isSite));
    const model: SystemModel = {
      name: unquote(this.system.title ?? ''),
      site: this.siteAir(members.filter(ast.isSite)),
      displayUnits: members.filter(ast.isDisplayUnits).at(-1)?.system === 'si' ? 'si' : 'imperial',
      design: {
        areas: members.filter(ast.isArea).map((area) => this.area(area)),
        debris: members.filter(ast.isDebris).at(-1)?.debris ?? 'general',
      },
      dust: this.dust(members.filter(ast.isDust).at(-1)),
      producers: [],
      separators: [],
      filters: [],
      pipes: [],
      inlets: [],
      cleanouts: [],
      scenarios: [],
      rules: { settings: [], suppressions: [], severities: [] },
    };
    this.sources.add('system', model.name, this.system);
    this.designBasis(model);
    const plantInlets = this.plants(model, members.filter(ast.isPlant));
    for (const pipe of members.filter(ast.isPipe)) this.pipe(model, pipe, plantInlets);
    const defaults = members.filter(ast.isDefaults);
    for (const inlet of members.filter(ast.isInlet)) this.inlet(model, inlet, defaults, plantInlets);
    for (const cleanout of members.filter(ast.isCleanout)) this.cleanout(model, cleanout, plantInlets);
    for (const scenario of members.filter(ast.isScenario)) {
      model.scenarios.push({
        name: scenario.name,
        open: scenario.openings.map((o) => ({ inlet: o.inlet?.$refText ?? '', toolState: o.state === 'lifted' ? 'lifted' : 'working' })),
      });
      this.sources.add('scenario', scenario.name, scenario);
    }
    for (const line of members.filter(ast.isRuleLine)) this.ruleLine(model, line);
    return { model, sources: this.sources, complete: this.complete };
  }

  // ----------------------------------------------------------- values

  /** SI value of a quantity, or undefined (and the model marked incomplete). */
  private si(quantity: ast.Quantity | undefined): number | undefined {
    if (!quantity) return undefined;
    const expectation = expectationFor(quantity);
    const reading = expectation ? readQuantity(quantity, expectation) : undefined;
    if (!reading?.ok) {
      this.complete = false;
      return undefined;
    }
    return reading.si;
  }

  /** SI value, or a neutral fallback when the quantity is absent or unreadable (model then incomplete). */
  private required(quantity: ast.Quantity | undefined, fallback: number): number {
    const value = this.si(quantity);
    if (value === undefined) {
      this.complete = false;
      return fallback;
    }
    return value;
  }

  /** A flow as standard m3/s: actual flows are taken at the site's ambient state (room air). */
  private standardFlow(quantity: ast.Quantity | undefined): number | undefined {
    const value = this.si(quantity);
    if (value === undefined || !quantity) return undefined;
    const reading = readQuantity(quantity, expectationFor(quantity)!);
    const basis = reading.ok ? reading.flowBasis : undefined;
    return basis === 'actual' ? standardFromActual(value, this.ambientPa, this.temperatureK) : value;
  }

  private measure(properties: readonly AstNode[], key: string): ast.Measure | undefined {
    return properties.filter(ast.isMeasure).find((m) => m.key === key);
  }

  // ----------------------------------------------------- site and basis

  private readSite(sites: ast.Site[]): void {
    const all = sites.flatMap((s) => s.measures);
    const temperature = this.si(all.find((m) => m.key === 'temperature')?.value);
    if (temperature !== undefined) this.temperatureK = temperature;
    const pressure = this.si(all.find((m) => m.key === 'pressure')?.value);
    const elevation = this.si(all.find((m) => m.key === 'elevation')?.value);
    if (pressure !== undefined) this.ambientPa = pressure;
    else if (elevation !== undefined) this.ambientPa = ambientPressureAtElevation(elevation);
  }

  private siteAir(sites: ast.Site[]): SystemModel['site'] {
    const elevation = this.si(sites.flatMap((s) => s.measures).find((m) => m.key === 'elevation')?.value);
    return {
      ambientPressurePa: this.ambientPa,
      temperatureK: this.temperatureK,
      ...(elevation !== undefined ? { elevationM: elevation } : {}),
    };
  }

  private area(area: ast.Area): CleaningArea {
    const rate = this.si(area.rate);
    return {
      surface: area.surface,
      areaM2: this.required(area.size, 0),
      ...(rate !== undefined ? { rateM2PerS: rate } : {}),
    };
  }

  private designBasis(model: SystemModel): void {
    const members = this.system.members;
    const operators = members.filter(ast.isOperators).at(-1);
    if (operators) {
      const count = Number(operators.count);
      if (Number.isInteger(count) && count >= 1) model.design.operators = count;
      else this.complete = false;
    }
    const window = this.si(members.filter(ast.isCleaningWindow).at(-1)?.duration);
    if (window !== undefined) model.design.cleaningWindowS = window;
    const margin = this.si(members.filter(ast.isMargin).at(-1)?.value);
    if (margin !== undefined) model.design.producerMarginFraction = margin;
    const orifice = this.si(members.filter(ast.isTestOrifice).at(-1)?.diameter);
    if (orifice !== undefined) model.design.testOrificeDiameterM = orifice;
    const needs = members
      .filter(ast.isDefaults)
      .flatMap((d) => d.properties)
      .filter(ast.isMeasure)
      .find((m) => m.key === 'needs');
    const needsPa = this.si(needs?.value);
    if (needsPa !== undefined) model.design.defaultToolVacuumPa = needsPa;
  }

  private dust(dust: ast.Dust | undefined): SystemModel['dust'] {
    const hazard = dust?.hazard ?? 'ordinary';
    return {
      combustible: hazard !== 'ordinary',
      metal: hazard === 'metal',
      bondedAndGrounded: dust?.bonded === true,
    };
  }

  // ----------------------------------------------------------- catalog

  private spec(node: ast.PipeSpec): ModelPipeSpec {
    const known = this.specs.get(node);
    if (known) return known;
    const props = node.properties;
    const schedule = props.find(ast.isSchedule)?.schedule;
    const wall = this.si(this.measure(props, 'wall')?.value);
    const sizeRule: SizeRule =
      schedule !== undefined ? { kind: 'schedule', schedule } : wall !== undefined ? { kind: 'wall', wallM: wall } : { kind: 'inside' };
    const listed = props
      .filter(ast.isSizes)
      .flatMap((s) => s.sizes)
      .map((q) => this.si(q))
      .filter((v): v is number => v !== undefined);
    const material = props.find(ast.isMaterial)?.material ?? 'unstated';
    const conductiveFlag = props.filter(ast.isFlag).find((f) => f.flag === 'conductive' || f.flag === 'nonconductive');
    const spec: ModelPipeSpec = {
      name: node.name,
      material,
      roughnessM: this.required(this.measure(props, 'roughness')?.value, 0),
      conductive: conductiveFlag ? conductiveFlag.flag === 'conductive' : conductsByMaterial(material),
      sizeRule,
      nominalSizesM: listed.length > 0 ? listed.sort((a, b) => a - b) : schedule !== undefined ? scheduleNominalSizesM(schedule) : [],
    };
    this.specs.set(node, spec);
    this.sources.add('pipe-spec', spec.name, node);
    return spec;
  }

  private hose(node: ast.HoseKind): ModelHoseKind {
    const known = this.hoses.get(node);
    if (known) return known;
    const props = node.properties;
    const roughness = this.si(this.measure(props, 'roughness')?.value);
    const loss = props.filter(ast.isRatedLoss).find((r) => r.kind === 'loss');
    const measured = loss ? this.ratedLoss(loss) : undefined;
    const conductiveFlag = props.filter(ast.isFlag).find((f) => f.flag === 'conductive' || f.flag === 'nonconductive');
    const hose: ModelHoseKind = {
      name: node.name,
      lengthM: this.required(this.measure(props, 'length')?.value, 0),
      boreM: this.required(this.measure(props, 'bore')?.value, 0),
      ...(roughness !== undefined ? { roughnessM: roughness } : {}),
      ...(measured ? { measuredLoss: measured } : {}),
      conductive: conductiveFlag?.flag === 'conductive',
    };
    if (roughness === undefined && !measured) this.complete = false;
    this.hoses.set(node, hose);
    this.sources.add('hose-kind', hose.name, node);
    return hose;
  }

  private tool(node: ast.ToolKind): ModelToolKind {
    const known = this.tools.get(node);
    if (known) return known;
    const states = node.properties.filter(ast.isToolState);
    const working = states.find((s) => s.state === 'working');
    const lifted = states.find((s) => s.state === 'lifted');
    const needs = this.si(this.measure(node.properties, 'needs')?.value);
    const workingLaw = working ? this.toolLaw(working.law) : undefined;
    if (!workingLaw) this.complete = false;
    const tool: ModelToolKind = {
      name: node.name,
      working: workingLaw ?? { kind: 'orifice', diameterM: 0, dischargeCoefficient: DEFAULT_DISCHARGE_COEFFICIENT },
      ...(lifted && this.toolLaw(lifted.law) ? { lifted: this.toolLaw(lifted.law)! } : {}),
      ...(needs !== undefined ? { requiredVacuumPa: needs } : {}),
    };
    this.tools.set(node, tool);
    this.sources.add('tool-kind', tool.name, node);
    return tool;
  }

  private toolLaw(law: ast.Orifice | ast.Curve | undefined): ToolLaw | undefined {
    if (!law) return undefined;
    if (ast.isOrifice(law)) {
      const diameter = this.si(law.diameter);
      if (diameter === undefined) return undefined;
      return {
        kind: 'orifice',
        diameterM: diameter,
        dischargeCoefficient: this.si(law.dischargeCoefficient) ?? DEFAULT_DISCHARGE_COEFFICIENT,
      };
    }
    const points = law.points.map((p) => ({ vacuumPa: this.si(p.vacuum), flowStdM3PerS: this.standardFlow(p.flow) }));
    if (points.length < 2 || points.some((p) => p.vacuumPa === undefined || p.flowStdM3PerS === undefined)) {
      this.complete = false;
      return undefined;
    }
    return { kind: 'table', points: points as { vacuumPa: number; flowStdM3PerS: number }[] };
  }

  private ratedLoss(node: ast.RatedLoss): ModelRatedLoss | undefined {
    const loss = this.si(node.loss);
    const flow = this.standardFlow(node.flow);
    if (loss === undefined || flow === undefined) {
      this.complete = false;
      return undefined;
    }
    return { lossPa: loss, flowStdM3PerS: flow };
  }

  private producerModel(node: ast.ProducerModel): ModelProducerModel {
    const curve = node.properties.find(ast.isCurve);
    let basis: 'standard' | 'actual' | undefined;
    const points: ModelCurvePoint[] = [];
    for (const point of curve?.points ?? []) {
      const flowReading = point.flow && readQuantity(point.flow, expectationFor(point.flow)!);
      const vacuum = this.si(point.vacuum);
      const power = this.si(point.power);
      if (!flowReading?.ok || vacuum === undefined) {
        this.complete = false;
        continue;
      }
      basis ??= flowReading.flowBasis ?? 'actual';
      points.push({ flowM3PerS: flowReading.si, vacuumPa: vacuum, ...(power !== undefined ? { powerW: power } : {}) });
    }
    if (points.length < 2) this.complete = false;
    const efficiency = this.si(this.measure(node.properties, 'efficiency')?.value);
    const relief = this.si(this.measure(node.properties, 'relief')?.value);
    this.sources.add('producer-model', node.name, node);
    return {
      name: node.name,
      flowBasis: basis ?? 'actual',
      curve: points,
      ...(efficiency !== undefined ? { efficiency } : {}),
      ...(relief !== undefined ? { reliefVacuumPa: relief } : {}),
    };
  }

  private separatorModel(node: ast.SeparatorModel): ModelSeparatorModel {
    const rated = node.properties.find((p) => p.kind === 'loss');
    this.sources.add('separator-model', node.name, node);
    return { name: node.name, rated: (rated && this.ratedLoss(rated)) ?? this.incompleteLoss() };
  }

  private filterModel(node: ast.FilterModel): ModelFilterModel {
    const clean = node.properties.find((p) => p.kind === 'clean');
    const loaded = node.properties.find((p) => p.kind === 'loaded');
    const loadedLoss = loaded && this.ratedLoss(loaded);
    this.sources.add('filter-model', node.name, node);
    return {
      name: node.name,
      clean: (clean && this.ratedLoss(clean)) ?? this.incompleteLoss(),
      ...(loadedLoss ? { loaded: loadedLoss } : {}),
    };
  }

  private incompleteLoss(): ModelRatedLoss {
    this.complete = false;
    return { lossPa: 0, flowStdM3PerS: 1 };
  }

  // --------------------------------------------------------- placement

  /**
   * Plants: equipment listed from the producer toward the network. Each
   * unit is named `<plant>.<kind>`; pipes leaving the plant start at the
   * inlet of its last unit. Returns plant name -> that point.
   */
  private plants(model: SystemModel, plants: ast.Plant[]): Map<string, string> {
    const inlets = new Map<string, string>();
    for (const plant of plants) {
      let towardProducer: string | undefined;
      const counts = new Map<string, number>();
      for (const unit of plant.equipment) {
        const kind = unit.$type === 'ProducerUnit' ? 'producer' : unit.$type === 'FilterUnit' ? 'filter' : 'separator';
        const n = (counts.get(kind) ?? 0) + 1;
        counts.set(kind, n);
        const name = `${plant.name}.${kind}${n > 1 ? `-${n}` : ''}`;
        const modelNode = unit.model?.ref;
        if (!modelNode) {
          this.complete = false;
          continue;
        }
        if (ast.isProducerUnit(unit)) {
          const exhaust = unit.exhaust ? this.ratedLoss({ loss: unit.exhaust, flow: unit.exhaustFlow } as ast.RatedLoss) : undefined;
          model.producers.push({ name, model: this.producerModel(modelNode as ast.ProducerModel), ...(exhaust ? { exhaust } : {}) });
          this.sources.add('producer', name, unit);
        } else if (ast.isFilterUnit(unit)) {
          model.filters.push({ name, model: this.filterModel(modelNode as ast.FilterModel), towardProducer: towardProducer ?? plant.name });
          this.sources.add('filter', name, unit);
        } else {
          model.separators.push({
            name,
            model: this.separatorModel(modelNode as ast.SeparatorModel),
            towardProducer: towardProducer ?? plant.name,
            indoors: unit.placement !== 'outdoors',
            explosionProtected: unit.protected === true,
          });
          this.sources.add('separator', name, unit);
        }
        if (!towardProducer && !ast.isProducerUnit(unit)) this.complete = false; // no producer before it
        towardProducer = name;
      }
      inlets.set(plant.name, towardProducer ?? plant.name);
      this.sources.add('producer', plant.name, plant);
    }
    return inlets;
  }

  private point(name: string | undefined, plantInlets: Map<string, string>): string {
    if (!name) {
      this.complete = false;
      return '';
    }
    return plantInlets.get(name) ?? name;
  }

  private pipe(model: SystemModel, node: ast.Pipe, plantInlets: Map<string, string>): void {
    const props = node.properties;
    const specNode = props.find(ast.isSpecRef)?.spec?.ref;
    if (!specNode) this.complete = false;
    const spec = specNode ? this.spec(specNode) : this.placeholderSpec();
    const sizeMeasure = this.measure(props, 'size');
    const boreMeasure = this.measure(props, 'bore');
    const nominal = this.si(sizeMeasure?.value);
    const bore = this.si(boreMeasure?.value);
    let inside = bore;
    if (inside === undefined && nominal !== undefined) {
      const resolved = insideDiameterFor(spec.sizeRule, nominal);
      if (resolved.ok) inside = resolved.insideDiameterM;
    }
    if (inside === undefined) this.complete = false;
    const lengthMeasure = this.measure(props, 'length');
    const direction = props.find(ast.isOrientation)?.direction ?? 'horizontal';
    const joins = props.find(ast.isJoins);
    const name = node.name;
    model.pipes.push({
      name,
      from: this.point(node.from?.$refText, plantInlets),
      to: this.point(node.to?.name ?? node.into?.$refText, plantInlets),
      spec,
      nominalSizeM: nominal ?? inside ?? 0,
      insideDiameterM: inside ?? 0,
      lengthM: this.required(lengthMeasure?.value, 0),
      // Written from the producer outward: a pipe that goes up as written carries air down.
      orientation: direction === 'up' ? 'air-down' : direction === 'down' ? 'air-up' : 'horizontal',
      fittings: this.fittings(props, inside),
      ...(joins ? { joins: this.junction(joins) } : {}),
      rules: this.elementRules(props),
    });
    this.sources.add('pipe', name, node);
    const propertyNodes: [string, AstNode | undefined][] = [
      ['name', node],
      ['size', sizeMeasure ?? boreMeasure],
      ['length', lengthMeasure],
      ['spec', props.find(ast.isSpecRef)],
      ['joins', joins],
      ['orientation', props.find(ast.isOrientation)],
      ['bend', props.find(ast.isBend)],
      ['reducer', props.find(ast.isReducer)],
    ];
    for (const [property, propertyNode] of propertyNodes) {
      if (propertyNode) this.sources.addProperty('pipe', name, property, propertyNode);
    }
  }

  private placeholderSpec(): ModelPipeSpec {
    return { name: '', material: 'unstated', roughnessM: 0, conductive: false, sizeRule: { kind: 'inside' }, nominalSizesM: [] };
  }

  private fittings(props: readonly AstNode[], insideDiameterM: number | undefined): Fitting[] {
    const fittings: Fitting[] = [];
    for (const bend of props.filter(ast.isBend)) {
      const angle = this.si(bend.angle);
      if (angle === undefined) continue;
      const count = bend.count === undefined ? 1 : Number(bend.count);
      let radiusRatio = DEFAULT_BEND_RADIUS_RATIO;
      if (bend.radius) {
        const reading = readQuantity(bend.radius, expectationFor(bend.radius)!);
        if (!reading.ok) this.complete = false;
        else radiusRatio = reading.inDiameters ? reading.si : insideDiameterM ? reading.si / insideDiameterM : DEFAULT_BEND_RADIUS_RATIO;
      }
      if (!Number.isInteger(count) || count < 1) {
        this.complete = false;
        continue;
      }
      fittings.push({ kind: 'bend', angleRad: angle, count, radiusRatio });
    }
    for (const reducer of props.filter(ast.isReducer)) {
      const angle = this.si(reducer.angle);
      fittings.push(angle !== undefined ? { kind: 'reducer', angleRad: angle } : { kind: 'reducer' });
    }
    return fittings;
  }

  private junction(joins: ast.Joins): Junction {
    if (joins.kind === 'tee') return { kind: 'tee' };
    if (joins.kind === 'sweep') return { kind: 'sweep' };
    return { kind: 'wye', angleRad: this.si(joins.angle) ?? DEFAULT_WYE_ANGLE_RAD };
  }

  private inlet(model: SystemModel, node: ast.Inlet, defaults: ast.Defaults[], plantInlets: Map<string, string>): void {
    const props = node.properties;
    const defaultProps = defaults.flatMap((d) => d.properties);
    const hoseRef = props.find(ast.isHoseRef) ?? defaultProps.find(ast.isHoseRef);
    const toolRef = props.find(ast.isToolRef) ?? defaultProps.find(ast.isToolRef);
    const hoseNode = hoseRef?.hose?.ref;
    const toolNode = toolRef?.tool?.ref;
    if (!hoseNode || !toolNode) this.complete = false;
    const flags = new Set(props.filter(ast.isFlag).map((f) => f.flag));
    const room = props.find(ast.isRoom);
    const inlet: ModelInlet = {
      name: node.name,
      position: node.pipe
        ? { kind: 'on-pipe', pipe: node.pipe.$refText, distanceM: this.required(node.distance, 0) }
        : { kind: 'point', point: this.point(node.at?.$refText, plantInlets) },
      hose: hoseNode ? this.hose(hoseNode) : { name: '', lengthM: 0, boreM: 0, conductive: false },
      tool: toolNode ? this.tool(toolNode) : { name: '', working: { kind: 'orifice', diameterM: 0, dischargeCoefficient: DEFAULT_DISCHARGE_COEFFICIENT } },
      // A half-typed `room` (the editor's text mid-edit) has no label yet.
      ...(typeof room?.label === 'string' ? { label: unquote(room.label) } : {}),
      publicArea: flags.has('public'),
      locked: flags.has('locked'),
      rules: this.elementRules(props),
    };
    model.inlets.push(inlet);
    this.sources.add('inlet', node.name, node);
    this.sources.addProperty('inlet', node.name, 'name', node);
    if (hoseRef) this.sources.addProperty('inlet', node.name, 'hose', props.includes(hoseRef) ? hoseRef : node);
    if (toolRef) this.sources.addProperty('inlet', node.name, 'tool', props.includes(toolRef) ? toolRef : node);
  }

  private cleanout(model: SystemModel, node: ast.Cleanout, plantInlets: Map<string, string>): void {
    model.cleanouts.push({
      position: node.pipe
        ? { kind: 'on-pipe', pipe: node.pipe.$refText, distanceM: this.required(node.distance, 0) }
        : { kind: 'point', point: this.point(node.at?.$refText, plantInlets) },
    });
  }

  // ------------------------------------------------------------- rules

  private elementRules(props: readonly AstNode[]): ElementRules {
    const rules: ElementRules = { settings: [], suppressions: [] };
    for (const threshold of props.filter(ast.isThreshold)) {
      const value = this.si(threshold.value);
      if (value !== undefined) rules.settings.push({ rule: threshold.rule, parameter: parameterName(threshold.parameter), value });
    }
    for (const accepted of props.filter(ast.isAccept)) {
      const reason = accepted.reason ? unquote(accepted.reason).trim() : '';
      if (reason) rules.suppressions.push({ rule: accepted.rule, reason });
    }
    return rules;
  }

  private ruleLine(model: SystemModel, line: ast.RuleLine): void {
    if (line.severity) {
      model.rules.severities.push({ rule: line.rule, severity: line.severity });
    } else if (line.off) {
      const reason = line.reason ? unquote(line.reason).trim() : '';
      if (reason) model.rules.suppressions.push({ rule: line.rule, reason });
    } else if (line.parameter) {
      const value = this.si(line.value);
      if (value !== undefined) model.rules.settings.push({ rule: line.rule, parameter: parameterName(line.parameter), value });
    }
  }
}

/** Metal pipe conducts; plastics do not (common knowledge; state `conductive` to override). */
function conductsByMaterial(material: string): boolean {
  return /^(steel|stainless|galvani[sz]ed|aluminium|aluminum|copper|metal|iron)/i.test(material);
}
