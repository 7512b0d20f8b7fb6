/**
 * The browser test of the static folder (`npm run test:static`): `npm run build:static` makes
 * out/, scripts/serve-static.mjs serves it as a plain web server would (README, "Headers for
 * the static folder"), and tests/static/ checks the pages open, compute, print and stay within
 * the policy. Separate from the main suite because it needs a different build; run it after
 * `npm run test:e2e` (both builds use .next/).
 */
import { defineConfig } from '@playwright/test';
import { sharedConfig } from './playwright.config';

const PORT = Number(process.env.STATIC_PORT ?? 3190);

export default defineConfig({
  ...sharedConfig(PORT),
  testDir: 'tests/static',
  outputDir: 'test-results/static',
  webServer: {
    command: `npm run build:static && node scripts/serve-static.mjs out --port ${PORT}`,
    url: `http://127.0.0.1:${PORT}/`,
    timeout: 300_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
