/**
 * Inside diameters of pipe from its spec's size rule and a nominal size.
 *
 * Steel pipe schedules: outside diameter and wall thickness by NPS from
 * ASME B36.10M (schedules 40 and 80) and ASME B36.19M (schedules 5S and
 * 10S, which B36.10M lists as 5 and 10 for these sizes), in inches as the
 * standard tabulates them; the millimetre columns are conversions. Values
 * from memory of the standard; schedules 10 and 40 are checked against the
 * published inside diameters in the tests.
 */
import type { SizeRule } from './model.js';

/** Metres per inch (exact, by definition). */
const METRES_PER_INCH = 0.0254;

interface ScheduleRow {
  /** Nominal pipe size, inches. */
  nps: number;
  /** Metric designation DN (ISO 6708). */
  dn: number;
  /** Outside diameter, inches (ASME B36.10M). */
  odIn: number;
  /** Wall thickness by schedule, inches (ASME B36.10M / B36.19M). */
  wallIn: Readonly<Record<string, number>>;
}

// ASME B36.10M / B36.19M, NPS 1/2 .. 12 (from memory; checks in the tests).
const SCHEDULE_ROWS: readonly ScheduleRow[] = [
  { nps: 0.5, dn: 15, odIn: 0.84, wallIn: { '5': 0.065, '10': 0.083, '40': 0.109, '80': 0.147 } },
  { nps: 0.75, dn: 20, odIn: 1.05, wallIn: { '5': 0.065, '10': 0.083, '40': 0.113, '80': 0.154 } },
  { nps: 1, dn: 25, odIn: 1.315, wallIn: { '5': 0.065, '10': 0.109, '40': 0.133, '80': 0.179 } },
  { nps: 1.25, dn: 32, odIn: 1.66, wallIn: { '5': 0.065, '10': 0.109, '40': 0.14, '80': 0.191 } },
  { nps: 1.5, dn: 40, odIn: 1.9, wallIn: { '5': 0.065, '10': 0.109, '40': 0.145, '80': 0.2 } },
  { nps: 2, dn: 50, odIn: 2.375, wallIn: { '5': 0.065, '10': 0.109, '40': 0.154, '80': 0.218 } },
  { nps: 2.5, dn: 65, odIn: 2.875, wallIn: { '5': 0.083, '10': 0.12, '40': 0.203, '80': 0.276 } },
  { nps: 3, dn: 80, odIn: 3.5, wallIn: { '5': 0.083, '10': 0.12, '40': 0.216, '80': 0.3 } },
  { nps: 3.5, dn: 90, odIn: 4.0, wallIn: { '5': 0.083, '10': 0.12, '40': 0.226, '80': 0.318 } },
  { nps: 4, dn: 100, odIn: 4.5, wallIn: { '5': 0.083, '10': 0.12, '40': 0.237, '80': 0.337 } },
  { nps: 5, dn: 125, odIn: 5.563, wallIn: { '5': 0.109, '10': 0.134, '40': 0.258, '80': 0.375 } },
  { nps: 6, dn: 150, odIn: 6.625, wallIn: { '5': 0.109, '10': 0.134, '40': 0.28, '80': 0.432 } },
  { nps: 8, dn: 200, odIn: 8.625, wallIn: { '5': 0.109, '10': 0.148, '40': 0.322, '80': 0.5 } },
  { nps: 10, dn: 250, odIn: 10.75, wallIn: { '5': 0.134, '10': 0.165, '40': 0.365, '80': 0.594 } },
  { nps: 12, dn: 300, odIn: 12.75, wallIn: { '5': 0.156, '10': 0.18, '40': 0.406, '80': 0.688 } },
];

/** Schedules the table covers. */
export const SCHEDULES: readonly string[] = ['5', '10', '40', '80'];

// A written size matches an NPS within 0.5 % (rounding of converted sizes; our choice).
const NPS_MATCH_TOLERANCE = 0.005;
// A written size matches a DN within 0.5 mm (DN are whole millimetres; our choice).
const DN_MATCH_TOLERANCE_M = 0.0005;

export type SizeFailureCause = 'unknown-schedule' | 'unknown-size' | 'invalid-size' | 'wall-too-thick';

export type InsideDiameterResult =
  | { ok: true; insideDiameterM: number }
  | {
      ok: false;
      cause: SizeFailureCause;
      message: string;
      /** Nominal sizes (m, as NPS in metres) that the rule does know, for a quick fix. */
      availableNominalM?: number[];
    };

/** Schedule names are written `40`, `sch 40`, `40S` or `STD`-free forms; normalise them. */
function normaliseSchedule(schedule: string): string {
  const s = schedule.trim().toUpperCase().replace(/^SCH(EDULE)?\s*/, '');
  return s.endsWith('S') ? s.slice(0, -1) : s;
}

/** The NPS row a written nominal size means: by NPS in inches, else by DN in millimetres. */
function findRow(nominalM: number): ScheduleRow | undefined {
  const inches = nominalM / METRES_PER_INCH;
  const byNps = SCHEDULE_ROWS.find((r) => Math.abs(inches - r.nps) <= NPS_MATCH_TOLERANCE * r.nps);
  if (byNps) return byNps;
  return SCHEDULE_ROWS.find((r) => Math.abs(nominalM - r.dn / 1000) <= DN_MATCH_TOLERANCE_M);
}

/**
 * Inside diameter of a pipe of a spec's size rule at a nominal size.
 *
 * Inputs: the rule, the nominal size as written (m; NPS in inches or DN in
 * millimetres both match a schedule row). Output: inside diameter, m, or a
 * typed failure (never throws, never NaN).
 * Schedule: ID = OD - 2 wall (ASME B36.10M / B36.19M table above).
 * Wall: ID = nominal (outside) diameter - 2 wall. Inside: ID = nominal.
 */
export function insideDiameterFor(rule: SizeRule, nominalM: number): InsideDiameterResult {
  if (!Number.isFinite(nominalM) || nominalM <= 0) {
    return { ok: false, cause: 'invalid-size', message: `nominal size must be a positive length, got ${nominalM} m` };
  }
  switch (rule.kind) {
    case 'inside':
      return { ok: true, insideDiameterM: nominalM };
    case 'wall': {
      if (!Number.isFinite(rule.wallM) || rule.wallM < 0) {
        return { ok: false, cause: 'invalid-size', message: `wall thickness must be zero or more, got ${rule.wallM} m` };
      }
      const id = nominalM - 2 * rule.wallM;
      if (!(id > 0)) {
        return {
          ok: false,
          cause: 'wall-too-thick',
          message: `a wall of ${rule.wallM} m leaves no bore in a ${nominalM} m tube`,
        };
      }
      return { ok: true, insideDiameterM: id };
    }
    case 'schedule': {
      const schedule = normaliseSchedule(rule.schedule);
      if (!SCHEDULES.includes(schedule)) {
        return {
          ok: false,
          cause: 'unknown-schedule',
          message: `schedule ${rule.schedule} is not in the table (known: ${SCHEDULES.join(', ')})`,
        };
      }
      const row = findRow(nominalM);
      const wall = row?.wallIn[schedule];
      if (!row || wall === undefined) {
        return {
          ok: false,
          cause: 'unknown-size',
          message: `no schedule ${schedule} pipe of nominal size ${(nominalM / METRES_PER_INCH).toFixed(3)} in (${(nominalM * 1000).toFixed(1)} mm); the table covers NPS 1/2 to 12`,
          availableNominalM: SCHEDULE_ROWS.map((r) => r.nps * METRES_PER_INCH),
        };
      }
      return { ok: true, insideDiameterM: (row.odIn - 2 * wall) * METRES_PER_INCH };
    }
    default:
      return { ok: false, cause: 'unknown-schedule', message: 'unknown size rule' };
  }
}

/** Nominal sizes (m) a schedule is tabulated for, ascending (for resize suggestions). */
export function scheduleNominalSizesM(schedule: string): number[] {
  const s = normaliseSchedule(schedule);
  if (!SCHEDULES.includes(s)) return [];
  return SCHEDULE_ROWS.map((r) => r.nps * METRES_PER_INCH);
}
