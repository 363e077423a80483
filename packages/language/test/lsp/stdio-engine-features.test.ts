// The engine-backed editor features over the real protocol, against the
// bundled server (packages/extension/dist/server.cjs) driven by a JSON-RPC
// client (vscode-jsonrpc, as VS Code's own client is). Message shapes from
// the LSP 3.17 specification: publishDiagnostics carries Diagnostic[] with
// codeDescription and relatedInformation; inlayHint returns InlayHint[];
// codeAction returns (Command | CodeAction)[] with WorkspaceEdit changes.
// Expected numbers come from the headless loader on the same file (the same
// engine on this side of the wire).
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { formatQuantity } from '@vacnet/engine';
import type { CodeAction, Hover, InlayHint, TextEdit } from 'vscode-languageserver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDocuments } from '../../src/document.js';
import { shutdown } from './stdio-client.js';
import { applyEdits, SLOW_SYSTEM } from './live-services.js';
import { examplesDir, startEngineSession, type EngineSession } from './stdio-engine-client.js';
import { vacnetFiles } from '../example-files.js';

const key = (d: { code?: unknown; severity?: unknown; message: unknown; range: { start: { line: number; character: number }; end: { line: number; character: number } } }) =>
  `${String(d.code)}|${d.severity}|${d.range.start.line}:${d.range.start.character}-${d.range.end.line}:${d.range.end.character}|${d.message}`;
const SEVERITY: Record<string, number> = { error: 1, warning: 2, info: 3 };

describe('vacnet language server (bundled), engine features over stdio', () => {
  let session: EngineSession;

  beforeAll(async () => {
    session = await startEngineSession({ workspaceFolder: examplesDir });
  });

  afterAll(async () => {
    if (session.server.child.exitCode === null) expect(await shutdown(session.server)).toBe(0);
  });

  it('publishes for every example what the headless loader reports, each diagnostic linked to its rule page', async () => {
    for (const file of vacnetFiles(examplesDir)) {
      const uri = pathToFileURL(file).href;
      await session.open(uri, readFileSync(file, 'utf8'));
      await session.settled(uri, 1);
      const published = session.latest(uri)!;
      expect(published.version, file).toBe(1);
      const headless = (await loadDocuments([file], { analyse: true })).files[0]!;
      const expected = headless.diagnostics.map((d) => key({ ...d, severity: SEVERITY[d.severity] })).sort();
      expect(published.diagnostics.map(key).sort(), file).toEqual(expected);
      for (const d of published.diagnostics) {
        const href = d.codeDescription?.href;
        expect(href, `${file}: ${d.code}`).toMatch(/^file:\/\/.*\/docs\/rules\/[a-z-]+\.md$/);
        expect(existsSync(fileURLToPath(href!)), href).toBe(true);
        expect(href!.endsWith(`/${String(d.code)}.md`)).toBe(true);
      }
    }
  });

  it('puts the velocity finding of a too-slow pipe on its size, and clears it when an edit fixes the size', async () => {
    const uri = pathToFileURL('/tmp/vacnet-stdio-engine/slow.vacnet').href;
    await session.open(uri, SLOW_SYSTEM);
    await session.settled(uri, 1);
    const slow = session.latest(uri)!.diagnostics.filter((d) => d.code === 'slow-carrying-velocity');
    expect(slow).toHaveLength(1);
    const lines = SLOW_SYSTEM.split('\n');
    // `size 4 in` on the pipe line: the finding underlines exactly `4 in`.
    const pipeLine = lines.findIndex((l) => l.includes('pipe main-1'));
    expect(slow[0]!.range).toEqual({ start: { line: pipeLine, character: lines[pipeLine]!.indexOf('4 in') }, end: { line: pipeLine, character: lines[pipeLine]!.indexOf('4 in') + 4 } });
    expect(slow[0]!.severity).toBe(2);
    expect(slow[0]!.relatedInformation?.[0]?.message).toMatch(/lone operator gives the lowest velocity/);

    await session.change(uri, SLOW_SYSTEM.replace('size 4 in', 'size 2 in'), 2);
    await session.settled(uri, 2);
    const after = session.latest(uri)!;
    expect(after.version).toBe(2);
    expect(after.diagnostics.map((d) => d.code)).not.toContain('slow-carrying-velocity');
    // No publication for version 2 ever carried the old finding.
    const v2 = session.published.filter((p) => p.uri === uri && p.version === 2);
    expect(v2.flatMap((p) => p.diagnostics).filter((d) => d.code === 'slow-carrying-velocity')).toEqual([]);
  });

  it('answers inlay hints with the engine numbers of the same file', async () => {
    const file = join(examplesDir, 'harbour-offices.vacnet');
    const uri = pathToFileURL(file).href;
    await session.settled(uri, 1);
    const hints = await session.server.request<InlayHint[]>('textDocument/inlayHint', { textDocument: { uri }, range: { start: { line: 0, character: 0 }, end: { line: 10_000, character: 0 } } });
    const headless = (await loadDocuments([file], { analyse: true })).files[0]!;
    const analysis = headless.analysis!;
    const units = headless.model!.displayUnits ?? 'imperial';
    const lines = readFileSync(file, 'utf8').split('\n');
    let inletHints = 0;
    for (const inlet of analysis.inlets) {
      const wc = inlet.worstCase!;
      const line = lines.findIndex((l) => new RegExp(`^\\s*inlet ${inlet.name.replace(/[-.]/g, '\\$&')}\\b`).test(l));
      const hint = hints.find((h) => h.position.line === line);
      expect(hint?.label, inlet.name).toBe(`${formatQuantity(wc.toolVacuumPa, 'pressure', units, 2)} · ${formatQuantity(wc.flowStdM3PerS, 'flow', units, 2, { flowBasis: 'standard' })}`);
      inletHints++;
    }
    expect(inletHints).toBe(analysis.inlets.length);
    for (const pipe of analysis.pipes.filter((p) => p.minVelocityMPerS !== null)) {
      const line = lines.findIndex((l) => new RegExp(`^\\s*pipe ${pipe.name.replace(/[-.]/g, '\\$&')}\\b`).test(l));
      expect(hints.find((h) => h.position.line === line)?.label, pipe.name).toBe(`min ${formatQuantity(pipe.minVelocityMPerS!, 'velocity', units)}`);
    }
  });

  it('hovers on an inlet with its computed values and how they were computed', async () => {
    const file = join(examplesDir, 'harbour-offices.vacnet');
    const uri = pathToFileURL(file).href;
    const lines = readFileSync(file, 'utf8').split('\n');
    const line = lines.findIndex((l) => /^\s*inlet L1-lobby\b/.test(l));
    const hover = await session.server.request<Hover>('textDocument/hover', { textDocument: { uri }, position: { line, character: lines[line]!.indexOf('L1-lobby') + 2 } });
    const value = (hover.contents as { value: string }).value;
    expect(value).toMatch(/\*\*Computed for inlet `L1-lobby`\*\*/);
    expect(value).toMatch(/Worst case, with .* also open: [\d.]+ inHg at the tool/);
    expect(value).toMatch(/isentropic nozzle flow/);
  });

  it('applies a quick fix the server offers, and the finding is gone from the next diagnostics', async () => {
    const uri = pathToFileURL('/tmp/vacnet-stdio-engine/fix.vacnet').href;
    await session.open(uri, SLOW_SYSTEM);
    await session.settled(uri, 1);
    const finding = session.latest(uri)!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')!;
    const actions = await session.server.request<CodeAction[]>('textDocument/codeAction', { textDocument: { uri }, range: finding.range, context: { diagnostics: [finding] } });
    const preferred = actions.find((a) => a.isPreferred)!;
    expect(preferred.title).toMatch(/^Resize pipe 'main-1' to /);
    const edited = applyEdits(SLOW_SYSTEM, preferred.edit!.changes![uri]! as TextEdit[]);
    await session.change(uri, edited, 2);
    await session.settled(uri, 2);
    expect(session.latest(uri)!.diagnostics.filter((d) => d.code === 'slow-carrying-velocity')).toEqual([]);
  });

  it('formats every example idempotently, keeping every comment', async () => {
    const options = { tabSize: 2, insertSpaces: true };
    for (const file of vacnetFiles(examplesDir)) {
      const uri = pathToFileURL(join('/tmp/vacnet-stdio-format', file.slice(examplesDir.length))).href;
      const text = readFileSync(file, 'utf8');
      await session.open(uri, text);
      const edits = await session.server.request<TextEdit[] | null>('textDocument/formatting', { textDocument: { uri }, options });
      const once = applyEdits(text, edits ?? []);
      const comments = (t: string) => (t.match(/\/\/[^\n\r]*|\/\*[\s\S]*?\*\//g) ?? []).map((c) => c.replace(/\r?\n[ \t]*/g, '\n').trimEnd());
      expect(comments(once), file).toEqual(comments(text));
      await session.change(uri, once, 2);
      const again = await session.server.request<TextEdit[] | null>('textDocument/formatting', { textDocument: { uri }, options });
      expect(again ?? [], file).toEqual([]);
    }
  });
});

describe('vacnet language server (bundled): settings from workspace/configuration', () => {
  it('shows SI units and a severity from the workspace settings; the file still wins', async () => {
    const settings = { units: 'si', rules: { 'slow-carrying-velocity': { severity: 'error' } } };
    const session = await startEngineSession({ capabilities: { workspace: { configuration: true, didChangeConfiguration: { dynamicRegistration: false } } }, configuration: (section) => (section === 'vacnet' ? settings : null) });
    const uri = pathToFileURL('/tmp/vacnet-stdio-settings/slow.vacnet').href;
    await session.open(uri, SLOW_SYSTEM);
    await session.settled(uri, 1);
    const slow = session.latest(uri)!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')!;
    expect(slow.severity).toBe(1);
    expect(slow.message).toMatch(/ m\/s /);
    await session.change(uri, SLOW_SYSTEM.replace('operators 1', 'operators 1\n  units imperial\n  rule slow-carrying-velocity severity info'), 2);
    await session.settled(uri, 2);
    const fileWins = session.latest(uri)!.diagnostics.find((d) => d.code === 'slow-carrying-velocity')!;
    expect(fileWins.severity).toBe(3);
    expect(fileWins.message).toMatch(/ fpm /);
    expect(await shutdown(session.server)).toBe(0);
  });
});

describe('vacnet language server (bundled): the project settings file', () => {
  it('applies vacnet.json as `vacnet check` does, and shows its problems on it', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'vacnet-project-'));
    try {
      mkdirSync(join(dir, '.git'));
      mkdirSync(join(dir, 'systems'));
      // One good setting and one misspelt rule (a settings problem placed in vacnet.json).
      writeFileSync(join(dir, 'vacnet.json'), '{\n  "rules": {\n    "slow-carrying-velocity": { "severity": "error" },\n    "slow-carying-velocity": { "severity": "info" }\n  }\n}\n');
      const file = join(dir, 'systems', 'slow.vacnet');
      writeFileSync(file, SLOW_SYSTEM);
      const session = await startEngineSession({ workspaceFolder: dir });
      const uri = pathToFileURL(file).href;
      await session.open(uri, SLOW_SYSTEM);
      await session.settled(uri, 1);
      const published = session.latest(uri)!;
      const headless = (await loadDocuments([file], { analyse: true, settings: 'discover' })).files[0]!;
      expect(published.diagnostics.map(key).sort()).toEqual(headless.diagnostics.map((d) => key({ ...d, severity: SEVERITY[d.severity] })).sort());
      expect(published.diagnostics.find((d) => d.code === 'slow-carrying-velocity')?.severity).toBe(1);
      const settingsUri = pathToFileURL(join(dir, 'vacnet.json')).href;
      const onSettings = session.latest(settingsUri);
      expect(onSettings?.diagnostics.map((d) => `${d.code}@${d.range.start.line}`)).toEqual(['settings-unknown-name@3']);
      expect(await shutdown(session.server)).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
