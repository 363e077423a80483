import { GrammarUtils } from 'langium';
import { RULES } from '@vacnet/engine';
import type { Inlet, Pipe } from '../../generated/ast.js';
import { appendTo, insertLinesAfter, memberNamed, systemOf } from './edit-text.js';
import { quickFix, type QuickFix } from './fix-context.js';

/**
 * The placeholder reason a suppression is written with. It reads as a
 * reason (the finding goes) but says plainly that one is owed; an empty
 * reason is still rejected (accept-without-reason).
 */
export const REASON_PLACEHOLDER = 'REASON';

const ENGINE_CODES = new Set(RULES.map((r) => r.code));

/**
 * Accept a design-rule finding with a reason to be written: on the element
 * when it is a pipe or an inlet (`accept <code> because "REASON"`), else for
 * the whole system (`rule <code> off because "REASON"` after the title line).
 */
export const acceptFinding: QuickFix = (context) => {
  if (!ENGINE_CODES.has(context.code)) return [];
  const element = context.data.element;
  const clause = `because "${REASON_PLACEHOLDER}"`;
  if (element?.kind === 'pipe' || element?.kind === 'inlet') {
    const node = memberNamed<Pipe | Inlet>(context.document, element.kind === 'pipe' ? 'Pipe' : 'Inlet', element.name);
    if (node?.$cstNode) {
      return [quickFix(context, `Accept '${context.code}' on ${element.kind} '${element.name}' with a reason (replace "${REASON_PLACEHOLDER}")`, [appendTo(node.$cstNode, `accept ${context.code} ${clause}`)])];
    }
  }
  const system = systemOf(context.document);
  const open = system ? GrammarUtils.findNodeForKeyword(system.$cstNode, '{') : undefined;
  if (!system || !open) return [];
  const line = `rule ${context.code} off ${clause}`;
  // Indent like the system's members (two spaces when it has none).
  const first = system.members[0]?.$cstNode;
  const edit = insertLinesAfter(context.document, open, [line]);
  if (first) {
    const indent = context.document.textDocument.getText({ start: { line: first.range.start.line, character: 0 }, end: first.range.start });
    edit.newText = edit.newText.replace(/^([ \t]*)/, /^[ \t]*$/.test(indent) ? indent : '  ');
  } else {
    edit.newText = edit.newText.replace(/^([ \t]*)/, '  ');
  }
  return [quickFix(context, `Accept '${context.code}' for the whole system with a reason (replace "${REASON_PLACEHOLDER}")`, [edit])];
};
