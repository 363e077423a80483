/**
 * Standard air and the gas constants the engine uses for dry air.
 *
 * Standard flow (scfm, Sm3/h) in this product is dry air at 20 C (68 F) and
 * 101.325 kPa, density 1.2041 kg/m3 (ideal gas with R below). The trade's
 * "0.075 lb/ft3" is 1.2014 kg/m3, 0.2 % lighter; we use 1.2041 consistently.
 */

/** Specific gas constant of dry air, J/(kg K): US Standard Atmosphere 1976 gives 287.053; ENGINEERING.md uses 287.05. */
export const R_AIR = 287.05;
/** Ratio of specific heats of dry air near room temperature (common value, e.g. Shapiro 1953). */
export const KAPPA_AIR = 1.4;
/** Standard temperature for standard flow, K (20 C; ENGINEERING.md, trade definition of scfm used here). */
export const STANDARD_TEMPERATURE_K = 293.15;
/** Standard pressure for standard flow, Pa (1 standard atmosphere, ISO 2533 / US Standard Atmosphere 1976). */
export const STANDARD_PRESSURE_PA = 101325;
/** Density of standard air, kg/m3: p / (R T) = 101325 / (287.05 x 293.15) = 1.20412. */
export const STANDARD_DENSITY = STANDARD_PRESSURE_PA / (R_AIR * STANDARD_TEMPERATURE_K);
/** Default system air temperature, K (20 C / 68 F, ENGINEERING.md). */
export const DEFAULT_TEMPERATURE_K = 293.15;
