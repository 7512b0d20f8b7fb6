/**
 * The optional parts of the screen and print: the glucose history and the clinic library open
 * on demand without breaking the screen (axe clean), a library table can be used for the
 * baseline, and the printed result keeps the caution while leaving the form out.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { expectScreenShows, fillTypedScenario, TYPED_SCENARIO } from './support';

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

test('the glucose history and the clinic library open on demand, and the screen stays accessible', async ({ page }) => {
  await page.goto('/');
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeVisible();

  await page.getByRole('button', { name: /glucose history/ }).click();
  await expect(page.getByTestId('glucose-history')).toBeVisible();
  await page.getByRole('button', { name: 'Open the library' }).click();
  await expect(page.getByTestId('library-section').getByRole('heading', { name: 'Population tables' })).toBeVisible();
  await expect(page.getByTestId('library-section')).toContainText('Save the evidence on screen');
  await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');

  const report = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
  // Still the same result underneath.
  await expect(page.getByTestId('result')).toBeVisible();
});

test('the skip link jumps from the top of the page to the result', async ({ page }) => {
  await page.goto('/');
  await page.keyboard.press('Tab');
  const skip = page.getByRole('link', { name: 'Skip to the result' });
  await expect(skip).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/#result$/);
});

test('in print the result keeps its caution and the form is left out', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByTestId('caution')).toBeVisible();
  await expect(page.getByTestId('array-exposed')).toBeVisible();
  await expect(page.locator('form[aria-label="Scenario"]')).toBeHidden();
  await expect(page.getByTestId('copy-link')).toBeHidden();
});
