/**
 * How many operators clean at once (the design operators k): from the
 * analysis options, the file, or the floor areas, the cleaning rates and
 * the cleaning window:
 *   k = ceil( sum(area / rate) / window ),  at least 1.
 */
import type { CleaningArea, SystemModel } from '../network/model.js';
import type { AnalysisOptions, OperatorCount } from './analysis-types.js';

/** Square metres per square foot (exact: 0.3048^2). */
const M2_PER_FT2 = 0.09290304;
const S_PER_H = 3600;

/**
 * Area one operator cleans per hour, by surface, ft2/h: common practice of
 * the trade, no published source. Carpet about 2,500; small rooms about
 * 1,500; bare floor 3,500-5,000 (the middle, 4,000, used here); large open
 * bare floor up to about 7,200.
 */
export const COMMON_PRACTICE_RATE_FT2_PER_H: Readonly<Record<CleaningArea['surface'], number>> = {
  carpet: 2500, // common practice
  'small-rooms': 1500, // common practice
  bare: 4000, // common practice (3,500-5,000)
  'open-bare': 7200, // common practice (up to about 7,200)
};

/** The common-practice rate of a surface, m2/s per operator. */
export function commonPracticeRateM2PerS(surface: CleaningArea['surface']): number {
  return (COMMON_PRACTICE_RATE_FT2_PER_H[surface] * M2_PER_FT2) / S_PER_H;
}

// A derived operator count is rounded up, less this slack, so that 2.0000001
// from rounding of the inputs stays 2 (our choice).
const ROUNDING_SLACK = 1e-9;

/** The design operator count and where it comes from. Never throws; bad numbers fall back. */
export function operatorCount(model: SystemModel, options: AnalysisOptions = {}): OperatorCount {
  const design = model.design ?? { areas: [], debris: 'general' };
  const fromAreas = areaDerivation(design.areas ?? [], design.cleaningWindowS);
  const valid = (n: number | undefined): n is number => n !== undefined && Number.isFinite(n) && n >= 1;
  if (valid(options.operators)) return { count: Math.floor(options.operators), source: 'options', fromAreas };
  if (valid(design.operators)) return { count: Math.floor(design.operators), source: 'stated', fromAreas };
  if (fromAreas && fromAreas.exactOperators > 0) {
    return { count: Math.max(1, Math.ceil(fromAreas.exactOperators - ROUNDING_SLACK)), source: 'areas', fromAreas };
  }
  return { count: 1, source: 'default', fromAreas };
}

function areaDerivation(areas: CleaningArea[], windowS: number | undefined): OperatorCount['fromAreas'] {
  if (areas.length === 0 || windowS === undefined || !(windowS > 0) || !Number.isFinite(windowS)) return null;
  const rows = areas
    .filter((a) => Number.isFinite(a.areaM2) && a.areaM2 >= 0)
    .map((a) => {
      const fileRate = a.rateM2PerS !== undefined && a.rateM2PerS > 0 && Number.isFinite(a.rateM2PerS);
      const rate = fileRate ? a.rateM2PerS! : commonPracticeRateM2PerS(a.surface);
      return {
        surface: a.surface,
        areaM2: a.areaM2,
        rateM2PerS: rate,
        rateSource: fileRate ? ('file' as const) : ('common-practice' as const),
        operatorTimeS: a.areaM2 / rate,
      };
    });
  const total = rows.reduce((s, r) => s + r.operatorTimeS, 0);
  return { areas: rows, totalOperatorTimeS: total, cleaningWindowS: windowS, exactOperators: total / windowS };
}
