// The extension's manifest and what it ships. What VS Code and vsce require
// is from the VS Code extension manifest reference ("Extension Manifest",
// code.visualstudio.com/api/references/extension-manifest), the contribution
// points reference (contributes.commands, menus, configuration,
// taskDefinitions, problemMatchers, walkthroughs), the workspace trust and
// virtual workspaces guides (capabilities) and the language configuration
// guide; the PNG layout from ISO/IEC 15948.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { fileURLToPath } from 'node:url';
import { formatQuantity, RULES } from '@vacnet/engine';
import { describe, expect, it } from 'vitest';
import { readSettings } from '../../language/src/engine-bridge/workspace-settings.js';
import { checkCommandLine } from '../src/check-command-line.js';
import { tokenise } from './textmate-tokens.js';
import { referencedFiles } from './manifest-files.js';

const extensionRoot = fileURLToPath(new URL('..', import.meta.url));
const repoRoot = join(extensionRoot, '..', '..');
const at = (path: string) => join(extensionRoot, path);
const readJson = (path: string) => JSON.parse(readFileSync(path, 'utf8'));

interface Command {
  command: string;
  title: string;
  category?: string;
}
interface SettingSchema {
  type?: string | string[];
  default?: unknown;
  enum?: unknown[];
  properties?: Record<string, SettingSchema>;
  markdownDescription?: string;
  description?: string;
}
interface Manifest {
  name: string;
  version: string;
  publisher: string;
  license: string;
  main: string;
  browser: string;
  icon: string;
  repository: { url: string };
  engines: { vscode: string };
  activationEvents: string[];
  devDependencies: Record<string, string>;
  capabilities: { untrustedWorkspaces: { supported: boolean | string }; virtualWorkspaces: { supported: boolean | string; description?: string } };
  contributes: {
    languages: { id: string; aliases: string[]; extensions: string[]; configuration: string; icon: { light: string; dark: string } }[];
    grammars: { language: string; scopeName: string; path: string }[];
    snippets: { language: string; path: string }[];
    jsonValidation: { fileMatch: string; url: string }[];
    commands: Command[];
    menus: Record<string, { command: string; when?: string }[]>;
    configuration: { title: string; properties: Record<string, SettingSchema> };
    taskDefinitions: { type: string; required: string[]; properties: Record<string, SettingSchema> }[];
    problemMatchers: { name: string; owner: string; fileLocation: string[]; pattern: { regexp: string; file: number; line: number; column: number; severity: number; code: number; message: number } }[];
    walkthroughs: { id: string; title: string; steps: { id: string; title: string; description: string; media: { markdown?: string; image?: string }; completionEvents?: string[] }[] }[];
  };
}
const manifest = readJson(at('package.json')) as Manifest;
const sourceFiles = readdirSync(at('src')).filter((f) => f.endsWith('.ts'));
const sources = sourceFiles.map((f) => readFileSync(at(join('src', f)), 'utf8')).join('\n');

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
    expect(manifest.browser).toBe('./dist/browser-extension.js');
  });

  it('declares an engine no older than the API types and the language client need', () => {
    const engine = versionOf(manifest.engines.vscode);
    // @types/vscode must not exceed engines.vscode (vsce checks this).
    expect(notAbove(versionOf(manifest.devDependencies['@types/vscode']!), engine)).toBe(true);
    const clientNeeds = readJson(join(repoRoot, 'node_modules/vscode-languageclient/package.json')).engines.vscode;
    expect(notAbove(versionOf(clientNeeds), engine)).toBe(true);
  });

  it('contributes the vacnet language for .vacnet files with its grammar, icon and snippets', () => {
    const [language] = manifest.contributes.languages;
    expect(language).toMatchObject({ id: 'vacnet', extensions: ['.vacnet'] });
    expect(language!.aliases[0]).toBe('vacnet');
    const [grammar] = manifest.contributes.grammars;
    expect(grammar).toMatchObject({ language: 'vacnet', scopeName: 'source.vacnet' });
    // The generated grammar must carry the scope name the manifest announces.
    expect(readJson(at(grammar!.path)).scopeName).toBe(grammar!.scopeName);
    expect(manifest.contributes.snippets).toEqual([{ language: 'vacnet', path: './snippets/vacnet.json' }]);
  });

  it('validates project settings files (vacnet.json) with a draft-07 schema it ships', () => {
    expect(manifest.contributes.jsonValidation).toEqual([{ fileMatch: 'vacnet.json', url: './schemas/vacnet.schema.json' }]);
    const schema = readJson(at(manifest.contributes.jsonValidation[0]!.url));
    expect(schema.$schema).toBe('http://json-schema.org/draft-07/schema#');
  });

  it('references only files that exist', () => {
    for (const file of referencedFiles(manifest)) expect(existsSync(at(file)), file).toBe(true);
  });

  it('ships the same licence as the repository', () => {
    expect(readFileSync(at('LICENSE'), 'utf8')).toBe(readFileSync(join(repoRoot, 'LICENSE'), 'utf8'));
  });

  it('runs in untrusted workspaces (the server never executes file content) and limits itself in virtual ones', () => {
    // The workspace trust guide: `supported: true` for extensions that run no workspace code.
    expect(manifest.capabilities.untrustedWorkspaces).toEqual({ supported: true });
    // The virtual workspaces guide: "limited" needs a description of what is missing.
    expect(manifest.capabilities.virtualWorkspaces.supported).toBe('limited');
    expect(manifest.capabilities.virtualWorkspaces.description).toMatch(/open/);
  });

  it('lists only activation events VS Code does not derive itself (languages and commands activate on their own since 1.74)', () => {
    expect(manifest.activationEvents.filter((e) => /^on(Language|Command):/.test(e))).toEqual([]);
    expect(manifest.activationEvents).toContain('onTaskType:vacnet');
  });
});

describe('commands and menus', () => {
  const declared = manifest.contributes.commands.map((c) => c.command);
  const registered = [...sources.matchAll(/registerCommand\(\s*'([^']+)'/g)].map((m) => m[1]!);

  it('every command has a title in the vacnet category', () => {
    expect(declared.length).toBeGreaterThanOrEqual(6);
    for (const command of manifest.contributes.commands) {
      expect(command.command).toMatch(/^vacnet\.[a-zA-Z]+$/);
      expect(command.title.length, command.command).toBeGreaterThan(5);
      expect(command.category).toBe('vacnet');
    }
  });

  it('every declared command has a handler in the source, and every handler is declared', () => {
    expect([...registered].sort()).toEqual([...declared].sort());
  });

  it('both bundles register every command (the desktop and the browser entry)', () => {
    for (const bundle of ['dist/extension.cjs', 'dist/browser-extension.js']) {
      if (!existsSync(at(bundle))) throw new Error(`${bundle} is missing: run \`npm run build\` first`);
      const text = readFileSync(at(bundle), 'utf8');
      for (const id of declared) expect(text.includes(`"${id}"`), `${id} in ${bundle}`).toBe(true);
      expect(text).toMatch(/registerCommand/);
    }
  });

  it('menus and the walkthrough name declared commands only', () => {
    const used = [
      ...Object.values(manifest.contributes.menus).flatMap((items) => items.map((i) => i.command)),
      ...manifest.contributes.walkthroughs.flatMap((w) => w.steps.flatMap((s) => [...s.description.matchAll(/\(command:([\w.]+)\)/g)].map((m) => m[1]!))),
      ...manifest.contributes.walkthroughs.flatMap((w) => w.steps.flatMap((s) => (s.completionEvents ?? []).filter((e) => e.startsWith('onCommand:')).map((e) => e.slice('onCommand:'.length)))),
    ];
    expect(used.length).toBeGreaterThan(5);
    for (const command of used) expect(declared, command).toContain(command);
  });
});

describe('settings', () => {
  const properties = manifest.contributes.configuration.properties;
  const declaredKeys = Object.keys(properties).map((k) => k.replace(/^vacnet\./, ''));
  const rulesSchema = properties['vacnet.rules']!;

  /** A value for every declared setting, each different from its default, in the form the Settings editor writes. */
  function everySetting(): Record<string, unknown> {
    const value: Record<string, unknown> = {};
    const set = (path: string, v: unknown) => {
      const parts = path.split('.');
      let object = value;
      for (const part of parts.slice(0, -1)) object = (object[part] ??= {}) as Record<string, unknown>;
      object[parts.at(-1)!] = v;
    };
    set('units', 'si');
    set('hints.inletVacuum', false);
    set('hints.pipeVelocity', false);
    set('hints.producer', false);
    set('rulesDocsBaseUrl', 'https://example.test/rules');
    set('analysis.debounceMs', 200);
    set('trace.server', 'messages');
    const rules: Record<string, Record<string, unknown>> = {};
    for (const rule of RULES) {
      const entry: Record<string, unknown> = { severity: rule.defaultSeverity === 'info' ? 'error' : 'info' };
      for (const p of rule.parameters) {
        const written = p.name.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());
        entry[written] =
          p.dimension === 'ratio' || p.dimension === 'count' ? p.default : p.dimension === 'fraction' ? `${p.default * 100} %` : formatQuantity(p.default, p.dimension, 'imperial', 6);
      }
      rules[rule.code] = entry;
    }
    set('rules', rules);
    return value;
  }

  /** The settings object behind a proxy that records every key path the reader looks at. */
  function recording(value: object, path: string[], seen: Set<string>): object {
    return new Proxy(value, {
      get(target, key, receiver) {
        const v = Reflect.get(target, key, receiver) as unknown;
        if (typeof key !== 'string') return v;
        seen.add([...path, key].join('.'));
        return v !== null && typeof v === 'object' ? recording(v, [...path, key], seen) : v;
      },
    });
  }

  it('the server reads only declared settings, and every declared setting but the client library\'s trace', () => {
    const seen = new Set<string>();
    readSettings(recording(everySetting(), [], seen));
    const isDeclared = (path: string) => {
      if (declaredKeys.includes(path) || declaredKeys.some((k) => k.startsWith(`${path}.`))) return true;
      const [first, code, parameter, ...rest] = path.split('.');
      if (first !== 'rules' || rest.length > 0) return false;
      const rule = code ? rulesSchema.properties?.[code] : undefined;
      return !!rule && (parameter === undefined || !!rule.properties?.[parameter]);
    };
    expect([...seen].filter((path) => !isDeclared(path))).toEqual([]);
    // trace.server is read by vscode-languageclient for the client id `vacnet` (its `<id>.trace.server` convention).
    expect(declaredKeys.filter((key) => key !== 'trace.server' && !seen.has(key))).toEqual([]);
    expect(sources).toMatch(/new LanguageClient\('vacnet'/);
  });

  it('every declared setting in its declared form is accepted by the server and takes effect', () => {
    const read = readSettings(everySetting());
    expect(read.problems).toEqual([]);
    expect(read.units).toBe('si');
    expect(read.hints).toEqual({ inletVacuum: false, pipeVelocity: false, producer: false });
    expect(read.debounceMs).toBe(200);
    expect(read.rulesDocsBaseUrl).toBe('https://example.test/rules');
    expect(read.severities).toHaveLength(RULES.length);
    expect(read.ruleSettings).toHaveLength(RULES.reduce((n, r) => n + r.parameters.length, 0));
    // Declared defaults are the server's defaults.
    const defaults = readSettings({ units: properties['vacnet.units']!.default, hints: { inletVacuum: properties['vacnet.hints.inletVacuum']!.default, pipeVelocity: properties['vacnet.hints.pipeVelocity']!.default, producer: properties['vacnet.hints.producer']!.default }, analysis: { debounceMs: properties['vacnet.analysis.debounceMs']!.default }, rules: properties['vacnet.rules']!.default, rulesDocsBaseUrl: properties['vacnet.rulesDocsBaseUrl']!.default });
    expect(defaults).toEqual(readSettings(undefined));
  });

  it('the extension\'s own code reads no setting outside the declared ones', () => {
    const reads = [...sources.matchAll(/getConfiguration\(\s*'([^']*)'\s*\)(?:\.get(?:<[^>]*>)?\(\s*'([^']+)')?/g)].map((m) => [m[1], m[2]].filter(Boolean).join('.'));
    for (const key of reads) expect(Object.keys(properties).some((k) => k === key || k.startsWith(`${key}.`)), key).toBe(true);
  });

  it('`vacnet.rules` declares exactly the engine\'s rules and parameters (scripts/rule-settings-schema.mjs)', async () => {
    // @ts-expect-error: a plain .mjs script without type declarations
    const { ruleSettingsSchema } = (await import('../scripts/rule-settings-schema.mjs')) as { ruleSettingsSchema: (rules: unknown, format: unknown) => unknown };
    // After a rule or parameter changes in the engine: `npx tsc -b packages/engine && npm run rule-settings -w packages/extension`.
    expect(rulesSchema, 'vacnet.rules is stale: run scripts/rule-settings-schema.mjs').toEqual(ruleSettingsSchema(RULES, formatQuantity));
    expect(Object.keys(rulesSchema.properties!).sort()).toEqual(RULES.map((r) => r.code).sort());
  });

  it('every setting has a description', () => {
    for (const [key, schema] of Object.entries(properties)) expect((schema.markdownDescription ?? schema.description ?? '').length, key).toBeGreaterThan(20);
  });
});

describe('the check task and its problem matcher', () => {
  const [matcher] = manifest.contributes.problemMatchers;
  const cli = at('dist/cli.mjs');

  it('a task type with paths and options, and the $vacnet matcher on the format `vacnet check --help` documents', () => {
    expect(manifest.contributes.taskDefinitions[0]).toMatchObject({ type: 'vacnet', required: ['paths'] });
    expect(matcher).toMatchObject({ name: 'vacnet', owner: 'vacnet', pattern: { file: 1, line: 2, column: 3, severity: 4, code: 5, message: 6 } });
    expect(sources).toContain("'$vacnet'");
  });

  it('reads every finding of `vacnet check` on the examples as the JSON output gives it', () => {
    if (!existsSync(cli)) throw new Error(`${cli} is missing: run \`npm run build\` first`);
    const examples = join(repoRoot, 'examples');
    // The task's own command line, run by Node instead of the editor's runtime.
    const line = checkCommandLine(process.execPath, cli, { paths: ['.'] });
    const text = spawnSync(line.command, line.args, { cwd: examples, env: { ...process.env, ...line.env, FORCE_COLOR: '' }, encoding: 'utf8', timeout: 120_000 });
    const json = spawnSync(process.execPath, [cli, 'check', '--format', 'json', '.'], { cwd: examples, encoding: 'utf8', timeout: 120_000 });
    const report = JSON.parse(json.stdout) as { files: { path: string; diagnostics: { line: number; column: number; severity: string; code: string; message: string }[] }[] };
    const expected = report.files.flatMap((f) => f.diagnostics.map((d) => [f.path, d.line, d.column, d.severity, d.code, d.message].join('|')));
    const regexp = new RegExp(matcher!.pattern.regexp);
    const matched = text.stdout
      .split('\n')
      .map((l) => regexp.exec(l))
      .filter((m): m is RegExpExecArray => m !== null)
      .map((m) => [m[1], Number(m[2]), Number(m[3]), m[4], m[5], m[6]].join('|'));
    expect(expected.length).toBeGreaterThan(20);
    expect(matched).toEqual(expected);
  });

  it('the matcher reads Windows paths and lines with colons in the message', () => {
    const regexp = new RegExp(matcher!.pattern.regexp);
    const m = regexp.exec('C:\\plant\\a.vacnet:12:7 warning fast-velocity Pipe x: 41 m/s at 10:30');
    expect(m?.slice(1)).toEqual(['C:\\plant\\a.vacnet', '12', '7', 'warning', 'fast-velocity', 'Pipe x: 41 m/s at 10:30']);
    // Summary and system lines are no findings.
    expect(regexp.test('Checked 2 files: 0 errors, 0 warnings, 0 infos.')).toBe(false);
    expect(regexp.test('  worst inlet B6: 6.18 inHg at the tool (needs 5.00 inHg), 122 scfm')).toBe(false);
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
    expect(opens).toEqual(expect.arrayContaining(['{', '"', '/*']));
    expect(new RegExp(configuration.folding.markers.start).test('system "Harbour offices" {')).toBe(true);
    expect(new RegExp(configuration.folding.markers.end).test('  }')).toBe(true);
  });

  it('keeps hyphenated names whole, as the grammar\'s ID terminal reads them', () => {
    const id = terminal('ID');
    for (const name of ['riser-b', 'L3-east', 'main-1', 'j-1', 'std-50', 'room_b1', 'test-orifice']) {
      expect(id.test(name), `${name} is an ID`).toBe(true);
      expect(words(name)).toEqual([name]);
    }
    expect(words('inlet L3-east on riser-b at 4 ft hose std-50')).toEqual(['inlet', 'L3-east', 'on', 'riser-b', 'at', '4', 'ft', 'hose', 'std-50']);
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

  it('indents every example as its blocks nest: the rules agree with the braces the grammar scopes, on every line', async () => {
    const increase = new RegExp(configuration.indentationRules.increaseIndentPattern);
    const decrease = new RegExp(configuration.indentationRules.decreaseIndentPattern);
    const examples = ['detached-house', 'grinding-plant', 'harbour-offices', 'primary-school', 'catalog/equipment'].map((n) => join(repoRoot, 'examples', `${n}.vacnet`));
    let checked = 0;
    for (const file of examples) {
      const text = readFileSync(file, 'utf8');
      const lines = text.split('\n');
      const tokens = await tokenise(text);
      // The reference: block braces as the TextMate grammar scopes them (never inside a comment or string).
      let braceDepth = 0;
      let ruleDepth = 0;
      lines.forEach((line, i) => {
        const braces = tokens[i]!.filter((t) => /punctuation\.section\.block/.test(t.scopes.at(-1) ?? ''));
        const opensFirst = braces[0]?.text === '}';
        if (decrease.test(line)) ruleDepth--;
        const depthHere = braceDepth - (opensFirst ? 1 : 0);
        if (line.trim() !== '' && !line.trim().startsWith('//')) {
          expect(ruleDepth, `${file}:${i + 1}: ${line}`).toBe(depthHere);
          checked++;
        }
        for (const b of braces) braceDepth += b.text === '{' ? 1 : -1;
        if (increase.test(line)) ruleDepth++;
        // A line such as `plant p { ... }` opens and closes: the rules leave the depth as it was.
        if (!increase.test(line) && !decrease.test(line)) expect(ruleDepth, `${file}:${i + 1}`).toBe(braceDepth);
      });
      expect(braceDepth).toBe(0);
    }
    expect(checked).toBeGreaterThan(250);
  });

  it('continues block comments with a star', () => {
    const [first] = configuration.onEnterRules as { beforeText: string; afterText?: string; action: { appendText: string } }[];
    expect(new RegExp(first!.beforeText).test('/* a note')).toBe(true);
    expect(new RegExp(first!.beforeText).test('pipe a /* done */')).toBe(false);
  });
});

describe('icons', () => {
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
  const header = (png: Buffer) => [png.readUInt32BE(16), png.readUInt32BE(20), png[24], png[25]];

  it('the extension icon is a 128 x 128 RGBA PNG, the size the marketplace asks for', () => {
    const png = readFileSync(at(manifest.icon));
    expect(png.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    expect(png.toString('latin1', 12, 16)).toBe('IHDR');
    expect(header(png)).toEqual([128, 128, 8, 6]);
  });

  it('the .vacnet file icon is a small RGBA PNG with a transparent ground', () => {
    const png = readFileSync(at(manifest.contributes.languages[0]!.icon.dark));
    expect(header(png)).toEqual([32, 32, 8, 6]);
    // Row 0, pixel 0: filter byte then RGBA; the corner is transparent.
    expect(pixelRows(png)[4]).toBe(0);
  });

  it('both are the ones our drawing script makes', async () => {
    // @ts-expect-error: a plain .mjs script without type declarations
    const { drawIcon, drawFileIcon } = (await import('../scripts/draw-icon.mjs')) as { drawIcon: () => Buffer; drawFileIcon: () => Buffer };
    expect(pixelRows(readFileSync(at(manifest.icon))).equals(pixelRows(drawIcon()))).toBe(true);
    expect(pixelRows(readFileSync(at('images/file-icon.png'))).equals(pixelRows(drawFileIcon()))).toBe(true);
  });
});
