/**
 * Does this person's checkup history fit the exposure a study defined — for example "in the
 * prediabetes range (ADA) at every yearly checkup for at least 3 years"?
 *
 * The history is classified under the study's criteria set (not the one shown on screen, when
 * they differ: the study's definition decides), then its run (./persistence.ts) is compared:
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
import { classifyHistory, type ClassifiedCheckup } from './classify';
import { CRITERIA } from './criteria';
import type { CriteriaSet, ExposureDefinition, GlycaemicCategory } from './exposure';
import { categoryLabel, rangeName, yearlyResults } from './format';
import { MAX_GAP_MONTHS, MIN_ROUND_MONTHS, persistence, type Persistence } from './persistence';
import type { Checkup } from './schema';

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
  const latest = [...classified].sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0)).at(-1);
  if (!latest || latest.category !== 'diabetes-range') return null;
  const evidence = otherCategory === 'diabetes-range' ? '' : ` Evidence about the ${rangeName(otherCategory)} does not apply to it.`;
  return {
    code: 'diabetes-range-latest',
    message: `The latest result (${latest.date}) is in the diabetes range (${CRITERIA[latest.criteria].id}).${evidence} One result is not a diagnosis: confirm with repeat testing as your local guideline says.`,
  };
}

function breakReason(run: Persistence): string | null {
  const body = CRITERIA[run.criteria].id;
  const brokenBy = run.brokenBy;
  if (!brokenBy) return run.checkups > 0 ? 'There are no earlier results.' : null;
  switch (brokenBy.reason) {
    case 'gap':
      return brokenBy.gap
        ? `The run starts after a gap of ${brokenBy.gap.months} months (${brokenBy.gap.from} to ${brokenBy.gap.to}); results before a gap of more than ${MAX_GAP_MONTHS} months do not count.`
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
  const body = CRITERIA[exposure.criteria].id;
  const classified = classifyHistory(checkups, exposure.criteria);
  const run = persistence(classified, exposure.criteria);
  const sameCategory = run.category === exposure.category;
  const count = sameCategory ? run.yearlyResults : 0;
  const matches = sameCategory && count >= exposure.minYears;

  const needed = `The study needed ${yearlyResults(exposure.minYears)} in the ${rangeName(exposure.category)} (${body}); this history has ${count}`;
  const span = sameCategory && run.from && run.to ? `, from ${run.from} to ${run.to}` : '';
  const reasons: string[] = [`${needed}${span}.`];

  if (!sameCategory) {
    if (run.to === null && run.brokenBy) {
      reasons.push(`The latest result (${run.brokenBy.date}) cannot be classified under ${body}: an HbA1c below 6.5% alone does not place it in a range; a fasting glucose is needed.`);
    } else if (run.to !== null) {
      reasons.push(`The latest result (${run.to}) is in the ${categoryLabel(run.category, exposure.criteria)}, not the ${rangeName(exposure.category)}.`);
    } else {
      reasons.push('There are no checkups.');
    }
  } else if (!matches) {
    const why = breakReason(run);
    if (why) reasons.push(why);
  }
  if (sameCategory && run.checkups > run.yearlyResults) {
    reasons.push(
      `The run holds ${run.checkups} results; some are less than ${MIN_ROUND_MONTHS} months apart and count as one yearly round.`,
    );
  }
  if (options.shownCriteria && options.shownCriteria !== exposure.criteria) {
    reasons.push(`The study used ${body} criteria, so this check applies ${body}; the results above are shown under ${CRITERIA[options.shownCriteria].id}.`);
  }

  const note = diabetesRangeNote(classified, exposure.category);
  return {
    exposure,
    matches,
    matchingYearlyResults: count,
    persistence: run,
    reasons,
    ...(matches
      ? {}
      : {
          warning: {
            code: 'exposure-mismatch',
            message: `This history does not fit the study's exposure: ${needed.charAt(0).toLowerCase()}${needed.slice(1)}. The study's figures may not apply to this person.`,
          },
        }),
    ...(note ? { diabetesRangeNote: note } : {}),
  };
}
