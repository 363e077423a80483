import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseLU, diagIndex, factorLU, offIndex, solveLU } from '../../src/solve/sparse-lu.js';
import { forestOrder, solveForest } from '../../src/solve/tree-elimination.js';

/** Dense Gaussian elimination with partial pivoting: an independent reference solve. */
function denseSolve(A: number[][], b: number[]): number[] {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[piv]![c]!)) piv = r;
    [M[c], M[piv]] = [M[piv]!, M[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = M[r]![c]! / M[c]![c]!;
      for (let k = c; k <= n; k++) M[r]![k] = M[r]![k]! - f * M[c]![k]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r]![n]!;
    for (let k = r + 1; k < n; k++) s -= M[r]![k]! * x[k]!;
    x[r] = s / M[r]![r]!;
  }
  return x;
}

/**
 * A random network-like matrix: for each edge (i, j) with element
 * derivatives dA > 0, dB < 0 (as a flow law gives) add the Jacobian block,
 * plus a grounded element at some nodes: column diagonally dominant.
 */
function networkMatrix(n: number, edges: [number, number][], rnd: () => number) {
  const A = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const blocks: { i: number; j: number; dA: number; dB: number }[] = [];
  for (const [i, j] of edges) {
    const dA = 0.1 + rnd();
    const dB = -(0.1 + rnd());
    A[i]![i]! -= dA;
    A[i]![j]! -= dB;
    A[j]![i]! += dA;
    A[j]![j]! += dB;
    blocks.push({ i, j, dA, dB });
  }
  const ground: number[] = [];
  for (let i = 0; i < n; i++) {
    const g = i === 0 || rnd() < 0.2 ? 0.05 + rnd() : 0;
    A[i]![i]! -= g;
    ground.push(g);
  }
  return { A, blocks, ground };
}

function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

/** A connected random graph: a random tree plus `extra` chords. */
function randomGraph(n: number, extra: number, rnd: () => number): [number, number][] {
  const edges: [number, number][] = [];
  const key = new Set<string>();
  for (let i = 1; i < n; i++) {
    const j = Math.floor(rnd() * i);
    edges.push([j, i]);
    key.add(`${Math.min(i, j)}-${Math.max(i, j)}`);
  }
  for (let t = 0; t < extra; t++) {
    const i = Math.floor(rnd() * n);
    const j = Math.floor(rnd() * n);
    const k = `${Math.min(i, j)}-${Math.max(i, j)}`;
    if (i === j || key.has(k)) continue;
    key.add(k);
    edges.push([i, j]);
  }
  return edges;
}

describe('sparse LU (minimum degree, no pivoting) against dense elimination with pivoting', () => {
  it('solves random network Jacobians, trees and looped', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 0, max: 30 }), fc.integer(), (n, extra, seed) => {
        const rnd = lcg(seed);
        const edges = randomGraph(n, extra, rnd);
        const { A, blocks, ground } = networkMatrix(n, edges, rnd);
        const b = Array.from({ length: n }, () => rnd() - 0.5);
        const sym = analyseLU(n, edges.map((e) => e[0]), edges.map((e) => e[1]));
        const values = new Float64Array(sym.valueCount);
        blocks.forEach(({ i, j, dA, dB }, e) => {
          values[diagIndex(i)]! -= dA;
          values[offIndex(sym, e, i)]! -= dB;
          values[offIndex(sym, e, j)]! += dA;
          values[diagIndex(j)]! += dB;
        });
        ground.forEach((g, i) => (values[diagIndex(i)]! -= g));
        expect(factorLU(sym, values)).toBe(true);
        const x = Float64Array.from(b);
        solveLU(sym, values, x);
        const ref = denseSolve(A, b);
        const scale = Math.max(1, ...ref.map(Math.abs));
        for (let i = 0; i < n; i++) expect(Math.abs(x[i]! - ref[i]!)).toBeLessThan(1e-9 * scale);
      }),
      { numRuns: 200 },
    );
  });

  it('adds no fill on a tree (leaves eliminated first)', () => {
    const rnd = lcg(7);
    const edges = randomGraph(500, 0, rnd);
    const sym = analyseLU(500, edges.map((e) => e[0]), edges.map((e) => e[1]));
    expect(sym.edgeCount).toBe(499);
  });

  it('reports a singular matrix (a part with no fixed pressure) as false, not NaN', () => {
    const sym = analyseLU(2, [0], [1]);
    const values = new Float64Array(sym.valueCount);
    values[0] = -1;
    values[offIndex(sym, 0, 0)] = 1;
    values[offIndex(sym, 0, 1)] = 1;
    values[1] = -1;
    expect(factorLU(sym, values)).toBe(false);
  });
});

describe('forest elimination against dense elimination', () => {
  it('solves random forests and rejects loops', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.integer(), (n, seed) => {
        const rnd = lcg(seed);
        // A forest: drop some tree edges.
        const edges = randomGraph(n, 0, rnd).filter(() => rnd() < 0.9);
        const { A, blocks, ground } = networkMatrix(n, edges, rnd);
        // Every tree of the forest needs a grounded node; ground all roots generously.
        const forest = forestOrder(n, edges.map((e) => e[0]), edges.map((e) => e[1]))!;
        expect(forest).not.toBeNull();
        const values = new Float64Array(3 * n);
        for (let i = 0; i < n; i++) {
          if (forest.parent[i] === -1 && ground[i] === 0) {
            ground[i] = 1;
            A[i]![i]! -= 1;
          }
          values[i]! -= ground[i]!;
        }
        for (const { i, j, dA, dB } of blocks) {
          const child = forest.parent[i] === j ? i : j;
          const slot = (from: number) => (from === child ? n + child : 2 * n + child);
          values[i]! -= dA;
          values[slot(i)]! -= dB;
          values[slot(j)]! += dA;
          values[j]! += dB;
        }
        const b = Array.from({ length: n }, () => rnd() - 0.5);
        const x = Float64Array.from(b);
        expect(solveForest(forest, values, x)).toBe(true);
        const ref = denseSolve(A, b);
        const scale = Math.max(1, ...ref.map(Math.abs));
        for (let i = 0; i < n; i++) expect(Math.abs(x[i]! - ref[i]!)).toBeLessThan(1e-9 * scale);
      }),
      { numRuns: 200 },
    );
    expect(forestOrder(3, [0, 1, 2], [1, 2, 0])).toBeNull();
    expect(forestOrder(2, [0, 0], [1, 1])).toBeNull();
  });
});
