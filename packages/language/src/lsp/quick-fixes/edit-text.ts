import type { AstNode, CstNode, LangiumDocument } from 'langium';
import type { Position, TextEdit } from 'vscode-languageserver';
import type { Document, System } from '../../generated/ast.js';

/** The system of a document, if any. */
export function systemOf(document: LangiumDocument): System | undefined {
  return (document.parseResult.value as Document | undefined)?.systems?.[0];
}

/** A named member of the system (`Pipe`, `Inlet`, `Plant`, `Scenario`). */
export function memberNamed<T extends AstNode>(document: LangiumDocument, type: string, name: unknown): T | undefined {
  return systemOf(document)?.members.find((m) => m.$type === type && (m as { name?: unknown }).name === name) as T | undefined;
}

/** The whitespace that starts a line. */
export function indentOf(document: LangiumDocument, line: number): string {
  const text = document.textDocument.getText({ start: { line, character: 0 }, end: { line: line + 1, character: 0 } });
  return /^[ \t]*/.exec(text)?.[0] ?? '';
}

/** Inserts whole lines after the line on which a node ends, indented like the node's first line. */
export function insertLinesAfter(document: LangiumDocument, node: CstNode, lines: string[]): TextEdit {
  const indent = indentOf(document, node.range.start.line);
  const position: Position = { line: node.range.end.line + 1, character: 0 };
  const eol = document.textDocument.getText().includes('\r\n') ? '\r\n' : '\n';
  if (position.line >= document.textDocument.lineCount) {
    // The node ends on the last line: start a new line after it.
    const end = document.textDocument.positionAt(document.textDocument.getText().length);
    return { range: { start: end, end }, newText: lines.map((l) => `${eol}${indent}${l}`).join('') };
  }
  return { range: { start: position, end: position }, newText: lines.map((l) => `${indent}${l}${eol}`).join('') };
}

/** Appends text to the end of a node (one space apart). */
export function appendTo(node: CstNode, text: string): TextEdit {
  return { range: { start: node.range.end, end: node.range.end }, newText: ` ${text}` };
}

/** A number for a file: at most `digits` significant digits, no exponent, no trailing zeros. */
export function numberText(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '0';
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, Math.min(12, digits - 1 - magnitude));
  const text = value.toFixed(decimals);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}
