// The layout the formatter must produce is the one LANGUAGE.md asks for ("one
// element per line ... comments survive formatting") and issue 4 item 5
// spells out: idempotent, keeps every comment, aligns nothing. The expected
// texts below are written by hand from those rules.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expectFormatting } from 'langium/test';
import { describe, expect, it } from 'vitest';
import { formatText } from '../../src/index.js';
import { Vacnet } from '../helpers.js';
import { vacnetFiles } from '../example-files.js';

const format = expectFormatting(Vacnet);
const examples = fileURLToPath(new URL('../../../../examples/', import.meta.url));

/** Every comment in a text, with the indentation of continuation lines removed (the formatter may move a block comment as a whole). */
function comments(text: string): string[] {
  return (text.match(/\/\/[^\n\r]*|\/\*[\s\S]*?\*\//g) ?? []).map((c) => c.replace(/\r?\n[ \t]*/g, '\n').trimEnd());
}

describe('formatter: layout', () => {
  it('puts one element on a line, indents blocks by two spaces and closes braces on their own line', async () => {
    await format({
      before: `system "S" {   operators 2
plant pr { producer exh-7  separator cyc }
      pipe   main-1   from pr   to j-1 spec steel-10 size 3 in length 35 ft horizontal }`,
      after: `system "S" {
  operators 2
  plant pr {
    producer exh-7
    separator cyc
  }
  pipe main-1 from pr to j-1 spec steel-10 size 3 in length 35 ft horizontal
}
`,
    });
  });

  it('writes a number and its unit one space apart and keeps a unit tight', async () => {
    await format({
      before: `hose h length 50ft bore 1-1/2in roughness 0.3   mm
producer p { curve { at 0 ft ^ 3 / min 15 inHg at 250 m3 / h 12 inHg } efficiency 55% }`,
      after: `hose h length 50 ft bore 1-1/2 in roughness 0.3 mm
producer p {
  curve {
    at 0 ft^3/min 15 inHg
    at 250 m3/h 12 inHg
  }
  efficiency 55 %
}
`,
    });
  });

  it('writes a comma tight to the word before it and one space after it', async () => {
    await format({
      before: `spec s10 roughness 45 um sizes 2 in,3 in ,4 in
system "S" {
  scenario s open A1 ,B2 lifted,C3
}`,
      after: `spec s10 roughness 45 um sizes 2 in, 3 in, 4 in
system "S" {
  scenario s open A1, B2 lifted, C3
}
`,
    });
  });

  it('keeps at most one blank line between elements and none after an opening or before a closing brace', async () => {
    await format({
      before: `

use "a.vacnet"



system "S" {

  operators 2


  debris fine

}


`,
      after: `use "a.vacnet"

system "S" {
  operators 2

  debris fine
}
`,
    });
  });

  it('keeps a line break inside an element as a continuation line, one step further in', async () => {
    await format({
      before: `system "S" {
  pipe main-1 from pr to j-1 spec s size 3 in length 35 ft
          accept slow-carrying-velocity because "slow when one operator runs alone"
}`,
      after: `system "S" {
  pipe main-1 from pr to j-1 spec s size 3 in length 35 ft
    accept slow-carrying-velocity because "slow when one operator runs alone"
}
`,
    });
  });

  it('never breaks a quantity across lines', async () => {
    await format({
      before: `hose h length 50
  ft bore 1-1/2 in roughness 0.3 mm`,
      after: `hose h length 50 ft bore 1-1/2 in roughness 0.3 mm
`,
    });
  });

  it('keeps text after a closing brace on its line: the tool law continues after the curve', async () => {
    await format({
      before: `tool pickup working curve { at 0 scfm 0 inHg at 60 scfm 1.5 inHg }   lifted orifice 1-3/4 in needs 5 inHg`,
      after: `tool pickup working curve {
  at 0 scfm 0 inHg
  at 60 scfm 1.5 inHg
} lifted orifice 1-3/4 in needs 5 inHg
`,
    });
  });

  it('uses two spaces whatever tab size the editor asks for', async () => {
    await format({
      before: `system "S" {\n\toperators 2\n}`,
      after: `system "S" {\n  operators 2\n}\n`,
      options: { tabSize: 8, insertSpaces: false },
    });
  });

  it('formats only the lines of a range when asked for a range', async () => {
    await format({
      before: `system "S" {\n      operators   2\n      debris   fine\n}\n`,
      after: `system "S" {\n  operators 2\n      debris   fine\n}\n`,
      range: { start: { line: 1, character: 0 }, end: { line: 1, character: 20 } },
    });
  });

  it('keeps Windows line ends', () => {
    expect(formatText('system "S" {\r\n   operators 2\r\n\r\n\r\n debris fine }')).toBe('system "S" {\r\n  operators 2\r\n\r\n  debris fine\r\n}\r\n');
  });

  it('leaves a file with a syntax error as it is', async () => {
    const broken = `system "S" {\n      operators\n  pipe  x\n`;
    await format({ before: broken, after: broken });
    expect(formatText(broken)).toBe(broken);
  });
});

describe('formatter: comments', () => {
  it('puts a trailing comment one space after its line and indents a comment line like the element after it', async () => {
    await format({
      before: `system "S" {
operators 2      // two at once
        // the plant
  plant pr { producer exh-7
     // the separator stands indoors
  separator cyc indoors }
    // nothing after this
}
// end`,
      after: `system "S" {
  operators 2 // two at once
  // the plant
  plant pr {
    producer exh-7
    // the separator stands indoors
    separator cyc indoors
  }
  // nothing after this
}
// end
`,
    });
  });

  it('moves a block comment as a whole and keeps a comment inside an element', async () => {
    await format({
      before: `system "S" {
      /* Design basis:
       * three operators. */
  operators 3
  pipe a from pr /* the plant */   to j-1 // first leg
    spec s size 3 in length 35 ft
}`,
      after: `system "S" {
  /* Design basis:
   * three operators. */
  operators 3
  pipe a from pr /* the plant */ to j-1 // first leg
    spec s size 3 in length 35 ft
}
`,
    });
  });

  it('keeps a block comment that ends on the line of an element and starts the element on the next line', async () => {
    const text = `system "S" { /* basis */ operators 2 }`;
    expect(formatText(text)).toBe(`system "S" { /* basis */\n  operators 2\n}\n`);
  });
});

describe('formatter: every example', () => {
  const files = vacnetFiles(examples);

  it('finds the examples', () => {
    // At least the bundled systems, the catalog and the invalid cases.
    expect(files.length).toBeGreaterThan(10);
  });

  for (const file of files) {
    const name = file.slice(examples.length);
    it(`${name}: formatting twice equals formatting once, and every comment survives`, () => {
      const text = readFileSync(file, 'utf8');
      const once = formatText(text);
      expect(formatText(once)).toBe(once);
      expect(comments(once)).toEqual(comments(text));
      // Nothing but whitespace changed.
      expect(once.replace(/\s+/g, '')).toBe(text.replace(/\s+/g, ''));
    });
  }

  it('changes a valid example (the check above is not vacuous): column alignment is removed', () => {
    const text = readFileSync(join(examples, 'harbour-offices.vacnet'), 'utf8');
    expect(text).toContain('from j-w  to w-1');
    expect(formatText(text)).toContain('from j-w to w-1');
  });
});
