import type { AstNode } from 'langium';

/**
 * Which properties each element takes, and which it must have. The grammar
 * lets any property stand on any element (so a misplaced one parses and gets
 * a clear message instead of a syntax error); this table says what belongs.
 *
 * A property's key: a Measure's keyword (`length`), a flag's word, or the
 * AST type of the property (`SpecRef`, `Bend`...).
 */
export interface ElementShape {
  /** What the element is called in messages. */
  noun: string;
  allowed: ReadonlySet<string>;
  /** Each entry is satisfied by any one of its keys. */
  required: readonly (readonly string[])[];
  /** Keys that may appear more than once (bends, rule settings). */
  repeatable?: ReadonlySet<string>;
}

const set = (...keys: string[]) => new Set(keys);

export const ELEMENT_SHAPES: Record<string, ElementShape> = {
  PipeSpec: {
    noun: 'pipe spec',
    allowed: set('Material', 'Schedule', 'wall', 'roughness', 'conductive', 'Sizes'),
    required: [['roughness']],
  },
  HoseKind: {
    noun: 'hose',
    allowed: set('length', 'bore', 'roughness', 'loss', 'conductive'),
    required: [['length'], ['bore'], ['roughness', 'loss']],
  },
  ToolKind: {
    noun: 'tool',
    allowed: set('working', 'lifted', 'needs'),
    required: [['working']],
  },
  ProducerModel: {
    noun: 'producer',
    allowed: set('Curve', 'efficiency', 'relief'),
    required: [['Curve']],
  },
  SeparatorModel: { noun: 'separator', allowed: set('loss'), required: [['loss']] },
  FilterModel: { noun: 'filter', allowed: set('clean', 'loaded'), required: [['clean']] },
  Site: { noun: 'site', allowed: set('elevation', 'pressure', 'temperature'), required: [] },
  Defaults: { noun: 'defaults line', allowed: set('HoseRef', 'ToolRef', 'needs'), required: [] },
  Pipe: {
    noun: 'pipe',
    allowed: set('SpecRef', 'size', 'bore', 'length', 'Orientation', 'Bend', 'Reducer', 'Joins', 'Threshold', 'Accept'),
    required: [['SpecRef'], ['size', 'bore'], ['length']],
    repeatable: set('Bend', 'Threshold', 'Accept'),
  },
  Inlet: {
    noun: 'inlet',
    allowed: set('HoseRef', 'ToolRef', 'Room', 'public', 'locked', 'Threshold', 'Accept'),
    required: [['HoseRef'], ['ToolRef']],
    repeatable: set('Threshold', 'Accept'),
  },
};

/** The key a property node stands for in ELEMENT_SHAPES. */
export function propertyKey(property: AstNode): string {
  const node = property as AstNode & { key?: string; flag?: string; kind?: string; state?: string };
  switch (property.$type) {
    case 'Measure':
      return node.key ?? '';
    case 'Flag':
      // conductive and nonconductive are one property: either may be stated, once.
      return node.flag === 'nonconductive' ? 'conductive' : (node.flag ?? '');
    case 'RatedLoss':
      return node.kind ?? '';
    case 'ToolState':
      return node.state ?? '';
    default:
      return property.$type;
  }
}

/** How a property is written, for messages. */
export function propertyWord(property: AstNode): string {
  const node = property as AstNode & { key?: string; flag?: string; kind?: string; state?: string };
  const words: Record<string, string> = {
    SpecRef: 'spec', HoseRef: 'hose', ToolRef: 'tool', Material: 'material', Schedule: 'schedule', Sizes: 'sizes',
    Curve: 'curve', Orientation: 'orientation', Bend: 'bend', Reducer: 'reducer', Joins: 'joins', Room: 'room',
    Threshold: 'threshold', Accept: 'accept',
  };
  return node.key ?? node.flag ?? node.kind ?? node.state ?? words[property.$type] ?? property.$type;
}
