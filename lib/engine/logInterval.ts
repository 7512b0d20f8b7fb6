/**
 * What a reported ratio's confidence interval says on the log scale.
 *
 * Ratio estimates are analysed on the log scale, where a Wald interval is symmetric:
 *   ln L = ln X − z·SE,  ln U = ln X + z·SE,
 * so the standard error is recovered from the limits as
 *   SE = (ln U − ln L) / (2·z)                       (Cochrane Handbook §7.7.7.3)
 * and the estimate should sit at the geometric mean of its limits, X ≈ √(L·U). Published
 * figures are rounded, so the check allows for the rounding of each printed number.
 */
import { zForLevel } from '../stats/normalQuantile';
import type { IntervalLevel } from '../scenario/schema';

/** SE of ln(ratio) from the interval's limits. */
export function standardErrorFromInterval(lower: number, upper: number, level: IntervalLevel): number {
  return (Math.log(upper) - Math.log(lower)) / (2 * zForLevel(level));
}

/**
 * Decimal places a number was written with, as JSON or a form would carry it: 1.25 → 2, 3 → 0.
 * Used to bound rounding error; exponent notation counts its effective places.
 */
export function decimalPlaces(value: number): number {
  // Fast path for the numbers people type (up to 10 places, magnitude below 1e15): the fewest
  // places k with round(v·10^k)/10^k === v, which is what String(v) would print.
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-6 && magnitude < 1e15) {
    let scale = 1;
    for (let k = 0; k <= 10; k += 1) {
      if (Math.round(value * scale) / scale === value) return k;
      scale *= 10;
    }
  }
  const text = String(value);
  const [mantissa = '', exponent] = text.toLowerCase().split('e');
  const fraction = mantissa.split('.')[1] ?? '';
  const places = fraction.length - (exponent === undefined ? 0 : Number(exponent));
  return Math.max(0, places);
}

export interface LogSymmetry {
  /** ln X − (ln L + ln U)/2: how far the estimate sits from the limits' geometric mean. */
  readonly offset: number;
  /** The largest |offset| that rounding of the three printed numbers could explain, plus slack. */
  readonly tolerance: number;
  readonly symmetric: boolean;
}

/**
 * Slack on top of rounding, as a fraction of the log half-width: profile-likelihood and exact
 * intervals are mildly asymmetric even before rounding (common practice; 5% chosen so that
 * a shifted digit, the usual typing slip, is still caught).
 */
export const SYMMETRY_SLACK = 0.05;

/**
 * Ratios are published to at least one decimal (common practice): a limit that arrives as 1 was
 * almost always printed "1.0", so it is taken to carry one decimal place, not none; otherwise a
 * whole-number limit would loosen the check enough to hide a slip such as 1.5 (1–4).
 */
export const MIN_PRINTED_PLACES = 1;

/**
 * Checks that X lies near √(L·U). Each printed number may be off by half a unit in its last
 * place, δ = 0.5·10^(−places) with places ≥ {@link MIN_PRINTED_PLACES}; on the log scale that moves ln v by at most about δ/v, so
 * rounding explains an offset up to δX/X + (δL/L + δU/U)/2 (first-order bound, hand-derived).
 *
 * @example
 * logSymmetry(1.5, 1.2, 1.9).symmetric //=> true   (√(1.2·1.9) = 1.51)
 * logSymmetry(1.5, 1.2, 9.1).symmetric //=> false  (a likely typing slip for 1.91)
 */
export function logSymmetry(estimate: number, lower: number, upper: number): LogSymmetry {
  const offset = Math.log(estimate) - (Math.log(lower) + Math.log(upper)) / 2;
  const halfWidth = (Math.log(upper) - Math.log(lower)) / 2;
  const rounding = (v: number) => (0.5 * 10 ** -Math.max(MIN_PRINTED_PLACES, decimalPlaces(v))) / v;
  const tolerance = rounding(estimate) + (rounding(lower) + rounding(upper)) / 2 + SYMMETRY_SLACK * halfWidth;
  return { offset, tolerance, symmetric: Math.abs(offset) <= tolerance };
}

/**
 * The same verdict as {@link logSymmetry}(…).symmetric, without building the report: an offset
 * within the slack alone is symmetric whatever the rounding, so the rounding bound is only
 * worked out when needed (the engine calls this on every evaluation).
 */
export function isLogSymmetric(estimate: number, lower: number, upper: number): boolean {
  const logLower = Math.log(lower);
  const logUpper = Math.log(upper);
  const offset = Math.abs(Math.log(estimate) - (logLower + logUpper) / 2);
  if (offset <= SYMMETRY_SLACK * ((logUpper - logLower) / 2)) return true;
  return logSymmetry(estimate, lower, upper).symmetric;
}
