import { formatSignificant, type DisplayUnits } from '@vacnet/engine';
import { NO_VALUE } from './quantity-text.js';

// 1 in = 0.0254 m exactly (international inch, NIST SP 811).
const M_PER_IN = 0.0254;
// Trade sizes of pipe, tube, hose and orifices are written in sixteenths of an inch or coarser (common practice).
const DENOMINATOR = 16;
// A size within 0.1 % of a sixteenth is that sixteenth (our choice: absorbs unit round-off).
const SNAP_FRACTION = 1e-3;

/**
 * A nominal size as the trade writes it: `2-1/2 in`, `3 in`, `5/8 in` in
 * imperial units (a mixed number in sixteenths, reduced), `63.5 mm` in SI.
 * A size that is no sixteenth of an inch prints as a decimal (`2.07 in`).
 */
export function nominalSizeText(sizeM: number | null | undefined, units: DisplayUnits): string {
  if (typeof sizeM !== 'number' || !Number.isFinite(sizeM) || sizeM <= 0) return NO_VALUE;
  if (units === 'si') return `${formatSignificant(sizeM * 1000, 3)} mm`;
  const inches = sizeM / M_PER_IN;
  const sixteenths = Math.round(inches * DENOMINATOR);
  if (sixteenths === 0 || Math.abs(sixteenths / DENOMINATOR - inches) > SNAP_FRACTION * inches) return `${formatSignificant(inches, 3)} in`;
  const whole = Math.floor(sixteenths / DENOMINATOR);
  let num = sixteenths % DENOMINATOR;
  let den = DENOMINATOR;
  while (num > 0 && num % 2 === 0) {
    num /= 2;
    den /= 2;
  }
  if (num === 0) return `${whole} in`;
  return whole === 0 ? `${num}/${den} in` : `${whole}-${num}/${den} in`;
}
