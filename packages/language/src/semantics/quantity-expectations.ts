import type { Dimension } from '@vacnet/engine';
import type { Quantity } from '../generated/ast.js';
import { ruleParameterExpectation } from './rule-parameters.js';

/**
 * What a number in a given place measures, and the range a real central
 * vacuum system stays within. Values outside the range are almost always a
 * slip of the unit or a typo (a 40 ft pipe diameter), so they are errors.
 *
 * Ranges are deliberately wide: they catch impossible values, not unusual
 * designs. All bounds are in SI.
 */
export interface Expectation {
  /** What the number measures, or `radius` (a length or a multiple of the pipe diameter, `D`). */
  dimension: Dimension | 'radius' | 'dimensionless';
  /** Plain words for messages: "a pipe size". */
  what: string;
  min?: number;
  max?: number;
  /** True when the minimum itself is not allowed (lengths must be > 0). */
  minExclusive?: boolean;
}

/** Standard atmosphere at sea level, Pa: no vacuum can exceed it (ISO 2533). */
export const SEA_LEVEL_PRESSURE_PA = 101_325;

const mm = 1e-3;

/** What each property keyword measures. */
export const MEASURE_EXPECTATIONS: Record<string, Expectation> = {
  length: { dimension: 'length', what: 'a length', min: 0, minExclusive: true, max: 5000 },
  size: { dimension: 'length', what: 'a pipe size', min: 6 * mm, max: 1.5 },
  bore: { dimension: 'length', what: 'an inside diameter', min: 6 * mm, max: 1.5 },
  roughness: { dimension: 'length', what: 'a roughness', min: 0, max: 10 * mm },
  wall: { dimension: 'length', what: 'a wall thickness', min: 0, minExclusive: true, max: 50 * mm },
  elevation: { dimension: 'length', what: 'a site elevation', min: -500, max: 6000 },
  pressure: { dimension: 'pressure', what: 'an ambient (absolute) pressure', min: 40_000, max: 110_000 },
  // -40 C to +70 C: air in a building or plant room.
  temperature: { dimension: 'temperature', what: 'an air temperature', min: 233.15, max: 343.15 },
  efficiency: { dimension: 'fraction', what: 'an efficiency', min: 0, minExclusive: true, max: 1 },
  relief: { dimension: 'pressure', what: 'a relief vacuum', min: 0, minExclusive: true, max: SEA_LEVEL_PRESSURE_PA },
  needs: { dimension: 'pressure', what: 'a tool vacuum', min: 0, minExclusive: true, max: SEA_LEVEL_PRESSURE_PA },
};

const VACUUM_LOSS: Expectation = { dimension: 'pressure', what: 'a pressure loss', min: 0, minExclusive: true, max: SEA_LEVEL_PRESSURE_PA };
const FLOW: Expectation = { dimension: 'flow', what: 'an air flow', min: 0, max: 10 };
const RATED_FLOW: Expectation = { ...FLOW, minExclusive: true };
const ANGLE_MAX_RAD = Math.PI;
const DEG = Math.PI / 180;

/** The expectation for a quantity, from where it stands in the file. */
export function expectationFor(quantity: Quantity): Expectation | undefined {
  const container = quantity.$container as { $type: string; key?: string };
  const property = quantity.$containerProperty;
  switch (container.$type) {
    case 'Measure':
      return MEASURE_EXPECTATIONS[container.key ?? ''];
    case 'Orifice':
      return property === 'diameter'
        ? { dimension: 'length', what: 'an orifice diameter', min: 1 * mm, max: 150 * mm }
        : { dimension: 'dimensionless', what: 'a discharge coefficient', min: 0.3, max: 1 };
    case 'CurvePoint':
      if (property === 'flow') return FLOW;
      if (property === 'vacuum') return { dimension: 'pressure', what: 'a vacuum', min: 0, max: SEA_LEVEL_PRESSURE_PA };
      return { dimension: 'power', what: 'a shaft power', min: 0, minExclusive: true, max: 2e6 };
    case 'RatedLoss':
    case 'ProducerUnit':
      return property === 'loss' || property === 'exhaust' ? VACUUM_LOSS : RATED_FLOW;
    case 'Sizes':
      return MEASURE_EXPECTATIONS.size;
    case 'Area':
      return property === 'size'
        ? { dimension: 'area', what: 'a floor area', min: 0, minExclusive: true, max: 1e7 }
        : { dimension: 'area-rate', what: 'a cleaning rate', min: 0, minExclusive: true, max: 1 };
    case 'CleaningWindow':
      return { dimension: 'time', what: 'a cleaning window', min: 0, minExclusive: true, max: 24 * 3600 };
    case 'Margin':
      return { dimension: 'fraction', what: 'a margin', min: 0, max: 1 };
    case 'TestOrifice':
      return { dimension: 'length', what: 'a test orifice diameter', min: 1 * mm, max: 100 * mm };
    case 'Bend':
      return property === 'angle'
        ? { dimension: 'angle', what: 'a bend angle', min: 0, minExclusive: true, max: ANGLE_MAX_RAD }
        : { dimension: 'radius', what: 'a bend radius', min: 0, minExclusive: true };
    case 'Reducer':
      return { dimension: 'angle', what: 'a reducer angle', min: 0, minExclusive: true, max: ANGLE_MAX_RAD };
    case 'Joins':
      return { dimension: 'angle', what: 'a branch angle', min: 10 * DEG, max: 90 * DEG };
    case 'Inlet':
    case 'Cleanout':
      return { dimension: 'length', what: 'a distance along the pipe', min: 0, max: 5000 };
    case 'Threshold':
    case 'RuleLine':
      return ruleParameterExpectation(quantity);
    default:
      return undefined;
  }
}
