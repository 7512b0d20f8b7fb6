/**
 * A worker handed over from the checkups screen ("open one worker", issue 10, item 7) whose
 * record cannot be used: the consultation screen fills nothing in and says why, in words, with
 * the way to try again; the record is consumed either way. The words come from lib/checkups
 * (`HANDOVER_REFUSED_LEAD`, `readWorkerHandOver`'s issues), never from the page.
 */
import { expect, test, type Page } from '@playwright/test';
import { WORKER_HANDOVER_KEY } from '../../lib/checkups/workerHandOverKey';
import { HANDOVER_REFUSED_LEAD, readWorkerHandOver, workerHandOverRecord } from '../../lib/checkups/workerHandOver';
import { localIsoDate } from '../../lib/glycaemia/dates';
import { consultationReady, expectAxeClean, field, TYPED_SCENARIO } from './support';

/** Leaves `record` where the checkups screen leaves it (this tab's sessionStorage), then opens the consultation screen as the new tab does. */
async function arriveWith(page: Page, record: string): Promise<void> {
  await page.goto('/');
  await consultationReady(page);
  await page.evaluate(([key, value]) => window.sessionStorage.setItem(key, value), [WORKER_HANDOVER_KEY, record] as const);
  await page.reload();
  await consultationReady(page);
}

test('a damaged record: nothing filled in, one notice saying why and what to do, the record consumed', async ({ page }) => {
  const damaged = '{"format":"hundredfold-checkups-worker","version":1,"scen';
  const got = readWorkerHandOver(damaged, localIsoDate());
  expect(got?.ok).toBe(false); // the lib refuses it; the page must say so
  await arriveWith(page, damaged);
  const notice = page.getByTestId('handover-notice');
  await expect(notice).toBeVisible();
  await expect(notice).toHaveAttribute('role', 'alert');
  await expect(notice).toContainText(HANDOVER_REFUSED_LEAD);
  if (got && !got.ok) await expect(notice.getByRole('listitem')).toHaveText(got.issues.map((i) => i.message));
  await expect(field(page, 'effect.estimate')).toHaveValue('');
  expect(await page.evaluate((key) => window.sessionStorage.getItem(key), WORKER_HANDOVER_KEY)).toBeNull();
  await expectAxeClean(page);
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(notice).toBeVisible();
  await expectAxeClean(page);
});

test('a record whose history is no longer valid (a checkup after today): refused with the history problem named', async ({ page }) => {
  const record = workerHandOverRecord({
    scenario: TYPED_SCENARIO,
    evidenceId: 'typed',
    criteria: 'ADA',
    checkups: [{ date: '2999-01-01', hba1c: { value: 6.0, unit: '%' } }], // invented: a date in the future
  });
  const got = readWorkerHandOver(record, localIsoDate());
  expect(got?.ok).toBe(false);
  await arriveWith(page, record);
  const notice = page.getByTestId('handover-notice');
  await expect(notice).toContainText(HANDOVER_REFUSED_LEAD);
  if (got && !got.ok) await expect(notice.getByRole('listitem').first()).toHaveText(got.issues[0]?.message ?? '');
  await expect(field(page, 'effect.estimate')).toHaveValue('');
});
