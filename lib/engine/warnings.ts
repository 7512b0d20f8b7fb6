/**
 * The engine's cautions, as data: a stable code and a plain message for the clinician.
 * Codes are documented in DEVELOPERS.md and never renamed.
 */
import type { Warning } from '../result';
import type { Baseline, Effect, StudyDesign } from '../scenario/schema';
import type { Conversion } from './types';
import { isLogSymmetric } from './logInterval';
import { referenceRiskFromPopulation } from './baseline';

export const WARNING_CODES = [
  'interval-asymmetric',
  'interval-includes-no-effect',
  'odds-ratio-high-baseline',
  'odds-ratio-adjusted',
  'risk-ratio-exceeds-certainty',
  'horizon-beyond-follow-up',
  'unadjusted-estimate',
  'risk-ratio-from-case-control',
  'baseline-extrapolated',
  'cross-sectional-prevalence',
  'measure-unusual-for-design',
  'table-prevalence-unknown',
] as const;
export type WarningCode = (typeof WARNING_CODES)[number];

/** Codes of the standing notes every result carries ({@link standingAssumptions}). */
export const ASSUMPTION_CODES = ['baseline-uncertainty-not-included', 'constant-relative-effect'] as const;

/**
 * The assumptions behind every result, as notes (methods guide, "Confidence intervals" and
 * "Caveats": Cochrane Handbook §12.5.4.5 holds the baseline fixed; Cook & Sackett 1995, BMJ
 * 310:452, and Chatellier et al. 1996, BMJ, on applying a relative effect to another baseline).
 */
export function standingAssumptions(level: number): Warning[] {
  return [
    {
      code: 'baseline-uncertainty-not-included',
      message: `The ${Number((level * 100).toFixed(1))}% interval comes from the study's ratio alone: the baseline risk is held fixed, so its own uncertainty is not included and the true range is wider.`,
    },
    {
      code: 'constant-relative-effect',
      message: "Applying the study's relative effect to this baseline assumes the effect is the same at every baseline risk, and holds only within the study's follow-up.",
    },
  ];
}

/** Baseline above which an odds ratio no longer approximates the risk ratio (Zhang & Yu 1998). */
export const ODDS_RATIO_BASELINE_LIMIT = 0.1;

/**
 * Stretching a baseline beyond this many times its own period, or beyond
 * {@link EXTRAPOLATION_YEARS}, assumes a constant hazard far beyond what was observed (methods
 * guide, "Baselines": incidence rising with age and competing death make that wrong in both
 * directions).
 */
export const EXTRAPOLATION_FACTOR = 2;
export const EXTRAPOLATION_YEARS = 20;

/**
 * The exposure prevalence used to show the size of the population-average effect when a table
 * gives none: 20%, an illustrative middle value for common cardiometabolic exposures (common
 * practice; the message says it is an example).
 */
export const TYPICAL_EXPOSURE_PREVALENCE = 0.2;

/** Designs whose odds ratio is conditional on matching (conditional logistic regression). */
export const MATCHED_DESIGNS: readonly StudyDesign[] = ['matched-case-control', 'matched-risk-set-case-control'];
const CASE_CONTROL_DESIGNS: readonly StudyDesign[] = ['case-control', 'risk-set-case-control', ...MATCHED_DESIGNS];

/**
 * Whether an estimate counts as adjusted for the bias warning: stated as adjusted, or a matched
 * design's conditional odds ratio, which is adjusted for the matching factors (Pearce 2016, BMJ
 * 352:i969, from memory).
 */
export function countsAsAdjusted(effect: Effect): boolean {
  return effect.adjusted === true || MATCHED_DESIGNS.includes(effect.design ?? 'cohort');
}

function fmt(value: number): string {
  return Number(value.toPrecision(3)).toString();
}

export interface WarningContext {
  readonly effect: Effect;
  readonly conversion: Conversion;
  readonly referenceRisk: number;
  readonly horizonYears: number;
  /** The scenario's baseline, for the extrapolation and population-table warnings. */
  readonly baseline?: Baseline | undefined;
  /** The table the baseline was looked up in, when it was. */
  readonly tableId?: string | undefined;
}

function times(value: number): string {
  return `${fmt(value)} times`;
}

/** The baseline-extrapolated warning, or null: a risk's own period is its years; a rate has none. */
function extrapolationWarning(baseline: Baseline, horizonYears: number): Warning | null {
  if ('rate' in baseline) {
    if (horizonYears <= EXTRAPOLATION_YEARS) return null;
    return {
      code: 'baseline-extrapolated',
      message: `The event rate is applied over ${fmt(horizonYears)} years, beyond ${EXTRAPOLATION_YEARS} years: this assumes the rate stays the same for that long, but incidence usually rises with age and competing causes of death take people out, so the risk may be too low or too high. Prefer a baseline given over a period close to the horizon.`,
    };
  }
  const period = baseline.years;
  if (horizonYears <= period) return null;
  const factor = horizonYears / period;
  if (factor <= EXTRAPOLATION_FACTOR && horizonYears <= EXTRAPOLATION_YEARS) return null;
  return {
    code: 'baseline-extrapolated',
    message: `The baseline risk over ${fmt(period)} ${period === 1 ? 'year' : 'years'} is stretched to ${fmt(horizonYears)} years (${times(factor)} its own period${horizonYears > EXTRAPOLATION_YEARS ? `, and beyond ${EXTRAPOLATION_YEARS} years` : ''}) assuming a constant hazard; incidence usually rises with age and competing causes of death take people out, so the risk may be too low or too high. Prefer a baseline given over a period close to the horizon.`,
  };
}

/** Every caution that applies to a valid scenario, in a fixed order. */
export function scenarioWarnings({ effect, conversion, referenceRisk, horizonYears, baseline, tableId }: WarningContext): Warning[] {
  const out: Warning[] = [];
  const { estimate, lower, upper } = effect;
  const design = effect.design ?? 'cohort';

  if (!isLogSymmetric(estimate, lower, upper)) {
    out.push({
      code: 'interval-asymmetric',
      message: `The estimate ${estimate} is far from the middle of its interval (${lower} to ${upper}); on the ratio scale the middle is about ${fmt(Math.sqrt(lower * upper))}. Check the numbers against the paper for a typing slip.`,
    });
  }
  if (lower <= 1 && upper >= 1) {
    out.push({
      code: 'interval-includes-no-effect',
      message: `The interval (${lower} to ${upper}) includes 1, no effect: the data are compatible with no difference, or a difference in either direction.`,
    });
  }
  if (conversion === 'risk-odds-ratio' && referenceRisk > ODDS_RATIO_BASELINE_LIMIT) {
    out.push({
      code: 'odds-ratio-high-baseline',
      message: `The baseline risk (${fmt(referenceRisk * 100)}%) is above 10%, where an odds ratio is clearly further from 1 than the risk ratio it implies (${estimate >= 1 ? 'larger, for an odds ratio above 1' : 'smaller, for an odds ratio below 1'}). It has been converted (Zhang & Yu), but treat the figures as approximate.`,
    });
  }
  if (conversion === 'risk-odds-ratio' && countsAsAdjusted(effect)) {
    out.push({
      code: 'odds-ratio-adjusted',
      message: 'Converting an adjusted odds ratio with the baseline risk gives a biased value and an interval that is too narrow when there is confounding (McNutt et al. 2003). It is the usual bedside approximation: read the range as a lower bound on the uncertainty.',
    });
  }
  if (conversion === 'risk-ratio' && upper * referenceRisk >= 1) {
    const at = estimate * referenceRisk >= 1 ? 'estimate' : 'upper limit';
    out.push({
      code: 'risk-ratio-exceeds-certainty',
      message: `At this baseline (${fmt(referenceRisk * 100)}%) the risk ratio's ${at} would give a risk of 100% or more, so it cannot apply to people like this; the figure has been capped at 100% and should not be used as it stands.`,
    });
  }
  if (effect.followUpYears !== undefined && horizonYears > effect.followUpYears) {
    out.push({
      code: 'horizon-beyond-follow-up',
      message: `The horizon (${horizonYears} years) is longer than the study's follow-up (${effect.followUpYears} years); the effect is assumed to hold beyond what the study observed.`,
    });
  }
  if (effect.adjusted === false && !MATCHED_DESIGNS.includes(design)) {
    out.push({
      code: 'unadjusted-estimate',
      message: 'The estimate is unadjusted: part of the difference may come from other differences between the groups (age, other risk factors), not from the exposure.',
    });
  }
  if (effect.measure === 'RR' && CASE_CONTROL_DESIGNS.includes(design)) {
    out.push({
      code: 'risk-ratio-from-case-control',
      message: 'A case-control study cannot estimate a risk ratio directly; check whether the paper reports an odds ratio.',
    });
  }
  if ((effect.measure === 'HR' && CASE_CONTROL_DESIGNS.includes(design)) || (effect.measure !== 'OR' && design === 'cross-sectional')) {
    const study = design === 'cross-sectional' ? 'A cross-sectional study' : 'A case-control study';
    const measureName = effect.measure === 'HR' ? 'hazard ratio' : 'risk ratio';
    out.push({
      code: 'measure-unusual-for-design',
      message: `${study} does not usually report a ${measureName}; check the measure and the design against the paper (such studies usually report an odds ratio${design === 'cross-sectional' ? ' or a prevalence ratio' : ''}).`,
    });
  }
  if (design === 'cross-sectional') {
    out.push({
      code: 'cross-sectional-prevalence',
      message: `A cross-sectional study compares how common the outcome is at one time (prevalence), not how often new cases arise; applying its ratio to new cases over ${fmt(horizonYears)} years is a further assumption.`,
    });
  }
  if (baseline !== undefined) {
    const stretched = extrapolationWarning(baseline, horizonYears);
    if (stretched) out.push(stretched);
    if (tableId !== undefined && !('exposurePrevalence' in baseline)) {
      const corrected = referenceRiskFromPopulation(conversion, referenceRisk, estimate, TYPICAL_EXPOSURE_PREVALENCE);
      const over = referenceRisk / corrected - 1;
      out.push({
        code: 'table-prevalence-unknown',
        message: `The table's risk is the average of the whole population, people with the exposure included, and the table gives no prevalence of the exposure, so the comparison group's risk is used as the population's. If ${fmt(TYPICAL_EXPOSURE_PREVALENCE * 100)}% had the exposure (an example), this would ${over >= 0 ? 'overstate' : 'understate'} the comparison group's risk by about ${fmt(Math.abs(over) * 100)}%, and the difference by about as much. Enter the prevalence if you know it.`,
      });
    }
  }
  return out;
}
