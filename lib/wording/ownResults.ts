/**
 * "Your own results": a person's glucose history in plain words, for the patient — one
 * sentence per test, where the latest results are, and that a range is not a diagnosis. The
 * handout sheet (lib/handout/sheet.ts) prints it under {@link OWN_RESULTS_HEADING}, and the
 * glucose history section (lib/glycaemia/view.ts) shows the same words so the clinician sees
 * what will go on paper. One function for both: the screen and the paper never disagree.
 *
 * For example "Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025."
 *
 * Words:
 * - Tests are named as a patient knows them: "HbA1c", "fasting blood sugar (glucose)".
 * - Counts of checkups and results from one to ten are written as words ("five checkups"), larger
 *   ones as digits ("12 checkups"): the common style rule for small whole numbers in running text
 *   (common practice), using the spoken words of lib/readability/numberWords.ts.
 * - Values are written with the decimals labs print (6.1%, 44 mmol/mol, 5.6 mmol/L, 104 mg/dL;
 *   lib/glycaemia/format.ts). When every result of a test was entered in one unit, the values are
 *   the ones entered (the ones on the person's lab reports); when units were mixed, all are given
 *   in the criteria body's unit, converted (lib/glycaemia/hba1c.ts, glucose.ts) and rounded to
 *   those decimals.
 * - Dates are years only ("from 2021 to 2025"), so no month is written in one region's way.
 * - "yearly" is said only when every checkup follows the one before by 6 to 18 months (the
 *   yearly-round rule of lib/glycaemia/persistence.ts).
 * - A range is named without the body ("the prediabetes range"); the body is in `criteriaLine`.
 *   "diabetes" only ever appears as "diabetes range", and the words always end by saying a range
 *   is not a diagnosis.
 */
import { integerWords } from '../readability/numberWords';
import { classifyHistory, sidePreservingText, type ClassifiedCheckup, type TestClassification, type TestName } from '../glycaemia/classify';
import { CRITERIA } from '../glycaemia/criteria';
import { addMonths } from '../glycaemia/dates';
import type { CriteriaSet } from '../glycaemia/exposure';
import { rangeName, THRESHOLD_DECIMALS } from '../glycaemia/format';
import { isLongGap, MIN_ROUND_MONTHS, persistence } from '../glycaemia/persistence';
import type { Checkup } from '../glycaemia/schema';

/** The heading of the section on the sheet. */
export const OWN_RESULTS_HEADING = 'Your own results';

export const RANGE_NOT_A_DIAGNOSIS = 'A range is not a diagnosis.';

/** The tests in words a patient knows. */
export const PATIENT_TEST_NAMES: Readonly<Record<TestName, string>> = { hba1c: 'HbA1c', fpg: 'fasting blood sugar (glucose)' };

export interface OwnResultsText {
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
  /** Everything above in order, one sentence each (the sheet's list). */
  readonly sentences: readonly string[];
  /** Everything above in order, as one paragraph. */
  readonly text: string;
}

/**
 * A count for running text: words from one to ten, digits above.
 *
 * @example
 * countWords(5)  //=> 'five'
 * countWords(12) //=> '12'
 */
export function countWords(count: number): string {
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

/**
 * A result for the sentence: as entered, or in the body's unit rounded to the decimals labs print
 * — with more where fewer would put it across one of the body's cut-points (a converted 6.46%
 * is written 6.46%, not the 6.5% that starts the diabetes range). `value` orders the results.
 */
function valueText(t: TestClassification, asEntered: boolean, criteria: CriteriaSet): { readonly value: number; readonly text: string } {
  if (asEntered) return { value: t.entered.value, text: t.enteredText };
  return { value: t.value, text: sidePreservingText(t.value, CRITERIA[criteria][t.test], THRESHOLD_DECIMALS[t.unit]) };
}

function testSentence(test: TestName, sorted: readonly ClassifiedCheckup[], criteria: CriteriaSet): string | null {
  const results = sorted.flatMap((c) => (c[test] ? [{ date: c.date, t: c[test] }] : []));
  const first = results[0];
  const last = results[results.length - 1];
  if (!first || !last) return null;
  const asEntered = results.every((r) => r.t.entered.unit === first.t.entered.unit);
  const values = results.map((r) => valueText(r.t, asEntered, criteria));
  const low = values.reduce((a, b) => (b.value < a.value ? b : a));
  const high = values.reduce((a, b) => (b.value > a.value ? b : a));
  const n = results.length;
  const when = yearsText(first.date, last.date);
  const name = PATIENT_TEST_NAMES[test];
  if (n === 1) return `Your ${name} was ${low.text} at one checkup, ${when}.`;
  const checkups = `${countWords(n)} ${isYearly(results.map((r) => r.date)) ? 'yearly ' : ''}checkups`;
  if (low.text === high.text) return `Your ${name} was ${low.text} at each of ${checkups}, ${when}.`;
  return `Your ${name} was between ${low.text} and ${high.text} at ${checkups}, ${when}.`;
}

/**
 * The person's own results in plain words; null for a history without checkups. The checkups
 * must be valid (lib/glycaemia/parse.ts); they are classified under the history's criteria set.
 *
 * @example
 * ownResultsText({ criteria: 'ADA', checkups: fiveYearlyHba1c })?.text   // 5.8 … 6.2%, 2021 to 2025
 * //=> 'Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025. All five results, from 2021 to 2025, were in the prediabetes range. A range is not a diagnosis. Ranges as set by the American Diabetes Association (ADA).'
 */
export function ownResultsText(history: { readonly criteria: CriteriaSet; readonly checkups: readonly Checkup[] }): OwnResultsText | null {
  const { criteria } = history;
  if (history.checkups.length === 0) return null;
  const sorted = classifyHistory(history.checkups, criteria); // sorted by date
  const tests = (['hba1c', 'fpg'] as const).map((t) => testSentence(t, sorted, criteria)).filter((s): s is string => s !== null);
  const run = persistence(sorted, criteria);
  let range: string | null = null;
  if (run.category !== null && run.from !== null && run.to !== null) {
    const where = `the ${rangeName(run.category)}`;
    if (run.checkups === 1) range = `Your latest result, ${yearsText(run.to, run.to)}, is in ${where}.`;
    else if (run.checkups === sorted.length) {
      range = `${run.checkups === 2 ? 'Both' : `All ${countWords(run.checkups)}`} results, ${yearsText(run.from, run.to)}, were in ${where}.`;
    } else range = `Your last ${countWords(run.checkups)} results, ${yearsText(run.from, run.to)}, were all in ${where}.`;
  }
  const confirm = run.category === 'diabetes-range' ? 'A result in the diabetes range needs a repeat test to confirm it.' : null;
  const criteriaLine = `Ranges as set by the ${CRITERIA[criteria].name}.`;
  const sentences = [...tests, range, confirm, RANGE_NOT_A_DIAGNOSIS, criteriaLine].filter((s): s is string => s !== null);
  return { tests, range, confirm, caution: RANGE_NOT_A_DIAGNOSIS, criteriaLine, sentences, text: sentences.join(' ') };
}
