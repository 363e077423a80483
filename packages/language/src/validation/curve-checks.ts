import type { ValidationAcceptor } from 'langium';
import type { Curve } from '../generated/ast.js';
import { expectationFor } from '../semantics/quantity-expectations.js';
import { readQuantity } from '../semantics/read-quantity.js';
import { StructureCodes } from './codes.js';

/**
 * A curve needs two points or more, listed by rising flow. A producer's
 * vacuum falls (or holds) as its flow rises; a tool passes more air the more
 * vacuum it sees, so its vacuum rises with flow. Either way the curve must be
 * monotone, or the interpolation between its points means nothing.
 */
export function checkCurve(curve: Curve, accept: ValidationAcceptor): void {
  if (curve.points.length < 2) {
    accept('error', 'A curve needs at least two points (at <flow> <vacuum>).', {
      node: curve,
      keyword: 'curve',
      code: StructureCodes.curveTooShort,
    });
    return;
  }
  const isProducer = curve.$container.$type === 'ProducerModel';
  const values = curve.points.map((point) => {
    const flow = point.flow && readQuantity(point.flow, expectationFor(point.flow)!);
    const vacuum = point.vacuum && readQuantity(point.vacuum, expectationFor(point.vacuum)!);
    return flow?.ok && vacuum?.ok ? { flow: flow.si, vacuum: vacuum.si } : undefined;
  });
  for (let i = 1; i < values.length; i++) {
    const previous = values[i - 1];
    const current = values[i];
    if (!previous || !current) continue;
    if (current.flow <= previous.flow) {
      accept('error', 'List curve points by rising flow; this flow is not above the one before.', {
        node: curve.points[i]!,
        property: 'flow',
        code: StructureCodes.curveNotMonotone,
      });
      return;
    }
    const wrongWay = isProducer ? current.vacuum > previous.vacuum : current.vacuum < previous.vacuum;
    if (wrongWay) {
      accept(
        'error',
        isProducer
          ? "A producer's vacuum cannot rise as its flow rises; this point's vacuum is above the one before."
          : "A tool's vacuum rises with the air it passes; this point's vacuum is below the one before.",
        { node: curve.points[i]!, property: 'vacuum', code: StructureCodes.curveNotMonotone },
      );
      return;
    }
  }
}
