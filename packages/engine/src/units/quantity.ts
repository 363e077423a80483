/**
 * Quantities: a number with a unit as a user writes it, converted to the
 * engine's SI units, with the flow basis (standard or actual) kept apart.
 *
 * SI per dimension: length m, pressure Pa, flow m^3/s, velocity m/s, angle rad,
 * area m^2, temperature K, power W, time s, fraction 1 (50 % -> 0.5),
 * area-rate m^2/s, mass-flow kg/s.
 */
import { parseUnit, type MathUnit } from './unit-registry.js';

export type Dimension =
  | 'length'
  | 'pressure'
  | 'flow'
  | 'velocity'
  | 'angle'
  | 'area'
  | 'temperature'
  | 'power'
  | 'time'
  | 'fraction'
  | 'area-rate'
  | 'mass-flow';

export type FlowBasis = 'standard' | 'actual';

export type ToSIResult =
  | { ok: true; si: number; flowBasis?: FlowBasis }
  | { ok: false; reason: 'unknown-unit' | 'wrong-dimension' | 'not-finite'; accepted: string[] };

/** The SI unit (mathjs spelling) each dimension converts to; fraction has none. */
const SI_UNIT: Record<Exclude<Dimension, 'fraction'>, string> = {
  length: 'm',
  pressure: 'Pa',
  flow: 'm^3/s',
  velocity: 'm/s',
  angle: 'rad',
  area: 'm^2',
  temperature: 'K',
  power: 'W',
  time: 's',
  'area-rate': 'm^2/s',
  'mass-flow': 'kg/s',
};

/** The short list of spellings shown to a user who wrote something else. */
export const ACCEPTED_UNITS: Readonly<Record<Dimension, readonly string[]>> = {
  length: ['in', 'ft', 'mm', 'cm', 'm', 'um'],
  pressure: ['inHg', 'inH2O', 'psi', 'Pa', 'kPa', 'mbar', 'mmH2O'],
  flow: ['scfm', 'acfm', 'cfm', 'Sm3/h', 'Sm3/s', 'SL/s', 'm3/h', 'Am3/h', 'm3/s', 'L/s'],
  velocity: ['fpm', 'ft/s', 'm/s'],
  angle: ['deg', 'rad'],
  area: ['sqft', 'ft2', 'm2'],
  temperature: ['degF', 'degC', 'K'],
  power: ['W', 'kW', 'hp'],
  time: ['s', 'min', 'h'],
  fraction: ['%'],
  'area-rate': ['sqft/h', 'ft2/h', 'm2/h'],
  'mass-flow': ['kg/s', 'kg/h', 'lb/min', 'lb/h'],
};

/**
 * Trade spellings that mathjs cannot parse, by normalised text, with the
 * mathjs expression they stand for and (for flows) their basis. Standard
 * flow is dry air at 20 C and 101.325 kPa (see air/standard-air.ts).
 */
const ALIASES: ReadonlyMap<string, { expression: string; basis?: FlowBasis }> = new Map<
  string,
  { expression: string; basis?: FlowBasis }
>([
  ['scfm', { expression: 'ft^3/min', basis: 'standard' }],
  ['acfm', { expression: 'ft^3/min', basis: 'actual' }],
  ['cfm', { expression: 'ft^3/min', basis: 'actual' }],
  ['Sm3/h', { expression: 'm^3/h', basis: 'standard' }],
  ['Sm^3/h', { expression: 'm^3/h', basis: 'standard' }],
  ['Sm3/s', { expression: 'm^3/s', basis: 'standard' }],
  ['Sm^3/s', { expression: 'm^3/s', basis: 'standard' }],
  ['Sm3/min', { expression: 'm^3/min', basis: 'standard' }],
  ['SL/s', { expression: 'L/s', basis: 'standard' }],
  ['Sl/s', { expression: 'L/s', basis: 'standard' }],
  ['SL/min', { expression: 'L/min', basis: 'standard' }],
  ['Am3/h', { expression: 'm^3/h', basis: 'actual' }],
  ['Am^3/h', { expression: 'm^3/h', basis: 'actual' }],
  ['Am3/s', { expression: 'm^3/s', basis: 'actual' }],
  ['AL/s', { expression: 'L/s', basis: 'actual' }],
  ['inWC', { expression: 'inH2O' }],
  ['sqft', { expression: 'ft^2' }],
  ['sqft/h', { expression: 'ft^2/h' }],
  ['sqft/min', { expression: 'ft^2/min' }],
  ['°F', { expression: 'degF' }],
  ['°C', { expression: 'degC' }],
  ['°', { expression: 'deg' }],
  ['µm', { expression: 'um' }],
  ['μm', { expression: 'um' }],
]);

/** Case-insensitive fallbacks for a few trade names people type in capitals. */
const CASELESS: ReadonlyMap<string, string> = new Map([
  ['scfm', 'scfm'],
  ['acfm', 'acfm'],
  ['cfm', 'cfm'],
  ['inhg', 'inHg'],
  ['inh2o', 'inH2O'],
  ['inwc', 'inWC'],
  ['mmh2o', 'mmH2O'],
  ['fpm', 'fpm'],
  ['sqft', 'sqft'],
  ['kpa', 'kPa'],
]);

/** A unit token mathjs may parse: letters, optionally `^2`/`^3`; no digits elsewhere. */
const UNIT_TOKEN = /^[A-Za-z_]+(?:\^[23])?$/;
/** Units with a name that ends in a digit (handled before the m3 -> m^3 rewrite). */
const DIGIT_NAMES = new Set(['inH2O', 'mmH2O', 'cmH2O']);

type Resolved =
  | { ok: true; scale: number; offset: number; basis?: FlowBasis }
  | { ok: false; reason: 'unknown-unit' | 'wrong-dimension' };

const MEMO_LIMIT = 4096;
const memo = new Map<string, Resolved>();

/** Tidy a unit as typed: trim, drop spaces around `/`, `^` and `*`, one space elsewhere. */
export function normaliseUnitText(unit: string): string {
  return unit
    .trim()
    .replace(/\s*([/^*])\s*/g, '$1')
    .replace(/\s+/g, ' ')
    .replace(/^sq (ft|in|m)\b/, 'sq$1');
}

/**
 * Convert `value` written in `unit` to the SI unit of `dimension`.
 *
 * Offset temperature units (degF, degC) are converted with their offset.
 * The factor is memoised per (unit, dimension) because mathjs parsing costs
 * tens of microseconds and this runs on every keystroke in the editor.
 */
export function toSI(value: number, unit: string, dimension: Dimension): ToSIResult {
  const resolved = resolve(unit, dimension);
  if (!resolved.ok) return { ok: false, reason: resolved.reason, accepted: [...ACCEPTED_UNITS[dimension]] };
  if (!Number.isFinite(value)) return { ok: false, reason: 'not-finite', accepted: [...ACCEPTED_UNITS[dimension]] };
  const si = value * resolved.scale + resolved.offset;
  if (!Number.isFinite(si)) return { ok: false, reason: 'not-finite', accepted: [...ACCEPTED_UNITS[dimension]] };
  return dimension === 'flow' ? { ok: true, si, flowBasis: resolved.basis ?? 'actual' } : { ok: true, si };
}

/** Whether `unit` is a valid spelling for `dimension` (no value needed). */
export function isUnitOf(unit: string, dimension: Dimension): boolean {
  return resolve(unit, dimension).ok;
}

function resolve(unit: string, dimension: Dimension): Resolved {
  const key = `${dimension}\u0000${unit}`;
  const hit = memo.get(key);
  if (hit) return hit;
  const resolved = resolveUncached(unit, dimension);
  if (memo.size >= MEMO_LIMIT) memo.clear(); // bounded: typing produces many partial spellings
  memo.set(key, resolved);
  return resolved;
}

function resolveUncached(unit: string, dimension: Dimension): Resolved {
  let text = normaliseUnitText(unit);
  if (dimension === 'fraction') {
    if (text === '%') return { ok: true, scale: 0.01, offset: 0 };
    if (text === '') return { ok: true, scale: 1, offset: 0 };
  }
  if (text === '' || text === '%') return { ok: false, reason: 'wrong-dimension' };
  const caseless = CASELESS.get(text.toLowerCase());
  if (caseless && !ALIASES.has(text) && parseUnit(text) === undefined) text = caseless;

  const alias = ALIASES.get(text);
  let expression = alias ? alias.expression : text;
  if (!alias && !DIGIT_NAMES.has(text)) {
    // m3/h -> m^3/h, ft2 -> ft^2; then every token must look like a unit name.
    const tokens = text.split(/([/* ])/);
    for (let i = 0; i < tokens.length; i += 2) {
      const token = (tokens[i] ?? '').replace(/^([A-Za-z]+)([23])$/, '$1^$2');
      if (!UNIT_TOKEN.test(token)) return { ok: false, reason: 'unknown-unit' };
      tokens[i] = token;
    }
    expression = tokens.join('');
  }
  const parsed = parseUnit(expression);
  if (!parsed) return { ok: false, reason: 'unknown-unit' };
  if (dimension === 'fraction') return { ok: false, reason: 'wrong-dimension' };
  const target = SI_UNIT[dimension];
  const reference = parseUnit(target) as MathUnit;
  if (!parsed.equalBase(reference)) return { ok: false, reason: 'wrong-dimension' };
  let scale: number;
  let offset: number;
  try {
    if (dimension === 'temperature') {
      // Two points give scale and offset for degF/degC; a plain factor for K and degR.
      const at0 = (parseUnit(expression, 0) as MathUnit).toNumber(target);
      const at1 = (parseUnit(expression, 1) as MathUnit).toNumber(target);
      offset = at0;
      scale = at1 - at0;
    } else {
      scale = parsed.toNumber(target);
      offset = 0;
    }
  } catch {
    return { ok: false, reason: 'wrong-dimension' };
  }
  if (!Number.isFinite(scale) || !Number.isFinite(offset) || scale === 0) return { ok: false, reason: 'unknown-unit' };
  const basis = dimension === 'flow' ? (alias?.basis ?? 'actual') : undefined;
  return basis ? { ok: true, scale, offset, basis } : { ok: true, scale, offset };
}

/** Scale and offset with si = value * scale + offset, or undefined for a unit not of `dimension`. */
export function unitConversion(unit: string, dimension: Dimension): { scale: number; offset: number } | undefined {
  const resolved = resolve(unit, dimension);
  return resolved.ok ? { scale: resolved.scale, offset: resolved.offset } : undefined;
}
