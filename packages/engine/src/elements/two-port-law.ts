/**
 * The contract between element physics and the network solver.
 *
 * Every element of the network (pipe, hose, tool, separator, filter, producer)
 * joins two ports and gives the mass flow through it from the absolute
 * pressures at those ports, with the partial derivatives the Newton solver
 * needs. Positive flow runs from port `a` to port `b`.
 */
export interface PortFlow {
  /** Mass flow from port a to port b, kg/s (negative when b -> a). */
  massFlowKgPerS: number;
  /** d(mass flow)/d(pa), kg/(s Pa). */
  dFlowDPa: number;
  /** d(mass flow)/d(pb), kg/(s Pa). */
  dFlowDPb: number;
  /**
   * Set when the law had to hold the flow at a physical limit (isothermal
   * choking in a pipe, a choked tool orifice, the end of a producer curve),
   * so that the caller can report it instead of trusting the value.
   */
  limited?: 'choked' | 'curve-end' | 'relief';
}

export interface TwoPortLaw {
  /** Flow and derivatives at absolute port pressures pa, pb (Pa, both > 0). */
  flow(pa: number, pb: number): PortFlow;
  /**
   * The same as `flow`, written into `out` (every field, `limited` set to
   * undefined when there is no limit) without allocating: the solver's hot
   * path uses it when a law has it.
   */
  flowInto?(pa: number, pb: number, out: PortFlow): void;
  /**
   * For laws that are the same both ways round (pipes, hoses): the
   * pressure at the end air enters for a mass flow m >= 0 toward an end at
   * pDown, with its derivatives, written into `out`; false when no physical
   * pressure passes that flow (choking). Optional: a solver that marches
   * pressures from a known end inverts other laws numerically.
   */
  upstreamPressureInto?(m: number, pDown: number, out: UpstreamPressure): boolean;
  /**
   * For a law that moves air itself (a producer: port a its inlet, port b
   * its outlet): the inlet pressure at which it moves mass flow m with its
   * outlet at pOutlet, with its derivatives (dPressureDDown: by the outlet
   * pressure); false when it cannot say directly (then invert `flow`).
   */
  inletPressureInto?(m: number, pOutlet: number, out: UpstreamPressure): boolean;
}

/** The inverse of a law at one flow: the upstream pressure and its derivatives. */
export interface UpstreamPressure {
  /** Absolute pressure at the end air enters, Pa. */
  pressurePa: number;
  /** d(pressure)/d(mass flow), Pa s/kg. */
  dPressureDFlow: number;
  /** d(pressure)/d(downstream pressure). */
  dPressureDDown: number;
}
