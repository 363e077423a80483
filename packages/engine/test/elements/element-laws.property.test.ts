import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pipeLaw } from '../../src/elements/pipe-law.js';
import { ratedLossLaw } from '../../src/elements/rated-loss-law.js';
import { toolLaw } from '../../src/elements/tool-law.js';
import type { PortFlow } from '../../src/elements/two-port-law.js';

// Properties every two-port law must have for the Newton solver (two-port-law.ts):
// finite values, flow from high to low pressure, flow rising with pa and falling with pb.
function checkLaw(r: PortFlow, pa: number, pb: number): void {
  expect(Number.isFinite(r.massFlowKgPerS) && Number.isFinite(r.dFlowDPa) && Number.isFinite(r.dFlowDPb)).toBe(true);
  if (pa > pb) expect(r.massFlowKgPerS).toBeGreaterThanOrEqual(0);
  if (pa < pb) expect(r.massFlowKgPerS).toBeLessThanOrEqual(0);
  expect(r.dFlowDPa).toBeGreaterThanOrEqual(0);
  expect(r.dFlowDPb).toBeLessThanOrEqual(0);
}

const pressure = fc.double({ min: 5e3, max: 2e5, noNaN: true });

describe('element laws: properties over random inputs (fast-check)', () => {
  it('pipe law', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.005, max: 0.3, noNaN: true }),
        fc.double({ min: 0.01, max: 300, noNaN: true }),
        fc.double({ min: 0, max: 1e-3, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        pressure,
        pressure,
        (d, l, e, k, pa, pb) => {
          const law = pipeLaw({ diameterM: d, lengthM: l, roughnessM: e, sumK: k, temperatureK: 293.15 });
          checkLaw(law.flow(pa, pb), pa, pb);
          // more pressure difference, more flow (never the false root)
          const more = law.flow(pa + 1000, pb).massFlowKgPerS;
          expect(more).toBeGreaterThanOrEqual(law.flow(pa, pb).massFlowKgPerS - 1e-12);
        },
      ),
      { numRuns: 300 },
    );
  });
  it('tool and rated-loss laws', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.002, max: 0.05, noNaN: true }), fc.double({ min: 10, max: 1e4, noNaN: true }), pressure, pressure, (d, loss, pa, pb) => {
        checkLaw(toolLaw({ kind: 'orifice', diameterM: d, dischargeCoefficient: 0.61 }, 101325, 293.15).flow(pa, pb), pa, pb);
        checkLaw(ratedLossLaw({ lossPa: loss, flowStdM3PerS: d * 10 }, 293.15).flow(pa, pb), pa, pb);
      }),
      { numRuns: 300 },
    );
  });
});
