/**
 * Entrance and exit losses, K on the pipe's velocity pressure.
 */
import { lookup, type Table } from './table-lookup.js';

/** Sharp-edged (flush) entrance: K = 0.5 (Crane TP-410; Idelchik). */
export const SHARP_ENTRY_K = 0.5;
/** Inward-projecting (re-entrant) entrance: K = 0.78 (Crane TP-410). */
export const PROJECTING_ENTRY_K = 0.78;
/** Exit into a large space: the whole velocity pressure is lost, K = 1.0 (Crane TP-410; Borda-Carnot with A2 -> infinity). */
export const EXIT_K = 1.0;

/**
 * Rounded entrance K by r/D: Crane TP-410 (2009), "entrance" chart:
 * 0.02/0.04/0.06/0.10/>=0.15 = 0.28/0.24/0.15/0.09/0.04 (0.04 at r/D >= 0.15: CHECKS.md [C]; the rest from memory).
 */
export const ROUNDED_ENTRY: Table = [
  [0, 0.5],
  [0.02, 0.28],
  [0.04, 0.24],
  [0.06, 0.15],
  [0.1, 0.09],
  [0.15, 0.04],
];

/** Rounded entrance by edge radius / diameter; r/D 0 (or invalid) is sharp, held at 0.04 from 0.15 on. */
export function roundedEntryK(radiusRatio: number): number {
  return lookup(ROUNDED_ENTRY, Number.isFinite(radiusRatio) && radiusRatio > 0 ? radiusRatio : 0);
}
