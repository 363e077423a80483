import { describe, expect, it } from 'vitest';
import { dustNonconductive } from '../../src/rules/dust-nonconductive.js';
import { createRuleSettings } from '../../src/rules/rule-settings.js';
import { hose, inlet, pipe, pvc, system } from './fixtures.js';
import type { SystemModel } from '../../src/network/model.js';

const run = (m: SystemModel) => dustNonconductive.check(m, undefined, createRuleSettings(dustNonconductive, m));
const dust = { combustible: true, metal: false, bondedAndGrounded: true };

describe('dust-nonconductive', () => {
  // NFPA 652: conductive or static-dissipative hose; NFPA 654: metallic ducts (CHECKS.md).
  const model = (combustible: boolean) =>
    system({
      dust: { ...dust, combustible },
      pipes: [pipe('steel', 'plant', 'a'), pipe('plastic', 'a', 'b', { spec: pvc() })],
      inlets: [inlet('i1', 'b', { hose: hose({ name: 'plain', conductive: false }) }), inlet('i2', 'a')],
    });
  it('cautions about non-conductive pipe and hose on combustible dust, deferring to NFPA and the AHJ', () => {
    const f = run(model(true));
    expect(f.map((x) => x.element)).toEqual([
      { kind: 'pipe', name: 'plastic', property: 'spec' },
      { kind: 'inlet', name: 'i1', property: 'hose' },
    ]);
    for (const x of f) {
      expect(x.message).toMatch(/^Caution/);
      expect(x.message).toMatch(/NFPA 652/);
      expect(x.message).toMatch(/authority having jurisdiction/);
      expect(x.message).not.toMatch(/complies|compliant/i);
    }
  });
  it('says nothing when the dust is not combustible', () => {
    expect(run(model(false))).toEqual([]);
  });
});
