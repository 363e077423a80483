import { parseNumberText, RULES, toSI, type Dimension, type RuleParameter, type RuleSetting, type SeverityOverride, type SystemModel } from '@vacnet/engine';
import type { SourceRange, VacnetDiagnostic } from '../diagnostic.js';
import type { System } from '../generated/ast.js';
import { findParameter, findRule, parameterName, writtenParameterName } from '../semantics/rule-parameters.js';
import { parseJsonWithPositions, type JsonMember, type JsonNode } from './json-with-positions.js';

/**
 * The project settings file, `vacnet.json`, shared by the command line and
 * the editor so that a build pipeline and the designer's screen agree. It
 * holds display units, rule severities and thresholds for every system in
 * the folders below it, and which results the editor shows beside the text.
 * docs/settings.md documents the shape.
 *
 * Pure: text in, settings and located problems out. Finding the file on disk
 * is `findProjectSettingsFile`, apart.
 */
export const PROJECT_SETTINGS_FILE = 'vacnet.json';

/** Codes of the problems in a settings file; each has a page in docs/rules/. */
export const SettingsCodes = {
  /** The text is not JSON. */
  syntaxError: 'settings-syntax-error',
  /** A key, rule code or rule parameter the product does not know. */
  unknownName: 'settings-unknown-name',
  /** A value of the wrong type, a wrong unit, or out of the sensible range. */
  invalidValue: 'settings-invalid-value',
} as const;

export interface ProjectHints {
  /** Worst-case vacuum beside each inlet. */
  inlets: boolean;
  /** Lowest and highest velocity beside each pipe. */
  pipes: boolean;
  /** The producer's operating point beside the plant. */
  producer: boolean;
}

export interface ProjectSettings {
  /** Display units of systems whose file has no `units` line. */
  displayUnits?: 'imperial' | 'si';
  /** Thresholds in SI, in the order written. */
  ruleSettings: RuleSetting[];
  /** Severities, `off` included (always with a written reason in the file). */
  severities: SeverityOverride[];
  /** Why each rule turned off is off, by rule code (for reports and reviews). */
  offReasons: Record<string, string>;
  hints: ProjectHints;
}

export interface ProjectSettingsReading {
  settings: ProjectSettings;
  /** Problems located in the settings file (0-based positions); what they name is left out of `settings`. */
  diagnostics: VacnetDiagnostic[];
}

/** Settings when there is no file: nothing overridden, every hint shown. */
export function emptyProjectSettings(): ProjectSettings {
  return { ruleSettings: [], severities: [], offReasons: {}, hints: { inlets: true, pipes: true, producer: true } };
}

const TOP_LEVEL_KEYS = ['displayUnits', 'rules', 'hints'] as const;
const HINT_KEYS = ['inlets', 'pipes', 'producer'] as const;

/**
 * Reads the text of a settings file. Never throws: every problem becomes a
 * diagnostic at the key or value it concerns, and the rest of the file
 * still applies (a misspelt rule does not cancel the others).
 */
export function parseProjectSettings(text: string): ProjectSettingsReading {
  const settings = emptyProjectSettings();
  const diagnostics: VacnetDiagnostic[] = [];
  const parsed = parseJsonWithPositions(text);
  if (!parsed.ok) {
    diagnostics.push(problem(SettingsCodes.syntaxError, `This is not valid JSON: ${parsed.message}`, parsed.range, 'syntax'));
    return { settings, diagnostics };
  }
  const root = parsed.value;
  if (root.kind !== 'object') {
    diagnostics.push(invalid('The settings file must hold one JSON object, e.g. { "rules": {} }.', root.range));
    return { settings, diagnostics };
  }
  for (const member of uniqueMembers(root, diagnostics)) {
    switch (member.key) {
      case '$schema':
        // Editors add a schema reference; it says nothing to vacnet.
        break;
      case 'displayUnits':
        readDisplayUnits(member, settings, diagnostics);
        break;
      case 'hints':
        readHints(member, settings, diagnostics);
        break;
      case 'rules':
        readRules(member, settings, diagnostics);
        break;
      default:
        diagnostics.push(unknown(`'${member.key}' is not a setting${suggestion(member.key, TOP_LEVEL_KEYS)}; the settings are ${TOP_LEVEL_KEYS.join(', ')}.`, member.keyRange));
    }
  }
  return { settings, diagnostics };
}

function readDisplayUnits(member: JsonMember, settings: ProjectSettings, diagnostics: VacnetDiagnostic[]): void {
  const value = member.value;
  if (value.kind === 'string' && (value.value === 'imperial' || value.value === 'si')) settings.displayUnits = value.value;
  else diagnostics.push(invalid(`displayUnits must be "imperial" or "si", not ${describe(value)}.`, value.range));
}

function readHints(member: JsonMember, settings: ProjectSettings, diagnostics: VacnetDiagnostic[]): void {
  const value = member.value;
  if (value.kind === 'boolean') {
    settings.hints = { inlets: value.value, pipes: value.value, producer: value.value };
    return;
  }
  if (value.kind !== 'object') {
    diagnostics.push(invalid(`hints must be an object such as { "inlets": true, "pipes": false, "producer": true }, or true or false for all, not ${describe(value)}.`, value.range));
    return;
  }
  for (const hint of uniqueMembers(value, diagnostics)) {
    if (!(HINT_KEYS as readonly string[]).includes(hint.key)) {
      diagnostics.push(unknown(`'${hint.key}' is not a hint${suggestion(hint.key, HINT_KEYS)}; the hints are ${HINT_KEYS.join(', ')}.`, hint.keyRange));
    } else if (hint.value.kind !== 'boolean') {
      diagnostics.push(invalid(`hints.${hint.key} must be true or false, not ${describe(hint.value)}.`, hint.value.range));
    } else {
      settings.hints[hint.key as keyof ProjectHints] = hint.value.value;
    }
  }
}

function readRules(member: JsonMember, settings: ProjectSettings, diagnostics: VacnetDiagnostic[]): void {
  const rules = member.value;
  if (rules.kind !== 'object') {
    diagnostics.push(invalid(`rules must map rule codes to their settings, e.g. { "hose-loss": { "severity": "error" } }, not ${describe(rules)}.`, rules.range));
    return;
  }
  for (const entry of uniqueMembers(rules, diagnostics)) {
    const rule = findRule(entry.key);
    if (!rule) {
      const codes = RULES.map((r) => r.code);
      diagnostics.push(unknown(`No design rule has the code '${entry.key}'${suggestion(entry.key, codes)}; the rule codes are the page names in docs/rules/.`, entry.keyRange));
      continue;
    }
    if (entry.value.kind !== 'object') {
      diagnostics.push(invalid(`The settings of ${rule.code} must be an object, e.g. { "severity": "error" }, not ${describe(entry.value)}.`, entry.value.range));
      continue;
    }
    const members = uniqueMembers(entry.value, diagnostics);
    const because = members.find((m) => m.key === 'because');
    for (const setting of members) {
      if (setting.key === 'because') {
        readBecause(rule.code, setting, members, diagnostics);
      } else if (setting.key === 'severity') {
        readSeverity(rule.code, setting, because, settings, diagnostics);
      } else {
        readThreshold(rule.code, rule.parameters, setting, settings, diagnostics);
      }
    }
  }
}

function readBecause(code: string, setting: JsonMember, siblings: readonly JsonMember[], diagnostics: VacnetDiagnostic[]): void {
  if (setting.value.kind !== 'string') {
    diagnostics.push(invalid(`The reason for turning ${code} off is a string, not ${describe(setting.value)}.`, setting.value.range));
    return;
  }
  const severity = siblings.find((m) => m.key === 'severity')?.value;
  if (!(severity?.kind === 'string' && severity.value === 'off')) {
    diagnostics.push(invalid(`'because' gives the reason a rule is off; ${code} is not turned off here, so it has no effect.`, setting.keyRange));
  }
}

function readSeverity(code: string, setting: JsonMember, because: JsonMember | undefined, settings: ProjectSettings, diagnostics: VacnetDiagnostic[]): void {
  const value = setting.value;
  if (value.kind !== 'string' || !['error', 'warning', 'info', 'off'].includes(value.value)) {
    diagnostics.push(invalid(`The severity of ${code} must be "error", "warning", "info" or "off", not ${describe(value)}.`, value.range));
    return;
  }
  if (value.value === 'off') {
    // As in a file (`rule ... off because "..."`), turning a rule off needs a written reason.
    const reason = because?.value.kind === 'string' ? because.value.value.trim() : '';
    if (reason === '') {
      diagnostics.push(invalid(`Turning ${code} off needs a reason, so reviewers know why: add "because": "..." beside the severity. Until then the rule stays on.`, value.range));
      return;
    }
    settings.offReasons[code] = reason;
  }
  settings.severities.push({ rule: code, severity: value.value as SeverityOverride['severity'] });
}

function readThreshold(code: string, parameters: readonly RuleParameter[], setting: JsonMember, settings: ProjectSettings, diagnostics: VacnetDiagnostic[]): void {
  const rule = findRule(code)!;
  const parameter = findParameter(rule, setting.key);
  if (!parameter || setting.key !== writtenParameterName(parameter.name)) {
    const known = parameters.map((p) => writtenParameterName(p.name));
    const has = known.length > 0 ? `it has severity, ${known.join(', ')}` : 'it has only severity';
    diagnostics.push(unknown(`${code} has no setting '${setting.key}'${suggestion(setting.key, known)} (${has}).`, setting.keyRange));
    return;
  }
  const reading = settingValue(setting.value, parameter.dimension);
  if (typeof reading === 'string') {
    diagnostics.push(invalid(`${code} ${setting.key}: ${reading}`, setting.value.range));
    return;
  }
  const [low, high] = parameter.range ?? [0, Number.POSITIVE_INFINITY];
  if (!(reading >= low && reading <= high)) {
    diagnostics.push(invalid(`${code} ${setting.key}: ${describe(setting.value)} is outside the sensible range of this setting; the default stays in force.`, setting.value.range));
    return;
  }
  settings.ruleSettings.push({ rule: code, parameter: parameterName(setting.key), value: reading });
}

/**
 * A setting's value in SI, or why it cannot be read. Values with a dimension
 * are strings with their unit, as in a .vacnet file ("4000 fpm", "15 %");
 * plain ratios and counts are numbers.
 */
function settingValue(node: JsonNode, dimension: RuleParameter['dimension']): number | string {
  const plain = dimension === 'ratio' || dimension === 'count';
  if (node.kind === 'number') {
    if (plain) return node.value;
    if (dimension === 'fraction') return `write a share with its unit, e.g. "${node.value} %".`;
    return `write the value with its unit, e.g. "${node.value} ${EXAMPLE_UNIT[dimension]}".`;
  }
  if (node.kind !== 'string') return `expected ${plain ? 'a number' : 'a number with its unit in a string, e.g. "4000 fpm"'}, not ${describe(node)}.`;
  const match = /^\s*(\S+)\s*(.*?)\s*$/.exec(node.value);
  const number = match ? parseNumberText(match[1]!) : undefined;
  const unit = match?.[2] ?? '';
  if (number === undefined || !Number.isFinite(number)) return `"${node.value}" does not start with a number.`;
  if (plain) return unit === '' ? number : `a plain number is expected, without '${unit}'.`;
  if (unit === '') return `write the value with its unit, e.g. "${node.value.trim()} ${EXAMPLE_UNIT[dimension]}".`;
  const si = toSI(number, unit, dimension as Dimension);
  return si.ok ? si.si : `'${unit}' is not a unit of ${DIMENSION_WORD[dimension]} (use one of ${si.accepted.slice(0, 7).join(', ')}).`;
}

const EXAMPLE_UNIT: Record<RuleParameter['dimension'], string> = {
  velocity: 'fpm',
  pressure: 'inHg',
  length: 'ft',
  angle: 'deg',
  fraction: '%',
  ratio: '',
  count: '',
};

const DIMENSION_WORD: Record<RuleParameter['dimension'], string> = {
  velocity: 'velocity',
  pressure: 'pressure',
  length: 'length',
  angle: 'angle',
  fraction: 'share',
  ratio: 'ratio',
  count: 'count',
};

/**
 * The model with the project's settings beneath the file's: display units
 * when the file has no `units` line; thresholds and severities placed before
 * the file's own system-wide ones, since the engine takes the last that
 * applies (element `threshold` lines win over both). Returns the model
 * itself when there is nothing to apply.
 */
export function applyProjectSettings(model: SystemModel, settings: ProjectSettings, fileStatesUnits: boolean): SystemModel {
  const units = !fileStatesUnits && settings.displayUnits !== undefined && settings.displayUnits !== model.displayUnits;
  if (!units && settings.ruleSettings.length === 0 && settings.severities.length === 0) return model;
  return {
    ...model,
    ...(units ? { displayUnits: settings.displayUnits } : {}),
    rules: {
      ...model.rules,
      settings: [...settings.ruleSettings, ...model.rules.settings],
      severities: [...settings.severities, ...model.rules.severities],
    },
  };
}

/** Whether a system states its display units itself (a `units` line). */
export function statesDisplayUnits(system: System): boolean {
  return system.members.some((m) => m.$type === 'DisplayUnits');
}

/** The members of an object; a key written twice is reported and only its last value kept, as JSON readers do. */
function uniqueMembers(node: Extract<JsonNode, { kind: 'object' }>, diagnostics: VacnetDiagnostic[]): JsonMember[] {
  const last = new Map<string, JsonMember>();
  for (const member of node.members) {
    const earlier = last.get(member.key);
    if (earlier) diagnostics.push(invalid(`'${member.key}' is written twice here; only the last one counts.`, earlier.keyRange));
    last.set(member.key, member);
  }
  return [...last.values()].sort((a, b) => a.keyRange.start.line - b.keyRange.start.line || a.keyRange.start.character - b.keyRange.start.character);
}

function describe(node: JsonNode): string {
  switch (node.kind) {
    case 'string':
      return JSON.stringify(node.value);
    case 'number':
      return String(node.value);
    case 'boolean':
      return String(node.value);
    case 'null':
      return 'null';
    case 'array':
      return 'a list';
    case 'object':
      return 'an object';
  }
}

/** ` (did you mean 'x'?)` when a known word is one or two edits away. */
function suggestion(word: string, known: readonly string[]): string {
  let best: string | undefined;
  let bestDistance = 3;
  for (const candidate of known) {
    const d = editDistance(word.toLowerCase(), candidate.toLowerCase());
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return best === undefined ? '' : ` (did you mean '${best}'?)`;
}

/** Levenshtein distance (Levenshtein 1966), for the spelling suggestions. */
function editDistance(a: string, b: string): number {
  if (Math.abs(a.length - b.length) > 3) return 4;
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      current[j] = Math.min(previous[j]! + 1, current[j - 1]! + 1, previous[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
    previous = current;
  }
  return previous[b.length]!;
}

function problem(code: string, message: string, range: SourceRange, source: VacnetDiagnostic['source'] = 'structure'): VacnetDiagnostic {
  return { severity: 'error', code, message, range, source };
}

function invalid(message: string, range: SourceRange): VacnetDiagnostic {
  return problem(SettingsCodes.invalidValue, message, range);
}

function unknown(message: string, range: SourceRange): VacnetDiagnostic {
  return problem(SettingsCodes.unknownName, message, range);
}
