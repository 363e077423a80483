import type { CleanoutPosition } from '@vacnet/engine';
import type { Pipe } from '../../generated/ast.js';
import { insertLinesAfter, memberNamed, numberText } from './edit-text.js';
import { quickFix, type QuickFix } from './fix-context.js';

/** Metres per foot (international foot, exact). */
const FOOT_M = 0.3048;

/**
 * Add the cleanout(s) the missing-cleanout finding names (`fix.cleanout` or
 * `fix.cleanouts`), on lines after the pipe the finding is on. Distances
 * along a pipe are written in feet or metres by the display units.
 */
export const addCleanout: QuickFix = (context) => {
  const positions = cleanoutsIn(context.data);
  const element = context.data.element;
  if (positions.length === 0 || element?.kind !== 'pipe') return [];
  const pipe = memberNamed<Pipe>(context.document, 'Pipe', element.name);
  if (!pipe?.$cstNode) return [];
  const si = context.state?.model?.displayUnits === 'si';
  const lines = positions.map((p) =>
    p.kind === 'point' ? `cleanout at ${p.point}` : `cleanout on ${p.pipe} at ${si ? `${numberText(p.distanceM, 4)} m` : `${numberText(p.distanceM / FOOT_M, 4)} ft`}`,
  );
  const where = positions.map((p) => (p.kind === 'point' ? `at '${p.point}'` : `on '${p.pipe}'`)).join(', ');
  return [quickFix(context, `Add ${lines.length === 1 ? 'a cleanout' : `${lines.length} cleanouts`} ${where}`, [insertLinesAfter(context.document, pipe.$cstNode, lines)], true)];
};

function cleanoutsIn(data: Record<string, unknown>): CleanoutPosition[] {
  const list = Array.isArray(data.cleanouts) ? data.cleanouts : data.cleanout ? [data.cleanout] : [];
  return list.filter(isPosition);
}

function isPosition(value: unknown): value is CleanoutPosition {
  const p = value as Partial<CleanoutPosition> | null;
  if (!p || typeof p !== 'object') return false;
  if (p.kind === 'point') return typeof (p as { point?: unknown }).point === 'string' && /^[A-Za-z_]/.test((p as { point: string }).point);
  if (p.kind === 'on-pipe') {
    const q = p as { pipe?: unknown; distanceM?: unknown };
    return typeof q.pipe === 'string' && typeof q.distanceM === 'number' && Number.isFinite(q.distanceM) && q.distanceM >= 0;
  }
  return false;
}
