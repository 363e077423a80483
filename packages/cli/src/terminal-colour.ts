/**
 * Colour for people at a terminal, off for pipes and files. NO_COLOR
 * (no-color.org: present and not empty) turns it off and wins over
 * everything; FORCE_COLOR (force-color.org) turns it on even when the
 * output is not a terminal, except for the values "0" and "false", which
 * turn it off as in Node's own `tty.getColorDepth`.
 */
export function colourWanted(env: Readonly<Record<string, string | undefined>>, isTty: boolean): boolean {
  if (env.NO_COLOR !== undefined && env.NO_COLOR !== '') return false;
  const force = env.FORCE_COLOR;
  if (force !== undefined) return force !== '0' && force.toLowerCase() !== 'false';
  if (env.TERM === 'dumb') return false;
  return isTty;
}

/** The few styles the output uses, as ANSI SGR sequences (ECMA-48); plain text when colour is off. */
export interface Palette {
  error(text: string): string;
  warning(text: string): string;
  info(text: string): string;
  dim(text: string): string;
  bold(text: string): string;
  good(text: string): string;
}

const sgr = (open: number, close: number) => (text: string) => `\u001b[${open}m${text}\u001b[${close}m`;

export const COLOUR: Palette = {
  error: sgr(31, 39), // red
  warning: sgr(33, 39), // yellow
  info: sgr(36, 39), // cyan
  dim: sgr(2, 22),
  bold: sgr(1, 22),
  good: sgr(32, 39), // green
};

const same = (text: string) => text;
export const PLAIN: Palette = { error: same, warning: same, info: same, dim: same, bold: same, good: same };

export function palette(colour: boolean): Palette {
  return colour ? COLOUR : PLAIN;
}
