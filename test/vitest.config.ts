import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));

// Tests run on the TypeScript sources through the "lightkiln-source" export condition; worker threads
// load the built dist/ files, so `pnpm run build` comes first (the `check` script does both).
export default defineConfig({
  root,
  resolve: { conditions: ['lightkiln-source'] },
  ssr: { resolve: { conditions: ['lightkiln-source'] } },
  test: {
    include: ['packages/*/test/**/*.test.ts', 'test/**/*.test.ts', 'examples/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
  },
});
