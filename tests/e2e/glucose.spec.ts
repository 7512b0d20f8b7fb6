/**
 * The glucose history on the consultation screen, as an occupational physician uses it: with the
 * demo workforce cohort chosen (its exposure: 3 yearly results in a row in the prediabetes range,
 * ADA), rows copied from a spreadsheet are pasted, each checkup shows its range with the body's
 * name, and the screen says whether the history fits the study's exposure — and, when it does
 * not, why, with the mismatch warning added to the result. A latest result in the diabetes range
 * shows the prominent note, and the word "diabetes" only ever appears as "diabetes range".
 *
 * What the screen must say is worked out from lib/glycaemia on the same pasted text (the paste
 * reader, then the screen's view), never read back from the page. The checkup histories are
 * invented, with dates in 2021–2025 so that none is in the future.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '../../lib/evidence/demo';
import { CRITERIA } from '../../lib/glycaemia/criteria';
import { localIsoDate } from '../../lib/glycaemia/dates';
import type { ExposureDefinition } from '../../lib/glycaemia/exposure';
import { parsePastedRows } from '../../lib/glycaemia/paste';
import { glucoseHistoryView, type GlucoseHistoryView } from '../../lib/glycaemia/view';
import { DEMO_HEART_FAILURE_10Y } from '../../lib/tables/demo';
import { consultationReady, field } from './support';

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const ENTRY = DEMO_WORKFORCE_HBA1C_HEART_FAILURE;
const EXPOSURE: ExposureDefinition = (() => {
  const exposure = ENTRY.exposureDefinition;
  if (!exposure) throw new Error('the demo workforce cohort carries an exposure definition');
  return exposure;
})();

/** The component's own lead lines (app/components/glucose/GlucoseHistory.tsx). */
const FITS = 'This history fits the study\u2019s exposure.';
const DOES_NOT_FIT = 'This history does not fit the study\u2019s exposure.';

/**
 * Rows as a spreadsheet puts them on the clipboard: cells separated by tabs, lines ending in CRLF,
 * a header line first, an empty cell where a test was not done.
 */
function spreadsheet(rows: readonly (readonly string[])[]): string {
  const header = ['Date', 'HbA1c', 'Unit', 'Fasting glucose', 'Unit'];
  return [header, ...rows].map((cells) => `${cells.join('\t')}\r\n`).join('');
}

/**
 * Four yearly checkups in the prediabetes range under ADA (HbA1c 5.7–6.4%, fasting glucose
 * 100–125 mg/dL; ADA Standards of Care, section 2, as in lib/glycaemia/criteria.ts), one HbA1c in
 * mmol/mol and one glucose in mmol/L, which the screen converts to ADA's units: 44 mmol/mol is
 * (44 + 23.5) / 10.93 = 6.18% (the master equation solved for %, Hoelzel et al. 2004, Clin Chem
 * 50:166; hand-computed), 5.8 mmol/L is 5.8 × 18.016 = 104.5 mg/dL (methods guide; hand-computed).
 * Invented values.
 */
const FITTING = spreadsheet([
  ['2022-03-14', '6.0', '%', '104', 'mg/dL'],
  ['2023-03-20', '6.1', '%', '', ''],
  ['2024-03-11', '44', 'mmol/mol', '5.8', 'mmol/L'],
  ['2025-03-17', '6.3', '%', '112', 'mg/dL'],
]);

/**
 * Prediabetes-range results, but a gap of 27 months (2022-03 to 2024-06, more than the 18 that
 * break a run) leaves only 2 yearly results in the run: fewer than the study's 3. Invented values.
 */
const GAPPED = spreadsheet([
  ['2021-03-08', '5.9', '%', '101', 'mg/dL'],
  ['2022-03-07', '6.0', '%', '', ''],
  ['2024-06-10', '6.1', '%', '108', 'mg/dL'],
  ['2025-06-16', '6.2', '%', '', ''],
]);

/**
 * Two yearly results in the prediabetes range, then a latest one in the diabetes range under ADA
 * (HbA1c ≥ 6.5%, fasting glucose ≥ 126 mg/dL; ADA Standards of Care, section 2). Invented values.
 */
const LATEST_IN_DIABETES_RANGE = spreadsheet([
  ['2023-04-03', '6.1', '%', '106', 'mg/dL'],
  ['2024-04-08', '6.3', '%', '118', 'mg/dL'],
  ['2025-04-07', '6.8', '%', '131', 'mg/dL'],
]);

/** What the screen must show for a pasted text, from lib: the paste reader, then the view. */
function expectedView(text: string): GlucoseHistoryView {
  const pasted = parsePastedRows(text, EXPOSURE.criteria);
  if (pasted.issues.length > 0) throw new Error(`the test paste must read cleanly: ${JSON.stringify(pasted.issues)}`);
  const view = glucoseHistoryView({ drafts: pasted.rows, criteria: EXPOSURE.criteria, today: localIsoDate(), exposure: EXPOSURE });
  if (view.status !== 'ready') throw new Error(`the test rows must be valid: ${view.errorLines.join('; ')}`);
  return view;
}

/** A result on screen: a 52-year-old man, baseline from the demo table, the workforce cohort chosen. */
async function openWithWorkforceCohort(page: Page): Promise<void> {
  await page.goto('/');
  await consultationReady(page);
  await field(page, 'tableId').selectOption(DEMO_HEART_FAILURE_10Y.id);
  await field(page, 'person.age').fill('52');
  await field(page, 'person.sex').selectOption('male');
  await field(page, 'evidenceId').selectOption(ENTRY.id);
  await expect(page.getByTestId('result')).toBeVisible();
  await expect(field(page, 'effect.estimate')).toHaveValue(String(ENTRY.effect.estimate));
}

async function openGlucoseHistory(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Check the person’s glucose history against the study’s exposure' }).click();
  await expect(page.getByTestId('glucose-history')).toBeVisible();
}

/** Pastes the text into the paste box through the clipboard, as Ctrl+V would, and adds the rows. */
async function paste(page: Page, text: string): Promise<void> {
  const box = page.getByLabel('Paste rows from a spreadsheet', { exact: true });
  await page.evaluate((t) => navigator.clipboard.writeText(t), text);
  await box.focus();
  await page.keyboard.press('ControlOrMeta+V');
  await expect(box).toHaveValue(text.replace(/\r\n/g, '\n'));
  await page.getByRole('button', { name: 'Add pasted rows' }).click();
}

/** Each checkup's row in the table: its date and its range with the body's name. */
async function expectCheckups(page: Page, view: GlucoseHistoryView): Promise<void> {
  const history = page.getByTestId('glucose-history');
  const rows = history.locator('table.glucose__table tbody tr');
  await expect(rows).toHaveCount(view.checkups.length);
  for (const [index, checkup] of view.checkups.entries()) {
    expect(checkup.label).toContain(`(${CRITERIA[EXPOSURE.criteria].id}`);
    await expect(rows.nth(index).getByRole('rowheader')).toHaveText(checkup.date);
    await expect(rows.nth(index).locator('td').nth(2)).toContainText(checkup.label);
    await expect(history.locator('.glucose__sentences li').nth(index)).toContainText(checkup.sentence);
  }
  if (view.runText) await expect(history.locator('.glucose__run')).toHaveText(view.runText);
}

/** The match box: its lead line and every reason, in order. */
async function expectMatch(page: Page, view: GlucoseHistoryView): Promise<void> {
  if (!view.match) throw new Error('the view must carry a match with the exposure');
  const shown = page.getByTestId('glucose-match');
  await expect(shown.locator('.glucose__match-lead')).toHaveText(view.match.matches ? FITS : DOES_NOT_FIT);
  await expect(shown.locator('li')).toHaveText([...view.match.reasons]);
}

const mismatchWarning = (page: Page) => page.locator('[data-testid="warnings"] li[data-code="exposure-mismatch"]');

/**
 * Text in which "diabetes" stands alone as a word but not as "diabetes range": a diagnosis. The
 * bodies' names and documents ("American Diabetes Association", "Standards of Care in Diabetes")
 * are taken out first; "prediabetes" and "non-diabetic" are other words.
 */
function diagnosisWords(text: string): string[] {
  let rest = text;
  for (const body of Object.values(CRITERIA)) rest = rest.split(body.name).join(' ').split(body.source).join(' ');
  return [...rest.matchAll(/.{0,40}\bdiabetes\b(?! range).{0,40}/gis)].map((m) => m[0]);
}

test.beforeEach(async ({ page, context, baseURL }) => {
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL ?? '' });
  await openWithWorkforceCohort(page);
  await openGlucoseHistory(page);
  await expect(page.getByTestId('glucose-history')).toContainText(expectedView(FITTING).exposureText ?? '');
  // No history yet, so no match and no mismatch warning on the result.
  await expect(page.getByTestId('glucose-match')).toHaveCount(0);
  await expect(mismatchWarning(page)).toHaveCount(0);
});

test('a pasted history that fits the exposure shows each range, the match message and no warning; axe finds nothing', async ({ page }) => {
  // 4 yearly results in the prediabetes range (ADA), at least the 3 the study needed.
  const view = expectedView(FITTING);
  expect(view.match?.matches).toBe(true);
  const history = page.getByTestId('glucose-history');
  await paste(page, FITTING);
  await expect(history.getByRole('status')).toHaveText('Added 4 rows (header line skipped).');
  await expect(history.locator('.glucose__status')).toHaveText(view.statusText);
  await expectCheckups(page, view);
  await expectMatch(page, view);
  await expect(mismatchWarning(page)).toHaveCount(0);
  await expect(page.getByTestId('glucose-diabetes-range-note')).toHaveCount(0);
  await expect(page.getByTestId('diabetes-range-note')).toHaveCount(0);
  await expect(page.getByTestId('glucose-chart-hba1c')).toBeVisible();
  await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
  await history.screenshot({ path: 'test-results/screens/glucose-fits.png' });

  const report = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
});

test('a pasted history with a gap of more than 18 months shows the mismatch, why, and the warning on the result', async ({ page }) => {
  // The gap leaves 2 yearly results in the run: the reason in plain words, and a warning.
  const view = expectedView(GAPPED);
  const match = view.match;
  if (!match?.warning) throw new Error('the gapped history must not fit the exposure');
  expect(match.warning.code).toBe('exposure-mismatch');
  expect(match.reasons[0]).toMatch(/needed 3 yearly results in the prediabetes range \(ADA, by HbA1c\); this history has 2\b/);
  expect(match.reasons.join(' ')).toMatch(/gap of \d+ months .*more than 18 months/);
  const history = page.getByTestId('glucose-history');
  await paste(page, GAPPED);
  await expect(history.locator('.glucose__status')).toHaveText(view.statusText);
  await expectCheckups(page, view);
  await expectMatch(page, view);
  await expect(mismatchWarning(page)).toHaveText(match.warning.message);
  await expect(mismatchWarning(page)).toContainText('this history has 2');
  await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
  await history.screenshot({ path: 'test-results/screens/glucose-gap.png' });

  // On a 320-pixel screen the section reflows: only the checkup table scrolls, inside its region.
  await page.setViewportSize({ width: 320, height: 800 });
  await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
  await expect(history.getByRole('region', { name: `Each checkup under ${CRITERIA[EXPOSURE.criteria].name}` })).toBeVisible();

  // Closing the section takes the warning off the result again.
  await page.getByRole('button', { name: 'Close the glucose history' }).click();
  await expect(history).toHaveCount(0);
  await expect(mismatchWarning(page)).toHaveCount(0);
});

test('a latest result in the diabetes range shows the prominent note and never "diabetes" as a diagnosis', async ({ page }) => {
  const view = expectedView(LATEST_IN_DIABETES_RANGE);
  const note = view.diabetesRangeNote;
  if (!note || !view.match?.warning) throw new Error('a latest result in the diabetes range carries the note and does not fit a prediabetes exposure');
  expect(view.checkups.at(-1)?.label).toBe('diabetes range (ADA)');

  await paste(page, LATEST_IN_DIABETES_RANGE);
  await expectCheckups(page, view);
  await expectMatch(page, view);
  // Prominent in the section, beside the result, and among the result's warnings.
  const sectionNote = page.getByTestId('glucose-diabetes-range-note');
  await expect(sectionNote.getByRole('heading')).toHaveText('Note: a result in the diabetes range');
  await expect(sectionNote).toContainText(note.message);
  await expect(sectionNote).toContainText('Evidence about the prediabetes range does not apply');
  await expect(sectionNote).toContainText('One result is not a diagnosis');
  await expect(page.getByTestId('diabetes-range-note')).toContainText(note.message);
  await expect(page.locator('[data-testid="warnings"] li[data-code="diabetes-range-latest"]')).toHaveText(note.message);
  await expect(mismatchWarning(page)).toHaveText(view.match.warning.message);
  await expect(page.getByTestId('settling')).toHaveAttribute('aria-busy', 'false');
  await page.getByTestId('glucose-history').screenshot({ path: 'test-results/screens/glucose-diabetes-range.png' });

  const shown = [await page.getByTestId('glucose-history').innerText(), await page.getByTestId('result').innerText()].join('\n');
  expect(shown).toContain('diabetes range');
  expect(diagnosisWords(shown)).toEqual([]);

  // The whole page is checked in the fitting state; here the parts this state adds.
  const report = await new AxeBuilder({ page })
    .withTags(WCAG_TAGS)
    .include('[data-testid="glucose-history"]')
    .include('[data-testid="diabetes-range-note"]')
    .include('[data-testid="warnings"]')
    .analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
});

/** The rows' date fields, in order. */
const dateFields = (page: Page) => page.getByTestId('glucose-row').getByLabel('Date', { exact: true });

/** What the rows' date fields hold, in order. */
async function expectDates(page: Page, dates: readonly string[]): Promise<void> {
  await expect.poll(() => dateFields(page).evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value))).toEqual(dates);
}

test('closing the glucose history keeps its rows; opening it again brings back the rows, the match and the warning', async ({ page }) => {
  const view = expectedView(GAPPED);
  const history = page.getByTestId('glucose-history');
  await paste(page, GAPPED);
  await expectMatch(page, view);
  await expect(mismatchWarning(page)).toHaveCount(1);

  await page.getByRole('button', { name: 'Close the glucose history' }).click();
  await expect(history).toHaveCount(0);
  await expect(mismatchWarning(page)).toHaveCount(0);
  await expect(page.getByTestId('glucose-kept')).toHaveText(
    '4 checkup rows are kept while the glucose history is closed; the result does not use them until you open it again.',
  );

  await openGlucoseHistory(page);
  await expect(page.getByTestId('glucose-row')).toHaveCount(4);
  await expectDates(page, ['2021-03-08', '2022-03-07', '2024-06-10', '2025-06-16']);
  await expectCheckups(page, view);
  await expectMatch(page, view);
  await expect(mismatchWarning(page)).toHaveText(view.match?.warning?.message ?? '');
});

test('a paste with a header row is read by column name, in any order, with units in the header', async ({ page }) => {
  // The FITTING checkups again, columns in another order and named the way a lab export might:
  // accents, capitals, units in the header or in a unit column of their own, an unused column.
  const text = [
    ['Glycémie à jeun', 'UNITÉ', 'Datum', 'HbA1c (%)', 'Bemerkung'],
    ['104', 'mg/dL', '14.03.2022', '6.0', 'x'],
    ['', '', '20.03.2023', '6.1', ''],
    ['5.8', 'mmol/L', '11.03.2024', '', ''],
    ['112', 'mg/dL', '17.03.2025', '6.3', ''],
  ]
    .map((cells) => `${cells.join('\t')}\r\n`)
    .join('');
  const pasted = parsePastedRows(text, EXPOSURE.criteria);
  expect(pasted.issues).toEqual([]);
  const view = glucoseHistoryView({ drafts: pasted.rows, criteria: EXPOSURE.criteria, today: localIsoDate(), exposure: EXPOSURE });
  expect(view.status).toBe('ready');
  await paste(page, text);
  await expect(page.getByTestId('glucose-history').getByRole('status')).toHaveText('Added 4 rows (header line skipped; column "Bemerkung" not used).');
  await expectDates(page, ['2022-03-14', '2023-03-20', '2024-03-11', '2025-03-17']);
  await expectCheckups(page, view);
  await expectMatch(page, view);
});

test('a paste whose cells are out of order says why, in words that fit the page', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  const long = 'z'.repeat(3000);
  await paste(page, `2024-03-11\t5.7\t5.6\n2024-03-12\t6.0\t${long}\n`);
  const report = page.locator('.glucose__report');
  await expect(report.locator('li').first()).toContainText('the HbA1c unit cell holds the number "5.6", not a unit (% or mmol/mol)');
  await expect(report).not.toContainText('"5.6" is not an HbA1c unit');
  await expect(report.locator('li').nth(1)).toContainText(`"${'z'.repeat(23)}…" is not an HbA1c unit`);
  await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
});

test('pasting over rows asks to replace or add; replacing leaves only the new person’s rows', async ({ page }) => {
  await paste(page, FITTING);
  await expect(page.getByTestId('glucose-row')).toHaveCount(4);
  await paste(page, GAPPED);
  const choice = page.getByTestId('glucose-import-choice');
  await expect(choice).toContainText('The paste gave 4 rows, and 4 rows are already in the history.');
  // Nothing joined the history yet.
  await expect(page.getByTestId('glucose-row')).toHaveCount(4);
  await expectMatch(page, expectedView(FITTING));
  const axe = await new AxeBuilder({ page }).withTags(WCAG_TAGS).include('[data-testid="glucose-history"]').analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);

  // The question has the focus: Enter on its first button replaces.
  await page.keyboard.press('Enter');
  await expect(choice).toHaveCount(0);
  await expectDates(page, ['2021-03-08', '2022-03-07', '2024-06-10', '2025-06-16']);
  await expectMatch(page, expectedView(GAPPED));

  // Adding instead keeps both: 4 + 3 rows.
  await paste(page, LATEST_IN_DIABETES_RANGE);
  await page.getByRole('button', { name: 'Add to the rows (same person)' }).click();
  await expect(page.getByTestId('glucose-row')).toHaveCount(7);
});

test('"Clear all rows" empties the history and can be undone', async ({ page }) => {
  await paste(page, FITTING);
  await page.getByRole('button', { name: 'Clear all rows' }).click();
  await expect(page.getByTestId('glucose-row')).toHaveCount(1);
  await expectDates(page, ['']);
  await expect(page.getByTestId('glucose-match')).toHaveCount(0);
  await expect(page.getByTestId('glucose-cleared')).toContainText('4 rows were cleared.');
  const axe = await new AxeBuilder({ page }).withTags(WCAG_TAGS).include('[data-testid="glucose-history"]').analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
  await page.getByRole('button', { name: 'Undo: bring the rows back' }).click();
  await expect(page.getByTestId('glucose-row')).toHaveCount(4);
  await expectMatch(page, expectedView(FITTING));
});

test('after "Add a checkup" by keyboard, typing goes into the new row’s date', async ({ page }) => {
  const history = page.getByTestId('glucose-history');
  await history.getByLabel('Fasting glucose', { exact: true }).click();
  await page.keyboard.type('104');
  // Fasting glucose → its unit → Remove → Add a checkup.
  await page.keyboard.press('Tab');
  await page.keyboard.press('Tab');
  await page.keyboard.press('Tab');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('glucose-row')).toHaveCount(2);
  await page.keyboard.type('2024-03-11');
  await expectDates(page, ['', '2024-03-11']);
});

test('at 390 px the section fits the page; the checkup table scrolls in its own region', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await paste(page, FITTING);
  await expectCheckups(page, expectedView(FITTING));
  await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  const region = page.getByTestId('glucose-history').getByRole('region', { name: `Each checkup under ${CRITERIA[EXPOSURE.criteria].name}` });
  const box = await region.boundingBox();
  expect(box?.x ?? -1).toBeGreaterThanOrEqual(0);
  expect((box?.x ?? 0) + (box?.width ?? 1000)).toBeLessThanOrEqual(390);
  await page.getByTestId('glucose-history').screenshot({ path: 'test-results/screens/glucose-390.png' });
  const report = await new AxeBuilder({ page }).withTags(WCAG_TAGS).include('[data-testid="glucose-history"]').analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
});

test('on a desktop the chart is wide enough for every date, and its text alternative is read once', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  const view = expectedView(FITTING);
  await paste(page, FITTING);
  const series = view.timeline?.series.find((s) => s.test === 'hba1c');
  if (!series) throw new Error('the fitting history has HbA1c results');
  const chart = page.getByTestId('glucose-chart-hba1c');
  // (recharts' own svg inside the picture also has the img role, with no name of its own.)
  await expect(chart.getByRole('img', { name: series.summary, exact: true })).toHaveCount(1);
  // The figure is named by its short title, not by the sentence again.
  await expect(page.getByRole('figure', { name: `${series.title} over time` })).toBeVisible();
  // The sentence is on the page once, and only the picture carries it for a screen reader.
  await expect(page.getByText(series.summary, { exact: true })).toHaveCount(1);
  await expect(page.getByText(series.summary, { exact: true })).toHaveAttribute('aria-hidden', 'true');
  // Every checkup's date is written on the axis.
  for (const point of series.points) await expect(chart.locator('svg text', { hasText: point.date })).toHaveCount(1);
  await page.getByTestId('glucose-history').screenshot({ path: 'test-results/screens/glucose-desktop.png' });
});

test('"Prepare handout" carries the pasted history: the sheet prints the person’s own results in plain words (issue 12 item 15)', async ({ page }) => {
  await paste(page, FITTING);
  // Hand-written: HbA1c 6.0%, 6.1%, 44 mmol/mol = 6.2% (hand-computed above; mixed units, so all in
  // ADA's %), 6.3%, one a year from 2022 to 2025.
  const sentence = 'Your HbA1c was between 6.0% and 6.3% at four yearly checkups, from 2022 to 2025.';
  await expect(page.getByTestId('glucose-own-results')).toContainText(sentence);
  await page.getByTestId('prepare-handout').click();
  await expect(page).toHaveURL(/\/handout#/);
  const own = page.getByTestId('handout-own-results');
  await expect(own).toContainText('Your own results');
  await expect(own).toContainText(sentence);
  await expect(own).toContainText('A range is not a diagnosis.');
  await page.screenshot({ path: 'test-results/screens/glucose-handout-own-results.png', fullPage: true });
});

test('an exposure definition typed on the screen is the one the history is checked against (issue 9 item 1)', async ({ page }) => {
  // Start from the demo entry, then say the study counted HbA1c alone with no gap over 12 months:
  // the 2024 checkup's 44 mmol/mol is in the prediabetes range, so the run still holds.
  const exposure = page.getByTestId('exposure-definition');
  await expect(field(page, 'exposure.defined')).toHaveValue('yes');
  await field(page, 'exposure.test').selectOption('hba1c');
  await field(page, 'exposure.minYears').selectOption('5');
  await expect(page.getByTestId('glucose-history')).toContainText('5 yearly results in a row in the prediabetes range (ADA), decided by HbA1c alone');
  await paste(page, FITTING);
  // Four yearly results cannot make the five now asked for.
  await expect(page.getByTestId('glucose-match').locator('.glucose__match-lead')).toHaveText(DOES_NOT_FIT);
  await expect(mismatchWarning(page)).toHaveCount(1);
  // The link carries it: a reload keeps the definition and the check.
  await expect(page).toHaveURL(/&x=/);
  await page.reload();
  await expect(field(page, 'exposure.test')).toHaveValue('hba1c');
  await expect(field(page, 'exposure.minYears')).toHaveValue('5');
  await expect(exposure).toBeVisible();
});
