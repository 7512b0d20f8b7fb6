'use client';
/**
 * The saved population tables: each with its outcome, population, source and coverage; view
 * its strata, rename it, export it as CSV (the same format it was imported in), delete it
 * (after a second click), or use it.
 *
 * Props:
 * - onUse(id): when given, each table gets a "Use this table" button (e.g. to pick it on the
 *   consultation screen);
 * - selectedId: the table in use, marked as such.
 *
 * Needs a {@link LibraryProvider} above it.
 */
import { useId, useState, type FormEvent } from 'react';
import type { Issue } from '@/lib/result';
import type { StoredTable, TableSummary } from '@/lib/storage/records';
import type { Library } from '@/app/storage/library';
import { useLibrary } from './LibraryContext';
import { useLibraryListing } from './useLibraryListing';
import { ConfirmDelete } from './ConfirmDelete';
import { ProblemList } from './ProblemList';
import { downloadText, fileNameFor } from './download';
import './library.css';

export interface TableListProps {
  readonly onUse?: ((id: string) => void) | undefined;
  readonly selectedId?: string | undefined;
}

/** Most strata drawn when viewing a table; the rest are counted. */
const VIEW_ROWS = 200;

const readTables = (library: Library) => library.listTables();

export function TableList({ onUse, selectedId }: TableListProps) {
  const { status } = useLibrary();
  const { items: tables, problems } = useLibraryListing(readTables);

  if (status !== 'ready') return null;
  return (
    <div className="library__list">
      <ProblemList problems={problems} heading="Some saved tables could not be read; they are left as they are" />
      {tables === undefined ? (
        <p role="status">Reading the saved tables…</p>
      ) : tables.length === 0 ? (
        <p>No tables saved yet. Import a CSV file to add your region’s figures; the demo tables stay available.</p>
      ) : (
        <ul className="library__items">
          {tables.map((t) => (
            <li key={t.id}>
              <TableItem summary={t} onUse={onUse} selected={t.id === selectedId} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function coverage(t: TableSummary): string {
  const sexes = t.sexes.includes('any') ? 'women and men together' : t.sexes.join(' and ');
  const ages = t.ageTo >= 120 ? `ages ${t.ageFrom} and over` : `ages ${t.ageFrom} to ${t.ageTo}`;
  const by = t.extraStrata.length > 0 ? `, by ${t.extraStrata.join(', ')}` : '';
  const what = t.form === 'risk' ? `risks over ${t.horizonYears ?? '?'} years` : 'rates per person-years';
  return `${t.strataCount.toLocaleString('en-GB')} strata: ${sexes}, ${ages}${by}; ${what}`;
}

function TableItem({ summary, onUse, selected }: { readonly summary: TableSummary; readonly onUse: ((id: string) => void) | undefined; readonly selected: boolean }) {
  const id = useId();
  const { library, changed } = useLibrary();
  const [mode, setMode] = useState<'none' | 'rename' | 'confirm-delete'>('none');
  const [title, setTitle] = useState(summary.title);
  const [issues, setIssues] = useState<readonly Issue[]>([]);
  const [viewing, setViewing] = useState<StoredTable | undefined>(undefined);

  async function rename(event: FormEvent) {
    event.preventDefault();
    if (!library) return;
    const r = await library.renameTable(summary.id, title);
    if (!r.ok) return setIssues(r.issues);
    setIssues([]);
    setMode('none');
    changed();
  }

  async function remove() {
    if (!library) return;
    const r = await library.deleteTable(summary.id);
    if (!r.ok) return setIssues(r.issues);
    changed();
  }

  async function exportCsv() {
    if (!library) return;
    const r = await library.exportTable(summary.id);
    if (!r.ok) return setIssues(r.issues);
    downloadText(fileNameFor(summary.id, 'csv'), r.value, 'text/csv;charset=utf-8');
  }

  async function toggleView() {
    if (viewing) return setViewing(undefined);
    if (!library) return;
    const r = await library.getTable(summary.id);
    if (!r.ok) return setIssues(r.issues);
    setViewing(r.value);
  }

  return (
    <article className="library__item" aria-labelledby={`${id}-title`}>
      <h4 id={`${id}-title`}>
        {summary.title}
        {selected && <span className="library__badge"> (in use)</span>}
      </h4>
      <p className="library__meta">
        {summary.outcome}. {summary.population}. Source: {summary.source} ({summary.year}).
        {summary.illustrative && <strong> Illustrative numbers, not from a real population.</strong>}
      </p>
      <p className="library__meta">
        {coverage(summary)}. Id <code>{summary.id}</code>; saved {summary.updatedAt.slice(0, 10)}.
      </p>

      {mode === 'rename' ? (
        <form className="library__inline" onSubmit={(e) => void rename(e)}>
          <label className="field__label" htmlFor={`${id}-rename`}>
            New title
          </label>
          <input
            id={`${id}-rename`}
            className="field__input"
            value={title}
            onChange={(e) => setTitle(e.target.value)}
            aria-invalid={issues.length > 0}
            aria-describedby={issues.length > 0 ? `${id}-issues` : undefined}
          />
          <button type="submit" className="button">
            Save title
          </button>
          <button type="button" className="button button--secondary" onClick={() => (setMode('none'), setIssues([]), setTitle(summary.title))}>
            Cancel
          </button>
        </form>
      ) : mode === 'confirm-delete' ? (
        <ConfirmDelete title={summary.title} onDelete={() => void remove()} onKeep={() => setMode('none')} />
      ) : (
        <div className="library__buttons">
          {onUse && (
            <button type="button" className="button" onClick={() => onUse(summary.id)} aria-pressed={selected}>
              Use this table
            </button>
          )}
          <button type="button" className="button button--secondary" onClick={() => void toggleView()} aria-expanded={viewing !== undefined}>
            {viewing ? 'Hide strata' : 'View strata'}
          </button>
          <button type="button" className="button button--secondary" onClick={() => setMode('rename')}>
            Rename
          </button>
          <button type="button" className="button button--secondary" onClick={() => void exportCsv()}>
            Export CSV
          </button>
          <button type="button" className="button button--secondary" onClick={() => setMode('confirm-delete')}>
            Delete…
          </button>
        </div>
      )}
      <ProblemList id={`${id}-issues`} problems={issues} heading="Not done" />
      {viewing && <StrataTable stored={viewing} captionId={`${id}-strata`} />}
    </article>
  );
}

function StrataTable({ stored, captionId }: { readonly stored: StoredTable; readonly captionId: string }) {
  const { table } = stored;
  const extras = Object.keys(table.strata[0]?.extra ?? {}).sort();
  const risk = table.strata[0]?.risk !== undefined;
  const shown = table.strata.slice(0, VIEW_ROWS);
  return (
    <div className="library__scroll" role="region" aria-labelledby={captionId} tabIndex={0}>
      <table className="library__table">
        <caption id={captionId}>
          {shown.length < table.strata.length
            ? `First ${shown.length} of ${table.strata.length.toLocaleString('en-GB')} strata`
            : `${table.strata.length.toLocaleString('en-GB')} strata`}
          {risk ? `; risk over ${table.horizonYears} years, as a fraction` : '; rate per the person-years given'}
        </caption>
        <thead>
          <tr>
            <th scope="col">Sex</th>
            <th scope="col">Ages</th>
            {extras.map((k) => (
              <th scope="col" key={k}>
                {k}
              </th>
            ))}
            {risk ? (
              <th scope="col">Risk</th>
            ) : (
              <>
                <th scope="col">Rate</th>
                <th scope="col">Person-years</th>
              </>
            )}
          </tr>
        </thead>
        <tbody>
          {shown.map((s, i) => (
            <tr key={i}>
              <td>{s.sex}</td>
              <td>{s.ageTo >= 120 ? `${s.ageFrom} and over` : `${s.ageFrom}–${s.ageTo}`}</td>
              {extras.map((k) => (
                <td key={k}>{s.extra?.[k] ?? ''}</td>
              ))}
              {risk ? (
                <td>{s.risk}</td>
              ) : (
                <>
                  <td>{s.rate}</td>
                  <td>{s.perPersonYears}</td>
                </>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
