import { GrammarUtils, type AstNode, type CstNode, type LangiumDocument } from 'langium';
import type { DocumentSymbolProvider } from 'langium/lsp';
import { SymbolKind, type DocumentSymbol, type Range } from 'vscode-languageserver';
import {
  isCleanout,
  isCurve,
  isFilterModel,
  isHoseKind,
  isInlet,
  isPipe,
  isPipeSpec,
  isPlant,
  isProducerModel,
  isScenario,
  isSeparatorModel,
  isToolKind,
  type Definition,
  type Document,
  type Equipment,
  type Inlet,
  type Pipe,
  type PipeSpec,
  type Plant,
  type System,
  type SystemMember,
} from '../generated/ast.js';
import { unquote } from '../references/use-paths.js';

/** Separates the parts of a symbol's detail. */
const SEP = ' · ';

/**
 * The outline of a .vacnet file: its catalog (the files it uses, then pipe
 * specs, hoses, tools and equipment models) and its system, grouped into
 * equipment (plants and their units), pipes (and cleanouts), inlets,
 * scenarios and settings. Each entry's detail is what one reads on its line:
 * a pipe's size and length, an inlet's hose, tool and room.
 */
export class VacnetDocumentSymbolProvider implements DocumentSymbolProvider {
  getSymbols(document: LangiumDocument): DocumentSymbol[] {
    const root = document.parseResult.value as Document;
    const symbols: DocumentSymbol[] = [];
    const catalog = [
      ...root.uses.map((use) => leaf(use, use.path ?? '', SymbolKind.File, 'use', findNode(use, 'path'))),
      ...root.definitions.map((definition) => this.definitionSymbol(definition)),
    ].filter(isSymbol);
    const group = this.group('Catalog', catalog);
    if (group) symbols.push(group);
    for (const system of root.systems) {
      const symbol = this.systemSymbol(system);
      if (symbol) symbols.push(symbol);
    }
    return symbols;
  }

  private definitionSymbol(definition: Definition): DocumentSymbol | undefined {
    const name = definition.name;
    const at = findNode(definition, 'name');
    if (isPipeSpec(definition)) return leaf(definition, name, SymbolKind.Struct, specDetail(definition), at);
    if (isHoseKind(definition)) {
      return leaf(definition, name, SymbolKind.Class, join('hose', measureText(definition, 'length'), withWord(measureText(definition, 'bore'), 'bore')), at);
    }
    if (isToolKind(definition)) {
      const working = definition.properties.find((p) => p.$type === 'ToolState' && p.state === 'working');
      return leaf(definition, name, SymbolKind.Class, join('tool', working ? lawText(working) : undefined, withWord(measureText(definition, 'needs'), 'needs', true)), at);
    }
    if (isProducerModel(definition)) {
      const curve = definition.properties.find(isCurve);
      return leaf(definition, name, SymbolKind.Class, join('producer', curve ? `curve of ${curve.points.length} points` : undefined), at);
    }
    if (isSeparatorModel(definition) || isFilterModel(definition)) {
      const word = isSeparatorModel(definition) ? 'separator' : 'filter';
      return leaf(definition, name, SymbolKind.Class, join(word, ...definition.properties.map((p) => textOf(p.$cstNode))), at);
    }
    return undefined;
  }

  private systemSymbol(system: System): DocumentSymbol | undefined {
    const members = system.members;
    const groups = [
      this.group('Equipment', members.filter(isPlant).map((plant) => this.plantSymbol(plant))),
      this.group('Pipes', members.flatMap((m) => (isPipe(m) ? [this.pipeSymbol(m)] : isCleanout(m) ? [this.cleanoutSymbol(m)] : []))),
      this.group('Inlets', members.filter(isInlet).map((inlet) => this.inletSymbol(inlet))),
      this.group(
        'Scenarios',
        members.filter(isScenario).map((s) => leaf(s, s.name, SymbolKind.Array, `open ${openingsText(s)}`, findNode(s, 'name'))),
      ),
      this.group('Settings', members.filter(isSetting).map((m) => this.settingSymbol(m))),
    ].filter(isSymbol);
    const title = unquote(system.title ?? '');
    return leaf(system, title || 'system', SymbolKind.Module, 'system', findNode(system, 'title'), groups);
  }

  private plantSymbol(plant: Plant): DocumentSymbol | undefined {
    const units = plant.equipment.map((unit) => this.unitSymbol(unit)).filter(isSymbol);
    const producer = plant.equipment.find((e) => e.$type === 'ProducerUnit');
    return leaf(plant, plant.name, SymbolKind.Package, producer ? `producer ${producer.model?.$refText ?? ''}` : 'plant', findNode(plant, 'name'), units);
  }

  private unitSymbol(unit: Equipment): DocumentSymbol | undefined {
    const role = unit.$type === 'ProducerUnit' ? 'producer' : unit.$type === 'FilterUnit' ? 'filter' : 'separator';
    const rest = textOf(unit.$cstNode)?.replace(/^\S+\s*/, '') ?? '';
    return leaf(unit, role, SymbolKind.Property, rest, findNode(unit, 'model'));
  }

  private pipeSymbol(pipe: Pipe): DocumentSymbol | undefined {
    const size = measureText(pipe, 'size') ?? withWord(measureText(pipe, 'bore'), 'bore');
    return leaf(pipe, pipe.name, SymbolKind.Field, join(size, measureText(pipe, 'length')), findNode(pipe, 'name'));
  }

  private cleanoutSymbol(cleanout: SystemMember): DocumentSymbol | undefined {
    const rest = textOf(cleanout.$cstNode)?.replace(/^cleanout\s*/, '') ?? '';
    return leaf(cleanout, 'cleanout', SymbolKind.Key, rest, undefined);
  }

  private inletSymbol(inlet: Inlet): DocumentSymbol | undefined {
    const hose = inlet.properties.find((p) => p.$type === 'HoseRef');
    const tool = inlet.properties.find((p) => p.$type === 'ToolRef');
    const room = inlet.properties.find((p) => p.$type === 'Room');
    return leaf(
      inlet,
      inlet.name,
      SymbolKind.Event,
      join(
        hose ? `hose ${hose.hose?.$refText ?? ''}` : undefined,
        tool ? `tool ${tool.tool?.$refText ?? ''}` : undefined,
        room ? unquote(room.label ?? '') : undefined,
      ),
      findNode(inlet, 'name'),
    );
  }

  private settingSymbol(member: SystemMember): DocumentSymbol | undefined {
    const text = textOf(member.$cstNode) ?? '';
    const keyword = /^\S+/.exec(text)?.[0] ?? member.$type;
    if (member.$type === 'RuleLine') {
      const rest = text.replace(/^rule\s+\S+\s*/, '');
      return leaf(member, `rule ${member.rule ?? ''}`, SymbolKind.Property, rest, findNode(member, 'rule'));
    }
    return leaf(member, keyword, SymbolKind.Property, text.slice(keyword.length).trim(), undefined);
  }

  /** A group of symbols: spans its children, omitted when empty. */
  private group(name: string, children: (DocumentSymbol | undefined)[]): DocumentSymbol | undefined {
    const present = children.filter(isSymbol);
    if (present.length === 0) return undefined;
    const range: Range = { start: present[0]!.range.start, end: present.at(-1)!.range.end };
    for (const child of present) {
      if (before(child.range.start, range.start)) range.start = child.range.start;
      if (before(range.end, child.range.end)) range.end = child.range.end;
    }
    return {
      name,
      kind: SymbolKind.Namespace,
      detail: `${present.length}`,
      range,
      selectionRange: present[0]!.selectionRange,
      children: present,
    };
  }
}

const SETTING_TYPES = new Set(['Site', 'DisplayUnits', 'Operators', 'Area', 'CleaningWindow', 'Debris', 'Dust', 'Margin', 'TestOrifice', 'Defaults', 'RuleLine']);

function isSetting(member: SystemMember): boolean {
  return SETTING_TYPES.has(member.$type);
}

function isSymbol(symbol: DocumentSymbol | undefined): symbol is DocumentSymbol {
  return symbol !== undefined;
}

function before(a: Range['start'], b: Range['start']): boolean {
  return a.line < b.line || (a.line === b.line && a.character < b.character);
}

/** A symbol for a node; the selection is the name when there is one, else the node's first line. */
function leaf(node: AstNode, name: string | undefined, kind: SymbolKind, detail: string | undefined, at: CstNode | undefined, children?: DocumentSymbol[]): DocumentSymbol | undefined {
  const cst = node.$cstNode;
  if (!cst) return undefined;
  const symbol: DocumentSymbol = {
    // A half-typed element has no name yet; the outline still shows it.
    name: name && name.length > 0 ? name : '(unnamed)',
    kind,
    range: cst.range,
    selectionRange: (at ?? cst).range,
  };
  if (detail) symbol.detail = detail;
  if (children && children.length > 0) symbol.children = children;
  return symbol;
}

function findNode(node: AstNode, property: string): CstNode | undefined {
  return node.$cstNode ? GrammarUtils.findNodeForProperty(node.$cstNode, property) : undefined;
}

/** A node's text with its whitespace and comments reduced to single spaces. */
function textOf(cst: CstNode | undefined): string | undefined {
  if (!cst) return undefined;
  return cst.text.replace(/\/\*[\s\S]*?\*\/|\/\/[^\n\r]*/g, ' ').replace(/\s+/g, ' ').trim();
}

/** The value of a measure property (`length 35 ft` gives `35 ft`). */
function measureText(node: AstNode & { properties: AstNode[] }, key: string): string | undefined {
  const measure = node.properties.find((p) => p.$type === 'Measure' && (p as AstNode & { key?: string }).key === key) as
    | (AstNode & { value?: AstNode })
    | undefined;
  return textOf(measure?.value?.$cstNode);
}

function lawText(state: AstNode): string | undefined {
  const law = (state as AstNode & { law?: AstNode }).law;
  if (!law) return undefined;
  if (law.$type === 'Curve') return 'measured curve';
  return textOf(law.$cstNode);
}

function specDetail(spec: PipeSpec): string {
  const parts: (string | undefined)[] = [];
  for (const property of spec.properties) {
    if (property.$type === 'Material') parts.push(property.material);
    if (property.$type === 'Schedule') parts.push(`schedule ${property.schedule}`);
  }
  parts.push(withWord(measureText(spec, 'wall'), 'wall', true));
  return join(...parts) ?? 'pipe spec';
}

function openingsText(scenario: AstNode): string {
  return textOf(scenario.$cstNode)?.replace(/^scenario\s+\S+\s+open\s*/, '') ?? '';
}

function withWord(value: string | undefined, word: string, wordFirst = false): string | undefined {
  if (!value) return undefined;
  return wordFirst ? `${word} ${value}` : `${value} ${word}`;
}

function join(...parts: (string | undefined)[]): string | undefined {
  const present = parts.filter((p): p is string => typeof p === 'string' && p.length > 0);
  return present.length > 0 ? present.join(SEP) : undefined;
}

