// Folding ranges as LSP 3.17 defines them (0-based start and end lines; a
// block folds up to the line before its closing brace so the brace stays
// visible, the convention of VS Code's own folding).
import { expectFoldings } from 'langium/test';
import { FoldingRangeKind } from 'vscode-languageserver';
import { describe, expect, it } from 'vitest';
import { Vacnet } from '../helpers.js';

const foldings = expectFoldings(Vacnet);

const TEXT = [
  '// Header: two lines', // 0
  '// of comment.', // 1
  'use "a.vacnet"', // 2
  'tool t working curve {', // 3
  '  at 0 scfm 0 inHg', // 4
  '  at 60 scfm 1.5 inHg', // 5
  '} lifted orifice 1 in', // 6
  'system "S" {', // 7
  '  plant pr {', // 8
  '    producer exh', // 9
  '    separator cyc', // 10
  '  }', // 11
  '  pipe main from pr to j-1 size 3 in length 40 ft', // 12
  '    accept slow-carrying-velocity because "continued on a second line"', // 13
  '  cleanout at j-1 // a trailing comment', // 14
  '  // a single comment line', // 15
  '', // 16
  '  // three lines', // 17
  '  // of comment', // 18
  '  // together', // 19
  '  operators 2', // 20
  '}', // 21
  '/* a block', // 22
  '   comment', // 23
  '*/', // 24
  '',
].join('\n');

describe('folding', () => {
  it('folds blocks, runs of comment lines and block comments, and nothing else', async () => {
    await foldings({
      text: TEXT,
      disposeAfterCheck: true,
      assert: (ranges) => {
        const found = ranges.map((r) => `${r.startLine}-${r.endLine}${r.kind === FoldingRangeKind.Comment ? ' comment' : ''}`).sort();
        expect(found).toEqual(
          [
            '0-1 comment', // the header run
            '3-5', // the tool's curve, up to the line before `}`
            '7-20', // the system
            '8-10', // the plant
            '17-19 comment', // three own-line comments; the single line and the trailing comment do not fold
            '22-23 comment', // the block comment (Langium keeps the closing line visible)
          ].sort(),
        );
      },
    });
  });
});
