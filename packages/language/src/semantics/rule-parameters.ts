import { RULES, type RuleInfo, type RuleParameter } from '@vacnet/engine';
import type { Quantity, RuleLine, Threshold } from '../generated/ast.js';
import type { Expectation } from './quantity-expectations.js';
// quantity-expectations imports this module too; only types flow back, so the cycle is harmless.

/** Rule parameters are written in kebab-case in files (`min-velocity`) and camelCase in the engine. */
export function parameterName(written: string): string {
  return written.replace(/-([a-z0-9])/g, (_, c: string) => c.toUpperCase());
}

export function writtenParameterName(name: string): string {
  return name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());
}

const rulesByCode = new Map<string, RuleInfo>(RULES.map((rule) => [rule.code, rule]));

export function findRule(code: string): RuleInfo | undefined {
  return rulesByCode.get(code);
}

export function findParameter(rule: RuleInfo, written: string): RuleParameter | undefined {
  const name = parameterName(written);
  return rule.parameters.find((p) => p.name === name);
}

/** What the value of a `rule` or `threshold` line must measure, from the engine's rule table. */
export function ruleParameterExpectation(quantity: Quantity): Expectation | undefined {
  const line = quantity.$container as RuleLine | Threshold;
  if (line.$type !== 'RuleLine' && line.$type !== 'Threshold') return undefined;
  const rule = findRule(line.rule);
  const parameter = rule && line.parameter ? findParameter(rule, line.parameter) : undefined;
  if (!parameter) return undefined;
  const what = `the ${writtenParameterName(parameter.name)} of ${rule!.code}`;
  const [min, max] = parameter.range ?? [undefined, undefined];
  const bounds = { ...(min !== undefined ? { min } : {}), ...(max !== undefined ? { max } : {}) };
  switch (parameter.dimension) {
    case 'ratio':
    case 'count':
      return { dimension: 'dimensionless', what, ...bounds };
    default:
      return { dimension: parameter.dimension, what, ...bounds };
  }
}
