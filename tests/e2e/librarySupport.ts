/**
 * Shared set-up of the browser tests that use the clinic library (library.spec.ts,
 * library-tabs.spec.ts, offline.spec.ts): a small population table as a CSV file, the evidence
 * typed with it, and the library's controls. The table and the evidence are invented:
 * illustrative numbers, not from a real population or study.
 */
import { expect, type Locator, type Page } from '@playwright/test';
import type { Effect, Scenario, Wording } from '../../lib/scenario/schema';
import { parseTableCsv } from '../../lib/tables/csv';
import { lookupStratum } from '../../lib/tables/lookup';
import type { PopulationTable } from '../../lib/tables/schema';
import { field } from './support';

/** The details block, lines 1 to 7 of each file; the header row is line 8. */
export function details(title: string): string {
  return [
    `# title: ${title}`,
    '# outcome: a first stroke',
    '# horizon_years: 10',
    '# population: Adults aged 40 and over in an invented test district',
    '# source: Invented for the browser test (illustrative numbers, not from a real population)',
    '# year: 2024',
    '# illustrative: true',
  ].join('\n');
}

export const TABLE_TITLE = 'Stroke within 10 years, test district';

/** A small valid table: two sexes, two age bands each (rows 9 to 12). Invented numbers. */
export const GOOD_CSV = `${details(TABLE_TITLE)}
sex,age_from,age_to,risk
female,40,59,0.03
female,60,120,0.07
male,40,59,0.04
male,60,120,0.09
`;

/** The table the engine reads from the good file: what the screen must use. */
export function goodTable(): PopulationTable {
  const parsed = parseTableCsv(GOOD_CSV);
  if (!parsed.ok) throw new Error(`the test table must be valid: ${JSON.stringify(parsed.issues)}`);
  return parsed.value;
}

/** The evidence typed in for the table scenario: a hazard ratio of 1.4 (1.1 to 1.8). Invented. */
export const EFFECT: Effect = { measure: 'HR', estimate: 1.4, lower: 1.1, upper: 1.8, design: 'cohort' };
export const WORDING: Wording = { outcome: 'a first stroke', exposure: 'current smoking', comparison: 'never smoking' };

/** The scenario the screen must compute with the table for this person. */
export function tableScenario(table: PopulationTable, person: { age: number; sex: 'female' | 'male' }): Scenario {
  const found = lookupStratum(table, person);
  if (!found.ok) throw new Error(`the test table covers ${JSON.stringify(person)}`);
  return { baseline: found.value.baseline, effect: EFFECT, wording: WORDING, person, tableId: table.id };
}

export async function openLibrary(page: Page): Promise<Locator> {
  await page.getByRole('button', { name: 'Open the library' }).click();
  const library = page.getByTestId('library-section');
  // The file input is enabled once the library has opened its database.
  await expect(library.getByLabel('Table file (.csv)')).toBeEnabled();
  return library;
}

export async function chooseCsv(library: Locator, name: string, text: string): Promise<void> {
  await library.getByLabel('Table file (.csv)').setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(text, 'utf8') });
}

/** The saved tables, as listed (one article each). */
export function savedTables(library: Locator): Locator {
  return library.getByRole('region', { name: 'Population tables' }).locator('.library__items > li > article');
}

/** What the list says about each saved table: title, details and coverage, without the "(in use)" mark. */
export async function listedTables(library: Locator): Promise<string[]> {
  return (await savedTables(library).allInnerTexts()).map((text) => text.replace(' (in use)', ''));
}

export async function fillEvidence(page: Page): Promise<void> {
  await page.getByLabel('Hazard ratio (HR)', { exact: true }).check();
  await field(page, 'effect.estimate').fill(String(EFFECT.estimate));
  await field(page, 'effect.lower').fill(String(EFFECT.lower));
  await field(page, 'effect.upper').fill(String(EFFECT.upper));
  await page.getByLabel('Cohort', { exact: true }).check();
  await field(page, 'wording.outcome').fill(WORDING.outcome ?? '');
  await field(page, 'wording.exposure').fill(WORDING.exposure ?? '');
  await field(page, 'wording.comparison').fill(WORDING.comparison ?? '');
}

