import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const here = (path: string) => fileURLToPath(new URL(path, import.meta.url));

export default defineConfig({
  resolve: {
    // Tests run on the TypeScript sources of sibling packages, not on dist/.
    alias: {
      '@vacnet/engine': here('./packages/engine/src/index.ts'),
      '@vacnet/language': here('./packages/language/src/index.ts'),
    },
  },
  test: {
    include: ['packages/*/test/**/*.test.ts'],
    setupFiles: [here('./scripts/object-groupby-shim.mjs')],
    testTimeout: 30000,
    hookTimeout: 60000,
    pool: 'forks',
  },
});
