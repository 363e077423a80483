/** What each kind of named element is called in the trade, for hovers and completion details. */
export const ELEMENT_NOUNS: Readonly<Record<string, string>> = {
  Plant: 'plant',
  PointDecl: 'point',
  Pipe: 'pipe',
  Inlet: 'inlet',
  Scenario: 'scenario',
  PipeSpec: 'pipe spec',
  HoseKind: 'hose',
  ToolKind: 'tool',
  ProducerModel: 'producer model',
  SeparatorModel: 'separator model',
  FilterModel: 'filter model',
};
