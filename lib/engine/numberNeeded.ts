/**
 * The number needed to treat or harm, with its interval.
 *
 * Number needed = 1/|RD|, where RD = P1 − P0 is the risk difference; harm (NNTH) when RD > 0,
 * benefit (NNTB) when RD < 0. It is rounded up to a whole person for display
 * (Cochrane Handbook §12.5.4.1; Cook & Sackett 1995, BMJ 310:452).
 *
 * The interval is the reciprocal of the risk difference's interval. When that interval
 * includes 0, the NNT interval is not a finite range: it runs from NNTB 1/|L| through infinity
 * to NNTH 1/U (Altman 1998, BMJ 317:1309).
 */
import type { Direction, NumberNeeded, NumberNeededLimit } from './types';
import type { Estimate } from './types';
import { intervalLabel } from '../wording/format';

/**
 * Rounds up, forgiving floating-point noise: 1/(0.12 − 0.08) computes as 25.000000000000004
 * and must display as 25, not 26. Anything within a billionth of a person below a whole number
 * counts as that number.
 */
export function roundUpPeople(value: number): number {
  return Math.ceil(value - 1e-9);
}

function directionOf(difference: number): Direction {
  if (difference > 0) return 'harm';
  if (difference < 0) return 'benefit';
  return 'none';
}

function limitOf(difference: number): NumberNeededLimit {
  if (difference === 0) return { direction: 'none', value: null, display: null };
  const value = 1 / Math.abs(difference);
  return { direction: directionOf(difference), value, display: roundUpPeople(value) };
}

function label(direction: Direction): string {
  return direction === 'harm' ? 'NNTH' : 'NNTB';
}

/**
 * Beyond a million people the number needed says nothing a clinician can use, and its digits are
 * floating-point noise (1/RD of a risk difference near 1e-17); the text says "more than a million"
 * (issue 11 item 13). The figures themselves stay exact in `value` and `display`.
 */
export const NUMBER_NEEDED_TEXT_LIMIT = 1_000_000;

function count(display: number): string {
  return display > NUMBER_NEEDED_TEXT_LIMIT ? 'more than a million' : String(display);
}

/**
 * @param riskDifference - RD with its interval (lower ≤ estimate ≤ upper)
 * @param level - the interval level, e.g. 0.95, used in the text only
 * @example
 * numberNeeded({ estimate: 0.04, lower: -0.005, upper: 0.08 }, 0.95).text
 * //=> "NNTH 25 (95% CI: NNTB 200 to ∞ to NNTH 13)"
 */
export function numberNeeded(riskDifference: Estimate, level: number): NumberNeeded {
  const point = limitOf(riskDifference.estimate);
  const from = limitOf(riskDifference.lower);
  const to = limitOf(riskDifference.upper);
  const crossesNull = riskDifference.lower <= 0 && riskDifference.upper >= 0;
  const ci = intervalLabel(level);

  const head = point.display === null ? 'No difference' : `${label(point.direction)} ${count(point.display)}`;
  let range: string;
  if (crossesNull) {
    // A limit exactly at no effect is the infinite end: write the interval from its finite end
    // ("NNTH 8 to ∞", not "∞ to NNTH 8"; issue 11 item 12).
    if (from.display === null && to.display === null) range = '∞';
    else if (from.display === null) range = `NNTH ${count(to.display ?? 0)} to ∞`;
    else if (to.display === null) range = `NNTB ${count(from.display)} to ∞`;
    else range = `NNTB ${count(from.display)} to ∞ to NNTH ${count(to.display)}`;
  } else {
    // Both limits on one side: smaller number first.
    const a = from.display ?? Infinity;
    const b = to.display ?? Infinity;
    range = `${label(from.direction)} ${count(Math.min(a, b))} to ${count(Math.max(a, b))}`;
  }
  return {
    direction: point.direction,
    estimate: point.value,
    display: point.display,
    crossesNull,
    interval: { from, to },
    text: `${head} (${ci}: ${range})`,
  };
}
