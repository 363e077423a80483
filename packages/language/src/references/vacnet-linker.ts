import { DefaultLinker, type AstNodeDescription, type LinkingError, type ReferenceInfo } from 'langium';

/** What each kind of reference points at, in the words of the trade. */
const TARGET_WORDS: Record<string, { noun: string; hint: string }> = {
  Point: { noun: 'point', hint: 'a point is the plant, or the far end of a pipe (`to NAME`)' },
  Pipe: { noun: 'pipe', hint: 'pipes are declared with `pipe NAME from ...`' },
  Inlet: { noun: 'inlet', hint: 'inlets are declared with `inlet NAME ...`' },
  PipeSpec: { noun: 'pipe spec', hint: 'define it with `spec NAME ...` or `use` the catalog that has it' },
  HoseKind: { noun: 'hose', hint: 'define it with `hose NAME ...` or `use` the catalog that has it' },
  ToolKind: { noun: 'tool', hint: 'define it with `tool NAME ...` or `use` the catalog that has it' },
  ProducerModel: { noun: 'producer model', hint: 'define it with `producer NAME { curve { ... } }` or `use` the catalog that has it' },
  SeparatorModel: { noun: 'separator model', hint: 'define it with `separator NAME loss ... at ...` or `use` the catalog that has it' },
  FilterModel: { noun: 'filter model', hint: 'define it with `filter NAME clean ... at ...` or `use` the catalog that has it' },
};

/** Says in plain words what could not be found and where it would come from. */
export class VacnetLinker extends DefaultLinker {
  protected override createLinkingError(refInfo: ReferenceInfo, targetDescription?: AstNodeDescription): LinkingError {
    const error = super.createLinkingError(refInfo, targetDescription);
    const type = this.reflection.getReferenceType(refInfo);
    const words = TARGET_WORDS[type];
    if (!words) return error;
    const written = refInfo.reference.$refText;
    const near = this.nearNames(refInfo, written);
    const suggestion = near.length > 0 ? ` Did you mean ${near.map((n) => `'${n}'`).join(' or ')}?` : '';
    return { ...error, message: `There is no ${words.noun} named '${written}' here; ${words.hint}.${suggestion}` };
  }

  /** Names in scope within a small edit distance of what was written, closest first (at most three). */
  private nearNames(refInfo: ReferenceInfo, written: string): string[] {
    // Typos of one or two characters; longer names may differ by a third (our choice).
    const limit = written.length > 6 ? 3 : 2;
    const scored: { name: string; distance: number }[] = [];
    for (const description of this.scopeProvider.getScope(refInfo).getAllElements()) {
      const distance = editDistance(written.toLowerCase(), description.name.toLowerCase(), limit);
      if (distance <= limit && description.name !== written) scored.push({ name: description.name, distance });
    }
    return [...new Set(scored.sort((a, b) => a.distance - b.distance).map((s) => s.name))].slice(0, 3);
  }
}

/** Levenshtein distance, giving up (returning limit + 1) once it must exceed `limit`. */
export function editDistance(a: string, b: string, limit: number): number {
  if (Math.abs(a.length - b.length) > limit) return limit + 1;
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    let rowMin = i;
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      const value = Math.min(previous[j]! + 1, current[j - 1]! + 1, previous[j - 1]! + cost);
      current.push(value);
      rowMin = Math.min(rowMin, value);
    }
    if (rowMin > limit) return limit + 1;
    previous = current;
  }
  return previous[b.length]!;
}
