import type { UnitSystem } from '@vacnet/engine';

/**
 * The catalog `vacnet init` writes when none exists: one pipe spec, hose,
 * tool, producer and separator, in the chosen units. The figures are
 * invented but in the range real equipment covers (marked in the text, as
 * in examples/catalog); designers replace them with the maker's data.
 */

/** Names of the starter catalog's items, which the starter system refers to. */
export const STARTER_ITEMS = {
  spec: 'starter-tubing',
  hose: 'starter-hose',
  tool: 'starter-tool',
  producer: 'starter-exhauster',
  separator: 'starter-cyclone',
} as const;

/**
 * A producer curve for `operators` operators: flow scales with the
 * operators, vacuum keeps the shape of a multistage exhauster (flat near
 * shut-off, falling toward open flow) [invented; shape as in
 * examples/catalog/equipment.vacnet]. Points: standard flow per operator in
 * scfm and vacuum in inHg.
 */
const CURVE_PER_OPERATOR: readonly [number, number][] = [
  [0, 7.0],
  [30, 6.9],
  [55, 6.6],
  [75, 5.8],
  [95, 4.2],
  [120, 1.4],
  [130, 0],
];

/** The separator's rated flow per operator, scfm: about one working tool's flow [invented, in the 50-80 cfm band, common practice]. */
const SEPARATOR_RATED_SCFM_PER_OPERATOR = 75;

/** 1 scfm in Sm3/h: 0.028316846592 m3 x 60 (NIST SP 811, 1 ft3 = 0.028316846592 m3). */
const SM3H_PER_SCFM = 1.69901079552;
/** 1 inHg (32 F) in kPa (NIST SP 811: 3.386389 kPa). */
const KPA_PER_INHG = 3.386389;

export function starterCatalog(units: UnitSystem, operators: number): string {
  const si = units === 'si';
  const curve = CURVE_PER_OPERATOR.map(([scfm, inHg]) =>
    si ? `    at ${round(scfm * operators * SM3H_PER_SCFM, 0)} Sm3/h ${round(inHg * KPA_PER_INHG, 1)} kPa` : `    at ${round(scfm * operators, 0)} scfm ${inHg} inHg`,
  );
  const lines = [
    '// Starter catalog written by `vacnet init`. Every figure here is a',
    '// placeholder [invented, in the range of real equipment]: replace it with',
    "// the maker's data sheets before relying on any result.",
    '',
    '// Thin-wall vacuum tubing; PVC roughness at the low end of the 9-46 um band',
    '// [ASHRAE Fundamentals ch. 21 table 1]. Plastic does not conduct.',
    si
      ? `spec ${STARTER_ITEMS.spec} material pvc wall 1.5 mm roughness 9 um nonconductive sizes 50 mm, 63 mm`
      : `spec ${STARTER_ITEMS.spec} material pvc wall 0.06 in roughness 9 um nonconductive sizes 2 in, 2-1/2 in`,
    '',
    '// A 50 ft (15 m) hose with a 1-1/2 in (38 mm) bore; flexible hose roughness',
    '// 0.3 mm [ASHRAE Fundamentals ch. 21].',
    si ? `hose ${STARTER_ITEMS.hose} length 15 m bore 38 mm roughness 0.3 mm` : `hose ${STARTER_ITEMS.hose} length 50 ft bore 1-1/2 in roughness 0.3 mm`,
    '',
    '// A floor tool as an equivalent orifice: about 65 cfm working, more lifted',
    '// [invented, in the 50-80 cfm band of commercial tools, common practice].',
    si
      ? `tool ${STARTER_ITEMS.tool} working orifice 22 mm lifted orifice 29 mm needs 10 kPa`
      : `tool ${STARTER_ITEMS.tool} working orifice 7/8 in lifted orifice 1-1/8 in needs 3 inHg`,
    '',
    `// A multistage exhauster sized for ${operators} operator${operators === 1 ? '' : 's'} [invented].`,
    `producer ${STARTER_ITEMS.producer} {`,
    '  curve {',
    ...curve,
    '  }',
    '  efficiency 55 %',
    '}',
    '',
    '// A cyclone separator sized for the exhauster: its rated loss at the',
    '// exhauster\'s design flow [invented].',
    si
      ? `separator ${STARTER_ITEMS.separator} loss 0.6 kPa at ${round(SEPARATOR_RATED_SCFM_PER_OPERATOR * operators * SM3H_PER_SCFM, 0)} Sm3/h`
      : `separator ${STARTER_ITEMS.separator} loss 2.5 inH2O at ${SEPARATOR_RATED_SCFM_PER_OPERATOR * operators} scfm`,
    '',
  ];
  return lines.join('\n');
}

function round(value: number, decimals: number): string {
  const f = 10 ** decimals;
  return String(Math.round(value * f) / f);
}
