// Completion: the unit lists are the engine's accepted spellings per
// dimension (packages/engine/src/units/quantity.ts ACCEPTED_UNITS), restated
// here by hand so a change to either is noticed; the dimension each place
// needs is LANGUAGE.md's ("every number that has a dimension carries a unit").
import { clearDocuments, expectCompletion, parseHelper } from 'langium/test';
import type { CompletionList } from 'vscode-languageserver';
import { beforeEach, describe, expect, it } from 'vitest';
import { shared, Vacnet } from '../helpers.js';

const complete = expectCompletion(Vacnet);
const parse = parseHelper(Vacnet);

const LENGTHS = ['in', 'ft', 'mm', 'cm', 'm', 'um'];
const PRESSURES = ['inHg', 'inH2O', 'psi', 'Pa', 'kPa', 'mbar', 'mmH2O'];
const FLOWS = ['scfm', 'acfm', 'cfm', 'Sm3/h', 'Sm3/s', 'SL/s', 'm3/h', 'Am3/h', 'm3/s', 'L/s'];

const CATALOG_URI = 'file:///work/catalog.vacnet';
const SYSTEM_URI = 'file:///work/system.vacnet';
const CATALOG = `
spec steel-10 material steel schedule 10 roughness 45 um
hose std-50 length 50 ft bore 1-1/2 in roughness 0.3 mm
hose std-30 length 30 ft bore 1-1/2 in roughness 0.3 mm
tool carpet working orifice 7/8 in needs 5 inHg
producer exh-7 { curve { at 0 scfm 15 inHg at 200 scfm 9 inHg } }
`;

function labels(list: CompletionList): string[] {
  return [...list.items].sort((a, b) => (a.sortText ?? '').localeCompare(b.sortText ?? '')).map((i) => i.label);
}

/** A system that uses the catalog, with `body` spliced in. */
function system(body: string): string {
  return `use "catalog.vacnet"
system "Completion" {
  plant pr { producer exh-7 }
  pipe main-1 from pr to j-1 spec steel-10 size 3 in length 35 ft horizontal
${body}
}`;
}

async function unitsAt(text: string): Promise<string[]> {
  let result: string[] = [];
  await complete({ text, index: 0, assert: (list) => (result = labels(list)), disposeAfterCheck: true });
  return result;
}

describe('completion: units after a number', () => {
  beforeEach(() => clearDocuments(shared));

  it('offers only lengths after a pipe length', async () => {
    expect(await unitsAt(system('  pipe b from j-1 to j-2 length 20 <|>'))).toEqual(LENGTHS);
  });

  it('offers flows, pressures and powers in the three columns of a curve point', async () => {
    expect(await unitsAt('producer p { curve { at 0 <|> } }')).toEqual(FLOWS);
    expect(await unitsAt('producer p { curve { at 0 scfm 15 <|> } }')).toEqual(PRESSURES);
    expect(await unitsAt('producer p { curve { at 0 scfm 15 inHg 4.2 <|> } }')).toEqual(['W', 'kW', 'hp']);
  });

  it('offers D (pipe diameters) first for a bend radius, then lengths', async () => {
    expect(await unitsAt(system('  pipe b from j-1 to j-2 bend 90 deg radius 1.5 <|>'))).toEqual(['D', ...LENGTHS]);
  });

  it('offers angles and the count word `x` after the number of a bend', async () => {
    expect(await unitsAt(system('  pipe b from j-1 to j-2 bend 2 <|>'))).toEqual(['deg', 'rad', 'x']);
  });

  it('offers % for a margin and velocities for a velocity threshold', async () => {
    expect(await unitsAt(system('  margin 15 <|>'))).toEqual(['%']);
    expect(await unitsAt(system('  rule slow-carrying-velocity min-velocity 4000 <|>'))).toEqual(['fpm', 'ft/s', 'm/s']);
  });

  it('replaces the unit being typed, however far it has got', async () => {
    await complete({
      text: 'hose h length 50 f<|>t bore 1-1/2 in',
      index: 0,
      assert: (list) => {
        expect(labels(list)).toEqual(LENGTHS);
        const edit = list.items[0]!.textEdit as { range: { start: { character: number }; end: { character: number } } };
        // `ft` spans characters 17..19 on line 0.
        expect([edit.range.start.character, edit.range.end.character]).toEqual([17, 19]);
      },
      disposeAfterCheck: true,
    });
    expect(await unitsAt('producer p { curve { at 250 m3/<|> } }')).toEqual(FLOWS);
  });

  it('offers no units for a plain number (a discharge coefficient) nor after a finished unit', async () => {
    const afterCd = await unitsAt('tool t working orifice 7/8 in cd 0.61 <|>');
    expect(afterCd).not.toContain('in');
    expect(afterCd).toContain('needs');
    const afterUnit = await unitsAt(system('  pipe b from j-1 to j-2 length 20 ft <|>'));
    expect(afterUnit).not.toContain('ft');
    expect(afterUnit).toEqual(expect.arrayContaining(['bend', 'joins', 'up', 'horizontal']));
  });
});

describe('completion: names in scope', () => {
  beforeEach(async () => {
    await clearDocuments(shared);
    await parse(CATALOG, { documentUri: CATALOG_URI });
    // A catalog the system does not `use`: its names must not be offered.
    await parse('hose other-hose length 30 ft bore 1-1/2 in roughness 0.3 mm', { documentUri: 'file:///work/unused.vacnet' });
  });

  const inSystem = { parseOptions: { documentUri: SYSTEM_URI }, disposeAfterCheck: true };

  it('offers the plant and the points declared by pipes after `from`', async () => {
    await complete({
      ...inSystem,
      text: system('  pipe b from <|>'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(expect.arrayContaining(['pr', 'j-1'])),
    });
  });

  it('offers pipes after `on` and inlets in a scenario', async () => {
    await complete({
      ...inSystem,
      text: system('  inlet A1 on main-1 at 3 ft hose std-50 tool carpet\n  inlet A2 on <|>'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(['main-1']),
    });
    await complete({
      ...inSystem,
      text: system('  inlet A1 on main-1 at 3 ft hose std-50 tool carpet\n  scenario s open <|>'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(['A1']),
    });
  });

  it('offers the hoses of the used catalog only, and producer models in a plant', async () => {
    await complete({
      ...inSystem,
      text: system('  inlet A1 on main-1 at 3 ft hose <|>'),
      index: 0,
      assert: (list) => {
        expect(labels(list).sort()).toEqual(['std-30', 'std-50']);
        expect(list.items[0]!.detail).toBe('hose · catalog.vacnet');
      },
    });
    await complete({
      ...inSystem,
      text: system('  plant p2 { producer <|> }'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(['exh-7']),
    });
  });

  it('offers no soft keywords where a new name is written', async () => {
    await complete({
      ...inSystem,
      text: system('  pipe <|>'),
      index: 0,
      assert: (list) => {
        expect(labels(list)).not.toContain('carpet');
        expect(labels(list)).not.toContain('up');
      },
    });
  });

  it('offers element keywords at the start of a member line', async () => {
    await complete({
      ...inSystem,
      text: system('  <|>'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(expect.arrayContaining(['pipe', 'inlet', 'cleanout', 'scenario', 'rule'])),
    });
  });

  it('offers the design-rule codes after `rule` and a rule\'s parameters after its code', async () => {
    await complete({
      ...inSystem,
      text: system('  rule <|>'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(expect.arrayContaining(['slow-carrying-velocity', 'missing-cleanout', 'short-radius-bend'])),
    });
    await complete({
      ...inSystem,
      text: system('  rule missing-cleanout <|>'),
      index: 0,
      assert: (list) => expect(labels(list)).toEqual(expect.arrayContaining(['spacing', 'severity', 'off'])),
    });
  });
});
