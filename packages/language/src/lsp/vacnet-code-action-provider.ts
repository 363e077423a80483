import type { LangiumDocument } from 'langium';
import type { CodeActionProvider, LangiumServices } from 'langium/lsp';
import type { CodeAction, CodeActionParams, Command, Diagnostic } from 'vscode-languageserver';
import type { AnalysisCache } from '../engine-bridge/analysis-cache.js';
import { acceptFinding } from './quick-fixes/accept-finding.js';
import { addCleanout } from './quick-fixes/add-cleanout.js';
import type { FixContext, QuickFix } from './quick-fixes/fix-context.js';
import { resizePipe } from './quick-fixes/resize-pipe.js';
import { swapHose } from './quick-fixes/swap-hose.js';
import { swapProducer } from './quick-fixes/swap-producer.js';
import { wyeEntry } from './quick-fixes/wye-entry.js';

/** The quick fixes of each finding code, most useful first; any design-rule finding can also be accepted with a reason. */
const FIXES: Readonly<Record<string, readonly QuickFix[]>> = {
  'slow-carrying-velocity': [resizePipe],
  'fast-velocity': [resizePipe],
  'shrinking-pipe': [resizePipe],
  'missing-cleanout': [addCleanout],
  'tee-branch-entry': [wyeEntry],
  'hose-loss': [swapHose],
  'producer-short': [swapProducer],
  'producer-margin': [swapProducer],
};

/**
 * Quick fixes for the engine's findings, each an edit that makes the file
 * check cleaner. Each works from the finding's data (what the engine
 * computed: the size, the place, the demand) and, where it compares catalog
 * items, from the cached analysis of this text version. No solve happens
 * here.
 */
export class VacnetCodeActionProvider implements CodeActionProvider {
  constructor(private readonly services: LangiumServices & { engine?: { AnalysisCache?: AnalysisCache } }) {}

  getCodeActions(document: LangiumDocument, params: CodeActionParams): Array<Command | CodeAction> | undefined {
    const state = this.services.engine?.AnalysisCache?.current(document);
    const actions: CodeAction[] = [];
    for (const diagnostic of params.context.diagnostics) {
      const code = typeof diagnostic.code === 'string' ? diagnostic.code : undefined;
      if (!code) continue;
      const data = dataOf(diagnostic, state?.result?.diagnostics);
      const context: FixContext = { services: this.services, document, state, diagnostic, code, data };
      for (const fix of [...(FIXES[code] ?? []), acceptFinding]) {
        try {
          actions.push(...fix(context));
        } catch {
          // A fix that cannot be built is left out; the others still come.
        }
      }
    }
    return actions;
  }
}

/**
 * The finding's data: as the client sent it back, else from the cached
 * findings at the same range with the same code (clients may drop `data`).
 */
function dataOf(diagnostic: Diagnostic, cached: { code: string; range: Diagnostic['range']; data?: Record<string, unknown> }[] | undefined): FixContext['data'] {
  const sent = diagnostic.data as Record<string, unknown> | undefined;
  if (sent && typeof sent === 'object' && sent.element) return sent as FixContext['data'];
  const match = cached?.find((d) => d.code === diagnostic.code && sameRange(d.range, diagnostic.range));
  return (match?.data ?? {}) as FixContext['data'];
}

function sameRange(a: Diagnostic['range'], b: Diagnostic['range']): boolean {
  return a.start.line === b.start.line && a.start.character === b.start.character && a.end.line === b.end.line && a.end.character === b.end.character;
}
