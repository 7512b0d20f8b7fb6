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
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

/**
 * Reads a "YYYY-MM-DD" date; null when the text is not in that form or names no real day.
 *
 * @example
 * parseIsoDate('2024-02-29') //=> { year: 2024, month: 2, day: 29 }
 * parseIsoDate('2023-02-29') //=> null (2023 is not a leap year)
 */
export function parseIsoDate(text: string): CalendarDate | null {
  // Read digit by digit: the same as matching /^(\d{4})-(\d{2})-(\d{2})$/ and reading its groups,
  // without a match object and three number parses (this runs several times a checkup).
  if (text.length !== 10 || text.charCodeAt(4) !== 45 || text.charCodeAt(7) !== 45) return null;
  const year = digits(text, 0, 4);
  const month = digits(text, 5, 7);
  const day = digits(text, 8, 10);
  if (year < 0 || month < 0 || day < 0) return null;
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  return { year, month, day };
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

export function formatIsoDate(date: CalendarDate): string {
  const pad = (n: number, width: number) => String(n).padStart(width, '0');
  return `${pad(date.year, 4)}-${pad(date.month, 2)}-${pad(date.day, 2)}`;
}

/** Days since 1970-01-01 for a valid "YYYY-MM-DD" date (caller has validated it). */
export function dayNumber(iso: string): number {
  const date = parseIsoDate(iso);
  if (!date) return Number.NaN;
  return Date.UTC(date.year, date.month - 1, date.day) / MS_PER_DAY;
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/**
 * The same day `months` calendar months later, clamped to the month's last day
 * (2020-08-31 + 18 months = 2022-02-28), as calendar arithmetic does by common practice.
 */
export function addMonths(iso: string, months: number): string {
  const date = parseIsoDate(iso);
  if (!date) return iso;
  const index = date.year * 12 + (date.month - 1) + months;
  const year = Math.floor(index / 12);
  const month = (index % 12) + 1;
  return formatIsoDate({ year, month, day: Math.min(date.day, daysInMonth(year, month)) });
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

/** Elapsed years between two dates: days / 365.25 (the mean Julian year, common practice). */
export function yearsBetween(from: string, to: string): number {
  return daysBetween(from, to) / 365.25;
}

/** Today's date in the local time zone of the given clock, as "YYYY-MM-DD". */
export function localIsoDate(now: Date = new Date()): string {
  return formatIsoDate({ year: now.getFullYear(), month: now.getMonth() + 1, day: now.getDate() });
}
