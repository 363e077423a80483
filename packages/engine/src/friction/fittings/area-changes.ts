/**
 * Reducers and expansions in the direction of flow, and a helper to move a
 * loss coefficient from one diameter's velocity pressure to another's.
 */

export interface AreaChangeInput {
  /** Inside diameter the air comes from, m. */
  upstreamDiameterM: number;
  /** Inside diameter the air goes into, m. */
  downstreamDiameterM: number;
  /** Included (total cone) angle, rad; pi for a sudden change. Default: standard concentric reducer. */
  includedAngleRad?: number;
}

export interface AreaChangeK {
  /** K on the upstream pipe's velocity pressure. */
  onUpstream: number;
  /** K on the downstream pipe's velocity pressure. */
  onDownstream: number;
}

/** Included angle of a standard concentric reducer, rad (30 deg: common practice, from memory). */
export const STANDARD_REDUCER_ANGLE_RAD = Math.PI / 6;

/** Borda-Carnot sudden expansion: K = (1 - A1/A2)^2 on the small (upstream) pipe's velocity pressure. */
export function suddenExpansionK(smallDiameterM: number, largeDiameterM: number): number {
  const beta = ratio(smallDiameterM, largeDiameterM);
  return (1 - beta * beta) ** 2;
}

/**
 * Loss of a concentric area change by the Crane method (Crane TP-410 (2009),
 * "contraction and enlargement"), beta = d_small / d_large, theta included angle:
 *   enlargement, on the small pipe: K1 = 2.6 sin(theta/2) (1 - beta^2)^2 for theta <= 45 deg,
 *                                   K1 = (1 - beta^2)^2 (Borda-Carnot) above;
 *   contraction, on the small pipe: K1 = 0.8 sin(theta/2) (1 - beta^2) for theta <= 45 deg,
 *                                   K1 = 0.5 sqrt(sin(theta/2)) (1 - beta^2) above;
 *   on the large pipe: K2 = K1 / beta^4.
 * Equal or invalid diameters give 0. The angle is held to 0..180 deg.
 */
export function areaChangeK(input: AreaChangeInput): AreaChangeK {
  const d1 = input.upstreamDiameterM;
  const d2 = input.downstreamDiameterM;
  if (!(d1 > 0) || !(d2 > 0) || !Number.isFinite(d1) || !Number.isFinite(d2) || d1 === d2) {
    return { onUpstream: 0, onDownstream: 0 };
  }
  const theta = clampAngle(input.includedAngleRad ?? STANDARD_REDUCER_ANGLE_RAD);
  const beta = Math.min(d1, d2) / Math.max(d1, d2);
  const b2 = beta * beta;
  const half = Math.sin(theta / 2);
  // 45 deg boundary between the gradual and abrupt forms: Crane TP-410.
  const gradual = theta <= Math.PI / 4;
  const kSmall = d1 < d2
    ? (gradual ? 2.6 * half : 1) * (1 - b2) ** 2
    : (gradual ? 0.8 * half : 0.5 * Math.sqrt(half)) * (1 - b2);
  const kLarge = kSmall / (b2 * b2);
  return d1 < d2 ? { onUpstream: kSmall, onDownstream: kLarge } : { onUpstream: kLarge, onDownstream: kSmall };
}

/**
 * A loss coefficient on diameter `fromM`'s velocity pressure expressed on
 * diameter `toM`'s: same loss, VP scales as 1/D^4 at equal flow, so
 * K_to = K_from (D_to / D_from)^4. Invalid diameters give K unchanged.
 */
export function rescaleK(k: number, fromDiameterM: number, toDiameterM: number): number {
  if (!(fromDiameterM > 0) || !(toDiameterM > 0) || !Number.isFinite(fromDiameterM) || !Number.isFinite(toDiameterM)) return k;
  return k * (toDiameterM / fromDiameterM) ** 4;
}

function ratio(small: number, large: number): number {
  if (!(small > 0) || !(large > 0) || !Number.isFinite(small) || !Number.isFinite(large)) return 1;
  return Math.min(small, large) / Math.max(small, large);
}

function clampAngle(theta: number): number {
  return Number.isFinite(theta) ? Math.min(Math.PI, Math.max(0, Math.abs(theta))) : STANDARD_REDUCER_ANGLE_RAD;
}
