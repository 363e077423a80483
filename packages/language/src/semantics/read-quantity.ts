import { ACCEPTED_UNITS, parseNumberText, toSI, unitConversion, type Dimension } from '@vacnet/engine';
import type { Quantity } from '../generated/ast.js';
import { StructureCodes, type StructureCode } from '../validation/codes.js';
import { SEA_LEVEL_PRESSURE_PA, type Expectation } from './quantity-expectations.js';

/** A quantity read to SI, or why it could not be. */
export type QuantityReading =
  | {
      ok: true;
      /** Value in SI (or, for a radius in `D`, the multiple of the pipe diameter). */
      si: number;
      flowBasis?: 'standard' | 'actual';
      /** The radius was given in pipe diameters (`1.5 D`). */
      inDiameters?: boolean;
    }
  | { ok: false; code: StructureCode; message: string; onUnit: boolean };

/** The unit word that means "multiples of the pipe diameter" for a bend radius. */
const DIAMETERS_UNIT = 'D';

/**
 * Reads a quantity as written against what it must measure. Never throws:
 * a bad number or unit is a reading with a code and a message that lists
 * what would be accepted.
 */
export function readQuantity(quantity: Quantity, expectation: Expectation): QuantityReading {
  const value = parseNumberText(quantity.value ?? '');
  if (value === undefined) {
    return { ok: false, code: StructureCodes.numberInvalid, message: `'${quantity.value}' is not a number vacnet can read.`, onUnit: false };
  }
  const unit = quantity.unit?.trim();
  const reading = convert(value, unit, expectation);
  if (!reading.ok) return reading;
  const range = rangeProblem(reading.si, expectation, reading.inDiameters === true, unit);
  if (range) {
    return { ok: false, code: StructureCodes.valueImplausible, message: range, onUnit: false };
  }
  return reading;
}

function convert(value: number, unit: string | undefined, expectation: Expectation): QuantityReading {
  if (expectation.dimension === 'dimensionless') {
    if (unit) {
      return { ok: false, code: StructureCodes.unitWrongDimension, message: `${capitalise(expectation.what)} is a plain number; remove the unit '${unit}'.`, onUnit: true };
    }
    return { ok: true, si: value };
  }
  if (expectation.dimension === 'fraction' && !unit) {
    // A share may be written as a plain number (0.55) or with % (55 %).
    return { ok: true, si: value };
  }
  if (expectation.dimension === 'radius' && unit === DIAMETERS_UNIT) {
    return { ok: true, si: value, inDiameters: true };
  }
  const dimension = expectation.dimension === 'radius' ? 'length' : expectation.dimension;
  const accepted = ACCEPTED_UNITS[dimension];
  const acceptedText = (expectation.dimension === 'radius' ? [DIAMETERS_UNIT, ...accepted] : accepted).join(', ');
  if (!unit) {
    return {
      ok: false,
      code: StructureCodes.unitMissing,
      message: `${capitalise(expectation.what)} needs a unit: ${acceptedText}.`,
      onUnit: false,
    };
  }
  const result = toSI(value, unit, dimension);
  if (result.ok) {
    return { ok: true, si: result.si, ...(result.flowBasis ? { flowBasis: result.flowBasis } : {}) };
  }
  switch (result.reason) {
    case 'unknown-unit':
      return { ok: false, code: StructureCodes.unitUnknown, message: `Unknown unit '${unit}' for ${expectation.what}; use one of: ${acceptedText}.`, onUnit: true };
    case 'wrong-dimension':
      return { ok: false, code: StructureCodes.unitWrongDimension, message: `'${unit}' does not measure ${expectation.what}; use one of: ${acceptedText}.`, onUnit: true };
    default:
      return { ok: false, code: StructureCodes.numberInvalid, message: `${capitalise(expectation.what)} is too large to be a number.`, onUnit: false };
  }
}

function rangeProblem(si: number, expectation: Expectation, inDiameters: boolean, unit: string | undefined): string | undefined {
  if (inDiameters) {
    // Bends are made from about 0.5 D (mitred, short) to about 20 D (pulled sweeps): common practice.
    if (si < 0.5 || si > 20) return `A bend radius of ${si} D is not a real fitting; bends run from about 0.5 D to 20 D.`;
    return undefined;
  }
  const { min, max, minExclusive } = expectation;
  const what = capitalise(expectation.what);
  if (min !== undefined && (si < min || (minExclusive && si === min))) {
    if (si < 0 && min >= 0) return `${what} cannot be negative.`;
    return `${what} must be ${minExclusive ? 'greater than' : 'at least'} ${inWrittenUnit(min, expectation, unit)}.`;
  }
  if (max !== undefined && si > max) {
    if (expectation.dimension === 'pressure' && max === SEA_LEVEL_PRESSURE_PA) {
      return `${what} cannot exceed the atmosphere's own pressure (${inWrittenUnit(max, expectation, unit)} at sea level); check the number and its unit.`;
    }
    return `${what} this large is not plausible (at most ${inWrittenUnit(max, expectation, unit)}); check the number and its unit.`;
  }
  return undefined;
}

const SI_UNIT: Record<string, string> = {
  length: 'm', pressure: 'Pa', flow: 'm3/s', velocity: 'm/s', angle: 'rad', area: 'm2',
  temperature: 'K', power: 'W', time: 's', fraction: '', 'area-rate': 'm2/s', 'mass-flow': 'kg/s',
};

/** A limit in the unit the user wrote (so `35 inHg` is answered in inHg), else in SI. */
function inWrittenUnit(si: number, expectation: Expectation, unit: string | undefined): string {
  const dimension = expectation.dimension;
  if (dimension === 'dimensionless' || dimension === 'radius') return `${+si.toPrecision(4)}`;
  if (unit) {
    const conversion = unitConversion(unit, dimension as Dimension);
    if (conversion && conversion.scale > 0) return `${+((si - conversion.offset) / conversion.scale).toPrecision(4)} ${unit}`;
  }
  if (dimension === 'fraction') return `${+(si * 100).toPrecision(4)} %`;
  if (dimension === 'angle') return `${+((si * 180) / Math.PI).toPrecision(4)} deg`;
  const siUnit = SI_UNIT[dimension] ?? '';
  return `${+si.toPrecision(4)}${siUnit ? ' ' + siUnit : ''}`;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
