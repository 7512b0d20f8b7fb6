/**
 * Numbers read from files at the precision a spreadsheet shows them: 15 significant digits.
 *
 * Why 15: every decimal with at most 15 significant digits survives a trip through a binary64
 * double and back unchanged (IEEE 754-2008 binary64, 53-bit significand: ⌊52·log10 2⌋ = 15, the
 * C standard's DBL_DIG), so rounding to 15 digits never changes a number anyone typed. The 16th
 * and 17th digits are where a value written by a formula carries the binary noise of its
 * arithmetic: a workbook cell of =6.1*1 or =100.8/18-style conversions, or a CSV written by a
 * program that prints doubles in full, give 6.1000000000000005 for 6.1 and 5.6999999999999993
 * for 5.7. Spreadsheets show and compute with 15 significant digits (from memory, common
 * practice), so at 15 digits the value is the one the clinic's own sheet shows: it is printed as
 * 6.1% on a handout, and a 5.7% meant as 5.7% counts at the 5.7% cut-point.
 */

/** Significant decimal digits every binary64 value round-trips (DBL_DIG). */
export const SIGNIFICANT_DIGITS = 15;

/**
 * A finite number rounded to {@link SIGNIFICANT_DIGITS} significant digits (ECMAScript
 * `Number.prototype.toPrecision`, which rounds the exact binary value); a number written with 15
 * significant digits or fewer comes back unchanged, and a non-finite one as it was.
 * @example
 * atFileDigits(6.1000000000000005) //=> 6.1
 * atFileDigits(0.1 + 0.2) //=> 0.3
 * atFileDigits(5.55) //=> 5.55
 */
export function atFileDigits(value: number): number {
  // Zero (−0 included, which toPrecision writes as "0") and non-finite values come back as they were.
  return Number.isFinite(value) && value !== 0 ? Number(value.toPrecision(SIGNIFICANT_DIGITS)) : value;
}
