/**
 * Two-sided standard normal critical values for the interval levels the engine accepts.
 *
 * z(level) = Φ⁻¹((1 + level) / 2), where Φ is the standard normal distribution function.
 * Only three levels are accepted (0.90, 0.95, 0.99), so the values are constants rather than an
 * approximation of Φ⁻¹. z(0.975) = 1.959963984540054 as given in the Cochrane Handbook
 * (§7.7.7.3); the other two are the standard tabulated values, to double
 * precision, and are cross-checked in tests against two general-purpose statistics packages
 * (jstat's normal.inv and simple-statistics' probit).
 */
import type { IntervalLevel } from '../scenario/schema';

const Z: Readonly<Record<IntervalLevel, number>> = {
  0.9: 1.6448536269514722,
  0.95: 1.959963984540054,
  0.99: 2.5758293035489004,
};

/**
 * @example
 * zForLevel(0.95) //=> 1.959963984540054
 */
export function zForLevel(level: IntervalLevel): number {
  return Z[level];
}
