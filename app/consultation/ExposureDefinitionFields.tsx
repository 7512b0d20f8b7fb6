'use client';
/**
 * The study's exposure over time (lib/evidence/exposureForm.ts) as the shared field components:
 * the same labels, one-line explanations and choices on the consultation form and in the
 * library's evidence editor. Works in any react-hook-form form whose values hold `exposure`
 * ({@link ExposureFormValues}). The glucose history is checked against it, the link carries it,
 * and saving the evidence keeps it.
 */
import { useFormContext, useWatch } from 'react-hook-form';
import { EXPOSURE_FIELD_TEXT as t, exposureChoices, type ExposureFormValues } from '@/lib/evidence/exposureForm';
import { SelectField } from './fields';

type WithExposure = { exposure: ExposureFormValues };

export function ExposureDefinitionFields() {
  const { control } = useFormContext<WithExposure>();
  const exposure = useWatch({ control, name: 'exposure' });
  const choices = exposureChoices(exposure);
  return (
    <fieldset className="subsection" data-testid="exposure-definition">
      <legend className="subsection__title">Exposure over time (optional)</legend>
      <SelectField<WithExposure> name="exposure.defined" label={t.defined.label} hint={t.defined.hint} choices={choices.defined} />
      {exposure.defined === 'yes' ? (
        <>
          <SelectField<WithExposure> name="exposure.test" label={t.test.label} hint={t.test.hint} choices={choices.test} />
          <SelectField<WithExposure> name="exposure.category" label={t.category.label} hint={t.category.hint} choices={choices.category} />
          <SelectField<WithExposure> name="exposure.criteria" label={t.criteria.label} hint={t.criteria.hint} choices={choices.criteria} />
          <SelectField<WithExposure> name="exposure.minYears" label={t.minYears.label} hint={t.minYears.hint} choices={choices.minYears} />
          <SelectField<WithExposure> name="exposure.maxGapMonths" label={t.maxGapMonths.label} hint={t.maxGapMonths.hint} choices={choices.maxGapMonths} />
          <SelectField<WithExposure> name="exposure.comparison" label={t.comparison.label} hint={t.comparison.hint} choices={choices.comparison} />
          {exposure.comparison !== '' ? (
            <SelectField<WithExposure> name="exposure.comparisonYears" label={t.comparisonYears.label} hint={t.comparisonYears.hint} choices={choices.comparisonYears} />
          ) : null}
        </>
      ) : null}
    </fieldset>
  );
}
