/**
 * Chart data for "risk by horizon": the risk in both groups at each whole year from 1 to the
 * chosen horizon H (and at H itself when it is not a whole number), each computed by the
 * engine for the same scenario with that horizon.
 *
 * Every point is a full {@link computeScenario} run, so the curve uses exactly the engine's
 * rules: the baseline rescaled under a constant hazard, p(t) = 1 − (1 − p1)^(t/t1), or from a
 * rate, p(t) = 1 − exp(−λt) (Miller & Homan 1994, Med Decis Making 14:52), then the conversion by
 * measure and design with the ratio held constant over time (an assumption the screen states;
 * Cook & Sackett 1995, BMJ 310:452), and the limits through the same formula (Cochrane Handbook
 * §12.5.4.5). Values are in per cent.
 */
import { computeScenario } from '../engine/compute';
import { fail, ok, type Result } from '../result';
import type { Scenario } from '../scenario/schema';
import { MAX_YEARS } from '../scenario/schema';
import { intervalLabel } from '../wording/format';

export interface RiskAtHorizon {
  readonly horizonYears: number;
  readonly referencePercent: number;
  readonly exposedPercent: number;
  readonly exposedLowerPercent: number;
  readonly exposedUpperPercent: number;
  /** [lower, upper] in per cent: the band the chart shades around the exposed line. */
  readonly exposedBandPercent: readonly [number, number];
}

/**
 * The horizons the chart shows: 1, 2, …, ⌊H⌋, then H if it is not whole; just H when H < 1.
 * @example
 * chartHorizons(3.5) //=> [1, 2, 3, 3.5]
 */
export function chartHorizons(horizonYears: number): number[] {
  if (!(horizonYears > 0 && horizonYears <= MAX_YEARS)) return [];
  const out: number[] = [];
  for (let year = 1; year <= horizonYears; year += 1) out.push(year);
  if (out[out.length - 1] !== horizonYears) out.push(horizonYears);
  return out;
}

/**
 * @param horizonYears - the horizon the result is given over (ComputeResult.horizonYears)
 * @example
 * riskByHorizon({ baseline: { risk: 0.19, years: 2 }, effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 2.5 } }, 2)
 * //=> { ok: true, value: [{ horizonYears: 1, referencePercent: 10, exposedPercent: 20, … }, { horizonYears: 2, referencePercent: 19, exposedPercent: 38, … }] }
 */
export function riskByHorizon(scenario: Scenario, horizonYears: number): Result<RiskAtHorizon[]> {
  const horizons = chartHorizons(horizonYears);
  if (horizons.length === 0) {
    return fail([{ code: 'out-of-range', path: ['horizonYears'], message: `The horizon must be greater than 0 and at most ${MAX_YEARS} years` }]);
  }
  const points: RiskAtHorizon[] = [];
  for (const years of horizons) {
    const computed = computeScenario({ ...scenario, horizonYears: years });
    if (!computed.ok) return fail(computed.issues);
    const { referenceRisk, exposedRisk } = computed.value;
    const lower = exposedRisk.lower * 100;
    const upper = exposedRisk.upper * 100;
    points.push({
      horizonYears: years,
      referencePercent: referenceRisk * 100,
      exposedPercent: exposedRisk.estimate * 100,
      exposedLowerPercent: lower,
      exposedUpperPercent: upper,
      exposedBandPercent: [lower, upper],
    });
  }
  return ok(points);
}

/**
 * A value already in per cent, one decimal, as the clinician view writes percentages
 * (lib/wording/format.ts formatPercent does the same from a fraction): 8 → "8.0%".
 */
export function formatPercentValue(percent: number): string {
  return `${percent.toLocaleString('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 })}%`;
}

/**
 * The chart's visible sentence, which is also its text alternative: the two groups' risks at
 * the first and the last horizon shown.
 *
 * @param groups - "with …" phrases, e.g. from lib/wording's patient text
 * @example
 * describeRiskByHorizon(points, { exposed: 'with HbA1c in the prediabetes range', comparison: 'with normal HbA1c' })
 * //=> "Risk by year, from 1 to 10 years: at 1 year 0.8% with HbA1c in the prediabetes range and 0.6% with normal HbA1c; at 10 years 12.0% (95% CI 9.6% to 15.2%) and 8.0%."
 */
export function describeRiskByHorizon(points: readonly RiskAtHorizon[], groups: { exposed: string; comparison: string }, level = 0.95): string {
  const first = points[0];
  const last = points[points.length - 1];
  if (!first || !last) return 'No horizon to show.';
  const years = (y: number) => (y === 1 ? '1 year' : `${y.toLocaleString('en', { maximumFractionDigits: 1 })} years`);
  const ci = intervalLabel(level);
  const at = (p: RiskAtHorizon, named: boolean) =>
    named
      ? `${formatPercentValue(p.exposedPercent)} ${groups.exposed} and ${formatPercentValue(p.referencePercent)} ${groups.comparison}`
      : `${formatPercentValue(p.exposedPercent)} (${ci} ${formatPercentValue(p.exposedLowerPercent)} to ${formatPercentValue(p.exposedUpperPercent)}) and ${formatPercentValue(p.referencePercent)}`;
  if (first === last) return `Risk at ${years(last.horizonYears)}: ${at(last, true)}.`;
  return `Risk by year, from ${years(first.horizonYears)} to ${years(last.horizonYears)}: at ${years(first.horizonYears)} ${at(first, true)}; at ${years(last.horizonYears)} ${at(last, false)}.`;
}
