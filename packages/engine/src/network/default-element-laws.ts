/**
 * The engine's own element physics as the graph builder's law set: pipes
 * and hoses by isothermal compressible flow (Churchill friction), tools by
 * isentropic nozzle flow or a measured table, separators and filters by a
 * rated quadratic loss, producers by their PCHIP curve; fitting losses from
 * the fitting tables.
 */
import { R_AIR, STANDARD_DENSITY } from '../air/standard-air.js';
import { hoseLaw } from '../elements/hose-law.js';
import { pipeLaw } from '../elements/pipe-law.js';
import { producerLaw, usableCurve } from '../elements/producer-law.js';
import { ratedLossLaw } from '../elements/rated-loss-law.js';
import { toolLaw } from '../elements/tool-law.js';
import { areaChangeK } from '../friction/fittings/area-changes.js';
import { bendLossCoefficient } from '../friction/fittings/bends.js';
import { junctionEntryK } from '../friction/fittings/branch-entries.js';
import type { ElementLaws } from './element-laws.js';

export const defaultElementLaws: ElementLaws = {
  pipe: (input) => pipeLaw(input),
  hose: (hose, ambientPa, temperatureK) => hoseLaw(hose, ambientPa, temperatureK),
  tool: (law, ambientPa, temperatureK) => toolLaw(law, ambientPa, temperatureK),
  ratedLoss: (rated, temperatureK) => ratedLossLaw(rated, temperatureK),
  producer: (unit, site) => producerLaw(unit, site.temperatureK),
  producerCurveEndFlow: (unit, inletPressurePa, temperatureK) => {
    const pts = usableCurve(unit.model.curve);
    const qMax = pts.length > 0 ? pts[pts.length - 1]!.flowM3PerS : 0;
    // Standard basis: m = Q rho_std; actual basis: m = Q p / (R T) at the producer inlet.
    return unit.model.flowBasis === 'actual' ? (qMax * inletPressurePa) / (R_AIR * temperatureK) : qMax * STANDARD_DENSITY;
  },
  bendK: (angleRad, radiusRatio, diameterM) => bendLossCoefficient(angleRad, radiusRatio, diameterM),
  junctionK: (junction) => junctionEntryK(junction),
  transitionK: (upstreamDiameterM, downstreamDiameterM, includedAngleRad) =>
    areaChangeK({ upstreamDiameterM, downstreamDiameterM, includedAngleRad }).onUpstream,
};
