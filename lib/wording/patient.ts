/**
 * The patient-facing sentences: natural frequencies, both frames, one denominator, the time
 * frame and who "people like you" are, the range in words, what the figures mean and do not
 * mean, the caution and teach-back questions. Built only from a {@link ComputeResult}, the
 * scenario's {@link Wording}, the group phrase (./people.ts) and the horizon.
 *
 * Rules (each with its published source; each checked in tests/unit/wording):
 * - natural frequencies, "N out of D", with the result's one denominator D (Gigerenzer &
 *   Hoffrage 1995, Psychol Rev 102:684; Trevena et al. 2013, BMC Med Inform Decis Mak
 *   13(Suppl 2):S7);
 * - both frames, "will" and "will not" (Akl et al. 2011, Cochrane Database Syst Rev CD006776);
 * - the time frame and the group are always stated, so a missing horizon or group is refused;
 * - no "1 in X" (Pighin et al. 2011, Med Decis Making 31:721);
 * - no relative figure at all in patient text: only absolute counts and their difference;
 * - the range as numbers beside the point value (van der Bles et al. 2019, R Soc Open Sci
 *   6:181870), matching the "could be" icons: from exposedLower to exposedUpper;
 * - each array's text alternative equals its visible caption (WCAG 2.2 SC 1.1.1).
 *
 * Counts come from the engine's icon-array counts (lib/engine/iconArray.ts), so each sentence
 * agrees with the array beside it.
 */
import { exposedLayout, referenceLayout, type IconArrayLayout, type IconKind } from '../engine/iconArray';
import type { ComputeResult } from '../engine/types';
import { fail, ok, type Issue, type Result } from '../result';
import type { Denominator, Wording } from '../scenario/schema';
import { capitalise, phraseText } from '../text';
import { CAUTION_TEXT } from './caution';
import { formatCount, inTheNext, overTheNext, peopleCount } from './format';

/** Used when the wording names no exposure. */
export const DEFAULT_EXPOSURE = 'the risk factor studied';

export interface PatientTextInput {
  readonly result: ComputeResult;
  readonly wording?: Wording | undefined;
  /** The group phrase from {@link describePeople}, e.g. "women aged 50 to 59". Required. */
  readonly people: string | undefined;
  /** The horizon the page speaks of, in years. Required; must equal `result.horizonYears`. */
  readonly horizonYears: number | undefined;
  /**
   * Who reads the text: one person ("women aged 50 to 59 like you", the default) or a class in
   * a group session, where no one reader is "like" the group, so "like you" is left out.
   */
  readonly audience?: 'person' | 'group' | undefined;
}

export type LegendKind = IconKind | 'uncertain';

export interface LegendItem {
  readonly kind: LegendKind;
  /** What the icon means, e.g. "Will have heart failure needing hospital care". */
  readonly label: string;
  /** How many icons of this kind the array draws. */
  readonly count: number;
  /**
   * Label with the count, pluralised: "Will not have it (92 people)"; for "could be", the range
   * in people ("from 10 to 15 in all; already counted above"), so the key adds up to D.
   */
  readonly text: string;
}

export interface ArrayText {
  readonly key: 'reference' | 'exposed';
  /** Short heading for the group: "With normal HbA1c". */
  readonly heading: string;
  /** Names the group and the time frame: "100 women aged 50 to 59 with normal HbA1c, over the next 10 years". */
  readonly title: string;
  /** The visible sentences beside the array. */
  readonly caption: string;
  /** The array's text alternative: always equal to `caption`. */
  readonly alt: string;
  /** Only the kinds the array draws, in drawing order, then "could be" when present. */
  readonly legend: readonly LegendItem[];
  readonly layout: IconArrayLayout;
}

export interface DataTableRow {
  readonly group: string;
  readonly willHave: string;
  readonly willNotHave: string;
}

export interface PatientText {
  readonly denominator: Denominator;
  readonly horizonYears: number;
  readonly people: string;
  /** Who and when, for a heading: "Women aged 50 to 59 like you, over the next 10 years". */
  readonly groupLine: string;
  readonly outcome: string;
  readonly exposure: string;
  /** "with normal HbA1c", or "without {exposure}" when no comparison is worded. */
  readonly comparisonGroup: string;
  readonly exposedGroup: string;
  /** Direction of the difference in counts at this denominator. */
  readonly direction: 'more' | 'fewer' | 'same';
  readonly referenceSentence: string;
  readonly exposedSentence: string;
  readonly differenceSentence: string;
  readonly rangeSentence: string;
  /** Present when the study's interval includes no effect. */
  readonly noDifferenceSentence: string | undefined;
  readonly reference: ArrayText;
  readonly exposed: ArrayText;
  readonly dataTable: {
    readonly caption: string;
    /** Column headings: "Group", "Will have {outcome}", "Will not". */
    readonly headers: { readonly group: string; readonly willHave: string; readonly willNotHave: string };
    readonly rows: readonly DataTableRow[];
  };
  /** What the figures mean. */
  readonly means: readonly string[];
  /** What the figures do not mean. */
  readonly doesNotMean: readonly string[];
  readonly caution: string;
  readonly teachBackIntro: string;
  readonly teachBack: readonly string[];
}

const clean = phraseText;

/**
 * "about 8 out of 100"; "fewer than 1 out of 100" when a non-zero risk rounds to 0 people;
 * "more than 99 out of 100" when a risk below 1 rounds to everyone.
 */
export function eventsOutOf(count: number, denominator: number, risk: number): string {
  const d = formatCount(denominator);
  if (count <= 0 && risk > 0) return `fewer than 1 out of ${d}`;
  if (count >= denominator && risk < 1) return `more than ${formatCount(denominator - 1)} out of ${d}`;
  return `about ${formatCount(count)} out of ${d}`;
}

/** The "will not" frame for the same group, never contradicting {@link eventsOutOf}. */
function nonEventsSentence(count: number, denominator: number, risk: number): string {
  const d = formatCount(denominator);
  if (count <= 0 && risk > 0) return `More than ${formatCount(denominator - 1)} out of ${d} will not.`;
  if (count >= denominator && risk < 1) return `Fewer than 1 out of ${d} will not.`;
  return `The other ${formatCount(denominator - count)} out of ${d} will not.`;
}

function groupSentence(lead: string, people: string, likeYou: string, who: string, count: number, denominator: number, risk: number, outcome: string, horizonYears: number): string {
  return [
    `${lead} ${formatCount(denominator)} ${people}${likeYou}.`,
    who,
    `${capitalise(inTheNext(horizonYears))}, ${eventsOutOf(count, denominator, risk)} will have ${outcome}.`,
    nonEventsSentence(count, denominator, risk),
  ].join(' ');
}

function legendItem(kind: LegendKind, label: string, count: number): LegendItem {
  return { kind, label, count, text: `${label} (${peopleCount(count)})` };
}

function referenceLegend(layout: IconArrayLayout, outcome: string): LegendItem[] {
  const items: LegendItem[] = [];
  if (layout.tally.event > 0) items.push(legendItem('event', `Will have ${outcome}`, layout.tally.event));
  if (layout.tally.none > 0) items.push(legendItem('none', 'Will not have it', layout.tally.none));
  return items;
}

/**
 * The key adds up to the denominator: the "could be" icons are already counted in the rows
 * above (they are events or non-events at the estimate), so their entry states the range in
 * people and never adds a count of its own.
 */
function rangeLegendItem(count: number, lower: number, upper: number): LegendItem {
  const label = 'Could be: inside the study\u2019s range';
  return { kind: 'uncertain', label, count, text: `${label} (from ${formatCount(lower)} to ${formatCount(upper)} in all; already counted above)` };
}

function exposedLegend(layout: IconArrayLayout, outcome: string, exposedGroup: string, comparisonGroup: string, range: { lower: number; upper: number }): LegendItem[] {
  const items: LegendItem[] = [];
  const { tally } = layout;
  if (tally.event > 0) {
    const label = tally.added > 0 || tally.avoided > 0 ? `Will have ${outcome}, as ${comparisonGroup}` : `Will have ${outcome}`;
    items.push(legendItem('event', label, tally.event));
  }
  if (tally.added > 0) items.push(legendItem('added', `Extra people who will have it ${exposedGroup}`, tally.added));
  if (tally.avoided > 0) items.push(legendItem('avoided', `People who will not have it ${exposedGroup}, but would ${comparisonGroup}`, tally.avoided));
  if (tally.none > 0) items.push(legendItem('none', 'Will not have it', tally.none));
  if (tally.uncertain > 0) items.push(rangeLegendItem(tally.uncertain, range.lower, range.upper));
  return items;
}

/** Checks the inputs the sentences cannot do without. */
function requiredIssues(input: PatientTextInput): Issue[] {
  const issues: Issue[] = [];
  const { horizonYears, result } = input;
  if (horizonYears === undefined || !Number.isFinite(horizonYears) || horizonYears <= 0) {
    issues.push({
      code: 'horizon-required',
      path: ['horizonYears'],
      message: 'The time frame is required: say over how many years (greater than 0) the figures apply',
    });
  } else if (Math.abs(horizonYears - result.horizonYears) > 1e-9) {
    issues.push({
      code: 'horizon-mismatch',
      path: ['horizonYears'],
      message: `The time frame (${horizonYears} years) must be the one the result was computed for (${result.horizonYears} years)`,
    });
  }
  if (clean(input.people).length === 0) {
    issues.push({
      code: 'population-required',
      path: ['people'],
      message: 'Say who the figures are about ("people like you"): give the age or sex the table uses, or a short description of the group',
    });
  }
  if (clean(input.wording?.outcome).length === 0) {
    issues.push({
      code: 'outcome-required',
      path: ['wording', 'outcome'],
      message: 'The outcome is required in plain words, e.g. "heart failure needing hospital care"',
    });
  }
  return issues;
}

/**
 * Every patient-facing sentence for one result.
 *
 * @example
 * // P0 = 0.08, P1 = 0.12 (0.10 to 0.15) over 10 years, D = 100
 * patientText({ result, wording: { outcome: 'heart failure needing hospital care', exposure: 'HbA1c in the prediabetes range', comparison: 'normal HbA1c' }, people: 'women aged 50 to 59', horizonYears: 10 })
 * //=> { ok: true, value: { referenceSentence: "Think of 100 women aged 50 to 59 like you. All of them have normal HbA1c. In the next 10 years, about 8 out of 100 will have heart failure needing hospital care. The other 92 out of 100 will not.", differenceSentence: "That is about 4 more out of 100.", … } }
 */
export function patientText(input: PatientTextInput): Result<PatientText> {
  const issues = requiredIssues(input);
  if (issues.length > 0) return fail(issues);

  const { result } = input;
  const horizonYears = result.horizonYears;
  const people = clean(input.people);
  const likeYou = input.audience === 'group' ? '' : ' like you';
  const outcome = clean(input.wording?.outcome);
  const exposure = clean(input.wording?.exposure) || DEFAULT_EXPOSURE;
  const comparison = clean(input.wording?.comparison);
  const exposedGroup = `with ${exposure}`;
  const comparisonGroup = comparison ? `with ${comparison}` : `without ${exposure}`;

  const counts = result.iconArray;
  const D = counts.denominator;
  const d = formatCount(D);
  const refLayout = referenceLayout(counts);
  const expLayout = exposedLayout(counts);

  // Short sentences: who the group is, then what it has, then the two frames.
  const referenceWho = comparison ? `All of them have ${comparison}.` : `None of them have ${exposure}.`;
  const exposedWho = `All of them have ${exposure}.`;
  const referenceSentence = groupSentence('Think of', people, likeYou, referenceWho, counts.referenceEvents, D, result.referenceRisk, outcome, horizonYears);
  const exposedSentence = groupSentence('Now think of', people, likeYou, exposedWho, counts.exposedEvents, D, result.exposedRisk.estimate, outcome, horizonYears);

  const diff = counts.exposedEvents - counts.referenceEvents;
  const direction = diff > 0 ? 'more' : diff < 0 ? 'fewer' : 'same';
  let differenceSentence: string;
  if (diff !== 0) differenceSentence = `That is about ${formatCount(Math.abs(diff))} ${direction} out of ${d}.`;
  else if (result.riskDifference.estimate !== 0) differenceSentence = `The difference between the two groups is less than 1 out of ${d}.`;
  else differenceSentence = `That is the same number as for people ${comparisonGroup}.`;

  const point = eventsOutOf(counts.exposedEvents, D, result.exposedRisk.estimate).replace(/^about /, '');
  const lowerText = eventsOutOf(counts.exposedLower, D, result.exposedRisk.lower).replace(/^about /, '').replace(/ out of .*$/, '');
  const upperText = eventsOutOf(counts.exposedUpper, D, result.exposedRisk.upper).replace(/^about /, '');
  const rangeSentence =
    counts.exposedLower < counts.exposedUpper
      ? `The study\u2019s range means the ${point} could be anywhere from ${lowerText} to ${upperText}.`
      : `The study\u2019s range gives the same number, ${point}.`;

  const crossesNull = result.riskDifference.lower <= 0 && result.riskDifference.upper >= 0;
  const noDifferenceSentence = crossesNull
    ? `This range includes the number for people ${comparisonGroup}, so there may be no real difference.`
    : undefined;

  const referenceCaption = referenceSentence;
  const exposedCaption = [exposedSentence, differenceSentence, rangeSentence, noDifferenceSentence].filter((s) => s !== undefined).join(' ');
  const time = overTheNext(horizonYears);

  const reference: ArrayText = {
    key: 'reference',
    heading: capitalise(comparisonGroup),
    title: `${d} ${people} ${comparisonGroup}, ${time}`,
    caption: referenceCaption,
    alt: referenceCaption,
    legend: referenceLegend(refLayout, outcome),
    layout: refLayout,
  };
  const exposed: ArrayText = {
    key: 'exposed',
    heading: capitalise(exposedGroup),
    title: `${d} ${people} ${exposedGroup}, ${time}`,
    caption: exposedCaption,
    alt: exposedCaption,
    legend: exposedLegend(expLayout, outcome, exposedGroup, comparisonGroup, { lower: counts.exposedLower, upper: counts.exposedUpper }),
    layout: expLayout,
  };

  const row = (group: string, count: number, risk: number): DataTableRow => ({
    group: capitalise(group),
    willHave: eventsOutOf(count, D, risk),
    willNotHave: count <= 0 && risk > 0 ? `more than ${formatCount(D - 1)} out of ${d}` : count >= D && risk < 1 ? `fewer than 1 out of ${d}` : `about ${formatCount(D - count)} out of ${d}`,
  });

  const means = [
    `Each figure in the pictures stands for one person.`,
    `The numbers are for a large group of people${likeYou}. They are not about you alone.`,
  ];
  const doesNotMean = [
    `They cannot tell what will happen to you. No one can say which people in the group will have it.`,
    ...(result.design === 'trial'
      ? []
      : [`The study found a link. A link does not prove that one thing causes the other.`]),
    `Other things about your health can make your own chances higher or lower.`,
  ];

  return ok({
    denominator: D,
    horizonYears,
    people,
    groupLine: `${capitalise(people)}${likeYou}, ${time}`,
    outcome,
    exposure,
    comparisonGroup,
    exposedGroup,
    direction,
    referenceSentence,
    exposedSentence,
    differenceSentence,
    rangeSentence,
    noDifferenceSentence,
    reference,
    exposed,
    dataTable: {
      caption: `Out of ${d} ${people}${likeYou}, ${time}`,
      headers: { group: 'Group', willHave: `Will have ${outcome}`, willNotHave: 'Will not' },
      rows: [
        row(comparisonGroup, counts.referenceEvents, result.referenceRisk),
        row(exposedGroup, counts.exposedEvents, result.exposedRisk.estimate),
      ],
    },
    means,
    doesNotMean,
    caution: CAUTION_TEXT,
    teachBackIntro: 'Try to answer these in your own words. They check how well we explained things. They are not a test of you.',
    teachBack: [
      `Out of ${d} people${likeYou || ' in this group'}, about how many will have ${outcome} ${inTheNext(horizonYears)}?`,
      `What is the difference for people ${exposedGroup}?`,
      `What can these numbers not tell us about you?`,
    ],
  });
}

/**
 * All the patient prose of a {@link PatientText}, as one text for the readability score:
 * the sentences, the meaning, the caution and the teach-back questions. Titles and legend
 * labels are left out: they are labels, not prose, and the grade formula is for prose.
 */
export function patientProse(text: PatientText): string {
  return [
    text.reference.caption,
    text.exposed.caption,
    ...text.means,
    ...text.doesNotMean,
    text.caution,
    text.teachBackIntro,
    ...text.teachBack,
  ].join('\n');
}

/**
 * Every string of a {@link PatientText} shown to the patient, labels included: what the
 * phrasing checks (no "1 in X", one denominator) run over.
 */
export function allPatientStrings(text: PatientText): string[] {
  const arrayStrings = (a: ArrayText) => [a.heading, a.title, a.caption, a.alt, ...a.legend.map((l) => l.text)];
  return [
    text.groupLine,
    ...arrayStrings(text.reference),
    ...arrayStrings(text.exposed),
    text.dataTable.caption,
    ...text.dataTable.rows.flatMap((r) => [r.group, r.willHave, r.willNotHave]),
    ...text.means,
    ...text.doesNotMean,
    text.caution,
    text.teachBackIntro,
    ...text.teachBack,
  ];
}
