/**
 * Browser tests of /handout (issue 4): axe finds no WCAG 2.2 AA violation; the reading grade
 * updates live; templates survive a reload and a bad import changes nothing, and two tabs
 * cannot overwrite each other's template (issue 14). The printed page on A4 and US Letter, one
 * page with the engine's numbers, the time frame and the caution, is checked for every layout
 * in handout-sheet.spec.ts.
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { demoScenario, openHandout } from './handoutSupport';

test('axe finds no WCAG 2.2 AA violation on /handout (result, and a block above grade 8)', async ({ page }) => {
  const tags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
  await openHandout(page, demoScenario(60));
  expect((await new AxeBuilder({ page }).withTags(tags).analyze()).violations).toEqual([]);
  await page.getByLabel('Opening words', { exact: true }).fill('Comprehensive cardiometabolic characterisation necessitates individualised interpretation.');
  await expect(page.getByText('Above grade 8', { exact: false })).toBeVisible();
  expect((await new AxeBuilder({ page }).withTags(tags).analyze()).violations).toEqual([]);
  // The error state (/handout with no scenario) is checked with axe in handout-sheet.spec.ts.
});

test('the reading grade updates as the educator types, and the numbers are not editable', async ({ page }) => {
  await openHandout(page, demoScenario(60));
  const opening = page.getByLabel('Opening words', { exact: true });
  await expect(page.getByText(/^Flesch–Kincaid grade [\d.]+ \(aim for 8 or below\)/).nth(1)).toBeVisible();
  await expect(page.getByText('Above grade 8', { exact: false })).toHaveCount(0);
  await opening.fill('Comprehensive cardiometabolic characterisation necessitates individualised interpretation.');
  await expect(page.getByText('Above grade 8', { exact: false })).toBeVisible();
  await expect(page.getByTestId('handout-sheet')).toContainText('Comprehensive cardiometabolic');
  // Only the three blocks and the two clinic fields are editable.
  await expect(page.getByTestId('handout-sheet').locator('input, textarea, [contenteditable="true"]')).toHaveCount(0);
});

test('templates: save, survive a reload, refuse a bad file without changing what is saved', async ({ page }) => {
  await openHandout(page, demoScenario(60));
  await page.getByLabel('Title', { exact: true }).fill('Your heart numbers');
  await page.getByLabel('Clinic name', { exact: true }).fill('Harbour Lane Clinic');
  await page.getByLabel('Template name', { exact: true }).fill('Heart clinic');
  await page.getByRole('button', { name: 'Save as template' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved the template "Heart clinic".' })).toBeVisible();

  await page.reload();
  await expect(page.getByTestId('handout-sheet')).toContainText('What your numbers mean');
  await page.getByLabel('Saved templates', { exact: true }).selectOption('Heart clinic');
  await page.getByRole('button', { name: 'Use template' }).click();
  await expect(page.getByTestId('handout-sheet')).toContainText('Your heart numbers');
  await expect(page.getByTestId('handout-sheet')).toContainText('Harbour Lane Clinic');

  // Templates live in the browser library (IndexedDB) since issue 14's revisions; the saved list is what the picker offers.
  const picker = page.getByLabel('Saved templates', { exact: true }).locator('option');
  const saved = await picker.allTextContents();
  expect(saved).toEqual(['Choose a template', 'Heart clinic']);
  await page.getByLabel('Import templates (JSON file)', { exact: true }).setInputFiles({
    name: 'bad.json',
    mimeType: 'application/json',
    buffer: Buffer.from(JSON.stringify({ format: 'hundredfold-handout-templates', version: 1, templates: [{ name: 'Broken', blocks: { title: 7 } }] })),
  });
  await expect(page.getByRole('alert').filter({ hasText: 'Template 1' })).toContainText('Template 1 ("Broken"): The title must be text');
  await expect(page.getByRole('status').filter({ hasText: 'The file was not imported; nothing saved was changed.' })).toBeVisible();
  expect(await picker.allTextContents()).toEqual(saved);

  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export templates' }).click();
  expect((await download).suggestedFilename()).toBe('hundredfold-handout-templates.json');
});

test('templates in two tabs: the other tab lists a change at once; a stale save is refused; a deleted template stays deleted', async ({ page }) => {
  // Two pages of one context share one IndexedDB, as two tabs do (issue 14 item 1, for templates).
  await openHandout(page, demoScenario(60));
  const other = await page.context().newPage();
  await openHandout(other, demoScenario(60));
  const pickerA = page.getByLabel('Saved templates', { exact: true });
  const pickerB = other.getByLabel('Saved templates', { exact: true });

  await page.getByLabel('Title', { exact: true }).fill('First version');
  await page.getByLabel('Template name', { exact: true }).fill('Shared');
  await page.getByRole('button', { name: 'Save as template' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved the template "Shared".' })).toBeVisible();
  // Tab B's list refreshed by itself; both tabs take the template up at its first revision.
  await expect(pickerB.locator('option', { hasText: 'Shared' })).toHaveCount(1);
  await pickerB.selectOption({ label: 'Shared' });
  await other.getByRole('button', { name: 'Use template' }).click();
  await pickerA.selectOption({ label: 'Shared' });
  await page.getByRole('button', { name: 'Use template' }).click();

  await page.getByLabel('Title', { exact: true }).fill('Changed in tab A');
  await page.getByRole('button', { name: 'Save as template' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved the template "Shared".' })).toBeVisible();

  await other.getByLabel('Title', { exact: true }).fill('Changed in tab B');
  await other.getByLabel('Template name', { exact: true }).fill('Shared');
  await other.getByRole('button', { name: 'Save as template' }).click();
  await expect(other.getByRole('alert').filter({ hasText: 'Not saved' })).toContainText('Not saved: the template “Shared” was changed in another tab or window after you took it up');
  // Tab A's change was kept.
  await pickerB.selectOption({ label: 'Shared' });
  await other.getByRole('button', { name: 'Use template' }).click();
  await expect(other.getByTestId('handout-sheet')).toContainText('Changed in tab A');

  // Deleted in tab A while tab B holds it: tab B's save is refused and nothing comes back.
  await pickerA.selectOption({ label: 'Shared' });
  await page.getByRole('button', { name: 'Delete template' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Deleted the template "Shared".' })).toBeVisible();
  await expect(pickerB.locator('option', { hasText: 'Shared' })).toHaveCount(0);
  await other.getByRole('button', { name: 'Save as template' }).click();
  await expect(other.getByRole('alert').filter({ hasText: 'Not saved' })).toContainText('Not saved: the template “Shared” was deleted in another tab or window after you took it up');
  await expect(pickerA.locator('option', { hasText: 'Shared' })).toHaveCount(0);
  await expect(pickerB.locator('option', { hasText: 'Shared' })).toHaveCount(0);
});
