'use client';
/**
 * Edit an evidence entry: its title, the effect (measure, estimate, interval, level, design,
 * follow-up, adjusted), the wording, the exposure over time and notes. The same field
 * components (app/consultation/fields.tsx), choice lists and number reader as the consultation
 * form; the values and their reading are lib/consultation/evidenceEditor.ts. Validated by the
 * entry schema on save; each problem appears under its field (aria-describedby) and nothing is
 * saved until all are fixed.
 *
 * Props:
 * - entry: the entry to edit (its id and whether it is illustrative are kept);
 * - onSave(entry): called with the valid entry; it resolves to issues when the library refused it;
 * - onCancel().
 */
import { useId, useState } from 'react';
import { FormProvider, useForm, type FieldError, type Resolver } from 'react-hook-form';
import { toNestErrors } from '@hookform/resolvers';
import { ADJUSTED_CHOICES_FOR_FORM, DESIGN_CHOICES, LEVEL_CHOICES_FOR_FORM, MEASURE_CHOICES } from '@/lib/consultation/choices';
import { entryFromEditorValues, evidenceEditorValues, type EvidenceEditorValues } from '@/lib/consultation/evidenceEditor';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { Issue } from '@/lib/result';
import { ExposureDefinitionFields } from '@/app/consultation/ExposureDefinitionFields';
import { FieldIdPrefix, SelectField, TextField } from '@/app/consultation/fields';
import { ProblemList } from './ProblemList';

export interface EvidenceFormProps {
  readonly entry: EvidenceEntry;
  readonly onSave: (entry: EvidenceEntry) => Promise<readonly Issue[]>;
  readonly onCancel: () => void;
}

/** The editor's own field names: every issue whose path is one of them shows under that field. */
const FIELDS = new Set([
  'title',
  'notes',
  ...['measure', 'estimate', 'lower', 'upper', 'level', 'design', 'followUpYears', 'adjusted'].map((k) => `effect.${k}`),
  ...['outcome', 'exposure', 'comparison', 'population', 'citation'].map((k) => `wording.${k}`),
  ...['defined', 'test', 'category', 'criteria', 'minYears', 'maxGapMonths', 'comparison', 'comparisonYears'].map((k) => `exposure.${k}`),
]);

function resolverFor(entry: EvidenceEntry): Resolver<EvidenceEditorValues> {
  return (values, _context, options) => {
    const read = entryFromEditorValues(values, entry);
    if (read.ok) return { values, errors: {} };
    const flat: Record<string, FieldError> = {};
    for (const issue of read.issues) {
      const name = issue.path.join('.');
      if (FIELDS.has(name) && flat[name] === undefined) flat[name] = { type: issue.code, message: issue.message };
    }
    return { values: {}, errors: toNestErrors(flat, options) };
  };
}

export function EvidenceForm({ entry, onSave, onCancel }: EvidenceFormProps) {
  const id = useId();
  const [resolver] = useState(() => resolverFor(entry));
  const methods = useForm<EvidenceEditorValues>({ resolver, defaultValues: evidenceEditorValues(entry), mode: 'onSubmit', reValidateMode: 'onChange' });
  const [problems, setProblems] = useState<readonly Issue[]>([]);
  const [saving, setSaving] = useState(false);

  async function save(values: EvidenceEditorValues) {
    const read = entryFromEditorValues(values, entry);
    if (!read.ok) return;
    setSaving(true);
    const refused = await onSave(read.value);
    setSaving(false);
    setProblems(refused);
  }
  // Problems with no field of their own (the library refused the entry) are listed together.
  const invalid = () => {
    const read = entryFromEditorValues(methods.getValues(), entry);
    setProblems(read.ok ? [] : read.issues.filter((i) => !FIELDS.has(i.path.join('.'))));
  };

  return (
    <FormProvider {...methods}>
      <FieldIdPrefix.Provider value={`${id}-`}>
        <form className="library__form" onSubmit={(e) => void methods.handleSubmit(save, invalid)(e)} noValidate aria-label={`Edit ${entry.title}`}>
          <TextField<EvidenceEditorValues> name="title" label="Title in the library" kind="text" size="long" />
          <fieldset className="subsection">
            <legend className="subsection__title">Effect</legend>
            <SelectField<EvidenceEditorValues> name="effect.measure" label="Measure" choices={MEASURE_CHOICES} />
            <TextField<EvidenceEditorValues> name="effect.estimate" label="Estimate" />
            <TextField<EvidenceEditorValues> name="effect.lower" label="Lower limit" />
            <TextField<EvidenceEditorValues> name="effect.upper" label="Upper limit" />
            <SelectField<EvidenceEditorValues> name="effect.level" label="Interval level" choices={LEVEL_CHOICES_FOR_FORM} />
            <SelectField<EvidenceEditorValues> name="effect.design" label="Study design" choices={DESIGN_CHOICES} />
            <TextField<EvidenceEditorValues> name="effect.followUpYears" label="Follow-up (years)" />
            <SelectField<EvidenceEditorValues> name="effect.adjusted" label="Adjusted" choices={ADJUSTED_CHOICES_FOR_FORM} />
          </fieldset>
          <fieldset className="subsection">
            <legend className="subsection__title">Wording</legend>
            <TextField<EvidenceEditorValues> name="wording.outcome" label="Outcome" kind="text" size="long" />
            <TextField<EvidenceEditorValues> name="wording.exposure" label="Exposure" kind="text" size="long" />
            <TextField<EvidenceEditorValues> name="wording.comparison" label="Comparison" kind="text" size="long" />
            <TextField<EvidenceEditorValues> name="wording.population" label="Population" kind="text" size="long" />
            <TextField<EvidenceEditorValues> name="wording.citation" label="Citation" kind="text" size="long" />
          </fieldset>
          <ExposureDefinitionFields />
          <TextField<EvidenceEditorValues> name="notes" label="Notes" kind="multiline" size="long" />
          <ProblemList problems={problems} heading="Not saved" />
          <div className="library__buttons">
            <button type="submit" className="button" disabled={saving}>
              {saving ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="button button--secondary" onClick={onCancel}>
              Cancel
            </button>
          </div>
        </form>
      </FieldIdPrefix.Provider>
    </FormProvider>
  );
}
