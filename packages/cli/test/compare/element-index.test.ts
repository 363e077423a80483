import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadDocuments } from '@vacnet/language';
import { afterAll, describe, expect, it } from 'vitest';
import { compareElements } from '../../src/compare/comparison.js';
import { indexElements } from '../../src/compare/element-index.js';

// Element comparison that ignores layout: units are compared in SI, with
// the exact factors of NIST SP 811 (1 in = 25.4 mm, 1 ft = 12 in), and
// standard and actual flow are kept apart (scfm is not acfm).

const work = mkdtempSync(join(tmpdir(), 'vacnet-elements-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

let n = 0;
async function elementsOf(text: string) {
  const path = join(work, `f${n++}.vacnet`);
  writeFileSync(path, text);
  return indexElements((await loadDocuments([path])).files[0]!.root);
}

const SYSTEM = (pipe: string, extra = '') => `spec s material steel schedule 10 roughness 45 um
system "T" {
  plant p { }
  ${pipe}
  ${extra}
}
`;

describe('compareElements', () => {
  it('2 in = 50.8 mm and 20 ft = 240 in are no change (NIST SP 811); 2-1/2 in is', async () => {
    const a = await elementsOf(SYSTEM('pipe m from p to j spec s size 2 in length 20 ft horizontal'));
    const b = await elementsOf(SYSTEM('pipe   m from p to j   horizontal length 240 in size 50.8 mm spec s // moved around'));
    expect(compareElements(a, b)).toEqual([]);
    const c = await elementsOf(SYSTEM('pipe m from p to j spec s size 2-1/2 in length 20 ft horizontal'));
    expect(compareElements(a, c)).toEqual([{ change: 'changed', kind: 'pipe', name: 'm', properties: [{ key: 'size', before: 'size 2 in', after: 'size 2-1/2 in' }] }]);
  });

  it('a property added and one removed; an element renamed is one removed and one added', async () => {
    const a = await elementsOf(SYSTEM('pipe m from p to j spec s size 2 in length 20 ft horizontal reducer'));
    const b = await elementsOf(SYSTEM('pipe m from p to j spec s size 2 in length 20 ft horizontal bend 90 deg'));
    expect(compareElements(a, b)).toEqual([{ change: 'changed', kind: 'pipe', name: 'm', properties: [{ key: 'bend', after: 'bend 90 deg' }, { key: 'reducer', before: 'reducer' }] }]);
    const c = await elementsOf(SYSTEM('pipe main from p to j spec s size 2 in length 20 ft horizontal reducer'));
    expect(compareElements(a, c).map((e) => `${e.change} ${e.kind} ${e.name}`)).toEqual(['added pipe main', 'removed pipe m']);
  });

  it('standard and actual flow differ at the same number', async () => {
    const a = await elementsOf('separator c loss 2 inH2O at 300 scfm\n');
    const b = await elementsOf('separator c loss 2 inH2O at 300 acfm\n');
    expect(compareElements(a, b)).toEqual([{ change: 'changed', kind: 'separator', name: 'c', properties: [{ key: 'loss', before: 'loss 2 inH2O at 300 scfm', after: 'loss 2 inH2O at 300 acfm' }] }]);
  });

  it('design-basis lines and rule lines are compared by what they set', async () => {
    const a = await elementsOf(SYSTEM('operators 2', 'rule fast-velocity limit 7000 fpm'));
    const b = await elementsOf(SYSTEM('operators 3', 'rule fast-velocity limit 7000 fpm'));
    expect(compareElements(a, b)).toEqual([{ change: 'changed', kind: 'design', name: 'operators', properties: [{ key: 'value', before: 'operators 2', after: 'operators 3' }] }]);
  });
});
