/**
 * The clinic library end to end, as a clinician uses it on the consultation screen: import a
 * population table from a CSV file (docs/table-format.md), check its preview, save it, use it
 * for the baseline, and find it again after a reload; a file with a problem shows each problem
 * with its row and column and saves nothing; an evidence entry saved to the library survives a
 * reload. The expected figures and problems come from the engine (lib/), never from the page.
 *
 * Every test starts in a fresh browser context, so each has its own empty IndexedDB.
 * The tables and the evidence here are invented: illustrative numbers, not from a real
 * population or study.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { parseTableCsv } from '../../lib/tables/csv';
import { expectScreenShows, field, fillTypedScenario, TYPED_SCENARIO } from './support';
import { chooseCsv, details, fillEvidence, GOOD_CSV, goodTable, listedTables, openLibrary, savedTables, TABLE_TITLE, tableScenario } from './librarySupport';

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** Row 10 overlaps row 9 (55 to 120 against 40 to 59) and row 11 has a risk of 1.5. */
const BAD_CSV = `${details('Broken test table')}
sex,age_from,age_to,risk
female,40,59,0.03
female,55,120,0.07
male,40,59,1.5
male,60,120,0.09
`;

test('the import preview shows the file’s details and rows, saves nothing until confirmed, and passes axe', async ({ page }) => {
  await page.goto('/');
  const library = await openLibrary(page);
  await expect(library).toContainText('No tables saved yet');
  // Under "Population tables" (level 3 on this screen), one level down.
  await expect(library.getByRole('heading', { name: 'Import a table from a CSV file', level: 4 })).toBeVisible();

  await chooseCsv(library, 'test-district.csv', GOOD_CSV);
  await expect(library).toContainText('test-district.csv: no problems found. Check the preview, then save.');
  const preview = library.locator('.library__preview');
  await expect(preview.locator('dl')).toContainText(TABLE_TITLE);
  await expect(preview.locator('dl')).toContainText('a first stroke');
  await expect(preview.getByRole('table')).toContainText('First 4 of 4 rows');
  // Each row of the file, numbered as a spreadsheet numbers it (the header is row 8).
  const rows = preview.locator('tbody tr');
  await expect(rows).toHaveCount(4);
  await expect(rows.nth(0)).toHaveText(['9', 'female', '40', '59', '0.03'].join(''));
  await expect(rows.nth(3)).toHaveText(['12', 'male', '60', '120', '0.09'].join(''));
  await expect(library.getByRole('button', { name: 'Save table' })).toBeEnabled();
  // Nothing is saved before the clinician confirms.
  await expect(savedTables(library)).toHaveCount(0);

  await library.scrollIntoViewIfNeeded();
  await library.screenshot({ path: 'test-results/screens/library-import-preview.png' });
  const report = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  expect(report.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join('; ')}`)).toEqual([]);
});

test('a CSV table imported and saved is used for the baseline, and after a reload it is still listed and usable', async ({ page }) => {
  const table = goodTable();
  await page.goto('/');
  const library = await openLibrary(page);
  await chooseCsv(library, 'test-district.csv', GOOD_CSV);
  await expect(library).toContainText('test-district.csv: no problems found. Check the preview, then save.');
  await expect(library.locator('.library__preview tbody tr')).toHaveCount(4);

  await library.getByRole('button', { name: 'Save table' }).click();
  await expect(library).toContainText(`Saved “${TABLE_TITLE}” (4 strata) as ${table.id}.`);
  await expect(savedTables(library)).toHaveCount(1);
  const item = library.getByRole('article', { name: TABLE_TITLE });
  await expect(item).toContainText('4 strata: female and male, ages 40 and over; risks over 10 years');
  // Saving alone does not switch the open consultation to the new table (issue 12 item 14): the clinician asks.
  await expect(item).not.toContainText('(in use)');
  await expect(field(page, 'tableId')).not.toHaveValue(table.id);
  await library.getByRole('button', { name: 'Use it for this consultation' }).click();
  await expect(item).toContainText('(in use)');

  // Asked, the table is picked for this consultation; it needs the age and sex.
  await expect(field(page, 'tableId')).toHaveValue(table.id);
  await field(page, 'person.age').fill('64');
  await field(page, 'person.sex').selectOption('female');
  await expect(page.getByTestId('lookup')).toContainText(`${table.population}. Source: ${table.source} (${table.year}).`);
  await expect(page.getByTestId('lookup')).toContainText('Illustrative numbers, not from a real population');
  await fillEvidence(page);
  await expectScreenShows(page, tableScenario(table, { age: 64, sex: 'female' }));

  await page.reload();
  // The address names the library table, and the reloaded form takes it again as the baseline's source.
  await expect(field(page, 'tableId')).toHaveValue(table.id);
  await expectScreenShows(page, tableScenario(table, { age: 64, sex: 'female' }));
  const reopened = await openLibrary(page);
  await expect(savedTables(reopened)).toHaveCount(1);
  const kept = reopened.getByRole('article', { name: TABLE_TITLE });
  await expect(kept).toContainText('4 strata: female and male, ages 40 and over; risks over 10 years');
  await kept.getByRole('button', { name: 'View strata' }).click();
  await expect(kept.getByRole('table')).toContainText('60 and over');
  await kept.getByRole('button', { name: 'Use this table' }).click();
  await expect(field(page, 'tableId')).toHaveValue(table.id);
  await expect(kept).toContainText('(in use)');
  // Another person, so the figures come from the stored table and not from the address.
  await field(page, 'person.age').fill('45');
  await field(page, 'person.sex').selectOption('male');
  await expectScreenShows(page, tableScenario(table, { age: 45, sex: 'male' }));

  // The handout for the same scenario names the clinic's table as the baseline's source.
  await page.getByRole('link', { name: 'Prepare handout' }).click();
  // The scenario travels in the fragment (never sent to the server).
  await expect(page).toHaveURL(/\/handout#/);
  await expect(page.locator('.sheet')).toContainText(`Risk for people like you: ${table.title}. Source: ${table.source} (${table.year}).`);
});

test('a CSV with an overlapping age band and a risk of 1.5 shows each problem with its row and column and saves nothing', async ({ page }) => {
  const checked = parseTableCsv(BAD_CSV);
  if (checked.ok) throw new Error('the bad test table must be refused');
  const codes = checked.issues.map((i) => `${i.code} row ${i.line} ${i.column}`);
  expect(codes).toEqual(['overlapping-age-bands row 10 age_from', 'out-of-range row 11 risk']);

  await page.goto('/');
  const library = await openLibrary(page);
  await chooseCsv(library, 'test-district.csv', GOOD_CSV);
  await library.getByRole('button', { name: 'Save table' }).click();
  await expect(savedTables(library)).toHaveCount(1);
  const before = await listedTables(library);

  await chooseCsv(library, 'broken.csv', BAD_CSV);
  const problems = library.getByRole('alert').filter({ hasText: 'nothing was saved' });
  await expect(problems).toContainText('2 problems in broken.csv — nothing was saved. Correct the file and choose it again.');
  await expect(problems.locator('li')).toHaveText(checked.issues.map((i) => i.message));
  await expect(problems.locator('li').nth(0)).toContainText('Row 10, column age_from:');
  await expect(problems.locator('li').nth(1)).toContainText('Row 11, column risk:');
  // The preview still shows what was read, but there is nothing to save.
  await expect(library.locator('.library__preview tbody tr')).toHaveCount(4);
  await expect(library.getByRole('button', { name: 'Save table' })).toHaveCount(0);
  expect(await listedTables(library)).toEqual(before);

  // Nothing reached the browser's storage either.
  await page.reload();
  const reopened = await openLibrary(page);
  await expect(savedTables(reopened)).toHaveCount(1);
  expect(await listedTables(reopened)).toEqual(before);
  await expect(reopened.getByRole('article', { name: 'Broken test table' })).toHaveCount(0);
});

test('evidence saved to the library survives a reload and fills the evidence again', async ({ page }) => {
  const title = 'Raised blood pressure and a first stroke (test entry)';
  await page.goto('/');
  await fillTypedScenario(page);
  await expectScreenShows(page, TYPED_SCENARIO);

  const library = await openLibrary(page);
  const save = library.getByRole('form', { name: 'Save this evidence to the library' });
  await save.getByLabel('Title in the library').fill(title);
  await save.getByRole('button', { name: 'Save this evidence' }).click();
  await expect(save).toContainText(`Saved as “${title}”.`);
  await expect(library.getByRole('article', { name: title })).toContainText('RR 1.5 (CI 1.2 to 1.9), cohort.');

  await page.reload();
  // Start from an empty form, so the evidence can only come from the library.
  await page.getByRole('button', { name: 'Clear the form' }).click();
  await expect(page.getByTestId('no-result')).toBeVisible();
  const reopened = await openLibrary(page);
  await reopened.getByLabel('Find by words').fill('blood pressure');
  await expect(reopened).toContainText('1 of 1 entries shown');
  const entry = reopened.getByRole('article', { name: title });
  await expect(entry).toContainText('raised blood pressure vs normal blood pressure; outcome: a first stroke.');

  const { baseline, person = {} } = TYPED_SCENARIO;
  if (!('risk' in baseline)) throw new Error('the typed scenario has a risk baseline');
  await page.getByLabel('Enter a risk over a period', { exact: true }).check();
  await field(page, 'riskBaseline.risk').fill(String(baseline.risk));
  await field(page, 'riskBaseline.years').fill(String(baseline.years));
  await field(page, 'person.age').fill(String(person.age));
  if (person.sex !== undefined) await field(page, 'person.sex').selectOption(person.sex);
  await entry.getByRole('button', { name: 'Use this evidence' }).click();
  await expect(field(page, 'evidenceId').locator('option:checked')).toHaveText(title);
  await expect(field(page, 'effect.estimate')).toHaveValue('1.5');
  await expectScreenShows(page, TYPED_SCENARIO);
});
