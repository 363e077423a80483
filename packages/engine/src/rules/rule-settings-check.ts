/**
 * Findings about the rule settings themselves: a setting or acceptance that
 * names no known rule or parameter, a value that cannot be used, an
 * acceptance without a reason (ignored), and an acceptance that no longer
 * matches any finding (stale, worth deleting in review).
 */
import type { ElementRef, ElementRules, Finding, SystemModel } from '../network/model.js';
import type { RuleInfo } from './rule.js';
import { hasReason, isValidSettingValue } from './rule-settings.js';

export const UNKNOWN_RULE: RuleInfo = {
  code: 'unknown-rule',
  title: 'Rule setting names no known rule or parameter',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
};

export const INVALID_RULE_SETTING: RuleInfo = {
  code: 'invalid-rule-setting',
  title: 'Rule setting value cannot be used',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
};

export const ACCEPT_WITHOUT_REASON: RuleInfo = {
  code: 'accept-without-reason',
  title: 'Finding accepted without a reason',
  defaultSeverity: 'warning',
  parameters: [],
  needsAnalysis: false,
};

export const UNUSED_ACCEPT: RuleInfo = {
  code: 'unused-accept',
  title: 'Acceptance that matches no finding',
  defaultSeverity: 'info',
  parameters: [],
  needsAnalysis: false,
};

export const RULE_FAILED: RuleInfo = {
  code: 'rule-failed',
  title: 'A design rule could not run',
  defaultSeverity: 'error',
  parameters: [],
  needsAnalysis: false,
};

/** The meta codes this file and the runner emit. */
export const SETTINGS_RULE_INFOS: readonly RuleInfo[] = [
  UNKNOWN_RULE,
  INVALID_RULE_SETTING,
  ACCEPT_WITHOUT_REASON,
  UNUSED_ACCEPT,
  RULE_FAILED,
];

interface Holder {
  ref: ElementRef;
  rules: ElementRules;
}

/** Every place rule settings are written: the system, its pipes and its inlets. */
export function ruleHolders(model: SystemModel): Holder[] {
  const holders: Holder[] = [];
  if (model.rules) holders.push({ ref: { kind: 'system', name: model.name }, rules: model.rules });
  for (const p of model.pipes ?? []) if (p.rules) holders.push({ ref: { kind: 'pipe', name: p.name }, rules: p.rules });
  for (const i of model.inlets ?? []) if (i.rules) holders.push({ ref: { kind: 'inlet', name: i.name }, rules: i.rules });
  return holders;
}

/** A parameter as written in files: kebab-case (`minRadius` is written `min-radius`). */
function written(name: string): string {
  return name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());
}

function finding(info: RuleInfo, ref: ElementRef, property: string, message: string): Finding {
  return { code: info.code, severity: info.defaultSeverity, message, element: { ...ref, property } };
}

/**
 * Checks the settings, severities and acceptances against the known rules.
 * `known` is every rule the product has (not only those run this time).
 */
export function checkRuleSettings(model: SystemModel, known: readonly RuleInfo[]): Finding[] {
  const byCode = new Map(known.map((r) => [r.code, r] as const));
  const out: Finding[] = [];
  for (const { ref, rules } of ruleHolders(model)) {
    const where = ref.kind === 'system' ? 'rule' : 'threshold';
    for (const s of rules.settings ?? []) {
      const info = byCode.get(s.rule);
      if (!info) {
        out.push(finding(UNKNOWN_RULE, ref, where, `No rule is called '${s.rule}'; the setting has no effect. Check the spelling against docs/rules/.`));
        continue;
      }
      const parameter = info.parameters.find((p) => p.name === s.parameter);
      if (!parameter) {
        const names = info.parameters.map((p) => written(p.name)).join(', ') || 'none';
        out.push(finding(UNKNOWN_RULE, ref, where, `Rule '${s.rule}' has no setting '${written(s.parameter)}' (it has: ${names}); the setting has no effect.`));
        continue;
      }
      if (!isValidSettingValue(parameter, s.value)) {
        const [low, high] = parameter.range ?? [0, Number.POSITIVE_INFINITY];
        out.push(
          finding(
            INVALID_RULE_SETTING,
            ref,
            where,
            `The ${written(s.parameter)} of '${s.rule}' must be from ${low} to ${high} (SI units); the default applies instead.`,
          ),
        );
      }
    }
    for (const s of rules.suppressions ?? []) {
      if (!byCode.has(s.rule)) {
        out.push(finding(UNKNOWN_RULE, ref, 'accept', `No rule is called '${s.rule}'; the acceptance has no effect.`));
      } else if (!hasReason(s)) {
        out.push(
          finding(
            ACCEPT_WITHOUT_REASON,
            ref,
            'accept',
            `Accepting '${s.rule}' needs a reason, so reviewers know why: write accept ${s.rule} because "...". Until then the findings still show.`,
          ),
        );
      }
    }
    if (ref.kind === 'system') {
      for (const o of model.rules?.severities ?? []) {
        if (!byCode.has(o.rule)) {
          out.push(finding(UNKNOWN_RULE, ref, 'rule', `No rule is called '${o.rule}'; the severity has no effect.`));
        }
      }
    }
  }
  return out;
}

/**
 * Acceptances (with a reason) for rules that ran but matched no finding:
 * the problem was fixed, so the acceptance can go.
 */
export function unusedAcceptances(
  model: SystemModel,
  ran: ReadonlySet<string>,
  findings: readonly Finding[],
): Finding[] {
  const out: Finding[] = [];
  for (const { ref, rules } of ruleHolders(model)) {
    for (const s of rules.suppressions ?? []) {
      if (!hasReason(s) || !ran.has(s.rule)) continue;
      const used = findings.some(
        (f) => f.code === s.rule && (ref.kind === 'system' || (f.element.kind === ref.kind && f.element.name === ref.name)),
      );
      if (!used) {
        out.push(
          finding(
            UNUSED_ACCEPT,
            ref,
            'accept',
            `Nothing here triggers '${s.rule}' any more; remove the acceptance so it does not hide a future problem.`,
          ),
        );
      }
    }
  }
  return out;
}
