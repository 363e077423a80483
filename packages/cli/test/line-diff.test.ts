import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diffLines, unifiedDiff } from '../src/line-diff.js';

// The line diff against outside references: the edit script is as short as
// the longest common subsequence allows (LCS by the textbook dynamic
// programme, Cormen et al., Introduction to Algorithms, section 15.4), and
// the unified diff is one that GNU patch applies to turn the old text into
// the new.

function lcsLength(a: readonly string[], b: readonly string[]): number {
  const table = Array.from({ length: a.length + 1 }, () => new Array<number>(b.length + 1).fill(0));
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      table[i]![j] = a[i - 1] === b[j - 1] ? table[i - 1]![j - 1]! + 1 : Math.max(table[i - 1]![j]!, table[i]![j - 1]!);
    }
  }
  return table[a.length]![b.length]!;
}

const hasPatch = spawnSync('patch', ['--version']).status === 0;

/** Applies a unified diff with GNU patch and returns the patched text. */
function patched(oldText: string, diff: string): string {
  const folder = mkdtempSync(join(tmpdir(), 'vacnet-diff-'));
  try {
    writeFileSync(join(folder, 'file'), oldText);
    writeFileSync(join(folder, 'change.diff'), diff);
    const run = spawnSync('patch', ['--quiet', '--force', join(folder, 'file'), join(folder, 'change.diff')], { encoding: 'utf8' });
    expect(run.status, run.stderr + run.stdout).toBe(0);
    return readFileSync(join(folder, 'file'), 'utf8');
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

const lines = fc.array(fc.constantFrom('a', 'b', 'c', 'pipe main', '', '  inlet A1'), { maxLength: 25 });

describe('diffLines', () => {
  it('keeps exactly an LCS of the lines: the shortest edit script (Myers 1986)', () => {
    fc.assert(
      fc.property(lines, lines, (a, b) => {
        const edits = diffLines(a, b);
        expect(edits.filter((e) => e.kind !== 'insert').map((e) => e.line)).toEqual(a);
        expect(edits.filter((e) => e.kind !== 'delete').map((e) => e.line)).toEqual(b);
        expect(edits.filter((e) => e.kind === 'same').length).toBe(lcsLength(a, b));
      }),
      { numRuns: 300 },
    );
  });
});

describe('unifiedDiff', () => {
  it('is empty for equal texts', () => {
    expect(unifiedDiff('a\nb\n', 'a\nb\n', 'a/x', 'b/x')).toBe('');
  });

  it('matches GNU diff -u for a one-line change in the middle of a long file', () => {
    const before = Array.from({ length: 20 }, (_, i) => `line ${i + 1}`);
    const after = [...before];
    after[9] = 'line ten';
    const diff = unifiedDiff(before.join('\n') + '\n', after.join('\n') + '\n', 'a/f', 'b/f');
    // What `diff -u` (GNU diffutils 3.8) prints for this change, headers aside.
    expect(diff).toBe(['--- a/f', '+++ b/f', '@@ -7,7 +7,7 @@', ' line 7', ' line 8', ' line 9', '-line 10', '+line ten', ' line 11', ' line 12', ' line 13', ''].join('\n'));
  });

  it.skipIf(!hasPatch)('GNU patch applies it and gets the new text, also without a final line feed', () => {
    const text = fc.array(fc.constantFrom('a', 'b', 'c', 'd', ''), { maxLength: 30 }).chain((ls) => fc.tuple(fc.constant(ls), fc.boolean()));
    fc.assert(
      fc.property(text, text, ([a, aFinal], [b, bFinal]) => {
        const oldText = a.length === 0 ? '' : a.join('\n') + (aFinal ? '\n' : '');
        const newText = b.length === 0 ? '' : b.join('\n') + (bFinal ? '\n' : '');
        const diff = unifiedDiff(oldText, newText, 'a/file', 'b/file');
        if (oldText === newText) return;
        expect(patched(oldText, diff)).toBe(newText);
      }),
      { numRuns: 60 },
    );
  });
});
