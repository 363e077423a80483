import { describe, expect, it } from 'vitest';
import { at, check, codes, system } from '../helpers.js';

const branch = (pipe: string) => system(`  ${pipe}\n  inlet A1 at e-1 hose std-50 tool carpet`);

describe('units on numbers', () => {
  it('accepts a valid system with trade fractions and mixed units', async () => {
    const { diagnostics } = await check(branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2-1/2 in length 10 m up'));
    expect(codes(diagnostics)).toEqual([]);
  });

  it('reports a missing unit at the number', async () => {
    const text = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length 10 horizontal');
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toEqual([`unit-missing@${at(text, '10 horizontal')}`]);
    expect(diagnostics[0]!.message).toMatch(/needs a unit: .*ft/);
  });

  it('reports an unknown unit at the unit and lists what is accepted', async () => {
    const text = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length 3 furlongz');
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toEqual([`unit-unknown@${at(text, 'furlongz')}`]);
    expect(diagnostics[0]!.message).toContain("'furlongz'");
    expect(diagnostics[0]!.message).toContain('ft');
  });

  it('reports a unit of the wrong dimension at the unit', async () => {
    const text = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 inHg length 3 ft');
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toEqual([`unit-wrong-dimension@${at(text, 'inHg length')}`]);
  });

  it('reports implausible magnitudes: a 40 ft pipe, a negative length, a vacuum above the atmosphere', async () => {
    const sizeText = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 40 ft length 3 ft');
    expect(codes((await check(sizeText)).diagnostics)).toEqual([`value-implausible@${at(sizeText, '40 ft')}`]);

    const negativeText = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length -3 ft');
    const negative = await check(negativeText);
    expect(codes(negative.diagnostics)).toEqual([`value-implausible@${at(negativeText, '-3 ft')}`]);
    expect(negative.diagnostics[0]!.message).toContain('cannot be negative');

    const vacuumText = system('  defaults needs 31 inHg');
    const vacuum = await check(vacuumText);
    expect(codes(vacuum.diagnostics)).toContain(`value-implausible@${at(vacuumText, '31 inHg')}`);
    // 101,325 Pa / 3386.389 Pa per inHg (NIST SP 811) = 29.92 inHg
    expect(vacuum.diagnostics.find((d) => d.code === 'value-implausible')!.message).toContain('29.92 inHg');
  });

  it('takes a bend radius in pipe diameters or as a length, and nothing else', async () => {
    const ok = await check(branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length 3 ft bend 90 deg radius 1.5 D bend 45 deg radius 6 in'));
    expect(codes(ok.diagnostics)).toEqual([]);
    const badText = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length 3 ft bend 90 deg radius 1.5 kPa');
    expect(codes((await check(badText)).diagnostics)).toEqual([`unit-wrong-dimension@${at(badText, 'kPa')}`]);
  });

  it('keeps a plain number plain: a discharge coefficient takes no unit', async () => {
    const text = branch('pipe b-1 from j-1 to e-1 spec steel-10 size 2 in length 3 ft').replace('orifice 7/8 in lifted', 'orifice 7/8 in cd 0.6 ft lifted');
    expect(codes((await check(text)).diagnostics)).toEqual([`unit-wrong-dimension@${at(text, 'ft lifted')}`]);
  });
});
