// Bundles the programs people run, each into files that start fast and need
// no module resolution at run time:
//   the command line          packages/cli/src/main.ts        -> packages/cli/dist/vacnet.mjs (+ chunks/)
//   the language server       packages/language/src/main.ts   -> packages/extension/dist/server.cjs
//   the editor extension      packages/extension/src/extension.ts -> packages/extension/dist/extension.cjs
//   the server in a browser   packages/language/src/browser-server.ts -> packages/extension/dist/browser-server.js (a web worker)
//   the extension in a browser packages/extension/src/browser-extension.ts -> packages/extension/dist/browser-extension.js
//   the extension's command line packages/extension/src/cli-main.ts -> packages/extension/dist/cli.mjs (one file)
// and copies into the extension what it ships beside them: docs/rules (the
// rule pages its findings link to) and the example systems. Sibling packages
// are bundled from their TypeScript sources (never a stale dist/). `tsc -b`
// type-checks before this runs (see the root `build` script). An entry whose
// source is missing is skipped with a message. The extension's bundles are
// minified (names kept) and carry no source maps: the .vsix stays small.
import { build } from 'esbuild';
import { cpSync, existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const at = (path) => root + path;

/** Workspace packages resolve to their sources. */
const alias = {
  '@vacnet/engine': at('packages/engine/src/index.ts'),
  '@vacnet/language': at('packages/language/src/index.ts'),
};

// CommonJS dependencies bundled into an ES module still call require() for
// Node built-ins; give them one.
const esmRequireBanner =
  "import { createRequire as __vacnetCreateRequire } from 'node:module';\n" +
  'const require = __vacnetCreateRequire(import.meta.url);';

const common = {
  bundle: true,
  // Output paths in the metafile are relative to this; without it they follow the caller's folder.
  absWorkingDir: root,
  platform: 'node',
  target: 'node20',
  alias,
  sourcemap: 'linked',
  logLevel: 'warning',
  metafile: true,
  // Keep class and function names: the dependency-injection of the language services and stack traces read better.
  keepNames: true,
};

// In the browser worker: Node built-ins the language package imports but the
// browser server never calls (rule pages on disk, the headless loader) are
// stubs that throw if they ever are; setImmediate (a Node timer the
// in-thread analysis runner uses) is a zero-delay timeout.
const NODE_STUBS = {
  'node:fs': 'export const existsSync = () => false; export const promises = {}; export const readFileSync = () => { throw new Error("no file system in the browser"); }; export default { existsSync, promises, readFileSync };',
  'node:path': 'const no = () => { throw new Error("no file paths in the browser"); }; export const join = no, dirname = no, resolve = no, basename = no, extname = no, relative = no, isAbsolute = () => false, sep = "/"; export default { join, dirname, resolve, basename, extname, relative, isAbsolute, sep };',
  'node:worker_threads': 'export const parentPort = null; export const workerData = undefined; export class Worker { constructor() { throw new Error("no worker_threads in the browser"); } }',
};
const nodeStubs = {
  name: 'node-stubs',
  setup(build) {
    build.onResolve({ filter: /^node:(fs|path|worker_threads)$/ }, (args) => ({ path: args.path, namespace: 'node-stub' }));
    build.onLoad({ filter: /.*/, namespace: 'node-stub' }, (args) => ({ contents: NODE_STUBS[args.path], loader: 'js' }));
  },
};
const workerBanner = 'if (typeof globalThis.setImmediate !== "function") globalThis.setImmediate = (callback, ...args) => setTimeout(callback, 0, ...args);';

const entries = [
  {
    label: 'command line',
    source: 'packages/cli/src/main.ts',
    // Chunks of earlier builds are removed after the new ones are written, so a
    // `vacnet` started meanwhile (a test in another terminal) still finds its files.
    prune: ['packages/cli/dist/chunks'],
    options: {
      entryPoints: { vacnet: at('packages/cli/src/main.ts') },
      outdir: at('packages/cli/dist'),
      format: 'esm',
      // Split so `vacnet --help` does not parse the language's code; `check` loads its chunk.
      splitting: true,
      chunkNames: 'chunks/[name]-[hash]',
      outExtension: { '.js': '.mjs' },
      banner: { js: esmRequireBanner },
    },
  },
  {
    label: 'language server',
    source: 'packages/language/src/main.ts',
    options: {
      entryPoints: [at('packages/language/src/main.ts')],
      outfile: at('packages/extension/dist/server.cjs'),
      format: 'cjs',
      // The .vsix ships no source maps.
      sourcemap: false,
      minify: true,
    },
  },
  {
    label: 'editor extension',
    source: 'packages/extension/src/extension.ts',
    options: {
      entryPoints: [at('packages/extension/src/extension.ts')],
      outfile: at('packages/extension/dist/extension.cjs'),
      format: 'cjs',
      external: ['vscode'],
      sourcemap: false,
      minify: true,
    },
  },
  {
    label: 'language server for the browser',
    source: 'packages/language/src/browser-server.ts',
    options: {
      entryPoints: [at('packages/language/src/browser-server.ts')],
      outfile: at('packages/extension/dist/browser-server.js'),
      platform: 'browser',
      target: 'es2022',
      // A classic worker script: `new Worker(url)` with no module type.
      format: 'iife',
      plugins: [nodeStubs],
      banner: { js: workerBanner },
      sourcemap: false,
      minify: true,
    },
  },
  {
    label: 'editor extension for the browser',
    source: 'packages/extension/src/browser-extension.ts',
    options: {
      entryPoints: [at('packages/extension/src/browser-extension.ts')],
      outfile: at('packages/extension/dist/browser-extension.js'),
      platform: 'browser',
      target: 'es2022',
      // The browser editor loads an extension's `browser` entry as a CommonJS module.
      format: 'cjs',
      external: ['vscode'],
      sourcemap: false,
      minify: true,
    },
  },
  {
    label: 'command line for the extension',
    source: 'packages/extension/src/cli-main.ts',
    options: {
      entryPoints: [at('packages/extension/src/cli-main.ts')],
      outfile: at('packages/extension/dist/cli.mjs'),
      format: 'esm',
      banner: { js: esmRequireBanner },
      sourcemap: false,
      minify: true,
    },
  },
];

/** Files the extension ships beside its bundles, copied fresh on every build (they are not committed there). */
const copies = [
  { label: 'rule pages', from: 'docs/rules', to: 'packages/extension/docs/rules', filter: (name) => name.endsWith('.md') },
  { label: 'example systems', from: 'examples', to: 'packages/extension/examples', filter: (name) => name.endsWith('.vacnet') },
];

let failed = false;
for (const entry of entries) {
  if (!existsSync(at(entry.source))) {
    console.log(`bundle: skipped the ${entry.label}: ${entry.source} does not exist yet`);
    continue;
  }
  try {
    const result = await build({ ...common, ...entry.options });
    const written = new Set(Object.keys(result.metafile.outputs).map((file) => at(file)));
    for (const folder of entry.prune ?? []) {
      for (const name of existsSync(at(folder)) ? readdirSync(at(folder)) : []) {
        const file = `${at(folder)}/${name}`;
        if (!written.has(file)) rmSync(file, { force: true });
      }
    }
    // A map left by an earlier build that wrote one would be shipped stale.
    if (entry.options.sourcemap === false && entry.options.outfile) rmSync(`${entry.options.outfile}.map`, { force: true });
    const outputs = Object.keys(result.metafile.outputs).filter((file) => !file.endsWith('.map'));
    const bytes = outputs.reduce((sum, file) => sum + statSync(at(file)).size, 0);
    console.log(`bundle: ${entry.label} -> ${outputs.length === 1 ? outputs[0] : `${outputs.length} files in ${entry.options.outdir.slice(root.length)}`} (${(bytes / 1e6).toFixed(1)} MB)`);
  } catch (error) {
    // esbuild has already printed the located errors.
    console.error(`bundle: the ${entry.label} failed to bundle`);
    failed = true;
  }
}
for (const copy of copies) {
  if (!existsSync(at(copy.from))) {
    console.log(`bundle: skipped the ${copy.label}: ${copy.from} does not exist`);
    continue;
  }
  rmSync(at(copy.to), { recursive: true, force: true });
  mkdirSync(at(copy.to), { recursive: true });
  cpSync(at(copy.from), at(copy.to), {
    recursive: true,
    // Not the invalid examples: they are test fixtures.
    filter: (source) => (statSync(source).isDirectory() ? !source.endsWith('/invalid') : copy.filter(source.split('/').pop())),
  });
  console.log(`bundle: ${copy.label} -> ${copy.to}`);
}
process.exitCode = failed ? 1 : 0;
