'use client';
import { useFormContext } from 'react-hook-form';
import { ENTRY_NO_LONGER_APPLIES, LEFTOVER_WORDING, type EntryCheck, type WordingField } from '@/lib/consultation/entry';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { ADJUSTED_CHOICES_FOR_FORM, DESIGN_CHOICES, LEVEL_CHOICES_FOR_FORM, MEASURE_CHOICES } from '@/lib/consultation/choices';
import { ExposureDefinitionFields } from './ExposureDefinitionFields';
import { RadioField, SelectField, TextField, type FieldName } from './fields';
import type { ConsultationFormValues } from '@/lib/consultation/formValues';

const LIMITS: FieldName[] = ['effect.estimate', 'effect.lower', 'effect.upper'];

interface EvidenceSectionProps {
  readonly entries: readonly EvidenceEntry[];
  /** Whether the entry the form started from still applies (lib/consultation/entry.ts). */
  readonly entryCheck?: EntryCheck;
  /** The clinician keeps a wording left over from an entry that no longer applies. */
  readonly onKeepWording?: (field: WordingField, text: string) => void;
  readonly children?: React.ReactNode;
}

const WORDING_LABELS: Record<WordingField, string> = { outcome: 'Outcome', exposure: 'Exposure', comparison: 'Comparison', population: 'Population', citation: 'Citation' };

export function EvidenceSection({ entries, entryCheck, onKeepWording, children }: EvidenceSectionProps) {
  const { setValue, getValues } = useFormContext<ConsultationFormValues>();
  const stale = entryCheck?.noLongerApplies === true;
  const leftovers = new Set(entryCheck?.leftoverFields ?? []);
  // Once the figures are the clinician's own, the picker no longer names the entry.
  const choices = [
    { value: '', label: 'None: type the figures in' },
    ...entries.map((e) =>
      stale && e.id === entryCheck?.staleId ? { value: e.id, label: 'Your own figures (the saved entry no longer applies)' } : { value: e.id, label: e.illustrative ? `${e.title} — illustrative, not a real study` : e.title },
    ),
  ];
  function flag(field: WordingField) {
    if (!leftovers.has(field)) return undefined;
    return (
      <span className="field__flag" data-testid={`leftover-${field}`}>
        {LEFTOVER_WORDING}{' '}
        <button type="button" className="button button--quiet" onClick={() => onKeepWording?.(field, getValues(`wording.${field}`))}>
          Keep this {WORDING_LABELS[field].toLowerCase()}
        </button>{' '}
        <button type="button" className="button button--quiet" onClick={() => setValue(`wording.${field}`, '', { shouldValidate: true, shouldDirty: true })}>
          Clear it
        </button>
      </span>
    );
  }

  async function fillFrom(id: string) {
    const entry = entries.find((e) => e.id === id);
    if (!entry) return;
    const { evidenceToFormValues } = await import('@/lib/consultation/fromScenario');
    const filled = evidenceToFormValues(entry);
    const options = { shouldValidate: true, shouldDirty: true, shouldTouch: true } as const;
    setValue('effect', filled.effect, options);
    setValue('wording', filled.wording, options);
    setValue('exposure', filled.exposure, options);
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
        choices={choices}
        onChosen={(id) => void fillFrom(id)}
      />
      {stale ? (
        <p className="entry-notice" role="status" data-testid="entry-no-longer-applies">
          {ENTRY_NO_LONGER_APPLIES}
        </p>
      ) : null}
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
        <TextField name="wording.outcome" label="Outcome" kind="text" size="long" placeholder="heart failure needing hospital care" flag={flag('outcome')} />
        <TextField name="wording.exposure" label="Exposure" kind="text" size="long" placeholder="HbA1c in the prediabetes range" flag={flag('exposure')} />
        <TextField name="wording.comparison" label="Comparison" kind="text" size="long" placeholder="normal HbA1c" flag={flag('comparison')} />
        <TextField
          name="wording.population"
          label="Population"
          kind="text"
          size="long"
          hint="Who the study was about; without an age or sex it also names “people like you” (at most 80 characters then)."
          flag={flag('population')}
        />
        <TextField name="wording.citation" label="Citation" kind="text" size="long" flag={flag('citation')} />
      </fieldset>
      <ExposureDefinitionFields />
      {children}
    </fieldset>
  );
}

