// The extension's manifest and what it ships. What VS Code and vsce require
// is from the VS Code extension manifest reference ("Extension Manifest",
// code.visualstudio.com/api/references/extension-manifest) and the
// language configuration guide (code.visualstudio.com/api/language-extensions/
// language-configuration-guide); the PNG layout from ISO/IEC 15948.
import { fork, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { createMessageConnection, IPCMessageReader, IPCMessageWriter } from 'vscode-jsonrpc/node';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { initializeParams, shutdown, startStdioServer } from '../../language/test/lsp/stdio-client.js';
import { zipEntries } from './zip-entries.js';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const repoRoot = join(extensionRoot, '..', '..');
const at = (path: string) => join(extensionRoot, path);
const readJson = (path: string) => JSON.parse(readFileSync(path, 'utf8'));

interface Manifest {
  name: string;
  version: string;
  publisher: string;
  license: string;
  main: string;
  icon: string;
  repository: { url: string };
  engines: { vscode: string };
  devDependencies: Record<string, string>;
  contributes: {
    languages: { id: string; aliases: string[]; extensions: string[]; configuration: string; icon: { light: string; dark: string } }[];
    grammars: { language: string; scopeName: string; path: string }[];
  };
}
const manifest = readJson(at('package.json')) as Manifest;

const hasUnzip = spawnSync('unzip', ['-v']).status === 0;

const bundles = ['dist/extension.cjs', 'dist/server.cjs'];
const bundlesMissing = () => bundles.filter((file) => !existsSync(at(file)));
const requireBundles = () => {
  const missing = bundlesMissing();
  if (missing.length) throw new Error(`missing ${missing.join(', ')}: run \`npm run build\` first`);
};

/** "^1.91.0" -> [1, 91, 0] */
const versionOf = (range: string) => range.replace(/^[^\d]*/, '').split('.').map(Number);
const notAbove = (a: number[], b: number[]) => {
  for (let i = 0; i < 3; i++) if ((a[i] ?? 0) !== (b[i] ?? 0)) return (a[i] ?? 0) < (b[i] ?? 0);
  return true;
};

describe('manifest', () => {
  it('has the fields vsce requires to package', () => {
    // vsce refuses a manifest without these (TOOLCHAIN pitfall 7; the manifest reference).
    expect(manifest.name).toMatch(/^[a-z0-9][a-z0-9-]*$/);
    expect(manifest.version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(manifest.publisher).toBeTruthy();
    expect(manifest.license).toBe('MIT');
    expect(manifest.repository.url).toBeTruthy();
    expect(manifest.main).toBe('./dist/extension.cjs');
  });

  it('declares an engine no older than the API types and the language client need', () => {
    const engine = versionOf(manifest.engines.vscode);
    // @types/vscode must not exceed engines.vscode (vsce checks this).
    expect(notAbove(versionOf(manifest.devDependencies['@types/vscode']!), engine)).toBe(true);
    const clientNeeds = readJson(join(repoRoot, 'node_modules/vscode-languageclient/package.json')).engines.vscode;
    expect(notAbove(versionOf(clientNeeds), engine)).toBe(true);
  });

  it('contributes the vacnet language for .vacnet files with its grammar', () => {
    const [language] = manifest.contributes.languages;
    expect(language).toMatchObject({ id: 'vacnet', extensions: ['.vacnet'] });
    expect(language!.aliases).toEqual(['vacnet', 'Vacnet']);
    const [grammar] = manifest.contributes.grammars;
    expect(grammar).toMatchObject({ language: 'vacnet', scopeName: 'source.vacnet' });
    // The generated grammar must carry the scope name the manifest announces.
    expect(readJson(at(grammar!.path)).scopeName).toBe(grammar!.scopeName);
  });

  it('references only files that exist', () => {
    const [language] = manifest.contributes.languages;
    const referenced = [
      manifest.icon,
      language!.configuration,
      language!.icon.light,
      language!.icon.dark,
      ...manifest.contributes.grammars.map((grammar) => grammar.path),
      'README.md',
      'LICENSE',
    ];
    for (const file of referenced) expect(existsSync(at(file)), file).toBe(true);
  });

  it('ships the same licence as the repository', () => {
    expect(readFileSync(at('LICENSE'), 'utf8')).toBe(readFileSync(join(repoRoot, 'LICENSE'), 'utf8'));
  });
});

describe('language configuration', () => {
  const configuration = readJson(at('language-configuration.json'));
  const grammarText = readFileSync(join(repoRoot, 'packages/language/src/vacnet.langium'), 'utf8');
  /** A terminal's regular expression, read from the grammar so the two cannot drift apart. */
  const terminal = (name: string) => {
    const match = new RegExp(`terminal ${name}(?: returns \\w+)?: /(.*)/;`).exec(grammarText);
    if (!match) throw new Error(`terminal ${name} not found in the grammar`);
    return new RegExp(`^(?:${match[1]})$`);
  };
  const words = (text: string) => text.match(new RegExp(configuration.wordPattern, 'g')) ?? [];

  it('has the comment styles of the grammar and closes braces and quotes', () => {
    expect(configuration.comments).toEqual({ lineComment: '//', blockComment: ['/*', '*/'] });
    expect(configuration.brackets).toEqual([['{', '}']]);
    const opens = configuration.autoClosingPairs.map((pair: { open: string }) => pair.open);
    expect(opens).toEqual(expect.arrayContaining(['{', '"']));
    expect(new RegExp(configuration.folding.markers.start).test('system "Harbour offices" {')).toBe(true);
    expect(new RegExp(configuration.folding.markers.end).test('  }')).toBe(true);
  });

  it('keeps hyphenated names whole, as the grammar\'s ID terminal reads them', () => {
    const id = terminal('ID');
    for (const name of ['riser-b', 'L3-east', 'main-1', 'j-1', 'std-50', 'room_b1', 'test-orifice']) {
      expect(id.test(name), `${name} is an ID`).toBe(true);
      expect(words(name)).toEqual([name]);
    }
    expect(words('inlet L3-east on riser-b at 4 ft hose std-50')).toEqual([
      'inlet', 'L3-east', 'on', 'riser-b', 'at', '4', 'ft', 'hose', 'std-50',
    ]);
    // Punctuation around a name is not part of it.
    expect(words('open riser-b, L3-east}')).toEqual(['open', 'riser-b', 'L3-east']);
  });

  it('keeps trade sizes and decimals together, as the grammar\'s NUMBER terminal reads them', () => {
    const number = terminal('NUMBER');
    for (const value of ['1-1/2', '7/8', '0.61', '1e-3', '35', '.5']) {
      expect(number.test(value), `${value} is a NUMBER`).toBe(true);
      expect(words(value)).toEqual([value]);
    }
    expect(words('bore 1-1/2 in')).toEqual(['bore', '1-1/2', 'in']);
  });
});

describe('icon', () => {
  const png = readFileSync(at(manifest.icon));

  /** The concatenated, inflated IDAT data of a PNG (ISO/IEC 15948, 11.2.4). */
  const pixelRows = (file: Buffer) => {
    const parts: Buffer[] = [];
    for (let offset = 8; offset < file.length; ) {
      const length = file.readUInt32BE(offset);
      if (file.toString('latin1', offset + 4, offset + 8) === 'IDAT') parts.push(file.subarray(offset + 8, offset + 8 + length));
      offset += 12 + length;
    }
    return inflateSync(Buffer.concat(parts));
  };

  it('is a 128 x 128 RGBA PNG, the size the marketplace asks for', () => {
    expect(png.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    expect(png.toString('latin1', 12, 16)).toBe('IHDR');
    expect([png.readUInt32BE(16), png.readUInt32BE(20), png[24], png[25]]).toEqual([128, 128, 8, 6]);
  });

  it('is the one our drawing script makes', async () => {
    // @ts-expect-error: a plain .mjs script without type declarations
    const { drawIcon } = (await import('../scripts/draw-icon.mjs')) as { drawIcon: () => Buffer };
    expect(pixelRows(png).equals(pixelRows(drawIcon()))).toBe(true);
  });
});

describe('the packaged .vsix', () => {
  let folder = '';
  let vsix = '';
  let entries: string[] = [];

  beforeAll(() => {
    requireBundles();
    folder = mkdtempSync(join(tmpdir(), 'vacnet-vsix-'));
    vsix = join(folder, 'vacnet.vsix');
    // The same vsce call as `npm run package`, reading the bundles already built.
    const vsce = join(repoRoot, 'node_modules/@vscode/vsce/vsce');
    const run = spawnSync(process.execPath, [vsce, 'package', '--no-dependencies', '--out', vsix], {
      cwd: extensionRoot,
      encoding: 'utf8',
      timeout: 60000,
    });
    if (run.status !== 0) throw new Error(`vsce failed:\n${run.stdout}\n${run.stderr}`);
    entries = zipEntries(vsix);
  }, 90000);

  afterAll(() => {
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  it('holds the bundles, the grammar, the configuration and the icon', () => {
    expect(entries).toEqual(
      expect.arrayContaining([
        'extension/package.json',
        'extension/dist/extension.cjs',
        'extension/dist/server.cjs',
        'extension/syntaxes/vacnet.tmLanguage.json',
        'extension/language-configuration.json',
        'extension/images/icon.png',
      ]),
    );
    expect(entries.some((entry) => /^extension\/readme\.md$/i.test(entry))).toBe(true);
    expect(entries.some((entry) => /^extension\/license(\.txt)?$/i.test(entry))).toBe(true);
  });

  it.skipIf(!hasUnzip)('is read by our zip reader as Info-ZIP unzip reads it', () => {
    const listed = spawnSync('unzip', ['-Z1', vsix], { encoding: 'utf8' }).stdout.trim().split('\n');
    expect(entries).toEqual(listed);
  });

  it('holds no source maps, sources, tests or dependencies', () => {
    const unwanted = entries.filter((entry) =>
      /\.map$|\.ts$|^extension\/(src|test|scripts|node_modules)\//.test(entry),
    );
    expect(unwanted).toEqual([]);
  });
});

describe('the bundles', () => {
  beforeAll(requireBundles);

  it('the client leaves vscode to the editor and carries no language code', () => {
    const client = readFileSync(at('dist/extension.cjs'), 'utf8');
    expect(client).toMatch(/require\("vscode"\)/);
    // The client only starts the server (the VS Code LSP sample's split): no parser in it.
    expect(client).not.toMatch(/chevrotain|langium/i);
  });

  it('the bundled server answers initialize over node IPC, as the language client starts it', async () => {
    // vscode-languageclient's TransportKind.ipc forks the module with `--node-ipc`.
    const child = fork(at('dist/server.cjs'), ['--node-ipc'], { stdio: ['ignore', 'ignore', 'pipe', 'ipc'] });
    const connection = createMessageConnection(new IPCMessageReader(child), new IPCMessageWriter(child));
    connection.listen();
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    try {
      const died = exited.then((code) => {
        throw new Error(`server exited with code ${code}`);
      });
      const result = await Promise.race([
        connection.sendRequest<{ capabilities: Record<string, unknown> }>('initialize', initializeParams()),
        died,
      ]);
      expect(result.capabilities.textDocumentSync).toBeDefined();
      await connection.sendRequest('shutdown');
      await connection.sendNotification('exit');
      expect(await exited).toBe(0);
    } finally {
      connection.dispose();
      if (child.exitCode === null) child.kill();
    }
  });

  it('the bundled server answers initialize over stdio', async () => {
    const server = startStdioServer([at('dist/server.cjs'), '--stdio']);
    try {
      const result = await server.request<{ capabilities: Record<string, unknown>; serverInfo?: unknown }>(
        'initialize',
        initializeParams(),
      );
      expect(result.capabilities.textDocumentSync).toBeDefined();
      await server.connection.sendNotification('initialized', {});

      const uri = pathToFileURL(join(tmpdir(), 'vacnet-bundle-test', 'broken.vacnet')).href;
      const published = server.nextDiagnostics(uri, 20000);
      await server.connection.sendNotification('textDocument/didOpen', {
        // `frobnicate` on line 1 (0-based) is no word of the language.
        textDocument: { uri, languageId: 'vacnet', version: 1, text: 'system "Bundle" {\n  frobnicate 1\n}\n' },
      });
      const { diagnostics } = await published;
      // LSP DiagnosticSeverity.Error = 1 (LSP specification 3.17).
      expect(diagnostics.some((d) => d.severity === 1 && d.range.start.line === 1)).toBe(true);
      expect(await shutdown(server)).toBe(0);
    } finally {
      if (server.child.exitCode === null) server.child.kill();
    }
  });
});
