/**
 * The wire format of the server's requests about one system document, for
 * editor clients (the status bar, the report and schematic views). Plain
 * types and two pure functions: a client imports this file alone, without
 * the language services.
 */

/** `{ uri }` -> SystemSummary | null: the producer margin and the worst inlet of the document's analysis. */
export const SYSTEM_SUMMARY_REQUEST = 'vacnet/systemSummary';
/** `{ uri }` -> ReportData | null: what the design report is made from, for the document's current text. */
export const REPORT_DATA_REQUEST = 'vacnet/reportData';

export interface SystemRequestParams {
  uri: string;
}

/** Where the document's analysis stands (the server's analysis cache states). */
export type SummaryStatus = 'no-system' | 'blocked' | 'pending' | 'ready' | 'failed';

export interface SystemSummary {
  uri: string;
  /** The text version the summary describes. */
  version: number;
  status: SummaryStatus;
  /** The system's title. */
  system?: string;
  /** Findings of this version by severity (syntax, structure and engine). */
  counts: { errors: number; warnings: number; infos: number };
  /** The producer at the design operating point (ready only). */
  producer?: {
    name: string;
    /** Curve flow over demand flow at the demand vacuum, minus one; null when no tool states what it needs. */
    marginFraction: number | null;
    /** `margin 29 %` or `margin unknown`, in the system's display units. */
    marginText: string;
    /** `244 scfm at 11.3 inHg`. */
    pointText: string;
  };
  /** The inlet whose tool is left with the least vacuum over what it needs (ready only). */
  worstInlet?: {
    name: string;
    /** `6.18 inHg at the tool (needs 5.00 inHg)`. */
    text: string;
    /** The tool gets less than it needs. */
    short: boolean;
  };
}

/** A ReportData travels as a string: `encodePlainData` of the report input. */
export interface ReportData {
  uri: string;
  version: number;
  status: SummaryStatus;
  /** `encodePlainData({ path, model?, analysis?, diagnostics, accepted })`, the report's input. */
  input: string;
}

const NON_FINITE = '$vacnetNonFinite';

/**
 * JSON text of plain data that keeps NaN and the infinities (JSON turns
 * them into null), so numbers arrive as the engine left them.
 */
export function encodePlainData(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? { [NON_FINITE]: String(v) } : v));
}

/** The inverse of `encodePlainData`. Throws on text that is not JSON. */
export function decodePlainData<T>(text: string): T {
  return JSON.parse(text, (_key, v: unknown) => {
    if (v && typeof v === 'object' && !Array.isArray(v)) {
      const marked = (v as Record<string, unknown>)[NON_FINITE];
      if (typeof marked === 'string' && Object.keys(v).length === 1) return Number(marked);
    }
    return v;
  }) as T;
}
