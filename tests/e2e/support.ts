/**
 * Shared steps for the browser tests: fill the consultation form like a clinician would, and
 * work out what the screen must show from the engine itself (lib/), never from the page.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, type Locator, type Page } from '@playwright/test';
import { computeScenario } from '../../lib/engine/compute';
import { exposedLayout, referenceLayout } from '../../lib/engine/iconArray';
import type { ComputeResult } from '../../lib/engine/types';
import type { Scenario } from '../../lib/scenario/schema';
import { clinicianText, type ClinicianText } from '../../lib/wording/clinician';

/** A typed-in scenario: a 10-year risk of 0.08 and a risk ratio of 1.5 (1.2 to 1.9). Invented. */
export const TYPED_SCENARIO: Scenario = {
  baseline: { risk: 0.08, years: 10 },
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9, design: 'cohort' },
  wording: { outcome: 'a first stroke', exposure: 'raised blood pressure', comparison: 'normal blood pressure' },
  person: { age: 62, sex: 'female' },
};

export function expected(scenario: Scenario): { result: ComputeResult; clinician: ClinicianText } {
  const computed = computeScenario(scenario);
  if (!computed.ok) throw new Error(`the test scenario must compute: ${JSON.stringify(computed.issues)}`);
  return { result: computed.value, clinician: clinicianText(computed.value, scenario.wording) };
}

/** The control of a form field, by its name in the form (ids are derived from names). */
export function field(page: Page, name: string): Locator {
  return page.locator(`#field-${name.replace(/\./g, '-')}`);
}

/**
 * Waits until the consultation screen runs in the browser (its form carries data-hydrated="true"):
 * a choice made before that, such as a table picked, would be lost when the page hydrates.
 */
export async function consultationReady(page: Page): Promise<void> {
  await expect(page.getByRole('form', { name: 'Scenario' })).toHaveAttribute('data-hydrated', 'true', { timeout: 60_000 });
}

/** Types a scenario with a typed-in risk baseline through the form, field by field. */
export async function fillTypedScenario(page: Page, scenario: Scenario = TYPED_SCENARIO): Promise<void> {
  await consultationReady(page);
  const { baseline, effect, wording = {}, person = {} } = scenario;
  if (!('risk' in baseline)) throw new Error('fillTypedScenario types a risk baseline');
  await page.getByLabel('Enter a risk over a period', { exact: true }).check();
  await field(page, 'riskBaseline.risk').fill(String(baseline.risk));
  await field(page, 'riskBaseline.years').fill(String(baseline.years));
  if (person.age !== undefined) await field(page, 'person.age').fill(String(person.age));
  if (person.sex !== undefined) await field(page, 'person.sex').selectOption(person.sex);
  await page.getByLabel(effect.measure === 'RR' ? 'Risk ratio (RR)' : effect.measure === 'OR' ? 'Odds ratio (OR)' : 'Hazard ratio (HR)', { exact: true }).check();
  await field(page, 'effect.estimate').fill(String(effect.estimate));
  await field(page, 'effect.lower').fill(String(effect.lower));
  await field(page, 'effect.upper').fill(String(effect.upper));
  if (effect.design === 'cohort') await page.getByLabel('Cohort', { exact: true }).check();
  if (wording.outcome) await field(page, 'wording.outcome').fill(wording.outcome);
  if (wording.exposure) await field(page, 'wording.exposure').fill(wording.exposure);
  if (wording.comparison) await field(page, 'wording.comparison').fill(wording.comparison);
}

/** Counts the icons of one kind drawn in an array ("reference" or "exposed"). */
export async function iconCount(page: Page, array: 'reference' | 'exposed', kind: string, uncertain?: boolean): Promise<number> {
  const selector = `[data-testid="array-${array}"] svg use[data-kind="${kind}"]${uncertain ? '[data-uncertain="true"]' : ''}`;
  return page.locator(selector).count();
}

/** Checks that the screen shows exactly the engine's figures for the scenario. */
export async function expectScreenShows(page: Page, scenario: Scenario): Promise<void> {
  const { result, clinician } = expected(scenario);
  const shown = page.getByTestId('result');
  await expect(shown).toBeVisible();
  await expect(page.getByTestId('clinician-absolute')).toHaveText(clinician.absoluteRisks);
  await expect(page.getByTestId('clinician-risk-ratio')).toHaveText(clinician.riskRatio);
  await expect(page.getByTestId('clinician-risk-difference')).toHaveText(clinician.riskDifference);
  await expect(page.getByTestId('clinician-number-needed')).toHaveText(clinician.numberNeeded);
  await expect(page.getByTestId('clinician-number-needed')).toContainText(result.numberNeeded.text);

  const counts = result.iconArray;
  const reference = referenceLayout(counts).tally;
  const exposed = exposedLayout(counts).tally;
  expect(await page.locator('[data-testid="array-reference"] svg use').count()).toBe(counts.denominator);
  expect(await page.locator('[data-testid="array-exposed"] svg use').count()).toBe(counts.denominator);
  expect(await iconCount(page, 'reference', 'event')).toBe(counts.referenceEvents);
  expect(await iconCount(page, 'reference', 'none')).toBe(reference.none);
  expect(await iconCount(page, 'exposed', 'event')).toBe(exposed.event);
  expect(await iconCount(page, 'exposed', 'added')).toBe(exposed.added);
  expect(await iconCount(page, 'exposed', 'avoided')).toBe(exposed.avoided);
  expect(exposed.event + exposed.added).toBe(counts.exposedEvents);
  expect(await page.locator('[data-testid="array-exposed"] svg use[data-uncertain="true"]').count()).toBe(counts.exposedUpper - counts.exposedLower);
}

/** Waits until the service worker has installed (its precache is complete) and is active. */
export async function serviceWorkerActive(page: Page): Promise<string> {
  return page.evaluate(async () => {
    const registration = await navigator.serviceWorker.ready;
    const worker = registration.active;
    if (!worker) throw new Error('no active service worker');
    if (worker.state !== 'activated') {
      await new Promise<void>((resolve) => worker.addEventListener('statechange', () => worker.state === 'activated' && resolve()));
    }
    return worker.scriptURL;
  });
}

/** The demo checkup file: 40 invented workers (demo/checkups/checkups.csv). */
export const DEMO_CHECKUPS = 'demo/checkups/checkups.csv';
/** The WCAG 2.2 AA rule tags every axe pass uses. */
export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** Runs axe on the whole page (WCAG 2.2 AA tags) and expects no violation. */
export async function expectAxeClean(page: Page): Promise<void> {
  const report = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
}

/** Opens /checkups, gives it a file (a path or a buffer), confirms the columns and waits for the summary. */
export async function openAndProcessCheckups(page: Page, file: string | { name: string; mimeType: string; buffer: Buffer }): Promise<void> {
  await page.goto('/checkups');
  await expect(page.getByLabel(/Checkup file/)).toBeEnabled(); // the page has hydrated
  await page.getByLabel(/Checkup file/).setInputFiles(file);
  await expect(page.getByTestId('columns')).toBeVisible();
  await page.getByRole('button', { name: 'Confirm the columns and process' }).click();
  await expect(page.getByTestId('summary')).toBeVisible({ timeout: 30_000 });
}
