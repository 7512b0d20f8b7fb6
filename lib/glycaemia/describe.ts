/**
 * Plain-language sentences for a classified history: one per checkup and one for the run. The
 * screen and the command line print these; they compute nothing themselves.
 *
 * Words follow the project's rule: "diabetes" appears only as "diabetes range", and every result
 * is a range under a named body, never a diagnosis.
 */
import type { ClassifiedCheckup, TestClassification } from './classify';
import { CRITERIA } from './criteria';
import { categoryLabel, rangeName, roundTo, TEST_LABELS, yearlyResults } from './format';
import type { DecidingTest, ExposureDefinition } from './exposure';
import { MAX_GAP_MONTHS, type Persistence } from './persistence';

/**
 * A gap's length in words. Gaps are counted in whole calendar months, so a gap that breaks the
 * run ("more than 18 months") can count as 18 whole months: it is then written "more than 18
 * months", never "18 months", which would contradict the rule (issue 11 item 14).
 */
function gapLength(wholeMonths: number): string {
  return wholeMonths === MAX_GAP_MONTHS ? `more than ${MAX_GAP_MONTHS} months` : `${wholeMonths} months`;
}

/** The caution shown with every classified history (clinician-facing). */
export const GLYCAEMIA_CAUTION =
  'Each category applies the named body\'s thresholds to single results. It is not a diagnosis: a result in the diabetes range needs confirming by repeat testing, as your local guideline says.';

function testWords(t: TestClassification): string {
  const shown = t.converted ? `${t.text}, entered as ${t.enteredText}` : t.text;
  return `${TEST_LABELS[t.test]} ${shown}`;
}

/** Which test decided, in words: "HbA1c 6.1%", "both tests", or null when nothing classified. */
export function decidedByText(c: ClassifiedCheckup): string | null {
  switch (c.decidedBy) {
    case 'hba1c':
      return c.hba1c ? testWords(c.hba1c) : null;
    case 'fpg':
      return c.fpg ? testWords(c.fpg) : null;
    case 'both':
      return c.hba1c && c.fpg ? `both tests (${testWords(c.hba1c)}; ${testWords(c.fpg)})` : null;
    case null:
      return null;
  }
}

/**
 * One checkup in a sentence.
 *
 * @example
 * describeCheckup(classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 92, unit: 'mg/dL' } }, 'ADA'))
 * //=> '2023-03-01: prediabetes range (ADA), from HbA1c 6.1%. The tests disagree: fasting glucose 92 mg/dL is in the normal range.'
 */
export function describeCheckup(c: ClassifiedCheckup): string {
  const label = categoryLabel(c.category, c.criteria);
  const decided = decidedByText(c);
  if (c.category === null) {
    return `${c.date}: ${label}. Under ${CRITERIA[c.criteria].id} an HbA1c below 6.5% alone does not place a result in a range; a fasting glucose is needed.`;
  }
  let sentence = `${c.date}: ${label}, from ${decided ?? 'the results'}.`;
  if (c.discordant && c.hba1c && c.fpg) {
    const other = c.decidedBy === 'hba1c' ? c.fpg : c.hba1c;
    const where = other.category === null ? 'below the diabetes range' : `in the ${rangeName(other.category)}`;
    sentence += ` The tests disagree: ${testWords(other)} is ${where}.`;
  }
  return sentence;
}

/** Elapsed years for people: one decimal. */
export function yearsText(years: number): string {
  const rounded = roundTo(years, 1);
  return `${rounded.toFixed(1)} year${rounded === 1 ? '' : 's'}`;
}

/**
 * The run in words.
 *
 * @example
 * describePersistence(run) //=> 'The last 3 yearly results, from 2021-03-01 to 2023-03-01 (2.0 years), are in the prediabetes range (ADA). There are no earlier results.'
 */
export function describePersistence(p: Persistence): string {
  const body = CRITERIA[p.criteria].id;
  if (p.to === null || p.from === null || p.category === null) {
    if (p.brokenBy) return `The latest result (${p.brokenBy.date}) cannot be classified under ${body}, so there is no run to report.`;
    return 'There are no checkups.';
  }
  const label = categoryLabel(p.category, p.criteria);
  const parts: string[] = [];
  if (p.checkups === 1) {
    parts.push(`The latest result (${p.to}) is in the ${label}.`);
  } else if (p.yearlyResults === 1) {
    parts.push(`The last ${p.checkups} checkups, all within one yearly round (${p.from} to ${p.to}), are in the ${label}.`);
  } else {
    const repeats = p.checkups > p.yearlyResults ? ` (${p.checkups} checkups)` : '';
    parts.push(`The last ${yearlyResults(p.yearlyResults)}${repeats}, from ${p.from} to ${p.to} (${yearsText(p.years)}), are in the ${label}.`);
  }
  const b = p.brokenBy;
  if (!b) parts.push('There are no earlier results.');
  else if (b.reason === 'gap' && b.gap) parts.push(`Before that there is a gap of ${gapLength(b.gap.months)} (${b.gap.from} to ${b.gap.to}), which breaks the run.`);
  else if (b.reason === 'category') parts.push(`Before that, the result of ${b.date} is in the ${categoryLabel(b.category, p.criteria)}.`);
  else parts.push(`Before that, the result of ${b.date} cannot be classified under ${body}.`);
  for (const g of p.gaps) {
    if (b?.gap && g.from === b.gap.from && g.to === b.gap.to) continue;
    parts.push(`The history also has a gap of ${gapLength(g.months)} (${g.from} to ${g.to}).`);
  }
  return parts.join(' ');
}

/** The deciding test in words, after "decided by". */
const DECIDING_TEST_WORDS: Readonly<Record<DecidingTest, string>> = {
  either: 'HbA1c or fasting glucose, whichever is in the higher range',
  hba1c: 'HbA1c alone',
  fpg: 'fasting glucose alone',
  both: 'HbA1c and fasting glucose together, both in the range',
};

function runWords(minYears: number): string {
  return minYears === 1 ? 'a result' : `${yearlyResults(minYears)} in a row`;
}

/**
 * A study's exposure definition in words: the run, the range and the body; then, when the
 * definition states them, the deciding test, the longest gap allowed and the comparison group's
 * own definition (its run defaults to the exposure's: "over the same span").
 *
 * @example
 * describeExposure({ category: 'prediabetes', criteria: 'ADA', minYears: 3 })
 * //=> 'The study's exposure: 3 yearly results in a row in the prediabetes range (ADA).'
 * describeExposure({ category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'hba1c', maxGapMonths: 15, comparison: { category: 'normal' } })
 * //=> 'The study's exposure: 3 yearly results in a row in the prediabetes range (ADA), decided by HbA1c alone, with no gap longer than 15 months. Comparison group: 3 yearly results in a row in the normal range, over the same span.'
 */
export function describeExposure(exposure: ExposureDefinition): string {
  const test = exposure.test === undefined ? '' : `, decided by ${DECIDING_TEST_WORDS[exposure.test]}`;
  const gap = exposure.maxGapMonths === undefined ? '' : `, with no gap longer than ${exposure.maxGapMonths} months`;
  const main = `The study's exposure: ${runWords(exposure.minYears)} in the ${rangeName(exposure.category)} (${CRITERIA[exposure.criteria].id})${test}${gap}.`;
  const c = exposure.comparison;
  if (!c) return main;
  const span = c.minYears === undefined ? ', over the same span' : '';
  return `${main} Comparison group: ${runWords(c.minYears ?? exposure.minYears)} in the ${rangeName(c.category)}${span}.`;
}
