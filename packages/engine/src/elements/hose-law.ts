/**
 * The hose: a pipe with its own roughness, or calibrated from one measured
 * loss point, which fixes a friction multiplier on the Churchill factor.
 */
import { airDensity } from '../air/density.js';
import { massFlowFromStandard } from '../air/flow-basis.js';
import { R_AIR } from '../air/standard-air.js';
import { churchillProduct } from '../friction/churchill.js';
import type { HoseKind } from '../network/model.js';
import { pipeLaw, type PipeLawParams } from './pipe-law.js';
import type { TwoPortLaw } from './two-port-law.js';
import { airViscosity } from '../air/viscosity.js';

/**
 * Roughness of a vacuum cleaning hose when the file gives neither roughness
 * nor a measured point, m: 0.3 mm, inside ASHRAE Fundamentals ch. 21's range
 * for flexible duct fully extended (0.09-0.9 mm); our choice, from memory.
 */
export const DEFAULT_HOSE_ROUGHNESS_M = 0.3e-3;

/**
 * Plausible range of a calibrated friction multiplier: outside it the
 * measured point is more likely a typing or unit slip than a real hose
 * (0.1 to 20 times the rough-wall friction; our choice).
 */
export const HOSE_MULTIPLIER_RANGE = { min: 0.1, max: 20 } as const;

export type HoseCalibration =
  | { ok: true; frictionMultiplier: number }
  | { ok: false; reason: 'no-measured-point' | 'invalid-hose' | 'loss-too-large' | 'loss-too-small' | 'choked' };

/** The pipe parameters of a hose (no fittings: a hose's bends are in its measured or rough-wall loss). */
export function hosePipeParams(hose: HoseKind, temperatureK: number, frictionMultiplier = 1): PipeLawParams {
  return {
    diameterM: hose.boreM,
    lengthM: hose.lengthM,
    roughnessM: hose.roughnessM ?? DEFAULT_HOSE_ROUGHNESS_M,
    sumK: 0,
    temperatureK,
    frictionMultiplier,
  };
}

/**
 * The friction multiplier that makes the hose lose `measuredLoss.lossPa` at
 * its length and standard flow, with its upstream (tool) end at ambient
 * pressure (our reading of a loss test: the free end open to the room).
 * From the isothermal equation with f -> M f (Re is fixed by the flow):
 *   M = [ (p1^2 - p2^2) A^2 / (R T m^2) - 2 ln(p1/p2) ] / (f L/D),
 * f by Churchill at the hose's roughness (or the default). Fails when the loss
 * is not below ambient, would need a flow above isothermal choking at that
 * outlet pressure, or gives a multiplier outside HOSE_MULTIPLIER_RANGE.
 */
export function hoseFrictionMultiplier(hose: HoseKind, ambientPa: number, temperatureK: number): HoseCalibration {
  const point = hose.measuredLoss;
  if (!point) return { ok: false, reason: 'no-measured-point' };
  const d = hose.boreM;
  const l = hose.lengthM;
  const t = temperatureK;
  if (!(d > 0) || !(l > 0) || !(t > 0) || !(ambientPa > 0) || ![d, l, t, ambientPa].every(Number.isFinite)) {
    return { ok: false, reason: 'invalid-hose' };
  }
  if (!(point.lossPa > 0) || !(point.flowStdM3PerS > 0) || !Number.isFinite(point.lossPa) || !Number.isFinite(point.flowStdM3PerS)) {
    return { ok: false, reason: 'loss-too-small' };
  }
  const p1 = ambientPa;
  const p2 = ambientPa - point.lossPa;
  if (!(p2 > 0)) return { ok: false, reason: 'loss-too-large' };
  const m = massFlowFromStandard(point.flowStdM3PerS);
  const area = (Math.PI * d * d) / 4;
  const rt = R_AIR * t;
  // Outlet velocity above the isothermal sound speed sqrt(RT): past choking, no multiplier fits.
  if (m / (airDensity(p2, t) * area) > Math.sqrt(rt)) return { ok: false, reason: 'choked' };
  const re = (4 * m) / (Math.PI * d * airViscosity(t));
  const f = churchillProduct(re, (hose.roughnessM ?? DEFAULT_HOSE_ROUGHNESS_M) / d).fRe / re;
  const frictionShare = ((p1 * p1 - p2 * p2) * area * area) / (rt * m * m) - 2 * Math.log(p1 / p2);
  const multiplier = frictionShare / ((f * l) / d);
  if (!(multiplier >= HOSE_MULTIPLIER_RANGE.min) || !Number.isFinite(multiplier)) return { ok: false, reason: 'loss-too-small' };
  if (multiplier > HOSE_MULTIPLIER_RANGE.max) return { ok: false, reason: 'loss-too-large' };
  return { ok: true, frictionMultiplier: multiplier };
}

/**
 * A hose as a two-port law (see pipeLaw): calibrated from its measured point
 * when it has one and the calibration succeeds, otherwise a rough pipe
 * (its roughness, or DEFAULT_HOSE_ROUGHNESS_M). Report a failed calibration
 * with hoseFrictionMultiplier.
 */
export function hoseLaw(hose: HoseKind, ambientPa: number, temperatureK: number): TwoPortLaw {
  const calibration = hoseFrictionMultiplier(hose, ambientPa, temperatureK);
  return pipeLaw(hosePipeParams(hose, temperatureK, calibration.ok ? calibration.frictionMultiplier : 1));
}
