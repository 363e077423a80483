import { RULES, type AnalysisFailure, type SuppressedFinding } from '@vacnet/engine';
import type { DiagnosticSeverity, VacnetDiagnostic } from '@vacnet/language';

/** One finding as the file's check reported it. */
export interface FindingRow {
  severity: DiagnosticSeverity;
  code: string;
  /** The rule's title, when known. */
  title: string | null;
  message: string;
  /** 1-based. */
  line: number;
  column: number;
  /** The report carries the code's rule page (link to it). */
  hasPage: boolean;
}

/** A finding the file accepts, with the reason written there. */
export interface AcceptedRow {
  code: string;
  title: string | null;
  /** `pipe main-1`, or `whole system (7 findings)`. */
  element: string;
  reason: string;
  /** The accepted finding's message (the first, for a system-wide acceptance). */
  message: string;
  hasPage: boolean;
}

/** A case the analysis could not solve. */
export interface FailureRow {
  stage: string;
  subject: string;
  cause: string;
  message: string;
}

/** A rule page for the appendix. */
export interface RulePage {
  code: string;
  title: string | null;
  /** The page's Markdown text. */
  markdown: string;
}

const SEVERITY_ORDER: Readonly<Record<DiagnosticSeverity, number>> = { error: 0, warning: 1, info: 2 };

/** Findings, errors first, then warnings, then infos; in file order within each. */
export function findingRows(diagnostics: readonly VacnetDiagnostic[], pages?: ReadonlyMap<string, string>): FindingRow[] {
  return [...diagnostics]
    .sort(
      (a, b) =>
        SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] ||
        a.range.start.line - b.range.start.line ||
        a.range.start.character - b.range.start.character,
    )
    .map((d) => ({
      severity: d.severity,
      code: d.code,
      title: ruleTitle(d.code, pages),
      message: d.message.replace(/\s*[\r\n]+\s*/g, ' ').trim(),
      line: d.range.start.line + 1,
      column: d.range.start.character + 1,
      hasPage: pages?.has(d.code) ?? false,
    }));
}

/** Accepted findings: each element's acceptance on its own line, a system-wide one once with its count. */
export function acceptedRows(accepted: readonly SuppressedFinding[], pages?: ReadonlyMap<string, string>): AcceptedRow[] {
  const rows: AcceptedRow[] = [];
  const systemWide = new Map<string, { row: AcceptedRow; count: number }>();
  for (const a of accepted) {
    const code = a.finding.code;
    if (a.scope === 'system') {
      const key = `${code}\u0000${a.reason}`;
      const entry = systemWide.get(key);
      if (entry) {
        entry.count++;
        continue;
      }
      const row: AcceptedRow = { code, title: ruleTitle(code, pages), element: 'whole system', reason: a.reason, message: a.finding.message, hasPage: pages?.has(code) ?? false };
      systemWide.set(key, { row, count: 1 });
      rows.push(row);
    } else {
      rows.push({
        code,
        title: ruleTitle(code, pages),
        element: `${a.finding.element.kind} ${a.finding.element.name}`,
        reason: a.reason,
        message: a.finding.message,
        hasPage: pages?.has(code) ?? false,
      });
    }
  }
  for (const { row, count } of systemWide.values()) row.element = `whole system (${count} ${count === 1 ? 'finding' : 'findings'})`;
  return rows;
}

export function failureRows(failures: readonly AnalysisFailure[]): FailureRow[] {
  return failures.map((f) => ({ stage: f.stage, subject: f.subject, cause: f.cause, message: f.message }));
}

/** The pages of the given codes that the caller supplied, each once, in first-seen order. */
export function rulePagesFor(codes: readonly string[], pages?: ReadonlyMap<string, string>): RulePage[] {
  const out: RulePage[] = [];
  const seen = new Set<string>();
  for (const code of codes) {
    if (seen.has(code)) continue;
    seen.add(code);
    const markdown = pages?.get(code);
    if (markdown !== undefined) out.push({ code, title: ruleTitle(code, pages), markdown });
  }
  return out;
}

/** A rule's title: the bold line under the page's heading, else the engine's rule table. */
export function ruleTitle(code: string, pages?: ReadonlyMap<string, string>): string | null {
  const page = pages?.get(code);
  const fromPage = page ? /^\*\*(.+?)\*\*\s*$/m.exec(page)?.[1]?.trim() : undefined;
  return fromPage ?? RULES.find((r) => r.code === code)?.title ?? null;
}
