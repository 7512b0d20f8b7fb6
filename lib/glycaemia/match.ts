/**
 * Does this person's checkup history fit the exposure a study defined — for example "in the
 * prediabetes range (ADA) at every yearly checkup for at least 3 years"? And, when the study
 * defined its comparison group too, is the person in it ({@link exposureStatus})?
 *
 * The history is classified under the study's criteria set (not the one shown on screen, when
 * they differ: the study's definition decides) and with the study's deciding test
 * ({@link classifyForDefinition}), then its run (./persistence.ts, cut further at the
 * definition's longest gap: {@link runForDefinition}) is compared:
 *
 *     matches ⇔ the run's category = the study's category  and  yearlyResults ≥ minYears
 *
 * `minYears` counts yearly results, as the exposure schema says ("a whole number of yearly
 * checkups"); a run of N yearly results spans about N − 1 elapsed years, reported beside it.
 *
 * Every outcome carries plain-language reasons; a mismatch also carries a warning (code
 * "exposure-mismatch") for the result screen. When the latest result is in the diabetes range a
 * separate, prominent note is attached: evidence about another range does not apply, and one
 * result is not a diagnosis.
 */
import type { Warning } from '../result';
import { classifyCheckup, classifyHistory, type ClassifiedCheckup } from './classify';
import { CRITERIA } from './criteria';
import { compareWithMonthsLater, daysBetween, inDateOrder, wholeMonthsBetween } from './dates';
import {
  resolveExposureDefinition,
  type CriteriaSet,
  type ExposureDefinition,
  type GlycaemicCategory,
  type ResolvedExposureDefinition,
} from './exposure';
import { categoryLabel, rangeName, yearlyResults } from './format';
import { MAX_GAP_MONTHS, MIN_ROUND_MONTHS, persistence, type Persistence } from './persistence';
import type { Checkup } from './schema';

const TEST_WORDS = { either: 'HbA1c or fasting glucose', hba1c: 'HbA1c', fpg: 'fasting glucose', both: 'HbA1c and fasting glucose together' } as const;

/**
 * The history classified as a definition reads it, sorted by date:
 * - test `either`: every checkup, taking the higher range of its tests (./classify.ts);
 * - `hba1c` / `fpg`: only checkups with that test, classified on it alone;
 * - `both`: only checkups with both tests; a checkup whose tests place it in different ranges
 *   (or that a test cannot place, e.g. WHO with an HbA1c below 6.5%) is left unclassified, which
 *   breaks a run as an unknown range does.
 *
 * @example
 * classifyForDefinition([{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 5.0, unit: 'mmol/L' } }], resolveExposureDefinition({ category: 'prediabetes', criteria: 'ADA', minYears: 1, test: 'fpg' }))
 * //=> [{ date: '2023-03-01', category: 'normal', decidedBy: 'fpg', … }]
 */
export function classifyForDefinition(checkups: readonly Checkup[], definition: ResolvedExposureDefinition): ClassifiedCheckup[] {
  const { test, criteria } = definition;
  if (test === 'either') return classifyHistory(checkups, criteria);
  const sorted = inDateOrder(checkups);
  if (test === 'hba1c') return sorted.filter((c) => c.hba1c).map((c) => classifyCheckup({ date: c.date, hba1c: c.hba1c }, criteria));
  if (test === 'fpg') return sorted.filter((c) => c.fpg).map((c) => classifyCheckup({ date: c.date, fpg: c.fpg }, criteria));
  return sorted
    .filter((c) => c.hba1c && c.fpg)
    .map((c) => {
      const classified = classifyCheckup(c, criteria);
      const agree = classified.hba1c?.category != null && classified.hba1c.category === classified.fpg?.category;
      return agree ? { ...classified, decidedBy: 'both' as const } : { ...classified, category: null, decidedBy: null };
    });
}

/**
 * The run ending at the latest checkup (./persistence.ts), cut further at the first gap longer
 * than the definition's `maxGapMonths` (a gap from a to b is too long when b > a + maxGapMonths
 * calendar months, the rule ./persistence.ts applies at 18).
 */
export function runForDefinition(classified: readonly ClassifiedCheckup[], definition: ResolvedExposureDefinition): Persistence {
  const run = persistence(classified, definition.criteria);
  if (definition.maxGapMonths >= MAX_GAP_MONTHS || run.from === null || run.to === null) return run;
  const inRun = classified.filter((c) => run.from !== null && c.date >= run.from && run.to !== null && c.date <= run.to);
  for (let i = inRun.length - 1; i > 0; i -= 1) {
    const before = inRun[i - 1];
    const after = inRun[i];
    if (!before || !after || compareWithMonthsLater(after.date, before.date, definition.maxGapMonths) <= 0) continue;
    const shorter = persistence(inRun.slice(i), definition.criteria);
    return {
      ...shorter,
      gaps: run.gaps,
      brokenBy: {
        date: before.date,
        reason: 'gap',
        category: before.category,
        gap: { from: before.date, to: after.date, months: wholeMonthsBetween(before.date, after.date), days: daysBetween(before.date, after.date) },
      },
    };
  }
  return run;
}

export interface HistoryMatch {
  readonly exposure: ExposureDefinition;
  readonly matches: boolean;
  /** Yearly results in the run that are in the study's category (0 when the latest result is in another). */
  readonly matchingYearlyResults: number;
  /** The run under the study's criteria set. */
  readonly persistence: Persistence;
  /** Plain-language reasons, the first one always "the study needed …; this history has …". */
  readonly reasons: readonly string[];
  /** Present when the history does not match: for the result screen's warnings. */
  readonly warning?: Warning;
  /** Present when the latest result is in the diabetes range: show it prominently. */
  readonly diabetesRangeNote?: Warning;
}

export interface MatchOptions {
  /** The criteria set the screen is showing, when it differs from the study's, to say so. */
  readonly shownCriteria?: CriteriaSet;
}

/**
 * The prominent note for a latest result in the diabetes range, or null.
 *
 * @param otherCategory - the range the evidence is about (default: the prediabetes range)
 * @example
 * diabetesRangeNote([…, { date: '2023-03-01', category: 'diabetes-range', criteria: 'ADA', … }])
 * //=> { code: 'diabetes-range-latest', message: 'The latest result (2023-03-01) is in the diabetes range (ADA). Evidence about the prediabetes range does not apply to it. One result is not a diagnosis: …' }
 */
export function diabetesRangeNote(
  classified: readonly ClassifiedCheckup[],
  otherCategory: GlycaemicCategory = 'prediabetes',
): Warning | null {
  const latest = inDateOrder(classified).at(-1);
  if (!latest || latest.category !== 'diabetes-range') return null;
  const evidence = otherCategory === 'diabetes-range' ? '' : ` Evidence about the ${rangeName(otherCategory)} does not apply to it.`;
  return {
    code: 'diabetes-range-latest',
    message: `The latest result (${latest.date}) is in the diabetes range (${CRITERIA[latest.criteria].id}).${evidence} One result is not a diagnosis: confirm with repeat testing as your local guideline says.`,
  };
}

function breakReason(run: Persistence, maxGapMonths: number = MAX_GAP_MONTHS): string | null {
  const body = CRITERIA[run.criteria].id;
  const brokenBy = run.brokenBy;
  if (!brokenBy) return run.checkups > 0 ? 'There are no earlier results.' : null;
  switch (brokenBy.reason) {
    case 'gap':
      return brokenBy.gap
        ? `The run starts after a gap of ${brokenBy.gap.months} months (${brokenBy.gap.from} to ${brokenBy.gap.to}); results before a gap of more than ${maxGapMonths} months do not count.`
        : null;
    case 'category':
      return `Before the run, the result of ${brokenBy.date} is in the ${categoryLabel(brokenBy.category, run.criteria)}.`;
    case 'unclassified':
      return `Before the run, the result of ${brokenBy.date} cannot be classified under ${body} (an HbA1c below 6.5% alone does not place it in a range).`;
  }
}

/**
 * Match a validated history against an exposure definition.
 *
 * @example
 * matchHistory(twoYearlyPrediabetesResults, { category: 'prediabetes', criteria: 'ADA', minYears: 3 })
 * //=> { matches: false, reasons: ['The study needed 3 yearly results in the prediabetes range (ADA); this history has 2.', …],
 * //     warning: { code: 'exposure-mismatch', … } }
 */
export function matchHistory(checkups: readonly Checkup[], exposure: ExposureDefinition, options: MatchOptions = {}): HistoryMatch {
  return matchResolved(checkups, exposure, resolveExposureDefinition(exposure), options);
}

/** The words for a definition's test and gap, when they are not the defaults: " (HbA1c), no gap over 12 months". */
function testAndGap(definition: ResolvedExposureDefinition): { test: string; gap: string } {
  return {
    test: definition.test === 'either' ? '' : ` by ${TEST_WORDS[definition.test]}`,
    gap: definition.maxGapMonths < MAX_GAP_MONTHS ? `, no gap over ${definition.maxGapMonths} months` : '',
  };
}

type Role = 'exposure' | 'comparison';

/** The words of a check that depend only on the definition and the role, not on the history. */
interface CheckWords {
  /** "The study needed 3 yearly results in the prediabetes range (ADA, by HbA1c); this history has " (the count follows). */
  readonly needed: string;
  /** The mismatch warning up to the count: "This history does not fit the study's exposure: the study needed …; this history has ". */
  readonly mismatch: string;
}

const MISMATCH_END = ". The study's figures may not apply to this person.";

/** The words last worked out per role, with the definition they were worked out for (compared field by field). */
const LAST_WORDS: Record<Role, { readonly definition: ResolvedExposureDefinition; readonly words: CheckWords } | null> = { exposure: null, comparison: null };

/**
 * A check's words for a definition and role, worked out once and reused while the definition
 * stays the same (a workforce checks thousands of histories against one definition).
 */
function checkWords(definition: ResolvedExposureDefinition, role: Role): CheckWords {
  const last = LAST_WORDS[role];
  if (
    last &&
    last.definition.category === definition.category &&
    last.definition.criteria === definition.criteria &&
    last.definition.minYears === definition.minYears &&
    last.definition.test === definition.test &&
    last.definition.maxGapMonths === definition.maxGapMonths
  ) {
    return last.words;
  }
  const body = CRITERIA[definition.criteria].id;
  const { test, gap } = testAndGap(definition);
  const group = role === 'exposure' ? 'The study needed' : "The study's comparison group needed";
  const needed = `${group} ${yearlyResults(definition.minYears)} in the ${rangeName(definition.category)} (${body}${test ? `,${test}` : ''})${gap}; this history has `;
  const words: CheckWords = {
    needed,
    mismatch: `This history does not fit the study's ${role === 'exposure' ? 'exposure' : 'comparison group'}: ${needed.charAt(0).toLowerCase()}${needed.slice(1)}`,
  };
  LAST_WORDS[role] = {
    definition: { category: definition.category, criteria: definition.criteria, minYears: definition.minYears, test: definition.test, maxGapMonths: definition.maxGapMonths, comparison: null },
    words,
  };
  return words;
}

function matchResolved(
  checkups: readonly Checkup[],
  exposure: ExposureDefinition,
  definition: ResolvedExposureDefinition,
  options: MatchOptions,
  role: Role = 'exposure',
  /** The history classified and its run under this definition's criteria, test and gap, when already known. */
  known?: { readonly classified: readonly ClassifiedCheckup[]; readonly run: Persistence },
): HistoryMatch {
  const body = CRITERIA[definition.criteria].id;
  const classified = known?.classified ?? classifyForDefinition(checkups, definition);
  const run = known?.run ?? runForDefinition(classified, definition);
  const sameCategory = run.category === definition.category;
  const count = sameCategory ? run.yearlyResults : 0;
  const matches = sameCategory && count >= definition.minYears;
  const words = checkWords(definition, role);
  const needed = `${words.needed}${count}`;
  const span = sameCategory && run.from && run.to ? `, from ${run.from} to ${run.to}` : '';
  const reasons: string[] = [`${needed}${span}.`];

  if (!sameCategory) {
    if (run.to === null && run.brokenBy) {
      reasons.push(
        definition.test === 'both'
          ? `The latest result with both tests (${run.brokenBy.date}) does not place both in one range under ${body}.`
          : `The latest result (${run.brokenBy.date}) cannot be classified under ${body}: an HbA1c below 6.5% alone does not place it in a range; a fasting glucose is needed.`,
      );
    } else if (run.to !== null) {
      reasons.push(`The latest result (${run.to}) is in the ${categoryLabel(run.category, definition.criteria)}, not the ${rangeName(definition.category)}.`);
    } else {
      reasons.push(definition.test === 'either' || checkups.length === 0 ? 'There are no checkups.' : `There are no checkups with ${TEST_WORDS[definition.test]}.`);
    }
  } else if (!matches) {
    const why = breakReason(run, definition.maxGapMonths);
    if (why) reasons.push(why);
  }
  if (sameCategory && run.checkups > run.yearlyResults) {
    reasons.push(
      `The run holds ${run.checkups} results; some are less than ${MIN_ROUND_MONTHS} months apart and count as one yearly round.`,
    );
  }
  if (role === 'exposure' && options.shownCriteria && options.shownCriteria !== exposure.criteria) {
    reasons.push(`The study used ${body} criteria, so this check applies ${body}; the results above are shown under ${CRITERIA[options.shownCriteria].id}.`);
  }

  const note = diabetesRangeNote(classified, definition.category);
  // Key by key (no spreads), in the same order: the optional ones last.
  const match: { -readonly [K in keyof HistoryMatch]: HistoryMatch[K] } = { exposure, matches, matchingYearlyResults: count, persistence: run, reasons };
  if (!matches) match.warning = { code: 'exposure-mismatch', message: `${words.mismatch}${count}${MISMATCH_END}` };
  if (note) match.diabetesRangeNote = note;
  return match;
}

/** Where a history stands against an evidence entry's exposure and comparison definitions. */
export type ExposureStatus = 'exposed' | 'comparison' | 'neither';

/**
 * Why a history is `neither`, for callers that sort such people further:
 * - `short`: the run is in a defined range and reaches back to the first result, but is too short
 *   (more yearly results would settle it);
 * - `gap`: the run is in a defined range but a gap cut it short;
 * - `unclassified`: the latest result cannot be placed with the deciding test (or there is none);
 * - `changed`: the run is in a defined range but an earlier result in another range ends it;
 * - `other-range`: the latest result is in a range the study compared neither way;
 * - `no-comparison`: the latest result is in the comparison's range but the entry defines no comparison group.
 */
export type NeitherReason = 'short' | 'gap' | 'unclassified' | 'changed' | 'other-range' | 'no-comparison';

export interface ExposureStatusMatch {
  readonly status: ExposureStatus;
  /** Present when the status is `neither`. */
  readonly neitherReason: NeitherReason | null;
  readonly exposure: HistoryMatch;
  /** Null when the entry defines no comparison group. */
  readonly comparison: HistoryMatch | null;
  /** The run under the definition (criteria set, deciding test, gap rule). */
  readonly run: Persistence;
  /** Plain-language reasons: the status first, then the matching reasons that explain it. */
  readonly reasons: readonly string[];
}

function neitherReason(run: Persistence, definition: ResolvedExposureDefinition): NeitherReason {
  if (run.category === null) return 'unclassified';
  const defined = [definition.category, definition.comparison?.category].filter((c) => c !== undefined);
  if (!defined.includes(run.category)) {
    return run.category === 'normal' && definition.comparison === null && definition.category !== 'normal' ? 'no-comparison' : 'other-range';
  }
  if (run.brokenBy === null) return 'short';
  return run.brokenBy.reason === 'gap' ? 'gap' : 'changed';
}

/** A definition resolved, and its comparison group's as the exposure's with the comparison's category and run. */
interface ResolvedDefinitions {
  readonly definition: ResolvedExposureDefinition;
  readonly comparisonDefinition: ResolvedExposureDefinition | null;
}

/** The definitions last resolved, with a copy of the fields they were resolved from (compared field by field). */
let lastResolved: { readonly from: ExposureDefinition; readonly resolved: ResolvedDefinitions } | null = null;

/**
 * {@link resolveExposureDefinition} and the comparison's definition, reused while the definition's
 * fields stay the same (a workforce checks thousands of histories against one definition). They
 * are read only here, never handed out.
 */
function resolvedDefinitions(exposure: ExposureDefinition): ResolvedDefinitions {
  const last = lastResolved?.from;
  if (
    last &&
    last.category === exposure.category &&
    last.criteria === exposure.criteria &&
    last.minYears === exposure.minYears &&
    last.test === exposure.test &&
    last.maxGapMonths === exposure.maxGapMonths &&
    last.comparison?.category === exposure.comparison?.category &&
    last.comparison?.minYears === exposure.comparison?.minYears &&
    (last.comparison === undefined) === (exposure.comparison === undefined)
  ) {
    return (lastResolved as { readonly resolved: ResolvedDefinitions }).resolved;
  }
  const definition = resolveExposureDefinition(exposure);
  const comparisonDefinition = definition.comparison ? { ...definition, category: definition.comparison.category, minYears: definition.comparison.minYears } : null;
  const resolved = { definition, comparisonDefinition };
  lastResolved = { from: { ...exposure, ...(exposure.comparison ? { comparison: { ...exposure.comparison } } : {}) }, resolved };
  return resolved;
}

/**
 * Exposed, comparison, or neither: the history against the exposure definition, then against the
 * comparison group's definition (same criteria set, test and gap rule). Exposure is checked first;
 * the two cannot both hold (their categories differ and both look at the same run).
 *
 * @example
 * exposureStatus(threeYearlyNormalResults, { category: 'prediabetes', criteria: 'ADA', minYears: 3, comparison: { category: 'normal' } })
 * //=> { status: 'comparison', neitherReason: null, reasons: ['In the study's comparison group: …', …], … }
 */
export function exposureStatus(checkups: readonly Checkup[], exposure: ExposureDefinition, options: MatchOptions = {}): ExposureStatusMatch {
  const { definition, comparisonDefinition } = resolvedDefinitions(exposure);
  // The comparison shares the criteria set, test and gap rule: classify and find the run once.
  const classified = classifyForDefinition(checkups, definition);
  const known = { classified, run: runForDefinition(classified, definition) };
  const exposed = matchResolved(checkups, exposure, definition, options, 'exposure', known);
  const comparison = comparisonDefinition ? matchResolved(checkups, exposure, comparisonDefinition, options, 'comparison', known) : null;
  const run = exposed.persistence;
  if (exposed.matches) {
    return { status: 'exposed', neitherReason: null, exposure: exposed, comparison, run, reasons: ["Fits the study's exposure.", ...exposed.reasons] };
  }
  if (comparison?.matches) {
    return { status: 'comparison', neitherReason: null, exposure: exposed, comparison, run, reasons: ["Fits the study's comparison group.", ...comparison.reasons] };
  }
  const why = neitherReason(run, definition);
  const first =
    why === 'no-comparison'
      ? "Fits neither: the evidence entry does not define its comparison group, so a history in the normal range is not matched to it."
      : why === 'other-range'
        ? `Fits neither the study's exposure nor its comparison group: the latest result is in a range the study did not compare.`
        : "Fits neither the study's exposure nor its comparison group.";
  const explaining = comparison && run.category === comparisonDefinition?.category ? comparison : exposed;
  return {
    status: 'neither',
    neitherReason: why,
    exposure: exposed,
    comparison,
    run,
    reasons: [first, ...explaining.reasons],
  };
}
