/**
 * The pipe element: isothermal compressible flow with friction (Churchill
 * 1977) and lumped fitting losses, as a two-port law for the network solver.
 * See isothermal-pipe.ts for the equation and its sources.
 */
import { R_AIR } from '../air/standard-air.js';
import { airViscosity } from '../air/viscosity.js';
import { churchillProduct, type FrictionProduct } from '../friction/churchill.js';
import { colebrookFrictionFactor } from '../friction/colebrook.js';
import { guardRoughness } from '../friction/friction-inputs.js';
import { isothermalChoking, isothermalFlow, isothermalOutletPressure, type IsothermalPipe } from './isothermal-pipe.js';
import { PipeFlowKernel, type PipeKernelResult } from './pipe-flow-kernel.js';
import type { PortFlow, TwoPortLaw, UpstreamPressure } from './two-port-law.js';

export interface PipeLawParams {
  /** Inside diameter, m. */
  diameterM: number;
  /** Length, m. */
  lengthM: number;
  /** Absolute wall roughness, m. */
  roughnessM: number;
  /** Sum of fitting loss coefficients on this pipe's velocity pressure. */
  sumK: number;
  /** Air temperature in the pipe, K. */
  temperatureK: number;
  /** Multiplies the friction factor (a hose calibrated from a measured loss); default 1. */
  frictionMultiplier?: number;
}

export type PipeParamProblem =
  | 'diameter-not-positive'
  | 'length-not-positive'
  | 'roughness-invalid'
  | 'sum-k-invalid'
  | 'temperature-not-positive'
  | 'multiplier-not-positive';

/** Pressures below this are taken as this, Pa (a solver overshoot must not give NaN). */
export const PRESSURE_FLOOR_PA = 1;
/** Shortest length used, m: a zero-length pipe (fittings only) keeps a finite zero-flow conductance. */
export const MIN_LENGTH_M = 1e-3;

/** What is wrong with the parameters, for the network builder to report; empty when usable. */
export function pipeParamProblems(p: PipeLawParams): PipeParamProblem[] {
  const out: PipeParamProblem[] = [];
  if (!(p.diameterM > 0) || !Number.isFinite(p.diameterM)) out.push('diameter-not-positive');
  if (!(p.lengthM > 0) || !Number.isFinite(p.lengthM)) out.push('length-not-positive');
  if (!(p.roughnessM >= 0) || !Number.isFinite(p.roughnessM)) out.push('roughness-invalid');
  if (!Number.isFinite(p.sumK) || p.sumK < 0) out.push('sum-k-invalid');
  if (!(p.temperatureK > 0) || !Number.isFinite(p.temperatureK)) out.push('temperature-not-positive');
  if (p.frictionMultiplier !== undefined && (!(p.frictionMultiplier > 0) || !Number.isFinite(p.frictionMultiplier))) {
    out.push('multiplier-not-positive');
  }
  return out;
}

export type FrictionModel = 'churchill' | 'colebrook';

interface GuardedPipe {
  lengthM: number;
  roughnessM: number;
  sumK: number;
  temperatureK: number;
  multiplier: number;
}

/** The guarded values of isothermalPipeOf (diameter checked by the caller). */
function guardedPipe(p: PipeLawParams): GuardedPipe {
  return {
    lengthM: Number.isFinite(p.lengthM) ? Math.max(MIN_LENGTH_M, p.lengthM) : MIN_LENGTH_M,
    roughnessM: Number.isFinite(p.roughnessM) && p.roughnessM > 0 ? p.roughnessM : 0,
    sumK: Number.isFinite(p.sumK) && p.sumK > 0 ? p.sumK : 0,
    temperatureK: Number.isFinite(p.temperatureK) && p.temperatureK > 0 ? p.temperatureK : 293.15,
    multiplier: p.frictionMultiplier !== undefined && Number.isFinite(p.frictionMultiplier) && p.frictionMultiplier > 0 ? p.frictionMultiplier : 1,
  };
}

/**
 * The pipe as the isothermal-flow core sees it, with guarded values:
 * length below 1 mm -> 1 mm; negative or non-finite roughness -> 0; negative
 * or non-finite sum K -> 0 (a lumped constant K cannot represent the
 * ejector gain of a converging tee); temperature not positive -> 293.15 K;
 * multiplier not positive -> 1. Returns undefined for a diameter that is
 * not positive (no pipe).
 */
export function isothermalPipeOf(p: PipeLawParams, model: FrictionModel = 'churchill'): IsothermalPipe | undefined {
  if (!(p.diameterM > 0) || !Number.isFinite(p.diameterM)) return undefined;
  const g = guardedPipe(p);
  const mult = g.multiplier;
  const rr = g.roughnessM / p.diameterM;
  const friction =
    model === 'churchill'
      ? (re: number): FrictionProduct => {
          const r = churchillProduct(re, rr);
          return { fRe: mult * r.fRe, dFReDRe: mult * r.dFReDRe };
        }
      : // Colebrook (turbulent) for reporting and checks; its derivative is not needed there.
        (re: number): FrictionProduct => ({ fRe: re > 0 ? mult * re * colebrookFrictionFactor(re, rr) : 64 * mult, dFReDRe: 0 });
  return { diameterM: p.diameterM, lengthM: g.lengthM, sumK: g.sumK, rt: R_AIR * g.temperatureK, viscosityPaS: airViscosity(g.temperatureK), friction };
}

function guardPressure(p: number): number {
  return Number.isFinite(p) && p > PRESSURE_FLOOR_PA ? p : PRESSURE_FLOOR_PA;
}

/**
 * A pipe as a two-port law: positive flow from port a to port b. Flow runs
 * from the higher to the lower pressure; pa == pb gives zero flow with the
 * finite laminar (Hagen-Poiseuille) derivative. Beyond isothermal choking the
 * flow is held at the maximum and `limited: 'choked'` is set.
 * Guards: see isothermalPipeOf; pressures below 1 Pa are taken as 1 Pa (the
 * derivatives are those at 1 Pa, so a solver is pushed back); a pipe with no
 * positive diameter is closed (zero flow, zero derivatives): report it with
 * pipeParamProblems before solving.
 * Evaluation goes through PipeFlowKernel (warm-started, no allocation with
 * `flowInto`); the choked branch through isothermalFlow.
 */
export function pipeLaw(params: PipeLawParams): TwoPortLaw {
  const pipe = isothermalPipeOf(params);
  if (!pipe) {
    return {
      flow: () => ({ massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 }),
      flowInto(_pa: number, _pb: number, out: PortFlow) {
        out.massFlowKgPerS = 0;
        out.dFlowDPa = 0;
        out.dFlowDPb = 0;
        out.limited = undefined;
      },
    };
  }
  const g = guardedPipe(params);
  const kernel = new PipeFlowKernel({
    diameterM: pipe.diameterM,
    lengthM: pipe.lengthM,
    sumK: pipe.sumK,
    rt: pipe.rt,
    viscosityPaS: pipe.viscosityPaS,
    relativeRoughness: guardRoughness(g.roughnessM / pipe.diameterM),
    multiplier: g.multiplier,
  });
  const r: PipeKernelResult = { massFlowKgPerS: 0, dFlowDP1: 0, dFlowDP2: 0, beyondChoking: false };
  const into = (pa: number, pb: number, out: PortFlow): void => {
    const a = guardPressure(pa);
    const b = guardPressure(pb);
    const forward = a >= b;
    const p1 = forward ? a : b;
    const p2 = forward ? b : a;
    kernel.solve(p1, p2, r);
    let m = r.massFlowKgPerS;
    let d1 = r.dFlowDP1;
    let d2 = r.dFlowDP2;
    out.limited = undefined;
    if (r.beyondChoking) {
      const c = isothermalFlow(pipe, p1, p2);
      m = c.massFlowKgPerS;
      d1 = c.dFlowDP1;
      d2 = c.dFlowDP2;
      if (c.choked) out.limited = 'choked';
    }
    if (forward) {
      out.massFlowKgPerS = m;
      out.dFlowDPa = d1;
      out.dFlowDPb = d2;
    } else {
      out.massFlowKgPerS = 0 - m; // 0 - x: no -0
      out.dFlowDPa = 0 - d2;
      out.dFlowDPb = 0 - d1;
    }
  };
  return {
    flow(pa: number, pb: number): PortFlow {
      const out: PortFlow = { massFlowKgPerS: 0, dFlowDPa: 0, dFlowDPb: 0 };
      into(pa, pb, out);
      if (out.limited === undefined) delete out.limited;
      return out;
    },
    flowInto: into,
    upstreamPressureInto(m: number, pDown: number, out: UpstreamPressure): boolean {
      if (!(m >= 0) || !Number.isFinite(m) || !(pDown > PRESSURE_FLOOR_PA) || !Number.isFinite(pDown)) return false;
      return kernel.upstreamPressure(m, pDown, out);
    },
  };
}

/** Mean velocity at absolute pressure p for mass flow m: v = m R T/(p A), m/s. Invalid inputs give 0. */
export function pipeVelocity(pressurePa: number, massFlowKgPerS: number, diameterM: number, temperatureK: number): number {
  if (!(pressurePa > 0) || !(diameterM > 0) || !(temperatureK > 0) || !Number.isFinite(massFlowKgPerS)) return 0;
  if (!Number.isFinite(pressurePa) || !Number.isFinite(diameterM) || !Number.isFinite(temperatureK)) return 0;
  return (Math.abs(massFlowKgPerS) * R_AIR * temperatureK) / (pressurePa * ((Math.PI * diameterM * diameterM) / 4));
}

/** Reynolds number Re = 4 |m| / (pi D mu(T)); invalid inputs give 0. */
export function pipeReynolds(massFlowKgPerS: number, diameterM: number, temperatureK: number): number {
  if (!(diameterM > 0) || !Number.isFinite(diameterM) || !Number.isFinite(massFlowKgPerS)) return 0;
  return (4 * Math.abs(massFlowKgPerS)) / (Math.PI * diameterM * airViscosity(temperatureK));
}

export type PipePressureDropResult =
  | { ok: true; outletPressurePa: number; dropPa: number }
  | { ok: false; reason: 'choked'; maxMassFlowKgPerS: number }
  | { ok: false; reason: 'invalid-input'; problems: PipeParamProblem[] };

/**
 * Pressure drop for a mass flow m (kg/s, >= 0; the sign is ignored) entering
 * at absolute inlet pressure p1: the outlet pressure on the physical branch
 * of the isothermal equation, or a typed failure when the flow exceeds the
 * choking flow or the inputs cannot describe a pipe. Friction by Churchill
 * (as the solver) or Colebrook-White (the check).
 */
export function pipePressureDrop(
  params: PipeLawParams,
  inletPressurePa: number,
  massFlowKgPerS: number,
  friction: FrictionModel = 'churchill',
): PipePressureDropResult {
  const pipe = isothermalPipeOf(params, friction);
  if (!pipe || !(inletPressurePa > 0) || !Number.isFinite(inletPressurePa) || !Number.isFinite(massFlowKgPerS)) {
    const problems = pipeParamProblems(params);
    return { ok: false, reason: 'invalid-input', problems: problems.length > 0 ? problems : [] };
  }
  const r = isothermalOutletPressure(pipe, inletPressurePa, Math.abs(massFlowKgPerS));
  if (!r.ok) return r;
  return { ok: true, outletPressurePa: r.outletPressurePa, dropPa: inletPressurePa - r.outletPressurePa };
}

/** Choking: the outlet pressure and mass flow at which the pipe chokes for inlet pressure p1. */
export function pipeChoking(params: PipeLawParams, inletPressurePa: number): { outletPressurePa: number; massFlowKgPerS: number } | undefined {
  const pipe = isothermalPipeOf(params);
  if (!pipe || !(inletPressurePa > 0) || !Number.isFinite(inletPressurePa)) return undefined;
  return isothermalChoking(pipe, inletPressurePa);
}
