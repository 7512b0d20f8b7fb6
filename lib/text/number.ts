/**
 * Whole counts in the one locale ({@link TEXT_LOCALE}): "1,000".
 */
import { TEXT_LOCALE } from './locale';

const countFormat = new Intl.NumberFormat(TEXT_LOCALE, { maximumFractionDigits: 0 });

/**
 * A whole count, grouped by thousands.
 * @example
 * formatCount(1000) //=> "1,000"
 */
export function formatCount(count: number): string {
  return countFormat.format(count);
}
