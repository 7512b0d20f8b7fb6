/**
 * The engine's front door: one valid {@link Scenario} in, one {@link ComputeResult} out.
 *
 * Steps (each in its own module, with its source):
 * 1. Horizon H: the scenario's, else the baseline's own period.
 * 2. Reference-group risk P0 over H: rescaled from a risk (./baseline.ts), from a rate, or solved
 *    from a population-average risk with the exposure's prevalence (at the ratio's estimate).
 * 3. Conversion by measure and design (./conversion.ts) and the exposed risk P1 at the estimate
 *    and at each interval limit (./exposedRisk.ts). P0 is held fixed, so the limits ignore
 *    uncertainty in the baseline (Cochrane Handbook §12.5.4.5).
 * 4. Risk ratio at this baseline P1/P0, risk difference P1 − P0, number needed (./numberNeeded.ts),
 *    icon-array counts (./iconArray.ts), warnings (./warnings.ts).
 */
import { fail, ok, type Result } from '../result';
import type { Scenario } from '../scenario/schema';
import { referenceRiskFromPopulation, rescaleRisk, riskFromRate } from './baseline';
import { conversionFor } from './conversion';
import { exposedRiskCapped } from './exposedRisk';
import { iconArrayCounts } from './iconArray';
import { numberNeeded } from './numberNeeded';
import type { ComputeResult, Conversion } from './types';
import { scenarioWarnings, standingAssumptions } from './warnings';

/**
 * A reference risk the engine can work with: above 0, and further than a billionth from
 * certainty (beyond that, double precision cannot tell the exposed risk apart, and no
 * consultation concerns such a risk).
 */
function isUsableRisk(p0: number): boolean {
  return p0 > 0 && p0 < 1 - 1e-9;
}

/** The horizon the result is given over: the scenario's own, else the baseline's period. */
export function resolveHorizonYears(scenario: Scenario): number {
  if (scenario.horizonYears !== undefined) return scenario.horizonYears;
  const { baseline } = scenario;
  // The schema requires a horizon with a rate, so a rate never reaches here without one.
  return 'years' in baseline ? baseline.years : Number.NaN;
}

/** P0 over the horizon, from whichever baseline form the scenario has. */
export function referenceRiskOverHorizon(scenario: Scenario, conversion: Conversion, horizonYears: number): number {
  const { baseline } = scenario;
  if ('rate' in baseline) {
    const atHorizon = riskFromRate(baseline.rate / baseline.perPersonYears, horizonYears);
    // A population-average rate (a table stating the exposure's prevalence): turned into a risk
    // over the horizon first, then corrected as a population-average risk (methods guide, "Baselines").
    if (baseline.exposurePrevalence === undefined) return atHorizon;
    return referenceRiskFromPopulation(conversion, atHorizon, scenario.effect.estimate, baseline.exposurePrevalence);
  }
  if ('populationRisk' in baseline) {
    const atBaselineYears = referenceRiskFromPopulation(
      conversion,
      baseline.populationRisk,
      scenario.effect.estimate,
      baseline.exposurePrevalence,
    );
    return rescaleRisk(atBaselineYears, baseline.years, horizonYears);
  }
  return rescaleRisk(baseline.risk, baseline.years, horizonYears);
}

/**
 * @example
 * computeScenario({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } })
 * //=> { ok: true, value: { horizonYears: 10, referenceRisk: 0.08, exposedRisk: { estimate: 0.12, lower: 0.096, upper: 0.152 }, … } }
 */
export function computeScenario(scenario: Scenario): Result<ComputeResult> {
  const { effect } = scenario;
  const design = effect.design ?? 'cohort';
  const level = effect.level ?? 0.95;
  const conversion = conversionFor(effect.measure, design);
  const horizonYears = resolveHorizonYears(scenario);
  const p0 = referenceRiskOverHorizon(scenario, conversion, horizonYears);

  if (!isUsableRisk(p0) && 'populationRisk' in scenario.baseline) {
    return fail([
      {
        code: 'population-risk-inconsistent',
        path: ['baseline', 'populationRisk'],
        message: `No reference-group risk fits a population risk of ${scenario.baseline.populationRisk} with ${scenario.baseline.exposurePrevalence} exposed and a ratio of ${effect.estimate}; check the population risk and the prevalence`,
      },
    ]);
  }
  if (!isUsableRisk(p0) && 'rate' in scenario.baseline && scenario.baseline.exposurePrevalence !== undefined && p0 >= 1 - 1e-9) {
    return fail([
      {
        code: 'population-risk-inconsistent',
        path: ['baseline', 'rate'],
        message: `No reference-group risk fits a population rate of ${scenario.baseline.rate} per ${scenario.baseline.perPersonYears} person-years with ${scenario.baseline.exposurePrevalence} exposed and a ratio of ${effect.estimate}; check the rate and the prevalence`,
      },
    ]);
  }
  if (!isUsableRisk(p0)) {
    return fail([
      {
        code: 'baseline-degenerate',
        path: ['baseline'],
        message: `Over ${horizonYears} years the baseline works out to a risk of ${p0 > 0.5 ? '100%' : '0%'}, which leaves nothing to compare; check the baseline and the horizon`,
      },
    ]);
  }

  const p1 = exposedRiskCapped(conversion, p0, effect.estimate);
  // Each formula is increasing in the ratio, so P1(L) ≤ P1(X) ≤ P1(U) holds exactly; computed, two
  // ratios a few ulps apart can come out in the wrong order in the last bit (measured: OR 10.886858932020477
  // and …479 at P0 = 0.59996). Restore the order the mathematics guarantees.
  const p1Lower = Math.min(exposedRiskCapped(conversion, p0, effect.lower), p1);
  const p1Upper = Math.max(exposedRiskCapped(conversion, p0, effect.upper), p1);
  const exposedRisk = { estimate: p1, lower: p1Lower, upper: p1Upper };
  const riskDifference = { estimate: p1 - p0, lower: p1Lower - p0, upper: p1Upper - p0 };

  return ok({
    horizonYears,
    referenceRisk: p0,
    exposedRisk,
    riskRatio: { estimate: p1 / p0, lower: p1Lower / p0, upper: p1Upper / p0 },
    riskDifference,
    numberNeeded: numberNeeded(riskDifference, level),
    iconArray: iconArrayCounts(p0, exposedRisk, scenario.denominator),
    warnings: scenarioWarnings({ effect, conversion, referenceRisk: p0, horizonYears, baseline: scenario.baseline, tableId: scenario.tableId }),
    assumptions: standingAssumptions(level),
    measure: effect.measure,
    design,
    level,
    conversion,
  });
}
