import { createHash } from 'node:crypto';
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import { RULES } from '@vacnet/engine';
import type { SourceRange, VacnetDiagnostic } from '@vacnet/language';
import type { CheckResult } from '../check-result.js';
import type { RuleDocs } from '../rule-docs.js';

/**
 * The SARIF format: a Static Analysis Results Interchange Format 2.1.0 log
 * (OASIS Standard, 27 March 2020), for code-scanning dashboards and review
 * tools. One run; `tool.driver.rules` holds each code that occurs, with its
 * title, summary and help from docs/rules; each finding is a result with a
 * level (error, warning, note), a 1-based region, related locations, a
 * stable fingerprint, and, for findings the file accepts with a reason, an
 * in-source suppression carrying that reason.
 */

/** The schema SARIF logs conventionally name (SARIF 2.1.0 section 3.13.3 allows any URI of the schema). */
const SARIF_SCHEMA = 'https://json.schemastore.org/sarif-2.1.0.json';
/** Base of the artifact URIs: the folder `vacnet check` ran in (SARIF 2.1.0 section 3.14.14). */
const SRCROOT = 'SRCROOT';
/** Name of our fingerprint in `partialFingerprints`; versioned, as SARIF 2.1.0 section 3.27.17 advises. */
const FINGERPRINT = 'vacnetFinding/v1';

export interface SarifOptions {
  version: string;
  docs: RuleDocs;
  /** False when a file could not be read: the run did not check everything. */
  executionSuccessful: boolean;
}

type Level = 'error' | 'warning' | 'note';
const LEVEL: Record<VacnetDiagnostic['severity'], Level> = { error: 'error', warning: 'warning', info: 'note' };

interface SarifResult {
  ruleId: string;
  ruleIndex: number;
  level: Level;
  message: { text: string };
  locations: unknown[];
  relatedLocations?: unknown[];
  partialFingerprints: Record<string, string>;
  suppressions?: unknown[];
  properties?: Record<string, unknown>;
}

/** The SARIF log as an object (JSON-ready). */
export function toSarif(result: CheckResult, options: SarifOptions): Record<string, unknown> {
  const cwd = result.cwd ?? process.cwd();
  const rules: Record<string, unknown>[] = [];
  const ruleIndex = new Map<string, number>();
  const indexOf = (code: string, severity: VacnetDiagnostic['severity']): number => {
    let index = ruleIndex.get(code);
    if (index === undefined) {
      index = rules.length;
      ruleIndex.set(code, index);
      rules.push(describeRule(code, severity, options.docs));
    }
    return index;
  };

  const results: SarifResult[] = [];
  const seenFingerprints = new Map<string, number>();
  const fingerprint = (identity: string): string => {
    // The same finding twice in one file (rare) gets an occurrence number so fingerprints stay unique.
    const count = seenFingerprints.get(identity) ?? 0;
    seenFingerprints.set(identity, count + 1);
    return createHash('sha256').update(count === 0 ? identity : `${identity}\u0000${count}`).digest('hex').slice(0, 32);
  };

  for (const file of result.files) {
    const uri = artifactUri(file.path, cwd);
    for (const d of file.diagnostics) {
      const entry: SarifResult = {
        ruleId: d.code,
        ruleIndex: indexOf(d.code, d.severity),
        level: LEVEL[d.severity],
        message: { text: d.message },
        locations: [location(uri, d.range)],
        partialFingerprints: { [FINGERPRINT]: fingerprint(identityOf(file.path, d)) },
        properties: { source: d.source },
      };
      const related = (d.related ?? []).map((r, i) => ({ id: i + 1, ...location(artifactUri(r.path, cwd), r.range), message: { text: r.message } }));
      if (related.length > 0) entry.relatedLocations = related;
      results.push(entry);
    }
    for (const a of file.accepted ?? []) {
      const element = a.finding.element;
      results.push({
        ruleId: a.finding.code,
        ruleIndex: indexOf(a.finding.code, a.finding.severity),
        level: LEVEL[a.finding.severity],
        message: { text: a.finding.message },
        locations: [location(uri, a.range ?? ORIGIN)],
        partialFingerprints: { [FINGERPRINT]: fingerprint(`${a.finding.code}\u0000${file.path}\u0000${element.kind}:${element.name}:${element.property ?? ''}`) },
        // SARIF 2.1.0 section 3.35: accepted in the source, with the written reason.
        suppressions: [{ kind: 'inSource', status: 'accepted', justification: a.reason }],
      });
    }
  }

  return {
    $schema: SARIF_SCHEMA,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: 'vacnet',
            version: options.version,
            semanticVersion: /^\d+\.\d+\.\d+/.test(options.version) ? options.version : undefined,
            rules,
          },
        },
        invocations: [{ executionSuccessful: options.executionSuccessful }],
        originalUriBaseIds: { [SRCROOT]: { uri: folderUri(cwd) } },
        columnKind: 'utf16CodeUnits',
        results,
      },
    ],
  };
}

/** The SARIF log, pretty-printed, ending with a newline. */
export function formatSarif(result: CheckResult, options: SarifOptions): string {
  return JSON.stringify(toSarif(result, options), null, 2) + '\n';
}

function describeRule(code: string, severity: VacnetDiagnostic['severity'], docs: RuleDocs): Record<string, unknown> {
  const doc = docs.get(code);
  return {
    id: code,
    name: pascalCase(code),
    shortDescription: { text: doc.title },
    fullDescription: { text: doc.summary },
    help: { text: doc.text, markdown: doc.markdown },
    // A design rule's own default; a code of the language keeps the severity it is reported with.
    defaultConfiguration: { level: LEVEL[RULES.find((r) => r.code === code)?.defaultSeverity ?? severity] },
  };
}

/** SARIF 2.1.0 section 3.49.7 recommends a readable `name` in PascalCase beside the opaque id. */
function pascalCase(code: string): string {
  return code.replace(/(^|-)([a-z0-9])/g, (_, _dash: string, c: string) => c.toUpperCase());
}

/**
 * What identifies a finding across edits that move it: its code, its file,
 * and the element it concerns (engine findings) or its message (the
 * language's own findings name what they are about). Line numbers are left
 * out so that inserting a line above does not make every finding "new".
 */
function identityOf(path: string, d: VacnetDiagnostic): string {
  const element = (d.data as { element?: { kind?: string; name?: string; property?: string } } | undefined)?.element;
  const what = element ? `${element.kind}:${element.name}:${element.property ?? ''}` : d.message;
  return `${d.code}\u0000${path}\u0000${what}`;
}

const ORIGIN: SourceRange = { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } };

function location(uri: { uri: string; uriBaseId?: string }, range: SourceRange): { physicalLocation: unknown } {
  return { physicalLocation: { artifactLocation: uri, region: region(range) } };
}

/** SARIF regions are 1-based (section 3.30.5); an empty range is an insertion point at its start. */
function region(range: SourceRange): Record<string, number> {
  const startLine = range.start.line + 1;
  const startColumn = range.start.character + 1;
  const endLine = Math.max(startLine, range.end.line + 1);
  const endColumn = endLine === startLine ? Math.max(startColumn, range.end.character + 1) : range.end.character + 1;
  return { startLine, startColumn, endLine, endColumn };
}

/** A file as a URI relative to the working folder (forward slashes, percent-encoded); absolute outside it. */
function artifactUri(path: string, cwd: string): { uri: string; uriBaseId?: string } {
  const absolute = isAbsolute(path) ? path : resolve(cwd, path);
  const rel = relative(cwd, absolute);
  if (rel === '' || rel.startsWith('..') || isAbsolute(rel)) return { uri: pathToFileURL(absolute).href };
  return { uri: rel.split(sep).map(encodeURIComponent).join('/'), uriBaseId: SRCROOT };
}

function folderUri(folder: string): string {
  const href = pathToFileURL(folder).href;
  return href.endsWith('/') ? href : `${href}/`;
}
