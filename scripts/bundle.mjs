// Bundles the programs people run, each into files that start fast and need
// no module resolution at run time:
//   the command line          packages/cli/src/main.ts        -> packages/cli/dist/vacnet.mjs (+ chunks/)
//   the language server       packages/language/src/main.ts   -> packages/extension/dist/server.cjs
//   the editor extension      packages/extension/src/extension.ts -> packages/extension/dist/extension.cjs
// Sibling packages are bundled from their TypeScript sources (never a stale
// dist/). `tsc -b` type-checks before this runs (see the root `build` script).
// An entry whose source is missing is skipped with a message.
import { build } from 'esbuild';
import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
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
    },
  },
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
    const outputs = Object.keys(result.metafile.outputs).filter((file) => !file.endsWith('.map'));
    const bytes = outputs.reduce((sum, file) => sum + statSync(at(file)).size, 0);
    console.log(`bundle: ${entry.label} -> ${outputs.length === 1 ? outputs[0] : `${outputs.length} files in ${entry.options.outdir.slice(root.length)}`} (${(bytes / 1e6).toFixed(1)} MB)`);
  } catch (error) {
    // esbuild has already printed the located errors.
    console.error(`bundle: the ${entry.label} failed to bundle`);
    failed = true;
  }
}
process.exitCode = failed ? 1 : 0;
