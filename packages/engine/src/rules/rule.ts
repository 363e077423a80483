/**
 * What a design rule is: a stable code, a default severity, the thresholds it
 * reads (each with a default and the source of that default), and a check
 * that turns a system model (and, for the flow rules, its analysis) into
 * findings. Rules never throw and never read anything but their arguments.
 */
import type { DebrisClass, Finding, ElementRules, Severity, SystemModel } from '../network/model.js';
import type { SystemAnalysis } from '../analysis/analysis-types.js';

/** What a parameter measures; values are SI (m/s, Pa, m, rad) or plain ratios. */
export type ParameterDimension =
  | 'velocity'
  | 'pressure'
  | 'length'
  | 'angle'
  /** A share of something, 0..1 (0.1 = 10 %). */
  | 'fraction'
  /** A plain ratio such as R/D. */
  | 'ratio'
  | 'count';

export interface RuleParameter {
  /** camelCase name in the engine (`minRadius`); files write it kebab-case (`min-radius`). */
  name: string;
  dimension: ParameterDimension;
  /** The value when neither the element, the system nor the design basis says otherwise. */
  default: number;
  /** Defaults that depend on the design debris class; take precedence over `default`. */
  defaultByDebris?: Readonly<Record<DebrisClass, number>>;
  /** Where the default comes from (standard, handbook, or "common practice"). */
  source: string;
  /** One line on what the parameter does. */
  description: string;
  /** Smallest and largest sensible value (our own sanity bounds, not design limits); a setting outside is ignored and reported. */
  range?: readonly [number, number];
}

/** The listing of a rule: everything but its check (for the language server and docs). */
export interface RuleInfo {
  code: string;
  title: string;
  defaultSeverity: Severity;
  parameters: readonly RuleParameter[];
  /** The rule reads the flow analysis and stays silent without it. */
  needsAnalysis: boolean;
}

/** Parameter values as one rule sees them, resolved for an element. */
export interface RuleSettings {
  /**
   * The value of `parameter`: the element's setting, else the system's,
   * else `stated` (a value the design basis gives), else the default.
   * Invalid settings (not finite, out of range) are skipped.
   */
  value(parameter: string, element?: ElementRules, stated?: number): number;
}

export interface Rule extends RuleInfo {
  check(model: SystemModel, analysis: SystemAnalysis | undefined, settings: RuleSettings): Finding[];
}
