import type { SystemSummary } from '../../language/src/lsp/system-requests-protocol.js';

/** What the status bar item shows for a system. */
export interface SummaryText {
  /** One short line, with a codicon. */
  text: string;
  /** Markdown for the hover. */
  tooltip: string;
  /** Draw attention: the producer falls short, a tool gets less than it needs, or the file has errors. */
  warning: boolean;
}

/**
 * The status bar's text for a system's summary: the producer margin and the
 * worst inlet when the analysis is in, else where it stands.
 */
export function summaryText(summary: SystemSummary): SummaryText {
  const title = summary.system ? `**${escapeMarkdown(summary.system)}**` : '**vacnet**';
  const counts = `${plural(summary.counts.errors, 'error')}, ${plural(summary.counts.warnings, 'warning')}, ${plural(summary.counts.infos, 'info')}`;
  switch (summary.status) {
    case 'no-system':
      return { text: '$(library) vacnet catalog', tooltip: `A catalog file: no system to analyse.\n\n${counts}`, warning: summary.counts.errors > 0 };
    case 'pending':
      return { text: '$(sync~spin) vacnet', tooltip: `${title}\n\nAnalysing\u2026`, warning: false };
    case 'blocked':
      return { text: `$(error) ${plural(summary.counts.errors, 'error')}`, tooltip: `${title}\n\nThe airflow analysis runs once the errors are fixed.\n\n${counts}`, warning: true };
    case 'failed':
      return { text: '$(error) no flow results', tooltip: `${title}\n\nThe airflow analysis could not run: see the Problems panel.\n\n${counts}`, warning: true };
    case 'ready':
      break;
  }
  const parts: string[] = [];
  const lines = [title, ''];
  const producer = summary.producer;
  if (producer) {
    parts.push(producer.marginText);
    lines.push(`Producer ${code(producer.name)}: ${escapeMarkdown(producer.pointText)}, ${escapeMarkdown(producer.marginText)} on flow.`, '');
  } else {
    parts.push('no operating point');
    lines.push('The producer has no operating point: see the Problems panel.', '');
  }
  const worst = summary.worstInlet;
  if (worst) {
    parts.push(`worst ${worst.name}`);
    lines.push(`Worst inlet ${code(worst.name)}: ${escapeMarkdown(worst.text)}.`, '');
  }
  lines.push(counts, '', 'Click for the design report.');
  const short = (producer?.marginFraction ?? 0) < 0 || worst?.short === true;
  return {
    text: `${short || summary.counts.errors > 0 ? '$(warning)' : '$(dashboard)'} ${parts.join(' \u00b7 ')}`,
    tooltip: lines.join('\n'),
    warning: short || summary.counts.errors > 0,
  };
}

function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? '' : 's'}`;
}

/** Backslash-escapes the characters Markdown would read as inline markup in running text. */
function escapeMarkdown(text: string): string {
  return text.replace(/[\\`*_[\]<>]/g, '\\$&');
}

/** A name as a code span (backslashes are literal there, so a backtick is the only character that must go). */
function code(name: string): string {
  return `\`${name.replace(/`/g, "'")}\``;
}
