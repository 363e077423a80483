/**
 * The design rules: the registry of every rule, the table the language
 * server and docs list, and `runRules`, which runs them and applies the
 * file's severities and acceptances.
 */
import type { Finding, SystemModel } from '../network/model.js';
import type { SystemAnalysis } from '../analysis/analysis-types.js';
import type { Rule, RuleInfo } from './rule.js';
import { createRuleSettings, findAcceptance, resolveSeverity, type Acceptance } from './rule-settings.js';
import { checkRuleSettings, RULE_FAILED, SETTINGS_RULE_INFOS, unusedAcceptances } from './rule-settings-check.js';
import { slowCarryingVelocity } from './slow-carrying-velocity.js';
import { fastVelocity } from './fast-velocity.js';
import { hoseLoss } from './hose-loss.js';
import { starvedInlet } from './starved-inlet.js';
import { producerShort } from './producer-short.js';
import { producerMargin } from './producer-margin.js';
import { missingCleanout } from './missing-cleanout.js';
import { teeBranchEntry } from './tee-branch-entry.js';
import { shortRadiusBend } from './short-radius-bend.js';
import { shrinkingPipe } from './shrinking-pipe.js';
import { unlockedPublicInlet } from './unlocked-public-inlet.js';
import { endFedHeader } from './end-fed-header.js';
import { dustNonconductive } from './dust-nonconductive.js';
import { dustBonding } from './dust-bonding.js';
import { dustSeparatorIndoors } from './dust-separator-indoors.js';
import { dustMetal } from './dust-metal.js';
import { toolChoked } from './tool-choked.js';

export type { Rule, RuleInfo, RuleParameter, RuleSettings, ParameterDimension } from './rule.js';
export type { Acceptance } from './rule-settings.js';

/** Every design rule, in the order findings are listed. */
export const ALL_RULES: readonly Rule[] = [
  starvedInlet,
  producerShort,
  producerMargin,
  slowCarryingVelocity,
  fastVelocity,
  hoseLoss,
  toolChoked,
  endFedHeader,
  missingCleanout,
  teeBranchEntry,
  shortRadiusBend,
  shrinkingPipe,
  unlockedPublicInlet,
  dustNonconductive,
  dustBonding,
  dustSeparatorIndoors,
  dustMetal,
];

/** Every code the engine's rule layer can emit, with defaults and sources (no checks). */
export const RULES: readonly RuleInfo[] = [...ALL_RULES, ...SETTINGS_RULE_INFOS].map((r) => ({
  code: r.code,
  title: r.title,
  defaultSeverity: r.defaultSeverity,
  parameters: r.parameters,
  needsAnalysis: r.needsAnalysis,
}));

export interface RunRulesOptions {
  /** Run only these rules (default: all). Settings are still checked against every known rule. */
  rules?: readonly Rule[];
}

export interface SuppressedFinding {
  finding: Finding;
  /** The reason written with the acceptance. */
  reason: string;
  scope: Acceptance['scope'];
}

export interface RuleResults {
  /** Findings to show, with this system's severities. */
  findings: Finding[];
  /** Findings accepted with a reason: for the report's list of what was accepted and why. */
  suppressed: SuppressedFinding[];
}

/**
 * Runs the design rules on a model (and its analysis, when there is one:
 * the flow rules stay silent without it), then applies severities (`off`
 * drops a finding) and acceptances. Never throws: a rule that fails becomes
 * a `rule-failed` finding.
 */
export function runRules(model: SystemModel, analysis?: SystemAnalysis, options: RunRulesOptions = {}): RuleResults {
  const rules = options.rules ?? ALL_RULES;
  const raw: Finding[] = [];
  const ran = new Set<string>();
  for (const rule of rules) {
    if (rule.needsAnalysis && !analysis) continue;
    try {
      const found = rule.check(model, analysis, createRuleSettings(rule, model));
      raw.push(...found);
      ran.add(rule.code);
    } catch (error) {
      raw.push({
        code: RULE_FAILED.code,
        severity: RULE_FAILED.defaultSeverity,
        message: `The rule '${rule.code}' could not run on this system (${error instanceof Error ? error.message : String(error)}); its findings are missing. Please report this.`,
        element: { kind: 'system', name: model?.name ?? '' },
      });
    }
  }
  const known = [...ALL_RULES, ...rules.filter((r) => !ALL_RULES.includes(r)), ...SETTINGS_RULE_INFOS];
  try {
    raw.push(...checkRuleSettings(model, known));
    raw.push(...unusedAcceptances(model, ran, raw));
  } catch (error) {
    raw.push({
      code: RULE_FAILED.code,
      severity: RULE_FAILED.defaultSeverity,
      message: `The rule settings could not be checked (${error instanceof Error ? error.message : String(error)}). Please report this.`,
      element: { kind: 'system', name: model?.name ?? '' },
    });
  }

  const findings: Finding[] = [];
  const suppressed: SuppressedFinding[] = [];
  for (const f of raw) {
    const severity = resolveSeverity(model, f.code, f.severity);
    if (severity === 'off') continue;
    const shown = { ...f, severity };
    const acceptance = findAcceptance(model, shown);
    if (acceptance) suppressed.push({ finding: shown, reason: acceptance.reason, scope: acceptance.scope });
    else findings.push(shown);
  }
  return { findings, suppressed };
}
