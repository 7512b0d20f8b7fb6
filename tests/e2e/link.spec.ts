/**
 * Scenario links (issue 14 items 4, 5, 16; issue 12 item 10): the scenario travels in the URL
 * fragment, which the browser never sends, so no request carries it; old `?…` links still open
 * and are moved to the fragment; a long link of non-Latin wording opens; "Prepare handout" sends
 * nothing about the scenario; links damaged on the way say what was left out.
 * Scenarios are illustrative numbers, not from a real population or study.
 */
import { expect, test, type Page, type Request } from '@playwright/test';
import { encodeScenarioLink, scenarioFragment, scenarioQuery } from '../../lib/link';
import type { Scenario } from '../../lib/scenario/schema';
import { expectScreenShows, TYPED_SCENARIO } from './support';

// These pages compute as soon as they open; on a loaded machine that can take a while, so the
// first wait for each page is long (a wait, not a timing assertion).
test.slow();
const OPENING = { timeout: 30_000 };

/** Waits for the page to have read its link and computed. */
async function opened(page: Page) {
  await expect(page.getByTestId('result')).toBeVisible(OPENING);
}

/** Wording no request may carry: distinctive, so a match in a URL is this scenario. */
const MARKED: Scenario = {
  ...TYPED_SCENARIO,
  wording: { outcome: 'a zebrafinch outcome', exposure: 'quokka exposure', comparison: 'no quokka exposure' },
};

function recordRequests(page: Page): Request[] {
  const seen: Request[] = [];
  page.on('request', (request) => seen.push(request));
  return seen;
}

/** Nothing of the scenario in any request: not its wording, not its parameters. */
function expectNoScenarioIn(requests: readonly Request[]) {
  expect(requests.length).toBeGreaterThan(0);
  for (const request of requests) {
    const url = decodeURIComponent(request.url());
    expect(url).not.toContain('zebrafinch');
    expect(url).not.toContain('quokka');
    expect(url).not.toMatch(/[?&#](br|ee|el|eu|wo)=/);
    expect(request.postData() ?? '').not.toContain('zebrafinch');
  }
}

test('a fragment link opens the figures, and no request carries the scenario', async ({ page }) => {
  const requests = recordRequests(page);
  await page.goto(encodeScenarioLink(MARKED));
  await opened(page);
  await expectScreenShows(page, MARKED);
  await page.waitForLoadState('networkidle');
  expectNoScenarioIn(requests);
  // The address keeps the scenario, in the fragment only.
  expect(new URL(page.url()).search).toBe('');
  expect(new URL(page.url()).hash).toBe(scenarioFragment(MARKED));
});

test('an old ?… link still opens, and the address bar ends up with the fragment', async ({ page }) => {
  await page.goto(`/${scenarioQuery(MARKED)}`);
  await opened(page);
  await expectScreenShows(page, MARKED);
  await expect.poll(() => new URL(page.url()).search).toBe('');
  expect(new URL(page.url()).hash).toBe(scenarioFragment(MARKED));
});

test('“Prepare handout” sends no request carrying the scenario', async ({ page }) => {
  await page.goto(encodeScenarioLink(MARKED));
  await opened(page);
  await expectScreenShows(page, MARKED);
  await page.waitForLoadState('networkidle');
  const requests = recordRequests(page);
  await expect(page.getByTestId('prepare-handout')).toHaveAttribute('href', encodeScenarioLink(MARKED, '/handout'));
  await page.getByTestId('prepare-handout').click();
  await expect(page.getByTestId('handout-sheet')).toBeVisible(OPENING);
  await expect(page.getByTestId('handout-sheet')).toContainText('zebrafinch');
  await page.waitForLoadState('networkidle');
  expectNoScenarioIn(requests);
  // Back to the consultation screen keeps the scenario, still off the wire.
  await page.getByRole('link', { name: 'Back to the consultation screen' }).click();
  await opened(page);
  await expectScreenShows(page, MARKED);
  await page.waitForLoadState('networkidle');
  expectNoScenarioIn(requests);
});

test('a 22 kB link of non-Latin wording opens (no HTTP 431), on / and on /handout', async ({ page }) => {
  // Five wording fields of 500 three-byte characters: the longest wording the schema allows.
  const wide = (c: string) => c.repeat(500);
  const long: Scenario = {
    ...TYPED_SCENARIO,
    wording: { outcome: wide('中'), exposure: wide('語'), comparison: wide('文'), population: wide('字'), citation: wide('典') },
  };
  const link = encodeScenarioLink(long);
  expect(link.length).toBeGreaterThan(22_000);
  const response = await page.goto(link);
  expect(response?.status()).toBe(200);
  await opened(page);
  await expectScreenShows(page, long);
  const handout = await page.goto(encodeScenarioLink(long, '/handout'));
  expect(handout?.status()).toBe(200);
  await expect(page.getByTestId('handout-sheet')).toBeVisible(OPENING);
});

test('a link damaged by a mail program opens with what could be kept, and names what was left out', async ({ page }) => {
  const mailed = `${encodeScenarioLink(TYPED_SCENARIO).replace(/&/g, '&amp;')}&amp;utm_source=mail&amp;ed=survey`;
  await page.goto(mailed);
  await expect(page.getByTestId('link-notice')).toContainText('left out', OPENING);
  await expect(page.getByTestId('link-notice')).toContainText('"utm_source"');
  await expect(page.getByTestId('link-notice')).toContainText('"ed" (the study design)');
  await expect(page.getByTestId('result')).toBeVisible();
});

test('a link cut short says so; a broken % escape is refused, never shown as �', async ({ page }) => {
  const full = encodeScenarioLink(MARKED);
  await page.goto(full.slice(0, full.indexOf('&el=')));
  await expect(page.getByTestId('link-notice')).toContainText('This link looks cut short', OPENING);
  await expect(page.getByTestId('no-result')).toBeVisible();

  await page.goto('about:blank');
  await page.goto(`${encodeScenarioLink(TYPED_SCENARIO)}&wp=adults%E2%80%2070`);
  await expect(page.getByTestId('link-notice')).toContainText('broken % escape', OPENING);
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.locator('body')).not.toContainText('\uFFFD');
});

test('__proto__ as a parameter and a lone surrogate in an old link: plain messages, no page error', async ({ page }) => {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    // A missing icon file (404) is not this test's concern; any other console error is.
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) errors.push(message.text());
  });
  await page.goto(`${encodeScenarioLink(TYPED_SCENARIO)}&__proto__=x`);
  await expect(page.getByTestId('link-notice')).toContainText('unknown parameter "__proto__"', OPENING);
  await expect(page.getByTestId('link-notice')).not.toContainText('[object Object]');

  await page.goto(`${encodeScenarioLink(TYPED_SCENARIO, '/handout')}&wr.json=%22a%5Cud800b%22`);
  await expect(page.getByTestId('link-notice')).toContainText('broken character', OPENING);
  await expect(page.getByTestId('handout-sheet')).toBeVisible(OPENING);
  expect(errors).toEqual([]);
});
