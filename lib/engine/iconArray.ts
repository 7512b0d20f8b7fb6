/**
 * Icon-array counts and the order icons are filled in.
 *
 * Rules (shared/guides/risk-communication.md):
 * - One denominator D for every array and sentence on a page (Trevena et al. 2013,
 *   BMC Med Inform Decis Mak 13(Suppl 2):S7).
 * - D = 100 when every shown count is a whole number ≥ 1; otherwise 1,000 (Galesic,
 *   Garcia-Retamero & Gigerenzer 2009, Health Psychol 28:210, on denominators; the switching
 *   rule is ours). A count "shown" is one the sentences state: people with and without the
 *   outcome in each group and the people added or avoided. It switches when a non-zero
 *   quantity would round to 0 people at 100.
 * - Counts are the cumulative risks rounded, count = round(P·D), so each array agrees with the
 *   sentence beside it; icons are whole and the groups sum to D.
 * - Affected icons are grouped and filled row by row from the same corner (Ancker, Weber &
 *   Kukafka 2011, Med Decis Making 31:143); baseline events first, then the added (or
 *   avoided) events right after them (Zikmund-Fisher et al. 2008, J Health Commun 13:107).
 */
import type { Denominator } from '../scenario/schema';
import type { Estimate, IconArrayCounts } from './types';

/**
 * Rounds half up (common practice), forgiving floating-point noise: 0.145·100 computes as
 * 14.499999999999998 and must count as 15 people, as the sentence "14.5%" would be read.
 */
export function roundPeople(value: number): number {
  return Math.floor(value + 0.5 + 1e-9);
}

function resolvesAt(denominator: number, reference: number, exposed: number): boolean {
  const shown = (p: number) => p === 0 || roundPeople(p * denominator) >= 1;
  const ref = roundPeople(reference * denominator);
  const exp = roundPeople(exposed * denominator);
  const differenceShown = reference === exposed || ref !== exp;
  return shown(reference) && shown(exposed) && shown(1 - reference) && shown(1 - exposed) && differenceShown;
}

/** The engine's automatic denominator for a pair of risks. */
export function chooseDenominator(referenceRisk: number, exposedRisk: number): Denominator {
  return resolvesAt(100, referenceRisk, exposedRisk) ? 100 : 1000;
}

/**
 * @param chosen - a denominator the clinician picked, or undefined for the automatic rule
 * @example
 * iconArrayCounts(0.08, { estimate: 0.12, lower: 0.1, upper: 0.15 })
 * //=> { denominator: 100, automatic: true, referenceEvents: 8, exposedEvents: 12, exposedLower: 10, exposedUpper: 15 }
 */
export function iconArrayCounts(referenceRisk: number, exposed: Estimate, chosen?: Denominator): IconArrayCounts {
  const denominator = chosen ?? chooseDenominator(referenceRisk, exposed.estimate);
  return {
    denominator,
    automatic: chosen === undefined,
    referenceEvents: roundPeople(referenceRisk * denominator),
    exposedEvents: roundPeople(exposed.estimate * denominator),
    exposedLower: roundPeople(exposed.lower * denominator),
    exposedUpper: roundPeople(exposed.upper * denominator),
  };
}

/**
 * What one icon stands for:
 * - `event`: has the outcome at the reference risk (both arrays)
 * - `added`: has the outcome only because of the exposure (exposed array, harmful effect)
 * - `avoided`: would have had it at the reference risk, does not with the exposure (protective)
 * - `none`: does not have the outcome
 */
export type IconKind = 'event' | 'added' | 'avoided' | 'none';

export interface IconCell {
  readonly kind: IconKind;
  /** Inside the range the interval allows ("could be"): drawn lighter, with an outline. */
  readonly uncertain: boolean;
}

export interface IconArrayLayout {
  readonly denominator: Denominator;
  /** Icons per row: 10 for 100, 25 for 1,000. Filled row by row from the top-left corner. */
  readonly columns: number;
  /** D cells in fill order. */
  readonly cells: readonly IconCell[];
  readonly tally: Readonly<Record<IconKind, number>> & { readonly uncertain: number };
}

function build(denominator: Denominator, kindAt: (i: number) => IconKind, uncertainFrom: number, uncertainTo: number): IconArrayLayout {
  const cells: IconCell[] = [];
  const tally = { event: 0, added: 0, avoided: 0, none: 0, uncertain: 0 };
  for (let i = 0; i < denominator; i += 1) {
    const kind = kindAt(i);
    const uncertain = i >= uncertainFrom && i < uncertainTo;
    tally[kind] += 1;
    if (uncertain) tally.uncertain += 1;
    cells.push({ kind, uncertain });
  }
  return { denominator, columns: denominator === 100 ? 10 : 25, cells, tally };
}

/** The reference group's array: `referenceEvents` events, then no-event icons. */
export function referenceLayout(counts: IconArrayCounts): IconArrayLayout {
  return build(counts.denominator, (i) => (i < counts.referenceEvents ? 'event' : 'none'), 0, 0);
}

/**
 * The exposed group's array. Harmful: reference events, then added events, then none.
 * Protective: the exposed events, then the avoided ones (up to the reference count), then none.
 * Icons from the lower to the upper limit's count are marked uncertain; their number equals
 * exposedUpper − exposedLower, the range the sentence gives.
 */
export function exposedLayout(counts: IconArrayCounts): IconArrayLayout {
  const { referenceEvents: ref, exposedEvents: exp } = counts;
  const kindAt = (i: number): IconKind => {
    if (i < Math.min(ref, exp)) return 'event';
    if (i < exp) return 'added';
    if (i < ref) return 'avoided';
    return 'none';
  };
  return build(counts.denominator, kindAt, counts.exposedLower, counts.exposedUpper);
}
