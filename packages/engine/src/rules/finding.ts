/** Building a rule's finding with the rule's code and default severity. */
import type { ElementRef, Finding } from '../network/model.js';
import type { RuleInfo } from './rule.js';

export interface FindingExtras {
  related?: Finding['related'];
  fix?: Record<string, unknown>;
}

export function ruleFinding(rule: RuleInfo, element: ElementRef, message: string, extras: FindingExtras = {}): Finding {
  const f: Finding = { code: rule.code, severity: rule.defaultSeverity, message, element };
  if (extras.related && extras.related.length > 0) f.related = extras.related;
  if (extras.fix) f.fix = extras.fix;
  return f;
}
