/**
 * The library open in two tabs of one browser (issue 14 item 1), and the library's rough edges
 * (issue 12): a stale save is refused with a message and the saved version shown; an entry
 * deleted in one tab cannot come back from a stale save in the other; every tab's list
 * refreshes on a change; a workbook given to the CSV import gets one sentence; the delete
 * confirmation takes focus on "Keep it"; the library never widens a 390 px page.
 *
 * Two pages of one browser context share one IndexedDB, as two tabs do. The evidence is the
 * support file's typed scenario (invented, illustrative).
 */
import { expect, test, type Locator, type Page } from '@playwright/test';
import { fillTypedScenario } from './support';
import { openLibrary } from './librarySupport';

const TITLE = 'Raised blood pressure and a first stroke (two tabs)';

function entries(library: Locator): Locator {
  return library.getByRole('region', { name: 'Evidence entries' }).locator('.library__items > li > article');
}

/** Tab A saves the typed evidence; tab B, already open, lists it without a reload. */
async function twoTabsWithOneEntry(page: Page): Promise<{ a: Locator; b: Locator; pageB: Page }> {
  await page.goto('/');
  const pageB = await page.context().newPage();
  await pageB.goto('/');
  const b = await openLibrary(pageB);
  await expect(entries(b)).toHaveCount(0);

  await fillTypedScenario(page);
  const a = await openLibrary(page);
  const save = a.getByRole('form', { name: 'Save this evidence to the library' });
  await save.getByLabel('Title in the library').fill(TITLE);
  await save.getByRole('button', { name: 'Save this evidence' }).click();
  await expect(save).toContainText(`Saved as “${TITLE}”.`);
  // The other tab's list refreshed by itself.
  await expect(b.getByRole('article', { name: TITLE })).toBeVisible();
  return { a, b, pageB };
}

test('two tabs editing one entry: the second save is refused with a message, and the first change is kept', async ({ page }) => {
  const { a, b, pageB } = await twoTabsWithOneEntry(page);
  const itemA = a.getByRole('article', { name: TITLE });
  const itemB = b.getByRole('article', { name: TITLE });
  await itemA.getByRole('button', { name: 'Edit' }).click();
  await itemB.getByRole('button', { name: 'Edit' }).click();

  await itemA.getByLabel('Citation').fill('Changed in tab A');
  await itemA.getByRole('button', { name: 'Save changes' }).click();
  await expect(a.getByRole('article', { name: TITLE })).toContainText('Changed in tab A');

  await itemB.getByLabel('Citation').fill('Changed in tab B');
  await itemB.getByRole('button', { name: 'Save changes' }).click();
  await expect(itemB.getByRole('alert')).toContainText(`Not saved: “${TITLE}” was changed in another tab or window after you opened it`);
  // Tab B now shows the saved version above its form.
  await expect(itemB.locator('.library__meta').filter({ hasText: 'Changed in tab A' })).toBeVisible();

  // Nothing was overwritten: after a reload both tabs show tab A's change.
  await pageB.reload();
  const again = await openLibrary(pageB);
  await expect(again.getByRole('article', { name: TITLE })).toContainText('Changed in tab A');
  await expect(again.getByRole('article', { name: TITLE })).not.toContainText('Changed in tab B');
});

test('an entry deleted in one tab cannot come back from a stale save in the other', async ({ page }) => {
  const { a, b, pageB } = await twoTabsWithOneEntry(page);
  const itemB = b.getByRole('article', { name: TITLE });
  await itemB.getByRole('button', { name: 'Edit' }).click();

  const itemA = a.getByRole('article', { name: TITLE });
  await itemA.getByRole('button', { name: 'Delete…' }).click();
  // The confirmation takes focus on "Keep it" (issue 12 item 12).
  await expect(itemA.getByRole('button', { name: 'Keep it' })).toBeFocused();
  await itemA.getByRole('button', { name: 'Delete', exact: true }).click();
  await expect(entries(a)).toHaveCount(0);

  // Tab B keeps the open form, says the entry is gone, and refuses to save it.
  await expect(itemB).toContainText('This entry was deleted in another tab or window');
  await itemB.getByLabel('Citation').fill('Edited after the delete');
  await itemB.getByRole('button', { name: 'Save changes' }).click();
  await expect(itemB.getByRole('alert').filter({ hasText: 'Not saved' })).toContainText('was deleted in another tab or window after you opened it');

  await expect(entries(a)).toHaveCount(0);
  await pageB.reload();
  const again = await openLibrary(pageB);
  await expect(again).toContainText('No evidence saved yet');
  await expect(entries(again)).toHaveCount(0);
});

test('a workbook given to the CSV import gets one sentence, and the library fits a 390 px phone', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/');
  const library = await openLibrary(page);
  // The start of an .xlsx workbook: a zip whose parts live under xl/ (bytes written for the test).
  const workbook = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]), Buffer.from('[Content_Types].xml'), Buffer.from([0, 0, 0x50, 0x4b, 0x03, 0x04]), Buffer.from('xl/workbook.xml'), Buffer.alloc(64, 0xa7)]);
  await library.getByLabel('Table file (.csv)').setInputFiles({ name: 'district.csv', mimeType: 'text/csv', buffer: workbook });
  const problems = library.getByRole('alert').filter({ hasText: 'nothing was saved' });
  await expect(problems.locator('li')).toHaveCount(1);
  await expect(problems.locator('li')).toHaveText(
    'This is a spreadsheet workbook (.xlsx), not a CSV file; open it in the spreadsheet program and save it as CSV (UTF-8), then choose the CSV file',
  );

  // People's words, not internal codes.
  await expect(library).not.toContainText('IndexedDB');
  // Opening the library (with a problem listed) never widens the page.
  const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
  expect(widths.scroll).toBeLessThanOrEqual(widths.client);
});
