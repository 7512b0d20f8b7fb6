/**
 * The clinician-side sentences: the risk ratio at this baseline, the risk difference in
 * percentage points and the number needed, each with its interval and with both absolute
 * risks beside it (relative figures never stand alone: Akl et al. 2011, Cochrane Database
 * Syst Rev CD006776). The engine's warnings are already plain
 * words for the clinician and pass through unchanged.
 *
 * The intervals hold the baseline fixed, so they ignore its uncertainty (Cochrane Handbook
 * §12.5.4.5); {@link ClinicianText.intervalNote} says so.
 */
import type { ComputeResult } from '../engine/types';
import { phraseText } from '../text';
import type { Warning } from '../result';
import type { Wording } from '../scenario/schema';
import { formatCount, formatPercent, formatPercentagePoints, formatRatio, intervalLabel, overTheNext } from './format';
import { DEFAULT_EXPOSURE } from './patient';

export interface ClinicianText {
  /** "Absolute risk over the next 10 years: 12.0% (95% CI 9.6% to 15.2%) with …; 8.0% with …." */
  readonly absoluteRisks: string;
  readonly riskRatio: string;
  readonly riskDifference: string;
  readonly numberNeeded: string;
  readonly intervalNote: string;
  /** The engine's warnings, unchanged. */
  readonly warnings: readonly Warning[];
}

const MEASURE_NAMES = { OR: 'odds ratio', RR: 'risk ratio', HR: 'hazard ratio' } as const;

const trimmed = phraseText;

/**
 * @example
 * clinicianText(result, { exposure: 'HbA1c in the prediabetes range', comparison: 'normal HbA1c' }).riskDifference
 * //=> "Risk difference over the next 10 years: +4.0 percentage points (95% CI +1.6 to +7.2); 12.0% with HbA1c in the prediabetes range vs 8.0% with normal HbA1c."
 */
export function clinicianText(result: ComputeResult, wording?: Wording): ClinicianText {
  const ci = intervalLabel(result.level);
  const exposure = trimmed(wording?.exposure) || DEFAULT_EXPOSURE;
  const comparison = trimmed(wording?.comparison);
  const exposedGroup = `with ${exposure}`;
  const comparisonGroup = comparison ? `with ${comparison}` : `without ${exposure}`;
  const time = overTheNext(result.horizonYears);
  const { exposedRisk: p1, riskRatio: rr, riskDifference: rd, iconArray: counts } = result;
  const p0Text = formatPercent(result.referenceRisk);
  const p1Text = formatPercent(p1.estimate);
  const both = `${p1Text} ${exposedGroup} vs ${p0Text} ${comparisonGroup}`;
  const d = formatCount(counts.denominator);

  return {
    absoluteRisks: `Absolute risk ${time}: ${p1Text} (${ci} ${formatPercent(p1.lower)} to ${formatPercent(p1.upper)}) ${exposedGroup}; ${p0Text} ${comparisonGroup}.`,
    riskRatio: `Risk ratio at this baseline: ${formatRatio(rr.estimate)} (${ci} ${formatRatio(rr.lower)} to ${formatRatio(rr.upper)}), from the reported ${MEASURE_NAMES[result.measure]}; ${both} ${time}.`,
    riskDifference: `Risk difference ${time}: ${formatPercentagePoints(rd.estimate)} percentage points (${ci} ${formatPercentagePoints(rd.lower)} to ${formatPercentagePoints(rd.upper)}); ${both}.`,
    numberNeeded: `${result.numberNeeded.text} ${time}; ${formatCount(counts.exposedEvents)} vs ${formatCount(counts.referenceEvents)} out of ${d} (${both}).${
      // Issue 11 item 15: the same count in both pictures beside a finite number needed.
      counts.exposedEvents === counts.referenceEvents && rd.estimate !== 0 ? ` The difference is less than one person in the picture of ${d}.` : ''
    }`,
    intervalNote: 'The intervals come from the ratio\u2019s interval with the baseline held fixed; they leave out any uncertainty in the baseline (Cochrane Handbook \u00a712.5.4.5).',
    warnings: result.warnings,
  };
}
