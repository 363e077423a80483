/**
 * Numbers in rule messages, in the system's display units, formatted as
 * everywhere else in the product (units/format-quantity). Pipe and hose
 * sizes are written the way the trade writes them (`2.5 in`, `65 mm`).
 */
import type { DisplayUnits } from '../network/model.js';
import { formatQuantity } from '../units/format-quantity.js';

/** Inch, m (exact, NIST SP 811). */
const INCH_M = 0.0254;

function plain(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return 'n/a';
  return Number(value.toFixed(decimals)).toString();
}

export function formatVelocity(mPerS: number, units: DisplayUnits): string {
  return formatQuantity(mPerS, 'velocity', units);
}

/** A vacuum or a pressure difference: inHg in imperial, kPa in SI. */
export function formatPressure(pa: number, units: DisplayUnits): string {
  return formatQuantity(pa, 'pressure', units);
}

export function formatLength(m: number, units: DisplayUnits): string {
  return formatQuantity(m, 'length', units);
}

/** A pipe size or bore, as the trade writes it: inches in imperial, mm in SI. */
export function formatDiameter(m: number, units: DisplayUnits): string {
  return units === 'imperial' ? `${plain(m / INCH_M, 3)} in` : `${plain(m * 1000, 1)} mm`;
}

/** A standard flow: scfm in imperial, Sm3/h in SI. */
export function formatFlow(m3PerS: number, units: DisplayUnits): string {
  return formatQuantity(m3PerS, 'flow', units, 3, { flowBasis: 'standard' });
}

export function formatPercent(fraction: number): string {
  return `${plain(fraction * 100, 0)} %`;
}

/**
 * Two shares as percentages with the fewest decimals (up to two) that keep
 * them apart, so that a value just under its limit never prints as equal to
 * it ("9.6 % margin, below the 10 % required", not "10 % ... below the 10 %").
 */
export function formatPercentApart(value: number, limit: number): [string, string] {
  const MAX_DECIMALS = 2; // our choice: past two, the difference is below what the inputs carry
  let decimals = 0;
  while (decimals < MAX_DECIMALS && plain(value * 100, decimals) === plain(limit * 100, decimals)) decimals++;
  return [`${plain(value * 100, decimals)} %`, `${plain(limit * 100, decimals)} %`];
}

export function formatAngle(rad: number): string {
  return `${plain((rad * 180) / Math.PI, 0)} deg`;
}
