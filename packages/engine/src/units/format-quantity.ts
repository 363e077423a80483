/**
 * Quantities for display: SI values from the engine shown in the units the
 * reader works in (imperial trade units or SI trade units).
 */
import { type Dimension, type FlowBasis, unitConversion } from './quantity.js';

export type UnitSystem = 'imperial' | 'si';

export interface DisplayOptions {
  /** Show in this unit (any spelling toSI accepts for the dimension); ignored when not of the dimension. */
  unit?: string;
  /** Basis of a flow value: scfm / Sm3/h for standard, acfm / m3/h for actual (default actual). */
  flowBasis?: FlowBasis;
}

export interface DisplayValue {
  value: number;
  unit: string;
}

// 1 hp = 745.6998715822702 W (mechanical horsepower, NIST SP 811); switch to hp from 1 hp.
const HP_W = 745.6998715822702;
// 2 ft = 0.6096 m: shorter lengths read better in inches (common practice).
const INCH_LIMIT_M = 0.6096;

function defaultUnit(si: number, dimension: Dimension, system: UnitSystem, basis: FlowBasis): string {
  const a = Math.abs(si);
  const imperial = system === 'imperial';
  switch (dimension) {
    case 'length':
      return imperial ? (a < INCH_LIMIT_M ? 'in' : 'ft') : a < 1 ? 'mm' : 'm';
    case 'pressure':
      return imperial ? 'inHg' : 'kPa';
    case 'flow':
      if (imperial) return basis === 'standard' ? 'scfm' : 'acfm';
      return basis === 'standard' ? 'Sm3/h' : 'm3/h';
    case 'velocity':
      return imperial ? 'fpm' : 'm/s';
    case 'angle':
      return 'deg';
    case 'area':
      return imperial ? 'ft2' : 'm2';
    case 'temperature':
      return imperial ? 'degF' : 'degC';
    case 'power':
      return imperial ? (a < HP_W ? 'W' : 'hp') : a < 1000 ? 'W' : 'kW';
    case 'time':
      return a < 120 ? 's' : a < 7200 ? 'min' : 'h';
    case 'fraction':
      return '%';
    case 'area-rate':
      return imperial ? 'ft2/h' : 'm2/h';
    case 'mass-flow':
      return imperial ? 'lb/min' : 'kg/h';
  }
}

/**
 * Convert an SI value to a display unit. The unit is `options.unit` when it
 * belongs to the dimension, otherwise the system's default for the size of
 * the value (pressure is shown in inHg or kPa: callers pass vacuum or
 * absolute as they mean it). A non-finite input is returned unchanged;
 * formatQuantity prints it as "n/a".
 */
export function fromSI(si: number, dimension: Dimension, system: UnitSystem, options: DisplayOptions = {}): DisplayValue {
  const basis = options.flowBasis ?? 'actual';
  let unit = options.unit;
  let conversion = unit !== undefined ? unitConversion(unit, dimension) : undefined;
  if (!conversion || unit === undefined) {
    unit = defaultUnit(si, dimension, system, basis);
    conversion = unitConversion(unit, dimension) ?? { scale: 1, offset: 0 };
  }
  if (!Number.isFinite(si)) return { value: si, unit };
  return { value: (si - conversion.offset) / conversion.scale, unit };
}

/** `12.0 inHg`, `340 scfm`, `4.90 kW`: `digits` significant digits (default 3, at least 1). */
export function formatQuantity(
  si: number,
  dimension: Dimension,
  system: UnitSystem,
  digits = 3,
  options: DisplayOptions = {},
): string {
  const { value, unit } = fromSI(si, dimension, system, options);
  return `${formatSignificant(value, digits)} ${unit}`;
}

/** Significant-digit formatting without exponents; large values are rounded to whole numbers. */
export function formatSignificant(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return 'n/a';
  const d = Math.min(15, Math.max(1, Math.round(Number.isFinite(digits) ? digits : 3)));
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = d - 1 - magnitude;
  if (decimals <= 0) return String(Math.round(value));
  const text = value.toFixed(Math.min(decimals, 20));
  return text === '-0' || /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}
