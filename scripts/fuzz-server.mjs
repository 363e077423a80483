// `npm run fuzz`: random edits of the example files sent to the real language
// server (the bundled packages/extension/dist/server.cjs) over stdio, with
// editor requests between them. The server must never crash, never publish
// malformed results (ranges outside the document, NaN or Infinity in a
// message or a hint) and answer every request within 1 s.
//
//   npm run fuzz                          1,000 edits, seed 1
//   npm run fuzz -- --edits 10000 --seed 7
//   npm run fuzz -- --server packages/language/bin/vacnet-lsp.js
//   npm run fuzz -- --dump tmp/fuzz-cases    write each document version that showed a problem
//
// Exit code 0 when no problem was found, 1 otherwise (each problem printed).
// The vitest suite runs 1,000 edits (packages/language/test/lsp/fuzz-server.test.ts).
import { spawn } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { createMessageConnection, StreamMessageReader, StreamMessageWriter } from 'vscode-jsonrpc/node';

const root = fileURLToPath(new URL('..', import.meta.url));
/** The issue's bound on an answer, ms. */
export const REQUEST_LIMIT_MS = 1000;
/** How long to wait for the last analyses to settle at the end, ms (the largest example analyses in about 2 s here). */
const SETTLE_MS = 60_000;
/** Text snippets a user might type: tokens of the language, numbers, units, and junk. */
const SNIPPETS = [
  'pipe', 'inlet', 'cleanout', 'plant', 'system', 'spec', 'hose', 'tool', 'producer', 'from', 'to', 'into', 'on', 'at', 'size', 'length',
  'joins tee', 'joins wye 45 deg', 'bend 90 deg', 'horizontal', 'up', 'down', 'accept slow-carrying-velocity because "x"', 'rule hose-loss share 200 %',
  '0', '1', '3', '-1', '1e400', '1/0', '1-1/2', '0.0', 'NaN', 'Infinity', '999999999', 'in', 'ft', 'mm', 'inHg', 'scfm', 'fpm', 'deg', '%', 'D',
  '{', '}', '"', '"open', '//', '/*', '*/', '\n', '\n  ', ' ', '\t', '\r\n', 'é', '💨', '\u0000', 'x'.repeat(40),
  'operators 0', 'operators 1000', 'units si', 'site elevation 9000 m', 'use "nowhere.vacnet"', 'use "catalog/equipment.vacnet"',
];

/** Numbers that stress the engine: zero, tiny, huge, fractions. */
const NUMBERS = ['0', '0.001', '1e-9', '1', '2', '7', '12', '40', '99', '1000', '1e6', '1e9', '1/64', '7/8', '1-1/2', '0.5', '250', '5000'];
/** Marks a restore edit; the caller puts the original text in. */
const RESTORE = '\u0000restore';

/** A seeded generator (mulberry32): the same seed gives the same run. */
function randomSource(seed) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return { next, int: (n) => Math.floor(next() * n), pick: (list) => list[Math.floor(next() * list.length)] };
}

function vacnetFiles(dir) {
  return readdirSync(dir)
    .flatMap((entry) => {
      const full = join(dir, entry);
      if (statSync(full).isDirectory()) return vacnetFiles(full);
      return entry.endsWith('.vacnet') ? [full] : [];
    })
    .sort();
}

// ------------------------------------------------------------ text helpers

function lineStarts(text) {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    if (text[i] === '\r' && text[i + 1] === '\n') continue;
    if (text[i] === '\n' || text[i] === '\r') starts.push(i + 1);
  }
  return starts;
}

function positionAt(text, offset) {
  const starts = lineStarts(text);
  let line = 0;
  while (line + 1 < starts.length && starts[line + 1] <= offset) line++;
  return { line, character: offset - starts[line] };
}

/** Length of each line without its line break (LSP positions run from 0 to this). */
function lineLengths(text) {
  return text.split(/\r\n|\r|\n/).map((l) => l.length);
}

/** One random edit: the new text and the LSP change that makes it (a range edit, or sometimes the whole text). */
function randomEdit(text, random, others) {
  const lines = text.split('\n');
  const kind = random.pick(['insert', 'insert', 'delete', 'duplicate-line', 'swap-chars', 'swap-lines', 'delete-line', 'replace-token', 'paste-other', 'whole-junk', 'number', 'number', 'restore']);
  const at = text.length === 0 ? 0 : random.int(text.length + 1);
  let start = at;
  let end = at;
  let insert = '';
  switch (kind) {
    case 'insert':
      insert = random.pick(SNIPPETS);
      if (random.next() < 0.5) insert = ` ${insert} `;
      break;
    case 'delete':
      end = Math.min(text.length, at + 1 + random.int(random.next() < 0.8 ? 4 : 200));
      break;
    case 'duplicate-line':
    case 'delete-line':
    case 'swap-lines': {
      const l = random.int(lines.length);
      const lineStart = lines.slice(0, l).reduce((n, s) => n + s.length + 1, 0);
      const lineEnd = lineStart + lines[l].length + (l < lines.length - 1 ? 1 : 0);
      if (kind === 'duplicate-line') {
        start = end = lineStart;
        insert = text.slice(lineStart, lineEnd) + (l === lines.length - 1 ? '\n' : '');
      } else if (kind === 'delete-line') {
        start = lineStart;
        end = lineEnd;
      } else if (l + 1 < lines.length) {
        const nextEnd = lineEnd + lines[l + 1].length + (l + 1 < lines.length - 1 ? 1 : 0);
        start = lineStart;
        end = nextEnd;
        const a = lines[l];
        const b = lines[l + 1];
        insert = `${b}\n${a}` + (l + 1 < lines.length - 1 ? '\n' : '');
      }
      break;
    }
    case 'swap-chars':
      if (at + 1 < text.length) {
        start = at;
        end = at + 2;
        insert = text[at + 1] + text[at];
      }
      break;
    case 'replace-token': {
      const word = /[A-Za-z0-9_./-]+/g;
      const matches = [...text.matchAll(word)];
      if (matches.length > 0) {
        const m = random.pick(matches);
        start = m.index;
        end = m.index + m[0].length;
        insert = random.pick(SNIPPETS);
      }
      break;
    }
    case 'paste-other': {
      const other = random.pick(others);
      const from = random.int(Math.max(1, other.length));
      insert = other.slice(from, from + 1 + random.int(300));
      break;
    }
    case 'number': {
      // A number changed to an extreme one: the file stays readable, so the engine sees strange models.
      const numbers = [...text.matchAll(/(?<![A-Za-z_-])\d+(\.\d+)?(?![A-Za-z_\d])/g)];
      if (numbers.length > 0) {
        const m = random.pick(numbers);
        start = m.index;
        end = m.index + m[0].length;
        insert = random.pick(NUMBERS);
      }
      break;
    }
    case 'restore':
      // Back to the example as written (a new start for the mutations), as one whole-text change.
      return { kind, text: random.pick(others.filter((o) => o.length > 0)) === undefined ? text : RESTORE, change: undefined };
    case 'whole-junk':
      // Rarely: a change that replaces everything, as a `textDocument/didChange` without a range.
      if (random.next() < 0.1) return { kind, text: Array.from({ length: random.int(30) }, () => random.pick(SNIPPETS)).join(' '), change: undefined };
      insert = random.pick(SNIPPETS);
      break;
  }
  // Keep CRLF pairs whole: split one and the two halves mean two line breaks, in the editor as here.
  if (text[start - 1] === '\r' && text[start] === '\n') start--;
  if (text[end - 1] === '\r' && text[end] === '\n') end++;
  const newText = text.slice(0, start) + insert + text.slice(end);
  const change = { range: { start: positionAt(text, start), end: positionAt(text, end) }, text: insert };
  return { kind, text: newText, change };
}

// ---------------------------------------------------------------- checks

const BAD_NUMBER_WORDS = /\bNaN\b|\bInfinity\b|\bundefined\b/;
/** A number the server computed that is not a number; words quoted from the user's text ('NaN' typed in the file) do not count. */
const hasBadNumber = (text) => BAD_NUMBER_WORDS.test(String(text).replace(/'[^'\n]*'|`[^`\n]*`|"[^"\n]*"/g, ''));

function checkRange(range, text, where, problems) {
  const lengths = lineLengths(text);
  const ok = (p) =>
    p && Number.isInteger(p.line) && Number.isInteger(p.character) && p.line >= 0 && p.character >= 0 && p.line < lengths.length && p.character <= lengths[p.line];
  if (!range || !ok(range.start) || !ok(range.end)) {
    problems.push(`${where}: range ${JSON.stringify(range)} is outside the document (${lengths.length} lines)`);
    return;
  }
  if (range.start.line > range.end.line || (range.start.line === range.end.line && range.start.character > range.end.character)) {
    problems.push(`${where}: range ${JSON.stringify(range)} ends before it starts`);
  }
}

function checkDiagnostics(published, texts, problems, dump) {
  const byVersion = texts.get(published.uri);
  if (!byVersion) return 0; // a workspace file we never opened
  const text = published.version !== undefined ? byVersion.get(published.version) : undefined;
  if (published.version !== undefined && text === undefined) {
    problems.push(`publishDiagnostics for ${published.uri} names version ${published.version}, which the client never sent`);
    return 0;
  }
  if (text === undefined) return 0;
  for (const d of published.diagnostics) {
    const where = `diagnostic ${d.code} in ${published.uri.split('/').pop()} v${published.version}`;
    const before = problems.length;
    checkRange(d.range, text, where, problems);
    if (typeof d.message !== 'string' || d.message.length === 0) problems.push(`${where}: no message`);
    else if (hasBadNumber(d.message)) problems.push(`${where}: message has a bad number: ${d.message}`);
    if (d.severity !== undefined && ![1, 2, 3, 4].includes(d.severity)) problems.push(`${where}: severity ${d.severity}`);
    for (const r of d.relatedInformation ?? []) {
      const related = r.location.uri === published.uri ? text : undefined;
      if (related !== undefined) checkRange(r.location.range, related, `${where} (related)`, problems);
      if (hasBadNumber(r.message)) problems.push(`${where}: related message has a bad number: ${r.message}`);
    }
    if (problems.length > before && dump) dump(published.uri, published.version, text);
  }
  return published.diagnostics.length;
}

function checkHints(hints, text, where, problems) {
  for (const h of hints ?? []) {
    checkRange({ start: h.position, end: h.position }, text, `${where}: hint`, problems);
    const label = typeof h.label === 'string' ? h.label : JSON.stringify(h.label);
    const tooltip = typeof h.tooltip === 'string' ? h.tooltip : h.tooltip?.value ?? '';
    if (hasBadNumber(label) || hasBadNumber(tooltip)) problems.push(`${where}: hint with a bad number: ${label} / ${tooltip}`);
  }
}

// ------------------------------------------------------------------- run

/** Waits until every document's analysis of its current version is in and published. */
async function settleAll(docs, request, problems, when) {
  const deadline = Date.now() + SETTLE_MS;
  for (const doc of docs) {
    for (;;) {
      const status = await request('vacnet/analysisStatus', { uri: doc.uri }, `analysisStatus of ${doc.uri.split('/').pop()} at the ${when}`);
      if (!status || (status.version === doc.version && status.status !== 'pending' && status.published)) break;
      if (Date.now() > deadline) {
        problems.push(`${doc.uri}: analysis of v${doc.version} did not settle within ${SETTLE_MS / 1000} s at the ${when} (${JSON.stringify(status)})`);
        break;
      }
      await new Promise((r) => setTimeout(r, 50));
    }
  }
}

/**
 * Runs a fuzz session. Options: edits (1000), seed (1), server (bundled),
 * log (console.log-like, or undefined for quiet). Resolves with the
 * findings: { problems: string[], stats }.
 */
export async function runFuzz(options = {}) {
  const edits = options.edits ?? 1000;
  const random = randomSource(options.seed ?? 1);
  const server = resolve(root, options.server ?? 'packages/extension/dist/server.cjs');
  const log = options.log ?? (() => undefined);
  const examples = join(root, 'examples');
  const files = vacnetFiles(examples);
  const originals = files.map((f) => readFileSync(f, 'utf8'));

  const child = spawn(process.execPath, [server, '--stdio'], { stdio: ['pipe', 'pipe', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (chunk) => (stderr += chunk.toString('utf8')));
  let exited = null;
  const exitedPromise = new Promise((resolveExit) => child.on('exit', (code, signal) => resolveExit((exited = { code, signal }))));
  const connection = createMessageConnection(new StreamMessageReader(child.stdout), new StreamMessageWriter(child.stdin));
  const problems = [];
  // Print each problem as it is found (the first few of each kind), so a long run shows them early.
  const seenKinds = new Map();
  const push = problems.push.bind(problems);
  problems.push = (...items) => {
    for (const item of items) {
      const kind = String(item).replace(/\d+/g, '#').slice(0, 80);
      const n = (seenKinds.get(kind) ?? 0) + 1;
      seenKinds.set(kind, n);
      if (n <= 3) log(`problem: ${item}`);
    }
    return push(...items);
  };
  const texts = new Map(); // uri -> Map(version -> text)
  // With `dumpDir`, the text of each document version that showed a problem is written there, to reproduce it.
  const dumped = new Set();
  const dump = options.dumpDir
    ? (uri, version, text) => {
        const name = `${uri.split('/').pop().replace(/\.vacnet$/, '')}-v${version}.vacnet`;
        if (dumped.has(name)) return;
        dumped.add(name);
        mkdirSync(options.dumpDir, { recursive: true });
        writeFileSync(join(options.dumpDir, name), text);
      }
    : undefined;
  const stats = { edits: 0, requests: 0, publications: 0, diagnosticsChecked: 0, hints: 0, quickFixes: 0, engineFindings: 0, slowestMs: 0, slowestRequest: '', kinds: {} };
  connection.onNotification('textDocument/publishDiagnostics', (published) => {
    stats.publications++;
    latestDiagnostics.set(published.uri, published.diagnostics);
    stats.engineFindings += published.diagnostics.filter((d) => d.data?.origin === 'engine' && d.code !== 'analysis-waiting').length;
    try {
      stats.diagnosticsChecked += checkDiagnostics(published, texts, problems, dump);
    } catch (error) {
      problems.push(`could not check a publication: ${error}`);
    }
  });
  connection.onRequest(() => null);
  connection.onError(([error]) => problems.push(`connection error: ${error?.message ?? error}`));
  connection.listen();

  /** Requests that count against the 1 s limit: those of editing, not starting or stopping the server or polling its progress. */
  const timed = (method) => method !== 'initialize' && method !== 'shutdown' && method !== 'vacnet/analysisStatus';
  const request = async (method, params, what) => {
    if (exited) throw new Error('the server has exited');
    const started = performance.now();
    let timer;
    const limit = new Promise((_, reject) => (timer = setTimeout(() => reject(new Error('no answer within 10 s')), 10_000)));
    try {
      const result = await Promise.race([connection.sendRequest(method, params), limit, exitedPromise.then(() => Promise.reject(new Error('the server exited')))]);
      const ms = performance.now() - started;
      stats.requests++;
      if (timed(method) && ms > stats.slowestMs) {
        stats.slowestMs = ms;
        stats.slowestRequest = what;
      }
      if (timed(method) && ms > REQUEST_LIMIT_MS) problems.push(`${what}: answered in ${ms.toFixed(0)} ms (limit ${REQUEST_LIMIT_MS} ms)`);
      return result;
    } catch (error) {
      problems.push(`${what}: ${error?.message ?? error}`);
      return undefined;
    } finally {
      clearTimeout(timer);
    }
  };

  const folder = pathToFileURL(examples).href;
  await request('initialize', {
    processId: process.pid,
    rootUri: folder,
    workspaceFolders: [{ uri: folder, name: 'examples' }],
    capabilities: { textDocument: { publishDiagnostics: { relatedInformation: true, versionSupport: true } }, workspace: { inlayHint: { refreshSupport: false } } },
  }, 'initialize');
  await connection.sendNotification('initialized', {});

  const docs = files.map((file, i) => ({ uri: pathToFileURL(file).href, text: originals[i], original: originals[i], version: 1 }));
  const latestDiagnostics = new Map();
  const valid = docs.filter((d) => !d.uri.includes('/invalid/'));
  for (const doc of docs) {
    texts.set(doc.uri, new Map([[1, doc.text]]));
    await connection.sendNotification('textDocument/didOpen', { textDocument: { uri: doc.uri, languageId: 'vacnet', version: 1, text: doc.text } });
  }

  // Start once the workspace is built and analysed: the limit is for answers while editing, not for start-up.
  await settleAll(docs, request, problems, 'start');

  const randomPosition = (text) => positionAt(text, random.int(text.length + 1));
  const whole = (text) => ({ start: { line: 0, character: 0 }, end: { line: lineLengths(text).length, character: 0 } });

  for (let n = 0; n < edits && !exited; n++) {
    // The valid systems more often than the invalid examples (most files there are invalid on purpose).
    const doc = random.next() < 0.6 ? random.pick(valid) : random.pick(docs);
    let edit = randomEdit(doc.text, random, originals);
    // Edits pile up into text no analysis can read; start afresh now and then, as a user's undo does.
    if (edit.text === RESTORE || (doc.sinceRestore > 8 && random.next() < 0.3)) edit = { kind: 'restore', text: doc.original, change: undefined };
    doc.sinceRestore = edit.kind === 'restore' ? 0 : (doc.sinceRestore ?? 0) + 1;
    stats.kinds[edit.kind] = (stats.kinds[edit.kind] ?? 0) + 1;
    doc.version++;
    doc.text = edit.text;
    const versions = texts.get(doc.uri);
    versions.set(doc.version, doc.text);
    // Keep the last versions only: publications are for recent ones.
    for (const v of [...versions.keys()]) if (v < doc.version - 200) versions.delete(v);
    await connection.sendNotification('textDocument/didChange', {
      textDocument: { uri: doc.uri, version: doc.version },
      contentChanges: [edit.change ?? { text: doc.text }],
    });
    stats.edits++;
    // Bursts of typing: a request only after some edits, so builds and analyses get superseded too.
    if (random.next() < 0.35) continue;
    const what = random.pick(['hover', 'inlayHint', 'codeAction', 'completion', 'documentSymbol', 'formatting', 'foldingRange', 'semanticTokens', 'definition']);
    const label = `${what} #${n} on ${doc.uri.split('/').pop()} v${doc.version}`;
    // Sometimes pause as a user does, until the analysis of this version is in: hints, hovers and fixes then have numbers to show.
    if (random.next() < 0.15) {
      await settleAll([doc], request, problems, `pause #${n}`);
      const hints = await request('textDocument/inlayHint', { textDocument: { uri: doc.uri }, range: whole(doc.text) }, `inlayHint after pause #${n}`);
      checkHints(hints, doc.text, `hints after pause #${n}`, problems);
      stats.hints += hints?.length ?? 0;
    }
    const text = doc.text;
    const textDocument = { uri: doc.uri };
    switch (what) {
      case 'hover':
        await request('textDocument/hover', { textDocument, position: randomPosition(text) }, label);
        break;
      case 'inlayHint': {
        const hints = await request('textDocument/inlayHint', { textDocument, range: whole(text) }, label);
        // Hints are for the text version current when the request was answered: the one just sent.
        checkHints(hints, doc.text, label, problems);
        stats.hints += hints?.length ?? 0;
        break;
      }
      case 'codeAction': {
        // With the diagnostics last published for the document (possibly of an older version, as an editor may send).
        const diagnostics = (latestDiagnostics.get(doc.uri) ?? []).slice(0, 20);
        const range = { start: randomPosition(text), end: randomPosition(text) };
        if (range.end.line < range.start.line || (range.end.line === range.start.line && range.end.character < range.start.character)) [range.start, range.end] = [range.end, range.start];
        const actions = await request('textDocument/codeAction', { textDocument, range, context: { diagnostics } }, label);
        if (actions && !Array.isArray(actions)) problems.push(`${label}: not an array`);
        stats.quickFixes += actions?.length ?? 0;
        for (const action of actions ?? []) {
          for (const edits of Object.values(action.edit?.changes ?? {})) for (const e of edits) {
            if (BAD_NUMBER_WORDS.test(e.newText)) problems.push(`${label}: quick fix '${action.title}' writes ${JSON.stringify(e.newText)}`);
          }
          if (hasBadNumber(action.title)) problems.push(`${label}: quick fix title has a bad number: ${action.title}`);
        }
        break;
      }
      case 'completion':
        await request('textDocument/completion', { textDocument, position: randomPosition(text) }, label);
        break;
      case 'documentSymbol':
        await request('textDocument/documentSymbol', { textDocument }, label);
        break;
      case 'formatting': {
        const edits = await request('textDocument/formatting', { textDocument, options: { tabSize: 2, insertSpaces: true } }, label);
        for (const e of edits ?? []) checkRange(e.range, text, `${label}: edit`, problems);
        break;
      }
      case 'foldingRange':
        await request('textDocument/foldingRange', { textDocument }, label);
        break;
      case 'semanticTokens':
        await request('textDocument/semanticTokens/full', { textDocument }, label);
        break;
      case 'definition':
        await request('textDocument/definition', { textDocument, position: randomPosition(text) }, label);
        break;
    }
    if ((n + 1) % 100 === 0) log(`${n + 1} edits, ${stats.requests} requests, ${stats.publications} publications, slowest ${stats.slowestMs.toFixed(0)} ms, ${problems.length} problems`);
  }

  // Every document settles on a final analysis of its last version, and its hints are sound.
  if (!exited) await settleAll(docs, request, problems, 'end');
  for (const doc of docs) {
    if (exited) break;
    const hints = await request('textDocument/inlayHint', { textDocument: { uri: doc.uri }, range: whole(doc.text) }, `final inlayHint on ${doc.uri.split('/').pop()}`);
    checkHints(hints, doc.text, `final hints of ${doc.uri.split('/').pop()}`, problems);
  }

  if (exited) {
    problems.push(`the server exited (code ${exited.code}, signal ${exited.signal}); stderr:\n${stderr.slice(-4000)}`);
  } else {
    await request('shutdown', undefined, 'shutdown');
    await connection.sendNotification('exit');
    const end = await Promise.race([exitedPromise, new Promise((r) => setTimeout(() => r(undefined), 5000))]);
    if (!end) {
      problems.push('the server did not exit after shutdown/exit');
      child.kill();
    } else if (end.code !== 0) problems.push(`the server exited with code ${end.code} after shutdown`);
  }
  // Anything the server printed as an error is a defect (it logs requests that threw).
  for (const line of stderr.split('\n')) {
    if (/error|exception|at \S+ \(/i.test(line)) problems.push(`server stderr: ${line.slice(0, 300)}`);
  }
  connection.dispose();
  return { problems: [...problems], stats };
}

// ------------------------------------------------------------------- cli

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const args = process.argv.slice(2);
  const option = (name) => {
    const i = args.indexOf(`--${name}`);
    return i >= 0 ? args[i + 1] : undefined;
  };
  const edits = Number(option('edits') ?? 1000);
  const seed = Number(option('seed') ?? 1);
  if (!Number.isInteger(edits) || edits < 0 || !Number.isInteger(seed)) {
    console.error('usage: npm run fuzz -- [--edits N] [--seed S] [--server path] [--dump folder]');
    process.exit(2);
  }
  const started = performance.now();
  console.log(`fuzz: ${edits} edits, seed ${seed}`);
  const { problems, stats } = await runFuzz({ edits, seed, server: option('server'), dumpDir: option('dump'), log: console.log });
  console.log(`\n${stats.edits} edits (${Object.entries(stats.kinds).map(([k, v]) => `${k} ${v}`).join(', ')})`);
  console.log(`${stats.hints} hints, ${stats.quickFixes} quick fixes and ${stats.engineFindings} engine findings seen`);
  console.log(`${stats.requests} requests, slowest ${stats.slowestMs.toFixed(0)} ms (${stats.slowestRequest}); ${stats.publications} publications, ${stats.diagnosticsChecked} diagnostics checked; ${((performance.now() - started) / 1000).toFixed(1)} s`);
  if (problems.length === 0) {
    console.log('no problems found');
  } else {
    console.log(`\n${problems.length} problems:`);
    for (const p of problems.slice(0, 200)) console.log(`- ${p}`);
  }
  process.exit(problems.length === 0 ? 0 : 1);
}
