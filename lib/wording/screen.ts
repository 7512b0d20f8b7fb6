/**
 * The consultation screen's own sentences and labels, around the patient sentences
 * (./patient.ts) and the clinician sentences (./clinician.ts): the line saying who the
 * figures are for, the screen-reader summary, headings with counts, the key's range row and
 * the messages for a result that must not reach the person. Components only render these.
 */
import type { RateBaseline, RiskBaseline } from '../scenario/schema';
import { formatCount, formatPercent, formatYears, overTheNext, TEXT_LOCALE } from './format';

/** The neutral words used for the pictures until the clinician has worded the outcome. */
export const NEUTRAL_OUTCOME = 'the outcome';
/** The neutral group phrase used until the clinician has said who the figures are about. */
export const NEUTRAL_PEOPLE = 'people';

/**
 * "Figures for women aged 50 to 59, over the next 10 years. Each picture shows 100 people
 * (number chosen automatically). Baseline from “…”."
 */
export function resultContextLine(input: {
  readonly people: string;
  readonly horizonYears: number;
  readonly denominator: number;
  readonly automatic: boolean;
  readonly tableTitle?: string | undefined;
}): string {
  const chosen = input.automatic ? 'number chosen automatically' : 'number chosen by the clinician';
  const table = input.tableTitle !== undefined ? ` Baseline from \u201c${input.tableTitle}\u201d.` : '';
  return `Figures for ${input.people}, ${overTheNext(input.horizonYears)}. Each picture shows ${formatCount(input.denominator)} people (${chosen}).${table}`;
}

/** What a screen reader hears once the result has settled. */
export function resultAnnouncement(input: { readonly people: string; readonly horizonYears: number; readonly denominator: number }): string {
  return `Result updated: figures for ${input.people}, ${overTheNext(input.horizonYears)}, out of ${formatCount(input.denominator)} people.`;
}

export const NO_RESULT_ANNOUNCEMENT = 'No result: some inputs are missing or need correcting.';
export const NO_RESULT_LEAD = 'No result yet. It appears here as soon as the inputs are complete and valid.';
export const NO_WARNINGS_TEXT = 'The engine raised no warning for these inputs.';

/** "…and 3 more." under a shortened list. */
export function andMore(count: number): string {
  return `\u2026and ${formatCount(count)} more.`;
}

/** "For the person: out of 100 people like you". */
export function patientHeading(denominator: number): string {
  return `For the person: out of ${formatCount(denominator)} people like you`;
}

/** Caption of the small table under each picture. */
export function pictureTableCaption(denominator: number): string {
  return `What the picture shows, out of ${formatCount(denominator)}`;
}

/** The total row under a picture's table: the rows above add up to it. */
export function pictureTotal(denominator: number): { readonly label: string; readonly count: string } {
  return { label: 'All the people in the picture', count: formatCount(denominator) };
}

/**
 * The study's range in its own row, never counted as more people: the marked icons are
 * already counted in the rows above.
 * @example
 * rangeRow(10, 15, 100) //=> { label: "Marked icons: the study’s range", count: "10 to 15 could have it, out of 100 (already counted above)" }
 */
export function rangeRow(lower: number, upper: number, denominator: number): { readonly label: string; readonly count: string } {
  return {
    label: 'Marked icons: the study\u2019s range',
    count: `${formatCount(lower)} to ${formatCount(upper)} could have it, out of ${formatCount(denominator)} (already counted above)`,
  };
}

/** Shown instead of the pictures and sentences when the result is capped at certainty. */
export const CAPPED_TITLE = 'This result is not shown to the person';
export const CAPPED_TEXT =
  'At this baseline the ratio gives a risk of 100% or more, so the figures were capped and should not be used as they stand. There are no pictures, sentences for the person or handout; the clinician\u2019s figures and the warning are below. Check the baseline, the ratio and the horizon.';

/** Shown above the pictures while the patient sentences still lack words. */
export const WORDS_NEEDED_LEAD =
  'The pictures use neutral words. To write the sentences for the person and prepare a handout, add:';

/** The demo band: on every result built from a demo table or a demo evidence entry. */
export const ILLUSTRATIVE_BAND = 'Illustrative figures, not for patients: this result uses demo data invented for trying the program.';

/** When the table's outcome and the evidence's outcome are both known and differ. */
export function outcomeMismatchMessage(tableOutcome: string, evidenceOutcome: string): string {
  return `The table's outcome and the study's outcome differ: the baseline is for \u201c${tableOutcome}\u201d, the study measured \u201c${evidenceOutcome}\u201d. Check that they are close enough to combine.`;
}

/** When the figures no longer match the saved evidence entry they started from. */
export function entryNoLongerAppliesMessage(name: string): string {
  return `The figures no longer match the saved entry \u201c${name}\u201d, so it no longer applies. Check each wording it filled in (marked below) before it reaches the person.`;
}

/**
 * The line under the table picker: the stratum's figure.
 * @example
 * tableFigureLine({ risk: 0.006, years: 10 }) //=> "a risk of 0.60% over 10 years"
 */
export function tableFigureLine(baseline: RiskBaseline | RateBaseline, suggestedHorizonYears?: number): string {
  if ('risk' in baseline) return `a risk of ${formatPercent(baseline.risk)} over ${formatYears(baseline.years)} years`;
  const rate = baseline.rate.toLocaleString(TEXT_LOCALE, { maximumFractionDigits: 3 });
  const horizon = suggestedHorizonYears !== undefined ? `; the suggested horizon is ${formatYears(suggestedHorizonYears)} years` : '';
  return `${rate} events per ${formatCount(baseline.perPersonYears)} person-years${horizon}`;
}

/** "Enter the person’s age and sex to look up the risk." */
export function tableNeedsLine(wanted: readonly string[]): string {
  return `Enter the person\u2019s ${wanted.join(' and ')} to look up the risk.`;
}

/** The sticky link to the result on narrow screens. */
export const SEE_RESULT = 'See the result';
export const SEE_STILL_NEEDED = 'See what is still needed';
