/**
 * Screenshots of the result state for a person to look at, saved with the test results:
 * test-results/screens/result-desktop.png, result-tablet.png and result-320.png.
 */
import { expect, test } from '@playwright/test';

for (const [name, width, height] of [
  ['desktop', 1400, 4200],
  ['tablet', 820, 1180],
  ['320', 320, 800],
] as const) {
  test(`screenshot of the result state (${name})`, async ({ page }) => {
    await page.setViewportSize({ width, height });
    await page.goto('/');
    await page.getByTestId('load-example').click();
    await expect(page.getByTestId('result')).toBeVisible();
    await expect(page.getByTestId('chart-horizon')).toBeVisible();
    await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
    await page.screenshot({ path: `test-results/screens/result-${name}.png`, fullPage: true });
  });
}
