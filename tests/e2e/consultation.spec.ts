/**
 * The consultation screen end to end: what the clinician types becomes exactly the engine's
 * result; invalid input shows a field error and no result; a link opens the same screen.
 */
import { execFileSync } from 'node:child_process';
import { expect, test } from '@playwright/test';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '../../lib/evidence/demo';
import { scenarioFragment } from '../../lib/link';
import type { Scenario } from '../../lib/scenario/schema';
import { DEMO_HEART_FAILURE_10Y } from '../../lib/tables/demo';
import { lookupStratum } from '../../lib/tables/lookup';
import { consultationReady, expectScreenShows, field, fillTypedScenario, TYPED_SCENARIO } from './support';

test('a scenario typed into the form shows the engine’s risks, difference, number needed and icon counts', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByTestId('no-result')).toBeVisible();
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);
  // The address now holds the whole scenario through the codec.
  await expect(page).toHaveURL(`/${scenarioFragment(TYPED_SCENARIO)}`);
  await expect(page.getByTestId('prepare-handout')).toHaveAttribute('href', `/handout${scenarioFragment(TYPED_SCENARIO)}`);
});

test('a baseline looked up in a demo table, with a demo evidence entry, matches the engine', async ({ page }) => {
  await page.goto('/');
  await consultationReady(page);
  await field(page, 'tableId').selectOption(DEMO_HEART_FAILURE_10Y.id);
  await field(page, 'person.age').fill('45');
  await field(page, 'person.sex').selectOption('female');
  await expect(page.getByTestId('lookup')).toContainText('Women aged 40 to 49');
  await expect(page.getByTestId('lookup')).toContainText('Illustrative numbers, not from a real population');
  await field(page, 'evidenceId').selectOption(DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id);

  const found = lookupStratum(DEMO_HEART_FAILURE_10Y, { age: 45, sex: 'female' });
  if (!found.ok) throw new Error('the demo table covers a 45-year-old woman');
  const scenario: Scenario = {
    baseline: found.value.baseline,
    effect: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.effect,
    wording: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.wording,
    person: { age: 45, sex: 'female' },
    tableId: DEMO_HEART_FAILURE_10Y.id,
  };
  await expectScreenShows(page, scenario);
  await expect(page.getByTestId('result')).toContainText('illustrative numbers, not from a real population', { ignoreCase: true });
  await expect(page.getByTestId('warnings')).toBeVisible();
});

test('a lower limit above the estimate shows a field error and no result', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page);
  await expect(page.getByTestId('result')).toBeVisible();

  await field(page, 'effect.lower').fill('1.6');
  const estimate = field(page, 'effect.estimate');
  const error = page.locator('#field-effect-estimate-error');
  await expect(error).toContainText('must lie within its interval');
  await expect(error).toHaveAttribute('aria-live', 'polite');
  await expect(estimate).toHaveAttribute('aria-invalid', 'true');
  await expect(estimate).toHaveAttribute('aria-describedby', /field-effect-estimate-error/);
  await expect(page.getByTestId('result')).toHaveCount(0);
  await expect(page.getByTestId('no-result')).toContainText('must lie within its interval');

  // Putting it right brings the result back at once.
  await field(page, 'effect.lower').fill('1.2');
  await expectScreenShows(page, TYPED_SCENARIO);
});

test('other bad input shows its own field error and never an old result', async ({ page }) => {
  await page.goto('/');
  await fillTypedScenario(page);
  await field(page, 'riskBaseline.risk').fill('8');
  await expect(page.locator('#field-riskBaseline-risk-error')).toContainText('must be less than 1');
  await expect(page.getByTestId('result')).toHaveCount(0);
  await field(page, 'riskBaseline.risk').fill('abc');
  await expect(page.locator('#field-riskBaseline-risk-error')).toContainText('must be a number');
  await expect(page.getByTestId('result')).toHaveCount(0);
});

test('a `hundredfold link` path opens exactly that screen, and a reload keeps it', async ({ page }) => {
  const scenario: Scenario = {
    baseline: { rate: 12, perPersonYears: 1000 },
    effect: { measure: 'OR', estimate: 1.4, lower: 1.1, upper: 1.8, level: 0.95, design: 'risk-set-case-control', followUpYears: 10, adjusted: true },
    horizonYears: 5,
    denominator: 1000,
    wording: { outcome: 'a first coronary event', exposure: 'fasting glucose in the prediabetes range', comparison: 'normal fasting glucose' },
    person: { age: 58, sex: 'male' },
  };
  const path = execFileSync('node', ['bin/hundredfold.mjs', 'link'], { input: JSON.stringify(scenario), encoding: 'utf8' }).trim();
  expect(path).toBe(`/${scenarioFragment(scenario)}`);

  await page.goto(path);
  await expectScreenShows(page, scenario);
  await expect(page.getByLabel('Enter an event rate', { exact: true })).toBeChecked();
  await expect(field(page, 'rateBaseline.rate')).toHaveValue('12');
  await expect(field(page, 'rateBaseline.perPersonYears')).toHaveValue('1000');
  await expect(page.getByLabel('Odds ratio (OR)', { exact: true })).toBeChecked();
  await expect(field(page, 'effect.estimate')).toHaveValue('1.4');
  await expect(field(page, 'effect.lower')).toHaveValue('1.1');
  await expect(field(page, 'effect.upper')).toHaveValue('1.8');
  await expect(page.getByLabel('Case-control with risk-set sampling (e.g. nested in a cohort)', { exact: true })).toBeChecked();
  await expect(field(page, 'effect.followUpYears')).toHaveValue('10');
  await expect(page.getByLabel('Adjusted', { exact: true })).toBeChecked();
  await expect(field(page, 'horizonYears')).toHaveValue('5');
  await expect(page.getByLabel('1,000 people', { exact: true })).toBeChecked();
  await expect(field(page, 'wording.outcome')).toHaveValue('a first coronary event');
  await expect(field(page, 'person.age')).toHaveValue('58');
  await expect(page).toHaveURL(path);

  await page.reload();
  await expectScreenShows(page, scenario);
  await expect(page).toHaveURL(path);
});

test('“Copy link” copies the address that reopens the screen', async ({ page, context, baseURL }) => {
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL ?? '' });
  await page.goto('/');
  await fillTypedScenario(page);
  await page.getByTestId('copy-link').click();
  await expect(page.getByRole('status').filter({ hasText: 'Link copied' })).toBeVisible();
  const copied = await page.evaluate(() => navigator.clipboard.readText());
  expect(copied).toBe(`${baseURL}/${scenarioFragment(TYPED_SCENARIO)}`);

  const again = await context.newPage();
  await again.goto(copied);
  await expectScreenShows(again, TYPED_SCENARIO);
});

test('a broken link says what is wrong and starts with an empty form', async ({ page }) => {
  await page.goto('/?br=8&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
  await expect(page.locator('.link-problem')).toContainText('could not be read');
  await expect(page.locator('.link-problem')).toHaveAttribute('role', 'alert');
  await expect(page.getByTestId('no-result')).toBeVisible();
});
