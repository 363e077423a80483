import { describe, expect, it } from 'vitest';
import { at, CATALOG, check, codes, system } from '../helpers.js';

const inletAtEnd = '  inlet A1 at j-1 hose std-50 tool carpet';

describe('structural checks', () => {
  it('finds duplicate names on the second declaration', async () => {
    const text = system(`${inletAtEnd}\n  inlet A1 at j-1 hose std-50 tool carpet`);
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toEqual([`duplicate-name@${at(text, 'A1', 'carpet\n  inlet A1')}`]);
  });

  it('finds a name used for a point and an inlet alike', async () => {
    const text = system(`  inlet j-1 at j-1 hose std-50 tool carpet`);
    expect(codes((await check(text)).diagnostics)).toEqual([`duplicate-name@${at(text, 'j-1 at')}`]);
  });

  it('finds unresolved references and says what is missing', async () => {
    const text = system('  inlet A1 at j-9 hose std-50 tool carpet');
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toContain(`unresolved-reference@${at(text, 'j-9')}`);
    expect(diagnostics.find((d) => d.code === 'unresolved-reference')!.message).toContain("no point named 'j-9'");
  });

  it('needs a producer', async () => {
    const text = `${CATALOG}\nsystem "No plant" {\n  operators 1\n}\n`;
    expect(codes((await check(text)).diagnostics)).toEqual([`no-producer@${at(text, '"No plant"')}`]);
  });

  it('finds a pipe that runs to itself', async () => {
    const text = system(`${inletAtEnd}\n  pipe loop-1 from j-1 into j-1 spec steel-10 size 3 in length 3 ft`);
    expect(codes((await check(text)).diagnostics)).toEqual([`pipe-to-itself@${at(text, 'j-1 spec', 'loop-1')}`]);
  });

  it('finds a pipe and an inlet with no path to a producer', async () => {
    const text = system(`${inletAtEnd}\n  pipe far from x-1 to x-2 spec steel-10 size 3 in length 3 ft\n  pipe far-0 from x-0 to x-1 spec steel-10 size 3 in length 3 ft\n  inlet B1 at x-2 hose std-50 tool carpet`)
      .replace('pipe far-0 from x-0', 'pipe far-0 from x-2');
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toEqual(expect.arrayContaining([`no-path@${at(text, 'B1')}`]));
  });

  it('warns of a dead leg that serves no inlet', async () => {
    const text = system(`${inletAtEnd}\n  pipe stub from j-1 to s-1 spec steel-10 size 3 in length 3 ft`);
    expect(codes((await check(text)).diagnostics)).toEqual([`dangling-pipe@${at(text, 'stub')}`]);
  });

  it('tells of a loop as information, not an error', async () => {
    const text = system(
      `  pipe a from j-1 to j-2 spec steel-10 size 3 in length 3 ft\n  pipe b from j-1 to j-3 spec steel-10 size 3 in length 3 ft\n  pipe tie from j-2 into j-3 spec steel-10 size 3 in length 3 ft\n  inlet A1 at j-2 hose std-50 tool carpet\n  inlet A2 at j-3 hose std-50 tool carpet`,
    );
    const { diagnostics } = await check(text);
    expect(codes(diagnostics)).toEqual([]);
    expect(codes(diagnostics, [3])).toEqual([`looped-piping@${at(text, 'tie')}`]);
  });

  it('finds an inlet placed beyond the end of its pipe', async () => {
    const text = system('  inlet A1 on main-1 at 40 ft hose std-50 tool carpet');
    expect(codes((await check(text)).diagnostics)).toEqual([`position-beyond-pipe@${at(text, '40 ft')}`]);
  });

  it('checks producer curves: two points at least, flow rising, vacuum falling', async () => {
    const short = system(inletAtEnd).replace('at 0 scfm 15 inHg  at 100 scfm 13 inHg  at 200 scfm 9 inHg', 'at 0 scfm 15 inHg');
    expect(codes((await check(short)).diagnostics)).toEqual([`curve-too-short@${at(short, 'curve')}`]);
    const rising = system(inletAtEnd).replace('at 100 scfm 13 inHg', 'at 100 scfm 16 inHg');
    expect(codes((await check(rising)).diagnostics)).toEqual([`curve-not-monotone@${at(rising, '16 inHg')}`]);
    const unordered = system(inletAtEnd).replace('at 200 scfm 9 inHg', 'at 50 scfm 9 inHg');
    expect(codes((await check(unordered)).diagnostics)).toEqual([`curve-not-monotone@${at(unordered, '50 scfm')}`]);
  });

  it('needs required properties and refuses ones that do not belong', async () => {
    const missing = system(`${inletAtEnd}\n  pipe b from j-1 to e-1 spec steel-10 length 3 ft\n  inlet A2 at e-1 hose std-50 tool carpet`);
    expect(codes((await check(missing)).diagnostics)).toEqual([`missing-property@${at(missing, 'b from')}`]);
    const misplaced = system(`  inlet A1 at j-1 hose std-50 tool carpet`).replace('size 3 in length 35 ft', 'size 3 in length 35 ft efficiency 50 %');
    expect(codes((await check(misplaced)).diagnostics)).toEqual([`property-not-allowed@${at(misplaced, 'efficiency 50')}`]);
    const twice = system(inletAtEnd).replace('length 35 ft', 'length 35 ft length 36 ft');
    expect(codes((await check(twice)).diagnostics)).toEqual([`duplicate-property@${at(twice, 'length 36')}`]);
  });

  it('lets inlets take hose and tool from the defaults line', async () => {
    const text = system('  defaults hose std-50 tool carpet\n  inlet A1 at j-1');
    expect(codes((await check(text)).diagnostics)).toEqual([]);
    const none = system('  inlet A1 at j-1 tool carpet');
    expect(codes((await check(none)).diagnostics)).toEqual([`missing-property@${at(none, 'A1')}`]);
  });

  it('insists on a written reason to accept or silence a finding', async () => {
    const accept = system(inletAtEnd).replace('length 35 ft horizontal', 'length 35 ft horizontal accept short-radius-bend');
    expect(codes((await check(accept)).diagnostics)).toEqual([`accept-without-reason@${at(accept, 'accept')}`]);
    const withReason = system(inletAtEnd).replace('length 35 ft horizontal', 'length 35 ft horizontal accept short-radius-bend because "existing fitting kept"');
    expect(codes((await check(withReason)).diagnostics)).toEqual([]);
    const off = system(`${inletAtEnd}\n  rule missing-cleanout off`);
    expect(codes((await check(off)).diagnostics)).toEqual([`accept-without-reason@${at(off, 'off')}`]);
  });

  it('knows the design rules and their settings', async () => {
    const unknown = system(`${inletAtEnd}\n  rule no-such-rule severity info`);
    expect(codes((await check(unknown)).diagnostics)).toEqual([`unknown-rule@${at(unknown, 'no-such-rule')}`]);
  });

  it('allows one system per file', async () => {
    const text = `${system(inletAtEnd)}\nsystem "Second" {\n}\n`;
    expect(codes((await check(text)).diagnostics)).toContain(`one-system-per-file@${at(text, 'system "Second"')}`);
  });
});

describe('names across files', () => {
  const catalogUri = 'file:///work/catalog/kit.vacnet';
  const catalog = 'hose long-35 length 35 ft bore 1-1/2 in roughness 0.3 mm';

  it('sees a catalog named by use, relative to the file', async () => {
    const text = `use "catalog/kit.vacnet"\n${system('  inlet A1 at j-1 hose long-35 tool carpet')}`;
    expect(codes((await check(text, { [catalogUri]: catalog })).diagnostics)).toEqual([]);
  });

  it('does not see a file it does not use', async () => {
    const text = system('  inlet A1 at j-1 hose long-35 tool carpet');
    expect(codes((await check(text, { [catalogUri]: catalog })).diagnostics)).toEqual([`unresolved-reference@${at(text, 'long-35')}`]);
  });

  it('reports a use path that names no file', async () => {
    const text = `use "catalog/none.vacnet"\n${system(inletAtEnd)}`;
    expect(codes((await check(text)).diagnostics)).toEqual([`use-not-found@${at(text, '"catalog/none.vacnet"')}`]);
  });
});

describe('robustness', () => {
  it.each([
    ['an empty file', ''],
    ['unclosed braces', 'system "x" { plant p { producer'],
    ['random bytes', String.fromCharCode(...Array.from({ length: 2000 }, (_, i) => (i * 7919) % 256))],
    ['a lone number', '1-1/2'],
    ['nested comments', '/* /* */ */ system'],
  ])('survives %s with located diagnostics', async (_name, text) => {
    const { diagnostics } = await check(text);
    for (const d of diagnostics) {
      expect(d.range.start.line).toBeGreaterThanOrEqual(0);
      expect(typeof d.message).toBe('string');
    }
  });
});
