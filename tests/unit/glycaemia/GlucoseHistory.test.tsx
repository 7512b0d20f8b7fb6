// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { GlucoseHistory } from '@/app/components/glucose/GlucoseHistory';
import { loadGlucoseView, useGlucoseHistory, type GlucoseHistoryHolder } from '@/app/components/glucose/useGlucoseHistory';
import type { ExposureDefinition } from '@/lib/glycaemia/exposure';

// Rows and files invented for the tests (illustrative numbers, not from a real person or study).
const TODAY = '2024-06-30';

/**
 * The section as a screen holds it: the rows in the holder (useGlucoseHistory), the section
 * rendering them. `seen` records the holder of each render, so a test can read the derived match.
 */
function Section({ exposure, seen }: { exposure?: ExposureDefinition; seen?: GlucoseHistoryHolder[] }) {
  const history = useGlucoseHistory({ exposure, today: TODAY, initiallyOpen: true });
  seen?.push(history);
  return <GlucoseHistory history={history} />;
}

beforeAll(async () => {
  // The holder fetches the view module on first opening; here it is fetched once, up front.
  await loadGlucoseView();
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
    render(<Section />);
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
    render(<Section />);
    const date = screen.getByLabelText('Date');
    await user.type(date, '2023-02-30');
    await user.type(screen.getByLabelText('Fasting glucose'), '101');
    expect(date).toHaveAttribute('aria-invalid', 'true');
    expect(date).toHaveAccessibleDescription(/The date 2023-02-30 is not a real calendar day/);
    expect(within(result()).getByText('1 problem in the rows; nothing is classified until it is fixed:')).toBeInTheDocument();
    expect(within(result()).getByText('Row 1, date: The date 2023-02-30 is not a real calendar day')).toBeInTheDocument();
  });

  it('pastes rows and shows the match and the mismatch for an exposure definition', async () => {
    // The match used to be pushed to the screen through onMatchChange; it is now derived by the
    // holder from the rows, so the same checks read it there (issue 13, item 3).
    const user = userEvent.setup();
    const seen: GlucoseHistoryHolder[] = [];
    const { rerender } = render(<Section exposure={{ category: 'prediabetes', criteria: 'ADA', minYears: 3 }} seen={seen} />);
    expect(seen.at(-1)?.match).toBeNull();
    await pasteRows(user, 'Date\tHbA1c\tUnit\tFPG\tUnit\n2021-03-01\t5,9\t%\t\t\n2022-03-01\t6,0\t%\t\t\n2023-03-01\t6,2\t%\t5,6\tmmol/l');
    expect(screen.getByText('Added 3 rows (header line skipped).')).toBeInTheDocument();
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(3);
    const match = screen.getByTestId('glucose-match');
    expect(within(match).getByText('This history fits the study\u2019s exposure.')).toBeInTheDocument();
    expect(within(match).getByText('The study needed 3 yearly results in the prediabetes range (ADA); this history has 3, from 2021-03-01 to 2023-03-01.')).toBeInTheDocument();
    expect(seen.at(-1)?.match).toEqual(expect.objectContaining({ matches: true }));
    expect(seen.at(-1)?.warnings).toEqual([]);

    rerender(<Section exposure={{ category: 'prediabetes', criteria: 'ADA', minYears: 4 }} seen={seen} />);
    expect(within(screen.getByTestId('glucose-match')).getByText('This history does not fit the study\u2019s exposure.')).toBeInTheDocument();
    expect(screen.getByText('The study needed 4 yearly results in the prediabetes range (ADA); this history has 3, from 2021-03-01 to 2023-03-01.')).toBeInTheDocument();
    const last = seen.at(-1)?.match;
    expect(last?.matches).toBe(false);
    expect(last?.warning?.code).toBe('exposure-mismatch');
    expect(seen.at(-1)?.warnings.map((w) => w.code)).toEqual(['exposure-mismatch']);
  });

  it('keeps the same match and warnings for an equal exposure object', async () => {
    // Formerly "does not call back again for an equal exposure object": with the match derived,
    // an equal exposure in a new object gives the very same match and warnings, so the result
    // is not redrawn.
    const user = userEvent.setup();
    const seen: GlucoseHistoryHolder[] = [];
    const { rerender } = render(<Section exposure={{ category: 'normal', criteria: 'WHO', minYears: 2 }} seen={seen} />);
    await pasteRows(user, '2023-03-01\t6.1\t%\t6.5\tmmol/L');
    const before = seen.at(-1);
    expect(before?.match?.matches).toBe(false);
    rerender(<Section exposure={{ category: 'normal', criteria: 'WHO', minYears: 2 }} seen={seen} />);
    const after = seen.at(-1);
    expect(after).not.toBe(before);
    expect(after?.match).toBe(before?.match);
    expect(after?.warnings).toBe(before?.warnings);
  });

  it('reports pasted lines it could not add', async () => {
    const user = userEvent.setup();
    render(<Section />);
    await pasteRows(user, '2023-03-01\t6.1\tmg%\t\t');
    expect(screen.getByText('Line 1: "mg%" is not an HbA1c unit (% or mmol/mol); the line was not added')).toBeInTheDocument();
  });

  it('shows the prominent note for a diabetes-range latest result, without diagnostic wording', async () => {
    const user = userEvent.setup();
    render(<Section />);
    await pasteRows(user, '2022-03-01\t6.0\t%\t\t\n2023-03-01\t6.8\t%\t\t');
    const note = screen.getByTestId('glucose-diabetes-range-note');
    expect(within(note).getByText(/One result is not a diagnosis/)).toBeInTheDocument();
    // Proper names ("American Diabetes Association", "Standards of Care in Diabetes") are not diagnostic wording.
    const text = (screen.getByTestId('glucose-history').textContent ?? '').replaceAll('American Diabetes Association', '').replaceAll('Standards of Care in Diabetes', '');
    expect(text).not.toMatch(/\bdiabetes\b(?! range)/i);
  });

  it('loads a FHIR Bundle and lists what it skipped', async () => {
    const user = userEvent.setup();
    render(<Section />);
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
    render(<Section />);
    await pasteRows(user, '2022-03-01\t42\tmmol/mol\t\t');
    const chart = screen.getByTestId('glucose-chart-hba1c');
    const img = within(chart).getByRole('img');
    expect(img).toHaveAccessibleName('HbA1c (%) under ADA: 2022-03-01 5.99%, prediabetes range (ADA). Lines mark the prediabetes range from 5.7% and the diabetes range from 6.5%.');
    expect(within(chart).getByRole('table', { name: 'Chart data: HbA1c (%)' })).toBeInTheDocument();
  });

  it('switches criteria and can be used by keyboard alone', async () => {
    const user = userEvent.setup();
    render(<Section />);
    await user.type(screen.getByLabelText('Date'), '2023-03-01');
    await user.type(screen.getByLabelText('HbA1c'), '5.8');
    await user.selectOptions(screen.getByLabelText('Criteria set'), 'NICE');
    // 5.8 % = 39.9 mmol/mol: below NICE's 42 (hand-computed 10.93 × 5.8 − 23.5).
    expect(screen.getByText('2023-03-01: normal range (NICE), from HbA1c 39.9 mmol/mol, entered as 5.8%.')).toBeInTheDocument();
    screen.getByRole('button', { name: 'Add a checkup' }).focus();
    await user.keyboard('{Enter}');
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(2);
    // The focus now moves to the new row's date (issue 12, item 12), so typing goes there and Tab
    // leads on through that row (before, Tab led from the button to the paste box).
    await user.keyboard('2024-03-01');
    expect(within(screen.getAllByTestId('glucose-row')[1] as HTMLElement).getByLabelText('Date')).toHaveValue('2024-03-01');
    await user.tab();
    expect(document.activeElement).toHaveAccessibleName('HbA1c');
  });
});

describe('GlucoseHistory: rows from a paste or a file meet rows already there', () => {
  it('asks whether to replace or add, and does what was chosen', async () => {
    const user = userEvent.setup();
    render(<Section />);
    await pasteRows(user, '2021-03-01\t5.9\t%\n2022-03-01\t6.0\t%');
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(2);

    await pasteRows(user, '2023-03-01\t6.1\t%');
    const choice = screen.getByTestId('glucose-import-choice');
    expect(within(choice).getByText('The paste gave 1 row, and 2 rows are already in the history. Are these the same person’s results?')).toBeInTheDocument();
    // Nothing is added before the choice; the first choice takes the focus.
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(2);
    expect(document.activeElement).toHaveAccessibleName('Replace the rows (another person)');
    await user.click(within(choice).getByRole('button', { name: 'Add to the rows (same person)' }));
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(3);
    expect(within(result()).getByText('3 checkups, classified under ADA.')).toBeInTheDocument();

    await pasteRows(user, '2024-03-01\t6.2\t%');
    await user.click(screen.getByRole('button', { name: 'Replace the rows (another person)' }));
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(1);
    expect(screen.getByText('Added 1 row. They replaced the rows that were there.')).toBeInTheDocument();
    expect(screen.getByLabelText('Date')).toHaveValue('2024-03-01');

    await pasteRows(user, '2025-03-01\t6.2\t%');
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByTestId('glucose-import-choice')).toBeNull();
    expect(screen.getByLabelText('Date')).toHaveValue('2024-03-01');
  });

  it('clears all rows and brings them back on undo', async () => {
    const user = userEvent.setup();
    render(<Section />);
    await pasteRows(user, '2021-03-01\t5.9\t%\n2022-03-01\t6.0\t%');
    await user.click(screen.getByRole('button', { name: 'Clear all rows' }));
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(1);
    expect(screen.getByLabelText('Date')).toHaveValue('');
    expect(screen.getByTestId('glucose-cleared')).toHaveTextContent('2 rows were cleared.');
    await user.keyboard('{Enter}'); // the undo button has the focus
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(2);
    expect(screen.queryByTestId('glucose-cleared')).toBeNull();
  });

  it('refuses a FHIR file of more than 500 checkups before adding any, and keeps the rows (500: MAX_CHECKUPS)', async () => {
    const user = userEvent.setup();
    render(<Section />);
    await pasteRows(user, '2021-03-01\t5.9\t%');
    const entry = Array.from({ length: 501 }, (_, i) => ({
      resource: {
        resourceType: 'Observation',
        status: 'final',
        code: { coding: [{ system: 'http://loinc.org', code: '4548-4' }] },
        effectiveDateTime: new Date(Date.UTC(2020, 0, 1 + i)).toISOString().slice(0, 10),
        valueQuantity: { value: 5.9, unit: '%', system: 'http://unitsofmeasure.org', code: '%' },
      },
    }));
    const file = new File([JSON.stringify({ resourceType: 'Bundle', type: 'collection', entry })], 'big.json', { type: 'application/json' });
    await user.upload(screen.getByLabelText('Load a FHIR file (Bundle or Observation, JSON)'), file);
    expect(await screen.findByText('The file big.json has 501 checkups, more than the 500 a history holds. Nothing was added.')).toBeInTheDocument();
    expect(screen.getAllByTestId('glucose-row')).toHaveLength(1);
    expect(screen.queryByTestId('glucose-import-choice')).toBeNull();
  });
});
