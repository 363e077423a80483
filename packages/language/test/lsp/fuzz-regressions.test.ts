// Files that random editing found to break a part of the language, kept as
// regressions: each must load headlessly (parse, link, lower, analyse)
// without throwing, and the live analysis must not report a failure of its
// own.
import { describe, expect, it } from 'vitest';
import { lowerSystem } from '../../src/lowering/lower-system.js';
import { analyseLowered } from '../../src/engine-bridge/analyse-lowered.js';
import { toVacnetDiagnostic } from '../../src/diagnostic-conversion.js';
import { CATALOG, createLive } from './live-services.js';

const CASES: Record<string, string> = {
  // Found by `npm run fuzz -- --seed 11`: an inlet's room label cut open by
  // an edit leaves a `room` with no label; lowering read its length.
  'a room with its label cut open': `${CATALOG}
system "Cut" {
  plant pr { producer exh-7  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 2 in length 40 ft horizontal
  inlet A1 on main-1 at 20 ft hose std-50 tool carpet room "Kitchen and din
  inlet A2 on main-1 at 30 ft hose std-50 tool carpet
}
`,
  // The same kind of cut in a scenario: an opening without its inlet.
  'a scenario cut after open': `${CATALOG}
system "Cut" {
  plant pr { producer exh-7  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 2 in length 40 ft horizontal
  inlet A1 on main-1 at 20 ft hose std-50 tool carpet
  scenario s open
}
`,
};

/** Files whose diagnostics must not show a value the program never had (`undefined` in a message). */
const MESSAGE_CASES: Record<string, string> = {
  // Found by `npm run fuzz -- --edits 10000 --seed 42`: `accept` cut before its code gave
  // "Accepting 'undefined' needs a written reason: accept undefined because ...".
  'an accept cut before its code': `${CATALOG}
system "Cut" {
  plant pr { producer exh-7  separator cyc }
  pipe main-1 from pr to j-1 spec steel-10 size 2 in length 40 ft horizontal accept
  inlet A1 on main-1 at 20 ft hose std-50 tool carpet
}
`,
};

describe('regressions found by fuzzing', () => {
  for (const [name, text] of Object.entries(MESSAGE_CASES)) {
    it(`${name}: no message names an undefined value`, async () => {
      const live = createLive();
      const [document] = await live.put({ 'file:///work/fuzz/message.vacnet': text });
      const messages = (document!.diagnostics ?? []).map((d) => d.message);
      expect(messages.length).toBeGreaterThan(0);
      expect(messages.filter((m) => /\bundefined\b/.test(m))).toEqual([]);
    });
  }

  for (const [name, text] of Object.entries(CASES)) {
    it(`${name}: loads, lowers and analyses without throwing`, async () => {
      const live = createLive();
      const [document] = await live.put({ 'file:///work/fuzz/case.vacnet': text });
      const system = document!.parseResult.value.systems[0]!;
      const lowered = lowerSystem(system);
      expect(() => analyseLowered(lowered, (document!.diagnostics ?? []).map(toVacnetDiagnostic), '/work/fuzz/case.vacnet')).not.toThrow();
      const state = await live.analysed('file:///work/fuzz/case.vacnet');
      expect(state.status).not.toBe('failed');
    });
  }
});
