/**
 * The static folder (`npm run build:static`, issue 15), served as a plain web server serves it
 * (scripts/serve-static.mjs: files, the `_headers` file, a 404 page): every page opens with the
 * generated Content Security Policy and hydrates under it (the inline scripts' hashes match),
 * the consultation screen computes the engine's figures, the handout prints to one page, the
 * checkups screen opens, and after one visit the service worker opens a scenario link offline.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { expectScreenShows, fillTypedScenario, serviceWorkerActive, TYPED_SCENARIO } from '../e2e/support';

const OUT = path.join('test-results', 'static');
mkdirSync(OUT, { recursive: true });

/** Console errors and policy violations on the page from now on (a blocked inline script shows as both). */
function watchProblems(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(message.text());
  });
  page.on('pageerror', (error) => problems.push(error.message));
  return problems;
}

function expectPolicy(headers: Record<string, string>) {
  const policy = headers['content-security-policy'] ?? '';
  expect(policy).toContain("default-src 'self'");
  const scriptSrc = policy.split(';').find((d) => d.trim().startsWith('script-src')) ?? '';
  expect(scriptSrc).toMatch(/^ ?script-src 'self'( 'sha256-[A-Za-z0-9+/=]+')+$/);
  expect(headers['referrer-policy']).toBe('no-referrer');
  expect(headers['x-content-type-options']).toBe('nosniff');
}

test('every page opens under the generated policy, computes, and prints; a missing page is a 404 with the same headers', async ({ page }) => {
  const problems = watchProblems(page);
  const home = await page.goto('/');
  expect(home?.status()).toBe(200);
  expectPolicy(home?.headers() ?? {});
  // Typing reaches the form only once the page has hydrated, which the policy's hashes allow.
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);

  await page.getByTestId('prepare-handout').click();
  await expect(page).toHaveURL(/\/handout#/);
  await expect(page.getByTestId('handout-sheet')).toBeVisible();
  const pdfPath = path.join(OUT, 'handout-static.pdf');
  writeFileSync(pdfPath, await page.pdf({ preferCSSPageSize: true, printBackground: true }));
  expect(execFileSync('pdfinfo', [pdfPath]).toString()).toMatch(/^Pages:\s+1$/m);

  const checkups = await page.goto('/checkups');
  expect(checkups?.status()).toBe(200);
  expectPolicy(checkups?.headers() ?? {});
  await expect(page.getByRole('heading', { level: 1, name: 'Workforce checkups' })).toBeVisible();

  const missing = await page.request.get('/no-such-page');
  expect(missing.status()).toBe(404);
  expectPolicy(missing.headers());
  expect(problems).toEqual([]);
});

test('after one visit to the static site, a scenario link opens with the network off', async ({ page, context, baseURL }) => {
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL ?? '' });
  await page.goto('/');
  expect(new URL(await serviceWorkerActive(page)).pathname).toBe('/sw.js');
  await fillTypedScenario(page);
  await page.getByTestId('copy-link').click();
  await expect(page.getByText('Link copied.', { exact: false })).toBeVisible();
  const link = await page.evaluate(() => navigator.clipboard.readText());

  await page.goto('about:blank');
  await context.setOffline(true);
  const response = await page.goto(link);
  expect(response?.fromServiceWorker()).toBe(true);
  await expectScreenShows(page, TYPED_SCENARIO);
});
