import { formatQuantity, type Dimension, type FlowBasis, type UnitSystem } from '@vacnet/engine';

/**
 * Engine values (SI) as people read them in the editor, in the system's
 * display units. Hints use fewer digits than hovers: they sit in the text.
 */
export interface Display {
  units: UnitSystem;
  pressure(pa: number, digits?: number): string;
  flow(m3PerS: number, basis?: FlowBasis, digits?: number): string;
  velocity(mPerS: number, digits?: number): string;
  length(m: number, digits?: number): string;
  power(w: number, digits?: number): string;
  percent(fraction: number, digits?: number): string;
}

export function display(units: UnitSystem | undefined): Display {
  const u: UnitSystem = units === 'si' ? 'si' : 'imperial';
  const f = (si: number, dimension: Dimension, digits: number, basis?: FlowBasis) =>
    formatQuantity(si, dimension, u, digits, basis ? { flowBasis: basis } : {});
  return {
    units: u,
    pressure: (pa, digits = 3) => f(pa, 'pressure', digits),
    flow: (q, basis = 'standard', digits = 3) => f(q, 'flow', digits, basis),
    velocity: (v, digits = 3) => f(v, 'velocity', digits),
    length: (m, digits = 3) => f(m, 'length', digits),
    power: (w, digits = 3) => f(w, 'power', digits),
    percent: (x, digits = 2) => f(x, 'fraction', digits),
  };
}

/** `'A1', 'B2' and 'C3'`: inlet names for sentences. */
export function nameList(names: readonly string[]): string {
  const quoted = names.map((n) => `\`${n}\``);
  if (quoted.length <= 1) return quoted.join('');
  return `${quoted.slice(0, -1).join(', ')} and ${quoted.at(-1)}`;
}
