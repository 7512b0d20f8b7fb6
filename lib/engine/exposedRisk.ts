/**
 * The exposed-group risk P1 over a horizon, from the reference-group risk P0 over the same
 * horizon and a ratio, for each {@link Conversion}. Each formula is increasing in the ratio at a
 * fixed P0, so an interval's limits go through the same formula (Cochrane Handbook §12.5.4.5).
 *
 * - risk ratio:       P1 = RR·P0                                   (definition)
 * - risk odds ratio:  P1 = OR·P0 / (1 − P0 + OR·P0)                (Zhang & Yu 1998, JAMA 280:1690)
 * - rate ratio:       P1 = 1 − (1 − P0)^HR                         (proportional hazards: S1 = S0^HR;
 *                                                                   Altman & Andersen 1999, BMJ 319:1492)
 *
 * The risk ratio can exceed certainty (RR·P0 ≥ 1); {@link exposedRisk} returns the raw value so
 * the caller can warn, and {@link exposedRiskCapped} caps it at 1.
 */
import type { Conversion } from './types';

/**
 * @param referenceRisk - P0, a fraction in (0, 1)
 * @param ratio - the reported ratio, > 0
 * @example
 * exposedRisk('risk-odds-ratio', 0.1, 2) //=> 0.18181818… (Zhang & Yu 1998: RR = 2 / (0.9 + 0.2) = 1.818)
 * exposedRisk('rate-ratio', 0.1, 2)      //=> 0.19 (1 − 0.9²)
 */
export function exposedRisk(conversion: Conversion, referenceRisk: number, ratio: number): number {
  // A ratio of 1 means no effect: P1 = P0 exactly under every formula (RR·P0, Zhang–Yu with
  // OR = 1, 1 − (1 − P0)^1). Computed, −expm1(log1p(−P0)) misses P0 by an ulp for some P0
  // (0.061 gives 0.06099999999999999), which would turn "no difference" into a number needed of 10^17.
  if (ratio === 1) return referenceRisk;
  switch (conversion) {
    case 'risk-ratio':
      return ratio * referenceRisk;
    case 'risk-odds-ratio':
      return (ratio * referenceRisk) / (1 - referenceRisk + ratio * referenceRisk);
    case 'rate-ratio':
      // 1 − (1 − P0)^HR, written with expm1/log1p to keep precision for small risks.
      return -Math.expm1(ratio * Math.log1p(-referenceRisk));
  }
}

/** {@link exposedRisk} capped at 1: a risk cannot exceed certainty. */
export function exposedRiskCapped(conversion: Conversion, referenceRisk: number, ratio: number): number {
  return Math.min(1, exposedRisk(conversion, referenceRisk, ratio));
}

/**
 * dP1/dP0 at a fixed ratio, for the Newton step of the population correction (each the
 * derivative of the formula above, hand-derived; tested against a central difference).
 * - risk ratio: RR
 * - risk odds ratio: OR / (1 − P0 + OR·P0)²   (differentiating Zhang–Yu)
 * - rate ratio: HR·(1 − P0)^(HR − 1)
 */
export function exposedRiskSlope(conversion: Conversion, referenceRisk: number, ratio: number): number {
  switch (conversion) {
    case 'risk-ratio':
      return ratio;
    case 'risk-odds-ratio': {
      const d = 1 - referenceRisk + ratio * referenceRisk;
      return ratio / (d * d);
    }
    case 'rate-ratio':
      return ratio * Math.exp((ratio - 1) * Math.log1p(-referenceRisk));
  }
}

/**
 * The inverse at a fixed P0: the ratio that turns P0 into P1 (each the algebraic inverse of the
 * formula above: the risk ratio's definition, the odds ratio's definition, and ln S1 = HR·ln S0).
 * - risk ratio: P1/P0
 * - odds ratio: P1(1 − P0) / (P0(1 − P1))
 * - rate ratio: ln(1 − P1) / ln(1 − P0)
 */
export function ratioFromRisks(conversion: Conversion, referenceRisk: number, exposed: number): number {
  switch (conversion) {
    case 'risk-ratio':
      return exposed / referenceRisk;
    case 'risk-odds-ratio':
      return (exposed * (1 - referenceRisk)) / (referenceRisk * (1 - exposed));
    case 'rate-ratio':
      return Math.log1p(-exposed) / Math.log1p(-referenceRisk);
  }
}
