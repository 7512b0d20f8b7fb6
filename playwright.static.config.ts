/**
 * The browser test of the static folder (`npm run test:static`): `npm run build:static` makes
 * out/, scripts/serve-static.mjs serves it as a plain web server would (README, "Headers for
 * the static folder"), and tests/static/ checks the pages open, compute, print and stay within
 * the policy. Separate from the main suite because it needs a different build; run it after
 * `npm run test:e2e` (both builds use .next/).
 */
import { defineConfig, devices } from '@playwright/test';
import { CHROMIUM_ARGS, CHROMIUM_PATH } from './playwright.config';

const PORT = Number(process.env.STATIC_PORT ?? 3190);

export default defineConfig({
  testDir: 'tests/static',
  outputDir: 'test-results/static',
  fullyParallel: true,
  workers: 2,
  forbidOnly: true,
  retries: 0,
  timeout: 90_000,
  expect: { timeout: 15_000 },
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${PORT}`,
    browserName: 'chromium',
    launchOptions: { executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS },
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
  },
  projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'], launchOptions: { executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS } } }],
  webServer: {
    command: `npm run build:static && node scripts/serve-static.mjs out --port ${PORT}`,
    url: `http://127.0.0.1:${PORT}/`,
    timeout: 300_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
