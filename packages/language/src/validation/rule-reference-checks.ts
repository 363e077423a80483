import type { ValidationAcceptor } from 'langium';
import { ALL_RULES } from '@vacnet/engine';
import type { Accept, RuleLine, Threshold } from '../generated/ast.js';
import { findParameter, findRule, writtenParameterName } from '../semantics/rule-parameters.js';
import { StructureCodes } from './codes.js';

/** A rule line, threshold or acceptance must name a rule (and parameter) that exists. */
export function checkRuleReference(line: RuleLine | Threshold | Accept, accept: ValidationAcceptor): void {
  // A line cut before its code (mid-edit) is the parser's syntax error already.
  if (!line.rule) return;
  const rule = findRule(line.rule);
  if (!rule) {
    accept('warning', `There is no design rule '${line.rule}'. Design rules: ${ALL_RULES.map((r) => r.code).join(', ')}.`, {
      node: line,
      property: 'rule',
      code: StructureCodes.unknownRule,
    });
    return;
  }
  if (line.$type === 'Accept' || !line.parameter) return;
  if (!findParameter(rule, line.parameter)) {
    const names = rule.parameters.map((p) => writtenParameterName(p.name));
    accept(
      'error',
      names.length > 0
        ? `'${rule.code}' has no setting '${line.parameter}'; it has: ${names.join(', ')}.`
        : `'${rule.code}' has no settings to change; only its severity.`,
      { node: line, property: 'parameter', code: StructureCodes.unknownRule },
    );
  }
}
