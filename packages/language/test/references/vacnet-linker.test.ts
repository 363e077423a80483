import { describe, expect, it } from 'vitest';
import { editDistance } from '../../src/references/vacnet-linker.js';
import { check, system } from '../helpers.js';

describe('unresolved names', () => {
  it('suggest the names in scope that are a typo away', async () => {
    const { diagnostics } = await check(system('  inlet A1 at j-1 hose std-5O tool carpet'));
    const message = diagnostics.find((d) => d.code === 'unresolved-reference')!.message;
    expect(message).toContain("There is no hose named 'std-5O'");
    expect(message).toContain("Did you mean 'std-50'?");
  });

  it('suggest nothing when no name is close', async () => {
    const { diagnostics } = await check(system('  inlet A1 at j-1 hose wholly-different tool carpet'));
    expect(diagnostics.find((d) => d.code === 'unresolved-reference')!.message).not.toContain('Did you mean');
  });
});

describe('editDistance (Levenshtein)', () => {
  it.each([
    ['kitten', 'sitting', 3],
    ['std-50', 'std-5', 1],
    ['riser-a', 'riser-b', 1],
    ['', 'abc', 3],
  ])('%s -> %s is %i', (a, b, d) => {
    expect(editDistance(a, b, 10)).toBe(d);
  });

  it('gives up past the limit', () => {
    expect(editDistance('abcdef', 'uvwxyz', 2)).toBe(3);
  });
});
