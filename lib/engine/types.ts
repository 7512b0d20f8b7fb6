/**
 * The shape of one computed result. Every number the screen, the handout and the command line
 * show comes from an object of this type, made by {@link computeScenario} in ./compute.ts.
 */
import type { Warning } from '../result';
import type { Denominator, EffectMeasure, IntervalLevel, StudyDesign } from '../scenario/schema';

/** A point value and its interval limits, at the effect's interval level. */
export interface Estimate {
  readonly estimate: number;
  readonly lower: number;
  readonly upper: number;
}

/**
 * How the reported ratio was turned into an exposed-group risk:
 * - `risk-ratio`: P1 = RR·P0 (risk ratios; case-cohort odds ratios)
 * - `risk-odds-ratio`: Zhang–Yu, P1 = OR·P0 / (1 − P0 + OR·P0)
 * - `rate-ratio`: P1 = 1 − (1 − P0)^ratio (hazard ratios; risk-set sampled odds ratios)
 */
export type Conversion = 'risk-ratio' | 'risk-odds-ratio' | 'rate-ratio';

export type Direction = 'harm' | 'benefit' | 'none';

/** One end of a number-needed interval. `value` is null for infinity (no effect). */
export interface NumberNeededLimit {
  readonly direction: Direction;
  /** 1/|risk difference| at this limit, unrounded; null when the difference is 0. */
  readonly value: number | null;
  /** `value` rounded up to a whole person for display; null when infinite. */
  readonly display: number | null;
}

export interface NumberNeeded {
  readonly direction: Direction;
  /** 1/|RD|, unrounded; null when RD = 0 (infinitely many). */
  readonly estimate: number | null;
  /** The estimate rounded up (Cochrane Handbook §12.5.4.1); null when infinite. */
  readonly display: number | null;
  /** True when the risk-difference interval includes 0, so the interval passes through infinity. */
  readonly crossesNull: boolean;
  /** The interval's two ends, written from the benefit side to the harm side. */
  readonly interval: { readonly from: NumberNeededLimit; readonly to: NumberNeededLimit };
  /** For the clinician, e.g. "NNTH 25 (95% CI: NNTB 200 to ∞ to NNTH 12)". */
  readonly text: string;
}

/**
 * Icon-array counts at one denominator. Counts come from rounding the cumulative risks, so each
 * array agrees with its sentence; they are whole and never exceed the denominator.
 */
export interface IconArrayCounts {
  readonly denominator: Denominator;
  /** True when the engine chose the denominator by its rule; false when the scenario set it. */
  readonly automatic: boolean;
  /** round(P0·D): people in the reference group who have the outcome. */
  readonly referenceEvents: number;
  /** round(P1·D) at the estimate. */
  readonly exposedEvents: number;
  /** round(P1·D) at the lower and upper limits of the ratio's interval. */
  readonly exposedLower: number;
  readonly exposedUpper: number;
}

export interface ComputeResult {
  readonly horizonYears: number;
  /** P0 over the horizon, a fraction in (0, 1). */
  readonly referenceRisk: number;
  readonly exposedRisk: Estimate;
  /** The risk ratio P1/P0 at this baseline (for an OR or HR it differs from the reported ratio). */
  readonly riskRatio: Estimate;
  /** P1 − P0 with its interval. */
  readonly riskDifference: Estimate;
  readonly numberNeeded: NumberNeeded;
  readonly iconArray: IconArrayCounts;
  readonly warnings: readonly Warning[];
  /**
   * Standing notes that hold for every result (issue 11 item 9): the interval leaves out the
   * baseline's own uncertainty, and the relative effect is assumed constant across baselines and
   * within the study's follow-up. Codes in {@link import('./warnings').ASSUMPTION_CODES}.
   */
  readonly assumptions: readonly Warning[];
  readonly measure: EffectMeasure;
  readonly design: StudyDesign;
  readonly level: IntervalLevel;
  readonly conversion: Conversion;
}
