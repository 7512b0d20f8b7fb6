/**
 * A checkup as typed into the screen's row (or pasted): text fields, not yet numbers. Turning
 * drafts into the history input happens here, so the screen does no conversion of its own and
 * the same schema (./schema.ts) judges typed, pasted and imported rows.
 */
import { readDecimal as readTypedDecimal } from '../text/decimal';
import type { Checkup } from './schema';
import { CRITERIA } from './criteria';
import type { CriteriaSet } from './exposure';
import type { GlucoseUnit } from './glucose';
import type { Hba1cUnit } from './hba1c';

export interface CheckupDraft {
  readonly date: string;
  readonly hba1cValue: string;
  readonly hba1cUnit: Hba1cUnit;
  readonly fpgValue: string;
  readonly fpgUnit: GlucoseUnit;
}

export const DRAFT_FIELDS = ['date', 'hba1cValue', 'hba1cUnit', 'fpgValue', 'fpgUnit'] as const;
export type DraftField = (typeof DRAFT_FIELDS)[number];

/** An empty row, with the units of the criteria set's own (the ones its thresholds use). */
export function emptyDraft(criteria: CriteriaSet): CheckupDraft {
  return { date: '', hba1cValue: '', hba1cUnit: CRITERIA[criteria].hba1c.unit, fpgValue: '', fpgUnit: CRITERIA[criteria].fpg.unit };
}

/** True when nothing has been typed into the row yet (it is then ignored, not an error). */
export function isBlankDraft(draft: CheckupDraft): boolean {
  return draft.date.trim() === '' && draft.hba1cValue.trim() === '' && draft.fpgValue.trim() === '';
}

/**
 * A typed number, read by the one decimal reader (lib/text/decimal.ts) that the consultation form
 * and the evidence editor use: "" → absent; "6.1" or "6,1" (decimal comma) → 6.1; anything else
 * ("high", "6.1.2", "6%") is passed on unchanged so that the schema reports it as not a number.
 *
 * @example
 * readDecimal('6,1')  //=> 6.1
 * readDecimal('')     //=> undefined
 * readDecimal('high') //=> 'high'
 */
export function readDecimal(text: string): number | string | undefined {
  const reading = readTypedDecimal(text);
  if (reading.kind === 'blank') return undefined;
  return reading.kind === 'number' ? reading.value : reading.text;
}

/**
 * Drafts → the `checkups` list of the history input, leaving blank rows out. `rowOf[k]` is the
 * row index of input checkup k, for mapping issues back to rows.
 */
export function draftsToCheckups(drafts: readonly CheckupDraft[]): { readonly checkups: unknown[]; readonly rowOf: number[] } {
  const checkups: unknown[] = [];
  const rowOf: number[] = [];
  drafts.forEach((draft, row) => {
    if (isBlankDraft(draft)) return;
    const hba1c = readDecimal(draft.hba1cValue);
    const fpg = readDecimal(draft.fpgValue);
    checkups.push({
      date: draft.date.trim(),
      ...(hba1c !== undefined ? { hba1c: { value: hba1c, unit: draft.hba1cUnit } } : {}),
      ...(fpg !== undefined ? { fpg: { value: fpg, unit: draft.fpgUnit } } : {}),
    });
    rowOf.push(row);
  });
  return { checkups, rowOf };
}

/** A validated checkup back into a row (after a FHIR import), the other test's unit from the criteria set. */
export function checkupToDraft(checkup: Checkup, criteria: CriteriaSet): CheckupDraft {
  const blank = emptyDraft(criteria);
  return {
    date: checkup.date,
    hba1cValue: checkup.hba1c ? String(checkup.hba1c.value) : '',
    hba1cUnit: checkup.hba1c?.unit ?? blank.hba1cUnit,
    fpgValue: checkup.fpg ? String(checkup.fpg.value) : '',
    fpgUnit: checkup.fpg?.unit ?? blank.fpgUnit,
  };
}
