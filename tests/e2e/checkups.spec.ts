/**
 * Browser tests of the workforce checkups screen (/checkups): the demo 40-worker file processed
 * in the Web Worker gives the same summary as `hundredfold checkups` for the same file; a file with
 * bad rows lists them and processes the rest; a PDF renamed .csv gets its one sentence; axe clean
 * at 1280 and 390 px; no request leaves the origin.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, test } from '@playwright/test';
import type { WorkforceSummary } from '../../lib/workforce/types';
import { checkupsSummaryView } from '../../lib/checkups/summaryView';
import { DEMO_CHECKUPS as DEMO, expectAxeClean, openAndProcessCheckups } from './support';

/** The command's summary for a file (same default today as the browser: the machine's date). */
function commandSummary(file: string): WorkforceSummary {
  const dir = mkdtempSync(join(tmpdir(), 'checkups-'));
  const out = join(dir, 'summary.json');
  try {
    execFileSync('node', ['bin/hundredfold.mjs', 'checkups', file, '--criteria', 'ADA', '--table-id', 'demo-heart-failure-10y', '--evidence-id', 'demo-workforce-hba1c-heart-failure', '--summary', out], { stdio: ['ignore', 'ignore', 'ignore'] });
  } catch {
    // exit 1: some rows were skipped; the summary is still written
  }
  return JSON.parse(readFileSync(out, 'utf8')) as WorkforceSummary;
}

test('the demo file: columns shown, processed in the worker, the summary equals the command’s, nothing leaves the origin', async ({ page, context, baseURL }) => {
  test.setTimeout(120_000); // two axe runs and a spawned command on a shared machine
  const requests: string[] = [];
  context.on('request', (r) => requests.push(r.url()));
  await page.goto('/');
  await page.getByRole('link', { name: /Workforce checkups/ }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Workforce checkups' })).toBeVisible();
  await expect(page.getByLabel(/Checkup file/)).toBeEnabled(); // the page has hydrated
  await page.getByLabel(/Checkup file/).setInputFiles(DEMO);
  const columns = page.getByTestId('columns');
  await expect(columns).toBeVisible();
  await expect(columns.getByRole('rowheader', { name: 'Worker' })).toBeVisible();
  await expect(page.getByLabel('What the column HbA1c (%) is')).toHaveValue('hba1c');
  await page.getByRole('button', { name: 'Confirm the columns and process' }).click();
  await expect(page.getByTestId('summary')).toBeVisible({ timeout: 30_000 });

  const expected = commandSummary(DEMO);
  const view = checkupsSummaryView(expected, 'heart failure needing hospital care');
  const counts = page.getByTestId('status-counts');
  for (const s of view.statuses) await expect(counts.locator(`tr[data-status="${s.status}"] td`)).toHaveText(String(s.count));
  await expect(page.getByTestId('employer-paragraph')).toHaveText(view.employerParagraph);
  await expect(page.getByTestId('chart-text')).toHaveText(view.chartText);
  await expect(page.getByTestId('summary-caution')).toContainText(expected.caution);
  await expect(page.getByTestId('worklist-count')).toHaveText(`${expected.workers} of ${expected.workers} workers shown`);
  // Filter by status: the count matches the command's count for that status.
  await page.getByLabel('Status').selectOption('exposed');
  await expect(page.getByTestId('worklist-count')).toHaveText(`${expected.byStatus.exposed} of ${expected.workers} workers shown`);
  await expect(page.getByTestId('worklist').locator('tbody tr[data-status]').first()).toHaveAttribute('data-status', 'exposed');

  // Exports: named by date only, naming the evidence inside, one line per worker.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Per-worker CSV' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^checkups-workers-\d{4}-\d{2}-\d{2}\.csv$/);
  const exported = readFileSync(await download.path(), 'utf8');
  expect(exported.startsWith('Evidence,Prediabetes-range HbA1c and heart failure, workforce cohort (demo) (demo-workforce-hba1c-heart-failure)'.replace(/^Evidence,(.*)$/, 'Evidence,"$1"'))).toBe(true);
  expect(exported.split('\r\n').filter((l) => /^W\d{3},/.test(l))).toHaveLength(expected.workers);

  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: 900 });
    await expectAxeClean(page);
    await page.screenshot({ path: `test-results/checkups-${width}.png`, fullPage: true });
    // A closed choice list cuts a long title at 390 px: the chosen entry's whole title is written under it there.
    const chosen = page.getByTestId('setup-evidence-chosen');
    if (width === 390) await expect(chosen).toHaveText('Prediabetes-range HbA1c and heart failure, workforce cohort (demo)');
    else await expect(chosen).toBeHidden();
  }
  const origin = new URL(baseURL ?? 'http://localhost').origin;
  expect(requests.filter((u) => !u.startsWith('data:') && !u.startsWith('blob:') && new URL(u).origin !== origin)).toEqual([]);
});

test('a file with bad rows lists them with row and column and processes the rest', async ({ page }) => {
  test.setTimeout(90_000); // axe on a shared, loaded machine
  const csv = ['Worker,Checkup date,HbA1c (%),Age,Sex', 'A1,2021-03-01,5.9,50,female', 'A1,2022-03-01,6.0,51,female', 'A1,2023-03-01,banana,52,female', 'A1,2024-03-01,6.1,53,female', 'B2,2022-03-01,5.2,40,male', 'B2,not a date,5.3,41,male', 'B2,2024-03-01,5.1,42,male'].join('\n');
  await openAndProcessCheckups(page, { name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  const problems = page.getByTestId('problems');
  await expect(problems.getByRole('heading')).toContainText('2 row problems');
  await expect(problems.getByRole('listitem').filter({ hasText: 'row 4, column HbA1c (%)' })).toHaveCount(1);
  await expect(problems.getByRole('listitem').filter({ hasText: 'row 7, column Checkup date' })).toHaveCount(1);
  await expect(page.getByTestId('worklist-count')).toHaveText('2 of 2 workers shown');
  await expectAxeClean(page);
});

test('a PDF renamed .csv gets one sentence and nothing else', async ({ page }) => {
  await page.goto('/checkups');
  await expect(page.getByLabel(/Checkup file/)).toBeEnabled(); // the page has hydrated
  await page.getByLabel(/Checkup file/).setInputFiles({ name: 'checkups.csv', mimeType: 'text/csv', buffer: Buffer.from('%PDF-1.7\n%\u00e2\u00e3\n1 0 obj\n') });
  await expect(page.getByTestId('file-message')).toHaveText(/^This file is a PDF document, not a table of checkups: open a CSV or TSV file/);
  await expect(page.getByTestId('columns')).toHaveCount(0);
  await page.setViewportSize({ width: 390, height: 900 });
  await expectAxeClean(page);
});

/**
 * An invented workforce big enough to still be processing while axe runs: `workers` workers ×
 * 3 yearly checkups, grouped by worker (illustrative values only).
 */
function bigWorkforce(workers: number): Buffer {
  const lines = ['Worker,Checkup date,HbA1c (%),Age,Sex,Site'];
  for (let w = 0; w < workers; w += 1) {
    const id = `Z${String(w).padStart(6, '0')}`;
    const sex = w % 2 === 0 ? 'female' : 'male';
    const age = 35 + (w % 30);
    for (let y = 0; y < 3; y += 1) lines.push(`${id},${2022 + y}-03-1${w % 9},${(5.2 + ((w + y) % 12) / 10).toFixed(1)},${age + y},${sex},Site ${w % 4}`);
  }
  return Buffer.from(lines.join('\n'));
}

test('axe finds nothing in every state of the screen, at 1280 and 390 px: set-up, columns, processing, cancelled', async ({ page }) => {
  test.setTimeout(180_000); // eight axe runs on a shared machine
  const bothWidths = async (state: string) => {
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 900 });
      await test.step(`${state} at ${width} px`, () => expectAxeClean(page));
    }
  };
  await page.goto('/checkups');
  await expect(page.getByLabel(/Checkup file/)).toBeEnabled(); // the page has hydrated
  await bothWidths('set-up');

  // Given as a file on disk, which the browser reads itself: 13 MB handed over as a buffer took
  // Playwright about 9 s to pass to the page.
  const year = test.info().outputPath('year.csv');
  writeFileSync(year, bigWorkforce(150_000));
  await page.getByLabel(/Checkup file/).setInputFiles(year);
  await expect(page.getByTestId('columns')).toBeVisible();
  await bothWidths('columns');

  await page.getByRole('button', { name: 'Confirm the columns and process' }).click();
  const processing = page.getByRole('heading', { name: 'Processing' });
  await expect(processing).toBeVisible();
  await bothWidths('processing');
  // Still processing once both runs are done (150,000 workers take seconds), so the state checked was the running one.
  await expect(processing).toBeVisible();
  await page.getByRole('button', { name: 'Cancel' }).click();
  await expect(page.getByText('Cancelled: nothing was kept.')).toBeVisible();
  await expect(processing).toHaveCount(0);
  await bothWidths('cancelled');
});
