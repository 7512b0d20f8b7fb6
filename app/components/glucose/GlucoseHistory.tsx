'use client';
/**
 * "Glucose history": a person's serial HbA1c and fasting glucose results, each placed in a range
 * by a named criteria set, the run ending at the latest result, a small timeline, and — when the
 * evidence defines an exposure — whether this history fits it.
 *
 * Rows come from typing, from a paste of spreadsheet rows, or from a FHIR file. The rows live in
 * a holder owned by the screen (./useGlucoseHistory.ts), so closing the section keeps them, and
 * everything shown is the holder's view model (lib/glycaemia/view.ts; lib/fhir for the import):
 * this component only renders and edits. Errors are linked to their fields with
 * aria-describedby; the result summary is announced politely. Keyboard only: every control is a
 * native input, select or button; after "Add a checkup" the focus is on the new row's date.
 *
 * Rows from a paste or a file, when filled rows are already there, wait for the clinician to
 * choose: replace them or add to them (a second person's rows must not join the first person's
 * history without a word). Either way the 500-checkup limit is checked before anything is added.
 * "Clear all rows" can be undone until the rows change again.
 *
 * Props:
 * - history: the holder (useGlucoseHistory), from the screen.
 */
import { useEffect, useId, useRef, useState, type ChangeEvent, type RefObject } from 'react';
import { CRITERIA } from '@/lib/glycaemia/criteria';
import { checkupToDraft, type CheckupDraft, type DraftField } from '@/lib/glycaemia/draft';
import { CRITERIA_SETS, type CriteriaSet } from '@/lib/glycaemia/exposure';
import { GLUCOSE_UNITS } from '@/lib/glycaemia/glucose';
import { HBA1C_UNITS } from '@/lib/glycaemia/hba1c';
import { importLimitIssue, MAX_PASTE_PROBLEMS, parsePastedRows, pasteSummary, PASTE_COLUMNS, readableLines } from '@/lib/glycaemia/paste';
import { importFhirGlucoseJson } from '@/lib/fhir/importGlucose';
import { fhirImportSummary, skipLine } from '@/lib/fhir/summary';
import { GlucoseTimelineChart } from './GlucoseTimelineChart';
import { PlainSelectField, PlainTextField } from '@/app/consultation/fields';
import type { GlucoseHistoryHolder, ImportMode } from './useGlucoseHistory';
import './glucose.css';

export interface GlucoseHistoryProps {
  readonly history: GlucoseHistoryHolder;
}

interface Report {
  readonly summary: string;
  readonly lines: readonly string[];
  readonly error?: boolean;
}

/** Rows read from a paste or a file, waiting for "replace" or "add" when filled rows are there. */
interface Pending {
  readonly source: 'paste' | 'fhir';
  /** "The paste", "The file export.json": names the source in the limit message. */
  readonly sourceName: string;
  readonly drafts: readonly CheckupDraft[];
  readonly report: Report;
}

export function GlucoseHistory({ history }: GlucoseHistoryProps) {
  const id = useId();
  const { view, rows, criteria } = history;
  const [pasteText, setPasteText] = useState('');
  const [pasteReport, setPasteReport] = useState<Report | null>(null);
  const [fhirReport, setFhirReport] = useState<Report | null>(null);
  const [pending, setPending] = useState<Pending | null>(null);
  const focusNext = useRef<string | null>(null);
  const choiceRef = useRef<HTMLDivElement>(null);
  const undoRef = useRef<HTMLButtonElement>(null);

  // After "Add a checkup" the new row's first field takes the focus (once it is on the page).
  useEffect(() => {
    const key = focusNext.current;
    if (key === null) return;
    const input = document.getElementById(`${key}-date`);
    if (input) {
      focusNext.current = null;
      input.focus();
    }
  }, [rows]);
  // The replace-or-add question takes the focus when it appears; the undo when rows are cleared.
  useEffect(() => {
    if (pending) choiceRef.current?.querySelector('button')?.focus();
  }, [pending]);
  const clearedRows = history.clearedRows;
  useEffect(() => {
    if (clearedRows !== null) undoRef.current?.focus();
  }, [clearedRows]);

  if (!view) return <p className="charts__loading">Loading the glucose history…</p>;

  const addRow = () => {
    focusNext.current = history.addRow();
  };

  /** Puts read rows in, after checking the limit; says so in the source's report. */
  const apply = (p: Pending, mode: ImportMode) => {
    const setReport = p.source === 'paste' ? setPasteReport : setFhirReport;
    const limit = importLimitIssue(mode === 'add' ? history.filledRows : 0, p.drafts.length, p.sourceName);
    setPending(null);
    if (limit) {
      setReport({ summary: limit.message, lines: [], error: true });
      return;
    }
    history.putDrafts(p.drafts, mode);
    setReport(mode === 'replace' ? { ...p.report, summary: `${p.report.summary} They replaced the rows that were there.` } : p.report);
    if (p.source === 'paste' && p.report.lines.length === 0) setPasteText('');
  };
  /** Rows read: straight in when no filled row is there, else ask. */
  const offer = (p: Pending) => {
    if (p.drafts.length === 0 || history.filledRows === 0) apply(p, 'add');
    else setPending(p);
  };

  const addPasted = () => {
    const result = parsePastedRows(pasteText, criteria);
    const report: Report = { summary: pasteSummary(result), lines: readableLines(result.issues.map((i) => i.message), MAX_PASTE_PROBLEMS + 1) };
    if (result.rows.length === 0) {
      setPasteReport({ ...report, error: result.issues.length > 0 });
      return;
    }
    offer({ source: 'paste', sourceName: 'The paste', drafts: result.rows, report });
  };

  const loadFhir = async (event: ChangeEvent<HTMLInputElement>) => {
    const input = event.target;
    const file = input.files?.[0];
    if (!file) return;
    const text = await file.text();
    // The same file chosen again must be read again.
    input.value = '';
    const result = importFhirGlucoseJson(text, { today: history.today, criteria });
    if (!result.ok) {
      setFhirReport({ summary: `${file.name} could not be read:`, lines: readableLines(result.issues.map((i) => i.message)), error: true });
      return;
    }
    const checkups = result.value.checkups;
    // Counted before a single row is made: a file far over the limit adds nothing.
    const limit = importLimitIssue(0, checkups.length, `The file ${file.name}`);
    if (limit) {
      setFhirReport({ summary: limit.message, lines: [], error: true });
      return;
    }
    offer({
      source: 'fhir',
      sourceName: `The file ${file.name}`,
      drafts: checkups.map((c) => checkupToDraft(c, criteria)),
      report: { summary: `${file.name}: ${fhirImportSummary(result.value)}`, lines: readableLines(result.value.skipped.map(skipLine)) },
    });
  };

  const fieldId = (key: string, field: DraftField) => `${key}-${field}`;
  const errorId = (key: string, field: DraftField | 'row') => `${key}-${field}-error`;
  const describedBy = (...ids: (string | false | undefined)[]) => ids.filter(Boolean).join(' ') || undefined;

  return (
    <section className="section glucose" aria-labelledby={`${id}-title`} data-testid="glucose-history">
      <h2 id={`${id}-title`} className="section__title">
        Glucose history
      </h2>
      <p className="field__hint">
        Serial checkup results, each placed in a range by the criteria set you choose. A range is not a diagnosis.
      </p>
      {view.exposureText ? <p className="glucose__exposure">{view.exposureText}</p> : null}

      <div className="field field--short">
        <label className="field__label" htmlFor={`${id}-criteria`}>
          Criteria set
        </label>
        <select
          id={`${id}-criteria`}
          className="field__input"
          value={criteria}
          onChange={(e) => history.setCriteria(e.target.value as CriteriaSet)}
          aria-describedby={`${id}-criteria-source`}
        >
          {CRITERIA_SETS.map((c) => (
            <option key={c} value={c}>
              {CRITERIA[c].id}
            </option>
          ))}
        </select>
        {/* Short names in the list, so it fits a 390 px phone; the full name is in the hint. */}
        <p className="field__hint" id={`${id}-criteria-source`}>
          {CRITERIA[criteria].name}: thresholds from {CRITERIA[criteria].source}, applied in its own units.
        </p>
      </div>

      <h3>Checkups</h3>
      <p className="field__hint" id={`${id}-date-hint`}>
        Dates as YYYY-MM-DD. Leave a test empty if it was not done.
      </p>
      <div className="glucose__rows">
        {rows.map((row, index) => {
          const errors = view.rowErrors[index] ?? {};
          const label = view.rowLabels[index] ?? '';
          const field = (f: DraftField, text: string, extra: { hint?: string; inputMode?: 'decimal' } = {}) => (
            <PlainTextField
              id={fieldId(row.key, f)}
              label={text}
              className={`glucose__field glucose__field--${f}`}
              kind={extra.inputMode === 'decimal' ? 'decimal' : 'text'}
              value={row.draft[f]}
              onChange={(value) => history.setField(row.key, f, value)}
              error={errors[f]}
              hintIds={extra.hint ? [extra.hint] : []}
            />
          );
          const unit = (f: 'hba1cUnit' | 'fpgUnit', text: string, units: readonly string[]) => (
            <PlainSelectField
              id={fieldId(row.key, f)}
              label={text}
              className="glucose__field glucose__field--unit"
              value={row.draft[f]}
              onChange={(value) => history.setField(row.key, f, value)}
              error={errors[f]}
              choices={units.map((u) => ({ value: u, label: u }))}
            />
          );
          return (
            <fieldset
              key={row.key}
              className={`glucose__row${errors.row ? ' glucose__row--invalid' : ''}`}
              aria-describedby={errors.row ? errorId(row.key, 'row') : undefined}
              data-testid="glucose-row"
            >
              <legend className="glucose__legend">{label}</legend>
              <div className="glucose__fields">
                {field('date', 'Date', { hint: `${id}-date-hint` })}
                {field('hba1cValue', 'HbA1c', { inputMode: 'decimal' })}
                {unit('hba1cUnit', 'HbA1c unit', HBA1C_UNITS)}
                {field('fpgValue', 'Fasting glucose', { inputMode: 'decimal' })}
                {unit('fpgUnit', 'Glucose unit', GLUCOSE_UNITS)}
                <button type="button" className="button button--quiet glucose__remove" onClick={() => history.removeRow(row.key)}>
                  Remove<span className="visually-hidden"> {label}</span>
                </button>
              </div>
              {errors.row ? (
                <p className="field__error" id={errorId(row.key, 'row')}>
                  {errors.row}
                </p>
              ) : null}
            </fieldset>
          );
        })}
      </div>
      <div className="glucose__row-actions">
        <button type="button" className="button button--secondary" onClick={addRow}>
          Add a checkup
        </button>
        {history.filledRows > 0 ? (
          <button type="button" className="button button--quiet" onClick={history.clearAll}>
            Clear all rows
          </button>
        ) : null}
      </div>
      {clearedRows !== null ? (
        <div className="glucose__undo" role="status" data-testid="glucose-cleared">
          <p>
            {clearedRows === 1 ? '1 row was cleared.' : `${clearedRows} rows were cleared.`}{' '}
            <button type="button" className="button button--quiet" ref={undoRef} onClick={history.undoClear}>
              Undo: bring the rows back
            </button>
          </p>
        </div>
      ) : null}

      <div className="glucose__imports">
        <div className="field">
          <label className="field__label" htmlFor={`${id}-paste`}>
            Paste rows from a spreadsheet
          </label>
          <p className="field__hint" id={`${id}-paste-hint`}>
            Tabs, semicolons or commas between cells. A header line is read by its column names, in any order, with units in it or
            in their own column (“Date”, “HbA1c (%)”, “Fasting glucose”, “Unit”); without a header the columns are: {PASTE_COLUMNS.join(', ')}.
          </p>
          <textarea
            id={`${id}-paste`}
            className="field__input glucose__paste"
            rows={4}
            value={pasteText}
            onChange={(e) => setPasteText(e.target.value)}
            aria-describedby={describedBy(`${id}-paste-hint`, pasteReport !== null && `${id}-paste-report`)}
          />
          <button type="button" className="button button--secondary glucose__paste-button" onClick={addPasted} disabled={pasteText.trim() === ''}>
            Add pasted rows
          </button>
          {pending?.source === 'paste' ? <ImportChoice pending={pending} filledRows={history.filledRows} choiceRef={choiceRef} onChoose={(mode) => (mode ? apply(pending, mode) : setPending(null))} /> : null}
          {pasteReport ? <ReadReport id={`${id}-paste-report`} report={pasteReport} error={pasteReport.error} /> : null}
        </div>

        <div className={`field${fhirReport?.error ? ' field--invalid' : ''}`}>
          <label className="field__label" htmlFor={`${id}-fhir`}>
            Load a FHIR file (Bundle or Observation, JSON)
          </label>
          <p className="field__hint" id={`${id}-fhir-hint`}>
            HbA1c and fasting glucose results marked final or amended are read; everything else is listed with the reason.
          </p>
          <input
            id={`${id}-fhir`}
            type="file"
            accept=".json,application/json,application/fhir+json"
            onChange={(e) => void loadFhir(e)}
            aria-describedby={describedBy(`${id}-fhir-hint`, fhirReport !== null && `${id}-fhir-report`)}
            aria-invalid={fhirReport?.error ? true : undefined}
          />
          {pending?.source === 'fhir' ? <ImportChoice pending={pending} filledRows={history.filledRows} choiceRef={choiceRef} onChoose={(mode) => (mode ? apply(pending, mode) : setPending(null))} /> : null}
          {fhirReport ? <ReadReport id={`${id}-fhir-report`} report={fhirReport} error={fhirReport.error} /> : null}
        </div>
      </div>

      <div className="glucose__result" aria-live="polite" data-testid="glucose-result">
        <h3>Results</h3>
        <p className="glucose__status">{view.statusText}</p>
        {view.status === 'invalid' ? (
          <ul className="warnings glucose__errors">
            {view.errorLines.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        ) : null}
        {view.diabetesRangeNote ? (
          <aside className="caution glucose__note" aria-labelledby={`${id}-note-heading`} data-testid="glucose-diabetes-range-note">
            <h4 id={`${id}-note-heading`} className="caution__heading">
              Note: a result in the diabetes range
            </h4>
            <p className="caution__text">{view.diabetesRangeNote.message}</p>
          </aside>
        ) : null}
        {view.runText ? <p className="glucose__run">{view.runText}</p> : null}
        {view.match ? (
          <div className={`glucose__match glucose__match--${view.match.matches ? 'yes' : 'no'}`} data-testid="glucose-match">
            <p className="glucose__match-lead">
              {view.match.matches ? 'This history fits the study\u2019s exposure.' : 'This history does not fit the study\u2019s exposure.'}
            </p>
            <ul>
              {view.match.reasons.map((reason) => (
                <li key={reason}>{reason}</li>
              ))}
            </ul>
          </div>
        ) : null}
        {view.ownResults ? (
          <div className="glucose__own" data-testid="glucose-own-results">
            <p className="glucose__own-lead">{view.ownResults.heading}:</p>
            <p>{view.ownResults.text}</p>
          </div>
        ) : null}
      </div>

      {view.checkups.length > 0 ? (
        <div className="glucose__scroll" role="region" aria-labelledby={`${id}-table-caption`} tabIndex={0}>
          <table className="data-table glucose__table">
            <caption id={`${id}-table-caption`}>Each checkup under {view.criteriaName}</caption>
            <thead>
              <tr>
                <th scope="col">Date</th>
                <th scope="col">HbA1c ({CRITERIA[criteria].hba1c.unit})</th>
                <th scope="col">Fasting glucose ({CRITERIA[criteria].fpg.unit})</th>
                <th scope="col">Range</th>
                <th scope="col">Decided by</th>
              </tr>
            </thead>
            <tbody>
              {view.checkups.map((c) => (
                <tr key={c.date}>
                  <th scope="row">{c.date}</th>
                  <td>{c.hba1cText ?? '—'}</td>
                  <td>{c.fpgText ?? '—'}</td>
                  <td>
                    {c.label}
                    {c.discordant ? <span className="glucose__flag"> (tests disagree)</span> : null}
                  </td>
                  <td>{c.decidedBy ?? '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {view.checkups.length > 0 ? (
        <ul className="glucose__sentences">
          {view.checkups.map((c) => (
            <li key={c.date}>
              {c.sentence}
              {c.notes.map((n) => (
                <span key={n} className="note glucose__checkup-note">
                  {' '}
                  {n}.
                </span>
              ))}
            </li>
          ))}
        </ul>
      ) : null}
      {view.notes.length > 0 ? (
        <ul className="note glucose__notes">
          {view.notes.map((n) => (
            <li key={n}>{n}.</li>
          ))}
        </ul>
      ) : null}
      {view.timeline ? <GlucoseTimelineChart timeline={view.timeline} idBase={id} /> : null}
      {view.status === 'ready' ? <p className="note">{view.caution}</p> : null}
    </section>
  );
}

export default GlucoseHistory;

/** The question when read rows meet filled rows: replace them, add to them, or leave it. */
function ImportChoice({
  pending,
  filledRows,
  choiceRef,
  onChoose,
}: {
  pending: Pending;
  filledRows: number;
  choiceRef: RefObject<HTMLDivElement | null>;
  onChoose: (mode: ImportMode | null) => void;
}) {
  const n = pending.drafts.length;
  const read = `${n} ${n === 1 ? 'row' : 'rows'}`;
  const there = filledRows === 1 ? '1 row is' : `${filledRows} rows are`;
  return (
    <div className="glucose__choice" role="group" aria-labelledby={`${pending.source}-choice-question`} ref={choiceRef} data-testid="glucose-import-choice">
      <p id={`${pending.source}-choice-question`}>
        {pending.source === 'paste' ? 'The paste' : 'The file'} gave {read}, and {there} already in the history. Are these the same person’s results?
      </p>
      <div className="glucose__choice-buttons">
        <button type="button" className="button button--secondary" onClick={() => onChoose('replace')}>
          Replace the rows (another person)
        </button>
        <button type="button" className="button button--secondary" onClick={() => onChoose('add')}>
          Add to the rows (same person)
        </button>
        <button type="button" className="button button--quiet" onClick={() => onChoose(null)}>
          Cancel
        </button>
      </div>
    </div>
  );
}

/** What reading pasted rows or a FHIR file found: a summary line and the lines it could not use. */
function ReadReport({ id, report, error = false }: { id: string; report: { summary: string; lines: readonly string[] }; error?: boolean | undefined }) {
  return (
    <div id={id} className={error ? 'field__error glucose__report' : 'glucose__report'} role="status">
      <p>{report.summary}</p>
      {report.lines.length > 0 ? (
        <ul className="warnings">
          {report.lines.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
