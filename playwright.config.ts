/**
 * Browser tests of the consultation screen (tests/e2e/), run against a production build.
 *
 * Playwright cannot download its own browser on this machine, so the tests drive Debian's
 * Chromium at /usr/bin/chromium (shared/guides/toolchain.md). Without it, or without
 * poppler-utils for the handout's PDF checks, the run stops at once with one line saying how to
 * install what is missing.
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { defineConfig, devices } from '@playwright/test';

/** Debian's Chromium; PLAYWRIGHT_CHROMIUM_PATH points elsewhere (e.g. to check the message below). */
export const CHROMIUM_PATH = process.env.PLAYWRIGHT_CHROMIUM_PATH ?? '/usr/bin/chromium';
/** The port the built app is served on for the tests; E2E_PORT overrides it (e.g. to run two checkouts at once). */
export const E2E_PORT = Number(process.env.E2E_PORT ?? 3100);

if (!existsSync(CHROMIUM_PATH)) {
  process.stderr.write(`Chromium is missing at ${CHROMIUM_PATH}: install it with \`apt-get install chromium\` (Debian), then run the tests again.\n`);
  process.exit(1);
}

/** The handout's PDF checks read the printed page with poppler-utils' pdftotext and pdftoppm. */
function hasCommand(name: string): boolean {
  try {
    execFileSync(name, ['-v'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}
if (!hasCommand('pdftotext') || !hasCommand('pdftoppm')) {
  process.stderr.write('pdftotext and pdftoppm are missing: install them with `apt-get install poppler-utils` (Debian), then run the tests again.\n');
  process.exit(1);
}

/** Launch flags that work with Debian's Chromium here (toolchain guide). */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--headless',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

/**
 * What both browser suites share (this one and the static folder's, playwright.static.config.ts):
 * Debian's Chromium, two workers, the limits and the reports, for the app served on `port`.
 */
export function sharedConfig(port: number) {
  return {
    fullyParallel: true,
    workers: 2,
    forbidOnly: true,
    retries: 0,
    // Generous limits: a page on a loaded 2-core machine can take several seconds to hydrate; a
    // limit only stops a stuck test, it is never a timing assertion (timings are in npm run bench).
    timeout: 90_000,
    expect: { timeout: 15_000 },
    reporter: [['list']] as [['list']],
    use: {
      baseURL: `http://127.0.0.1:${port}`,
      browserName: 'chromium' as const,
      launchOptions: { executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS },
      trace: 'retain-on-failure' as const,
      screenshot: 'only-on-failure' as const,
    },
    projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'], launchOptions: { executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS } } }],
  };
}

const shared = sharedConfig(E2E_PORT);

export default defineConfig({
  ...shared,
  // The service worker precaches the whole app (about 2.4 MB, 65 files) in every new browser
  // context, i.e. in every test: on the 2-core CI machine that cost each test 1.5–2 s of CPU
  // shared with the other worker. Tests that are not about it run without it (the app works
  // online without one, as in a browser that has none); the specs that are about it — offline
  // use, the update offer, what the service worker fetches, the policy it runs under — say
  // `test.use({ serviceWorkers: 'allow' })` (offline, privacy, headers), and so does the static
  // folder's suite.
  use: { ...shared.use, serviceWorkers: 'block' },
  testDir: 'tests/e2e',
  outputDir: 'test-results/e2e',
  webServer: {
    // A production build, so the tests see the real bundle and the production CSP.
    command: `npm run build && npx next start -p ${E2E_PORT} -H 127.0.0.1`,
    url: `http://127.0.0.1:${E2E_PORT}/`,
    timeout: 300_000,
    reuseExistingServer: !process.env.CI,
    env: { NEXT_TELEMETRY_DISABLED: '1' },
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
