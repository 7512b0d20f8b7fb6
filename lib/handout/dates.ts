/**
 * Dates on the handout, written the way the chosen paper's region writes them
 * (./paper.ts `dateOrder`): "12 May 2025" on A4, "May 12, 2025" on US Letter. Month names are
 * written out so a reader never has to guess whether 05/12 is May or December (common practice).
 * Written by hand rather than through Intl so the printed date is the same in every browser.
 */
import { PAPER_SIZES, type DateOrder, type PaperSize } from './paper';

export const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'] as const;

/**
 * A calendar day in words, in the given order. Uses the date's local calendar day.
 * @example
 * writtenDate(new Date(2025, 4, 12), 'day-month-year') //=> "12 May 2025"
 * writtenDate(new Date(2025, 4, 12), 'month-day-year') //=> "May 12, 2025"
 */
export function writtenDate(date: Date, order: DateOrder): string | undefined {
  if (Number.isNaN(date.getTime())) return undefined;
  const month = MONTH_NAMES[date.getMonth()] ?? '';
  const day = date.getDate();
  const year = date.getFullYear();
  return order === 'day-month-year' ? `${day} ${month} ${year}` : `${month} ${day}, ${year}`;
}

/**
 * "Prepared on 12 May 2025." (A4) or "Prepared on May 12, 2025." (US Letter); "Prepared today."
 * for a date that is not a real date.
 */
export function preparedOnLine(date: Date, paper: PaperSize): string {
  const written = writtenDate(date, PAPER_SIZES[paper].dateOrder);
  return written === undefined ? 'Prepared today.' : `Prepared on ${written}.`;
}
