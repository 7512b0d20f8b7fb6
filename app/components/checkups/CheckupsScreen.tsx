'use client';
/**
 * The checkups screen: set-up, open a file, confirm the columns, process in a Web Worker, then
 * the worklist and the summary. Everything shown comes from lib/workforce and lib/checkups; the
 * file stays in this page's memory and is never sent anywhere.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useHydrated } from '@/app/components/useHydrated';
import { localIsoDate } from '@/lib/glycaemia/dates';
import { CHECKUP_SNIFF_BYTES, checkupFileKind, MAX_CHECKUP_FILE_BYTES } from '@/lib/checkups/fileKind';
import { checkupsProgressView } from '@/lib/checkups/progress';
import type { WorklistRow } from '@/lib/checkups/worklist';
import { packedChunkResults } from '@/lib/checkups/packedResults';
import { attachColumns, fileOrder, lazyWorklistRows } from '@/lib/checkups/worklistColumns';
import { decodeMappingMemory, encodeMappingMemory, mappingMemoryKey } from '@/lib/checkups/mappingMemory';
import { checkupsFileNames, summaryCsv } from '@/lib/checkups/exportCsv';
import { downloadText } from '@/app/components/library/download';
import { CHECKUP_FIELDS, type CheckupField, type CheckupsProgress, type ColumnMapping, type WorkerResult, type HeaderInfo, type RowProblem, type WorkforceSummary } from '@/lib/workforce';
import { newSessionId } from '@/lib/checkups/session';
import { rememberOrders, type WorklistRanks } from '@/lib/checkups/worklistOrder';
import type { FileKindName, FilterChoices, FromWorker, ToWorker } from './protocol';
import { SetupPanel, useCheckupsSetup } from './SetupPanel';
import { SessionPanel, type SaveState } from './SessionPanel';
import { BatchWorklist, type CheckupsRunInput } from './BatchWorklist';
import { SummaryPanel } from './SummaryPanel';
import { ProblemsPanel } from './ProblemsPanel';
import { afterNextPaint } from './afterNextPaint';
import './checkups.css';

type Phase = 'setup' | 'columns' | 'running' | 'done';

/**
 * What of the results is on screen, added one step at a time after a run, each step in its own
 * task after the previous one was painted, so no step holds up the page for long: the summary's
 * text and tables first, then its chart (drawn in steps of its own, ./SummaryPanel.tsx, while the
 * page is still small: recharts measures text, which lays out the whole page), then the exports,
 * problems and worklist once the chart is drawn.
 */
const SHOWN_STEPS = ['summary', 'chart', 'worklist'] as const;

export function CheckupsScreen() {
  // False in the server's HTML, true once the page runs: the file input waits for its handler.
  const ready = useHydrated();
  const setup = useCheckupsSetup();
  const { criteria, horizon, evidence, table } = setup;
  const [files, setFiles] = useState<File[]>([]);
  const [kind, setKind] = useState<FileKindName | null>(null);
  const [fileMessage, setFileMessage] = useState<string | null>(null);
  const [header, setHeader] = useState<HeaderInfo | null>(null);
  const [fields, setFields] = useState<(CheckupField | null)[]>([]);
  const [phase, setPhase] = useState<Phase>('setup');
  const [progress, setProgress] = useState<{ p: CheckupsProgress; elapsed: number } | null>(null);
  const [rows, setRows] = useState<readonly WorklistRow[]>([]);
  const [problems, setProblems] = useState<RowProblem[]>([]);
  const [summary, setSummary] = useState<WorkforceSummary | null>(null);
  const [runMessages, setRunMessages] = useState<string[]>([]);
  const [paste, setPaste] = useState('');
  const workerRef = useRef<Worker | null>(null);
  const startRef = useRef(0);
  /** The run's results and worklist rows so far (each read from the packed form only when shown), until `done` puts them on screen. */
  const pending = useRef<{ results: WorkerResult[]; rows: WorklistRow[] }>({ results: [], rows: [] });
  const [results, setResults] = useState<readonly WorkerResult[]>([]);
  /** How many of SHOWN_STEPS are on screen. */
  const [shownSteps, setShownSteps] = useState(0);
  const exportName = useRef<string | null>(null);
  const [choices, setChoices] = useState<FilterChoices | null>(null);
  const [ranks, setRanks] = useState<WorklistRanks | null>(null);
  const [saveState, setSaveState] = useState<SaveState>({ status: 'idle' });
  /** True when the results on screen come from a saved session (nothing new to save). */
  const [fromSession, setFromSession] = useState(false);
  const [sessionMessages, setSessionMessages] = useState<string[]>([]);
  const restore = setup.restore;
  const [runInput, setRunInput] = useState<CheckupsRunInput | null>(null); // what the results were made from (open one worker, batch handouts)

  const onMessage = useCallback((event: MessageEvent<FromWorker>) => {
    const m = event.data;
    if (m.type === 'header') {
      if (m.refusal) {
        setFileMessage(m.refusal.message);
        setPhase('setup');
        return;
      }
      setHeader(m.header);
      const proposed = m.header ? m.header.proposal.mapping.columns.map((c) => c.field) : [];
      let remembered: (CheckupField | null)[] | null = null;
      try {
        remembered = m.header ? decodeMappingMemory(window.localStorage.getItem(mappingMemoryKey(m.header.headers)), proposed.length) : null;
      } catch {
        remembered = null; // storage unavailable: the proposal stands
      }
      setFields(remembered ?? proposed);
      setPhase('columns');
    } else if (m.type === 'progress') {
      setProgress({ p: m.progress, elapsed: performance.now() - startRef.current });
    } else if (m.type === 'results') {
      const chunk = packedChunkResults(m.chunk);
      for (const r of chunk) pending.current.results.push(r);
      for (const r of lazyWorklistRows(chunk, m.chunk.first)) pending.current.rows.push(r);
    } else if (m.type === 'columns') {
      attachColumns(pending.current.rows, m.columns);
      fileOrder(m.columns); // made now, in this message's task, rather than when the worklist first shows

    } else if (m.type === 'export-workers') {
      if (m.text !== null && exportName.current) downloadText(exportName.current, m.text, 'text/csv');
      exportName.current = null;
    } else if (m.type === 'choices') {
      setChoices(m.choices);
    } else if (m.type === 'ranks') {
      rememberOrders(m.ranks, m.orders);
      setRanks(m.ranks);
    } else if (m.type === 'session-saved') {
      setSaveState(m.messages.length === 0 ? { status: 'saved' } : { status: 'failed', messages: m.messages });
    } else if (m.type === 'session-opened') {
      restore(m.setup);
      setFromSession(true);
      // A session keeps no file: its rows, kept by the worker, give the results, batch handouts' own results and one worker's history.
      setRunInput({ files: [], kind: m.kind, today: localIsoDate(), mapping: m.mapping, confirmedMapping: m.mapping, evidence: m.setup.evidence, table: m.setup.table, criteria: m.setup.criteria, horizon: m.setup.horizonYears });
    } else if (m.type === 'session-refused') {
      setSessionMessages([...m.messages]);
      setPhase('setup');
    } else if (m.type === 'problems') {
      setProblems((p) => p.concat(m.problems));
    } else if (m.type === 'refused') {
      setRunMessages([...m.messages]);
      setPhase('columns');
    } else if (m.type === 'done') {
      const outcome = m.outcome;
      if (outcome.ok) {
        setSummary(outcome.summary);
        setRows(pending.current.rows);
        setResults(pending.current.results);
        pending.current = { results: [], rows: [] };
        setShownSteps(1);
        setPhase('done');
      } else if ('refusal' in outcome) {
        setRunMessages([outcome.refusal.message]);
        setPhase('columns');
      } else {
        setRunMessages(['Cancelled: nothing was kept. Process the file again when ready.']);
        setPhase('columns');
      }
    }
  }, [restore]);

  const worker = useCallback((): Worker => {
    if (!workerRef.current) {
      const w = new Worker(new URL('./checkups.worker.ts', import.meta.url));
      w.onmessage = onMessage;
      workerRef.current = w;
    }
    return workerRef.current;
  }, [onMessage]);

  useEffect(() => () => workerRef.current?.terminate(), []);

  const send = (message: ToWorker) => worker().postMessage(message);

  /** Clears the results on screen (a new file, a session opened). */
  const clearResults = () => {
    setSummary(null);
    setRows([]);
    setResults([]);
    setProblems([]);
    setRunMessages([]);
    setChoices(null);
    setRanks(null);
    setSaveState({ status: 'idle' });
    setFromSession(false);
    setSessionMessages([]);
    pending.current = { results: [], rows: [] };
    setShownSteps(0);
  };

  const openFiles = async (list: File[]) => {
    setFileMessage(null);
    setHeader(null);
    clearResults();
    const first = list[0];
    if (!first) return;
    if (first.size > MAX_CHECKUP_FILE_BYTES) {
      const refused = checkupFileKind(first.name, first.size, new Uint8Array([0]));
      setFileMessage(refused.kind === 'refused' ? refused.message : null);
      return;
    }
    const head = new Uint8Array(await first.slice(0, CHECKUP_SNIFF_BYTES).arrayBuffer());
    const found = checkupFileKind(first.name, first.size, head);
    if (found.kind === 'refused') {
      setFileMessage(found.message);
      setPhase('setup');
      return;
    }
    setFiles(list);
    setKind(found.kind);
    send({ type: 'preview', file: first, kind: found.kind, today: localIsoDate() });
  };

  const mapping: ColumnMapping | null = useMemo(() => {
    if (!header) return null;
    return { columns: header.proposal.mapping.columns.map((c, i) => ({ ...c, field: fields[i] ?? null })) };
  }, [header, fields]);
  const corrected = header ? header.proposal.mapping.columns.some((c, i) => c.field !== (fields[i] ?? null)) : false;

  const process = () => {
    if (!kind || !evidence || !table) return;
    clearResults();
    setProgress(null);
    startRef.current = performance.now();
    setPhase('running');
    const h = horizon.trim() === '' ? null : Number(horizon);
    if (header && corrected) {
      try {
        window.localStorage.setItem(mappingMemoryKey(header.headers), encodeMappingMemory(fields)); // the headers and chosen fields only, never values
      } catch {
        // storage unavailable: the correction holds for this file only
      }
    }
    const input: CheckupsRunInput = { files, kind, today: localIsoDate(), mapping: corrected ? mapping : null, confirmedMapping: mapping, evidence, table, criteria, horizon: h };
    setRunInput(input);
    send({ type: 'run', ...input });
  };

  const saveSession = (name: string) => {
    setSaveState({ status: 'saving' });
    send({ type: 'save-session', id: newSessionId(), name });
  };

  const openSession = (id: string) => {
    setRunInput(null);
    setHeader(null);
    setFiles([]);
    setKind(null);
    setFileMessage(null);
    clearResults();
    setProgress(null);
    startRef.current = performance.now();
    setPhase('running');
    send({ type: 'open-session', id });
  };

  const cancel = () => send({ type: 'cancel' });

  const exportContext = () => ({ evidenceTitle: evidence?.title ?? '', evidenceId: evidence?.id ?? '', tableTitle: table?.title ?? '', tableId: table?.id ?? '', criteria, date: localIsoDate() });
  // Made in the worker (it reads every result); the answer is downloaded when it comes (onMessage).
  const exportWorkers = () => {
    exportName.current = checkupsFileNames(localIsoDate()).workers;
    send({ type: 'export-workers', context: exportContext() });
  };
  const exportSummary = () => summary && downloadText(checkupsFileNames(localIsoDate()).summary, summaryCsv(summary, exportContext()), 'text/csv');

  // After a run: the next step on screen once this one is painted.
  const shows = (step: (typeof SHOWN_STEPS)[number]) => shownSteps > SHOWN_STEPS.indexOf(step);
  const chartShown = shows('chart');
  useEffect(() => {
    // The step after the chart waits for the chart to say it is drawn.
    if (phase !== 'done' || shownSteps === 0 || shownSteps >= SHOWN_STEPS.length || chartShown) return;
    return afterNextPaint(() => setShownSteps((n) => Math.min(n + 1, SHOWN_STEPS.length)));
  }, [phase, shownSteps, chartShown]);
  const chartDrawn = useCallback(() => setShownSteps((n) => Math.max(n, SHOWN_STEPS.indexOf('worklist') + 1)), []);

  const progressView = progress ? checkupsProgressView(progress.p, files.reduce((s, f) => s + f.size, 0), progress.elapsed) : null;
  const skipped = summary ? summary.rows.skipped : 0;

  return (
    <div className="checkups">
      <h1>Workforce checkups</h1>
      <p>Open a year&rsquo;s checkup export to see which workers fit a study&rsquo;s exposure. The file stays in this browser tab; nothing is sent anywhere.</p>

      <SetupPanel setup={setup} />

      <section aria-labelledby="file-heading" className="checkups__section">
        <h2 id="file-heading">Open the file</h2>
        <div
          className="checkups__drop"
          data-testid="drop-zone"
          onDragOver={(e) => e.preventDefault()}
          onDrop={(e) => {
            e.preventDefault();
            void openFiles([...e.dataTransfer.files]);
          }}
        >
          <label>
            Checkup file (CSV, TSV, .xlsx or FHIR .ndjson; up to 100 MB) — or drop it here
            <input type="file" multiple disabled={!ready} accept=".csv,.tsv,.txt,.xlsx,.ndjson,.jsonl" onChange={(e) => void openFiles([...(e.target.files ?? [])])} />
          </label>
        </div>
        <label className="checkups__paste">
          Or paste the table
          <textarea rows={3} value={paste} onChange={(e) => setPaste(e.target.value)} />
        </label>
        <button type="button" disabled={paste.trim() === ''} onClick={() => void openFiles([new File([paste], 'pasted.csv', { type: 'text/csv' })])}>
          Use the pasted table
        </button>
        {fileMessage ? (
          <p role="alert" className="checkups__message" data-testid="file-message">
            {fileMessage}
          </p>
        ) : null}
      </section>

      {phase !== 'setup' && (header || kind === 'fhir-ndjson') ? (
        <section aria-labelledby="columns-heading" className="checkups__section">
          <h2 id="columns-heading">Columns</h2>
          {header ? (
            <div className="checkups__scroll" tabIndex={0} role="region" aria-labelledby="columns-heading">
              <table className="checkups__table" data-testid="columns">
                <caption>Each column found, a few values, and what it was taken to be; correct any of them.</caption>
                <thead>
                  <tr>
                    <th scope="col">Column</th>
                    <th scope="col">Sample values</th>
                    <th scope="col">Taken to be</th>
                  </tr>
                </thead>
                <tbody>
                  {header.proposal.mapping.columns.map((c, i) => (
                    <tr key={c.index}>
                      <th scope="row">{c.header}</th>
                      <td>{header.sample.slice(0, 3).map((r) => r[c.index] ?? '').join(', ')}</td>
                      <td>
                        <select
                          aria-label={`What the column ${c.header} is`}
                          value={fields[i] ?? ''}
                          onChange={(e) => setFields((f) => f.map((v, j) => (j === i ? ((e.target.value || null) as CheckupField | null) : v)))}
                        >
                          <option value="">not used</option>
                          {CHECKUP_FIELDS.map((f) => (
                            <option key={f} value={f}>
                              {f}
                            </option>
                          ))}
                        </select>
                        {c.identifying ? <span> (looks identifying: left out)</span> : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {header.proposal.problems.length > 0 ? (
                <ul className="checkups__message">
                  {header.proposal.problems.map((p) => (
                    <li key={p.message}>{p.message}</li>
                  ))}
                </ul>
              ) : null}
            </div>
          ) : (
            <p>A FHIR bulk export: the Patient and Observation resources are read as they are.</p>
          )}
          <div className="checkups__actions">
            <button type="button" onClick={process} disabled={phase === 'running' || !setup.view.ready || !evidence || !table}>
              Confirm the columns and process
            </button>
            {phase === 'running' ? (
              <button type="button" onClick={cancel}>
                Cancel
              </button>
            ) : null}
          </div>
          {runMessages.map((m) => (
            <p key={m} role="alert" className="checkups__message">
              {m}
            </p>
          ))}
        </section>
      ) : null}

      {phase === 'running' ? (
        <section aria-labelledby="progress-heading" className="checkups__section">
          <h2 id="progress-heading">Processing</h2>
          <progress aria-labelledby="progress-heading" max={1} value={progressView?.fraction ?? 0} />
          <p aria-live="polite" data-testid="progress-text">
            {progressView ? `${progressView.text}${progressView.timeLeft ? ` · ${progressView.timeLeft}` : ''}` : 'Starting…'}
          </p>
        </section>
      ) : null}

      {phase === 'done' && summary ? (
        <>
          <SummaryPanel summary={summary} outcome={evidence?.wording.outcome ?? 'the outcome'} chart={chartShown} onChartDrawn={chartDrawn} />
        </>
      ) : null}
      {phase === 'done' && summary && shows('worklist') ? (
        <>
          <section aria-labelledby="export-heading" className="checkups__section">
            <h2 id="export-heading">Export</h2>
            <div className="checkups__actions">
              <button type="button" onClick={exportWorkers}>
                Per-worker CSV
              </button>
              <button type="button" onClick={exportSummary}>
                Summary CSV
              </button>
            </div>
          </section>
          <ProblemsPanel problems={problems} skippedRows={skipped} />
          <BatchWorklist rows={rows} results={results} run={runInput} worker={worker} choices={choices} ranks={ranks} />
        </>
      ) : null}

      <SessionPanel canSave={phase === 'done' && summary !== null && !fromSession} saveState={saveState} onSave={saveSession} onOpen={openSession} busy={phase === 'running'} openMessages={sessionMessages} />
    </div>
  );
}
