/**
 * Browser tests of the checkups screen's "open one worker" and batch handouts (issue 10, items 7
 * and 9), on the demo 40-worker file (demo/checkups/checkups.csv):
 * - W001 opened from its worklist row: the consultation screen (a new tab) shows the engine's
 *   figures for W001's scenario, the same as the row, with W001's five checkups filled in; the
 *   hand-over is consumed on arrival and never in the address;
 * - four workers ticked (one with the keyboard), one of them in the diabetes range: three one-page
 *   sheets in one PDF, each with its own numbers, the caution and the demo band; the fourth is
 *   listed without a sheet; the id is printed only when ticked; A4 and US Letter;
 * - axe on the batch controls once prepared, at 1280 and 390 px.
 * What the pages must show comes from lib/ (handoutSheet, the engine), never from the page.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { WORKER_HANDOVER_KEY } from '../../lib/checkups/workerHandOverKey';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '../../lib/evidence/demo';
import { DEFAULT_BLOCKS, handoutSheet } from '../../lib/handout';
import type { Scenario } from '../../lib/scenario/schema';
import { baselineOf, DEMO_HEART_FAILURE_10Y } from '../../lib/tables';
import { CAUTION_HEADING, CAUTION_TEXT } from '../../lib/wording';
import { DEMO_CHECKUPS, expectScreenShows, openAndProcessCheckups, WCAG_TAGS } from './support';

const OUT = path.join('test-results', 'checkups-handouts');
mkdirSync(OUT, { recursive: true });

/**
 * A worker's scenario written out: the demo table's stratum for their age and sex, the demo
 * entry's effect and words. Ages and sexes are those `hundredfold checkups` prints for the demo
 * file (W001 54 female, W007 63 male, W012 61 female).
 */
function workerScenario(age: number, sex: 'female' | 'male'): Scenario {
  const stratum = DEMO_HEART_FAILURE_10Y.strata.find((s) => s.sex === sex && s.ageFrom <= age && age <= s.ageTo);
  if (!stratum) throw new Error(`no demo stratum for ${sex} ${age}`);
  const entry = DEMO_WORKFORCE_HBA1C_HEART_FAILURE;
  return { baseline: baselineOf(DEMO_HEART_FAILURE_10Y, stratum), effect: entry.effect, wording: entry.wording, person: { age, sex }, tableId: DEMO_HEART_FAILURE_10Y.id };
}

const PRINTED = [
  { worker: 'W001', scenario: workerScenario(54, 'female') },
  { worker: 'W007', scenario: workerScenario(63, 'male') },
  { worker: 'W012', scenario: workerScenario(61, 'female') },
] as const;

function squash(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

/** Prints the page to PDF; returns the page size line and each page's text. */
async function printPages(page: Page, base: string): Promise<{ size: string; pages: string[] }> {
  const pdfPath = path.join(OUT, `${base}.pdf`);
  writeFileSync(pdfPath, await page.pdf({ preferCSSPageSize: true, printBackground: true }));
  const info = execFileSync('pdfinfo', [pdfPath]).toString();
  const count = Number(/^Pages:\s+(\d+)$/m.exec(info)?.[1] ?? 0);
  execFileSync('pdftoppm', ['-png', '-r', '50', pdfPath, path.join(OUT, base)]);
  const pages = Array.from({ length: count }, (_, i) => squash(execFileSync('pdftotext', ['-raw', '-f', String(i + 1), '-l', String(i + 1), pdfPath, '-']).toString()));
  return { size: /^Page size:.*$/m.exec(info)?.[0] ?? '', pages };
}

test('one worker opened from the worklist: the consultation screen shows the same figures and the history, handed over inside the browser', async ({ page, context }) => {
  await openAndProcessCheckups(page, DEMO_CHECKUPS);
  const row = page.getByTestId('worklist').locator('tr[data-worker="W001"]');
  const cell = (column: string) => row.locator(`td[data-column="${column}"]`);
  const baseline = (await cell('baseline').textContent()) ?? '';
  const exposed = /^(\S+%) \((\S+%) to (\S+%)\)$/.exec((await cell('exposed').textContent()) ?? '');
  const numberNeeded = (await cell('numberNeeded').textContent()) ?? '';
  expect(exposed).not.toBeNull();

  const [tab] = await Promise.all([context.waitForEvent('page'), row.getByRole('button', { name: 'Open W001 in the consultation screen (new tab)' }).click()]);
  await expect(page.getByTestId('open-status')).toHaveText('W001 is open in the consultation screen, in a new tab.');
  await expect(tab.getByTestId('result')).toBeVisible({ timeout: 30_000 });

  // The engine's figures for W001's scenario, and the very figures of the worklist row.
  await expectScreenShows(tab, PRINTED[0].scenario);
  await expect(tab.getByTestId('clinician-absolute')).toContainText(`${exposed?.[1]} (95% CI ${exposed?.[2]} to ${exposed?.[3]})`);
  await expect(tab.getByTestId('clinician-absolute')).toContainText(`; ${baseline} with normal HbA1c.`);
  await expect(tab.getByTestId('clinician-number-needed')).toContainText(numberNeeded);

  // W001's five checkups (demo/checkups/checkups.csv lines 3–7), matched against the study's exposure.
  const rows = tab.getByTestId('glucose-row');
  await expect(rows).toHaveCount(5);
  await expect(rows.first().getByLabel('Date', { exact: true })).toHaveValue('2021-04-06');
  await expect(rows.last().getByLabel('HbA1c', { exact: true })).toHaveValue('6.2');
  await expect(tab.getByTestId('glucose-match')).toContainText('This history fits the study\u2019s exposure.');

  // One-shot and never in the address: the record is gone; the address holds the scenario only.
  expect(await tab.evaluate((key) => window.sessionStorage.getItem(key), WORKER_HANDOVER_KEY)).toBeNull();
  expect(await page.evaluate((key) => window.sessionStorage.getItem(key), WORKER_HANDOVER_KEY)).toBeNull();
  expect(tab.url()).not.toMatch(/W001|2021-04-06|2025-05-23/);
  expect(await tab.title()).not.toContain('W001');
});

test('batch handouts: ticked workers print one page each in one PDF, each with its own numbers and the caution; the id only when ticked', async ({ page }) => {
  test.slow(); // two PDFs and two axe passes on a shared machine
  await openAndProcessCheckups(page, DEMO_CHECKUPS);
  await page.getByLabel('Tick W001', { exact: true }).check();
  await page.getByLabel('Tick W007', { exact: true }).press('Space'); // the keyboard works the tick box
  await page.getByLabel('Tick W012', { exact: true }).check();
  // W023 (latest result in the diabetes range) is further down: found through the status filter.
  await page.getByLabel('Status').selectOption('diabetes-range');
  await page.getByLabel('Tick W023', { exact: true }).check();
  await page.getByLabel('Status').selectOption('');
  await expect(page.getByTestId('worklist-ticked')).toHaveText('4 workers ticked');
  await expect(page.getByTestId('worklist-ticked')).toHaveAttribute('role', 'status');

  await page.getByLabel(/^The workers ticked in the worklist/).check();
  await page.getByRole('button', { name: 'Prepare 4 handouts' }).click();
  await expect(page.getByTestId('batch-status')).toHaveText('Ready. 4 workers chosen: 3 handouts (one page each); 1 worker gets none (listed below).');
  await expect(page.getByTestId('batch-skipped').getByRole('listitem')).toHaveText([/^W023: Diabetes range: follow up: the study’s figures do not apply/]);
  await expect(page.getByTestId('batch-print')).toHaveAttribute('data-ready', 'true');
  await expect(page.getByTestId('batch-print')).toBeHidden(); // on screen the sheets are out of sight

  const a4 = await printPages(page, 'ticked-a4');
  expect(a4.size).toContain('(A4)');
  expect(a4.pages).toHaveLength(3);
  PRINTED.forEach(({ worker, scenario }, i) => {
    const sheet = handoutSheet(scenario, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: new Date(), paper: 'a4', table: DEMO_HEART_FAILURE_10Y });
    if (!sheet.ok) throw new Error(`${worker}'s scenario must give a sheet`);
    const text = a4.pages[i] ?? '';
    expect(text, worker).toContain(squash(sheet.value.text.reference.caption));
    expect(text, worker).toContain(squash(sheet.value.text.exposed.caption));
    expect(text, worker).toContain(`${CAUTION_HEADING} ${squash(CAUTION_TEXT)}`);
    expect(text.toLowerCase(), worker).toContain('illustrative figures \u2014 not for patients');
    expect(text, worker).not.toMatch(/W0\d\d/);
  });
  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: 900 });
    const report = await new AxeBuilder({ page }).include('[data-testid="batch"]').withTags(WCAG_TAGS).analyze();
    expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`), `${width} px`).toEqual([]);
  }

  // With the id ticked, on US Letter: the prepared sheets are cleared by the change, then made again.
  await page.getByLabel('US Letter', { exact: true }).check();
  await page.getByLabel('Print each worker\u2019s id in small print', { exact: true }).check();
  await expect(page.getByTestId('batch-print')).toHaveCount(0);
  await page.getByRole('button', { name: 'Prepare 4 handouts' }).click();
  await expect(page.getByTestId('batch-print')).toHaveAttribute('data-ready', 'true');
  const letter = await printPages(page, 'ticked-letter-ids');
  expect(letter.size).toMatch(/612 x 792 pts/);
  expect(letter.pages).toHaveLength(3);
  PRINTED.forEach(({ worker }, i) => {
    expect(letter.pages[i]).toContain(`Worker ${worker}`);
    expect(letter.pages[i]?.match(/W0\d\d/g)).toEqual([worker]);
  });
});
