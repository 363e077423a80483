import { parseNumberText, toSI, type Dimension, type RuleSetting, type SeverityOverride, type SystemModel } from '@vacnet/engine';
import { findParameter, findRule, parameterName } from '../semantics/rule-parameters.js';

/**
 * Editor settings (LSP `workspace/configuration`, section `vacnet`; the keys
 * are listed in docs/editor-settings.md). Settings written in a file win
 * over these: a `units` line over `units`, a `rule` line or a `threshold`
 * over `rules`.
 */
export interface VacnetSettings {
  /** Display units when the file has no `units` line. */
  units?: 'imperial' | 'si';
  /** System-wide rule settings (values in SI) and severities, in the order written. */
  ruleSettings: RuleSetting[];
  severities: SeverityOverride[];
  hints: { inletVacuum: boolean; pipeVelocity: boolean; producer: boolean };
  /** Base URL of the rule pages (`<base>/<code>.md`), when set. */
  rulesDocsBaseUrl?: string;
  /** Wait this long after a change before the analysis starts, ms. */
  debounceMs: number;
  /** What could not be read, one sentence each. */
  problems: string[];
}

/** 50 ms: long enough to merge the changes of one burst of typing, short against the 0.1 s of "immediate" (Nielsen 1993). */
export const DEFAULT_DEBOUNCE_MS = 50;
/** Longest debounce accepted, ms (our choice: beyond it the checks no longer feel live). */
const MAX_DEBOUNCE_MS = 5000;

export const DEFAULT_SETTINGS: VacnetSettings = Object.freeze({
  ruleSettings: [],
  severities: [],
  hints: { inletVacuum: true, pipeVelocity: true, producer: true },
  debounceMs: DEFAULT_DEBOUNCE_MS,
  problems: [],
}) as VacnetSettings;

/** Reads the `vacnet` configuration section as a client sends it. Never throws: what cannot be used is listed in `problems`. */
export function readSettings(raw: unknown): VacnetSettings {
  const settings: VacnetSettings = { ruleSettings: [], severities: [], hints: { ...DEFAULT_SETTINGS.hints }, debounceMs: DEFAULT_DEBOUNCE_MS, problems: [] };
  if (raw === null || raw === undefined) return settings;
  if (!isObject(raw)) {
    settings.problems.push('the vacnet settings are not an object.');
    return settings;
  }
  const units = raw.units;
  if (units === 'imperial' || units === 'si') settings.units = units;
  else if (units !== undefined && units !== null && units !== '') settings.problems.push(`vacnet.units must be "imperial" or "si", not ${JSON.stringify(units)}.`);

  if (isObject(raw.hints)) {
    for (const kind of ['inletVacuum', 'pipeVelocity', 'producer'] as const) {
      const value = raw.hints[kind];
      if (typeof value === 'boolean') settings.hints[kind] = value;
      else if (value !== undefined) settings.problems.push(`vacnet.hints.${kind} must be true or false.`);
    }
  } else if (typeof raw.hints === 'boolean') {
    settings.hints = { inletVacuum: raw.hints, pipeVelocity: raw.hints, producer: raw.hints };
  }

  const base = raw.rulesDocsBaseUrl;
  if (typeof base === 'string' && base.trim() !== '') settings.rulesDocsBaseUrl = base.trim().replace(/\/+$/, '');

  const analysis = isObject(raw.analysis) ? raw.analysis : {};
  const debounce = analysis.debounceMs;
  if (typeof debounce === 'number' && Number.isFinite(debounce) && debounce >= 0 && debounce <= MAX_DEBOUNCE_MS) settings.debounceMs = debounce;
  else if (debounce !== undefined) settings.problems.push(`vacnet.analysis.debounceMs must be a number of milliseconds from 0 to ${MAX_DEBOUNCE_MS}.`);

  if (raw.rules !== undefined && raw.rules !== null) {
    if (!isObject(raw.rules)) settings.problems.push('vacnet.rules must map rule codes to their settings.');
    else for (const [code, entry] of Object.entries(raw.rules)) readRule(code, entry, settings);
  }
  return settings;
}

function readRule(code: string, entry: unknown, settings: VacnetSettings): void {
  const where = `vacnet.rules.${code}`;
  const rule = findRule(code);
  if (!rule) {
    settings.problems.push(`${where}: no design rule has the code '${code}'.`);
    return;
  }
  if (!isObject(entry)) {
    settings.problems.push(`${where} must be an object of settings, e.g. { "severity": "error" }.`);
    return;
  }
  for (const [key, value] of Object.entries(entry)) {
    if (key === 'severity') {
      // Turning a rule off needs a written reason, so only the file can do it.
      if (value === 'error' || value === 'warning' || value === 'info') settings.severities.push({ rule: code, severity: value });
      else settings.problems.push(`${where}.severity must be "error", "warning" or "info" (turn a rule off in the file, with a reason).`);
      continue;
    }
    const parameter = findParameter(rule, key) ?? rule.parameters.find((p) => p.name === key);
    if (!parameter) {
      const known = rule.parameters.map((p) => p.name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase()));
      settings.problems.push(`${where}: the rule has no setting '${key}'${known.length > 0 ? ` (it has ${known.join(', ')})` : ''}.`);
      continue;
    }
    const si = settingValue(value, parameter.dimension);
    if (typeof si === 'string') {
      settings.problems.push(`${where}.${key}: ${si}`);
      continue;
    }
    const [low, high] = parameter.range ?? [0, Number.POSITIVE_INFINITY];
    if (!(si >= low && si <= high)) {
      settings.problems.push(`${where}.${key}: ${JSON.stringify(value)} is outside the sensible range; the default stays in force.`);
      continue;
    }
    settings.ruleSettings.push({ rule: code, parameter: parameterName(parameter.name), value: si });
  }
}

/** A setting's value in SI, or why it cannot be read. Dimensional values are strings with a unit, as in a file: "4000 fpm". */
function settingValue(value: unknown, dimension: string): number | string {
  const plain = dimension === 'ratio' || dimension === 'count';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) return 'not a finite number.';
    if (plain || dimension === 'fraction') return value;
    return `write the value with its unit, e.g. "${value} ${exampleUnit(dimension)}".`;
  }
  if (typeof value !== 'string') return 'write the value as a number with its unit, e.g. "4000 fpm".';
  const match = /^\s*(\S+)\s*(.*?)\s*$/.exec(value);
  const number = match ? parseNumberText(match[1]!) : undefined;
  const unit = match?.[2] ?? '';
  if (number === undefined) return `'${value}' does not start with a number.`;
  if (plain) return unit === '' ? number : `a plain number is expected, without '${unit}'.`;
  if (dimension === 'fraction' && unit === '') return number;
  if (unit === '') return `write the value with its unit, e.g. "${number} ${exampleUnit(dimension)}".`;
  const reading = toSI(number, unit, dimension as Dimension);
  return reading.ok ? reading.si : `'${unit}' is not a unit of ${dimension} (use one of ${reading.accepted.slice(0, 6).join(', ')}).`;
}

function exampleUnit(dimension: string): string {
  return ({ velocity: 'fpm', pressure: 'inHg', length: 'ft', angle: 'deg', fraction: '%' } as Record<string, string>)[dimension] ?? '';
}

/**
 * The model with the editor's settings under the file's: display units when
 * the file states none, rule settings and severities placed before the
 * file's system-wide ones (the engine takes the last, so the file wins).
 * Returns the model itself when there is nothing to apply, so the editor and
 * the headless loader analyse the same model.
 */
export function applySettings(model: SystemModel, settings: VacnetSettings, fileStatesUnits: boolean): SystemModel {
  const units = !fileStatesUnits && settings.units !== undefined && settings.units !== model.displayUnits;
  if (!units && settings.ruleSettings.length === 0 && settings.severities.length === 0) return model;
  return {
    ...model,
    ...(units ? { displayUnits: settings.units } : {}),
    rules: {
      ...model.rules,
      settings: [...settings.ruleSettings, ...model.rules.settings],
      severities: [...settings.severities, ...model.rules.severities],
    },
  };
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
