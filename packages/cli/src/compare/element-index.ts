import { normaliseUnitText, parseNumberText, toSI, type Dimension } from '@vacnet/engine';
import type { Ast } from '@vacnet/language';

/**
 * What a file says, element by element, independent of layout: each
 * element (a pipe, an inlet, a design-basis line, a catalog item...) keyed
 * by kind and name, with its properties keyed by what they set. Each
 * property keeps the text as written (tokens joined by one space, comments
 * dropped) for people, and a canonical form for comparing: numbers read
 * with their unit into SI, so `2 in` and `50.8 mm` are the same size, and
 * names as written. Order of elements and properties does not matter.
 */
export interface ElementProperty {
  /** As written, e.g. `size 2-1/2 in`. */
  text: string;
  /** For comparing; equal when the property means the same. */
  canonical: string;
}

export interface ElementEntry {
  kind: string;
  name: string;
  /** Properties by key (`size`, `spec`, `bend`, `threshold fast-velocity limit`...). */
  properties: Map<string, ElementProperty>;
  /** Position in its file, for listing in file order. */
  order: number;
}

/** The elements of one file by `kind name`. */
export type ElementIndex = Map<string, ElementEntry>;

export function elementKey(kind: string, name: string): string {
  return `${kind} ${name}`;
}

/** Indexes a parsed file. Never throws: a node it does not know is keyed by its type and text. */
export function indexElements(document: Ast.Document | undefined): ElementIndex {
  const index: ElementIndex = new Map();
  if (!document) return index;
  let order = 0;
  const add = (kind: string, name: string, properties: [string, AstLike | AstLike[]][]) => {
    const map = new Map<string, ElementProperty>();
    for (const [key, value] of properties) {
      const nodes = (Array.isArray(value) ? value : [value]).filter(Boolean);
      if (nodes.length === 0) continue;
      const previous = map.get(key);
      const texts = nodes.map(textOf);
      const canonicals = nodes.map(canonical);
      // A key that repeats (two bends, two filters) is one property listing all of them.
      const text = previous ? `${previous.text}, ${texts.join(', ')}` : texts.join(', ');
      const canonicalText = [...(previous ? previous.canonical.split('\u0001') : []), ...canonicals].sort().join('\u0001');
      map.set(key, { text, canonical: canonicalText });
    }
    index.set(elementKey(kind, name), { kind, name, properties: map, order: order++ });
  };

  for (const use of document.uses ?? []) add('use', unquote(use.path ?? ''), []);
  for (const definition of document.definitions ?? []) {
    add(DEFINITION_KIND[definition.$type] ?? definition.$type, definition.name, definitionProperties(definition));
  }
  for (const system of document.systems ?? []) {
    add('system', '', [['title', system as unknown as AstLike]]);
    for (const member of system.members ?? []) indexMember(member, add);
  }
  return index;
}

type AstLike = { $type: string; $cstNode?: unknown } & Record<string, unknown>;
type Add = (kind: string, name: string, properties: [string, AstLike | AstLike[]][]) => void;

const DEFINITION_KIND: Record<string, string> = {
  PipeSpec: 'spec',
  HoseKind: 'hose',
  ToolKind: 'tool',
  ProducerModel: 'producer',
  SeparatorModel: 'separator',
  FilterModel: 'filter',
};

/** The one-word keys of design-basis lines. */
const SETTING_KEYWORD: Record<string, string> = {
  Site: 'site',
  DisplayUnits: 'units',
  Operators: 'operators',
  CleaningWindow: 'window',
  Debris: 'debris',
  Dust: 'dust',
  Margin: 'margin',
  TestOrifice: 'test-orifice',
  Defaults: 'defaults',
};

function indexMember(member: Ast.SystemMember, add: Add): void {
  const node = member as unknown as AstLike;
  switch (member.$type) {
    case 'Plant':
      add('plant', member.name, member.equipment.map((e) => [EQUIPMENT_KEY[e.$type] ?? e.$type, e as unknown as AstLike]));
      return;
    case 'Pipe': {
      const route = { $type: 'Route', $cstNode: undefined, text: `from ${member.from?.$refText ?? ''} ${member.to ? `to ${member.to.name}` : `into ${member.into?.$refText ?? ''}`}` } as unknown as AstLike;
      add('pipe', member.name, [['route', route], ...member.properties.map((p) => [propertyKey(p as unknown as AstLike), p as unknown as AstLike] as [string, AstLike])]);
      return;
    }
    case 'Inlet':
      add('inlet', member.name, [['position', positionOf(member)], ...member.properties.map((p) => [propertyKey(p as unknown as AstLike), p as unknown as AstLike] as [string, AstLike])]);
      return;
    case 'Cleanout': {
      const position = positionOf(member);
      add('cleanout', position.text as string, []);
      return;
    }
    case 'Scenario':
      add('scenario', member.name, [['open', member.openings as unknown as AstLike[]]]);
      return;
    case 'RuleLine': {
      const what = member.parameter ?? (member.severity ? 'severity' : 'off');
      add('rule', `${member.rule} ${what}`, [['value', node]]);
      return;
    }
    case 'Area':
      add('design', `area ${member.surface}`, [['value', node]]);
      return;
    case 'Site':
      add('design', 'site', member.measures.map((m) => [m.key, m as unknown as AstLike]));
      return;
    case 'Defaults':
      add('design', 'defaults', member.properties.map((p) => [propertyKey(p as unknown as AstLike), p as unknown as AstLike]));
      return;
    default: {
      const keyword = SETTING_KEYWORD[member.$type] ?? member.$type;
      add('design', keyword, [['value', node]]);
    }
  }
}

const EQUIPMENT_KEY: Record<string, string> = { ProducerUnit: 'producer', SeparatorUnit: 'separator', FilterUnit: 'filter' };

function definitionProperties(definition: Ast.Definition): [string, AstLike][] {
  const properties = (definition as unknown as { properties?: AstLike[] }).properties ?? [];
  return properties.map((p) => [propertyKey(p), p]);
}

/** What a property sets, as the key it is compared under. */
function propertyKey(p: AstLike): string {
  switch (p.$type) {
    case 'Measure':
      return String(p.key);
    case 'SpecRef':
      return 'spec';
    case 'Orientation':
      return 'direction';
    case 'Bend':
      return 'bend';
    case 'Reducer':
      return 'reducer';
    case 'Joins':
      return 'joins';
    case 'Flag':
      // conductive / nonconductive are one property with two values.
      return p.flag === 'conductive' || p.flag === 'nonconductive' ? 'conductivity' : String(p.flag);
    case 'Threshold':
      return `threshold ${String(p.rule)} ${String(p.parameter)}`;
    case 'Accept':
      return `accept ${String(p.rule)}`;
    case 'HoseRef':
      return 'hose';
    case 'ToolRef':
      return 'tool';
    case 'Room':
      return 'room';
    case 'Material':
      return 'material';
    case 'Schedule':
      return 'schedule';
    case 'Sizes':
      return 'sizes';
    case 'RatedLoss':
      return String(p.kind);
    case 'ToolState':
      return String(p.state);
    case 'Curve':
      return 'curve';
    default:
      return p.$type;
  }
}

/** Where an inlet or cleanout sits, as a synthetic property. */
function positionOf(node: Ast.Inlet | Ast.Cleanout): AstLike {
  const text = node.at ? `at ${node.at.$refText}` : `on ${node.pipe?.$refText ?? ''} at ${node.distance ? textOf(node.distance as unknown as AstLike) : ''}`;
  const canonicalText = node.at ? `at ${node.at.$refText}` : `on ${node.pipe?.$refText ?? ''} at ${node.distance ? canonical(node.distance as unknown as AstLike) : ''}`;
  return { $type: 'Position', text, canonicalText } as unknown as AstLike;
}

/** The tokens of a node as written, one space apart, without comments. */
export function textOf(node: AstLike): string {
  if (node.$type === 'Route' || node.$type === 'Position') return String(node.text);
  if (node.$type === 'System') return `system ${JSON.stringify(String(node.title))}`;
  const tokens: string[] = [];
  collectTokens(node.$cstNode, tokens);
  return tokens.join(' ');
}

function collectTokens(cst: unknown, out: string[]): void {
  if (!cst || typeof cst !== 'object') return;
  const content = (cst as { content?: unknown[] }).content;
  if (Array.isArray(content)) {
    for (const child of content) collectTokens(child, out);
    return;
  }
  const leaf = cst as { hidden?: boolean; text?: string };
  if (!leaf.hidden && typeof leaf.text === 'string' && leaf.text.trim() !== '') out.push(leaf.text);
}

/** A layout-free form of a node for comparing: types, values, quantities in SI, references by name. */
export function canonical(node: unknown): string {
  if (Array.isArray(node)) return `[${node.map(canonical).join(',')}]`;
  if (node === null || node === undefined) return '-';
  if (typeof node !== 'object') return JSON.stringify(node);
  const n = node as AstLike & { $refText?: string };
  if (typeof n.$refText === 'string') return `ref:${n.$refText}`;
  if (n.$type === 'Route') return String(n.text);
  if (n.$type === 'Position') return String(n.canonicalText);
  if (n.$type === 'System') return `title:${String(n.title)}`;
  if (n.$type === 'Quantity') return canonicalQuantity(String(n.value ?? ''), typeof n.unit === 'string' ? n.unit : '');
  const keys = Object.keys(n)
    .filter((k) => !k.startsWith('$'))
    .sort();
  return `${n.$type}{${keys.map((k) => `${k}=${canonical(n[k])}`).join(';')}}`;
}

const DIMENSIONS: readonly Dimension[] = ['length', 'pressure', 'flow', 'velocity', 'angle', 'area', 'temperature', 'power', 'time', 'fraction', 'area-rate', 'mass-flow'];

/** A number with its unit in SI (12 significant digits, so rounding in the conversion does not count as a change). */
function canonicalQuantity(valueText: string, unitText: string): string {
  const value = parseNumberText(valueText);
  if (value === undefined || !Number.isFinite(value)) return `${valueText} ${unitText}`.trim();
  const unit = normaliseUnitText(unitText);
  if (unit === '') return String(value);
  for (const dimension of DIMENSIONS) {
    const si = toSI(value, unit, dimension);
    // Standard and actual flow are different quantities even at the same number.
    if (si.ok) return `${dimension}:${Number(si.si.toPrecision(12))}${si.flowBasis ? `:${si.flowBasis}` : ''}`;
  }
  return `${value} ${unit}`;
}

function unquote(text: string): string {
  return text.length >= 2 && text.startsWith('"') && text.endsWith('"') ? text.slice(1, -1) : text;
}
