/**
 * Which pipes meet where, for the layout rules. A pipe runs from its
 * producer-side end (`from`) to its far end (`to`); air flows from `to`
 * toward `from`.
 */
import type { Pipe, PointName, SystemModel } from '../network/model.js';

export interface PipeGraph {
  /** Pipes whose producer-side end is at the point (they carry air into it). */
  startingAt(point: PointName): Pipe[];
  /** Pipes whose far end is at the point (they carry air away from it, toward the producer). */
  endingAt(point: PointName): Pipe[];
  /** Pipes the given pipe discharges into: those whose far end is its producer-side end. */
  parentsOf(pipe: Pipe): Pipe[];
  pipe(name: string): Pipe | undefined;
}

export function pipeGraph(model: SystemModel): PipeGraph {
  const starting = new Map<PointName, Pipe[]>();
  const ending = new Map<PointName, Pipe[]>();
  const byName = new Map<string, Pipe>();
  for (const p of model.pipes ?? []) {
    byName.set(p.name, p);
    if (!starting.has(p.from)) starting.set(p.from, []);
    starting.get(p.from)!.push(p);
    if (!ending.has(p.to)) ending.set(p.to, []);
    ending.get(p.to)!.push(p);
  }
  return {
    startingAt: (point) => starting.get(point) ?? [],
    endingAt: (point) => ending.get(point) ?? [],
    parentsOf: (pipe) => (ending.get(pipe.from) ?? []).filter((q) => q !== pipe),
    pipe: (name) => byName.get(name),
  };
}

/** A pipe runs vertically (a riser or drop). */
export function isVertical(pipe: Pipe): boolean {
  return pipe.orientation === 'air-up' || pipe.orientation === 'air-down';
}

/** The lower end of a vertical pipe: air rising flows from its far end up to its producer end. */
export function lowerEnd(pipe: Pipe): PointName {
  return pipe.orientation === 'air-up' ? pipe.to : pipe.from;
}

/** The upper end of a vertical pipe. */
export function upperEnd(pipe: Pipe): PointName {
  return pipe.orientation === 'air-up' ? pipe.from : pipe.to;
}
