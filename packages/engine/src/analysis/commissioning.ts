/**
 * Commissioning predictions: the vacuum a gauge at each inlet valve should
 * read with a test orifice in the valve, while the partner inlets of its
 * worst case also hold test orifices (repeatable on site without
 * operators), and, when asked, with the orifice alone.
 *
 * Test orifice sizes, common practice (no published source): 1/2, 5/8 and
 * 7/8 in stand for narrow carpet, wide carpet and floor tools; 5/8 in is the
 * default.
 */
import type { AnalysisFailure, Commissioning, WorstCase } from './analysis-types.js';
import type { SetEvaluator } from './set-evaluator.js';

/** Default test orifice, m (5/8 in; common practice). */
export const DEFAULT_TEST_ORIFICE_M = 0.625 * 0.0254;

export function commissioningPredictions(
  evaluator: SetEvaluator,
  worst: readonly (WorstCase | null)[],
  orifice: { diameterM: number; dischargeCoefficient: number },
  withAlone = false,
): { commissioning: Commissioning; failures: AnalysisFailure[] } {
  const names = evaluator.names;
  const index = new Map(names.map((n, i) => [n, i]));
  const failures: AnalysisFailure[] = [];
  const inlets: Commissioning['inlets'] = [];
  names.forEach((name, i) => {
    const wc = worst[i];
    const members = wc ? wc.openInlets.map((n) => index.get(n)!).filter((x) => x !== undefined) : [i];
    const res = evaluator.evaluate(members);
    const alone = withAlone ? evaluator.evaluate([i]) : null;
    if (!res.ok) {
      failures.push({
        stage: 'commissioning',
        subject: name,
        openInlets: members.map((m) => names[m]!),
        cause: res.failure.cause,
        element: res.failure.element,
        message: res.failure.message,
      });
      return;
    }
    const mine = res.points.find((p) => p.name === name)!;
    inlets.push({
      name,
      gaugeVacuumPa: mine.inletVacuumPa,
      flowStdM3PerS: mine.flowStdM3PerS,
      openInlets: [name, ...members.filter((m) => m !== i).map((m) => names[m]!)],
      aloneGaugeVacuumPa: alone?.ok ? alone.points[0]!.inletVacuumPa : null,
    });
  });
  return { commissioning: { testOrificeDiameterM: orifice.diameterM, dischargeCoefficient: orifice.dischargeCoefficient, inlets }, failures };
}
