/**
 * How the file's rule settings apply: a parameter's value for an element
 * (element setting > system setting > design basis > default), the severity of
 * a rule in this system, and whether a finding was accepted with a reason.
 */
import type {
  ElementRef,
  ElementRules,
  Finding,
  RuleSetting,
  Severity,
  Suppression,
  SystemModel,
} from '../network/model.js';
import type { RuleInfo, RuleParameter, RuleSettings } from './rule.js';

/** True when a setting's value can be used for this parameter. */
export function isValidSettingValue(parameter: RuleParameter, value: number): boolean {
  if (typeof value !== 'number' || !Number.isFinite(value)) return false;
  const [low, high] = parameter.range ?? [0, Number.POSITIVE_INFINITY];
  return value >= low && value <= high;
}

function settingFor(
  settings: readonly RuleSetting[] | undefined,
  code: string,
  parameter: RuleParameter,
): number | undefined {
  if (!settings) return undefined;
  // The last valid line wins, as when a value is written twice.
  let found: number | undefined;
  for (const s of settings) {
    if (s.rule === code && s.parameter === parameter.name && isValidSettingValue(parameter, s.value)) {
      found = s.value;
    }
  }
  return found;
}

/** The default of a parameter for this model (by debris class where the parameter has one). */
export function parameterDefault(parameter: RuleParameter, model: SystemModel): number {
  const byDebris = parameter.defaultByDebris?.[model.design?.debris];
  return byDebris ?? parameter.default;
}

/** Parameter values for one rule in one model. Unknown parameter names give NaN-free 0. */
export function createRuleSettings(rule: RuleInfo, model: SystemModel): RuleSettings {
  const byName = new Map(rule.parameters.map((p) => [p.name, p] as const));
  return {
    value(name: string, element?: ElementRules, stated?: number): number {
      const parameter = byName.get(name);
      // A rule asking for a parameter it does not declare is a programming
      // error; return 0 rather than throw so a report still comes out.
      if (!parameter) return 0;
      const fromElement = settingFor(element?.settings, rule.code, parameter);
      if (fromElement !== undefined) return fromElement;
      const fromSystem = settingFor(model.rules?.settings, rule.code, parameter);
      if (fromSystem !== undefined) return fromSystem;
      if (stated !== undefined && isValidSettingValue(parameter, stated)) return stated;
      return parameterDefault(parameter, model);
    },
  };
}

/** The severity of a rule in this system: the last override, else the default. */
export function resolveSeverity(model: SystemModel, code: string, fallback: Severity): Severity | 'off' {
  let severity: Severity | 'off' = fallback;
  for (const o of model.rules?.severities ?? []) {
    if (o.rule === code) severity = o.severity;
  }
  return severity;
}

/** The rule settings of the element a finding concerns (pipes and inlets carry them). */
export function elementRulesOf(model: SystemModel, ref: ElementRef): ElementRules | undefined {
  switch (ref.kind) {
    case 'pipe':
      return model.pipes.find((p) => p.name === ref.name)?.rules;
    case 'inlet':
      return model.inlets.find((i) => i.name === ref.name)?.rules;
    default:
      return undefined;
  }
}

/** A reason counts when it has some non-blank text. */
export function hasReason(s: Suppression): boolean {
  return typeof s.reason === 'string' && s.reason.trim().length > 0;
}

export interface Acceptance {
  reason: string;
  /** Where the acceptance was written: on the element or for the whole system. */
  scope: 'element' | 'system';
}

/** The acceptance (with a reason) that covers this finding, element before system. */
export function findAcceptance(model: SystemModel, finding: Finding): Acceptance | undefined {
  const onElement = elementRulesOf(model, finding.element)?.suppressions.find(
    (s) => s.rule === finding.code && hasReason(s),
  );
  if (onElement) return { reason: onElement.reason.trim(), scope: 'element' };
  const onSystem = model.rules?.suppressions.find((s) => s.rule === finding.code && hasReason(s));
  if (onSystem) return { reason: onSystem.reason.trim(), scope: 'system' };
  return undefined;
}
