// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { LibraryProvider } from '@/app/components/library/LibraryContext';
import { TableImport } from '@/app/components/library/TableImport';
import { TableList } from '@/app/components/library/TableList';
import { EvidenceLibrary } from '@/app/components/library/EvidenceLibrary';
import { SaveEvidence } from '@/app/components/library/SaveEvidence';
import { openLibrary } from '@/app/storage/library';
import { exportTableCsv } from '@/lib/tables/csv';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { exportEvidenceJson } from '@/lib/evidence/file';
import type { PopulationTable } from '@/lib/tables/schema';

// The demo table and entries with new ids: illustrative numbers, not from a real population or study.
const TABLE: PopulationTable = { ...DEMO_HEART_FAILURE_10Y, id: 'north-hf', title: 'North heart failure' };
const GOOD_CSV = exportTableCsv(TABLE);
const BAD_CSV = GOOD_CSV.replace('0.006', '1.5');

afterEach(() => cleanup());

let n = 0;
function dbName() {
  n += 1;
  return `ui-${n}`;
}

function csvFile(text: string, name = 'north.csv') {
  return new File([text], name, { type: 'text/csv' });
}

describe('library UI: tables', () => {
  it('shows every problem and the preview, saves nothing; then imports, lists, renames and deletes', async () => {
    const user = userEvent.setup();
    const name = dbName();
    const onSaved = vi.fn();
    render(
      <LibraryProvider name={name}>
        <TableImport onSaved={onSaved} />
        <TableList />
      </LibraryProvider>,
    );
    const input = await screen.findByLabelText('Table file (.csv)');
    await waitFor(() => expect(input).toBeEnabled());

    await user.upload(input, csvFile(BAD_CSV));
    const alert = await screen.findByText(/1 problem in north\.csv — nothing was saved/);
    // The female 40–49 row is line 11 (8 details, the header on line 9).
    expect(within(alert.parentElement!).getByText(/^Row 11, column risk: The risk must be less than 1/)).toBeInTheDocument();
    expect(screen.getByText('First 10 of 10 rows')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save table' })).not.toBeInTheDocument();
    expect(await screen.findByText(/No tables saved yet/)).toBeInTheDocument();

    await user.upload(input, csvFile(GOOD_CSV));
    await user.click(await screen.findByRole('button', { name: 'Save table' }));
    expect(await screen.findByText(/Saved “North heart failure” \(10 strata\) as north-hf/)).toBeInTheDocument();
    expect(onSaved).toHaveBeenCalledTimes(1);
    const item = await screen.findByRole('article', { name: 'North heart failure' });
    expect(within(item).getByText(/10 strata: female and male, ages 30 to 79; risks over 10 years/)).toBeInTheDocument();

    await user.click(within(item).getByRole('button', { name: 'View strata' }));
    expect(await within(item).findByText('10 strata; risk over 10 years, as a fraction')).toBeInTheDocument();

    await user.click(within(item).getByRole('button', { name: 'Rename' }));
    const title = within(item).getByLabelText('New title');
    await user.clear(title);
    await user.click(within(item).getByRole('button', { name: 'Save title' }));
    expect(await within(item).findByText(/The title must not be empty/)).toBeInTheDocument();
    await user.type(title, 'Heart failure, north');
    await user.click(within(item).getByRole('button', { name: 'Save title' }));
    const renamed = await screen.findByRole('article', { name: 'Heart failure, north' });

    await user.click(within(renamed).getByRole('button', { name: 'Delete…' }));
    await user.click(within(renamed).getByRole('button', { name: 'Delete' }));
    expect(await screen.findByText(/No tables saved yet/)).toBeInTheDocument();

    const lib = await openLibrary({ name });
    expect(lib.ok && (await lib.value.listTables())).toMatchObject({ ok: true, value: { items: [] } });
    if (lib.ok) lib.value.close();
  });

  it('offers to replace a table whose id is taken', async () => {
    const user = userEvent.setup();
    const name = dbName();
    const lib = await openLibrary({ name });
    if (!lib.ok) throw new Error('library');
    await lib.value.saveTable(TABLE);
    lib.value.close();
    render(
      <LibraryProvider name={name}>
        <TableImport />
      </LibraryProvider>,
    );
    const input = await screen.findByLabelText('Table file (.csv)');
    await waitFor(() => expect(input).toBeEnabled());
    await user.upload(input, csvFile(GOOD_CSV.replace('North heart failure', 'North HF, revised')));
    await user.click(await screen.findByRole('button', { name: 'Save table' }));
    expect(await screen.findByText(/already has the id "north-hf"/)).toBeInTheDocument();
    await user.click(screen.getByLabelText('Replace the saved table with the same id'));
    await user.click(screen.getByRole('button', { name: 'Save table' }));
    expect(await screen.findByText(/Saved “North HF, revised”/)).toBeInTheDocument();
  });
});

describe('library UI: evidence', () => {
  it('saves the current evidence, finds it by words, refuses a bad import whole, and deletes', async () => {
    const user = userEvent.setup();
    const demo = DEMO_EVIDENCE[0]!;
    render(
      <LibraryProvider name={dbName()}>
        <SaveEvidence effect={demo.effect} wording={demo.wording} exposureDefinition={demo.exposureDefinition} />
        <EvidenceLibrary />
      </LibraryProvider>,
    );
    const title = await screen.findByLabelText('Title in the library');
    expect(title).toHaveValue('HbA1c in the prediabetes range at yearly checkups and heart failure needing hospital care');
    await user.clear(title);
    await user.type(title, 'Workforce cohort HF');
    await user.click(screen.getByRole('button', { name: 'Save this evidence' }));
    expect(await screen.findByText('Saved as “Workforce cohort HF”.')).toBeInTheDocument();
    expect(await screen.findByRole('article', { name: 'Workforce cohort HF' })).toBeInTheDocument();
    expect(screen.getByText(/HR 1.6 \(95% CI 1.2 to 2.1\), cohort, 8 years of follow-up, adjusted/)).toBeInTheDocument();

    const badFile = exportEvidenceJson([{ ...DEMO_EVIDENCE[1]!, id: 'cc', title: 'CC', effect: { ...DEMO_EVIDENCE[1]!.effect, lower: 5 } }]);
    await user.upload(screen.getByLabelText('Import entries (.json)'), new File([badFile], 'bad.json', { type: 'application/json' }));
    expect(await screen.findByText(/1 problem — nothing was imported/)).toBeInTheDocument();
    expect(screen.getByText(/^Entry 1 \("CC"\), effect\.lower: /)).toBeInTheDocument();
    expect(screen.getAllByRole('article')).toHaveLength(1);

    const goodFile = exportEvidenceJson([{ ...DEMO_EVIDENCE[1]!, id: 'cc', title: 'Nested case-control, coronary' }]);
    await user.upload(screen.getByLabelText('Import entries (.json)'), new File([goodFile], 'good.json', { type: 'application/json' }));
    expect(await screen.findByText('Imported good.json: 1 added, 0 replaced.')).toBeInTheDocument();
    await screen.findByRole('article', { name: 'Nested case-control, coronary' });

    await user.type(screen.getByLabelText('Find by words'), 'coronary');
    await waitFor(() => expect(screen.getAllByRole('article')).toHaveLength(1));
    expect(screen.getByText('1 of 2 entries shown')).toBeInTheDocument();

    const item = screen.getByRole('article', { name: 'Nested case-control, coronary' });
    await user.click(within(item).getByRole('button', { name: 'Edit' }));
    const lower = within(item).getByLabelText('Lower limit');
    await user.clear(lower);
    await user.type(lower, '2');
    await user.click(within(item).getByRole('button', { name: 'Save changes' }));
    expect(await within(item).findByText(/The lower limit \(2\) must be less than the upper limit/)).toBeInTheDocument();
    expect(lower).toHaveAttribute('aria-invalid', 'true');
    await user.clear(lower);
    await user.type(lower, '1.05');
    await user.click(within(item).getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText(/OR 1.4 \(95% CI 1.05 to 1.8\)/)).toBeInTheDocument();

    const again = screen.getByRole('article', { name: 'Nested case-control, coronary' });
    await user.click(within(again).getByRole('button', { name: 'Delete…' }));
    await user.click(within(again).getByRole('button', { name: 'Delete' }));
    await waitFor(() => expect(screen.queryByRole('article', { name: 'Nested case-control, coronary' })).not.toBeInTheDocument());
  });
});
