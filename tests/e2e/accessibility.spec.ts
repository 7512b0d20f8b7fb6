/**
 * WCAG 2.2 AA checks with axe in the three states of the screen (empty, error, result), at a
 * desktop width and at 320 px; and the screen used by keyboard alone.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Locator, type Page } from '@playwright/test';
import { field, fillTypedScenario } from './support';

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function expectNoViolations(page: Page): Promise<void> {
  const report = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  const summary = report.violations.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join('; ')})`);
  expect(summary).toEqual([]);
}

for (const width of [1280, 320]) {
  test.describe(`at ${width} px`, () => {
    test.use({ viewport: { width, height: 900 } });

    test('the empty screen has no axe violations', async ({ page }) => {
      await page.goto('/');
      await expect(page.getByTestId('no-result')).toBeVisible();
      await expectNoViolations(page);
    });

    test('the error state has no axe violations', async ({ page }) => {
      await page.goto('/');
      await fillTypedScenario(page);
      await field(page, 'effect.lower').fill('1.6');
      await expect(page.locator('#field-effect-estimate-error')).toContainText('must lie within its interval');
      await expectNoViolations(page);
    });

    test('the result state has no axe violations', async ({ page }) => {
      await page.goto('/');
      await fillTypedScenario(page);
      await expect(page.getByTestId('result')).toBeVisible();
      await expect(page.getByTestId('chart-absolute')).toBeVisible();
      await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
      await page.getByText('Show each step').click();
      await expectNoViolations(page);
    });
  });
}

test('the whole screen can be used by keyboard alone', async ({ page }) => {
  await page.goto('/');
  // Tab to the example button and press it.
  let reached = false;
  for (let i = 0; i < 10 && !reached; i += 1) {
    await page.keyboard.press('Tab');
    reached = await page.getByTestId('load-example').evaluate((el) => el === document.activeElement);
  }
  expect(reached).toBe(true);
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('result')).toBeVisible();

  // Change the estimate from the keyboard: focus moves with Tab, typing replaces the value. Every
  // control below is reached by pressing Tab, not by focus(), so the test proves keyboard reach.
  const tabTo = async (target: Locator, most = 200) => {
    for (let i = 0; i < most; i += 1) {
      if (await target.evaluate((el) => el === document.activeElement)) return true;
      await page.keyboard.press('Tab');
    }
    return target.evaluate((el) => el === document.activeElement);
  };
  expect(await tabTo(field(page, 'effect.estimate'))).toBe(true);
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.type('1.7');
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.locator('#field-effect-estimate-error')).toBeEmpty();
  // The example's saved entry no longer applies to the changed figure: each word it filled in is
  // flagged, and the clinician keeps each one from the keyboard (the handout waits for that).
  for (const name of ['outcome', 'exposure', 'comparison', 'population', 'citation']) {
    const flag = page.getByTestId(`leftover-${name}`);
    if ((await flag.count()) === 0) continue;
    expect(await tabTo(flag.getByRole('button', { name: /^Keep this/ }))).toBe(true);
    await page.keyboard.press('Enter');
    await expect(flag).toHaveCount(0);
  }

  // A radio group moves with the arrow keys.
  expect(await tabTo(page.getByLabel('Automatic', { exact: true }))).toBe(true);
  await page.keyboard.press('ArrowDown');
  await expect(page.getByLabel('100 people', { exact: true })).toBeChecked();

  // Every control in the result can be reached: the copy button and the handout link.
  expect(await tabTo(page.getByTestId('copy-link'))).toBe(true);
  await page.keyboard.press('Tab');
  await expect(page.getByTestId('prepare-handout')).toBeFocused();
  // The focus ring is visible (an outline wider than zero).
  const outline = await page.getByTestId('prepare-handout').evaluate((el) => getComputedStyle(el).outlineWidth);
  expect(parseFloat(outline)).toBeGreaterThan(0);
});

test('at 320 px nothing needs sideways scrolling', async ({ page }) => {
  await page.setViewportSize({ width: 320, height: 800 });
  await page.goto('/');
  await page.getByTestId('load-example').click();
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.getByTestId('chart-absolute')).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
});
