'use client';
import { DENOMINATOR_CHOICES_FOR_FORM } from '@/lib/consultation/choices';
import { RadioField, TextField } from './fields';

export function SettingsSection() {
  return (
    <fieldset className="section">
      <legend className="section__title">
        <span className="section__number">3</span> Time frame and picture
      </legend>
      <div className="field-row">
        <TextField name="horizonYears" label="Horizon in years" hint="Leave blank to use the baseline’s own period." />
      </div>
      <RadioField name="denominator" legend="People in each picture" choices={DENOMINATOR_CHOICES_FOR_FORM} />
    </fieldset>
  );
}
