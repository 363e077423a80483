/**
 * The element law factories the graph builder uses, as one replaceable set:
 * the engine's physics by default (`default-element-laws.ts`), simple laws in
 * tests. Factories may throw on impossible input; the builder catches that
 * and marks the element invalid.
 */
import type { TwoPortLaw } from '../elements/two-port-law.js';
import type { HoseKind, Junction, ProducerUnit, RatedLoss, SiteAir, ToolLaw } from './model.js';

export interface PipeLawInput {
  diameterM: number;
  lengthM: number;
  roughnessM: number;
  /** Fittings lumped on the pipe's own velocity pressure. */
  sumK: number;
  temperatureK: number;
  frictionMultiplier?: number;
}

export interface ElementLaws {
  /** Pipe (or pipe segment): port a = far end, port b = producer side. */
  pipe(input: PipeLawInput): TwoPortLaw;
  /** Hose: port a = hose end, port b = inlet valve. */
  hose(hose: HoseKind, ambientPa: number, temperatureK: number): TwoPortLaw;
  /** Tool (or test orifice): port a = room, port b = hose end (or valve). */
  tool(law: ToolLaw, ambientPa: number, temperatureK: number): TwoPortLaw;
  /** Separator, filter: port a = inlet, port b = toward the producer. */
  ratedLoss(rated: RatedLoss, temperatureK: number): TwoPortLaw;
  /** Producer with its exhaust line: port a = producer inlet, port b = atmosphere. */
  producer(unit: ProducerUnit, site: SiteAir): TwoPortLaw;
  /**
   * The largest flow the producer's curve states, as mass flow at a producer
   * inlet pressure (kg/s): a case that needs more is beyond the curve.
   */
  producerCurveEndFlow?(unit: ProducerUnit, inletPressurePa: number, temperatureK: number): number;
  /** Loss coefficient of a bend on its own velocity pressure. */
  bendK(angleRad: number, radiusRatio: number, diameterM: number): number;
  /** Entry loss of a branch joining its parent (on the branch velocity pressure). */
  junctionK(junction: Junction): number;
  /**
   * Loss of a size change where air passes from a pipe of `upstreamDiameterM`
   * into its parent of `downstreamDiameterM`, on the upstream pipe's velocity
   * pressure; `includedAngleRad` undefined = standard concentric reducer.
   */
  transitionK(upstreamDiameterM: number, downstreamDiameterM: number, includedAngleRad?: number): number;
}
