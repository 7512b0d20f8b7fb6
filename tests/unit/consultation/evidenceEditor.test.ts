/**
 * The library's evidence editor as values (lib/consultation/evidenceEditor.ts): the same reading
 * as the consultation form — one decimal reader, the same choice values — and problems on the
 * editor's own field paths. Expected values are written out by hand.
 */
import { describe, expect, it } from 'vitest';
import { entryFromEditorValues, evidenceEditorValues } from '@/lib/consultation/evidenceEditor';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';

const ENTRY: EvidenceEntry = {
  id: 'clinic-a',
  title: 'A cohort (illustrative)',
  effect: { measure: 'HR', estimate: 1.6, lower: 1.2, upper: 2.1, level: 0.95, design: 'cohort', adjusted: true },
  wording: { outcome: 'heart failure' },
  exposureDefinition: { category: 'prediabetes', criteria: 'ADA', minYears: 3 },
  illustrative: false,
  notes: 'Men and women 40–65.',
};

describe('evidenceEditorValues / entryFromEditorValues', () => {
  it('shows an entry as the consultation form would, and gives it back unchanged', () => {
    const values = evidenceEditorValues(ENTRY);
    expect(values.effect).toEqual({ measure: 'HR', estimate: '1.6', lower: '1.2', upper: '2.1', level: '0.95', design: 'cohort', followUpYears: '', adjusted: 'yes' });
    expect(values.exposure.defined).toBe('yes');
    expect(values.notes).toBe('Men and women 40–65.');
    expect(entryFromEditorValues(values, ENTRY)).toEqual({ ok: true, value: ENTRY });
    for (const entry of DEMO_EVIDENCE) expect(entryFromEditorValues(evidenceEditorValues(entry), entry)).toEqual({ ok: true, value: entry });
  });

  it('reads a decimal comma as the form does, and leaves "not stated" out', () => {
    const values = evidenceEditorValues(ENTRY);
    const read = entryFromEditorValues({ ...values, effect: { ...values.effect, estimate: '1,7', level: '', adjusted: '' }, notes: '  ' }, ENTRY);
    expect(read.ok && read.value.effect).toEqual({ measure: 'HR', estimate: 1.7, lower: 1.2, upper: 2.1, design: 'cohort' });
    expect(read.ok && 'notes' in read.value).toBe(false);
  });

  it('removes the exposure definition when the study defines none', () => {
    const values = evidenceEditorValues(ENTRY);
    const read = entryFromEditorValues({ ...values, exposure: { ...values.exposure, defined: 'no' } }, ENTRY);
    expect(read.ok && 'exposureDefinition' in read.value).toBe(false);
  });

  it('puts each problem on the editor’s field: a number that is not one, an empty title, a same-range comparison', () => {
    const values = evidenceEditorValues(ENTRY);
    const read = entryFromEditorValues({ ...values, title: ' ', effect: { ...values.effect, lower: '1.2abc' }, exposure: { ...values.exposure, comparison: 'prediabetes' } }, ENTRY);
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.issues.map((i) => i.path.join('.'))).toEqual(['title', 'effect.lower', 'exposure.comparison']);
  });
});
