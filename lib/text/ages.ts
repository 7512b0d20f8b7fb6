/**
 * Age ranges in words, with the one cut-off for an open top band: a band reaching
 * {@link MAX_AGE_YEARS} (lib/tables/schema.ts) is written "and over".
 */
import { MAX_AGE_YEARS } from '../tables/schema';
import { formatCount } from './number';

/** An age band in whole years; `toYears` ≥ {@link MAX_AGE_YEARS} means open-ended. */
export interface AgeBand {
  readonly fromYears: number;
  readonly toYears: number;
}

/** True when the band has no upper limit ("80 and over"). */
export function isOpenTop(toYears: number): boolean {
  return toYears >= MAX_AGE_YEARS;
}

/**
 * True when the band covers every age (0 to the open top): it says nothing about age, and is
 * never written as an age ("aged 0 and over").
 */
export function spansAllAges(band: AgeBand): boolean {
  return band.fromYears <= 0 && isOpenTop(band.toYears);
}

function range(band: AgeBand, joiner: string): string {
  if (isOpenTop(band.toYears)) return `${formatCount(band.fromYears)} and over`;
  if (band.fromYears === band.toYears) return formatCount(band.fromYears);
  return `${formatCount(band.fromYears)}${joiner}${formatCount(band.toYears)}`;
}

/**
 * "ages 50 to 59", "ages 80 and over", "age 55" (a one-year band), "all ages".
 * @example
 * agesPhrase({ fromYears: 80, toYears: 120 }) //=> "ages 80 and over"
 */
export function agesPhrase(band: AgeBand): string {
  if (spansAllAges(band)) return 'all ages';
  if (band.fromYears === band.toYears && !isOpenTop(band.toYears)) return `age ${formatCount(band.fromYears)}`;
  return `ages ${range(band, ' to ')}`;
}

/**
 * "aged 50 to 59", "aged 80 and over", "aged 55"; undefined for a band that spans every age.
 * @example
 * agedPhrase({ fromYears: 50, toYears: 59 }) //=> "aged 50 to 59"
 * agedPhrase({ fromYears: 0, toYears: 120 }) //=> undefined
 */
export function agedPhrase(band: AgeBand): string | undefined {
  if (spansAllAges(band)) return undefined;
  return `aged ${range(band, ' to ')}`;
}

/**
 * A band in a table cell: "50–59", "80 and over", "all ages".
 * @example
 * ageCell({ fromYears: 50, toYears: 59 }) //=> "50–59"
 */
export function ageCell(band: AgeBand): string {
  if (spansAllAges(band)) return 'all ages';
  return range(band, '\u2013');
}

/**
 * The span of several bands, e.g. every band of a table: "ages 40 and over".
 * @example
 * agesSpanPhrase([{ fromYears: 40, toYears: 49 }, { fromYears: 50, toYears: 120 }]) //=> "ages 40 and over"
 */
export function agesSpanPhrase(bands: readonly AgeBand[]): string {
  if (bands.length === 0) return 'all ages';
  return agesPhrase({ fromYears: Math.min(...bands.map((b) => b.fromYears)), toYears: Math.max(...bands.map((b) => b.toYears)) });
}
