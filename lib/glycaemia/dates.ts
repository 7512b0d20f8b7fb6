/**
 * Calendar dates as "YYYY-MM-DD" strings (ISO 8601 calendar dates, proleptic Gregorian), with the
 * few operations the checkup history needs. Dates have no time or zone: a checkup is a day.
 * Arithmetic runs on UTC day numbers so that no local clock or daylight-saving change enters.
 */

const MS_PER_DAY = 86_400_000;

export interface CalendarDate {
  readonly year: number;
  readonly month: number;
  readonly day: number;
}

/** Days in a month of the Gregorian calendar (leap years: divisible by 4, not by 100 unless by 400). */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/**
 * Reads a "YYYY-MM-DD" date; null when the text is not in that form or names no real day.
 *
 * @example
 * parseIsoDate('2024-02-29') //=> { year: 2024, month: 2, day: 29 }
 * parseIsoDate('2023-02-29') //=> null (2023 is not a leap year)
 */
export function parseIsoDate(text: string): CalendarDate | null {
  const key = isoDateKey(text);
  if (key < 0) return null;
  return { year: Math.floor(key / 10_000), month: Math.floor(key / 100) % 100, day: key % 100 };
}

/**
 * A "YYYY-MM-DD" date as the number YYYYMMDD (20240229), or −1 when the text is not in that form
 * or names no real day: {@link parseIsoDate} without an object, for comparing and counting.
 */
function isoDateKey(text: string): number {
  // Read digit by digit: the same as matching /^(\d{4})-(\d{2})-(\d{2})$/ and reading its groups,
  // without a match object and three number parses (this runs several times a checkup).
  if (text.length !== 10 || text.charCodeAt(4) !== 45 || text.charCodeAt(7) !== 45) return -1;
  const year = digits(text, 0, 4);
  const month = digits(text, 5, 7);
  const day = digits(text, 8, 10);
  if (year < 0 || month < 0 || day < 0) return -1;
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return -1;
  return year * 10_000 + month * 100 + day;
}

/** The number written by the ASCII digits text[from..to), or -1 when one is not a digit. */
function digits(text: string, from: number, to: number): number {
  let value = 0;
  for (let i = from; i < to; i++) {
    const d = text.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return -1;
    value = value * 10 + d;
  }
  return value;
}

/** "YYYY-MM-DD": each part written with at least 4, 2 and 2 digits (zeros in front). */
export function formatIsoDate(date: CalendarDate): string {
  const { year, month, day } = date;
  // The usual case without padStart: a four-digit year, a month and a day from 1 to 99 (this runs
  // several times a checkup); anything else (a year before 1000, a part that is not a whole
  // number) is padded below, to the same text.
  if (Number.isInteger(year) && year >= 1000 && year <= 9999 && Number.isInteger(month) && month >= 1 && month <= 99 && Number.isInteger(day) && day >= 1 && day <= 99) {
    return `${year}-${month < 10 ? '0' : ''}${month}-${day < 10 ? '0' : ''}${day}`;
  }
  const pad = (n: number, width: number) => String(n).padStart(width, '0');
  return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
}

/** Days since 1970-01-01 for a valid "YYYY-MM-DD" date (caller has validated it). */
export function dayNumber(iso: string): number {
  const key = isoDateKey(iso);
  if (key < 0) return Number.NaN;
  return Date.UTC(Math.floor(key / 10_000), (Math.floor(key / 100) % 100) - 1, key % 100) / MS_PER_DAY;
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/** The date {@link monthsLater} worked out last (one object, reused: no allocation per call). */
const LATER: { year: number; month: number; day: number } = { year: 0, month: 0, day: 0 };

/**
 * The same day `months` calendar months after year-month-day, clamped to the month's last day,
 * into {@link LATER}: the one rule behind {@link addMonths} and {@link compareWithMonthsLater}.
 */
function monthsLater(year: number, month: number, day: number, months: number): void {
  const index = year * 12 + (month - 1) + months;
  LATER.year = Math.floor(index / 12);
  LATER.month = (index % 12) + 1;
  LATER.day = Math.min(day, daysInMonth(LATER.year, LATER.month));
}

/**
 * The same day `months` calendar months later, clamped to the month's last day
 * (2020-08-31 + 18 months = 2022-02-28), as calendar arithmetic does by common practice.
 */
export function addMonths(iso: string, months: number): string {
  const key = isoDateKey(iso);
  if (key < 0) return iso;
  monthsLater(Math.floor(key / 10_000), Math.floor(key / 100) % 100, key % 100, months);
  return formatIsoDate(LATER);
}

/**
 * How `to` compares with the date `months` calendar months after `from`, as text: −1, 0 or 1,
 * exactly `to < addMonths(from, months) ? -1 : to > addMonths(from, months) ? 1 : 0`. When both
 * are real dates and the later date has a four-digit year (then text order is number order) it
 * compares numbers, without writing the later date out (this runs several times a checkup).
 *
 * @example
 * compareWithMonthsLater('2022-03-02', '2020-09-01', 18) //=> 1 (2022-03-02 is after 2022-03-01: a gap of more than 18 months)
 */
export function compareWithMonthsLater(to: string, from: string, months: number): number {
  const fromKey = isoDateKey(from);
  const toKey = isoDateKey(to);
  if (fromKey >= 0 && toKey >= 0) {
    monthsLater(Math.floor(fromKey / 10_000), Math.floor(fromKey / 100) % 100, fromKey % 100, months);
    if (LATER.year >= 1000 && LATER.year <= 9999) {
      const laterKey = LATER.year * 10_000 + LATER.month * 100 + LATER.day;
      return toKey < laterKey ? -1 : toKey > laterKey ? 1 : 0;
    }
  }
  const later = addMonths(from, months);
  return to < later ? -1 : to > later ? 1 : 0;
}

/** Whole calendar months from `from` to `to` (`from` ≤ `to`): the largest n with from + n months ≤ to. */
export function wholeMonthsBetween(from: string, to: string): number {
  const a = parseIsoDate(from);
  const b = parseIsoDate(to);
  if (!a || !b) return Number.NaN;
  let months = (b.year - a.year) * 12 + (b.month - a.month);
  if (months > 0 && addMonths(from, months) > to) months -= 1;
  return months;
}

/** Dated items earliest first: the comparison for a (stable) sort by "YYYY-MM-DD" date. */
export function compareByDate(a: { readonly date: string }, b: { readonly date: string }): number {
  return a.date < b.date ? -1 : a.date > b.date ? 1 : 0;
}

/** Whether dated items are earliest first (each on or after the one before). */
function isInDateOrder(items: readonly { readonly date: string }[]): boolean {
  for (let i = 1; i < items.length; i++) {
    if ((items[i] as { readonly date: string }).date < (items[i - 1] as { readonly date: string }).date) return false;
  }
  return true;
}

/**
 * Sorts dated items in place, earliest first, items of one date in their given order (a stable
 * sort with {@link compareByDate}); a list already in order is left as it is, unsorted.
 */
export function sortByDate<T extends { readonly date: string }>(items: T[]): T[] {
  return isInDateOrder(items) ? items : items.sort(compareByDate);
}

/**
 * Dated items earliest first, items of one date in their given order — what a stable sort with
 * {@link compareByDate} gives. A list already in that order (the usual case: histories are kept
 * sorted) is returned as it is, not copied, so the caller must only read it.
 *
 * @example
 * inDateOrder([{ date: '2022-03-01' }, { date: '2021-03-01' }]) //=> [{ date: '2021-03-01' }, { date: '2022-03-01' }] (a copy)
 */
export function inDateOrder<T extends { readonly date: string }>(items: readonly T[]): readonly T[] {
  return isInDateOrder(items) ? items : [...items].sort(compareByDate);
}

/** Elapsed years between two dates: days / 365.25 (the mean Julian year, common practice). */
export function yearsBetween(from: string, to: string): number {
  return daysBetween(from, to) / 365.25;
}

/** Today's date in the local time zone of the given clock, as "YYYY-MM-DD". */
export function localIsoDate(now: Date = new Date()): string {
  return formatIsoDate({ year: now.getFullYear(), month: now.getMonth() + 1, day: now.getDate() });
}
