// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { GlucoseHistory } from '@/app/components/glucose/GlucoseHistory';
import type { HistoryMatch } from '@/lib/glycaemia/match';

// Rows and files invented for the tests (illustrative numbers, not from a real person or study).
const TODAY = '2024-06-30';

beforeAll(() => {
  // jsdom has no ResizeObserver; recharts' ResponsiveContainer asks for one.
  globalThis.ResizeObserver ??= class {
    observe() {}
    unobserve() {}
    disconnect() {}
  } as unknown as typeof ResizeObserver;
});

afterEach(() => cleanup());

function result() {
  return screen.getByTestId('glucose-result');
}

async function pasteRows(user: ReturnType<typeof userEvent.setup>, text: string) {
  const box = screen.getByLabelText('Paste rows from a spreadsheet');
  await user.click(box);
  await user.paste(text);
  await user.click(screen.getByRole('button', { name: 'Add pasted rows' }));
}

describe('GlucoseHistory', () => {
  it('classifies a typed row and says the run in plain words', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    expect(within(result()).getByText('No checkups yet: add a row, paste rows or load a FHIR file.')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Date'), '2023-03-01');
    await user.type(screen.getByLabelText('HbA1c'), '6.1');
    expect(within(result()).getByText('1 checkup, classified under ADA.')).toBeInTheDocument();
    expect(within(result()).getByText('The latest result (2023-03-01) is in the prediabetes range (ADA). There are no earlier results.')).toBeInTheDocument();
    expect(screen.getByText('2023-03-01: prediabetes range (ADA), from HbA1c 6.1%.')).toBeInTheDocument();
    expect(result()).toHaveAttribute('aria-live', 'polite');
  });

  it('links each error to its field', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    const date = screen.getByLabelText('Date');
    await user.type(date, '2023-02-30');
    await user.type(screen.getByLabelText('Fasting glucose'), '101');
    expect(date).toHaveAttribute('aria-invalid', 'true');
    expect(date).toHaveAccessibleDescription(/The date 2023-02-30 is not a real calendar day/);
    expect(within(result()).getByText('1 problem in the rows; nothing is classified until it is fixed:')).toBeInTheDocument();
    expect(within(result()).getByText('Row 1, date: The date 2023-02-30 is not a real calendar day')).toBeInTheDocument();
  });

  it('pastes rows and shows the match and the mismatch for an exposure definition', async () => {
    const user = userEvent.setup();
    const onMatchChange = vi.fn<(match: HistoryMatch | null) => void>();
    const { rerender } = render(
      <GlucoseHistory today={TODAY} exposure={{ category: 'prediabetes', criteria: 'ADA', minYears: 3 }} onMatchChange={onMatchChange} />,
    );
    expect(onMatchChange).toHaveBeenLastCalledWith(null);
    await pasteRows(user, 'Date\tHbA1c\tUnit\tFPG\tUnit\n2021-03-01\t5,9\t%\t\t\n2022-03-01\t6,0\t%\t\t\n2023-03-01\t6,2\t%\t5,6\tmmol/l');
    expect(screen.getByText('Added 3 rows (header line skipped).')).toBeInTheDocument();
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(3);
    const match = screen.getByTestId('glucose-match');
    expect(within(match).getByText('This history fits the study\u2019s exposure.')).toBeInTheDocument();
    expect(within(match).getByText('The study needed 3 yearly results in the prediabetes range (ADA); this history has 3, from 2021-03-01 to 2023-03-01.')).toBeInTheDocument();
    expect(onMatchChange).toHaveBeenLastCalledWith(expect.objectContaining({ matches: true }));

    rerender(<GlucoseHistory today={TODAY} exposure={{ category: 'prediabetes', criteria: 'ADA', minYears: 4 }} onMatchChange={onMatchChange} />);
    expect(within(screen.getByTestId('glucose-match')).getByText('This history does not fit the study\u2019s exposure.')).toBeInTheDocument();
    expect(screen.getByText('The study needed 4 yearly results in the prediabetes range (ADA); this history has 3, from 2021-03-01 to 2023-03-01.')).toBeInTheDocument();
    const last = onMatchChange.mock.lastCall?.[0];
    expect(last?.matches).toBe(false);
    expect(last?.warning?.code).toBe('exposure-mismatch');
  });

  it('does not call back again for an equal exposure object', () => {
    const onMatchChange = vi.fn();
    const { rerender } = render(<GlucoseHistory today={TODAY} exposure={{ category: 'normal', criteria: 'WHO', minYears: 1 }} onMatchChange={onMatchChange} />);
    rerender(<GlucoseHistory today={TODAY} exposure={{ category: 'normal', criteria: 'WHO', minYears: 1 }} onMatchChange={onMatchChange} />);
    expect(onMatchChange).toHaveBeenCalledTimes(1);
  });

  it('reports pasted lines it could not add', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    await pasteRows(user, '2023-03-01\t6.1\tmg%\t\t');
    expect(screen.getByText('Line 1: "mg%" is not an HbA1c unit (% or mmol/mol); the line was not added')).toBeInTheDocument();
  });

  it('shows the prominent note for a diabetes-range latest result, without diagnostic wording', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    await pasteRows(user, '2022-03-01\t6.0\t%\t\t\n2023-03-01\t6.8\t%\t\t');
    const note = screen.getByTestId('glucose-diabetes-range-note');
    expect(within(note).getByText(/One result is not a diagnosis/)).toBeInTheDocument();
    // Proper names ("American Diabetes Association", "Standards of Care in Diabetes") are not diagnostic wording.
    const text = (screen.getByTestId('glucose-history').textContent ?? '').replaceAll('American Diabetes Association', '').replaceAll('Standards of Care in Diabetes', '');
    expect(text).not.toMatch(/\bdiabetes\b(?! range)/i);
  });

  it('loads a FHIR Bundle and lists what it skipped', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    const obs = (code: string, value: number, unit: string, date: string, status = 'final') => ({
      resourceType: 'Observation',
      status,
      code: { coding: [{ system: 'http://loinc.org', code }] },
      effectiveDateTime: date,
      valueQuantity: { value, unit, system: 'http://unitsofmeasure.org', code: unit },
    });
    const bundle = {
      resourceType: 'Bundle',
      type: 'searchset',
      entry: [{ resource: obs('4548-4', 6.1, '%', '2022-03-01') }, { resource: obs('1558-6', 104, 'mg/dL', '2023-03-01') }, { resource: obs('4548-4', 7, '%', '2023-04-01', 'preliminary') }],
    };
    const file = new File([JSON.stringify(bundle)], 'export.json', { type: 'application/json' });
    await user.upload(screen.getByLabelText('Load a FHIR file (Bundle or Observation, JSON)'), file);
    expect(await screen.findByText('export.json: Read 3 resources: 2 checkups added, 1 resource skipped:')).toBeInTheDocument();
    expect(screen.getByText('Entry 2: status "preliminary": only final, amended and corrected results are used')).toBeInTheDocument();
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(2);
    expect(within(result()).getByText('2 checkups, classified under ADA.')).toBeInTheDocument();
  });

  it('draws a chart with a text alternative and a data table', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    await pasteRows(user, '2022-03-01\t42\tmmol/mol\t\t');
    const chart = screen.getByTestId('glucose-chart-hba1c');
    const img = within(chart).getByRole('img');
    expect(img).toHaveAccessibleName('HbA1c (%) under ADA: 2022-03-01 5.99%, prediabetes range (ADA). Lines mark the prediabetes range from 5.7% and the diabetes range from 6.5%.');
    expect(within(chart).getByRole('table', { name: 'Chart data: HbA1c (%)' })).toBeInTheDocument();
  });

  it('switches criteria and can be used by keyboard alone', async () => {
    const user = userEvent.setup();
    render(<GlucoseHistory today={TODAY} />);
    await user.type(screen.getByLabelText('Date'), '2023-03-01');
    await user.type(screen.getByLabelText('HbA1c'), '5.8');
    await user.selectOptions(screen.getByLabelText('Criteria set'), 'NICE');
    // 5.8 % = 39.9 mmol/mol: below NICE's 42 (hand-computed 10.93 × 5.8 − 23.5).
    expect(screen.getByText('2023-03-01: normal range (NICE), from HbA1c 39.9 mmol/mol, entered as 5.8%.')).toBeInTheDocument();
    screen.getByRole('button', { name: 'Add a checkup' }).focus();
    await user.keyboard('{Enter}');
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(2);
    await user.tab();
    expect(document.activeElement).toHaveAccessibleName('Paste rows from a spreadsheet');
  });
});
