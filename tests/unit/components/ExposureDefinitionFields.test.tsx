// @vitest-environment jsdom
/**
 * The exposure fields (app/consultation/ExposureDefinitionFields.tsx), shared by the consultation
 * form and the library's evidence editor, in a react-hook-form harness that reads the values the
 * way both forms do (lib/evidence/exposureForm.ts).
 */
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useEffect } from 'react';
import { FormProvider, useForm, type Resolver } from 'react-hook-form';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ExposureDefinitionFields } from '@/app/consultation/ExposureDefinitionFields';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { exposureFromFormValues, exposureToFormValues, type ExposureFormValues } from '@/lib/evidence/exposureForm';
import { exposureDefinitionSchema, type ExposureDefinition } from '@/lib/glycaemia/exposure';

afterEach(() => cleanup());

type Values = { exposure: ExposureFormValues };

const resolver: Resolver<Values> = (values) => {
  const read = exposureFromFormValues(values.exposure);
  if (read.ok) return { values, errors: {} };
  const issue = read.issues[0];
  const field = String(issue?.path[1] ?? 'defined');
  return { values: {}, errors: { exposure: { [field]: { type: issue?.code ?? 'invalid', message: issue?.message ?? '' } } } };
};

function Harness({ initial, onChange = () => undefined }: { initial: ExposureDefinition | undefined; onChange?: (v: ExposureDefinition | undefined) => void }) {
  const methods = useForm<Values>({ resolver, defaultValues: { exposure: exposureToFormValues(initial) } });
  const { subscribe } = methods;
  useEffect(
    () =>
      subscribe({
        formState: { values: true },
        callback: ({ values }) => {
          const read = exposureFromFormValues(values.exposure);
          if (read.ok) onChange(read.value);
        },
      }),
    [subscribe, onChange],
  );
  return (
    <FormProvider {...methods}>
      <form onSubmit={(e) => void methods.handleSubmit(() => undefined)(e)}>
        <ExposureDefinitionFields />
        <button type="submit">Save</button>
      </form>
    </FormProvider>
  );
}

describe('ExposureDefinitionFields', () => {
  it('starts with one question when the study defined nothing; "Yes" gives a valid definition', async () => {
    const onChange = vi.fn();
    render(<Harness initial={undefined} onChange={onChange} />);
    expect(screen.queryByLabelText('Which test decides')).not.toBeInTheDocument();
    await userEvent.selectOptions(screen.getByLabelText('Does the study define its exposure over time?'), 'yes');
    const value = onChange.mock.calls.at(-1)?.[0] as ExposureDefinition;
    expect(exposureDefinitionSchema.safeParse(value).success).toBe(true);
    expect(screen.getByLabelText('Which test decides')).toBeInTheDocument();
  });

  it('every control has a plain label and a one-line explanation linked by aria-describedby', () => {
    render(<Harness initial={DEMO_WORKFORCE_HBA1C_HEART_FAILURE.exposureDefinition} />);
    const labels = [
      'Does the study define its exposure over time?',
      'Which test decides',
      'Range of the exposed group',
      'Criteria set',
      'Yearly results in a row',
      'Longest gap allowed between checkups',
      'Range of the comparison group',
      'Comparison: yearly results in a row',
    ];
    for (const label of labels) {
      const control = screen.getByLabelText(label, { exact: true });
      const hint = document.getElementById((control.getAttribute('aria-describedby') ?? '').split(' ')[0] ?? '');
      expect(hint?.textContent?.length).toBeGreaterThan(10);
    }
    // The demo entry's definition is shown as it is.
    expect(screen.getByLabelText('Which test decides')).toHaveValue('hba1c');
    expect(screen.getByLabelText('Range of the comparison group')).toHaveValue('normal');
  });

  it('changes each field, and removes the comparison group when it is "not stated"', async () => {
    const onChange = vi.fn();
    render(<Harness initial={{ category: 'prediabetes', criteria: 'ADA', minYears: 3 }} onChange={onChange} />);
    await userEvent.selectOptions(screen.getByLabelText('Which test decides'), 'fpg');
    await userEvent.selectOptions(screen.getByLabelText('Longest gap allowed between checkups'), '12');
    await userEvent.selectOptions(screen.getByLabelText('Range of the comparison group'), 'normal');
    expect(onChange.mock.calls.at(-1)?.[0]).toEqual({ category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'fpg', maxGapMonths: 12, comparison: { category: 'normal' } });
    await userEvent.selectOptions(screen.getByLabelText('Range of the comparison group'), '');
    expect(onChange.mock.calls.at(-1)?.[0]).toEqual({ category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'fpg', maxGapMonths: 12 });
    await userEvent.selectOptions(screen.getByLabelText('Does the study define its exposure over time?'), 'no');
    expect(onChange.mock.calls.at(-1)?.[0]).toBeUndefined();
  });

  it('shows a problem under its field', async () => {
    render(<Harness initial={{ category: 'normal', criteria: 'ADA', minYears: 3, comparison: { category: 'normal' } }} />);
    await userEvent.click(screen.getByRole('button', { name: 'Save' }));
    const control = screen.getByLabelText('Range of the comparison group');
    expect(control).toHaveAttribute('aria-invalid', 'true');
    expect(control).toHaveAccessibleDescription(expect.stringContaining('must differ'));
  });
});
