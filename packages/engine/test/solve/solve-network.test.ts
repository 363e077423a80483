import { describe, expect, it } from 'vitest';
import { solveNetwork } from '../../src/solve/solve-network.js';
import { NetBuilder, flowOf, pressureOf } from '../fixtures/solver-network-builder.js';
import { quadraticLaw, squareLaw, testProducerLaw, testToolLaw } from '../fixtures/test-laws.js';

const PATM = 101325;

/** producer - main - [branches] - hose - tool, built from simple laws. */
function chain(opts: { pipeR2?: number } = {}) {
  const nb = new NetBuilder();
  const atm = nb.node(PATM);
  const pin = nb.node();
  const j = nb.node();
  const inlet = nb.node();
  const he = nb.node();
  const prod = nb.element(pin, atm, testProducerLaw(30000, 1000, 2e6), 'P', { drives: true, kind: 'producer' });
  const main = nb.element(j, pin, quadraticLaw(1, opts.pipeR2 ?? 1e6), 'main');
  const branch = nb.element(inlet, j, quadraticLaw(1, 2e6), 'branch');
  const hose = nb.element(he, inlet, quadraticLaw(1, 4e6), 'hose', { kind: 'inlet' });
  const tool = nb.element(atm, he, quadraticLaw(1, 5e6), 'tool', { kind: 'inlet' });
  return { nb, atm, pin, j, inlet, he, prod, main, branch, hose, tool };
}

describe('solveNetwork on a series chain', () => {
  it('matches the closed-form operating point of a quadratic system', () => {
    const c = chain();
    const res = solveNetwork(c.nb.build(), [c.prod, c.main, c.branch, c.hose, c.tool]);
    expect(res.ok).toBe(true);
    if (!res.ok) return;
    // Series resistances add: v0 - a m - b m^2 = (sum r1) m + (sum r2) m^2
    // -> (b + R2) m^2 + (a + R1) m - v0 = 0 (closed form).
    const R1 = 4;
    const R2 = 1e6 + 2e6 + 4e6 + 5e6;
    const A = 2e6 + R2;
    const B = 1000 + R1;
    const m = (-B + Math.sqrt(B * B + 4 * A * 30000)) / (2 * A);
    // Converged to 1e-9 of the total flow (ENGINEERING.md), so agree to that.
    expect(Math.abs(flowOf(res, c.tool) - m)).toBeLessThan(1e-9 * m);
    expect(Math.abs(flowOf(res, c.prod) - m)).toBeLessThan(1e-9 * m);
    expect(PATM - pressureOf(res, c.he)).toBeCloseTo(1 * m + 5e6 * m * m, 5);
    expect(res.imbalanceFraction).toBeLessThan(1e-9);
  });

  it('gives equal flow to two symmetric branches of a loop and balances mass at every node', () => {
    const nb = new NetBuilder();
    const atm = nb.node(PATM);
    const pin = nb.node();
    const left = nb.node();
    const right = nb.node();
    const far = nb.node();
    const he = nb.node();
    const els = [
      nb.element(pin, atm, testProducerLaw(30000, 1000, 2e6), 'P', { drives: true }),
      nb.element(left, pin, squareLaw(1e3, 2e11), 'l1'),
      nb.element(right, pin, squareLaw(1e3, 2e11), 'r1'),
      nb.element(far, left, squareLaw(1e3, 2e11), 'l2'),
      nb.element(far, right, squareLaw(1e3, 2e11), 'r2'),
      nb.element(he, far, quadraticLaw(1, 4e6), 'hose'),
      nb.element(atm, he, quadraticLaw(1, 5e6), 'tool'),
    ];
    const res = solveNetwork(nb.build(), els);
    expect(res.ok).toBe(true);
    if (!res.ok) return;
    const total = flowOf(res, els[6]!);
    expect(Math.abs(flowOf(res, els[1]!) - flowOf(res, els[2]!))).toBeLessThan(1e-9 * total);
    expect(Math.abs(flowOf(res, els[1]!) + flowOf(res, els[2]!) - total)).toBeLessThan(1e-9 * total);
  });
});

describe('solveNetwork failures are typed', () => {
  it('an element with no law is invalid-element', () => {
    const nb = new NetBuilder();
    const atm = nb.node(PATM);
    const a = nb.node();
    const e1 = nb.element(a, atm, null, 'zero-bore', { invalid: 'zero diameter' });
    const res = solveNetwork(nb.build(), [e1]);
    expect(res.ok).toBe(false);
    if (!res.ok) {
      expect(res.failure.cause).toBe('invalid-element');
      expect(res.failure.element?.name).toBe('zero-bore');
    }
  });

  it('an open tool with no producer is no-path', () => {
    const c = chain();
    // Leave the producer out: the tool's air has nowhere to go.
    const res = solveNetwork(c.nb.build(), [c.main, c.branch, c.hose, c.tool]);
    expect(res.ok === false && res.failure.cause).toBe('no-path');
  });

  it('a demand beyond the curve end is infeasible-demand', () => {
    const nb = new NetBuilder();
    const atm = nb.node(PATM);
    const pin = nb.node();
    const he = nb.node();
    const els = [
      nb.element(pin, atm, testProducerLaw(30000, 1000, 2e6, 0.01), 'P', { drives: true, kind: 'producer' }),
      nb.element(he, pin, quadraticLaw(1, 1e5), 'hose'),
      nb.element(atm, he, quadraticLaw(1, 1e5), 'tool'),
    ];
    const res = solveNetwork(nb.build(), els);
    expect(res.ok === false && res.failure.cause).toBe('infeasible-demand');
    expect(res.ok === false && res.failure.element?.name).toBe('P');
  });

  it('a tool past its critical pressure ratio is choked', () => {
    const nb = new NetBuilder();
    const atm = nb.node(PATM);
    const pin = nb.node();
    const he = nb.node();
    const els = [
      nb.element(pin, atm, testProducerLaw(90000, 1000, 1e5), 'P', { drives: true }),
      nb.element(he, pin, quadraticLaw(1, 1e5), 'hose'),
      nb.element(atm, he, testToolLaw(1, 1e8, 0.5283), 'tool', { kind: 'inlet' }),
    ];
    const res = solveNetwork(nb.build(), els);
    expect(res.ok === false && res.failure.cause).toBe('choked');
    expect(res.ok === false && res.failure.element?.name).toBe('tool');
  });
});
