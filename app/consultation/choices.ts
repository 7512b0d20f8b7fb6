/**
 * The choices the form offers, each with one plain sentence for the clinician saying what it
 * means. What each design's odds ratio estimates follows lib/engine/conversion.ts (Zhang & Yu
 * 1998; Greenland & Thomas 1982; Rodrigues & Kirkwood 1990; Knol et al. 2008).
 */
import type { Choice } from './fields';

export const BASELINE_SOURCE_CHOICES: readonly Choice[] = [
  { value: 'table', label: 'Look it up in a population table', explanation: 'Pick a table and the person’s age and sex; the screen finds the matching group’s risk.' },
  { value: 'risk', label: 'Enter a risk over a period', explanation: 'A risk in the comparison group over a number of years, as a fraction (0.08 means 8 in 100).' },
  { value: 'rate', label: 'Enter an event rate', explanation: 'New events per so many person-years (for example 12 per 1000), turned into a risk over the horizon.' },
  {
    value: 'population',
    label: 'Enter a population-average risk',
    explanation: 'The risk in a whole population, exposed and unexposed together, with how common the exposure is; the screen works out the comparison group’s risk.',
  },
];

export const MEASURE_CHOICES: readonly Choice[] = [
  { value: 'OR', label: 'Odds ratio (OR)', explanation: 'Compares the odds of the outcome between the groups; it is turned into risks according to the study design below.' },
  { value: 'RR', label: 'Risk ratio (RR)', explanation: 'The risk in the exposed group divided by the risk in the comparison group over the study’s follow-up.' },
  { value: 'HR', label: 'Hazard ratio (HR)', explanation: 'Compares the rate of new events at any moment of follow-up, assumed to stay the same over time.' },
];

export const DESIGN_CHOICES: readonly Choice[] = [
  { value: '', label: 'Not stated', explanation: 'Treated as a cohort study.' },
  { value: 'cohort', label: 'Cohort', explanation: 'People grouped by exposure and followed forward in time; an odds ratio from such a study is converted with the baseline risk (Zhang and Yu).' },
  { value: 'trial', label: 'Randomised trial', explanation: 'The exposure or treatment was assigned by chance, so the groups differ mainly by chance.' },
  {
    value: 'cross-sectional',
    label: 'Cross-sectional survey',
    explanation: 'Exposure and outcome were measured at the same time, so the ratio compares how common the outcome is, not new cases over time.',
  },
  {
    value: 'case-control',
    label: 'Case-control, controls from people without the outcome',
    explanation: 'Its odds ratio is a risk odds ratio, so it is converted with the baseline risk, and it is near the risk ratio only when the outcome is rare.',
  },
  {
    value: 'risk-set-case-control',
    label: 'Case-control with risk-set sampling (e.g. nested in a cohort)',
    explanation:
      'Controls were drawn from people still at risk when each case occurred, so the odds ratio estimates the rate (hazard) ratio without any rare-disease assumption.',
  },
  { value: 'case-cohort', label: 'Case-cohort', explanation: 'Controls were drawn from the whole cohort at its start, so the odds ratio estimates the risk ratio.' },
  {
    value: 'matched-case-control',
    label: 'Matched case-control, controls from people without the outcome',
    explanation: 'A conditional odds ratio, adjusted for the matching factors; converted with the baseline risk like a risk odds ratio.',
  },
  {
    value: 'matched-risk-set-case-control',
    label: 'Matched case-control with risk-set sampling',
    explanation: 'A conditional odds ratio from controls still at risk when each case occurred: read as a rate (hazard) ratio.',
  },
];

export const LEVEL_CHOICES_FOR_FORM: readonly Choice[] = [
  { value: '', label: 'Not stated (95% assumed)' },
  { value: '0.95', label: '95%' },
  { value: '0.9', label: '90%' },
  { value: '0.99', label: '99%' },
];

export const ADJUSTED_CHOICES_FOR_FORM: readonly Choice[] = [
  { value: '', label: 'Not stated', explanation: 'The screen gives no warning either way.' },
  { value: 'yes', label: 'Adjusted', explanation: 'The estimate allows for other differences between the groups, such as age or smoking.' },
  { value: 'no', label: 'Unadjusted', explanation: 'A crude comparison, so other differences between the groups may explain part of it.' },
];

export const SEX_CHOICES_FOR_FORM: readonly Choice[] = [
  { value: '', label: 'Not given' },
  { value: 'female', label: 'Female' },
  { value: 'male', label: 'Male' },
];

export const DENOMINATOR_CHOICES_FOR_FORM: readonly Choice[] = [
  { value: 'auto', label: 'Automatic', explanation: '100 people when every count is a whole person, otherwise 1,000.' },
  { value: '100', label: '100 people', explanation: 'Easiest to take in; a risk below half a person in 100 then shows as no one.' },
  { value: '1000', label: '1,000 people', explanation: 'Shows small risks and small differences, at the cost of a busier picture.' },
];
