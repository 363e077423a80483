// Robustness of the bundled language server under random editing: 1,000
// random edits (insert, delete, duplicate, swap characters and lines, paste,
// replace everything) of the example files, with editor requests between
// them (scripts/fuzz-server.mjs; `npm run fuzz -- --edits 10000` runs the
// long version). The server must not crash, must publish only well-formed
// results (ranges inside the document version they name, no NaN or
// Infinity it computed in a message or hint) and must answer every request
// while editing within 1 s.
import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runFuzz } from '../../../../scripts/fuzz-server.mjs';
import { bundledServer } from './stdio-engine-client.js';

describe('language server under random edits', () => {
  it('survives 1,000 random edits of the examples with well-formed answers, each within 1 s', async () => {
    if (!existsSync(bundledServer)) throw new Error(`${bundledServer} is missing: run \`npm run build\` first`);
    const { problems, stats } = await runFuzz({ edits: 1000, seed: 20_260_101 });
    expect(problems).toEqual([]);
    // The run did what it says: every edit sent, requests answered, diagnostics checked.
    expect(stats.edits).toBe(1000);
    expect(stats.requests).toBeGreaterThan(500);
    expect(stats.diagnosticsChecked).toBeGreaterThan(1000);
  }, 600_000);
});
