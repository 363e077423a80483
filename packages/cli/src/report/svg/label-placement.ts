import type { Box, Point } from './layout.js';

/** A label to place near its anchor, with the offsets it may take, in order of preference. */
export interface LabelRequest {
  width: number;
  height: number;
  /** Candidate top-left corners. */
  candidates: Point[];
}

/**
 * Greedy label placement: each label in turn takes the candidate that
 * stays inside the bounds, overlaps nothing placed so far and covers no
 * drawn point (lines sampled as points), earlier candidates preferred;
 * failing that, the one that does least of these. Enough for the handful of callouts on
 * a plot; not a general solver.
 */
export function placeLabels(requests: readonly LabelRequest[], bounds: Box, obstacles: readonly Box[], drawn: readonly Point[]): Box[] {
  const placed: Box[] = [];
  for (const request of requests) {
    let best: Box | null = null;
    let bestScore = Infinity;
    for (const [index, c] of request.candidates.entries()) {
      const box = { x: c.x, y: c.y, width: request.width, height: request.height };
      const outside = outsideArea(box, bounds);
      const overlap = [...obstacles, ...placed].reduce((sum, b) => sum + overlapArea(box, b), 0);
      const covered = drawn.filter((p) => p.x >= box.x - 2 && p.x <= box.x + box.width + 2 && p.y >= box.y - 2 && p.y <= box.y + box.height + 2).length;
      // Outside the plot and overlapping other labels weigh most, then covered lines, then a less preferred side (our weights).
      const score = outside * 10 + overlap * 5 + covered * 40 + index * 15;
      if (score < bestScore) {
        bestScore = score;
        best = box;
      }
    }
    placed.push(best ?? { x: bounds.x, y: bounds.y, width: request.width, height: request.height });
  }
  return placed;
}

function overlapArea(a: Box, b: Box): number {
  const w = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
  return w > 0 && h > 0 ? w * h : 0;
}

function outsideArea(a: Box, bounds: Box): number {
  return a.width * a.height - overlapArea(a, bounds);
}

