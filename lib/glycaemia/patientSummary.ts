/**
 * A person's own glucose history in plain words, for the patient handout: what each test was
 * over the checkups, and which range the latest results are in. For example
 * "Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025."
 *
 * Words:
 * - Counts of checkups and results from one to ten are written as words ("five checkups"), larger
 *   ones as digits ("12 checkups"): the common style rule for small whole numbers in running text
 *   (common practice), using the spoken words of lib/readability/numberWords.ts.
 * - Values are written with the decimals labs print (6.1%, 44 mmol/mol, 5.6 mmol/L, 104 mg/dL;
 *   ./format.ts). When every result of a test was entered in one unit, the values are the ones
 *   entered (the ones on the person's lab reports); when units were mixed, all are given in the
 *   criteria body's unit, rounded to those decimals.
 * - Dates are years only ("from 2021 to 2025"): the handout writes full dates its own way.
 * - "yearly" is said only when every checkup follows the one before by 6 to 18 months (the
 *   yearly-round convention of ./persistence.ts).
 * - A range is named without the body ("the prediabetes range"); the body is in `criteriaLine`.
 *   "diabetes" only ever appears as "diabetes range", and the summary always ends by saying a
 *   range is not a diagnosis.
 *
 * Pure: no React, no DOM; the handout (lib/handout) decides where it goes.
 */
import { integerWords } from '../readability/numberWords';
import type { ClassifiedCheckup, TestClassification, TestName } from './classify';
import { CRITERIA } from './criteria';
import { addMonths } from './dates';
import type { CriteriaSet } from './exposure';
import { rangeName, roundTo, TEST_LABELS, THRESHOLD_DECIMALS, withUnit } from './format';
import { isLongGap, MIN_ROUND_MONTHS, persistence } from './persistence';

export interface PatientGlucoseSummary {
  /** One sentence per test present, HbA1c first: "Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025." */
  readonly tests: readonly string[];
  /** Where the latest results are: "Your last three results, from 2023 to 2025, were all in the prediabetes range."; null when the latest could not be placed. */
  readonly range: string | null;
  /** Present when the latest result is in the diabetes range: it needs a repeat test. */
  readonly confirm: string | null;
  /** Always: "A range is not a diagnosis." */
  readonly caution: string;
  /** Whose thresholds: "Ranges as set by the American Diabetes Association (ADA)." */
  readonly criteriaLine: string;
  /** Everything above in order, as one paragraph. */
  readonly text: string;
}

export const RANGE_NOT_A_DIAGNOSIS = 'A range is not a diagnosis.';

/**
 * A count for running text: words from one to ten, digits above.
 *
 * @example
 * countText(5)  //=> 'five'
 * countText(12) //=> '12'
 */
export function countText(count: number): string {
  return Number.isInteger(count) && count >= 0 && count <= 10 ? integerWords(count).join(' ') : count.toLocaleString('en');
}

function yearsText(first: string, last: string): string {
  const from = first.slice(0, 4);
  const to = last.slice(0, 4);
  return from === to ? `in ${from}` : `from ${from} to ${to}`;
}

/** True when each date follows the one before by at least 6 and at most 18 months. */
function isYearly(dates: readonly string[]): boolean {
  if (dates.length < 2) return false;
  return dates.every((date, i) => {
    const before = dates[i - 1];
    return before === undefined || (date >= addMonths(before, MIN_ROUND_MONTHS) && !isLongGap(before, date));
  });
}

function valueText(t: TestClassification, asEntered: boolean): { readonly value: number; readonly text: string } {
  if (asEntered) return { value: t.entered.value, text: withUnit(t.entered.value, t.entered.unit) };
  const rounded = roundTo(t.value, THRESHOLD_DECIMALS[t.unit]);
  return { value: rounded, text: withUnit(rounded, t.unit) };
}

function testSentence(test: TestName, sorted: readonly ClassifiedCheckup[]): string | null {
  const results = sorted.flatMap((c) => (c[test] ? [{ date: c.date, t: c[test] }] : []));
  const first = results[0];
  const last = results[results.length - 1];
  if (!first || !last) return null;
  const asEntered = results.every((r) => r.t.entered.unit === first.t.entered.unit);
  const values = results.map((r) => valueText(r.t, asEntered));
  const low = values.reduce((a, b) => (b.value < a.value ? b : a));
  const high = values.reduce((a, b) => (b.value > a.value ? b : a));
  const n = results.length;
  const when = yearsText(first.date, last.date);
  const label = TEST_LABELS[test];
  if (n === 1) return `Your ${label} was ${low.text} at one checkup, ${when}.`;
  const checkups = `${countText(n)} ${isYearly(results.map((r) => r.date)) ? 'yearly ' : ''}checkups`;
  if (low.text === high.text) return `Your ${label} was ${low.text} at each of ${checkups}, ${when}.`;
  return `Your ${label} was between ${low.text} and ${high.text} at ${checkups}, ${when}.`;
}

/**
 * @example
 * patientGlucoseSummary(classifyHistory(fiveYearlyHba1c, 'ADA'), 'ADA')?.text
 * //=> 'Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025. All five results, from 2021 to 2025, were in the prediabetes range. A range is not a diagnosis. Ranges as set by the American Diabetes Association (ADA).'
 */
export function patientGlucoseSummary(classified: readonly ClassifiedCheckup[], criteria: CriteriaSet): PatientGlucoseSummary | null {
  if (classified.length === 0) return null;
  const sorted = [...classified].sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
  const tests = (['hba1c', 'fpg'] as const).map((t) => testSentence(t, sorted)).filter((s): s is string => s !== null);
  const run = persistence(sorted, criteria);
  let range: string | null = null;
  if (run.category !== null && run.from !== null && run.to !== null) {
    const where = `the ${rangeName(run.category)}`;
    if (run.checkups === 1) range = `Your latest result, ${yearsText(run.to, run.to)}, is in ${where}.`;
    else if (run.checkups === sorted.length) {
      range = `${run.checkups === 2 ? 'Both' : `All ${countText(run.checkups)}`} results, ${yearsText(run.from, run.to)}, were in ${where}.`;
    }
    else range = `Your last ${countText(run.checkups)} results, ${yearsText(run.from, run.to)}, were all in ${where}.`;
  }
  const confirm = run.category === 'diabetes-range' ? 'A result in the diabetes range needs a repeat test to confirm it.' : null;
  const criteriaLine = `Ranges as set by the ${CRITERIA[criteria].name}.`;
  const text = [...tests, range, confirm, RANGE_NOT_A_DIAGNOSIS, criteriaLine].filter((s): s is string => s !== null).join(' ');
  return { tests, range, confirm, caution: RANGE_NOT_A_DIAGNOSIS, criteriaLine, text };
}
