import type { SuppressedFinding, SystemAnalysis, SystemModel } from '@vacnet/engine';
import type { VacnetDiagnostic } from '@vacnet/language';
import { elementKey, type ElementIndex } from './element-index.js';

/** One side of a comparison as loaded: a file on disk or at a git revision. */
export interface ComparedSide {
  /** As the user wrote it (`HEAD~1:plant.vacnet`, `plant.vacnet`). */
  label: string;
  /** False when the file does not exist on that side (a file added or deleted). */
  exists: boolean;
  model?: SystemModel;
  analysis?: SystemAnalysis;
  /** The file's own findings (not its catalogs'). */
  diagnostics: VacnetDiagnostic[];
  accepted: SuppressedFinding[];
  elements: ElementIndex;
}

export interface PropertyChange {
  key: string;
  /** As written before; absent when the property was added. */
  before?: string;
  /** As written after; absent when the property was removed. */
  after?: string;
}

export interface ElementChange {
  change: 'added' | 'removed' | 'changed';
  kind: string;
  name: string;
  /** For added and removed elements: the element's properties as written. */
  text?: string;
  /** For changed elements. */
  properties?: PropertyChange[];
}

export interface InletMove {
  name: string;
  /** Worst-case vacuum at the tool, Pa; null when not computed on that side (or no such inlet). */
  beforePa: number | null;
  afterPa: number | null;
  /** What the inlet's tool needs, Pa (the new side's, else the old side's); null when nothing says. */
  requiredPa: number | null;
  flowBeforeStdM3PerS: number | null;
  flowAfterStdM3PerS: number | null;
  status: 'added' | 'removed' | 'better' | 'worse' | 'same' | 'unknown';
  shortBefore: boolean;
  shortAfter: boolean;
  /** Short of its requirement after, and either new or worse than before. */
  regression: boolean;
}

export interface PipeMove {
  name: string;
  /** Lowest velocity with one operator, m/s. */
  beforeMinVelocityMPerS: number | null;
  afterMinVelocityMPerS: number | null;
  /** The carrying-velocity rule found the pipe too slow (shown or accepted). */
  slowBefore: boolean;
  slowAfter: boolean;
  /** The pipe crossed the carrying threshold one way or the other. */
  crossed: boolean;
}

export interface ProducerPointSummary {
  name: string;
  flowStdM3PerS: number;
  vacuumPa: number;
  marginFraction: number | null;
}

export interface FindingEntry {
  severity: VacnetDiagnostic['severity'];
  code: string;
  /** `pipe riser`, or `line 12` for a finding of the language itself. */
  where: string;
  message: string;
}

export interface Comparison {
  old: ComparedSide;
  new: ComparedSide;
  elements: ElementChange[];
  inlets: InletMove[];
  pipes: PipeMove[];
  producer: { before: ProducerPointSummary | null; after: ProducerPointSummary | null };
  findings: { new: FindingEntry[]; resolved: FindingEntry[] };
  /** One sentence per regression (an inlet newly short, a new error). */
  regressions: string[];
}

/** Changes below 1 Pa (0.0003 inHg) are not changes: far below the 0.01 inHg a vacuum gauge resolves (common practice). */
export const VACUUM_TOLERANCE_PA = 1;

/** Compares two loaded sides. */
export function compareSides(before: ComparedSide, after: ComparedSide): Comparison {
  const inlets = compareInlets(before, after);
  const findings = compareFindings(before, after);
  const regressions: string[] = [];
  for (const inlet of inlets) {
    if (inlet.regression) regressions.push(inletRegression(inlet));
  }
  for (const finding of findings.new) {
    if (finding.severity === 'error') regressions.push(`a new error: ${finding.code} at ${finding.where}`);
  }
  return {
    old: before,
    new: after,
    elements: compareElements(before.elements, after.elements),
    inlets,
    pipes: comparePipes(before, after),
    producer: { before: producerOf(before.analysis), after: producerOf(after.analysis) },
    findings,
    regressions,
  };
}

function inletRegression(inlet: InletMove): string {
  const was = inlet.beforePa === null ? 'a new inlet' : 'worse than before';
  return `inlet ${inlet.name} falls short of the vacuum its tool needs (${was})`;
}

/** Elements added, removed and changed, new-file order first, then what was removed in old-file order. */
export function compareElements(before: ElementIndex, after: ElementIndex): ElementChange[] {
  const changes: ElementChange[] = [];
  const ordered = [...after.values()].sort((a, b) => a.order - b.order);
  for (const entry of ordered) {
    const previous = before.get(elementKey(entry.kind, entry.name));
    if (!previous) {
      changes.push({ change: 'added', kind: entry.kind, name: entry.name, text: describeEntry(entry) });
      continue;
    }
    const properties: PropertyChange[] = [];
    for (const [key, property] of entry.properties) {
      const old = previous.properties.get(key);
      if (!old) properties.push({ key, after: property.text });
      else if (old.canonical !== property.canonical) properties.push({ key, before: old.text, after: property.text });
    }
    for (const [key, property] of previous.properties) {
      if (!entry.properties.has(key)) properties.push({ key, before: property.text });
    }
    if (properties.length > 0) changes.push({ change: 'changed', kind: entry.kind, name: entry.name, properties });
  }
  for (const entry of [...before.values()].sort((a, b) => a.order - b.order)) {
    if (!after.has(elementKey(entry.kind, entry.name))) changes.push({ change: 'removed', kind: entry.kind, name: entry.name, text: describeEntry(entry) });
  }
  return changes;
}

function describeEntry(entry: { properties: Map<string, { text: string }> }): string {
  return [...entry.properties.values()].map((p) => p.text).join(' ');
}

function compareInlets(before: ComparedSide, after: ComparedSide): InletMove[] {
  const oldInlets = new Map((before.analysis?.inlets ?? []).map((i) => [i.name, i]));
  const newInlets = new Map((after.analysis?.inlets ?? []).map((i) => [i.name, i]));
  // Inlets named in either model, new-file order first.
  const names = [...new Set([...(after.model?.inlets ?? []).map((i) => i.name), ...(before.model?.inlets ?? []).map((i) => i.name)])];
  const inNewModel = new Set((after.model?.inlets ?? []).map((i) => i.name));
  const inOldModel = new Set((before.model?.inlets ?? []).map((i) => i.name));
  return names.map((name) => {
    const oldCase = oldInlets.get(name)?.worstCase ?? null;
    const newCase = newInlets.get(name)?.worstCase ?? null;
    const beforePa = oldCase?.toolVacuumPa ?? null;
    const afterPa = newCase?.toolVacuumPa ?? null;
    const requiredPa = newCase?.requiredToolVacuumPa ?? oldCase?.requiredToolVacuumPa ?? null;
    const short = (pa: number | null) => pa !== null && requiredPa !== null && pa < requiredPa - VACUUM_TOLERANCE_PA;
    let status: InletMove['status'];
    if (!inOldModel.has(name)) status = 'added';
    else if (!inNewModel.has(name)) status = 'removed';
    else if (beforePa === null || afterPa === null) status = 'unknown';
    else if (afterPa > beforePa + VACUUM_TOLERANCE_PA) status = 'better';
    else if (afterPa < beforePa - VACUUM_TOLERANCE_PA) status = 'worse';
    else status = 'same';
    const shortAfter = short(afterPa);
    return {
      name,
      beforePa,
      afterPa,
      requiredPa,
      flowBeforeStdM3PerS: oldCase?.flowStdM3PerS ?? null,
      flowAfterStdM3PerS: newCase?.flowStdM3PerS ?? null,
      status,
      shortBefore: short(beforePa),
      shortAfter,
      regression: shortAfter && (status === 'added' || status === 'worse' || (status === 'unknown' && beforePa === null)),
    };
  });
}

const SLOW = 'slow-carrying-velocity';

function slowPipes(side: ComparedSide): Set<string> {
  const slow = new Set<string>();
  for (const d of side.diagnostics) {
    const element = (d.data as { element?: { kind?: string; name?: string } } | undefined)?.element;
    if (d.code === SLOW && element?.kind === 'pipe' && element.name) slow.add(element.name);
  }
  for (const a of side.accepted) if (a.finding.code === SLOW && a.finding.element.kind === 'pipe') slow.add(a.finding.element.name);
  return slow;
}

function comparePipes(before: ComparedSide, after: ComparedSide): PipeMove[] {
  const oldPipes = new Map((before.analysis?.pipes ?? []).map((p) => [p.name, p]));
  const newPipes = new Map((after.analysis?.pipes ?? []).map((p) => [p.name, p]));
  const slowBefore = slowPipes(before);
  const slowAfter = slowPipes(after);
  const names = [...new Set([...newPipes.keys(), ...oldPipes.keys()])];
  // Only pipes analysed on both sides can be said to have crossed.
  return names.map((name) => {
    const analysedBoth = oldPipes.has(name) && newPipes.has(name);
    return {
      name,
      beforeMinVelocityMPerS: oldPipes.get(name)?.minVelocityMPerS ?? null,
      afterMinVelocityMPerS: newPipes.get(name)?.minVelocityMPerS ?? null,
      slowBefore: slowBefore.has(name),
      slowAfter: slowAfter.has(name),
      crossed: analysedBoth && slowBefore.has(name) !== slowAfter.has(name),
    };
  });
}

function producerOf(analysis: SystemAnalysis | undefined): ProducerPointSummary | null {
  const p = analysis?.producer;
  return p ? { name: p.name, flowStdM3PerS: p.flowStdM3PerS, vacuumPa: p.vacuumPa, marginFraction: p.marginFraction } : null;
}

/** New and resolved findings, matched by code and the element they concern (or their message, for the language's own). */
function compareFindings(before: ComparedSide, after: ComparedSide): Comparison['findings'] {
  const entries = (side: ComparedSide) => side.diagnostics.map((d) => ({ key: findingKey(d), entry: findingEntry(d) }));
  const oldEntries = entries(before);
  const newEntries = entries(after);
  const unmatched = (from: typeof oldEntries, against: typeof oldEntries) => {
    const counts = new Map<string, number>();
    for (const { key } of against) counts.set(key, (counts.get(key) ?? 0) + 1);
    const left: FindingEntry[] = [];
    for (const { key, entry } of from) {
      const n = counts.get(key) ?? 0;
      if (n > 0) counts.set(key, n - 1);
      else left.push(entry);
    }
    return left;
  };
  return { new: unmatched(newEntries, oldEntries), resolved: unmatched(oldEntries, newEntries) };
}

function elementOf(d: VacnetDiagnostic): { kind: string; name: string } | undefined {
  const element = (d.data as { element?: { kind?: unknown; name?: unknown } } | undefined)?.element;
  return element && typeof element.kind === 'string' && typeof element.name === 'string' ? { kind: element.kind, name: element.name } : undefined;
}

function findingKey(d: VacnetDiagnostic): string {
  const element = elementOf(d);
  return `${d.code}\u0000${element ? `${element.kind}\u0000${element.name}` : d.message}`;
}

function findingEntry(d: VacnetDiagnostic): FindingEntry {
  const element = elementOf(d);
  return { severity: d.severity, code: d.code, where: element ? `${element.kind} ${element.name}` : `line ${d.range.start.line + 1}`, message: d.message };
}
