// Benchmark group `lsp`: the language server as an editor meets it, over a
// real stdio session with the bundled server (packages/extension/dist/
// server.cjs) and the generated 1,000-inlet system (generate-system.mjs).
//
//   keystroke_vs_parse_1k  time from a didChange of one pipe length to the
//                          publishDiagnostics of that version that includes
//                          the engine's findings, over the parse + link time
//                          of the same file in this process (issue 4: <= 2.0)
//   inlay_hints_ms_1k      an inlayHint request for one editor window of lines
//                          (what an editor asks for), answered from the cached
//                          analysis (issue 4: <= 20 ms); the whole file's is
//                          in the notes
//   server_rss_mb_1k       resident memory of the server process (with its
//                          analysis thread) holding the analysed file, after a
//                          pause of a few seconds as when a user stops typing
//                          (issue 4: <= 250 MB); the peak while typing is in
//                          the notes
import { spawn } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { EmptyFileSystem, URI } from 'langium';
import { createVacnetServices } from '@vacnet/language';
import { createMessageConnection, StreamMessageReader, StreamMessageWriter } from 'vscode-jsonrpc/node';
import { generateSystem } from './generate-system.mjs';

/** Targets of issue 4. */
const KEYSTROKE_VS_PARSE_TARGET = 2.0;
const INLAY_HINTS_MS_TARGET = 20;
const SERVER_RSS_MB_TARGET = 250;

const PARSE_WARMUP = 3;
const PARSE_RUNS = 9;
/** Keystrokes before the timed ones: the first edits of a session run cold code (the JIT has not compiled the parser and solver yet). */
const WARMUP_KEYSTROKES = 2;
const KEYSTROKES = 3;
const HINT_WARMUP = 3;
const HINT_RUNS = 15;
/** A user's pause before memory is read, ms: longer than the server's idle collection waits (src/idle-collection.ts). */
const PAUSE_MS = 3000;
/** Lines of one editor window: editors ask for the hints of the visible range (our choice of a tall window). */
const VIEWPORT_LINES = 60;

const root = fileURLToPath(new URL('..', import.meta.url));
const server = `${root}packages/extension/dist/server.cjs`;

const median = (values) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};
const round = (value, digits) => Number(value.toFixed(digits));

/** Parse + link (no validation) of the text on fresh documents, ms: the median after warm-up. */
async function parseAndLinkMs(text) {
  const { shared } = createVacnetServices(EmptyFileSystem);
  const documents = shared.workspace.LangiumDocuments;
  const builder = shared.workspace.DocumentBuilder;
  const samples = [];
  for (let i = 0; i < PARSE_WARMUP + PARSE_RUNS; i++) {
    const uri = URI.parse(`memory:///bench/lsp-${i}.vacnet`);
    const t0 = performance.now();
    const document = documents.createDocument(uri, text);
    await builder.build([document], { validation: false });
    const elapsed = performance.now() - t0;
    await builder.update([], [uri]);
    if (i >= PARSE_WARMUP) samples.push(elapsed);
  }
  return median(samples);
}

function rssMb(pid) {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(/VmRSS:\s+(\d+)\s+kB/.exec(status)?.[1]);
  return kb / 1024;
}

export async function run() {
  if (!existsSync(server)) throw new Error(`${server} is missing: run \`npm run build\` first`);
  const system = generateSystem(1000);
  const text = system.text;
  const parseMs = await parseAndLinkMs(text);

  const child = spawn(process.execPath, [server, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (c) => (stderr += c));
  const connection = createMessageConnection(new StreamMessageReader(child.stdout), new StreamMessageWriter(child.stdin));
  const waiters = [];
  connection.onNotification('textDocument/publishDiagnostics', (p) => {
    const at = performance.now();
    for (const w of [...waiters]) {
      if (w.test(p)) {
        waiters.splice(waiters.indexOf(w), 1);
        w.resolve({ at, published: p });
      }
    }
  });
  connection.onRequest(() => null);
  connection.listen();
  const uri = 'file:///tmp/vacnet-bench/synthetic-1000.vacnet';
  const engineOf = (p) => p.diagnostics.filter((d) => d.data?.origin === 'engine');
  const publicationWithEngine = (version, timeoutMs = 600_000) =>
    new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no diagnostics with engine findings for v${version}; stderr:\n${stderr}`)), timeoutMs);
      waiters.push({ test: (p) => p.uri === uri && p.version === version && engineOf(p).length > 0, resolve: (r) => (clearTimeout(timer), resolve(r)) });
    });

  try {
    await connection.sendRequest('initialize', { processId: process.pid, rootUri: null, workspaceFolders: null, capabilities: { textDocument: { publishDiagnostics: { versionSupport: true } } } });
    await connection.sendNotification('initialized', {});
    const opened = publicationWithEngine(1);
    const tOpen = performance.now();
    await connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'vacnet', version: 1, text } });
    const first = await opened;
    const openMs = first.at - tOpen;
    const findings = engineOf(first.published).length;

    // Keystrokes: one pipe's length changes; each time a length not analysed before. Memory is sampled meanwhile.
    let peakRss = rssMb(child.pid);
    const sampler = setInterval(() => {
      try {
        peakRss = Math.max(peakRss, rssMb(child.pid));
      } catch {
        // the process is gone; the run reports that
      }
    }, 100);
    const keystrokes = [];
    const coldKeystrokes = [];
    let current = text;
    for (let k = 1; k <= WARMUP_KEYSTROKES + KEYSTROKES; k++) {
      const next = current.replace(/(pipe br-1-1 [^\n]*? length )\d+( ft)/, `$1${40 + k}$2`);
      if (next === current) throw new Error('the generated system has no pipe br-1-1 to edit');
      current = next;
      const version = k + 1;
      const published = publicationWithEngine(version);
      const t0 = performance.now();
      await connection.sendNotification('textDocument/didChange', { textDocument: { uri, version }, contentChanges: [{ text: current }] });
      const { at } = await published;
      if (k > WARMUP_KEYSTROKES) keystrokes.push(at - t0);
      else coldKeystrokes.push(at - t0);
    }
    clearInterval(sampler);
    const status = await connection.sendRequest('vacnet/analysisStatus', { uri });
    const keystrokeMs = median(keystrokes);

    // Inlay hints from the cache: the whole file, then one editor viewport.
    const lines = current.split('\n').length;
    const hintMs = async (range) => {
      const samples = [];
      let count = 0;
      for (let i = 0; i < HINT_WARMUP + HINT_RUNS; i++) {
        const t0 = performance.now();
        const hints = await connection.sendRequest('textDocument/inlayHint', { textDocument: { uri }, range });
        const elapsed = performance.now() - t0;
        count = hints.length;
        if (i >= HINT_WARMUP) samples.push(elapsed);
      }
      return { ms: median(samples), count };
    };
    const wholeFile = await hintMs({ start: { line: 0, character: 0 }, end: { line: lines, character: 0 } });
    const middle = Math.floor(lines / 2);
    const viewport = await hintMs({ start: { line: middle, character: 0 }, end: { line: middle + VIEWPORT_LINES, character: 0 } });

    await new Promise((resolve) => setTimeout(resolve, PAUSE_MS));
    const rss = rssMb(child.pid);

    await connection.sendRequest('shutdown');
    await connection.sendNotification('exit');
    const ratio = keystrokeMs / parseMs;
    return {
      metrics: {
        keystroke_vs_parse_1k: { value: round(ratio, 2), unit: 'x', target: KEYSTROKE_VS_PARSE_TARGET },
        inlay_hints_ms_1k: { value: round(viewport.ms, 1), unit: 'ms', target: INLAY_HINTS_MS_TARGET },
        server_rss_mb_1k: { value: round(rss, 1), unit: 'MB', target: SERVER_RSS_MB_TARGET },
      },
      notes: [
        `generated system: ${system.counts.inlets} inlets, ${system.counts.pipes} pipes, ${(system.counts.bytes / 1024).toFixed(0)} KB`,
        `parse + link in this process: ${parseMs.toFixed(0)} ms (median of ${PARSE_RUNS})`,
        `didOpen to the first diagnostics with engine findings: ${openMs.toFixed(0)} ms (${findings} engine findings)`,
        `didChange of one pipe length to its diagnostics with engine findings: ${keystrokes.map((m) => m.toFixed(0)).join(', ')} ms (median ${keystrokeMs.toFixed(0)}; the ${WARMUP_KEYSTROKES} first, untimed: ${coldKeystrokes.map((m) => m.toFixed(0)).join(', ')} ms); the engine's share of the last: ${status?.engineMs?.toFixed(0) ?? '?'} ms`,
        `inlay hints, whole file: ${wholeFile.ms.toFixed(1)} ms for ${wholeFile.count} hints; one ${VIEWPORT_LINES}-line viewport: ${viewport.ms.toFixed(1)} ms for ${viewport.count} hints (medians of ${HINT_RUNS})`,
        `server resident memory with the analysed file, after a ${PAUSE_MS / 1000} s pause: ${rss.toFixed(0)} MB; the most while typing: ${peakRss.toFixed(0)} MB`,
      ],
    };
  } finally {
    if (child.exitCode === null) child.kill();
    connection.dispose();
  }
}
