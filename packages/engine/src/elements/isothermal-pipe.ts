/**
 * Isothermal compressible flow with friction and lumped fitting losses in a
 * round pipe (Crane Technical Paper 410, isothermal flow equation; Shapiro,
 * The Dynamics and Thermodynamics of Compressible Fluid Flow, 1953, ch. 6):
 *
 *   p1^2 - p2^2 = (m/A)^2 R T [ f L/D + sum K + 2 ln(p1/p2) ]
 *
 * m mass flow from the high-pressure end 1 to the low-pressure end 2. Re =
 * 4 m/(pi D mu) does not change along an isothermal pipe, so f is constant.
 * Multiplying by A^2/(RT) and writing m^2 f L/D = m alpha (f Re) with
 * alpha = pi mu L / 4 gives
 *
 *   H(m) = m alpha fRe(Re(m)) + m^2 (sum K + 2 ln(p1/p2)) - (p1^2 - p2^2) A^2/(RT) = 0,
 *
 * increasing in m (f Re never falls as Re rises), so for given p1 > p2 it
 * has exactly one root. The root is physical only while the outlet Mach
 * number is at most 1/sqrt(kappa), i.e. m sqrt(RT)/A <= p2 (isothermal
 * choking); for lower p2 the flow is held at the maximum m_max(p1), where
 * y - 1 - ln y = f L/D + sum K with y = (A p1)^2 / (m^2 R T).
 * Writing it with f Re keeps the zero-flow limit finite: there the law is
 * laminar (f Re = 64) and dm/dp is the Hagen-Poiseuille conductance.
 */
import type { FrictionProduct } from '../friction/churchill.js';
import { solveBracketed } from './scalar-solve.js';

export interface IsothermalPipe {
  /** Inside diameter, m (> 0). */
  diameterM: number;
  /** Length, m (> 0). */
  lengthM: number;
  /** Sum of fitting loss coefficients on this pipe's velocity pressure (>= 0). */
  sumK: number;
  /** R T of the gas, J/kg (> 0). */
  rt: number;
  /** Dynamic viscosity, Pa s (> 0). */
  viscosityPaS: number;
  /** f Re and d(f Re)/dRe at a Reynolds number >= 0 (any friction multiplier included). */
  friction: (re: number) => FrictionProduct;
  /** Keep the 2 ln(p1/p2) acceleration term (default true); false gives the mean-density Darcy-Weisbach form. */
  accelerationTerm?: boolean;
}

export interface IsothermalFlow {
  /** Mass flow from end 1 to end 2, kg/s (>= 0). */
  massFlowKgPerS: number;
  /** dm/dp1, kg/(s Pa). */
  dFlowDP1: number;
  /** dm/dp2, kg/(s Pa) (0 when choked). */
  dFlowDP2: number;
  /** The flow is held at the isothermal choking limit. */
  choked: boolean;
}

interface Derived {
  area: number;
  alpha: number;
  reynoldsPerFlow: number;
}

function derive(pipe: IsothermalPipe): Derived {
  const area = (Math.PI * pipe.diameterM * pipe.diameterM) / 4;
  return {
    area,
    alpha: (Math.PI * pipe.viscosityPaS * pipe.lengthM) / 4,
    reynoldsPerFlow: 4 / (Math.PI * pipe.diameterM * pipe.viscosityPaS),
  };
}

/**
 * Mass flow and derivatives for end pressures p1 >= p2 > 0 (Pa). The caller
 * validates the pipe (positive sizes, R T and viscosity) and orders the ends.
 */
export function isothermalFlow(pipe: IsothermalPipe, p1: number, p2: number): IsothermalFlow {
  const d = derive(pipe);
  const accel = pipe.accelerationTerm !== false;
  const lambda = accel ? Math.log(p1 / p2) : 0;
  const kq = pipe.sumK + 2 * lambda; // coefficient of m^2
  const a2rt = (d.area * d.area) / pipe.rt;
  const c = (p1 * p1 - p2 * p2) * a2rt;

  const h = (m: number) => {
    const re = m * d.reynoldsPerFlow;
    const fr = pipe.friction(re);
    return {
      value: m * d.alpha * fr.fRe + m * m * kq - c,
      slope: d.alpha * (fr.fRe + re * fr.dFReDRe) + 2 * m * kq,
    };
  };

  let m = 0;
  if (c > 0) {
    const fRe0 = pipe.friction(0).fRe;
    // H(m) >= m alpha fRe(0) + m^2 kq - c, so either bound makes H >= 0.
    let hi = Number.POSITIVE_INFINITY;
    if (fRe0 > 0 && d.alpha > 0) hi = c / (d.alpha * fRe0);
    if (kq > 0) hi = Math.min(hi, Math.sqrt(c / kq));
    if (!Number.isFinite(hi)) hi = Math.sqrt(c) + 1;
    for (let i = 0; i < 200 && h(hi).value < 0; i++) hi *= 2;
    // Start from the turbulent estimate with f L/D ~ 0.02 L/D (common practice), inside the bracket.
    const guess = Math.sqrt(c / (kq + (0.02 * pipe.lengthM) / pipe.diameterM));
    // H(0) = -c < 0 and H(hi) >= 0: the signs are known, so the solver need not evaluate the ends.
    m = solveBracketed(h, 0, hi, guess, { relTol: 1e-14, rising: true });
  }

  const at = h(m);
  const hm = at.slope;
  const hp1 = (accel ? (2 * m * m) / p1 : 0) - 2 * p1 * a2rt;
  const hp2 = (accel ? (-2 * m * m) / p2 : 0) + 2 * p2 * a2rt;
  // Physical branch: outlet velocity m RT/(p2 A) at most sqrt(RT), i.e. H_p2 >= 0.
  if (!accel || hp2 >= 0) {
    return { massFlowKgPerS: m, dFlowDP1: hm > 0 ? -hp1 / hm : 0, dFlowDP2: hm > 0 ? -hp2 / hm : 0, choked: false };
  }
  return chokedFlow(pipe, d, p1);
}

/**
 * The maximum (choking) mass flow for inlet pressure p1 and its derivative:
 * Phi(m) = y - 1 - ln y - (alpha fRe/m + sum K) = 0, y = (A p1)^2/(m^2 RT).
 */
function chokedFlow(pipe: IsothermalPipe, d: Derived, p1: number): IsothermalFlow {
  const sonic = (d.area * p1) / Math.sqrt(pipe.rt); // flow with outlet Mach 1/sqrt(kappa) at p2 = p1
  const phi = (m: number) => {
    const y = (sonic * sonic) / (m * m);
    const re = m * d.reynoldsPerFlow;
    const fr = pipe.friction(re);
    const kt = (d.alpha * fr.fRe) / m + pipe.sumK;
    const dKt = (d.alpha * (re * fr.dFReDRe - fr.fRe)) / (m * m);
    return { value: y - 1 - Math.log(y) - kt, slope: (-2 * (y - 1)) / m - dKt };
  };
  // Phi > 0 for small m (y ~ 1/m^2 outgrows the laminar 1/m), Phi(sonic) = -Kt < 0.
  let lo = sonic * 1e-3;
  for (let i = 0; i < 60 && phi(lo).value <= 0; i++) lo *= 1e-3;
  const m = solveBracketed(phi, lo, sonic, 0.5 * sonic, { relTol: 1e-14, logBisection: true, rising: false });
  const at = phi(m);
  const y = (sonic * sonic) / (m * m);
  const dPhiDp1 = (2 * (y - 1)) / p1;
  const dm = at.slope !== 0 ? -dPhiDp1 / at.slope : m / p1;
  return { massFlowKgPerS: m, dFlowDP1: dm, dFlowDP2: 0, choked: true };
}

/** Outlet pressure at which a pipe with inlet p1 chokes, and the choking mass flow. */
export function isothermalChoking(pipe: IsothermalPipe, p1: number): { outletPressurePa: number; massFlowKgPerS: number } {
  const d = derive(pipe);
  const { massFlowKgPerS } = chokedFlow(pipe, d, p1);
  return { outletPressurePa: (massFlowKgPerS * Math.sqrt(pipe.rt)) / d.area, massFlowKgPerS };
}

export type OutletPressureResult =
  | { ok: true; outletPressurePa: number }
  | { ok: false; reason: 'choked'; maxMassFlowKgPerS: number };

/**
 * Outlet pressure p2 for inlet pressure p1 and mass flow m >= 0: solves
 * F(p2) = p1^2 - p2^2 - G^2 RT [K_t + 2 ln(p1/p2)] = 0 on the physical branch
 * p2 > G sqrt(RT), where F falls with p2. A flow above the choking flow has
 * no such p2: typed failure with the maximum flow.
 */
export function isothermalOutletPressure(pipe: IsothermalPipe, p1: number, m: number): OutletPressureResult {
  const d = derive(pipe);
  if (m <= 0) return { ok: true, outletPressurePa: p1 };
  const accel = pipe.accelerationTerm !== false;
  const re = m * d.reynoldsPerFlow;
  const kt = (d.alpha * pipe.friction(re).fRe) / m + pipe.sumK;
  const g2rt = ((m / d.area) * (m / d.area)) * pipe.rt;
  const f = (p2: number) => ({
    value: p1 * p1 - p2 * p2 - g2rt * (kt + (accel ? 2 * Math.log(p1 / p2) : 0)),
    slope: -2 * p2 + (accel ? (2 * g2rt) / p2 : 0),
  });
  const pStar = accel ? Math.sqrt(g2rt) : 0;
  if (pStar >= p1 || f(Math.max(pStar, Number.MIN_VALUE)).value < 0) {
    return { ok: false, reason: 'choked', maxMassFlowKgPerS: chokedFlow(pipe, d, p1).massFlowKgPerS };
  }
  const p2 = solveBracketed(f, Math.max(pStar, Number.MIN_VALUE), p1, p1 - (g2rt * kt) / (2 * p1), { relTol: 1e-15, rising: false });
  return { ok: true, outletPressurePa: p2 };
}
