/**
 * Cleanouts where debris settles and a rod or snake must get in: the base of
 * every riser, the far end of every horizontal run, next to every horizontal
 * change of direction over 45 deg, and at most a set spacing apart along
 * horizontal runs. The places follow guide specifications for exhaust ducts
 * (cleanouts next to bends and risers) and, by analogy, drainage codes
 * (changes of direction over 45 deg, base of stacks, at most 100 ft apart);
 * applying them to vacuum piping is common practice.
 *
 * Positions on a pipe are distances from its producer-side (`from`) end.
 */
import type { CleanoutPosition, Finding, Pipe, PointName, SystemModel } from '../network/model.js';
import type { Rule, RuleSettings } from './rule.js';
import { ruleFinding } from './finding.js';
import { isVertical, lowerEnd, pipeGraph, upperEnd, type PipeGraph } from './pipe-graph.js';
import { horizontalRuns, positionOnRun } from './horizontal-runs.js';
import { formatLength } from './rule-format.js';

/** International foot, m (exact). */
const FOOT_M = 0.3048;

/** Whether a cleanout serves a point: at it, or on a pipe ending there within `near`. */
function servesPoint(c: CleanoutPosition, point: PointName, near: number, graph: PipeGraph): boolean {
  if (c.kind === 'point') return c.point === point;
  const pipe = graph.pipe(c.pipe);
  if (!pipe) return false;
  if (pipe.from === point && c.distanceM <= near) return true;
  if (pipe.to === point && pipe.lengthM - c.distanceM <= near) return true;
  return false;
}

interface Requirement {
  point: PointName;
  pipe: Pipe;
  reasons: string[];
}

export const missingCleanout: Rule = {
  code: 'missing-cleanout',
  title: 'Cleanout missing',
  defaultSeverity: 'warning',
  parameters: [
    {
      name: 'spacing',
      dimension: 'length',
      // 100 ft: drainage codes' largest cleanout interval on horizontal drains, applied by analogy.
      default: 100 * FOOT_M,
      source: 'drainage codes (cleanouts at most 100 ft apart on horizontal drains), by analogy: common practice',
      description: 'Longest stretch of a horizontal run between cleanouts.',
      range: [0.1, 1e4],
    },
    {
      name: 'near',
      dimension: 'length',
      // 3 ft: a cleanout fitting beside a riser base or run end; common practice.
      default: 3 * FOOT_M,
      source: 'common practice',
      description: 'How far from a riser base or run end a cleanout on the pipe still counts as there.',
      range: [0, 100],
    },
    {
      name: 'bendAngle',
      dimension: 'angle',
      // Drainage codes ask for a cleanout at horizontal changes of direction over 45 deg.
      default: Math.PI / 4,
      source: 'drainage codes (cleanout at horizontal changes of direction over 45 deg), by analogy: common practice',
      description: 'A horizontal bend sharper than this needs a cleanout next to it.',
      range: [0, Math.PI],
    },
    {
      name: 'shortRun',
      dimension: 'length',
      // 5 ft: drainage codes exempt short horizontal runs from an end cleanout (from memory).
      default: 5 * FOOT_M,
      source: 'drainage codes exempt horizontal runs under 5 ft (from memory), by analogy: common practice',
      description: 'A horizontal run shorter than this needs no cleanout at its far end.',
      range: [0, 1e4],
    },
  ],
  needsAnalysis: false,
  check(model, _analysis, settings) {
    return checkCleanouts(model, settings);
  },
};

function checkCleanouts(model: SystemModel, settings: RuleSettings): Finding[] {
  const graph = pipeGraph(model);
  const units = model.displayUnits ?? 'imperial';
  const cleanouts = (model.cleanouts ?? []).map((c) => c.position).filter(Boolean);
  const findings: Finding[] = [];

  // Points needing a cleanout, each with the reasons (one finding per point).
  const needs = new Map<PointName, Requirement>();
  const need = (point: PointName, pipe: Pipe, reason: string) => {
    const existing = needs.get(point);
    if (existing) existing.reasons.push(reason);
    else needs.set(point, { point, pipe, reasons: [reason] });
  };

  // Points where pipes start but none ends: the plant, where the separator is the access.
  const isRoot = (point: PointName) => graph.endingAt(point).length === 0;

  for (const pipe of model.pipes ?? []) {
    if (!isVertical(pipe)) continue;
    const base = lowerEnd(pipe);
    const continuesBelow = [...graph.startingAt(base), ...graph.endingAt(base)].some(
      (q) => q !== pipe && isVertical(q) && upperEnd(q) === base,
    );
    if (continuesBelow || isRoot(base)) continue;
    need(base, pipe, `the base of riser '${pipe.name}'`);
  }

  const runs = horizontalRuns(model, graph);
  for (const run of runs) {
    const last = run.pipes[run.pipes.length - 1]!;
    if (run.lengthM >= settings.value('shortRun', last.rules)) {
      need(last.to, last, `the far end of the horizontal run ending with '${last.name}'`);
    }
  }

  for (const req of needs.values()) {
    const near = settings.value('near', req.pipe.rules);
    if (cleanouts.some((c) => servesPoint(c, req.point, near, graph))) continue;
    findings.push(
      ruleFinding(
        missingCleanout,
        { kind: 'pipe', name: req.pipe.name },
        `No cleanout at point '${req.point}', ${req.reasons.join(' and ')}: debris settles there and a rod must get in. Add a cleanout at '${req.point}'.`,
        { fix: { cleanout: { kind: 'point', point: req.point } satisfies CleanoutPosition } },
      ),
    );
  }

  // Horizontal bends over the limit: the model does not place a bend along its
  // pipe, so any cleanout on the pipe or at its ends counts.
  for (const pipe of model.pipes ?? []) {
    if (pipe.orientation !== 'horizontal') continue;
    const limit = settings.value('bendAngle', pipe.rules);
    const sharp = (pipe.fittings ?? []).filter((f) => f.kind === 'bend' && f.angleRad > limit + 1e-9);
    if (sharp.length === 0) continue;
    const near = settings.value('near', pipe.rules);
    const served = cleanouts.some(
      (c) =>
        (c.kind === 'on-pipe' && c.pipe === pipe.name) ||
        servesPoint(c, pipe.from, near, graph) ||
        servesPoint(c, pipe.to, near, graph),
    );
    if (served) continue;
    findings.push(
      ruleFinding(
        missingCleanout,
        { kind: 'pipe', name: pipe.name, property: 'bend' },
        `Pipe '${pipe.name}' changes direction by more than ${Math.round((limit * 180) / Math.PI)} deg in a horizontal run with no cleanout next to the bend. Add a cleanout on '${pipe.name}' just upstream of the bend (on its far side from the producer).`,
        {
          fix: {
            cleanout: { kind: 'on-pipe', pipe: pipe.name, distanceM: Math.max(0, pipe.lengthM) } satisfies CleanoutPosition,
            note: 'the file does not say where on the pipe the bend is: move the cleanout next to it',
          },
        },
      ),
    );
  }

  // Spacing along each run; the run's producer-side end counts as an access
  // point (a junction, riser or the plant) and so does its far end (required above).
  for (const run of runs) {
    const spacing = settings.value('spacing', run.pipes[0]!.rules);
    if (!(run.lengthM > spacing)) continue;
    const marks: number[] = [0, run.lengthM];
    run.pipes.forEach((pipe, k) => {
      const offset = run.offsets[k]!;
      for (const c of cleanouts) {
        if (c.kind === 'on-pipe' && c.pipe === pipe.name && Number.isFinite(c.distanceM)) {
          marks.push(offset + Math.min(Math.max(c.distanceM, 0), pipe.lengthM));
        } else if (c.kind === 'point' && (c.point === pipe.from || c.point === pipe.to)) {
          marks.push(c.point === pipe.from ? offset : offset + pipe.lengthM);
        }
      }
    });
    marks.sort((a, b) => a - b);
    for (let i = 1; i < marks.length; i++) {
      const start = marks[i - 1]!;
      const gap = marks[i]! - start;
      if (gap <= spacing * (1 + 1e-9)) continue;
      const added = Math.ceil(gap / spacing - 1e-9) - 1;
      const positions: CleanoutPosition[] = [];
      for (let n = 1; n <= added; n++) positions.push(positionOnRun(run, start + (gap * n) / (added + 1)));
      const first = positions[0]!;
      const pipeName = first.kind === 'on-pipe' ? first.pipe : run.pipes[0]!.name;
      const where = positions
        .map((p) => (p.kind === 'on-pipe' ? `'${p.pipe}' at ${formatLength(p.distanceM, units)}` : `'${p.point}'`))
        .join(', ');
      findings.push(
        ruleFinding(
          missingCleanout,
          { kind: 'pipe', name: pipeName },
          `The horizontal run from '${run.pipes[0]!.from}' to '${run.pipes[run.pipes.length - 1]!.to}' goes ${formatLength(gap, units)} without a cleanout (from ${formatLength(start, units)} to ${formatLength(start + gap, units)} along it), more than ${formatLength(spacing, units)}. Add ${added === 1 ? 'a cleanout' : `${added} cleanouts`} on ${where}.`,
          { fix: { cleanouts: positions } },
        ),
      );
    }
  }
  return findings;
}
