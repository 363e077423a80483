/**
 * How an inlet's worst-case tool vacuum stands against what its tool needs,
 * in four bands the schematic shades (with a pattern and a number, not by
 * colour alone) and the tables name.
 */
export type MarginBand = 'ample' | 'tight' | 'short' | 'unknown';

/**
 * A tool within 10 % of its need (in vacuum) is "tight": our choice for the
 * report, about what a worn hose, a loaded filter or a gauge's reading
 * error takes away.
 */
export const TIGHT_MARGIN_FRACTION = 0.1;

/** The band of a tool vacuum against its need; `unknown` when either is missing. */
export function marginBand(toolVacuumPa: number | null | undefined, requiredPa: number | null | undefined): MarginBand {
  if (typeof toolVacuumPa !== 'number' || !Number.isFinite(toolVacuumPa)) return 'unknown';
  if (typeof requiredPa !== 'number' || !Number.isFinite(requiredPa) || requiredPa <= 0) return 'unknown';
  if (toolVacuumPa < requiredPa) return 'short';
  return toolVacuumPa < requiredPa * (1 + TIGHT_MARGIN_FRACTION) ? 'tight' : 'ample';
}

/** Words for each band, for legends and tables. */
export const MARGIN_BAND_TEXT: Readonly<Record<MarginBand, { label: string; symbol: string; description: string }>> = {
  ample: { label: 'ample', symbol: '', description: `at least ${TIGHT_MARGIN_FRACTION * 100} % over what the tool needs` },
  tight: { label: 'tight', symbol: '~', description: `meets the need with less than ${TIGHT_MARGIN_FRACTION * 100} % to spare` },
  short: { label: 'short', symbol: '!', description: 'below what the tool needs' },
  unknown: { label: 'no need stated', symbol: '?', description: 'the tool states no need, or no result' },
};
