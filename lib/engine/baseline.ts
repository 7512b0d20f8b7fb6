/**
 * Reference-group risk over a horizon, from each of the three baseline forms.
 *
 * - A rate λ (events per person-year) to a risk over t years:  p = 1 − exp(−λt)
 *   (Miller & Homan 1994, Med Decis Making 14:52; Gidwani & Russell 2020, PharmacoEconomics 38:1153)
 * - A risk p1 over t1 years to a risk over t2 years under a constant hazard:
 *   p2 = 1 − (1 − p1)^(t2/t1)  (same sources; not valid with competing transitions)
 * - A population-average risk Ppop with exposure prevalence pe mixes both groups:
 *   Ppop = (1 − pe)·P0 + pe·P1(P0). For a risk ratio P0 = Ppop / (1 − pe + pe·RR) (algebra);
 *   otherwise the equation is solved numerically. Its left side is increasing in P0, so the
 *   root in (0, 1) is unique; a safeguarded Newton iteration finds it.
 */
import type { Conversion } from './types';
import { exposedRiskCapped, exposedRiskSlope } from './exposedRisk';

/**
 * @param eventsPerPersonYear - λ, e.g. 12 per 1000 person-years is 0.012
 * @example
 * riskFromRate(0.01, 10) //=> 0.09516… (1 − e^(−0.1))
 */
export function riskFromRate(eventsPerPersonYear: number, horizonYears: number): number {
  return -Math.expm1(-eventsPerPersonYear * horizonYears);
}

/**
 * @example
 * rescaleRisk(0.19, 2, 1) //=> 0.1 (1 − 0.81^(1/2))
 */
export function rescaleRisk(risk: number, fromYears: number, toYears: number): number {
  if (fromYears === toYears) return risk;
  return -Math.expm1((toYears / fromYears) * Math.log1p(-risk));
}

/** Ppop = (1 − pe)·P0 + pe·P1(P0), the population risk implied by a reference-group risk. */
export function populationRisk(conversion: Conversion, referenceRisk: number, ratio: number, exposurePrevalence: number): number {
  return (1 - exposurePrevalence) * referenceRisk + exposurePrevalence * exposedRiskCapped(conversion, referenceRisk, ratio);
}

const MAX_ITERATIONS = 60;
/** Stop when the population risk is matched to 1e-15 (absolute), or the bracket is one ulp wide. */
const TOLERANCE = 1e-15;

/**
 * Solves Ppop = (1 − pe)·P0 + pe·P1(P0) for P0.
 *
 * The engine solves it once, at the ratio's point estimate, and holds that P0 fixed when it puts
 * the interval's limits through the exposed-risk formula (./compute.ts; Cochrane Handbook
 * §12.5.4.5). The limits therefore leave out both the uncertainty in Ppop and the way the
 * solved P0 would itself move with the ratio; the clinician text says the baseline is held fixed.
 *
 * @param populationAverageRisk - Ppop in (0, 1)
 * @param exposurePrevalence - pe in [0, 1)
 * @example
 * referenceRiskFromPopulation('risk-ratio', 0.12, 2, 0.2) //=> 0.1 (0.12 / (0.8 + 0.4))
 */
export function referenceRiskFromPopulation(
  conversion: Conversion,
  populationAverageRisk: number,
  ratio: number,
  exposurePrevalence: number,
): number {
  if (exposurePrevalence === 0 || ratio === 1) return populationAverageRisk;
  if (conversion === 'risk-ratio') {
    const closed = populationAverageRisk / (1 - exposurePrevalence + exposurePrevalence * ratio);
    // Above 1 there is no reference risk that fits: the caller refuses the baseline.
    if (closed >= 1) return 1;
    if (ratio * closed < 1) return closed;
  }
  // f(P0) = Ppop(P0) − target is increasing, f(0) = −target < 0, f(1) = 1 − target > 0.
  let lo = 0;
  let hi = 1;
  // For a harmful ratio P0 < Ppop; for a protective one P0 > Ppop: a tighter bracket.
  if (ratio > 1) hi = populationAverageRisk;
  else lo = populationAverageRisk;
  let p = (lo + hi) / 2;
  for (let i = 0; i < MAX_ITERATIONS; i += 1) {
    const f = populationRisk(conversion, p, ratio, exposurePrevalence) - populationAverageRisk;
    if (f === 0) return p;
    if (f > 0) hi = p;
    else lo = p;
    const capped = conversion === 'risk-ratio' && ratio * p >= 1;
    const slope = 1 - exposurePrevalence + exposurePrevalence * (capped ? 0 : exposedRiskSlope(conversion, p, ratio));
    if (Math.abs(f) <= TOLERANCE || hi - lo <= 2 * Number.EPSILON * hi) return p;
    let next = p - f / slope;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    p = next;
  }
  return p;
}

