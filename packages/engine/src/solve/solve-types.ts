/**
 * What the network solver takes and returns. The solver knows nodes,
 * two-port elements and fixed pressures only; the system model, inlets and
 * pipes are the graph builder's business.
 */
import type { TwoPortLaw } from '../elements/two-port-law.js';
import type { ElementRef } from '../network/model.js';

/** Why a case could not be solved. */
export type SolveFailureCause =
  | 'infeasible-demand'
  | 'choked'
  | 'no-path'
  | 'zero-pressure'
  | 'not-converged'
  | 'invalid-element';

/**
 * A network as the solver sees it: `nodeCount` nodes, each either fixed at
 * an absolute pressure or unknown, and elements joining port `a` to port `b`
 * with a flow law (positive flow a -> b).
 */
export interface SolverNetwork {
  nodeCount: number;
  /** Fixed absolute pressure of each node, Pa; NaN where the pressure is unknown. */
  fixedPressurePa: Float64Array;
  elementA: Int32Array;
  elementB: Int32Array;
  /** The law of each element; null where the element could not be built (see `invalid`). */
  laws: (TwoPortLaw | null)[];
  /** Why an element has no law (zero length, zero bore...). */
  invalid: (string | undefined)[];
  /** The model element each solver element stands for, for failures. */
  refs: (ElementRef | undefined)[];
  /**
   * 1 for elements that move air by themselves (producers): a part of the
   * network with open tools but no such element, and no difference between
   * its fixed pressures, has no path for air.
   */
  drives: Uint8Array;
  /**
   * What a law's limit at the solution means for the case: a failure cause,
   * or null when the limit is an acceptable state. Default: 'choked' ->
   * choked; 'curve-end' on a driving element -> infeasible-demand; others null.
   */
  classifyLimit?: (element: number, limit: LawLimit, pa: number, pb: number, flowKgPerS: number) => SolveFailureCause | null;
}

export type LawLimit = 'choked' | 'curve-end' | 'relief';

export interface NetworkSolveOptions {
  /** A starting pressure per node (indexed by node id, length nodeCount); NaN entries are ignored. */
  initialPressurePa?: Float64Array;
  /** Fixed pressures for this solve only (node id -> Pa), on top of the network's. */
  fixedOverridesPa?: ReadonlyMap<number, number>;
  /** Relative mass-imbalance tolerance (default 1e-9 of the total flow, ENGINEERING.md). */
  tolerance?: number;
  /** Newton iteration cap (default 100). */
  maxIterations?: number;
  /** Remove dead legs (parts with no way for air to pass) before solving (default true). */
  prune?: boolean;
  /**
   * 'auto' (default): a case that is a tree hanging from one producer, with
   * air entering at tools, is solved by its entry flows (tree-flow-solve.ts),
   * anything else by Newton on node pressures; 'newton': always Newton.
   */
  method?: 'auto' | 'newton';
  /**
   * Accept a driving element past the end of its curve (the law extrapolates
   * it along its last slope and the state lists it in `limited`) instead of
   * failing the case: for cases that only bound a quantity, such as the
   * highest velocities with tools lifted (default false).
   */
  acceptCurveEnd?: boolean;
}

export interface SolveFailure {
  cause: SolveFailureCause;
  element?: ElementRef;
  message: string;
}

/** Counters shared across solves, for benchmarks (solves, iterations, law evaluations). */
export interface SolveEffort {
  solves: number;
  newtonIterations: number;
  elementEvaluations: number;
}

export interface SolvedState {
  /** Node ids that took part, and their absolute pressures, Pa (aligned arrays). */
  nodes: Int32Array;
  pressurePa: Float64Array;
  /** Element ids that took part, and their mass flows a -> b, kg/s (aligned arrays). */
  elements: Int32Array;
  flowKgPerS: Float64Array;
  /** Elements whose law reported a limit at the solution (relief, curve end...). */
  limited: { element: number; limit: LawLimit; cause: SolveFailureCause | null }[];
  iterations: number;
  /** Largest node mass imbalance over the total flow at the end. */
  imbalanceFraction: number;
}

export type SolveResult =
  | ({ ok: true } & SolvedState)
  | { ok: false; failure: SolveFailure; iterations: number; state?: SolvedState };
