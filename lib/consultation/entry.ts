/**
 * Does the saved (or demo) evidence entry the form started from still describe the figures on
 * screen? Once the clinician types figures of their own, the entry no longer applies: its
 * name must not stay on screen, and every wording it filled in (comparison, population,
 * citation…) is flagged until the clinician keeps or clears it, so an invented citation or a
 * mismatched comparison never reaches the handout unseen.
 */
import type { EvidenceEntry } from '../evidence/schema';
import type { Issue } from '../result';
import { numberFromText } from '../text';

export const WORDING_FIELDS = ['outcome', 'exposure', 'comparison', 'population', 'citation'] as const;
export type WordingField = (typeof WORDING_FIELDS)[number];

/** The effect and wording as the form holds them (text as typed). */
export interface EntryFormPart {
  readonly effect: {
    readonly measure: string;
    readonly estimate: string;
    readonly lower: string;
    readonly upper: string;
    readonly level: string;
    readonly design: string;
    readonly followUpYears: string;
    readonly adjusted: string;
  };
  readonly wording: Readonly<Record<WordingField, string>>;
}

export interface EntryCheck {
  /** The entry named by the form, while its figures still match the form's. */
  readonly applying?: EvidenceEntry;
  /** Set once the figures no longer match the entry the form started from. */
  readonly noLongerApplies: boolean;
  /** The id of the entry that no longer applies (the picker stops naming it). */
  readonly staleId?: string;
  /** Wording fields still holding the entry's text, not yet kept by the clinician. */
  readonly leftoverFields: readonly WordingField[];
  /** True while demo data is in use: a demo entry that applies, or its leftover words. */
  readonly illustrative: boolean;
}

export const ENTRY_NO_LONGER_APPLIES =
  'The figures no longer match the saved entry you started from, so it no longer applies. Each wording it filled in is marked: keep it or clear it.';
export const LEFTOVER_WORDING = 'Filled in from a saved entry that no longer applies: keep this wording or clear it.';

function sameNumber(typed: string, value: number | undefined): boolean {
  const read = numberFromText(typed);
  return read === value || (read !== undefined && value !== undefined && Math.abs(read - value) < 1e-12);
}

/**
 * True when the form's effect fields say what the entry's effect says.
 * @example
 * effectMatches(entry, { measure: 'HR', estimate: '1.5', … }) //=> false for an entry with OR 1.5
 */
export function effectMatches(entry: EvidenceEntry, form: EntryFormPart['effect']): boolean {
  const e = entry.effect;
  return (
    form.measure === e.measure &&
    sameNumber(form.estimate, e.estimate) &&
    sameNumber(form.lower, e.lower) &&
    sameNumber(form.upper, e.upper) &&
    sameNumber(form.level, e.level) &&
    form.design === (e.design ?? '') &&
    sameNumber(form.followUpYears, e.followUpYears) &&
    form.adjusted === (e.adjusted === undefined ? '' : e.adjusted ? 'yes' : 'no')
  );
}

/**
 * @param entry - the entry the form's `evidenceId` names, if any
 * @param form - the form's effect and wording
 * @param kept - wording fields the clinician chose to keep, with the text kept
 */
export function checkEntry(entry: EvidenceEntry | undefined, form: EntryFormPart, kept: Readonly<Partial<Record<WordingField, string>>> = {}): EntryCheck {
  if (!entry) return { noLongerApplies: false, leftoverFields: [], illustrative: false };
  if (effectMatches(entry, form.effect)) return { applying: entry, noLongerApplies: false, leftoverFields: [], illustrative: entry.illustrative };
  const leftoverFields = WORDING_FIELDS.filter((field) => {
    const text = form.wording[field].trim();
    const fromEntry = (entry.wording?.[field] ?? '').trim();
    return text !== '' && text === fromEntry && kept[field] !== form.wording[field];
  });
  return { noLongerApplies: true, staleId: entry.id, leftoverFields, illustrative: entry.illustrative && leftoverFields.length > 0 };
}

/** The leftover fields as issues on their form fields, for the list of words still needed. */
export function leftoverIssues(check: EntryCheck): Issue[] {
  return check.leftoverFields.map((field) => ({ code: 'entry-leftover', path: ['wording', field], message: `${LEFTOVER_WORDING} (${field})` }));
}
