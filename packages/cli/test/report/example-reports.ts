import { loadDocuments } from '@vacnet/language';
import type { ReportInput } from '../../src/report/report-model.js';

/** The bundled examples the report tests read, loaded once per test file (the load and analysis take a second or more each). */
export const EXAMPLES = ['harbour-offices', 'grinding-plant', 'primary-school', 'detached-house'] as const;
export type ExampleName = (typeof EXAMPLES)[number] | 'unresolved-hose';

const cache = new Map<string, Promise<ReportInput & Required<Pick<ReportInput, 'model'>>>>();

/** A file loaded and analysed as `vacnet report` loads it (path relative to the repository root). */
export function loadExample(name: ExampleName): Promise<ReportInput & Required<Pick<ReportInput, 'model'>>> {
  let loaded = cache.get(name);
  if (!loaded) {
    const path = name === 'unresolved-hose' ? 'packages/cli/test/fixtures/unresolved-hose.vacnet' : `examples/${name}.vacnet`;
    loaded = loadDocuments([path], { analyse: true }).then((result) => {
      const file = result.files[0]!;
      if (!file.model) throw new Error(`${path} holds no system`);
      return {
        path,
        model: file.model,
        diagnostics: file.diagnostics,
        ...(file.analysis ? { analysis: file.analysis } : {}),
        ...(file.accepted ? { accepted: file.accepted } : {}),
      };
    });
    cache.set(name, loaded);
  }
  return loaded;
}

// Conversion factors from NIST SP 811 (2008), appendix B.8, independent of the engine's unit table.
/** Pascals in one inch of mercury (conventional, 32 degF): 3.386 389 E+03. */
export const PA_PER_INHG = 3386.389;
/** Cubic metres per second in one cubic foot per minute: 4.719 474 E-04. */
export const M3S_PER_CFM = 4.719474e-4;
/** Metres per second in one foot per minute: 5.08 E-03 (exact). */
export const MS_PER_FPM = 5.08e-3;
/** Watts in one horsepower (550 ft lbf/s): 7.456 999 E+02. */
export const W_PER_HP = 745.6999;

/**
 * The number at the start of a display text (`189.6 scfm` -> 189.6), checked
 * against an expected value to the three significant digits the report
 * prints: within half a unit of the third digit, plus a hair for round-off.
 */
export function agreesToThreeDigits(text: string, expected: number): boolean {
  const value = Number(/^[+\u2212-]?[\d.]+/.exec(text.trim())?.[0]?.replace('\u2212', '-'));
  if (!Number.isFinite(value)) return false;
  const magnitude = Math.floor(Math.log10(Math.abs(expected)));
  const halfUnit = 0.5 * 10 ** (magnitude - 2);
  return Math.abs(value - expected) <= halfUnit * 1.001 + 1e-12;
}
