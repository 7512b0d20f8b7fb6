/**
 * Saved checkups sessions (/checkups): saved under the physician's own name, listed after a
 * reload, reopened with the same summary, deleted after a confirmation; the name never reaches
 * the address or the title, and no request leaves the origin meanwhile.
 */
import { expect, test } from '@playwright/test';
import { openAndProcessCheckups } from './support';

const DEMO = 'demo/checkups/checkups.csv';
const NAME = 'Spring visits, North site';

test('a saved session reopens after a reload with the same summary; deleted, it is gone', async ({ page, context, baseURL }) => {
  test.setTimeout(90_000);
  const requests: string[] = [];
  context.on('request', (r) => requests.push(r.url()));
  await openAndProcessCheckups(page, DEMO);
  const paragraph = await page.getByTestId('employer-paragraph').textContent();
  const counts = await page.getByTestId('status-counts').textContent();
  const chart = await page.getByTestId('chart-text').textContent();
  const sessions = page.getByTestId('sessions');
  await expect(page.getByTestId('sessions-what')).toContainText('in this browser’s storage on this computer');

  await sessions.getByLabel(/Name for this session/).fill(NAME);
  await sessions.getByRole('button', { name: 'Save the session' }).click();
  await expect(page.getByTestId('sessions-status')).toHaveText('Saved in this browser.', { timeout: 30_000 });
  await expect(page.getByTestId('session-list')).toContainText(NAME);
  await expect(page.getByTestId('session-list')).toContainText('40 workers');

  await page.reload();
  await expect(page.getByTestId('summary')).toHaveCount(0); // the page keeps nothing in memory over a reload
  await page.getByRole('button', { name: `Open ${NAME}` }).click();
  await expect(page.getByTestId('summary')).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId('employer-paragraph')).toHaveText(paragraph ?? '');
  await expect(page.getByTestId('status-counts')).toHaveText(counts ?? '');
  await expect(page.getByTestId('chart-text')).toHaveText(chart ?? '');
  await expect(page.getByTestId('worklist-count')).toHaveText('40 of 40 workers shown');
  await expect(page.getByTestId('setup-evidence')).toHaveValue('demo-workforce-hba1c-heart-failure');
  expect(page.url()).not.toContain('Spring');
  expect(await page.title()).not.toContain('Spring');

  await page.getByRole('button', { name: `Delete ${NAME}` }).click();
  const confirm = page.getByRole('group', { name: `Delete the session ${NAME}?` });
  await expect(confirm.getByRole('button', { name: 'Keep it' })).toBeFocused(); // a stray Enter keeps it
  await confirm.getByRole('button', { name: 'Delete', exact: true }).click();
  await expect(page.getByTestId('session-list')).toHaveCount(0);
  await expect(sessions).toContainText('No session is saved in this browser.');
  await page.reload();
  await expect(page.getByTestId('sessions')).toContainText('No session is saved in this browser.');

  const origin = new URL(baseURL ?? 'http://localhost').origin;
  expect(requests.filter((u) => !u.startsWith('data:') && !u.startsWith('blob:') && new URL(u).origin !== origin)).toEqual([]);
  expect(requests.filter((u) => u.includes('Spring'))).toEqual([]);
});
