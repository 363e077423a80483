import { RULES, type RuleParameter, type SystemAnalysis, type SystemModel } from '@vacnet/engine';
import { nominalSizeText } from './nominal-size-text.js';
import { NO_VALUE, type QuantityText } from './quantity-text.js';

/** One line of a two-column table: what, and its value; a note in smaller print. */
export interface LabelValue {
  label: string;
  value: string;
  note?: string;
}

const DEBRIS_WORDS: Readonly<Record<string, string>> = {
  fine: 'fine: very fine light dust, lint, paper',
  dry: 'dry: dry dust and powder',
  general: 'general: average debris',
  heavy: 'heavy: sawdust, turnings, sand, grit',
  moist: 'moist: heavy or moist debris',
};

const SURFACE_WORDS: Readonly<Record<string, string>> = {
  carpet: 'carpet',
  'small-rooms': 'small rooms',
  bare: 'bare floor',
  'open-bare': 'open bare floor',
};

/** The design basis: what the analysis assumed, and where each assumption came from. */
export function designBasisRows(model: SystemModel, analysis: SystemAnalysis | undefined, text: QuantityText): LabelValue[] {
  const rows: LabelValue[] = [];
  const design = model.design;
  const operators = analysis?.operators;
  if (operators) {
    rows.push({ label: 'Design operators', ...operatorText(operators, text) });
  } else if (design?.operators !== undefined) {
    rows.push({ label: 'Design operators', value: `${design.operators}`, note: 'as stated in the file' });
  }

  const debris = design?.debris;
  if (debris) {
    const carrying = carryingVelocity(model);
    rows.push({
      label: 'Debris class',
      value: DEBRIS_WORDS[debris] ?? debris,
      ...(carrying ? { note: `carrying velocity ${text.velocity(carrying.value)} in horizontal runs with one operator (${carrying.source})` } : {}),
    });
  }

  const site = model.site;
  const ambientPa = analysis?.ambient.pressurePa || site?.ambientPressurePa;
  const temperatureK = analysis?.ambient.temperatureK || site?.temperatureK;
  rows.push({
    label: 'Site air',
    value: `ambient ${text.vacuum(ambientPa)} absolute, ${text.temperature(temperatureK)}`,
    ...(site?.elevationM !== undefined ? { note: `ambient pressure from the site elevation, ${text.length(site.elevationM)} (standard atmosphere, ASHRAE Fundamentals ch. 1)` } : {}),
  });
  rows.push({
    label: 'Display units',
    value: model.displayUnits === 'si' ? 'SI: kPa, Sm3/h, m/s, m, mm, kW' : 'imperial: inHg, scfm, fpm, ft, in, hp',
    note: 'vacuum is gauge vacuum below ambient; flows are standard (20 \u00b0C, 101.325 kPa)',
  });
  rows.push({
    label: 'Required producer margin',
    value: design?.producerMarginFraction !== undefined ? `${text.percent(design.producerMarginFraction)} on flow` : 'not stated',
  });
  if (design?.defaultToolVacuumPa !== undefined) {
    rows.push({ label: 'Tool vacuum needed (default)', value: text.vacuum(design.defaultToolVacuumPa), note: 'at the hose end, for tools that state no need' });
  }
  const commissioning = analysis?.commissioning;
  if (commissioning) {
    rows.push({
      label: 'Test orifice',
      value: nominalSizeText(commissioning.testOrificeDiameterM, model.displayUnits),
      note: `sharp-edged, discharge coefficient ${commissioning.dischargeCoefficient}${design?.testOrificeDiameterM !== undefined ? ', as stated in the file' : ', the default'}`,
    });
  }
  rows.push({ label: 'Combustible dust', value: dustText(model) });
  const settings = ruleSettingsText(model, text);
  if (settings.length > 0) rows.push({ label: 'Rule settings (whole system)', value: settings.join('; ') });
  return rows;
}

function operatorText(operators: SystemAnalysis['operators'], text: QuantityText): { value: string; note?: string } {
  const n = `${operators.count}`;
  switch (operators.source) {
    case 'stated':
      return { value: n, note: 'as stated in the file' };
    case 'options':
      return { value: n, note: 'as asked for this run' };
    case 'default':
      return { value: n, note: 'none stated and no floor areas given: one assumed' };
    case 'areas': {
      const a = operators.fromAreas;
      if (!a) return { value: n, note: 'from the floor areas' };
      const parts = a.areas.map(
        (r) =>
          `${SURFACE_WORDS[r.surface] ?? r.surface} ${text.area(r.areaM2)} at ${text.areaRate(r.rateM2PerS)}` +
          ` (${r.rateSource === 'file' ? 'rate from the file' : 'common-practice rate'}) = ${text.hours(r.operatorTimeS)}`,
      );
      return {
        value: n,
        note:
          `from the floor areas: ${parts.join('; ')}; ${text.hours(a.totalOperatorTimeS)} of cleaning in a ${text.hours(a.cleaningWindowS)} window ` +
          `= ${a.exactOperators.toFixed(2)} operators, rounded up`,
      };
    }
  }
}

/** The carrying-velocity threshold of the debris class (or the system's own setting), with its source. */
function carryingVelocity(model: SystemModel): { value: number; source: string } | null {
  const rule = RULES.find((r) => r.code === 'slow-carrying-velocity');
  const parameter = rule?.parameters.find((p) => p.name === 'minVelocity');
  if (!parameter) return null;
  const setting = model.rules?.settings?.find((s) => s.rule === 'slow-carrying-velocity' && s.parameter === 'minVelocity' && Number.isFinite(s.value));
  if (setting) return { value: setting.value, source: 'the system\u2019s own setting' };
  const value = parameter.defaultByDebris?.[model.design.debris] ?? parameter.default;
  return Number.isFinite(value) ? { value, source: parameter.source } : null;
}

function dustText(model: SystemModel): string {
  const dust = model.dust;
  if (!dust?.combustible) return 'none declared';
  return `${dust.metal ? 'combustible metal dust' : 'combustible dust'}; ${dust.bondedAndGrounded ? 'bonding and grounding declared' : 'bonding and grounding not declared'} (see the caution above)`;
}

/** The system-wide rule lines: thresholds in display units, severities and rules turned off. */
function ruleSettingsText(model: SystemModel, text: QuantityText): string[] {
  const out: string[] = [];
  for (const s of model.rules?.settings ?? []) {
    const parameter = RULES.find((r) => r.code === s.rule)?.parameters.find((p) => p.name === s.parameter);
    out.push(`${s.rule} ${kebab(s.parameter)} ${parameterValue(parameter, s.value, text)}`);
  }
  for (const s of model.rules?.severities ?? []) out.push(`${s.rule} ${s.severity}`);
  return out;
}

function parameterValue(parameter: RuleParameter | undefined, value: number, text: QuantityText): string {
  if (!Number.isFinite(value)) return NO_VALUE;
  switch (parameter?.dimension) {
    case 'velocity':
      return text.velocity(value);
    case 'pressure':
      return text.vacuum(value);
    case 'length':
      return text.length(value);
    case 'angle':
      return text.angle(value);
    case 'fraction':
      return text.percent(value);
    default:
      return `${value}`;
  }
}

function kebab(name: string): string {
  return name.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);
}
