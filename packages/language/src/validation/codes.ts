/**
 * Codes of the findings the language itself reports (syntax, names, units,
 * structure). The airflow engine's design-rule codes live with the rules in
 * the engine. Each code is stable and has a page in docs/rules/<code>.md.
 */
export const StructureCodes = {
  syntaxError: 'syntax-error',
  unresolvedReference: 'unresolved-reference',
  useNotFound: 'use-not-found',
  duplicateName: 'duplicate-name',
  duplicateProperty: 'duplicate-property',
  propertyNotAllowed: 'property-not-allowed',
  missingProperty: 'missing-property',
  unitMissing: 'unit-missing',
  unitUnknown: 'unit-unknown',
  unitWrongDimension: 'unit-wrong-dimension',
  numberInvalid: 'number-invalid',
  valueImplausible: 'value-implausible',
  oneSystemPerFile: 'one-system-per-file',
  noProducer: 'no-producer',
  noPath: 'no-path',
  selfLoop: 'pipe-to-itself',
  danglingPipe: 'dangling-pipe',
  inletBeyondPipe: 'position-beyond-pipe',
  curveTooShort: 'curve-too-short',
  curveNotMonotone: 'curve-not-monotone',
  suppressionWithoutReason: 'accept-without-reason',
  unknownRule: 'unknown-rule',
  loop: 'looped-piping',
} as const;

export type StructureCode = (typeof StructureCodes)[keyof typeof StructureCodes];
