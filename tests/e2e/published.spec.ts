/**
 * A published worked example on the screen (issue 11): the figures pinned here are the published
 * ones, typed as the source prints them, not the engine's own output.
 *
 * Cochrane Handbook v6, §15.4.4 (from memory): a risk ratio of 0.92 at an assumed comparator risk
 * of 0.3 gives NNT = 1 / (0.3 × (1 − 0.92)) = 41.67, rounded up to 42. The interval (0.88 to 0.96)
 * is illustrative, chosen around the published ratio; only the point figures are pinned.
 */
import { expect, test } from '@playwright/test';
import { fillTypedScenario, TYPED_SCENARIO } from './support';

test('a risk ratio of 0.92 at a comparator risk of 30% shows NNTB 42, as the Cochrane Handbook example gives', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page, {
    baseline: { risk: 0.3, years: 1 },
    effect: { measure: 'RR', estimate: 0.92, lower: 0.88, upper: 0.96, design: 'cohort' },
    // The wording and person only name things on the screen; they do not change a figure.
    ...(TYPED_SCENARIO.wording ? { wording: TYPED_SCENARIO.wording } : {}),
    ...(TYPED_SCENARIO.person ? { person: TYPED_SCENARIO.person } : {}),
  });
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(page.getByText(/^NNTB 42 \(95% CI/).first()).toBeVisible();
  // Published exposed risk: 0.92 × 0.3 = 0.276, i.e. 27.6% against 30.0%.
  await expect(page.getByText(/^Absolute risk over the next year: 27\.6% .*; 30\.0% with/).first()).toBeVisible();
});
