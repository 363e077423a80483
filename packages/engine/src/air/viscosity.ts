/**
 * Dynamic viscosity of air by Sutherland's law.
 */

// Sutherland constant for air, K (US Standard Atmosphere 1976).
const SUTHERLAND_S_K = 110.4;
// beta = 1.458e-6 kg/(m s K^0.5) (US Standard Atmosphere 1976); the same law
// as mu_ref = 1.716e-5 Pa s at 273.15 K to 4 digits (beta gives 1.7161e-5 there).
const SUTHERLAND_BETA = 1.458e-6;
/** Temperatures outside this band are clamped, K (the law fits air well from ~100 K to ~1900 K). */
export const VISCOSITY_RANGE_K = { min: 100, max: 1900 } as const;

/**
 * mu = beta T^1.5 / (T + S), Pa s, T in K (Sutherland 1893; constants from
 * US Standard Atmosphere 1976). Gives 1.8134e-5 Pa s at 20 C. T is clamped
 * to 100..1900 K; a non-finite T is taken as 293.15 K.
 */
export function airViscosity(temperatureK: number): number {
  const t = Number.isFinite(temperatureK)
    ? Math.min(VISCOSITY_RANGE_K.max, Math.max(VISCOSITY_RANGE_K.min, temperatureK))
    : 293.15;
  return (SUTHERLAND_BETA * Math.pow(t, 1.5)) / (t + SUTHERLAND_S_K);
}
