/**
 * Width of a line of text in px, estimated without a font engine (the
 * report is laid out before any browser sees it). 0.6 em a character is
 * about the mean advance of DejaVu Sans and a little over that of Arial and
 * Liberation Sans for mixed lowercase, digits and units (from the fonts'
 * metrics, from memory); boxes come out a little wide rather than clipped.
 */
const EM_PER_CHARACTER = 0.6;
// Bold runs about 8 % wider (from memory of the same fonts).
const BOLD_FACTOR = 1.08;

export function textWidth(text: string, fontSizePx: number, bold = false): number {
  return text.length * fontSizePx * EM_PER_CHARACTER * (bold ? BOLD_FACTOR : 1);
}
