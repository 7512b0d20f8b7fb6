/**
 * Privacy: during a full session no request leaves the app's origin, typing sends nothing to
 * the server, and the production Content Security Policy has no 'unsafe-eval'.
 */
import { expect, test } from '@playwright/test';
import { field, fillTypedScenario } from './support';

// With the service worker, as a clinician's browser runs (its precache is part of the session): playwright.config.ts blocks it elsewhere.
test.use({ serviceWorkers: 'allow' });

test('no request leaves the origin during a full session, and typing sends nothing', async ({ page, context, baseURL }) => {
  const origin = new URL(baseURL ?? 'http://127.0.0.1').origin;
  const requests: { url: string; method: string; phase: string }[] = [];
  let phase = 'load';
  context.on('request', (request) => requests.push({ url: request.url(), method: request.method(), phase }));

  await page.goto('/');
  await page.waitForLoadState('networkidle');
  // The service worker downloads the app once for offline use (its own requests, nothing typed):
  // let it finish before typing starts, so the typing phase sees only what typing causes.
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  phase = 'typing';
  await fillTypedScenario(page);
  await expect(page.getByTestId('result')).toBeVisible();
  await field(page, 'effect.estimate').fill('1.6');
  await page.getByLabel('1,000 people', { exact: true }).check();
  await page.getByText('Show each step').click();
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeVisible();
  await page.waitForLoadState('networkidle');
  phase = 'reload';
  await page.reload();
  await expect(page.getByTestId('result')).toBeVisible();
  phase = 'handout';
  await page.getByTestId('prepare-handout').click();
  await page.waitForLoadState('networkidle');

  const foreign = requests.filter((r) => new URL(r.url).origin !== origin && !r.url.startsWith('data:') && !r.url.startsWith('blob:'));
  expect(foreign).toEqual([]);
  // While typing, the only requests are the page's own code chunks: nothing carries what was typed.
  const whileTyping = requests.filter((r) => r.phase === 'typing');
  for (const r of whileTyping) {
    expect(r.method).toBe('GET');
    expect(new URL(r.url).pathname).toMatch(/^\/_next\/static\//);
    expect(new URL(r.url).search).toBe('');
  }
});

test('the production Content Security Policy keeps everything on the origin, without unsafe-eval', async ({ request }) => {
  const response = await request.get('/');
  const csp = response.headers()['content-security-policy'] ?? '';
  expect(csp).toContain("default-src 'self'");
  expect(csp).toContain("connect-src 'self'");
  expect(csp).toContain("frame-ancestors 'none'");
  expect(csp).not.toContain('unsafe-eval');
  expect(response.headers()['referrer-policy']).toBe('no-referrer');
});

test('no web fonts, no third-party scripts or styles in the page', async ({ page }) => {
  await page.goto('/');
  const external = await page.evaluate(() =>
    [...document.querySelectorAll('script[src], link[href], img[src], iframe[src]')]
      .map((el) => el.getAttribute('src') ?? el.getAttribute('href') ?? '')
      .filter((url) => /^(https?:)?\/\//.test(url)),
  );
  expect(external).toEqual([]);
  const fonts = await page.evaluate(async () => {
    await document.fonts.ready;
    return [...document.fonts].map((f) => f.family);
  });
  expect(fonts).toEqual([]);
});
