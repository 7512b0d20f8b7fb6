/**
 * The engine's cautions, as data: a stable code and a plain message for the clinician.
 * Codes are documented in DEVELOPERS.md and never renamed.
 */
import type { Warning } from '../result';
import type { Effect } from '../scenario/schema';
import type { Conversion } from './types';
import { isLogSymmetric } from './logInterval';

export const WARNING_CODES = [
  'interval-asymmetric',
  'interval-includes-no-effect',
  'odds-ratio-high-baseline',
  'odds-ratio-adjusted',
  'risk-ratio-exceeds-certainty',
  'horizon-beyond-follow-up',
  'unadjusted-estimate',
  'risk-ratio-from-case-control',
] as const;
export type WarningCode = (typeof WARNING_CODES)[number];

/** Baseline above which an odds ratio no longer approximates the risk ratio (Zhang & Yu 1998). */
export const ODDS_RATIO_BASELINE_LIMIT = 0.1;

function fmt(value: number): string {
  return Number(value.toPrecision(3)).toString();
}

export interface WarningContext {
  readonly effect: Effect;
  readonly conversion: Conversion;
  readonly referenceRisk: number;
  readonly horizonYears: number;
}

/** Every caution that applies to a valid scenario, in a fixed order. */
export function scenarioWarnings({ effect, conversion, referenceRisk, horizonYears }: WarningContext): Warning[] {
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
      message: `The baseline risk (${fmt(referenceRisk * 100)}%) is above 10%, where an odds ratio is clearly larger than the risk ratio it implies. It has been converted (Zhang & Yu), but treat the figures as approximate.`,
    });
  }
  if (conversion === 'risk-odds-ratio' && effect.adjusted === true) {
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
  if (effect.adjusted === false) {
    out.push({
      code: 'unadjusted-estimate',
      message: 'The estimate is unadjusted: part of the difference may come from other differences between the groups (age, other risk factors), not from the exposure.',
    });
  }
  if (effect.measure === 'RR' && (design === 'case-control' || design === 'risk-set-case-control')) {
    out.push({
      code: 'risk-ratio-from-case-control',
      message: 'A case-control study cannot estimate a risk ratio directly; check whether the paper reports an odds ratio.',
    });
  }
  return out;
}
