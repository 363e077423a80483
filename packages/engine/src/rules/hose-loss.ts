/**
 * Excessive hose loss: the hose is the largest single restriction in most
 * systems; a long or narrow hose throws away the vacuum the piping
 * delivered. Trade figure: hoses of 25-100 ft can lose up to about 10 inHg
 * at the long, narrow end. Checked in the inlet's worst case and alone
 * (the lone operator draws most air, so loses most in the hose).
 */
import type { Finding } from '../network/model.js';
import type { Rule } from './rule.js';
import { ruleFinding } from './finding.js';
import { formatDiameter, formatLength, formatPercentApart, formatPressure } from './rule-format.js';

/** Conventional inch of mercury, Pa (NIST SP 811). */
const INHG_PA = 3386.389;

export const hoseLoss: Rule = {
  code: 'hose-loss',
  title: 'Excessive hose loss',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'share',
      dimension: 'fraction',
      // Half the inlet vacuum lost in the hose: common practice.
      default: 0.5,
      source: 'common practice',
      description: 'Largest share of the vacuum at the inlet valve the hose may lose.',
      range: [0, 1],
    },
    {
      name: 'absolute',
      dimension: 'pressure',
      // 10 inHg: the trade's upper figure for 25-100 ft hoses at the long, narrow end; common practice.
      default: 10 * INHG_PA,
      source: 'common practice: 25-100 ft hoses lose up to about 10 inHg at the long, narrow end',
      description: 'Largest vacuum the hose may lose.',
      range: [0, 101325],
    },
  ],
  needsAnalysis: true,
  check(model, analysis, settings) {
    if (!analysis) return [];
    const units = model.displayUnits ?? 'imperial';
    const findings: Finding[] = [];
    for (const inlet of model.inlets ?? []) {
      const ia = analysis.inlets?.find((i) => i.name === inlet.name);
      if (!ia) continue;
      const shareLimit = settings.value('share', inlet.rules);
      const absolute = settings.value('absolute', inlet.rules);
      const cases = [
        ia.worstCase && { label: 'in its worst case', loss: ia.worstCase.hoseLossPa, vacuum: ia.worstCase.inletVacuumPa },
        ia.alone && { label: 'with its operator alone', loss: ia.alone.hoseLossPa, vacuum: ia.alone.inletVacuumPa },
      ].filter((c): c is { label: string; loss: number; vacuum: number } => !!c && Number.isFinite(c.loss) && Number.isFinite(c.vacuum));
      // The case that breaks the limits furthest: largest loss over what it may lose.
      let worst: { label: string; loss: number; vacuum: number; allowed: number } | undefined;
      for (const c of cases) {
        const allowed = Math.min(absolute, c.vacuum > 0 ? shareLimit * c.vacuum : absolute);
        if (c.loss > allowed && (!worst || c.loss / allowed > worst.loss / worst.allowed)) worst = { ...c, allowed };
      }
      if (!worst) continue;
      const share = worst.vacuum > 0 ? worst.loss / worst.vacuum : 1;
      const hose = inlet.hose;
      const [shareText, shareLimitText] = formatPercentApart(share, shareLimit);
      const which = worst.loss > absolute ? `more than ${formatPressure(absolute, units)}` : `more than ${shareLimitText} of the vacuum at the valve`;
      // Friction dominates: loss ~ length, and ~ bore^-5 at the same flow (Darcy-Weisbach).
      const ratio = worst.allowed > 0 ? worst.loss / worst.allowed : Number.POSITIVE_INFINITY;
      const maxLength = hose && Number.isFinite(ratio) ? hose.lengthM / ratio : undefined;
      const minBore = hose && Number.isFinite(ratio) ? hose.boreM * ratio ** 0.2 : undefined;
      const advice =
        maxLength !== undefined && minBore !== undefined
          ? `Shorten the hose to about ${formatLength(maxLength, units)} or use a bore of about ${formatDiameter(minBore, units)} or more (estimates), or add an inlet closer to the area.`
          : 'Use a shorter or larger hose, or add an inlet closer to the area.';
      findings.push(
        ruleFinding(
          hoseLoss,
          { kind: 'inlet', name: inlet.name, property: 'hose' },
          `The hose at inlet '${inlet.name}'${hose ? ` ('${hose.name}', ${formatLength(hose.lengthM, units)} x ${formatDiameter(hose.boreM, units)})` : ''} loses ${formatPressure(worst.loss, units)} ${worst.label}, ${shareText} of the ${formatPressure(worst.vacuum, units)} at the valve: ${which}. ${advice}`,
          {
            related: hose ? [{ element: { kind: 'hose-kind', name: hose.name }, message: 'the hose kind' }] : [],
            fix: {
              hoseLossPa: worst.loss,
              allowedLossPa: worst.allowed,
              ...(maxLength !== undefined ? { maxHoseLengthM: maxLength } : {}),
              ...(minBore !== undefined ? { minHoseBoreM: minBore } : {}),
            },
          },
        ),
      );
    }
    return findings;
  },
};
