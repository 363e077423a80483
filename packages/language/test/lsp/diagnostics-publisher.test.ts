// The publisher's promise: every validated document gets its diagnostics,
// engine findings included, even when Langium's own publication of it never
// comes (a build cancelled between a document's listeners skips it).
import { URI } from 'langium';
import { describe, expect, it } from 'vitest';
import type { Connection, PublishDiagnosticsParams } from 'vscode-languageserver';
import { SLOW_SYSTEM, createLive } from './live-services.js';

/** A connection that records the diagnostics sent and accepts every other call as a no-op. */
function recordingConnection(sent: PublishDiagnosticsParams[]): Connection {
  const noop: unknown = new Proxy(() => undefined, { get: () => noop, apply: () => ({ dispose() {} }) });
  return new Proxy({} as Connection, {
    get: (_target, key) => (key === 'sendDiagnostics' ? async (params: PublishDiagnosticsParams) => void sent.push(params) : noop),
  });
}

describe('diagnostics publisher', () => {
  it('publishes a document whose structural diagnostics Langium never sent, with its engine findings', async () => {
    const sent: PublishDiagnosticsParams[] = [];
    // Langium's diagnostics handler is registered only when a server starts, so here it never publishes: the lost case.
    const live = createLive({}, recordingConnection(sent));
    const uri = 'file:///work/publisher/slow.vacnet';
    await live.put({ [uri]: SLOW_SYSTEM });
    const deadline = Date.now() + 5000;
    while (!live.Vacnet.lsp.DiagnosticsPublisher.hasPublishedFinal(uri) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
    expect(live.Vacnet.lsp.DiagnosticsPublisher.hasPublishedFinal(uri)).toBe(true);
    const last = sent.filter((p) => p.uri === uri).at(-1)!;
    expect(last.version).toBe(live.documents.getDocument(URI.parse(uri))!.textDocument.version);
    // The slow main's velocity finding (an engine finding) is in the one publication.
    expect(last.diagnostics.map((d) => d.code)).toContain('slow-carrying-velocity');
  });
});
