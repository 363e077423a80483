/**
 * Line diffs for `vacnet fmt --check`: the shortest edit script between two
 * texts by Myers' O(ND) algorithm (E. W. Myers, "An O(ND) Difference
 * Algorithm and Its Variations", Algorithmica 1, 1986), printed as a
 * unified diff (the format of GNU diff -u and git, read by patch(1) and
 * `git apply`).
 */

export type LineEdit = { kind: 'same' | 'delete' | 'insert'; line: string };

/** Past this many differences the middle of the texts is shown as removed then added (bounded memory; still a correct diff). */
const MAX_EDIT_DISTANCE = 4000;

/** The edit script turning `a` into `b`, line by line, shortest where D <= MAX_EDIT_DISTANCE. */
export function diffLines(a: readonly string[], b: readonly string[]): LineEdit[] {
  // Common head and tail cost nothing to match and shrink the search.
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;
  const middle = myers(a.slice(head, a.length - tail), b.slice(head, b.length - tail));
  return [
    ...a.slice(0, head).map((line) => ({ kind: 'same' as const, line })),
    ...middle,
    ...a.slice(a.length - tail).map((line) => ({ kind: 'same' as const, line })),
  ];
}

function myers(a: readonly string[], b: readonly string[]): LineEdit[] {
  const n = a.length;
  const m = b.length;
  if (n === 0) return b.map((line) => ({ kind: 'insert', line }));
  if (m === 0) return a.map((line) => ({ kind: 'delete', line }));
  const limit = Math.min(n + m, MAX_EDIT_DISTANCE);
  // v[k] = furthest x on diagonal k (offset by limit + 1); trace[d] keeps the diagonals -d..d before round d.
  const offset = limit + 1;
  const v = new Int32Array(2 * limit + 3);
  const trace: Int32Array[] = [];
  for (let d = 0; d <= limit; d++) {
    trace.push(v.slice(offset - d, offset + d + 1));
    for (let k = -d; k <= d; k += 2) {
      let x = k === -d || (k !== d && v[offset + k - 1]! < v[offset + k + 1]!) ? v[offset + k + 1]! : v[offset + k - 1]! + 1;
      let y = x - k;
      while (x < n && y < m && a[x] === b[y]) {
        x++;
        y++;
      }
      v[offset + k] = x;
      if (x >= n && y >= m) return backtrack(a, b, trace);
    }
  }
  // Too different to search further: all of `a` out, all of `b` in.
  return [...a.map((line) => ({ kind: 'delete' as const, line })), ...b.map((line) => ({ kind: 'insert' as const, line }))];
}

function backtrack(a: readonly string[], b: readonly string[], trace: readonly Int32Array[]): LineEdit[] {
  const edits: LineEdit[] = [];
  let x = a.length;
  let y = b.length;
  for (let d = trace.length - 1; d >= 0; d--) {
    const at = (k: number) => trace[d]![k + d]!;
    const k = x - y;
    const previousK = k === -d || (k !== d && at(k - 1) < at(k + 1)) ? k + 1 : k - 1;
    const previousX = d === 0 ? 0 : at(previousK);
    const previousY = previousX - previousK;
    while (x > previousX && y > previousY) {
      edits.push({ kind: 'same', line: a[x - 1]! });
      x--;
      y--;
    }
    if (d === 0) break;
    if (x === previousX) {
      edits.push({ kind: 'insert', line: b[y - 1]! });
      y--;
    } else {
      edits.push({ kind: 'delete', line: a[x - 1]! });
      x--;
    }
  }
  return edits.reverse();
}

/** Lines of a text without their line feeds; `final` says whether the last line had one. */
function splitLines(text: string): { lines: string[]; final: boolean } {
  if (text === '') return { lines: [], final: true };
  const lines = text.split('\n');
  const final = lines.at(-1) === '';
  if (final) lines.pop();
  return { lines, final };
}

const NO_NEWLINE = '\\ No newline at end of file';

/**
 * A unified diff from `oldText` to `newText` with `context` lines around
 * each change, headed `--- oldName` / `+++ newName`; empty when the texts
 * are equal. Carriage returns stay part of their lines, so a change of line
 * ends shows as a change.
 */
export function unifiedDiff(oldText: string, newText: string, oldName: string, newName: string, context = 3): string {
  if (oldText === newText) return '';
  const before = splitLines(oldText);
  const after = splitLines(newText);
  // A last line without a line feed differs from the same line with one.
  const mark = (lines: string[], final: boolean) => (final || lines.length === 0 ? lines : [...lines.slice(0, -1), `${lines.at(-1)}\u0000`]);
  const edits = diffLines(mark(before.lines, before.final), mark(after.lines, after.final));

  // Positions of each edit in both texts (0-based line numbers before it).
  const rows = [];
  let oldLine = 0;
  let newLine = 0;
  for (const edit of edits) {
    rows.push({ ...edit, oldLine, newLine });
    if (edit.kind !== 'insert') oldLine++;
    if (edit.kind !== 'delete') newLine++;
  }

  const out = [`--- ${oldName}`, `+++ ${newName}`];
  let i = 0;
  while (i < rows.length) {
    if (rows[i]!.kind === 'same') {
      i++;
      continue;
    }
    // A hunk: from `context` lines before this change to `context` lines after the last change within reach.
    const start = Math.max(0, i - context);
    let end = i;
    let lastChange = i;
    while (end < rows.length && (rows[end]!.kind !== 'same' || end - lastChange <= 2 * context)) {
      if (rows[end]!.kind !== 'same') lastChange = end;
      end++;
    }
    end = Math.min(rows.length, lastChange + context + 1);
    const hunk = rows.slice(start, end);
    const oldCount = hunk.filter((r) => r.kind !== 'insert').length;
    const newCount = hunk.filter((r) => r.kind !== 'delete').length;
    const oldStart = oldCount === 0 ? hunk[0]!.oldLine : hunk[0]!.oldLine + 1;
    const newStart = newCount === 0 ? hunk[0]!.newLine : hunk[0]!.newLine + 1;
    out.push(`@@ -${range(oldStart, oldCount)} +${range(newStart, newCount)} @@`);
    for (const row of hunk) {
      const sign = row.kind === 'same' ? ' ' : row.kind === 'delete' ? '-' : '+';
      const unterminated = row.line.endsWith('\u0000');
      out.push(sign + (unterminated ? row.line.slice(0, -1) : row.line));
      if (unterminated) out.push(NO_NEWLINE);
    }
    i = end;
  }
  return out.join('\n') + '\n';
}

/** `start,count`, with `,1` left out as GNU diff does. */
function range(start: number, count: number): string {
  return count === 1 ? String(start) : `${start},${count}`;
}
