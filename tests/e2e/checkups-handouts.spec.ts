/**
 * Browser tests of the checkups screen's "open one worker" and batch handouts (issue 10, items 7
 * and 9), on the demo 40-worker file (demo/checkups/checkups.csv):
 * - W001 opened from its worklist row: the consultation screen (a new tab) shows the engine's
 *   figures for W001's scenario, the same as the row, with W001's five checkups filled in; the
 *   hand-over is consumed on arrival and never in the address;
 * - four workers ticked (one with the keyboard), one of them in the diabetes range: three one-page
 *   sheets in one PDF, each with its own numbers, the worker's own results (read again from the
 *   file), the caution and the demo band; the fourth is listed without a sheet; no worker id
 *   anywhere unless ticked, then the id alone in small print; A4 and US Letter;
 * - axe on the batch controls once prepared, at 1280 and 390 px, the choices one per line across
 *   the width with 24 px targets (screenshots saved to look at);
 * - a saved session (no file kept): the screen says before printing that the handouts go without
 *   own results, and the printed sheets have none.
 * What the pages must show comes from lib/ (handoutSheet, the engine), never from the page.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { WORKER_HANDOVER_KEY } from '../../lib/checkups/workerHandOverKey';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '../../lib/evidence/demo';
import { DEFAULT_BLOCKS, HANDOUT_HISTORY_KEY, handOverRecord, handoutSheet } from '../../lib/handout';
import type { Scenario } from '../../lib/scenario/schema';
import { baselineOf, DEMO_HEART_FAILURE_10Y } from '../../lib/tables';
import { CAUTION_HEADING, CAUTION_TEXT } from '../../lib/wording';
import { W001_CHECKUPS } from '../unit/checkups/fixtures'; // W001's checkups as in the file: what the consultation screen hands /handout
import { openHandout } from './handoutSupport';
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

/**
 * Each worker's own results as the sheet words them (lib/wording/ownResults.ts), written by hand
 * from their rows in demo/checkups/checkups.csv: the lowest and highest value of each test, how
 * many checkups, "yearly" when each follows the one before by 6 to 18 months (they do: 9 to 14
 * months apart), the first and last year; all HbA1c results in the prediabetes range (ADA 5.7–6.4%).
 */
const PRINTED = [
  {
    worker: 'W001', // lines 3–7
    scenario: workerScenario(54, 'female'),
    own: [
      'Your HbA1c was between 5.9% and 6.2% at five yearly checkups, from 2021 to 2025.',
      'Your fasting blood sugar (glucose) was between 5.2 mmol/L and 5.6 mmol/L at five yearly checkups, from 2021 to 2025.',
    ],
  },
  {
    worker: 'W007', // lines 30–34
    scenario: workerScenario(63, 'male'),
    own: [
      'Your HbA1c was between 6.1% and 6.4% at five yearly checkups, from 2021 to 2025.',
      'Your fasting blood sugar (glucose) was between 5.2 mmol/L and 5.6 mmol/L at five yearly checkups, from 2021 to 2025.',
    ],
  },
  {
    worker: 'W012', // lines 53–56
    scenario: workerScenario(61, 'female'),
    own: [
      'Your HbA1c was between 5.9% and 6.2% at four yearly checkups, from 2022 to 2025.',
      'Your fasting blood sugar (glucose) was between 5.2 mmol/L and 5.5 mmol/L at four yearly checkups, from 2022 to 2025.',
    ],
  },
] as const;
/** Each word of a PDF page and where it is (pdftotext -bbox), to compare two printed layouts. */
function wordBoxes(pdfPath: string, pageNumber: number): { word: string; x: number; y: number }[] {
  const xml = execFileSync('pdftotext', ['-bbox', '-f', String(pageNumber), '-l', String(pageNumber), pdfPath, '-']).toString();
  return [...xml.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="[\d.]+" yMax="[\d.]+">([^<]*)<\/word>/g)].map((m) => ({ word: m[3] ?? '', x: Number(m[1]), y: Number(m[2]) }));
}

/** The last sentences of every worker's own results (lib/wording/ownResults.ts: always said; ADA is the run's criteria set). */
const OWN_ALWAYS = ['Your own results', 'A range is not a diagnosis.', 'Ranges as set by the American Diabetes Association (ADA).'];

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
  PRINTED.forEach(({ worker, scenario, own }, i) => {
    const sheet = handoutSheet(scenario, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: new Date(), paper: 'a4', table: DEMO_HEART_FAILURE_10Y });
    if (!sheet.ok) throw new Error(`${worker}'s scenario must give a sheet`);
    const text = a4.pages[i] ?? '';
    expect(text, worker).toContain(squash(sheet.value.text.reference.caption));
    expect(text, worker).toContain(squash(sheet.value.text.exposed.caption));
    expect(text, worker).toContain(`${CAUTION_HEADING} ${squash(CAUTION_TEXT)}`);
    expect(text.toLowerCase(), worker).toContain('illustrative figures \u2014 not for patients');
    for (const sentence of [...own, ...OWN_ALWAYS]) expect(text, worker).toContain(sentence);
    // no worker id anywhere on the page, nor another worker's own results
    expect(text, worker).not.toMatch(/W0\d\d/);
    for (const other of PRINTED) if (other.worker !== worker) expect(text, worker).not.toContain(other.own[0]);
  });
  // Exactly /handout's sheet: W001's handout made on /handout from the same scenario and the same
  // history (handed over as the consultation screen hands it) prints every word in the same place.
  const handout = await page.context().newPage();
  await handout.addInitScript(([key, value]) => window.sessionStorage.setItem(key, value), [HANDOUT_HISTORY_KEY, handOverRecord(PRINTED[0].scenario, { criteria: 'ADA', checkups: W001_CHECKUPS })] as const);
  await openHandout(handout, PRINTED[0].scenario);
  await expect(handout.getByTestId('handout-own-results')).toBeVisible();
  const handoutPdf = path.join(OUT, 'handout-w001-a4.pdf');
  writeFileSync(handoutPdf, await handout.pdf({ preferCSSPageSize: true, printBackground: true }));
  await handout.close();
  const alone = wordBoxes(handoutPdf, 1);
  const inBatch = wordBoxes(path.join(OUT, 'ticked-a4.pdf'), 1);
  expect(inBatch.map((w) => w.word)).toEqual(alone.map((w) => w.word));
  inBatch.forEach((w, i) => {
    expect(Math.abs(w.x - (alone[i]?.x ?? NaN)), `"${w.word}" across`).toBeLessThan(0.5); // points
    expect(Math.abs(w.y - (alone[i]?.y ?? NaN)), `"${w.word}" down`).toBeLessThan(0.5);
  });

  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: 900 });
    const report = await new AxeBuilder({ page }).include('[data-testid="batch"]').withTags(WCAG_TAGS).analyze();
    expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`), `${width} px`).toEqual([]);
    await page.getByTestId('batch').screenshot({ path: path.join(OUT, `batch-controls-${width}.png`) });
    // Every choice: a line of its own across its group, the box and the line at least 24 px (WCAG 2.5.8).
    const choices = await page.getByTestId('batch').locator('fieldset').evaluateAll((sets) =>
      sets.map((set) => {
        const inner = set.getBoundingClientRect();
        return {
          left: inner.left,
          top: inner.top,
          bottom: inner.bottom,
          labels: [...set.querySelectorAll('label')].map((l) => {
            const box = l.getBoundingClientRect();
            const input = l.querySelector('input')?.getBoundingClientRect();
            const words = l.querySelector('span')?.getBoundingClientRect();
            return { width: box.width, height: box.height, top: box.top, setWidth: inner.width, inputWidth: input?.width ?? 0, inputHeight: input?.height ?? 0, wordsWidth: words?.width ?? 0 };
          }),
        };
      }),
    );
    expect(choices).toHaveLength(3);
    for (const set of choices) {
      set.labels.forEach((l, i) => {
        expect(l.inputWidth, `${width} px`).toBeGreaterThanOrEqual(24);
        expect(l.inputHeight, `${width} px`).toBeGreaterThanOrEqual(24);
        expect(l.height, `${width} px`).toBeGreaterThanOrEqual(24);
        expect(l.width, `${width} px: the choice spans its group`).toBeGreaterThan(l.setWidth - 40); // less the group's border and padding
        // the box keeps its own size and the words have the rest of the line (not a thin column beside a stretched box)
        expect(l.inputWidth, `${width} px`).toBeLessThanOrEqual(32);
        expect(l.wordsWidth, `${width} px`).toBeGreaterThan(l.width - l.inputWidth - 24);
        if (i > 0) expect(l.top, `${width} px: one choice per line`).toBeGreaterThan(set.labels[i - 1]?.top ?? Infinity);
      });
    }
    if (width === 390) {
      // On a phone the three groups stand one above the other, each the full width.
      choices.forEach((set, i) => {
        expect(set.left).toBeCloseTo(choices[0]?.left ?? NaN, 0);
        if (i > 0) expect(set.top).toBeGreaterThanOrEqual(choices[i - 1]?.bottom ?? Infinity);
      });
    }
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
  PRINTED.forEach(({ worker, own }, i) => {
    expect(letter.pages[i]).toContain(`Worker ${worker}`);
    expect(letter.pages[i]?.match(/W0\d\d/g)).toEqual([worker]);
    expect(letter.pages[i]).toContain(`${CAUTION_HEADING} ${squash(CAUTION_TEXT)}`);
    for (const sentence of [...own, ...OWN_ALWAYS]) expect(letter.pages[i], worker).toContain(sentence);
  });
  // The id is small print (7 pt; the sheet's text is 12 pt): pdftotext's bounding boxes give each word's height.
  const pdfPath = path.join(OUT, 'ticked-letter-ids.pdf');
  const boxes = execFileSync('pdftotext', ['-bbox', '-f', '1', '-l', '1', pdfPath, '-']).toString();
  const idWord = /<word xMin="[\d.]+" yMin="([\d.]+)" xMax="[\d.]+" yMax="([\d.]+)">W001<\/word>/.exec(boxes);
  expect(idWord).not.toBeNull();
  expect(Number(idWord?.[2]) - Number(idWord?.[1])).toBeLessThan(9); // points: a 7 pt line, where 12 pt text is about 14
});

test('a saved session keeps the rows, not the file: reopened, its batch handouts still carry each worker’s own results, and one worker opens with their history', async ({ page, context }) => {
  test.slow(); // save, reopen and print on a shared machine
  await openAndProcessCheckups(page, DEMO_CHECKUPS);
  // Straight from the file, the screen says nothing of the kind.
  await expect(page.getByTestId('batch-no-file')).toHaveCount(0);
  const name = 'Batch handouts check';
  await page.getByTestId('sessions').getByLabel(/Name for this session/).fill(name);
  await page.getByTestId('sessions').getByRole('button', { name: 'Save the session' }).click();
  await expect(page.getByTestId('sessions-status')).toHaveText('Saved in this browser.', { timeout: 30_000 });
  await page.reload();
  await page.getByRole('button', { name: `Open ${name}` }).click();
  await expect(page.getByTestId('summary')).toBeVisible({ timeout: 30_000 });
  // The session's rows give the own results (the worker keeps them): nothing to say before printing.
  await expect(page.getByTestId('batch-no-file')).toHaveCount(0);
  await page.getByLabel('Tick W001', { exact: true }).check();
  await page.getByLabel(/^The workers ticked in the worklist/).check();
  await page.getByRole('button', { name: 'Prepare the handout' }).click();
  await expect(page.getByTestId('batch-print')).toHaveAttribute('data-ready', 'true');
  const a4 = await printPages(page, 'session-a4');
  expect(a4.pages).toHaveLength(1);
  const text = a4.pages[0] ?? '';
  const sheet = handoutSheet(PRINTED[0].scenario, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: new Date(), paper: 'a4', table: DEMO_HEART_FAILURE_10Y });
  if (!sheet.ok) throw new Error('W001 must get a sheet');
  expect(text).toContain(squash(sheet.value.text.exposed.caption));
  expect(text).toContain(`${CAUTION_HEADING} ${squash(CAUTION_TEXT)}`);
  // W001's own results, the same sentences as a batch straight from the file (demo/checkups/checkups.csv lines 3–7).
  expect(text).toContain('Your own results');
  for (const sentence of PRINTED[0].own) expect(text).toContain(sentence);
  // Open one worker from the reopened session: the history comes from the session's rows too.
  const row = page.getByTestId('worklist').locator('tr[data-worker="W001"]');
  const [tab] = await Promise.all([context.waitForEvent('page'), row.getByRole('button', { name: 'Open W001 in the consultation screen (new tab)' }).click()]);
  await expect(tab.getByTestId('result')).toBeVisible({ timeout: 30_000 });
  await expect(tab.getByTestId('glucose-row')).toHaveCount(5); // W001's five checkups, lines 3–7
  await expect(tab.getByTestId('glucose-match')).toContainText('This history fits the study\u2019s exposure.');
  await tab.close();
  await page.getByRole('button', { name: `Delete ${name}` }).click();
  await page.getByRole('group', { name: `Delete the session ${name}?` }).getByRole('button', { name: 'Delete', exact: true }).click();
});

/**
 * An invented workforce for a long batch: 600 workers (X0001 …), three yearly HbA1c results each
 * in the prediabetes range (ADA 5.7–6.4%), ages 40 to 69, women and men in turn, so all 600 fit the
 * demo study's exposure.
 */
function inventedWorkforce(): string {
  const lines = ['Worker,Checkup date,HbA1c (%),Age,Sex'];
  for (let w = 1; w <= 600; w++) {
    for (let y = 0; y < 3; y++) lines.push(`X${String(w).padStart(4, '0')},${2022 + y}-04-${String(1 + (w % 28)).padStart(2, '0')},${(5.8 + ((w + y) % 5) / 10).toFixed(1)},${40 + (w % 30) + y},${w % 2 ? 'female' : 'male'}`);
  }
  return `${lines.join('\n')}\n`;
}

test('a long batch shows its progress and can be cancelled: nothing is kept, and Prepare is back', async ({ page }) => {
  test.slow();
  await openAndProcessCheckups(page, { name: 'invented.csv', mimeType: 'text/csv', buffer: Buffer.from(inventedWorkforce()) });
  await page.getByLabel(/^All workers who fit the exposure/).check();
  const prepare = page.getByRole('button', { name: 'Prepare 600 handouts' });
  await prepare.click();
  const progress = page.getByTestId('batch-progress');
  await expect(progress.getByRole('progressbar')).toBeVisible();
  await expect(progress).toContainText(/Reading the chosen workers’ results again from the file…|Preparing handout \d+ of 600…/);
  await expect(prepare).toBeDisabled();
  await page.getByRole('button', { name: 'Cancel', exact: true }).click();
  await expect(progress).toHaveCount(0);
  await expect(page.getByTestId('batch-print')).toHaveCount(0); // the prepared pages are gone with the job
  await expect(page.getByTestId('batch-status')).toHaveText('');
  await expect(prepare).toBeEnabled();
  await expect(page.getByTestId('batch-print-button')).toHaveCount(0);
});
