import { formatQuantity, formatSignificant, fromSI, type DisplayUnits } from '@vacnet/engine';

/**
 * Text for the report's numbers in the system's display units: vacuum in
 * inHg or kPa, standard flow in scfm or Sm3/h, velocity in fpm or m/s, and
 * so on (the engine's `formatQuantity`). A missing or non-finite value
 * prints as an en dash, never as NaN.
 */
export interface QuantityText {
  units: DisplayUnits;
  vacuum(pa: number | null | undefined): string;
  /** Standard flow (the analysis gives standard flows). */
  flow(m3s: number | null | undefined): string;
  power(w: number | null | undefined): string;
  velocity(ms: number | null | undefined): string;
  /** Lengths of runs and hoses: ft or m. */
  length(m: number | null | undefined): string;
  /** Bores and orifices: in or mm. */
  bore(m: number | null | undefined): string;
  temperature(k: number | null | undefined): string;
  area(m2: number | null | undefined): string;
  /** Cleaning rate per operator. */
  areaRate(m2s: number | null | undefined): string;
  /** A duration in hours. */
  hours(s: number | null | undefined): string;
  /** A fraction as a whole-number percentage: `25 %`, `-4 %`. */
  percent(fraction: number | null | undefined): string;
  /** The same with its sign: `+25 %`. */
  signedPercent(fraction: number | null | undefined): string;
  /** A vacuum difference with its sign: `+0.12 inHg`. */
  signedVacuum(pa: number | null | undefined): string;
  /** An angle in degrees: `45 deg`. */
  angle(rad: number | null | undefined): string;
}

/** Placeholder for a value that was not computed. */
export const NO_VALUE = '\u2013';

const ok = (x: number | null | undefined): x is number => typeof x === 'number' && Number.isFinite(x);

export function quantityText(units: DisplayUnits): QuantityText {
  const imperial = units === 'imperial';
  const q = (dimension: Parameters<typeof formatQuantity>[1], digits = 3, unit?: string, basis?: 'standard') =>
    (x: number | null | undefined) => (ok(x) ? formatQuantity(x, dimension, units, digits, { ...(unit ? { unit } : {}), ...(basis ? { flowBasis: basis } : {}) }) : NO_VALUE);
  const vacuum = q('pressure');
  return {
    units,
    vacuum,
    flow: q('flow', 3, undefined, 'standard'),
    power: q('power'),
    velocity: q('velocity'),
    length: q('length', 3, imperial ? 'ft' : 'm'),
    bore: q('length', 3, imperial ? 'in' : 'mm'),
    temperature: (k) => q('temperature')(k).replace(/ deg([FC])$/, ' \u00b0$1'),
    area: q('area'),
    areaRate: q('area-rate'),
    hours: (s) => (ok(s) ? `${formatSignificant(s / 3600, 3)} h` : NO_VALUE),
    percent: (f) => (ok(f) ? `${Math.round(f * 100)} %` : NO_VALUE),
    signedPercent: (f) => (ok(f) ? `${f >= 0 ? '+' : '\u2212'}${Math.abs(Math.round(f * 100))} %` : NO_VALUE),
    signedVacuum: (pa) => {
      if (!ok(pa)) return NO_VALUE;
      const { value, unit } = fromSI(Math.abs(pa), 'pressure', units);
      return `${pa >= 0 ? '+' : '\u2212'}${formatSignificant(value, 2)} ${unit}`;
    },
    angle: (rad) => (ok(rad) ? `${formatSignificant((rad * 180) / Math.PI, 3)}\u00b0` : NO_VALUE),
  };
}
