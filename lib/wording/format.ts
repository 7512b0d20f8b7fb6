/**
 * Number and plural formatting for patient-facing text, in one place so that every count on a
 * page is written the same way.
 *
 * Locale: English ("en"), digits grouped by thousands ("1,000"). Counts of people are whole
 * numbers; years may carry one decimal ("2.5 years").
 */

import { formatCount, plural, TEXT_LOCALE } from '../text';

/** The locale, whole counts and plurals live in lib/text; re-exported here for the wording modules. */
export { formatCount, plural, TEXT_LOCALE };

const yearsFormat = new Intl.NumberFormat(TEXT_LOCALE, { maximumFractionDigits: 1 });

/**
 * A number of years, at most one decimal.
 * @example
 * formatYears(2.5) //=> "2.5"
 */
export function formatYears(years: number): string {
  return yearsFormat.format(years);
}

/**
 * A count of people with its noun.
 * @example
 * peopleCount(1) //=> "1 person"
 * peopleCount(1000) //=> "1,000 people"
 */
export function peopleCount(count: number): string {
  return `${formatCount(count)} ${plural(count, 'person', 'people')}`;
}

/**
 * "in the next 10 years", "in the next year" for a horizon of exactly 1.
 * @example
 * inTheNext(10) //=> "in the next 10 years"
 */
export function inTheNext(horizonYears: number): string {
  return horizonYears === 1 ? 'in the next year' : `in the next ${formatYears(horizonYears)} years`;
}

/**
 * "over the next 10 years", "over the next year".
 * @example
 * overTheNext(5) //=> "over the next 5 years"
 */
export function overTheNext(horizonYears: number): string {
  return horizonYears === 1 ? 'over the next year' : `over the next ${formatYears(horizonYears)} years`;
}

/**
 * A percentage for the clinician view: one decimal from 1% up (0.0825 → "8.3%"); below 1%, two
 * significant figures (0.0003 → "0.030%"), so that a small risk never reads as "0.0%".
 * @example
 * formatPercent(0.0825) //=> "8.3%"
 * formatPercent(0.0003) //=> "0.030%"
 */
export function formatPercent(fraction: number): string {
  const percent = fraction * 100;
  if (percent !== 0 && Math.abs(percent) < 1) return `${TWO_SIGNIFICANT.format(percent)}%`;
  return `${ONE_DECIMAL.format(percent)}%`;
}

// Made once: `n.toLocaleString(locale, options)` builds a new formatter on every call (the same
// output as `new Intl.NumberFormat(locale, options).format(n)`, ECMA-402 §19.5.1), which made a
// 100,000-worker worklist spend seconds formatting.
const TWO_SIGNIFICANT = new Intl.NumberFormat(TEXT_LOCALE, { minimumSignificantDigits: 2, maximumSignificantDigits: 2 });
const ONE_DECIMAL = new Intl.NumberFormat(TEXT_LOCALE, { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/**
 * A signed number of percentage points for the clinician view, rounded like
 * {@link formatPercent} (by magnitude, so +x and −x mirror each other): 0.04 → "+4.0".
 * @example
 * formatPercentagePoints(-0.0315) //=> "−3.2"
 */
export function formatPercentagePoints(fraction: number): string {
  const magnitude = formatPercent(Math.abs(fraction)).slice(0, -1);
  if (/^[0.,]+$/.test(magnitude)) return magnitude;
  if (fraction > 0) return `+${magnitude}`;
  if (fraction < 0) return `\u2212${magnitude}`;
  return magnitude;
}

/**
 * A ratio for the clinician view, two decimals: 1.5 → "1.50".
 * @example
 * formatRatio(1.4567) //=> "1.46"
 */
export function formatRatio(ratio: number): string {
  return ratio.toLocaleString(TEXT_LOCALE, { minimumFractionDigits: 2, maximumFractionDigits: 2 });
}

/**
 * The interval's label: 0.95 → "95% CI"; any level from 80% to 99.9% keeps its decimal.
 * @example
 * intervalLabel(0.9) //=> "90% CI"
 * intervalLabel(0.975) //=> "97.5% CI"
 */
export function intervalLabel(level: number): string {
  return `${formatLevel(level)} CI`;
}

/**
 * An interval level as a percentage, to one decimal where it has one: 0.95 → "95%", 0.975 → "97.5%".
 * @example
 * formatLevel(0.99) //=> "99%"
 */
export function formatLevel(level: number): string {
  return `${Number((level * 100).toFixed(1))}%`;
}
