/**
 * The library's evidence editor (app/components/library/EvidenceForm.tsx) as form values: the
 * same effect, wording and exposure fields as the consultation form (./formValues.ts), read the
 * same way (one decimal reader, the same choice lists), plus the entry's title and notes. Pure:
 * the component only wires these values to the shared field components.
 */
import { z } from '../zod';
import { exposureFromFormValues } from '../evidence/exposureForm';
import { parseEvidenceEntry } from '../evidence/parse';
import type { EvidenceEntry } from '../evidence/schema';
import { fail, type Result } from '../result';
import { optionalText } from '../text';
import { effectFromForm, formInputSchema, wordingFromForm } from './formValues';
import { evidenceToFormValues } from './fromScenario';

export const evidenceEditorSchema = z.object({
  title: z.string(),
  effect: formInputSchema.shape.effect,
  wording: formInputSchema.shape.wording,
  exposure: formInputSchema.shape.exposure,
  notes: z.string(),
});

export type EvidenceEditorValues = z.infer<typeof evidenceEditorSchema>;

/**
 * An entry as the editor's values.
 * @example
 * evidenceEditorValues({ id: 'x', title: 'A study', effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 }, wording: {}, illustrative: false }).effect.estimate
 * //=> '1.5'
 */
export function evidenceEditorValues(entry: EvidenceEntry): EvidenceEditorValues {
  return { title: entry.title, ...evidenceToFormValues(entry), notes: entry.notes ?? '' };
}

/**
 * The editor's values → the entry (keeping the id and whether it is illustrative), checked by
 * the entry schema; issues carry the editor's field paths (`effect.estimate`, `exposure.comparison`, `title`).
 * @example
 * entryFromEditorValues({ ...evidenceEditorValues(entry), title: '' }, entry)
 * //=> { ok: false, issues: [{ code: 'too-short', path: ['title'], message: 'The title must not be empty' }] }
 */
export function entryFromEditorValues(values: EvidenceEditorValues, base: EvidenceEntry): Result<EvidenceEntry> {
  const exposure = exposureFromFormValues(values.exposure, ['exposure']);
  const notes = optionalText(values.notes);
  const parsed = parseEvidenceEntry({
    id: base.id,
    title: values.title,
    effect: effectFromForm(values.effect),
    wording: wordingFromForm(values.wording),
    ...(exposure.ok && exposure.value ? { exposureDefinition: exposure.value } : {}),
    illustrative: base.illustrative,
    ...(notes === undefined ? {} : { notes }),
  });
  if (parsed.ok && exposure.ok) return parsed;
  return fail([...(parsed.ok ? [] : parsed.issues), ...(exposure.ok ? [] : exposure.issues)]);
}
