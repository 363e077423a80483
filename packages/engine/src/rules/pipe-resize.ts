/**
 * Estimates for the resize quick fixes: the sizes a pipe's spec is made in,
 * and how velocity and loss move when the bore changes at the same mass flow.
 *
 * These are first estimates for a suggestion, not a new solve: the user
 * accepts the fix and the analysis runs again on the new size.
 */
import type { Pipe } from '../network/model.js';
import { insideDiameterFor, scheduleNominalSizesM } from '../network/spec-sizes.js';

export interface SizeOption {
  nominalSizeM: number;
  insideDiameterM: number;
}

/**
 * The sizes the pipe's spec is made in, with their bores, ascending by bore.
 * The spec's own list first; a schedule spec with no list falls back to the
 * schedule table. Sizes whose bore cannot be found are left out.
 */
export function sizeOptions(pipe: Pipe): SizeOption[] {
  const spec = pipe.spec;
  if (!spec?.sizeRule) return [];
  let nominals = spec.nominalSizesM ?? [];
  if (nominals.length === 0 && spec.sizeRule.kind === 'schedule') nominals = scheduleNominalSizesM(spec.sizeRule.schedule);
  const options: SizeOption[] = [];
  for (const nominal of nominals) {
    const r = insideDiameterFor(spec.sizeRule, nominal);
    if (r.ok) options.push({ nominalSizeM: nominal, insideDiameterM: r.insideDiameterM });
  }
  return options.sort((a, b) => a.insideDiameterM - b.insideDiameterM);
}

/**
 * Velocity in a bore `d2` when the same mass flow at the same density runs
 * at `v1` in bore `d1`: continuity, v2 = v1 (d1/d2)^2.
 * Valid as an estimate: a smaller pipe lowers the pressure (raising velocity
 * a little more) and the flow a little (lowering it); the two partly cancel.
 */
export function velocityAtBore(v1: number, d1: number, d2: number): number {
  return v1 * (d1 / d2) ** 2;
}

/**
 * Friction loss in a bore `d2` when the same mass flow loses `loss1` in bore
 * `d1`: Darcy-Weisbach at a fixed friction factor, dp ~ L m^2 / (rho D^5),
 * so loss2 = loss1 (d1/d2)^5. Valid for small loss/pressure ratios (the
 * incompressible limit); f rises a little in a smaller pipe (ignored).
 */
export function lossAtBore(loss1: number, d1: number, d2: number): number {
  return loss1 * (d1 / d2) ** 5;
}
