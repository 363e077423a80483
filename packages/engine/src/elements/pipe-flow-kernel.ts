/**
 * The pipe law's hot path: the isothermal equation of isothermal-pipe.ts,
 *
 *   H(m) = m^2 (alpha fRe(Re(m))/m + sum K + 2 ln(p1/p2)) - (p1^2 - p2^2) A^2/(RT) = 0,
 *
 * solved for m with Churchill friction by safeguarded Newton, specialised
 * for speed: constants per pipe computed once, no allocation per call, and
 * a warm start. The network solver evaluates each pipe a few times per
 * iteration and many times per analysis, always close to its last flow, so
 * the start is the root of the equation with the friction term alpha
 * fRe/m held at its last value (an exact quadratic); since f varies slowly
 * with Re, that start is already within a small fraction of the root and
 * one to three Newton steps finish it. Newton converges quadratically (the
 * error after a step is about half the square of the step, relative), so
 * a step below STOP_STEP of m leaves m at the root to rounding without
 * another evaluation.
 *
 * Same roots as `isothermalFlow` (to ~1e-14 of the flow); the choked branch
 * and other friction models stay there.
 */
import { churchillProductInto } from '../friction/churchill.js';
import type { UpstreamPressure } from './two-port-law.js';

// Stop when a Newton step is below this share of m (the flow's error left
// is then ~1e-18, the derivatives', taken one step back, ~1e-9 at worst and
// far less after the secant correction) or, safeguarded, when the bracket
// is below 1e-14 of m (our choices).
const STOP_STEP = 1e-9;
const STOP_BRACKET = 1e-14;
// The inverse stops on a pressure step below 1e-15 of the pressure: near
// rounding, so the forward law at the result gives back m (our choice).
const INVERSE_STOP = 1e-15;
// Iteration cap of the inner solve (never reached in practice; bisection
// alone would need ~50 steps for 1e-14 of a bracket, our choice).
const MAX_STEPS = 100;
// First guess without history: turbulent f L/D with f ~ 0.02 (common practice).
const TYPICAL_DARCY_F = 0.02;
// f Re of Churchill never falls below 64 (Hagen-Poiseuille), which bounds m,
// and is exactly 64 up to Re = 1 (churchill.ts).
const LAMINAR_F_RE = 64;
const LAMINAR_ONLY_RE = 1;

export interface PipeKernelInput {
  diameterM: number;
  lengthM: number;
  sumK: number;
  rt: number;
  viscosityPaS: number;
  /** Relative roughness e/D, already guarded to 0..0.5. */
  relativeRoughness: number;
  /** Friction multiplier (> 0). */
  multiplier: number;
}

/** Result of one solve, for p1 >= p2. */
export interface PipeKernelResult {
  massFlowKgPerS: number;
  dFlowDP1: number;
  dFlowDP2: number;
  /** The root lies past isothermal choking: the caller must use the choked branch. */
  beyondChoking: boolean;
}

export class PipeFlowKernel {
  private readonly a2rt: number;
  private readonly alpha: number;
  private readonly reynoldsPerFlow: number;
  private readonly typicalKf: number;
  private readonly rr: number;
  private readonly mult: number;
  private readonly sumK: number;
  private readonly fr = new Float64Array(2);
  /** alpha fRe/m (friction's share of the loss coefficient) at the last solved flow; NaN before any. */
  private lastKf = Number.NaN;

  constructor(p: PipeKernelInput) {
    const area = (Math.PI * p.diameterM * p.diameterM) / 4;
    this.a2rt = (area * area) / p.rt;
    this.alpha = (Math.PI * p.viscosityPaS * p.lengthM) / 4;
    this.reynoldsPerFlow = 4 / (Math.PI * p.diameterM * p.viscosityPaS);
    this.typicalKf = (TYPICAL_DARCY_F * p.lengthM) / p.diameterM;
    this.rr = p.relativeRoughness;
    this.mult = p.multiplier;
    this.sumK = p.sumK;
  }

  /** Flow and derivatives for p1 >= p2 > 0 (Pa), written into `out`. */
  solve(p1: number, p2: number, out: PipeKernelResult): void {
    const kq = this.sumK + 2 * Math.log(p1 / p2); // coefficient of m^2
    const a2rt = this.a2rt;
    const c = (p1 * p1 - p2 * p2) * a2rt;
    const alpha = this.alpha;
    const fr = this.fr;
    let m = 0;
    let slope: number;
    if (c > 0) {
      // Bracket: H(0) = -c < 0; H >= m alpha 64 mult + m^2 kq - c, so H >= 0 at either bound.
      let lo = 0;
      const laminar = alpha * LAMINAR_F_RE * this.mult;
      let hi = c / laminar;
      if (kq > 0) hi = Math.min(hi, Math.sqrt(c / kq));
      if (hi * this.reynoldsPerFlow <= LAMINAR_ONLY_RE) {
        // The root lies where Churchill's f Re is exactly 64 (Re <= 1): H is
        // the quadratic kq m^2 + laminar m - c, solved in closed form.
        m = (2 * c) / (laminar + Math.sqrt(laminar * laminar + 4 * kq * c));
        this.writeOut(p1, p2, m, laminar + 2 * m * kq, out);
        return;
      }
      const kf = this.lastKf;
      m = Math.sqrt(c / (kq + (kf > 0 ? kf : this.typicalKf)));
      if (!(m > lo && m < hi)) m = 0.5 * (lo + hi);
      slope = 0;
      let prevM = Number.NaN;
      let prevSlope = Number.NaN;
      for (let i = 0; i < MAX_STEPS; i++) {
        const re = m * this.reynoldsPerFlow;
        churchillProductInto(re, this.rr, fr);
        const fRe = this.mult * fr[0]!;
        const dFRe = this.mult * fr[1]!;
        const value = m * alpha * fRe + m * m * kq - c;
        slope = alpha * (fRe + re * dFRe) + 2 * m * kq;
        if (value === 0) break;
        if (value > 0) hi = m;
        else lo = m;
        let next = m - value / slope;
        const newton = next > lo && next < hi;
        if (!newton) next = 0.5 * (lo + hi);
        const step = next - m;
        if (newton && Math.abs(step) <= STOP_STEP * next) {
          // Done without evaluating at `next`: move the slope there along the
          // secant of the last two slopes (its error is then far below the step's).
          if (prevM === prevM && m !== prevM) slope += ((slope - prevSlope) / (m - prevM)) * step;
          m = next;
          break;
        }
        prevM = m;
        prevSlope = slope;
        m = next;
        if (hi - lo <= STOP_BRACKET * hi) break;
      }
      if (m > 0) this.lastKf = (alpha * this.mult * fr[0]!) / m;
    } else {
      slope = alpha * LAMINAR_F_RE * this.mult; // H'(0): laminar
    }
    this.writeOut(p1, p2, m, slope, out);
  }

  /**
   * The inverse: the inlet pressure p1 at which the pipe passes mass flow
   * m >= 0 to an outlet at p2 > 0, with dp1/dm = -H_m/H_p1 and dp1/dp2 =
   * -H_p2/H_p1. With m given, Re and so f are known (one friction
   * evaluation), and H(p1) = m alpha fRe + m^2 (sum K + 2 ln(p1/p2)) -
   * (p1^2 - p2^2) A^2/(RT) is concave and falling in p1 on the physical
   * branch, so Newton from the side of H > 0 converges monotonically after
   * its first step. False (out untouched) when the outlet would pass Mach
   * 1/sqrt(kappa), m^2 RT > (A p2)^2: no subsonic p1 exists (choking).
   */
  upstreamPressure(m: number, p2: number, out: UpstreamPressure): boolean {
    const a2rt = this.a2rt;
    const alpha = this.alpha;
    if (!(m > 0)) {
      out.pressurePa = p2;
      out.dPressureDFlow = (alpha * LAMINAR_F_RE * this.mult) / (2 * p2 * a2rt);
      out.dPressureDDown = 1;
      return true;
    }
    if (m * m > p2 * p2 * a2rt) return false;
    const re = m * this.reynoldsPerFlow;
    churchillProductInto(re, this.rr, this.fr);
    const fRe = this.mult * this.fr[0]!;
    const dFRe = this.mult * this.fr[1]!;
    const base = m * alpha * fRe + m * m * this.sumK; // H without the acceleration and pressure terms
    const m2 = m * m;
    let p1 = Math.sqrt(p2 * p2 + base / a2rt); // the root without acceleration: H > 0 there
    let hp1 = 0;
    for (let i = 0; i < MAX_STEPS; i++) {
      const h = base + 2 * m2 * Math.log(p1 / p2) - (p1 * p1 - p2 * p2) * a2rt;
      hp1 = (2 * m2) / p1 - 2 * p1 * a2rt;
      if (!(hp1 < 0)) return false;
      const step = -h / hp1;
      p1 += step;
      if (Math.abs(step) <= INVERSE_STOP * p1) break;
    }
    hp1 = (2 * m2) / p1 - 2 * p1 * a2rt;
    const hp2 = (-2 * m2) / p2 + 2 * p2 * a2rt;
    const hm = alpha * (fRe + re * dFRe) + 2 * m * (this.sumK + 2 * Math.log(p1 / p2));
    out.pressurePa = p1;
    out.dPressureDFlow = -hm / hp1;
    out.dPressureDDown = -hp2 / hp1;
    this.lastKf = (alpha * fRe) / m;
    return true;
  }

  /** Flow and its derivatives dm/dp = -H_p / H_m from the implicit-function theorem. */
  private writeOut(p1: number, p2: number, m: number, slope: number, out: PipeKernelResult): void {
    const a2rt = this.a2rt;
    const hp1 = (2 * m * m) / p1 - 2 * p1 * a2rt;
    const hp2 = (-2 * m * m) / p2 + 2 * p2 * a2rt;
    out.massFlowKgPerS = m;
    out.dFlowDP1 = slope > 0 ? -hp1 / slope : 0;
    out.dFlowDP2 = slope > 0 ? -hp2 / slope : 0;
    // Physical branch: outlet velocity m RT/(p2 A) at most sqrt(RT), i.e. H_p2 >= 0.
    out.beyondChoking = hp2 < 0;
  }
}
