/**
 * The choices the form offers, each with one plain sentence for the clinician saying what it
 * means. What each design's odds ratio estimates follows lib/engine/conversion.ts (Zhang & Yu
 * 1998; Greenland & Thomas 1982; Rodrigues & Kirkwood 1990; Knol et al. 2008).
 */
import { EFFECT_MEASURES, INTERVAL_LEVELS, STUDY_DESIGNS } from '../scenario/schema';
import { formatLevel } from '../wording/format';

/** One option of a choice field: its value in the form, its label and, when useful, what it means. */
export interface Choice {
  readonly value: string;
  readonly label: string;
  /** One plain sentence saying what the choice means. */
  readonly explanation?: string;
}

/** The values of a list of choices, for a zod enum: the form's choices and its schema are one list. */
export function choiceValues<const T extends readonly { readonly value: string }[]>(choices: T): [T[number]['value'], ...T[number]['value'][]] {
  const values = choices.map((choice) => choice.value);
  return values as [T[number]['value'], ...T[number]['value'][]];
}

/** Labels keyed by value, so a value the engine adds cannot be missing from the form (type-checked). */
function fromLabels<K extends string>(order: readonly K[], labels: Record<K, Omit<Choice, 'value'>>): { readonly value: K; readonly label: string; readonly explanation?: string }[] {
  return order.map((value) => ({ value, ...labels[value] }));
}

export const BASELINE_SOURCE_CHOICES = [
  { value: 'table', label: 'Look it up in a population table', explanation: 'Pick a table and the person’s age and sex; the screen finds the matching group’s risk.' },
  { value: 'risk', label: 'Enter a risk over a period', explanation: 'A risk in the comparison group over a number of years, as a fraction (0.08 means 8 in 100).' },
  { value: 'rate', label: 'Enter an event rate', explanation: 'New events per so many person-years (for example 12 per 1000), turned into a risk over the horizon.' },
  {
    value: 'population',
    label: 'Enter a population-average risk',
    explanation: 'The risk in a whole population, exposed and unexposed together, with how common the exposure is; the screen works out the comparison group’s risk.',
  },
] as const;

export const MEASURE_CHOICES = fromLabels(EFFECT_MEASURES, {
  OR: { label: 'Odds ratio (OR)', explanation: 'Compares the odds of the outcome between the groups; it is turned into risks according to the study design below.' },
  RR: { label: 'Risk ratio (RR)', explanation: 'The risk in the exposed group divided by the risk in the comparison group over the study’s follow-up.' },
  HR: { label: 'Hazard ratio (HR)', explanation: 'Compares the rate of new events at any moment of follow-up, assumed to stay the same over time.' },
});

export const DESIGN_CHOICES = fromLabels(['', ...STUDY_DESIGNS], {
  '': { label: 'Not stated', explanation: 'Treated as a cohort study.' },
  cohort: { label: 'Cohort', explanation: 'People grouped by exposure and followed forward in time; an odds ratio from such a study is converted with the baseline risk (Zhang and Yu).' },
  trial: { label: 'Randomised trial', explanation: 'The exposure or treatment was assigned by chance, so the groups differ mainly by chance.' },
  'cross-sectional': {
    label: 'Cross-sectional survey',
    explanation: 'Exposure and outcome were measured at the same time, so the ratio compares how common the outcome is, not new cases over time.',
  },
  'case-control': {
    label: 'Case-control, controls from people without the outcome',
    explanation: 'Its odds ratio is a risk odds ratio, so it is converted with the baseline risk, and it is near the risk ratio only when the outcome is rare.',
  },
  'risk-set-case-control': {
    label: 'Case-control with risk-set sampling (e.g. nested in a cohort)',
    explanation:
      'Controls were drawn from people still at risk when each case occurred, so the odds ratio estimates the rate (hazard) ratio without any rare-disease assumption.',
  },
  'case-cohort': { label: 'Case-cohort', explanation: 'Controls were drawn from the whole cohort at its start, so the odds ratio estimates the risk ratio.' },
  'matched-case-control': {
    label: 'Matched case-control, controls from people without the outcome',
    explanation: 'A conditional odds ratio, adjusted for the matching factors; converted with the baseline risk like a risk odds ratio.',
  },
  'matched-risk-set-case-control': {
    label: 'Matched case-control with risk-set sampling',
    explanation: 'A conditional odds ratio from controls still at risk when each case occurred: read as a rate (hazard) ratio.',
  },
});

/** "0.95" → "95%": the interval levels the scenario schema accepts, most common first. */
const LEVEL_ORDER = [0.95, ...INTERVAL_LEVELS.filter((level) => level !== 0.95)];
export const LEVEL_CHOICES_FOR_FORM = [
  { value: '', label: 'Not stated (95% assumed)' },
  ...LEVEL_ORDER.map((level) => ({ value: String(level) as `${(typeof INTERVAL_LEVELS)[number]}`, label: formatLevel(level) })),
] as const;

export const ADJUSTED_CHOICES_FOR_FORM = [
  { value: '', label: 'Not stated', explanation: 'The screen gives no warning either way.' },
  { value: 'yes', label: 'Adjusted', explanation: 'The estimate allows for other differences between the groups, such as age or smoking.' },
  { value: 'no', label: 'Unadjusted', explanation: 'A crude comparison, so other differences between the groups may explain part of it.' },
] as const;

export const SEX_CHOICES_FOR_FORM = [
  { value: '', label: 'Not given' },
  { value: 'female', label: 'Female' },
  { value: 'male', label: 'Male' },
] as const;

export const DENOMINATOR_CHOICES_FOR_FORM = [
  { value: 'auto', label: 'Automatic', explanation: '100 people when every count is a whole person, otherwise 1,000.' },
  { value: '100', label: '100 people', explanation: 'Easiest to take in; a risk below half a person in 100 then shows as no one.' },
  { value: '1000', label: '1,000 people', explanation: 'Shows small risks and small differences, at the cost of a busier picture.' },
] as const;
