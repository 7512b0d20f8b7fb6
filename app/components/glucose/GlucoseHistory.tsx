'use client';
/**
 * "Glucose history": a person's serial HbA1c and fasting glucose results, each placed in a range
 * by a named criteria set, the run ending at the latest result, a small timeline, and — when the
 * evidence defines an exposure — whether this history fits it.
 *
 * Rows come from typing, from a paste of spreadsheet rows, or from a FHIR file. Everything shown
 * is computed by lib/glycaemia/view.ts (and lib/fhir for the import); this component only keeps
 * what was typed and renders. Errors are linked to their fields with aria-describedby; the result
 * summary is announced politely. Keyboard only: every control is a native input, select or button.
 *
 * Props:
 * - exposure: the evidence entry's exposure definition, if it has one;
 * - onMatchChange: called with the match (or null) whenever it changes, so the result can carry
 *   the mismatch warning (match.warning) and the diabetes-range note.
 * - today: YYYY-MM-DD, for tests; default the local date.
 */
import { useEffect, useId, useMemo, useRef, useState, type ChangeEvent } from 'react';
import { CRITERIA } from '@/lib/glycaemia/criteria';
import { localIsoDate } from '@/lib/glycaemia/dates';
import { checkupToDraft, emptyDraft, isBlankDraft, type CheckupDraft, type DraftField } from '@/lib/glycaemia/draft';
import { CRITERIA_SETS, type CriteriaSet, type ExposureDefinition } from '@/lib/glycaemia/exposure';
import { GLUCOSE_UNITS } from '@/lib/glycaemia/glucose';
import { HBA1C_UNITS } from '@/lib/glycaemia/hba1c';
import type { HistoryMatch } from '@/lib/glycaemia/match';
import { parsePastedRows, pasteSummary, PASTE_COLUMNS } from '@/lib/glycaemia/paste';
import { glucoseHistoryView } from '@/lib/glycaemia/view';
import { importFhirGlucoseJson } from '@/lib/fhir/importGlucose';
import { fhirImportSummary, skipLine } from '@/lib/fhir/summary';
import { GlucoseTimelineChart } from './GlucoseTimelineChart';
import './glucose.css';

export interface GlucoseHistoryProps {
  readonly exposure?: ExposureDefinition | undefined;
  readonly onMatchChange?: ((match: HistoryMatch | null) => void) | undefined;
  /** Today as YYYY-MM-DD; default the local date. */
  readonly today?: string | undefined;
}

interface Row {
  readonly key: string;
  readonly draft: CheckupDraft;
}

interface Report {
  readonly summary: string;
  readonly lines: readonly string[];
  readonly error?: boolean;
}

export function GlucoseHistory({ exposure, onMatchChange, today }: GlucoseHistoryProps) {
  const id = useId();
  const keys = useRef(0);
  const newKey = () => {
    keys.current += 1;
    return `${id}-row-${keys.current}`;
  };
  const [criteria, setCriteria] = useState<CriteriaSet>(exposure?.criteria ?? 'ADA');
  const [rows, setRows] = useState<readonly Row[]>(() => [{ key: `${id}-row-0`, draft: emptyDraft(exposure?.criteria ?? 'ADA') }]);
  const [pasteText, setPasteText] = useState('');
  const [pasteReport, setPasteReport] = useState<Report | null>(null);
  const [fhirReport, setFhirReport] = useState<Report | null>(null);
  const day = today ?? localIsoDate();

  const view = useMemo(
    () => glucoseHistoryView({ drafts: rows.map((r) => r.draft), criteria, today: day, exposure }),
    [rows, criteria, day, exposure],
  );

  // Tell the screen when the match changes (compared by content, so a re-render with an equal
  // exposure object does not call back again).
  const lastMatch = useRef<string | undefined>(undefined);
  const matchKey = JSON.stringify(view.match);
  useEffect(() => {
    if (lastMatch.current === matchKey) return;
    lastMatch.current = matchKey;
    onMatchChange?.(view.match);
  }, [matchKey, view.match, onMatchChange]);

  const setField = (key: string, field: DraftField, value: string) => {
    setRows((current) => current.map((r) => (r.key === key ? { ...r, draft: { ...r.draft, [field]: value } as CheckupDraft } : r)));
  };
  const addRow = () => setRows((current) => [...current, { key: newKey(), draft: emptyDraft(criteria) }]);
  const removeRow = (key: string) =>
    setRows((current) => {
      const left = current.filter((r) => r.key !== key);
      return left.length > 0 ? left : [{ key: newKey(), draft: emptyDraft(criteria) }];
    });
  const appendDrafts = (drafts: readonly CheckupDraft[]) =>
    setRows((current) => [...current.filter((r) => !isBlankDraft(r.draft)), ...drafts.map((draft) => ({ key: newKey(), draft }))]);

  const addPasted = () => {
    const result = parsePastedRows(pasteText, criteria);
    appendDrafts(result.rows);
    setPasteReport({ summary: pasteSummary(result), lines: result.issues.map((i) => i.message) });
    if (result.issues.length === 0) setPasteText('');
  };

  const loadFhir = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (!file) return;
    const text = await file.text();
    const result = importFhirGlucoseJson(text, { today: day, criteria });
    if (!result.ok) {
      setFhirReport({ summary: `${file.name} could not be read:`, lines: result.issues.map((i) => i.message), error: true });
      return;
    }
    appendDrafts(result.value.checkups.map((c) => checkupToDraft(c, criteria)));
    setFhirReport({ summary: `${file.name}: ${fhirImportSummary(result.value)}`, lines: result.value.skipped.map(skipLine) });
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
          onChange={(e) => setCriteria(e.target.value as CriteriaSet)}
          aria-describedby={`${id}-criteria-source`}
        >
          {CRITERIA_SETS.map((c) => (
            <option key={c} value={c}>
              {CRITERIA[c].name}
            </option>
          ))}
        </select>
        <p className="field__hint" id={`${id}-criteria-source`}>
          Thresholds from {CRITERIA[criteria].source}, applied in its own units.
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
            <div className={`field glucose__field glucose__field--${f}${errors[f] ? ' field--invalid' : ''}`}>
              <label className="field__label" htmlFor={fieldId(row.key, f)}>
                {text}
              </label>
              <input
                id={fieldId(row.key, f)}
                className="field__input"
                type="text"
                autoComplete="off"
                inputMode={extra.inputMode}
                value={row.draft[f]}
                onChange={(e) => setField(row.key, f, e.target.value)}
                aria-invalid={errors[f] ? true : undefined}
                aria-describedby={describedBy(extra.hint, errors[f] && errorId(row.key, f))}
              />
              {errors[f] ? (
                <p className="field__error" id={errorId(row.key, f)}>
                  {errors[f]}
                </p>
              ) : null}
            </div>
          );
          const unit = (f: 'hba1cUnit' | 'fpgUnit', text: string, units: readonly string[]) => (
            <div className={`field glucose__field glucose__field--unit${errors[f] ? ' field--invalid' : ''}`}>
              <label className="field__label" htmlFor={fieldId(row.key, f)}>
                {text}
              </label>
              <select
                id={fieldId(row.key, f)}
                className="field__input"
                value={row.draft[f]}
                onChange={(e) => setField(row.key, f, e.target.value)}
                aria-describedby={errors[f] ? errorId(row.key, f) : undefined}
              >
                {units.map((u) => (
                  <option key={u} value={u}>
                    {u}
                  </option>
                ))}
              </select>
              {errors[f] ? (
                <p className="field__error" id={errorId(row.key, f)}>
                  {errors[f]}
                </p>
              ) : null}
            </div>
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
                <button type="button" className="button button--quiet glucose__remove" onClick={() => removeRow(row.key)}>
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
      <button type="button" className="button button--secondary" onClick={addRow}>
        Add a checkup
      </button>

      <div className="glucose__imports">
        <div className="field">
          <label className="field__label" htmlFor={`${id}-paste`}>
            Paste rows from a spreadsheet
          </label>
          <p className="field__hint" id={`${id}-paste-hint`}>
            Columns: {PASTE_COLUMNS.join(', ')}. Tabs, semicolons or commas between cells; a header line is skipped.
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
          {pasteReport ? <ReadReport id={`${id}-paste-report`} report={pasteReport} /> : null}
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
