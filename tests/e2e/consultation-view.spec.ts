/**
 * The consultation screen's view model in the browser (issue 12 items on `/`): a capped result
 * reaches no one, keys add up, figures come before words, leftovers from a saved entry are
 * flagged, outcomes that differ are named, "8%" and decimal commas are read, Clear is undoable,
 * demo data carries its band, and the 390 px layout keeps the result one tap away.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { scenarioQuery } from '../../lib/link';
import type { Scenario } from '../../lib/scenario/schema';
import { expectScreenShows, field, fillTypedScenario, TYPED_SCENARIO } from './support';

async function countsAddUp(page: Page, array: 'reference' | 'exposed'): Promise<number> {
  const cells = page.locator(`[data-testid="array-${array}"] td[data-testid^="count-${array}-"]`);
  const ids = await cells.evaluateAll((tds) => tds.map((td) => ({ id: td.getAttribute('data-testid') ?? '', text: td.textContent ?? '' })));
  return ids.filter(({ id }) => !id.endsWith('-total') && !id.endsWith('-range')).reduce((sum, { text }) => sum + Number(text.replace(/,/g, '')), 0);
}

test('a capped result shows the clinician figures and the warning only (item 4)', async ({ page }) => {
  await page.goto('/');
  // Invented: RR 2.5 (2 to 3) at a 10-year risk of 0.5 gives RR·P0 = 1.25 ≥ 1 (hand-computed).
  await fillTypedScenario(page, { ...TYPED_SCENARIO, baseline: { risk: 0.5, years: 10 }, effect: { measure: 'RR', estimate: 2.5, lower: 2, upper: 3, design: 'cohort' } });
  await expect(page.getByTestId('capped')).toBeVisible();
  await expect(page.locator('[data-code="risk-ratio-exceeds-certainty"]')).toBeVisible();
  await expect(page.getByTestId('clinician-absolute')).toBeVisible();
  await expect(page.getByTestId('array-reference')).toHaveCount(0);
  await expect(page.getByTestId('groups-table')).toHaveCount(0);
  await expect(page.getByTestId('prepare-handout')).toHaveCount(0);
});

test('each picture’s table adds up to the denominator, the range in its own row (item 5)', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);
  expect(await countsAddUp(page, 'reference')).toBe(100);
  expect(await countsAddUp(page, 'exposed')).toBe(100);
  await expect(page.getByTestId('count-exposed-total')).toHaveText('100');
  // Hand-computed: RR 1.5 (1.2 to 1.9) at 0.08 gives 9.6% to 15.2%: 10 to 15 out of 100.
  await expect(page.getByTestId('count-exposed-range')).toHaveText('10 to 15 could have it, out of 100 (already counted above)');
});

test('figures and pictures appear before the words; the words are asked for the sentences and handout (item 6)', async ({ page }) => {
  const scenario: Scenario = { baseline: TYPED_SCENARIO.baseline, effect: TYPED_SCENARIO.effect };
  await page.goto('/');
  await fillTypedScenario(page, scenario);
  await expect(page.getByTestId('result')).toBeVisible({ timeout: 30_000 });
  await expectScreenShows(page, scenario);
  await expect(page.getByTestId('words-needed')).toContainText('outcome');
  await expect(page.getByTestId('count-reference-event')).toBeVisible();
  await expect(page.locator('[data-testid="array-reference"] th').filter({ hasText: 'Will have the outcome' })).toBeVisible();
  await expect(page.getByTestId('prepare-handout')).toHaveCount(0);

  // A link without wording (as `hundredfold link` makes) opens on the figures, not "No result yet".
  await page.goto(`/${scenarioQuery(scenario)}`);
  // The link is read after hydration and the figures' chunk loads then: allow for a slow machine.
  await expect(page.getByTestId('result')).toBeVisible({ timeout: 30_000 });
  await expectScreenShows(page, scenario);
  await expect(page.getByTestId('no-result')).toHaveCount(0);
});

test('typing your own figures over a saved entry flags what came from it (item 1)', async ({ page }) => {
  await page.goto('/');
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('prepare-handout')).toBeVisible();
  await field(page, 'effect.estimate').fill('2.1');
  await field(page, 'effect.upper').fill('2.9');
  await expect(page.getByTestId('entry-no-longer-applies')).toBeVisible();
  await expect(page.getByTestId('entry-notice')).toBeVisible();
  // The picker no longer names the entry.
  await expect(field(page, 'evidenceId').locator('option:checked')).toHaveText('Your own figures (the saved entry no longer applies)');
  await expect(page.getByTestId('leftover-citation')).toBeVisible();
  await expect(page.getByTestId('prepare-handout')).toHaveCount(0);
  // Each flagged wording is kept or cleared by the clinician; then the handout comes back.
  for (const name of ['outcome', 'exposure', 'comparison', 'population', 'citation']) {
    const flag = page.getByTestId(`leftover-${name}`);
    if ((await flag.count()) === 0) continue;
    if (name === 'citation' || name === 'population') await flag.getByRole('button', { name: 'Clear it' }).click();
    else await flag.getByRole('button', { name: /^Keep this/ }).click();
    await expect(flag).toHaveCount(0);
  }
  await field(page, 'wording.population').fill('adults at a health check');
  await expect(page.getByTestId('prepare-handout')).toBeVisible();
});

test('the table’s and the study’s outcomes, when they differ, are both named in a warning (item 3); demo data carries the band (item 2)', async ({ page }) => {
  await page.goto('/');
  await page.getByTestId('load-example').click();
  const warning = page.locator('[data-code="outcome-mismatch"]');
  await expect(warning).toContainText('a first hospital admission for heart failure'); // lib/tables/demo.ts
  await expect(warning).toContainText('heart failure needing hospital care'); // lib/evidence/demo.ts
  await expect(page.getByTestId('illustrative-band')).toContainText('Illustrative figures, not for patients');
});

test('"8%" in a risk field is read as 0.08, and a decimal comma as a point (item 13)', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page);
  await field(page, 'riskBaseline.risk').fill('8%');
  await expectScreenShows(page, TYPED_SCENARIO);
  await field(page, 'riskBaseline.risk').fill('0,08');
  await expectScreenShows(page, TYPED_SCENARIO);
});

test('Clear the form can be undone, and Back brings the scenario back (item 7)', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);
  await page.getByTestId('clear-form').click();
  await expect(page.getByTestId('no-result')).toBeVisible();
  await page.getByTestId('undo-clear').click();
  await expectScreenShows(page, TYPED_SCENARIO);
  await page.getByTestId('clear-form').click();
  await expect(page.getByTestId('no-result')).toBeVisible();
  await page.goBack();
  await expectScreenShows(page, TYPED_SCENARIO);
});

test('at 390 px the result is one tap away and nothing widens the page (item 11); screenshots', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/');
  await page.getByTestId('load-example').click();
  const link = page.getByTestId('see-result');
  await expect(link).toBeVisible();
  await expect(link).toHaveText('See the result');
  await expect(link).toHaveAttribute('href', '#result');
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  // Every section heading stays inside its box.
  const crossing = await page.locator('legend, h2, h3, h4').evaluateAll((els) =>
    els.filter((el) => {
      const box = el.parentElement?.getBoundingClientRect();
      const own = el.getBoundingClientRect();
      return box !== undefined && own.width > 0 && own.right > box.right + 1;
    }).length,
  );
  expect(crossing).toBe(0);
  await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
  await page.screenshot({ path: 'test-results/screens/vm-consultation-390.png', fullPage: true });
  await page.setViewportSize({ width: 1280, height: 900 });
  await expect(page.getByTestId('see-result')).toBeHidden();
  await page.screenshot({ path: 'test-results/screens/vm-consultation-1280.png', fullPage: true });
});

test('at 390 px, after a change far down the form, a link right under that field takes one tap to the result; it covers nothing and axe is clean (item 11)', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/');
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeAttached();
  // The horizon is in the last section, far below the top link.
  const horizon = field(page, 'horizonYears');
  await horizon.fill('5');
  const link = page.getByTestId('see-result-inline');
  await expect(link).toHaveCount(1);
  await expect(link).toBeInViewport();
  await expect(link).toHaveText('See the result');
  await expect(page.getByTestId('see-result')).not.toBeInViewport();
  // Directly under the changed field, in the page's flow: it overlaps no other control.
  const [fieldBox, linkBox] = await Promise.all([horizon.boundingBox(), link.boundingBox()]);
  expect(linkBox && fieldBox && linkBox.y >= fieldBox.y + fieldBox.height).toBe(true);
  expect(linkBox && linkBox.height >= 24).toBe(true);
  const covered = await link.evaluate((a) => {
    const r = a.getBoundingClientRect();
    const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
    return hit !== a && !a.contains(hit);
  });
  expect(covered).toBe(false);
  await page.screenshot({ path: 'test-results/screens/consult-390-inline-link.png' });
  // One key press: the result comes into view.
  await link.press('Enter');
  await expect(page.getByRole('heading', { name: 'Result', exact: true })).toBeInViewport();
  await page.screenshot({ path: 'test-results/screens/consult-390-after-link.png' });
  // A field that does not change the numbers' validity still gets the link; only one at a time.
  await field(page, 'person.age').fill('56');
  await expect(page.getByTestId('see-result-inline')).toHaveCount(1);
  await expect(page.getByTestId('see-result-inline')).toBeInViewport();
  const report = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
  // On a wide screen the result is beside the form: no link.
  await page.setViewportSize({ width: 1280, height: 900 });
  await expect(page.getByTestId('see-result-inline')).toBeHidden();
});
