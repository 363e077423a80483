/**
 * Carrying velocity too low with ONE operator: a main sized for several
 * operators runs slow when one works alone, and debris drops out and plugs
 * it. The analysis gives each pipe's lowest single-operator velocity (tool
 * working) at its upstream end, where it is lowest.
 *
 * Thresholds: ACGIH Industrial Ventilation minimum duct design velocities by
 * material, the low end of each band, for horizontal runs. Vertical runs may
 * be a little slower (the choking velocity in a riser is below the saltation
 * velocity in a horizontal run: Klinzing et al., Mills), so horizontal governs
 * and vertical takes a factor of it.
 */
import type { DebrisClass, Finding, Pipe, SystemModel } from '../network/model.js';
import type { PipeAnalysis, SystemAnalysis } from '../analysis/analysis-types.js';
import type { Rule, RuleSettings } from './rule.js';
import { ruleFinding } from './finding.js';
import { isVertical } from './pipe-graph.js';
import { formatDiameter, formatPressure, formatVelocity } from './rule-format.js';
import { lossAtBore, sizeOptions, velocityAtBore } from './pipe-resize.js';

/** Feet per minute in m/s (exact from the international foot). */
const FPM = 0.3048 / 60;

/** Minimum horizontal velocity by debris class: low end of each ACGIH band (CHECKS.md). */
export const HORIZONTAL_CARRYING_VELOCITY: Readonly<Record<DebrisClass, number>> = {
  fine: 2500 * FPM, // very fine light dust 2500-3000 fpm (ACGIH)
  dry: 3000 * FPM, // dry dusts and powders 3000-4000 fpm (ACGIH)
  general: 3500 * FPM, // average industrial dust 3500-4000 fpm (ACGIH)
  heavy: 4000 * FPM, // heavy dust: sawdust, turnings, sand 4000-4500 fpm (ACGIH)
  moist: 4500 * FPM, // heavy or moist, 4500 fpm and up (ACGIH)
};

const DEBRIS_WORDS: Readonly<Record<DebrisClass, string>> = {
  fine: 'very fine light dust',
  dry: 'dry dust and powder',
  general: 'general debris',
  heavy: 'heavy debris',
  moist: 'heavy or moist debris',
};

/** The velocity a pipe needs with one operator: horizontal threshold, times the factor if vertical. */
export function carryingThreshold(pipe: Pipe, settings: RuleSettings): number {
  const horizontal = settings.value('minVelocity', pipe.rules);
  return isVertical(pipe) ? horizontal * settings.value('verticalFactor', pipe.rules) : horizontal;
}

/**
 * Vacuum to spare at the inlets a pipe serves, in their worst cases: the
 * least of (tool vacuum - need). Undefined when no served inlet states a need.
 */
export function spareVacuum(pipe: PipeAnalysis, analysis: SystemAnalysis): number | undefined {
  let spare: number | undefined;
  for (const name of pipe.servedInlets ?? []) {
    const wc = analysis.inlets?.find((i) => i.name === name)?.worstCase;
    if (!wc || wc.requiredToolVacuumPa === null) continue;
    const s = wc.toolVacuumPa - wc.requiredToolVacuumPa;
    if (Number.isFinite(s)) spare = spare === undefined ? s : Math.min(spare, s);
  }
  return spare;
}

export const slowCarryingVelocity: Rule = {
  code: 'slow-carrying-velocity',
  title: 'Carrying velocity too low with one operator',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'minVelocity',
      dimension: 'velocity',
      default: HORIZONTAL_CARRYING_VELOCITY.general,
      defaultByDebris: HORIZONTAL_CARRYING_VELOCITY,
      source:
        'ACGIH Industrial Ventilation minimum duct design velocities, low end of each band: fine 2500, dry 3000, general 3500, heavy 4000, moist 4500 fpm',
      description: 'Lowest velocity with one operator in a horizontal run.',
      range: [0, 200],
    },
    {
      name: 'verticalFactor',
      dimension: 'ratio',
      // From memory: dust-collection guidance quoting 3500 fpm vertical against
      // 4000 fpm horizontal (0.875); horizontal governs. Common practice.
      default: 0.875,
      source: 'from memory: 3500 fpm vertical vs 4000 fpm horizontal in dust-collection guidance; common practice',
      description: 'Vertical runs need this share of the horizontal velocity.',
      range: [0, 1.5],
    },
  ],
  needsAnalysis: true,
  check(model, analysis, settings) {
    if (!analysis) return [];
    return checkSlow(model, analysis, settings);
  },
};

function checkSlow(model: SystemModel, analysis: SystemAnalysis, settings: RuleSettings): Finding[] {
  const units = model.displayUnits ?? 'imperial';
  const debris = DEBRIS_WORDS[model.design?.debris] ?? 'the debris';
  // Settled combustible dust is a fuel deposit; NFPA 654 asks for a velocity that keeps it suspended.
  const dustNote = model.dust?.combustible ? ', and settled combustible dust is a fire and explosion hazard (NFPA 654)' : '';
  const findings: Finding[] = [];
  for (const pipe of model.pipes ?? []) {
    const pa = analysis.pipes?.find((p) => p.name === pipe.name);
    const v = pa?.minVelocityMPerS;
    if (!pa || v === null || v === undefined || !Number.isFinite(v)) continue;
    const need = carryingThreshold(pipe, settings);
    if (v >= need) continue;

    const d = pipe.insideDiameterM > 0 ? pipe.insideDiameterM : pa.insideDiameterM;
    const where = isVertical(pipe) ? 'a vertical run' : 'a horizontal run';
    const who = pa.minVelocityInlet ? ` with one operator at inlet '${pa.minVelocityInlet}'` : ' with one operator';
    let advice: string;
    let fix: Record<string, unknown> | undefined;

    const spare = spareVacuum(pa, analysis);
    const extraLoss = (dc: number) => (pa.lossPa === null ? 0 : lossAtBore(pa.lossPa, d, dc) - pa.lossPa);
    const fits = sizeOptions(pipe).filter((o) => o.insideDiameterM < d && velocityAtBore(v, d, o.insideDiameterM) >= need);
    const good = fits.filter((o) => spare === undefined || extraLoss(o.insideDiameterM) <= spare);
    if (good.length > 0 && d > 0) {
      // The largest size that carries: least added loss and least change.
      const pick = good[good.length - 1]!;
      const smallest = good[0]!;
      advice = `Use ${formatDiameter(pick.nominalSizeM, units)} (${pipe.spec.name}): about ${formatVelocity(velocityAtBore(v, d, pick.insideDiameterM), units)} with one operator${
        pa.lossPa === null ? '' : ` and about ${formatPressure(extraLoss(pick.insideDiameterM), units)} more loss with all operators`
      } (estimate; the analysis reruns on the new size).`;
      fix = {
        nominalSizeM: pick.nominalSizeM,
        insideDiameterM: pick.insideDiameterM,
        smallestNominalSizeM: smallest.nominalSizeM,
        estimatedVelocityMPerS: velocityAtBore(v, d, pick.insideDiameterM),
        estimatedExtraLossPa: extraLoss(pick.insideDiameterM),
      };
    } else if (fits.length > 0 && d > 0) {
      const pick = fits[fits.length - 1]!;
      advice = `The ${formatDiameter(pick.nominalSizeM, units)} size would carry, but would cost about ${formatPressure(extraLoss(pick.insideDiameterM), units)} more loss with all operators, more than the ${formatPressure(spare ?? 0, units)} the served inlets have to spare. Reroute or shorten the run, or split the inlets it serves between two smaller pipes.`;
    } else if (d > 0) {
      const bore = d * Math.sqrt(v / need);
      advice = `It needs a bore of at most ${formatDiameter(bore, units)}; no size of spec '${pipe.spec?.name}' fits, so choose a smaller spec size or split the inlets it serves.`;
      fix = { maxInsideDiameterM: bore };
    } else {
      advice = 'Choose a smaller size.';
    }
    findings.push(
      ruleFinding(
        slowCarryingVelocity,
        { kind: 'pipe', name: pipe.name, property: 'size' },
        `Pipe '${pipe.name}' runs at ${formatVelocity(v, units)}${who}, below the ${formatVelocity(need, units)} needed to carry ${debris} in ${where}: debris settles and plugs it${dustNote}. ${advice}`,
        {
          related: pa.minVelocityInlet
            ? [{ element: { kind: 'inlet', name: pa.minVelocityInlet }, message: 'the inlet whose lone operator gives the lowest velocity' }]
            : [],
          ...(fix ? { fix } : {}),
        },
      ),
    );
  }
  return findings;
}
