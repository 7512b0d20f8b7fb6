/**
 * Persistence: how long a person has stayed in the range of their latest checkup.
 *
 * The run is the consecutive checkups, ending at the latest, that share its category under one
 * criteria set. Walking back from the latest checkup, the run stops at the first checkup that
 * - is more than {@link MAX_GAP_MONTHS} months before the next one (a missed yearly round: the
 *   gap is reported and earlier results do not count), or
 * - is in a different category, or cannot be classified under this body (WHO: HbA1c below 6.5%
 *   alone) — an unknown range does not continue a run.
 * Input in any order is sorted by date first.
 *
 * Three measures of the run, because "years" is ambiguous:
 * - `checkups`: how many results the run holds, repeats included;
 * - `yearlyResults`: how many yearly rounds it covers. Counting from the run's earliest result,
 *   a result starts a new round when it is at least {@link MIN_ROUND_MONTHS} months after the
 *   result that started the current round; closer results are repeats within a round (a confirming
 *   test a few weeks later). Rounds are 12 ± 6 months apart, gaps over 18 months break the run:
 *   half a year either way around a yearly schedule (our convention, documented here).
 *   This is what an exposure definition's `minYears` is compared with (./match.ts).
 * - `years`: elapsed time from the run's first to its last result, days / 365.25. Three yearly
 *   results span about 2 years.
 */
import { compareWithMonthsLater, daysBetween, inDateOrder, wholeMonthsBetween, yearsBetween } from './dates';
import type { ClassifiedCheckup } from './classify';
import type { CriteriaSet, GlycaemicCategory } from './exposure';

/** A gap of more than this many calendar months between checkups breaks a run. */
export const MAX_GAP_MONTHS = 18;
/** A result this many months or more after the start of the current round starts a new yearly round. */
export const MIN_ROUND_MONTHS = 6;

export interface Gap {
  /** The checkup before the gap. */
  readonly from: string;
  /** The checkup after the gap. */
  readonly to: string;
  /** Whole calendar months between them. */
  readonly months: number;
  readonly days: number;
}

export interface RunBreak {
  /** The latest checkup left out of the run. */
  readonly date: string;
  /** Why it is left out; a gap takes precedence when both apply. */
  readonly reason: 'gap' | 'category' | 'unclassified';
  /** That checkup's category (null when it could not be classified). */
  readonly category: GlycaemicCategory | null;
  /** The gap after it, when the reason is a gap. */
  readonly gap: Gap | null;
}

export interface Persistence {
  readonly criteria: CriteriaSet;
  /** The latest checkup's category; null when it could not be classified (then the run is empty). */
  readonly category: GlycaemicCategory | null;
  readonly checkups: number;
  readonly yearlyResults: number;
  readonly years: number;
  /** First and last date of the run; null when the run is empty. */
  readonly from: string | null;
  readonly to: string | null;
  /** Every gap of more than {@link MAX_GAP_MONTHS} months in the whole history, earliest first. */
  readonly gaps: readonly Gap[];
  /** What ended the run; null when the run reaches back to the earliest checkup. */
  readonly brokenBy: RunBreak | null;
}

/** A gap from `from` to `to` is too long when `to` is later than `from` + 18 calendar months. */
export function isLongGap(from: string, to: string): boolean {
  return compareWithMonthsLater(to, from, MAX_GAP_MONTHS) > 0;
}

function gapBetween(from: string, to: string): Gap {
  return { from, to, months: wholeMonthsBetween(from, to), days: daysBetween(from, to) };
}

/** Yearly rounds in a run, dates earliest first (see the module comment). */
export function countYearlyRounds(dates: readonly string[]): number {
  let rounds = 0;
  let roundStart: string | null = null;
  for (const date of dates) {
    if (roundStart === null || compareWithMonthsLater(date, roundStart, MIN_ROUND_MONTHS) >= 0) {
      rounds += 1;
      roundStart = date;
    }
  }
  return rounds;
}

/**
 * The run ending at the latest checkup.
 *
 * @example
 * persistence(classifyHistory([2019, 2020, 2021, 2022 yearly in the prediabetes range], 'ADA'), 'ADA')
 * //=> { category: 'prediabetes', checkups: 4, yearlyResults: 4, years: 3.0, gaps: [], brokenBy: null, … }
 */
export function persistence(classified: readonly ClassifiedCheckup[], criteria: CriteriaSet): Persistence {
  const sorted = inDateOrder(classified);
  const gaps: Gap[] = [];
  // Where the latest long gap ends (the run, walking back from the latest checkup, stops there at the latest).
  let latestGapEnd = -1;
  for (let i = 1; i < sorted.length; i += 1) {
    const before = sorted[i - 1];
    const after = sorted[i];
    if (before && after && isLongGap(before.date, after.date)) {
      gaps.push(gapBetween(before.date, after.date));
      latestGapEnd = i;
    }
  }
  const latest = sorted[sorted.length - 1];
  const empty = { criteria, checkups: 0, yearlyResults: 0, years: 0, from: null, to: null, gaps } as const;
  if (!latest) return { ...empty, category: null, brokenBy: null };
  if (latest.category === null) {
    return { ...empty, category: null, brokenBy: { date: latest.date, reason: 'unclassified', category: null, gap: null } };
  }

  let start = sorted.length - 1;
  let brokenBy: RunBreak | null = null;
  while (start > 0) {
    const previous = sorted[start - 1];
    const current = sorted[start];
    if (!previous || !current) break;
    if (start === latestGapEnd) {
      brokenBy = { date: previous.date, reason: 'gap', category: previous.category, gap: gapBetween(previous.date, current.date) };
      break;
    }
    if (previous.category !== latest.category) {
      brokenBy = { date: previous.date, reason: previous.category === null ? 'unclassified' : 'category', category: previous.category, gap: null };
      break;
    }
    start -= 1;
  }
  const run = sorted.slice(start).map((c) => c.date);
  const from = run[0] ?? latest.date;
  return {
    criteria,
    category: latest.category,
    checkups: run.length,
    yearlyResults: countYearlyRounds(run),
    years: yearsBetween(from, latest.date),
    from,
    to: latest.date,
    gaps,
    brokenBy,
  };
}
