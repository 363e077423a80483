import type { LangiumDocument } from 'langium';
import type { LangiumServices } from 'langium/lsp';
import type { CodeAction, Diagnostic, TextEdit } from 'vscode-languageserver';
import type { ElementRef } from '@vacnet/engine';
import type { DocumentAnalysis } from '../../engine-bridge/analysis-cache.js';

/** What a quick fix gets: the finding, its fix data, and the document with its analysis. */
export interface FixContext {
  services: LangiumServices;
  document: LangiumDocument;
  /** The analysis of this exact text version, when it is ready. */
  state: DocumentAnalysis | undefined;
  diagnostic: Diagnostic;
  code: string;
  /** The finding's data: the engine's fix data and the element it concerns. */
  data: Record<string, unknown> & { element?: ElementRef };
}

export type QuickFix = (context: FixContext) => CodeAction[];

/** A quick-fix code action editing this document. */
export function quickFix(context: FixContext, title: string, edits: TextEdit[], preferred = false): CodeAction {
  return {
    title,
    kind: 'quickfix',
    diagnostics: [context.diagnostic],
    ...(preferred ? { isPreferred: true } : {}),
    edit: { changes: { [context.document.uri.toString()]: edits } },
  };
}

/** A finite number from fix data, else undefined. */
export function numberIn(data: Record<string, unknown>, key: string): number | undefined {
  const value = data[key];
  return typeof value === 'number' && Number.isFinite(value) ? value : undefined;
}
