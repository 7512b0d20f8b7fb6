/// <reference lib="webworker" />
/**
 * The checkups run off the main thread: lib/workforce's runCheckups / runCheckupTable, exactly as
 * lib/workforce/index.ts documents, with progress, batches of results and cancellation. The
 * worklist's filter choices and sort ranks are worked out here too, so the page only renders.
 *
 * Saved sessions (lib/checkups/session.ts, app/storage/sessions.ts) are saved and opened here:
 * the rows are read again from the file still in memory and written to the browser's storage
 * from this thread, and a reopened session's rows are processed here with the engine's public
 * steps (WorkerGrouper → evaluateWorker → SummaryAccumulator), as runCheckups does. A session
 * keeps the rows the engine read, not the file: while one is open, the workers' checkups for
 * batch handouts and "open one worker" come from its rows (a request that gives no file).
 */
import {
  createCheckupTextReader,
  EVALUATE_SLICE,
  evaluateWorker,
  FhirBulkReader,
  isRefusal,
  prepareCheckups,
  readCheckupTable,
  readXlsxSheet,
  runCheckups,
  runCheckupTable,
  SummaryAccumulator,
  WorkerGrouper,
  type CheckupRow,
  type CheckupsOutcome,
  type CheckupsProgress,
  type ReadRefusal,
  type RowCounts,
  type RowProblem,
  type WorkerResult,
} from '@/lib/workforce';
import { worklistCategory, worklistKeys, worklistStrata } from '@/lib/checkups/worklist';
import { WorklistKeyColumns, worklistOrders } from '@/lib/checkups/worklistOrder';
import { columnsFilterChoices, worklistColumnsBuffers, WorklistColumnsBuilder } from '@/lib/checkups/worklistColumns';
import { copyPackedChunk, packedChunkBuffers, packedResultList, ResultsPacker, type PackedResults } from '@/lib/checkups/packedResults';
import { workersCsv } from '@/lib/checkups/exportCsv';
import { SESSION_VERSION, type CheckupSession } from '@/lib/checkups/session';
import { openSessionStore } from '@/app/storage/sessions';
import { collectWorkersRows, collectWorkersRowsFromTable, workerCheckups, workersRowsFrom, type RowsByWorker } from '@/lib/checkups/workerHistory';
import type { FromWorker, ToWorker } from './protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (message: FromWorker, transfer: Transferable[] = []) => scope.postMessage(message, transfer);
const SLICE = 1 << 20;
const PREVIEW_BYTES = 64 * 1024;
let controller: AbortController | null = null;
/** The last run that finished, for "Save the session". */
let lastRun: Extract<ToWorker, { type: 'run' }> | null = null;
/** The rows of the saved session open now (its workers' checkups are read from them); null after a run from a file. */
let sessionRows: readonly CheckupRow[] | null = null;

async function* slices(files: readonly File[], markFiles: boolean): AsyncGenerator<string | { file: string }> {
  for (const file of files) {
    if (markFiles) yield { file: file.name };
    const decoder = new TextDecoder();
    for (let at = 0; at < file.size; at += SLICE) {
      const buffer = await file.slice(at, at + SLICE).arrayBuffer();
      yield decoder.decode(buffer, { stream: at + SLICE < file.size });
    }
  }
}

async function preview(data: Extract<ToWorker, { type: 'preview' }>): Promise<void> {
  if (data.kind === 'fhir-ndjson') return post({ type: 'header', header: null, refusal: null });
  if (data.kind === 'xlsx') {
    const sheet = await readXlsxSheet(data.file);
    if (isRefusal(sheet)) return post({ type: 'header', header: null, refusal: sheet });
    const read = readCheckupTable(sheet.rows.slice(0, 60), { today: data.today });
    if (isRefusal(read)) return post({ type: 'header', header: null, refusal: read });
    return post({ type: 'header', header: read.header, refusal: null });
  }
  const text = new TextDecoder().decode(await data.file.slice(0, PREVIEW_BYTES).arrayBuffer());
  const reader = createCheckupTextReader({ today: data.today });
  const step = reader.push(text);
  const last = data.file.size <= PREVIEW_BYTES ? reader.end() : step;
  if (reader.header) return post({ type: 'header', header: reader.header, refusal: null });
  return post({ type: 'header', header: null, refusal: isRefusal(last) ? last : isRefusal(step) ? step : null });
}

/**
 * Packs results as they come (lib/checkups/packedResults.ts) and sends each chunk to the page as
 * it is made (a copy, its buffers transferred: no copy on the page's side, nothing for its garbage
 * collector), keeping the original here for the per-worker export; builds the worklist's filter
 * columns and sort keys meanwhile (no display row is made here).
 */
function resultSink() {
  const packer = new ResultsPacker((chunk) => {
    const copy = copyPackedChunk(chunk);
    post({ type: 'results', chunk: copy }, packedChunkBuffers(copy));
  });
  const columns = new WorklistColumnsBuilder();
  const keys = new WorklistKeyColumns();
  return {
    packer,
    columns,
    keys,
    add: (w: WorkerResult) => {
      packer.add(w);
      columns.add({ status: w.status, category: worklistCategory(w), strata: worklistStrata(w) });
      keys.add(worklistKeys(w));
    },
  };
}

const yieldToMessages = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/** The last finished run's results, kept here for the per-worker export. */
let lastResults: PackedResults | null = null;

/**
 * The last results, the worklist's filter columns and choices, and its sort ranks and orders, all
 * before `done`. The ranks were made just after `done` at first, so this thread took a core for
 * most of a second while the page drew the summary and the worklist step by step: on a 2-core
 * machine the page's steps (20–30 ms of work each) then took up to 70 ms of wall time. Made first,
 * they cost the summary that second, and the worklist can be sorted the moment it shows.
 */
function finish(outcome: CheckupsOutcome, sink: ReturnType<typeof resultSink> | null): void {
  lastResults = null;
  if (!outcome.ok || !sink) {
    post({ type: 'done', outcome });
    return;
  }
  lastResults = sink.packer.finish();
  const columns = sink.columns.finish();
  post({ type: 'columns', columns }, worklistColumnsBuffers(columns));
  post({ type: 'choices', choices: columnsFilterChoices(columns) });
  const ranks = sink.keys.ranks();
  const orders = worklistOrders(ranks);
  post({ type: 'ranks', ranks, orders }, [...Object.values(ranks), ...Object.values(orders).flatMap((o) => [o.ascending, o.descending])].map((a) => a.buffer));
  post({ type: 'done', outcome });
}

async function run(data: Extract<ToWorker, { type: 'run' }>): Promise<void> {
  controller = new AbortController();
  lastRun = null;
  lastResults = null;
  sessionRows = null;
  const context = prepareCheckups({ evidence: data.evidence, table: data.table, criteria: data.criteria, ...(data.horizon !== null ? { horizonYears: data.horizon } : {}) });
  if (!context.ok) return post({ type: 'refused', messages: context.issues.map((i) => i.message) });
  const sink = resultSink();
  const options = {
    context: context.value,
    reader: { today: data.today, ...(data.mapping ? { mapping: data.mapping } : {}) },
    signal: controller.signal,
    pause: yieldToMessages,
    onWorker: sink.add,
    onProblems: (problems: readonly RowProblem[]) => post({ type: 'problems', problems }),
    onProgress: (progress: CheckupsProgress) => post({ type: 'progress', progress }),
  };
  let outcome: CheckupsOutcome;
  if (data.kind === 'xlsx') {
    const file = data.files[0];
    const sheet = file ? await readXlsxSheet(file) : null;
    if (!sheet) return post({ type: 'refused', messages: ['No file was given'] });
    outcome = isRefusal(sheet) ? ({ ok: false, refusal: sheet } as const) : await runCheckupTable(sheet.rows, options);
  } else {
    outcome = await runCheckups(slices(data.files, data.kind === 'fhir-ndjson'), { ...options, format: data.kind });
  }
  if (outcome.ok) lastRun = data;
  finish(outcome, sink);
}

/** The rows of the last run's file, read again with the same settings (never the file's other columns). */
async function readRows(data: Extract<ToWorker, { type: 'run' }>): Promise<{ rows: CheckupRow[]; counts: RowCounts; problems: RowProblem[] } | string> {
  const rows: CheckupRow[] = [];
  const problems: RowProblem[] = [];
  const take = (step: { rows: readonly CheckupRow[]; problems: readonly RowProblem[] }) => {
    for (const r of step.rows) rows.push(r);
    for (const p of step.problems) problems.push(p);
  };
  const options = { today: data.today, ...(data.mapping ? { mapping: data.mapping } : {}) };
  if (data.kind === 'xlsx') {
    const file = data.files[0];
    if (!file) return 'No file was given';
    const sheet = await readXlsxSheet(file);
    if (isRefusal(sheet)) return sheet.message;
    const read = readCheckupTable(sheet.rows, options);
    if (isRefusal(read)) return read.message;
    take(read.step);
    return { rows, counts: read.counts, problems };
  }
  if (data.kind === 'fhir-ndjson') {
    const reader = new FhirBulkReader(options);
    for await (const chunk of slices(data.files, true)) {
      if (typeof chunk === 'string') take(reader.push(chunk));
      else reader.startFile(chunk.file);
    }
    take(reader.end());
    return { rows, counts: reader.counts(), problems };
  }
  const reader = createCheckupTextReader(options);
  for await (const chunk of slices(data.files, false)) {
    if (typeof chunk !== 'string') continue;
    const step = reader.push(chunk);
    if (isRefusal(step)) return step.message;
    take(step);
  }
  const last = reader.end();
  if (isRefusal(last)) return last.message;
  take(last);
  return { rows, counts: reader.counts(), problems };
}

async function saveSession(data: Extract<ToWorker, { type: 'save-session' }>): Promise<void> {
  const runData = lastRun;
  if (!runData) return post({ type: 'session-saved', id: data.id, messages: ['There is no finished run to save: process the file first.'] });
  const read = await readRows(runData);
  if (typeof read === 'string') return post({ type: 'session-saved', id: data.id, messages: [read] });
  const session: CheckupSession = {
    sessionVersion: SESSION_VERSION,
    id: data.id,
    name: data.name,
    setup: { evidence: runData.evidence, table: runData.table, criteria: runData.criteria, horizonYears: runData.horizon },
    today: runData.today,
    kind: runData.kind,
    mapping: runData.confirmedMapping ? { columns: [...runData.confirmedMapping.columns] } : null,
    rows: read.rows,
    rowCounts: read.counts,
    problems: read.problems,
  };
  const store = await openSessionStore();
  if (!store.ok) return post({ type: 'session-saved', id: data.id, messages: store.issues.map((i) => i.message) });
  try {
    const saved = await store.value.save(session);
    post({ type: 'session-saved', id: data.id, messages: saved.ok ? [] : saved.issues.map((i) => i.message) });
  } finally {
    store.value.close();
  }
}

async function openSession(data: Extract<ToWorker, { type: 'open-session' }>): Promise<void> {
  controller = new AbortController();
  const signal = controller.signal;
  lastRun = null;
  lastResults = null;
  const store = await openSessionStore();
  if (!store.ok) return post({ type: 'session-refused', messages: store.issues.map((i) => i.message) });
  const opened = await store.value.open(data.id);
  store.value.close();
  if (!opened.ok) return post({ type: 'session-refused', messages: opened.issues.map((i) => i.message) });
  const session = opened.value;
  const { setup } = session;
  sessionRows = session.rows;
  post({ type: 'session-opened', setup, kind: session.kind, mapping: session.mapping });
  const context = prepareCheckups({ evidence: setup.evidence, table: setup.table, criteria: setup.criteria, ...(setup.horizonYears !== null ? { horizonYears: setup.horizonYears } : {}) });
  if (!context.ok) return post({ type: 'session-refused', messages: context.issues.map((i) => i.message) });
  if (session.problems.length > 0) post({ type: 'problems', problems: session.problems });
  // The engine's public steps, in the order runCheckups takes them (lib/workforce/run.ts).
  const grouper = new WorkerGrouper();
  grouper.add(session.rows);
  const summary = new SummaryAccumulator();
  const sink = resultSink();
  const counts = session.rowCounts;
  const total = grouper.size;
  let done = 0;
  let extraSkipped = 0;
  let problemCount = session.problems.length;
  const progress = (): CheckupsProgress => ({ phase: 'evaluating', charsDone: 0, rowsRead: counts.read, workersDone: done, workersTotal: total });
  for (const group of grouper.workers()) {
    const result = evaluateWorker(group, context.value);
    if (result.problems.length > 0) {
      extraSkipped += result.skippedRows;
      problemCount += result.problems.length;
      post({ type: 'problems', problems: result.problems });
    }
    summary.add(result);
    sink.add(result);
    done++;
    if (done % EVALUATE_SLICE === 0) {
      post({ type: 'progress', progress: progress() });
      await yieldToMessages();
      if (signal.aborted) return finish({ ok: false, cancelled: true }, null);
    }
  }
  post({ type: 'progress', progress: progress() });
  const finished = summary.finish({ read: counts.read, used: counts.used - extraSkipped, skipped: counts.skipped + extraSkipped });
  finish({ ok: true, summary: finished, header: null, problemCount }, sink);
}

type RowsRequest = Pick<Extract<ToWorker, { type: 'histories' }>, 'files' | 'kind' | 'today' | 'mapping'>;

/**
 * The wanted workers' rows, read again: from the open saved session's rows when the request gives
 * no file, else from the same files with the same mapping (a workbook's sheet, or text in slices,
 * each slice reported to `onSlice`). Null when there is neither.
 */
async function wantedRows(data: RowsRequest, wanted: ReadonlySet<string>, signal?: AbortSignal, onSlice?: () => void): Promise<RowsByWorker | ReadRefusal | null> {
  if (data.files.length === 0) return sessionRows ? workersRowsFrom(sessionRows, wanted) : null;
  const reader = { today: data.today, ...(data.mapping ? { mapping: data.mapping } : {}) };
  if (data.kind === 'xlsx') {
    const file = data.files[0];
    const sheet = file ? await readXlsxSheet(file) : null;
    return !sheet ? null : isRefusal(sheet) ? sheet : collectWorkersRowsFromTable(sheet.rows, reader, wanted);
  }
  async function* counted(): AsyncGenerator<string | { file: string }> {
    for await (const chunk of slices(data.files, data.kind === 'fhir-ndjson')) {
      if (signal?.aborted) return;
      if (typeof chunk === 'string') onSlice?.();
      yield chunk;
    }
  }
  return collectWorkersRows(counted(), { reader, format: data.kind }, wanted);
}

/** One worker's checkups, read again (see {@link wantedRows}). */
async function history(data: Extract<ToWorker, { type: 'history' }>): Promise<void> {
  const rows = await wantedRows(data, new Set([data.worker]));
  if (!rows || isRefusal(rows)) return post({ type: 'history', worker: data.worker, checkups: null, message: rows ? rows.message : 'No file was given' });
  post({ type: 'history', worker: data.worker, checkups: workerCheckups(rows.get(data.worker) ?? []), message: null });
}

/** Workers' checkups per 'histories' answer: small enough that the page takes each in a few milliseconds. */
const HISTORIES_BATCH = 250;
type FromWorkerHistories = Extract<FromWorker, { type: 'histories' }>;
/** The 'histories' pass still reading, if any. */
let historiesPass: { readonly id: number; readonly controller: AbortController } | null = null;

/** The chosen workers' checkups, read again from the same files in one pass, with progress. */
async function histories(data: Extract<ToWorker, { type: 'histories' }>): Promise<void> {
  historiesPass?.controller.abort();
  const pass = { id: data.id, controller: new AbortController() };
  historiesPass = pass;
  const { signal } = pass.controller;
  const bytesTotal = data.files.reduce((sum, f) => sum + f.size, 0);
  let bytesRead = 0;
  const answer = (rest: { histories?: FromWorkerHistories['histories']; done: boolean; message: string | null }) =>
    post({ type: 'histories', id: data.id, bytesRead, bytesTotal, histories: rest.histories ?? [], done: rest.done, message: rest.message });
  const rows = await wantedRows(data, new Set(data.workers), signal, () => {
    bytesRead = Math.min(bytesTotal, bytesRead + SLICE);
    answer({ done: false, message: null });
  });
  if (signal.aborted) return;
  if (historiesPass === pass) historiesPass = null;
  bytesRead = bytesTotal;
  if (!rows || isRefusal(rows)) return answer({ done: true, message: rows ? rows.message : 'No file was given' });
  const list = [...rows].map(([worker, workerRows]) => ({ worker, checkups: workerCheckups(workerRows) }));
  for (let at = 0; at < list.length; at += HISTORIES_BATCH) answer({ histories: list.slice(at, at + HISTORIES_BATCH), done: false, message: null });
  answer({ done: true, message: null });
}

/** The per-worker CSV of the last finished run, made here so the page never reads every result. */
function exportWorkers(data: Extract<ToWorker, { type: 'export-workers' }>): void {
  post({ type: 'export-workers', text: lastResults ? workersCsv(packedResultList(lastResults), data.context) : null });
}

scope.onmessage = (event: MessageEvent<ToWorker>) => {
  const data = event.data;
  if (data.type === 'cancel') {
    controller?.abort();
    return;
  }
  if (data.type === 'histories-cancel') {
    if (historiesPass?.id === data.id) historiesPass.controller.abort();
    return;
  }
  if (data.type === 'histories') {
    void histories(data);
    return;
  }
  if (data.type === 'preview') void preview(data);
  else if (data.type === 'save-session') void saveSession(data);
  else if (data.type === 'open-session') void openSession(data);
  else if (data.type === 'history') void history(data);
  else if (data.type === 'export-workers') exportWorkers(data);
  else void run(data);
};
