// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useState } from 'react';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ExposureFields, withExposure } from '@/app/components/exposure/ExposureFields';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { exposureDefinitionSchema, type ExposureDefinition } from '@/lib/glycaemia/exposure';

afterEach(() => cleanup());

function Harness({ initial, onChange }: { initial: ExposureDefinition | undefined; onChange: (v: ExposureDefinition | undefined) => void }) {
  const [value, setValue] = useState(initial);
  return (
    <ExposureFields
      value={value}
      onChange={(v) => {
        setValue(v);
        onChange(v);
      }}
    />
  );
}

describe('ExposureFields', () => {
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
    render(<Harness initial={DEMO_WORKFORCE_HBA1C_HEART_FAILURE.exposureDefinition} onChange={() => undefined} />);
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
      const hint = document.getElementById(control.getAttribute('aria-describedby') ?? '');
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

  it('shows a problem under its field', () => {
    render(
      <ExposureFields
        value={{ category: 'normal', criteria: 'ADA', minYears: 3, comparison: { category: 'normal' } }}
        onChange={() => undefined}
        issues={[{ code: 'invalid-choice', path: ['exposureDefinition', 'comparison', 'category'], message: 'The comparison category must differ from the exposure category (normal)' }]}
      />,
    );
    const control = screen.getByLabelText('Range of the comparison group');
    expect(control).toHaveAttribute('aria-invalid', 'true');
    expect(control).toHaveAccessibleDescription(expect.stringContaining('must differ'));
  });

  it('withExposure sets or removes the definition on an entry', () => {
    expect(withExposure(DEMO_WORKFORCE_HBA1C_HEART_FAILURE, undefined)).not.toHaveProperty('exposureDefinition');
    expect(withExposure(DEMO_WORKFORCE_HBA1C_HEART_FAILURE, { category: 'normal', criteria: 'WHO', minYears: 1 }).exposureDefinition).toEqual({ category: 'normal', criteria: 'WHO', minYears: 1 });
  });
});
