/**
 * Headers and the browser console (issue 14, item 15; issue 12 "Small"; issue 15's manifest):
 * the Content Security Policy allows inline scripts by hash only, no page logs a policy
 * violation, error responses carry the same security headers as pages, a page load asks for
 * nothing that is missing (the favicon included), and the app installs from its manifest.
 */
import { createHash } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';

test.describe.configure({ timeout: 180_000 }); // generous: a busy machine hydrates slowly
// About the service worker (or run with it, as a clinician's browser does): playwright.config.ts blocks it elsewhere.
test.use({ serviceWorkers: 'allow' });

const SECURITY_HEADERS = ['content-security-policy', 'referrer-policy', 'x-content-type-options', 'x-frame-options', 'permissions-policy', 'cross-origin-opener-policy'];

/** The policy's script-src sources. */
function scriptSources(csp: string): string[] {
  const directive = csp.split(';').map((d) => d.trim()).find((d) => d.startsWith('script-src '));
  return directive ? directive.split(/\s+/).slice(1) : [];
}

/** Collects CSP violations, as the page reports them and as the console logs them. */
async function watchViolations(page: Page): Promise<{ events: () => Promise<string[]>; console: string[] }> {
  const consoleLines: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) consoleLines.push(message.text());
  });
  await page.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { cspViolations: string[] }).cspViolations = seen;
    document.addEventListener('securitypolicyviolation', (e) => seen.push(`${e.violatedDirective} ${e.blockedURI} ${e.sourceFile}:${e.lineNumber}`));
  });
  return {
    events: () => page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations),
    console: consoleLines,
  };
}

test('script-src allows inline scripts by hash only, and every inline script of / and /handout is allowed', async ({ request }) => {
  for (const path of ['/', '/handout']) {
    const response = await request.get(path);
    expect(response.status()).toBe(200);
    const sources = scriptSources(response.headers()['content-security-policy'] ?? '');
    expect(sources).toContain("'self'");
    expect(sources).not.toContain("'unsafe-inline'");
    expect(sources).not.toContain("'unsafe-eval'");
    const html = await response.text();
    const inline = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)].filter((m) => !/\ssrc=/.test(` ${m[1] ?? ''}`)).map((m) => m[2] ?? '');
    expect(inline.length).toBeGreaterThan(0);
    for (const text of inline) expect(sources).toContain(`'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`);
  }
});

test('no Content Security Policy violation is logged on / (with a result and its charts) or /handout', async ({ page }) => {
  const violations = await watchViolations(page);
  await page.goto('/');
  // The service worker is registered once the page has hydrated: wait for it before clicking.
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.getByTestId('chart-horizon')).toBeVisible();
  await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
  expect(await violations.events()).toEqual([]);

  await page.getByTestId('prepare-handout').click();
  await expect(page.getByTestId('handout-sheet')).toBeVisible({ timeout: 60_000 }); // a busy machine lays the sheet out slowly
  expect(await violations.events()).toEqual([]);
  expect(violations.console).toEqual([]);
});

test('error responses carry the same security headers as pages', async ({ request }) => {
  const page = (await request.get('/')).headers();
  for (const [method, path, status] of [
    ['GET', '/no-such-page', 404],
    ['GET', '/_next/static/chunks/no-such-chunk.js', 404],
    ['POST', '/', 405],
  ] as const) {
    const response = await request.fetch(path, { method });
    expect(response.status(), `${method} ${path}`).toBe(status);
    for (const name of SECURITY_HEADERS) expect(response.headers()[name], `${name} on ${method} ${path}`).toBe(page[name]);
  }
});

test('loading / and /handout asks for nothing that is missing (the favicon included)', async ({ page }) => {
  const missing: string[] = [];
  page.on('response', (response) => {
    if (response.status() >= 400) missing.push(`${response.status()} ${response.url()}`);
  });
  for (const path of ['/', '/handout']) {
    await page.goto(path);
    await page.waitForLoadState('networkidle');
  }
  expect(missing).toEqual([]);
  const favicon = await page.request.get('/favicon.ico');
  expect(favicon.status()).toBe(200);
  expect(favicon.headers()['content-type']).toMatch(/icon/);
});

test('the web app manifest names the app and its icons load', async ({ request }) => {
  const response = await request.get('/manifest.webmanifest');
  expect(response.status()).toBe(200);
  const manifest = (await response.json()) as { name: string; short_name: string; display: string; start_url: string; icons: { src: string; sizes: string; type: string }[] };
  expect(manifest.name).toContain('Hundredfold');
  expect(manifest.short_name).toBe('Hundredfold');
  expect(manifest.display).toBe('standalone');
  expect(manifest.start_url).toBe('/');
  const sizes = manifest.icons.map((i) => i.sizes);
  expect(sizes).toEqual(expect.arrayContaining(['192x192', '512x512']));
  for (const icon of manifest.icons) {
    const file = await request.get(icon.src);
    expect(file.status(), icon.src).toBe(200);
    expect(file.headers()['content-type'], icon.src).toContain(icon.type);
  }
});
