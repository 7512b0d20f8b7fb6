'use client';
/**
 * Import a population table from a CSV file (docs/table-format.md): read it in blocks with a
 * progress bar, show its details, its first rows and every problem, and save it only when the
 * clinician confirms a file without problems. A file with any problem saves nothing.
 *
 * Props:
 * - onSaved(table): called after the table is saved (e.g. to select it on the consultation screen);
 * - headingLevel: 3 (default) or 4, one below the heading it sits under.
 *
 * Needs a {@link LibraryProvider} above it.
 */
import { useId, useRef, useState, type ChangeEvent } from 'react';
import type { Issue } from '@/lib/result';
import { MAX_TABLE_FILE_BYTES } from '@/lib/tables/csvFormat';
import { parseTableCsvInChunks, type TableCsvResult } from '@/lib/tables/csvReader';
import { LIBRARY_IMPORT_CHUNK_CHARS } from '@/lib/tables/chunking';
import type { StoredTable } from '@/lib/storage/records';
import { useLibrary } from './LibraryContext';
import { countProblems, ProblemList } from './ProblemList';
import './library.css';

export interface TableImportProps {
  readonly onSaved?: ((table: StoredTable) => void) | undefined;
  readonly headingLevel?: 3 | 4;
}

type Phase =
  | { readonly kind: 'idle' }
  | { readonly kind: 'reading'; readonly fileName: string; readonly done: number; readonly total: number }
  | { readonly kind: 'checked'; readonly fileName: string; readonly result: TableCsvResult }
  | { readonly kind: 'saved'; readonly fileName: string; readonly table: StoredTable };

/** Lets the page paint and answer input between blocks. */
const yieldToPage = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

export function TableImport({ onSaved, headingLevel = 3 }: TableImportProps) {
  const H = headingLevel === 3 ? 'h3' : 'h4';
  const id = useId();
  const { library, changed, status } = useLibrary();
  const [phase, setPhase] = useState<Phase>({ kind: 'idle' });
  const [saveIssues, setSaveIssues] = useState<readonly Issue[]>([]);
  const [replace, setReplace] = useState(false);
  const [saving, setSaving] = useState(false);
  const abort = useRef<AbortController | null>(null);
  const input = useRef<HTMLInputElement>(null);

  async function onFile(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    setSaveIssues([]);
    setReplace(false);
    if (!file) return;
    if (file.size > MAX_TABLE_FILE_BYTES) {
      // Refused before reading: a huge file is never loaded into the page.
      setPhase({
        kind: 'checked',
        fileName: file.name,
        result: {
          ok: false,
          preview: undefined,
          issues: [{ code: 'file-too-large', path: [], message: `The file is ${(file.size / 1024 / 1024).toFixed(1)} MB; the largest accepted is ${MAX_TABLE_FILE_BYTES / 1024 / 1024} MB. Split the table into smaller tables` }],
        },
      });
      return;
    }
    abort.current?.abort();
    const controller = new AbortController();
    abort.current = controller;
    setPhase({ kind: 'reading', fileName: file.name, done: 0, total: file.size });
    const text = await file.text();
    const result = await parseTableCsvInChunks(text, {
      chunkChars: LIBRARY_IMPORT_CHUNK_CHARS,
      signal: controller.signal,
      pause: yieldToPage,
      onProgress: (p) => {
        if (!controller.signal.aborted) setPhase({ kind: 'reading', fileName: file.name, done: p.charsDone, total: p.charsTotal });
      },
    });
    if (abort.current !== controller) return; // a newer file replaced this one
    abort.current = null;
    setPhase(controller.signal.aborted ? { kind: 'idle' } : { kind: 'checked', fileName: file.name, result });
  }

  function cancel() {
    abort.current?.abort();
    abort.current = null;
    setPhase({ kind: 'idle' });
    if (input.current) input.current.value = '';
  }

  async function save() {
    if (phase.kind !== 'checked' || !phase.result.ok || !library) return;
    setSaving(true);
    const hadIdLine = phase.result.preview.details.some((d) => d.key === 'id');
    const saved = await library.saveImportedTable(phase.result.value, hadIdLine, { replace });
    setSaving(false);
    if (!saved.ok) {
      setSaveIssues(saved.issues);
      return;
    }
    setSaveIssues([]);
    setPhase({ kind: 'saved', fileName: phase.fileName, table: saved.value });
    if (input.current) input.current.value = '';
    changed();
    onSaved?.(saved.value);
  }

  const result = phase.kind === 'checked' ? phase.result : undefined;
  const preview = result?.preview;
  const idTaken = saveIssues.some((i) => i.code === 'id-taken');

  return (
    <section className="library__panel" aria-labelledby={`${id}-title`}>
      <H id={`${id}-title`}>Import a table from a CSV file</H>
      <p className="field__hint" id={`${id}-hint`}>
        A spreadsheet saved as CSV: details lines such as <code># title: …</code>, then columns sex, age_from, age_to and risk (or rate and
        person_years). The whole file is checked before anything is saved. At most {MAX_TABLE_FILE_BYTES / 1024 / 1024} MB.
      </p>
      <label className="field__label" htmlFor={`${id}-file`}>
        Table file (.csv)
      </label>
      <input
        ref={input}
        id={`${id}-file`}
        className="library__file"
        type="file"
        accept=".csv,.tsv,.txt,text/csv,text/plain"
        aria-describedby={`${id}-hint`}
        disabled={status !== 'ready'}
        onChange={(e) => void onFile(e)}
      />

      <div aria-live="polite" className="library__live">
        {phase.kind === 'reading' && (
          <div className="library__progress">
            <label htmlFor={`${id}-progress`}>Checking {phase.fileName}…</label>
            <progress id={`${id}-progress`} max={Math.max(1, phase.total)} value={phase.done} />
            <button type="button" className="button button--secondary" onClick={cancel}>
              Cancel
            </button>
          </div>
        )}
        {phase.kind === 'saved' && (
          <p className="library__ok">
            Saved “{phase.table.table.title}” ({phase.table.table.strata.length.toLocaleString('en-GB')} strata) as {phase.table.table.id}.
          </p>
        )}
        {result?.ok && <p className="library__ok">{phase.kind === 'checked' ? phase.fileName : ''}: no problems found. Check the preview, then save.</p>}
      </div>

      {result && !result.ok && phase.kind === 'checked' && (
        <ProblemList problems={result.issues} heading={`${countProblems(result.issues)} in ${phase.fileName} — nothing was saved. Correct the file and choose it again.`} />
      )}

      {preview && <TablePreview preview={preview} captionId={`${id}-preview`} />}

      {result?.ok && (
        <div className="library__actions">
          <ProblemList problems={saveIssues} heading="The table was not saved" />
          {idTaken && (
            <label className="library__check">
              <input type="checkbox" checked={replace} onChange={(e) => setReplace(e.target.checked)} /> Replace the saved table with the same id
            </label>
          )}
          <button type="button" className="button" onClick={() => void save()} disabled={saving || status !== 'ready'}>
            {saving ? 'Saving…' : 'Save table'}
          </button>
        </div>
      )}
    </section>
  );
}

/** The file's details and first rows, as read. */
export function TablePreview({ preview, captionId }: { readonly preview: NonNullable<TableCsvResult['preview']>; readonly captionId: string }) {
  return (
    <div className="library__preview">
      {preview.details.length > 0 && (
        <dl className="library__details">
          {preview.details.map((d) => (
            <div key={d.key}>
              <dt>{d.key}</dt>
              <dd>{d.value}</dd>
            </div>
          ))}
        </dl>
      )}
      {preview.columns.length > 0 && (
        <div className="library__scroll" role="region" aria-labelledby={captionId} tabIndex={0}>
          <table className="library__table">
            <caption id={captionId}>
              First {Math.min(preview.rows.length, preview.rowCount).toLocaleString('en-GB')} of {preview.rowCount.toLocaleString('en-GB')} rows
            </caption>
            <thead>
              <tr>
                <th scope="col">Row</th>
                {preview.columns.map((c, i) => (
                  <th scope="col" key={`${i}-${c}`}>
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {preview.rows.map((r) => (
                <tr key={r.line}>
                  <th scope="row">{r.line}</th>
                  {preview.columns.map((c, i) => (
                    <td key={`${i}-${c}`}>{r.cells[i] ?? ''}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
