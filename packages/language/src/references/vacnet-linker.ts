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
    return { ...error, message: `There is no ${words.noun} named '${refInfo.reference.$refText}' here; ${words.hint}.` };
  }
}
