/**
 * "Nice" axis ticks: steps of 1, 2, 2.5 or 5 times a power of ten, the
 * usual choice of plotting libraries (after Heckbert, "Nice numbers for
 * graph labels", Graphics Gems, 1990, with 2.5 added).
 */
export interface AxisTicks {
  /** The axis runs from 0 (or `min`) to `max`, a whole number of steps. */
  min: number;
  max: number;
  step: number;
  values: number[];
}

const STEPS = [1, 2, 2.5, 5, 10];

/** Ticks from `low` to at least `high`, about `target` of them (at least 2 steps). */
export function axisTicks(low: number, high: number, target = 6): AxisTicks {
  const lo = Number.isFinite(low) ? low : 0;
  let hi = Number.isFinite(high) ? high : 1;
  if (!(hi > lo)) hi = lo + 1;
  const raw = (hi - lo) / Math.max(2, target);
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = (STEPS.find((s) => s * power >= raw) ?? 10) * power;
  const min = Math.floor(lo / step + 1e-9) * step;
  const max = Math.ceil(hi / step - 1e-9) * step;
  const values: number[] = [];
  for (let v = min; v <= max + step * 1e-6; v += step) values.push(roundTo(v, step));
  return { min, max, step, values };
}

/** Tick text without float noise: as many decimals as the step needs. */
export function tickText(value: number, step: number): string {
  const power = Math.floor(Math.log10(step) + 1e-9);
  const quarter = Math.abs(step / 10 ** power - 2.5) < 1e-9 ? 1 : 0; // 2.5, 0.25...: one decimal more
  const decimals = Math.max(0, Math.min(6, -power + quarter));
  return value.toFixed(decimals);
}

function roundTo(v: number, step: number): number {
  const scale = 1e9 / step;
  return Math.round(v * scale) / scale;
}
