import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

/**
 * Test files that must each run in a fresh module graph: the component tests (jsdom), the ones
 * on browser storage (fake-indexeddb keeps its databases in the module), and the zod set-up check,
 * which proves that importing a schema module alone configures zod — it would pass vacuously if
 * another file had imported lib/zod.ts into the same graph first.
 */
const ISOLATED = ['tests/unit/**/*.test.tsx', 'tests/unit/storage/**', 'tests/unit/handout/templateStore.test.ts', 'tests/unit/zodConfig.test.ts'];
const ALL = ['tests/unit/**/*.test.ts', 'tests/unit/**/*.test.tsx', 'tests/cli/**/*.test.ts'];

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./', import.meta.url)) },
  },
  test: {
    environment: 'node',
    testTimeout: 30_000,
    // Vitest's default in a run is one fewer worker than cores: a single worker on this project's
    // 2-core machines, which left a core idle for most of the run (about 120 s alone).
    maxWorkers: 2,
    projects: [
      { extends: true, test: { name: 'isolated', include: ISOLATED } },
      // The rest test pure functions (lib/ and the command line): their files share each worker's
      // module graph instead of loading lib/ afresh for every file (an import phase of about 50 s
      // of the unit run's 95 s). lib/ keeps no state but memo caches of pure results.
      { extends: true, test: { name: 'pure', include: ALL, exclude: ISOLATED, isolate: false } },
    ],
  },
});
