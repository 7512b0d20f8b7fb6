'use client';
import { useFormContext } from 'react-hook-form';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { ADJUSTED_CHOICES_FOR_FORM, DESIGN_CHOICES, LEVEL_CHOICES_FOR_FORM, MEASURE_CHOICES } from './choices';
import { RadioField, SelectField, TextField, type FieldName } from './fields';
import type { ConsultationFormValues } from './formModel';

const LIMITS: FieldName[] = ['effect.estimate', 'effect.lower', 'effect.upper'];

export function EvidenceSection({ entries, children }: { entries: readonly EvidenceEntry[]; children?: React.ReactNode }) {
  const { setValue } = useFormContext<ConsultationFormValues>();

  async function fillFrom(id: string) {
    const entry = entries.find((e) => e.id === id);
    if (!entry) return;
    const { evidenceToFormValues } = await import('./fromScenario');
    const filled = evidenceToFormValues(entry);
    const options = { shouldValidate: true, shouldDirty: true, shouldTouch: true } as const;
    setValue('effect', filled.effect, options);
    setValue('wording', filled.wording, options);
  }

  return (
    <fieldset className="section">
      <legend className="section__title">
        <span className="section__number">2</span> Evidence: the published effect
      </legend>
      <SelectField
        name="evidenceId"
        label="Start from a saved entry (optional)"
        hint="Fills in the fields below; you can still change any of them."
        choices={[{ value: '', label: 'None: type the figures in' }, ...entries.map((e) => ({ value: e.id, label: e.illustrative ? `${e.title} — illustrative, not a real study` : e.title }))]}
        onChosen={(id) => void fillFrom(id)}
      />
      <RadioField name="effect.measure" legend="Measure reported" choices={MEASURE_CHOICES} />
      <div className="field-row">
        <TextField name="effect.estimate" label="Estimate" deps={LIMITS.filter((n) => n !== 'effect.estimate')} />
        <TextField name="effect.lower" label="Lower limit" deps={LIMITS.filter((n) => n !== 'effect.lower')} />
        <TextField name="effect.upper" label="Upper limit" deps={LIMITS.filter((n) => n !== 'effect.upper')} />
        <SelectField
          name="effect.level"
          label="Interval level"
          hint="How sure the paper’s interval is meant to be; most papers give 95%."
          choices={LEVEL_CHOICES_FOR_FORM}
        />
      </div>
      <RadioField name="effect.design" legend="Study design" choices={DESIGN_CHOICES} />
      <div className="field-row">
        <TextField name="effect.followUpYears" label="Follow-up in years (optional)" hint="How long the study followed people." />
      </div>
      <RadioField name="effect.adjusted" legend="Adjusted for other factors?" choices={ADJUSTED_CHOICES_FOR_FORM} />
      <fieldset className="subsection">
        <legend className="subsection__title">Wording used in the sentences</legend>
        <TextField name="wording.outcome" label="Outcome" kind="text" size="long" placeholder="heart failure needing hospital care" />
        <TextField name="wording.exposure" label="Exposure" kind="text" size="long" placeholder="HbA1c in the prediabetes range" />
        <TextField name="wording.comparison" label="Comparison" kind="text" size="long" placeholder="normal HbA1c" />
        <TextField
          name="wording.population"
          label="Population"
          kind="text"
          size="long"
          hint="Who the study was about; without an age or sex it also names “people like you” (at most 80 characters then)."
        />
        <TextField name="wording.citation" label="Citation" kind="text" size="long" />
      </fieldset>
      {children}
    </fieldset>
  );
}
