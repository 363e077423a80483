// Syntax errors read as plain sentences (what was expected, after what, and
// what was found), and a slip reports once: the parser's recovery echoes and
// the checks of items it misread are left out.
import { describe, expect, it } from 'vitest';
import { check, system } from '../helpers.js';

/** The diagnostics of a system with one line changed, as `code@line:col message`. */
async function findings(body: string): Promise<string[]> {
  const { diagnostics } = await check(system(body));
  return diagnostics.map((d) => `${d.code}@${d.range.start.line + 1}:${d.range.start.character + 1} ${d.message}`);
}

// Line numbers: the shared catalog takes lines 1-6, the system opens on line 8 and its body starts on line 11.
const INLET = '  inlet A1 on main-1 at 20 ft hose std-50 tool carpet';
const BRANCH = '  pipe branch-1 from j-1 to j-2 spec steel-10 size 2 in length 20 ft horizontal joins wye 45 deg';

describe('syntax error messages', () => {
  it('a missing keyword names the choices, the word before and the word found; nothing else is reported', async () => {
    const found = await findings(`  pipe branch-1 from j-1 j-2 spec steel-10 size 2 in length 20 ft horizontal\n${INLET}`);
    expect(found).toEqual(["syntax-error@11:26 Expected 'to' or 'into' after 'j-1', but found 'j-2'."]);
  });

  it('a value outside a fixed list lists the values', async () => {
    const found = await findings(BRANCH.replace('joins wye 45 deg', 'joins elbow'));
    expect(found).toEqual(["syntax-error@11:87 Expected one of 'wye', 'tee' or 'sweep' after 'joins', but found 'elbow'."]);
  });

  it('a word where a number belongs says "a number"', async () => {
    const found = await findings(INLET.replace('at 20 ft', 'at twenty ft'));
    expect(found[0]).toBe("syntax-error@11:25 Expected a number after 'at', but found 'twenty'.");
  });

  it('an unclosed block names the brace and the end of the file', async () => {
    const { diagnostics } = await check(system(INLET).trimEnd().replace(/}$/, ''));
    expect(diagnostics.map((d) => d.message)).toEqual(["Expected '}' after 'carpet', but found the end of the file."]);
  });

  it('an unclosed quoted text says so, once on its line', async () => {
    const found = await findings(`${INLET} room "Kitchen`);
    expect(found[0]).toMatch(/^syntax-error@11:\d+ This quoted text is not closed/);
    expect(found.filter((f) => f.includes('@11:'))).toHaveLength(1);
  });

  it('a character no token starts with is named', async () => {
    const found = await findings(`${INLET} §`);
    expect(found).toEqual(["syntax-error@11:55 Unexpected character '§': names are letters, digits, '_' and '-', and comments start with //."]);
  });

  it('checks of the items before the slip still report; those from the slip on wait for it', async () => {
    // An unresolved hose above the slip is reported; the misread pipe's "needs a length" and the unknown tool below are not.
    const body = [INLET.replace('std-50', 'std-5O'), '  pipe branch-1 from j-1 j-2 spec steel-10 size 2 in', INLET.replace('A1', 'A2').replace('carpet', 'carpt')].join('\n');
    const found = await findings(body);
    expect(found.map((f) => f.split(' ')[0]).sort()).toEqual(['syntax-error@12:26', 'unresolved-reference@11:36']);
  });

  it('no parser wording leaks into any message', async () => {
    const bodies = [`  pipe`, `  inlet A9 on`, `  scenario s open`, `  plant p2 {`, `${INLET} room`, `  rule slow-carrying-velocity min-velocity`, `  }}`, `  operators 2 2`];
    for (const body of bodies) {
      for (const line of await findings(body)) {
        expect(line, body).not.toMatch(/Expecting|Token sequences|token of type|EOF|->|<-/);
      }
    }
  });
});
