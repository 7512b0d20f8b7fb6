/**
 * Works without a network after one visit (issue 15): the service worker keeps every page and
 * chunk, so with the browser offline a scenario link made by the page's own "Copy link" opens and
 * shows the engine's figures, the handout opens and prints to one page, and a new version is
 * offered ("Reload to update"), never switched in under the clinician. The clinic library's saved
 * tables (IndexedDB) load offline too and give the baseline.
 *
 * The links are the ones the page itself makes (Copy link, Prepare handout), so these tests hold
 * whatever form the link codec gives them (query or fragment).
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import { computeScenario } from '@/lib/engine/compute';
import { CAUTION_TEXT } from '@/lib/wording';
import { expectScreenShows, field, fillTypedScenario, openAndProcessCheckups, serviceWorkerActive, TYPED_SCENARIO } from './support';
import { chooseCsv, fillEvidence, GOOD_CSV, goodTable, openLibrary, savedTables, TABLE_TITLE, tableScenario } from './librarySupport';

// Installing the service worker downloads every page and chunk once: allow for a busy machine.
test.describe.configure({ timeout: 180_000 });
// About the service worker (or run with it, as a clinician's browser does): playwright.config.ts blocks it elsewhere.
test.use({ serviceWorkers: 'allow' });

const OUT = path.join('test-results', 'offline');
mkdirSync(OUT, { recursive: true });

/** Visits `/` once, types the shared scenario, and returns the links the page itself makes. */
async function visitOnce(page: Page, context: BrowserContext, baseURL: string | undefined): Promise<{ link: string; handout: string }> {
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL ?? '' });
  await page.goto('/');
  // The worker is registered once the page has hydrated, so from here on typing reaches the form.
  expect(new URL(await serviceWorkerActive(page)).pathname).toBe('/sw.js');
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);
  await page.getByTestId('copy-link').click();
  await expect(page.getByText('Link copied.', { exact: false })).toBeVisible();
  const link = await page.evaluate(() => navigator.clipboard.readText());
  const handoutHref = await page.getByTestId('prepare-handout').getAttribute('href');
  if (!handoutHref) throw new Error('Prepare handout has no link');
  return { link, handout: new URL(handoutHref, link).href };
}

/** Records every response and failed request from now on, to check all came from the service worker. */
function watchNetwork(page: Page) {
  const notFromWorker: string[] = [];
  const failed: string[] = [];
  page.on('response', (response) => {
    if (!response.fromServiceWorker()) notFromWorker.push(`${response.status()} ${response.url()}`);
  });
  page.on('requestfailed', (request) => {
    // The router's own background fetches of its data (`_rsc`, e.g. a prefetch of the back link)
    // fail offline by design: they are never cached, and following the link loads the cached page.
    if (new URL(request.url()).searchParams.has('_rsc')) return;
    failed.push(`${request.url()} ${request.failure()?.errorText ?? ''}`);
  });
  return { notFromWorker, failed };
}

test('after one visit, a scenario link opens with the network off and shows the figures', async ({ page, context, baseURL }) => {
  const { link } = await visitOnce(page, context, baseURL);
  await page.goto('about:blank');
  await context.setOffline(true);
  const network = watchNetwork(page);

  const response = await page.goto(link);
  expect(response?.fromServiceWorker()).toBe(true);
  await expect(page.getByTestId('result')).toBeVisible({ timeout: 60_000 }); // a busy machine hydrates slowly
  await expectScreenShows(page, TYPED_SCENARIO);
  // The demo data works offline too: the example fills in from the cached chunks and computes.
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.getByTestId('chart-horizon')).toBeVisible();

  expect(network.notFromWorker).toEqual([]);
  expect(network.failed).toEqual([]);
});

test('after one visit, the handout opens with the network off and prints to one page', async ({ page, context, baseURL }) => {
  const { handout } = await visitOnce(page, context, baseURL);
  await page.goto('about:blank');
  await context.setOffline(true);
  const network = watchNetwork(page);

  await page.goto(handout);
  await expect(page.getByTestId('handout-sheet')).toBeVisible({ timeout: 60_000 });
  const pdfPath = path.join(OUT, 'handout-offline.pdf');
  writeFileSync(pdfPath, await page.pdf({ preferCSSPageSize: true, printBackground: true }));
  expect(execFileSync('pdfinfo', [pdfPath]).toString()).toMatch(/^Pages:\s+1$/m);
  const text = execFileSync('pdftotext', ['-raw', pdfPath, '-']).toString().replace(/\s+/g, ' ');
  const computed = computeScenario(TYPED_SCENARIO);
  if (!computed.ok) throw new Error(JSON.stringify(computed.issues));
  const { iconArray: c } = computed.value;
  expect(text).toContain(`about ${c.referenceEvents} out of ${c.denominator}`);
  expect(text).toContain(`about ${c.exposedEvents} out of ${c.denominator}`);
  expect(text).toContain(CAUTION_TEXT.replace(/\s+/g, ' ').trim());

  expect(network.notFromWorker).toEqual([]);
  expect(network.failed).toEqual([]);
});

test('after one visit, the library\'s saved tables load with the network off and give the baseline', async ({ page, context }) => {
  const table = goodTable();
  await page.goto('/');
  await serviceWorkerActive(page);
  const library = await openLibrary(page);
  await chooseCsv(library, 'test-district.csv', GOOD_CSV);
  await library.getByRole('button', { name: 'Save table' }).click();
  await expect(savedTables(library)).toHaveCount(1);

  await page.goto('about:blank');
  await context.setOffline(true);
  const network = watchNetwork(page);
  const response = await page.goto('/');
  expect(response?.fromServiceWorker()).toBe(true);
  const offline = await openLibrary(page);
  const kept = offline.getByRole('article', { name: TABLE_TITLE });
  await expect(kept).toContainText('4 strata: female and male, ages 40 and over; risks over 10 years');
  await kept.getByRole('button', { name: 'Use this table' }).click();
  await expect(field(page, 'tableId')).toHaveValue(table.id);
  await field(page, 'person.age').fill('64');
  await field(page, 'person.sex').selectOption('female');
  await fillEvidence(page);
  await expectScreenShows(page, tableScenario(table, { age: 64, sex: 'female' }));

  expect(network.notFromWorker).toEqual([]);
  expect(network.failed).toEqual([]);
});

test('after one visit, the checkups screen reads and processes a file with the network off (its Web Worker included)', async ({ page, context }) => {
  await page.goto('/checkups');
  await serviceWorkerActive(page);
  await page.goto('about:blank');
  await context.setOffline(true);
  const network = watchNetwork(page);
  // The invented 40-worker demo file (illustrative).
  await openAndProcessCheckups(page, 'demo/checkups/checkups.csv');
  await expect(page.getByTestId('summary')).toContainText('40');
  expect(network.notFromWorker).toEqual([]);
  expect(network.failed).toEqual([]);
});

test('a new version is offered with "Reload to update", not switched in under the clinician', async ({ page }) => {
  await page.goto('/');
  await serviceWorkerActive(page);
  await page.reload(); // Now the page is controlled by the service worker.
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? '')).toMatch(/\/sw\.js$/);
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeVisible();
  await page.evaluate(() => {
    (window as unknown as { stillHere: boolean }).stillHere = true;
  });

  // A new version appears: the browser installs a different worker script for the same scope.
  await page.evaluate(() => navigator.serviceWorker.register('/sw.js?version=next', { scope: '/' }));
  const banner = page.getByTestId('update-banner');
  await expect(banner).toBeVisible();
  await expect(banner).toContainText('A new version of Hundredfold is ready.');
  // Offered, not forced: the same page and the same worker are still in place, the result still shown.
  expect(await page.evaluate(() => (window as unknown as { stillHere?: boolean }).stillHere)).toBe(true);
  expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? '')).toMatch(/\/sw\.js$/);
  expect(await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.waiting?.scriptURL ?? '')).toMatch(/\/sw\.js\?version=next$/);
  await expect(page.getByTestId('result')).toBeVisible();

  // The clinician chooses: the new version takes over and the page reloads once.
  await Promise.all([page.waitForEvent('load'), page.getByTestId('update-reload').click()]);
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? '')).toMatch(/\/sw\.js\?version=next$/);
  expect(await page.evaluate(() => (window as unknown as { stillHere?: boolean }).stillHere)).toBeUndefined();
  // (The reloaded page registers /sw.js again, which this test's stand-in version is not, so the
  // browser would now offer /sw.js as the next update: that is an artefact of the stand-in.)
});
