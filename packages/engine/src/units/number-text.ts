/**
 * Number text as people write it on drawings and in the trade: decimals,
 * exponents and inch fractions.
 *
 * Input: the text of one number, e.g. `12`, `-2.5`, `1e-3`, `.5`, `3/4`,
 * `1-1/2` (mixed number: 1 + 1/2), `-1-1/2` (= -1.5).
 * Output: the value, or undefined for anything else, for Infinity and for NaN.
 */
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const FRACTION = /^([+-]?)(\d+)\/(\d+)$/;
const MIXED = /^([+-]?)(\d+)[- ](\d+)\/(\d+)$/;

export function parseNumberText(text: string): number | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  let value: number | undefined;
  if (DECIMAL.test(t)) {
    value = Number(t);
  } else {
    const mixed = MIXED.exec(t);
    const frac = mixed ? undefined : FRACTION.exec(t);
    if (mixed) {
      const [, sign, whole, num, den] = mixed;
      value = ratio(Number(num), Number(den));
      if (value !== undefined) value = (sign === '-' ? -1 : 1) * (Number(whole) + value);
    } else if (frac) {
      const [, sign, num, den] = frac;
      value = ratio(Number(num), Number(den));
      if (value !== undefined && sign === '-') value = -value;
    }
  }
  return value !== undefined && Number.isFinite(value) ? value : undefined;
}

function ratio(num: number, den: number): number | undefined {
  return den === 0 ? undefined : num / den;
}
