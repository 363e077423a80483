/**
 * Numbers in rule messages, in the system's display units with the other
 * system in brackets where it helps a reviewer check the value.
 */
import type { DisplayUnits } from '../network/model.js';

/** International foot, m (exact, NIST SP 811). */
const FOOT_M = 0.3048;
/** Inch, m (exact, NIST SP 811). */
const INCH_M = 0.0254;
/** Conventional inch of mercury, Pa (NIST SP 811). */
const INHG_PA = 3386.389;
/** Inch of water at 39.2 F, Pa (NIST SP 811). */
const INH2O_PA = 249.082;
/** Cubic foot per minute, m^3/s (exact from the foot). */
const CFM_M3S = (FOOT_M * FOOT_M * FOOT_M) / 60;

function round(value: number, digits: number): string {
  if (!Number.isFinite(value)) return String(value);
  return Number(value.toFixed(digits)).toString();
}

export function formatVelocity(mPerS: number, units: DisplayUnits): string {
  const fpm = (mPerS / FOOT_M) * 60;
  return units === 'imperial' ? `${round(fpm, 0)} fpm (${round(mPerS, 1)} m/s)` : `${round(mPerS, 1)} m/s (${round(fpm, 0)} fpm)`;
}

/** A vacuum or a pressure difference: inHg in imperial, kPa in SI. */
export function formatPressure(pa: number, units: DisplayUnits): string {
  return units === 'imperial' ? `${round(pa / INHG_PA, 2)} inHg` : `${round(pa / 1000, 2)} kPa`;
}

/** A small pressure difference (fitting, separator): inH2O in imperial, Pa in SI. */
export function formatSmallPressure(pa: number, units: DisplayUnits): string {
  return units === 'imperial' ? `${round(pa / INH2O_PA, 1)} inH2O` : `${round(pa, 0)} Pa`;
}

export function formatLength(m: number, units: DisplayUnits): string {
  return units === 'imperial' ? `${round(m / FOOT_M, 1)} ft` : `${round(m, 2)} m`;
}

/** A pipe size or bore: inches in imperial, mm in SI. */
export function formatDiameter(m: number, units: DisplayUnits): string {
  return units === 'imperial' ? `${round(m / INCH_M, 3)} in` : `${round(m * 1000, 1)} mm`;
}

/** A standard flow: scfm in imperial, Sm3/h in SI. */
export function formatFlow(m3PerS: number, units: DisplayUnits): string {
  return units === 'imperial' ? `${round(m3PerS / CFM_M3S, 0)} scfm` : `${round(m3PerS * 3600, 0)} Sm3/h`;
}

export function formatPercent(fraction: number): string {
  return `${round(fraction * 100, 0)} %`;
}

export function formatAngle(rad: number): string {
  return `${round((rad * 180) / Math.PI, 0)} deg`;
}

/** An SI value of a rule parameter in the unit a reader expects, for docs and messages. */
export function formatParameter(value: number, dimension: string, units: DisplayUnits): string {
  switch (dimension) {
    case 'velocity':
      return formatVelocity(value, units);
    case 'pressure':
      return formatPressure(value, units);
    case 'length':
      return formatLength(value, units);
    case 'angle':
      return formatAngle(value);
    case 'fraction':
      return formatPercent(value);
    default:
      return round(value, 3);
  }
}
