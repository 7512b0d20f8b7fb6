/**
 * The whole job, incrementally: chunks of a file in, worker results and the summary out, with
 * progress, pauses (a page or a Web Worker stays responsive) and cancellation (an AbortSignal).
 * It only strings together the public steps — a reader (./reader.ts, ./fhirBulk.ts), a grouper
 * (./group.ts), {@link evaluateWorker} (./evaluate.ts) and the {@link SummaryAccumulator}
 * (./summary.ts) — so the command, the screen and the tests get the same figures.
 *
 * The file is grouped whole here (any row order). The command streams a file already grouped by
 * worker with the same steps and a StreamingGrouper instead.
 */
import { evaluateWorker, type CheckupsContext } from './evaluate';
import { FhirBulkReader } from './fhirBulk';
import { WorkerGrouper } from './group';
import { createCheckupTextReader, isRefusal, noUsableRows, readCheckupTable, type CheckupReaderOptions, type HeaderInfo, type ReadRefusal } from './reader';
import { SummaryAccumulator } from './summary';
import type { CellValue, RowCounts, RowProblem, WorkerResult, WorkforceSummary } from './types';

export type CheckupFormat = 'delimited' | 'fhir-ndjson';

export interface CheckupsProgress {
  readonly phase: 'reading' | 'evaluating';
  /** Characters read so far (reading), for a progress bar against the file's size. */
  readonly charsDone: number;
  readonly rowsRead: number;
  readonly workersDone: number;
  /** Known once reading is done. */
  readonly workersTotal: number | null;
}

export interface RunCheckupsOptions {
  readonly context: CheckupsContext;
  readonly reader: CheckupReaderOptions;
  readonly format: CheckupFormat;
  /** Called with each worker's result, in order of first appearance. */
  readonly onWorker?: (result: WorkerResult) => void;
  /** Called once the header is read, before the first worker (the columns, for a CSV writer or the screen). */
  readonly onHeader?: (header: HeaderInfo) => void;
  /** Called with row problems as they are found. */
  readonly onProblems?: (problems: readonly RowProblem[]) => void;
  readonly onProgress?: (progress: CheckupsProgress) => void;
  /** Awaited between chunks and every {@link EVALUATE_SLICE} workers. */
  readonly pause?: () => Promise<void>;
  readonly signal?: AbortSignal;
}

/** Workers evaluated between two pauses. */
export const EVALUATE_SLICE = 500;

export type CheckupsOutcome =
  | { readonly ok: true; readonly summary: WorkforceSummary; readonly header: HeaderInfo | null; readonly problemCount: number }
  | { readonly ok: false; readonly refusal: ReadRefusal }
  | { readonly ok: false; readonly cancelled: true };

const CANCELLED = { ok: false, cancelled: true } as const;

async function evaluateAll(grouper: WorkerGrouper, counts: RowCounts, options: RunCheckupsOptions, problemCount: number, charsDone: number): Promise<{ summary: WorkforceSummary; problemCount: number } | null> {
  const summary = new SummaryAccumulator();
  let done = 0;
  let extraSkipped = 0;
  const total = grouper.size;
  for (const group of grouper.workers()) {
    const result = evaluateWorker(group, options.context);
    if (result.problems.length > 0) {
      extraSkipped += result.skippedRows;
      problemCount += result.problems.length;
      options.onProblems?.(result.problems);
    }
    summary.add(result);
    options.onWorker?.(result);
    done++;
    if (done % EVALUATE_SLICE === 0) {
      options.onProgress?.({ phase: 'evaluating', charsDone, rowsRead: counts.read, workersDone: done, workersTotal: total });
      if (options.pause) await options.pause();
      if (options.signal?.aborted) return null;
    }
  }
  options.onProgress?.({ phase: 'evaluating', charsDone, rowsRead: counts.read, workersDone: done, workersTotal: total });
  return { summary: summary.finish({ read: counts.read, used: counts.used - extraSkipped, skipped: counts.skipped + extraSkipped }), problemCount };
}

/**
 * Runs the checkups on a file given as text chunks (CSV/TSV, or FHIR bulk NDJSON: several files
 * one after another, each started by a `{ file: name }` marker).
 *
 * @example
 * const outcome = await runCheckups([csvText], { context, reader: { today: '2025-01-01' }, format: 'delimited', onWorker: (w) => lines.push(w) });
 * //=> { ok: true, summary: { workers: 40, rows: { read: 180, used: 178, skipped: 2 }, … }, header: { headers: [...], … }, problemCount: 2 }
 */
export async function runCheckups(chunks: AsyncIterable<string | { readonly file: string }> | Iterable<string | { readonly file: string }>, options: RunCheckupsOptions): Promise<CheckupsOutcome> {
  const grouper = new WorkerGrouper();
  let problemCount = 0;
  let charsDone = 0;
  const report = (problems: readonly RowProblem[]) => {
    if (problems.length === 0) return;
    problemCount += problems.length;
    options.onProblems?.(problems);
  };
  let counts: RowCounts;
  let header: HeaderInfo | null = null;
  if (options.format === 'fhir-ndjson') {
    const reader = new FhirBulkReader(options.reader);
    for await (const chunk of chunks) {
      if (typeof chunk !== 'string') {
        reader.startFile(chunk.file);
        continue;
      }
      report(reader.push(chunk).problems);
      charsDone += chunk.length;
      options.onProgress?.({ phase: 'reading', charsDone, rowsRead: reader.counts().read, workersDone: 0, workersTotal: null });
      if (options.pause) await options.pause();
      if (options.signal?.aborted) return CANCELLED;
    }
    const last = reader.end();
    report(last.problems);
    grouper.add(last.rows);
    counts = reader.counts();
  } else {
    const reader = createCheckupTextReader(options.reader);
    for await (const chunk of chunks) {
      if (typeof chunk !== 'string') continue;
      const step = reader.push(chunk);
      if (isRefusal(step)) return { ok: false, refusal: step };
      report(step.problems);
      grouper.add(step.rows);
      charsDone += chunk.length;
      options.onProgress?.({ phase: 'reading', charsDone, rowsRead: reader.counts().read, workersDone: 0, workersTotal: null });
      if (options.pause) await options.pause();
      if (options.signal?.aborted) return CANCELLED;
    }
    const last = reader.end();
    if (isRefusal(last)) return { ok: false, refusal: last };
    report(last.problems);
    grouper.add(last.rows);
    counts = reader.counts();
    header = reader.header;
    if (header) options.onHeader?.(header);
  }
  const empty = noUsableRows(grouper.size === 0 ? { ...counts, used: 0 } : counts);
  if (empty) return { ok: false, refusal: empty };
  const evaluated = await evaluateAll(grouper, counts, options, problemCount, charsDone);
  if (!evaluated) return CANCELLED;
  return { ok: true, summary: evaluated.summary, header, problemCount: evaluated.problemCount };
}

/** The same for a workbook's sheet already read into cells (./xlsx.ts `readXlsxSheet`). */
export async function runCheckupTable(table: readonly (readonly CellValue[])[], options: Omit<RunCheckupsOptions, 'format'>): Promise<CheckupsOutcome> {
  const read = readCheckupTable(table, options.reader);
  if (isRefusal(read)) return { ok: false, refusal: read };
  options.onHeader?.(read.header);
  if (read.step.problems.length > 0) options.onProblems?.(read.step.problems);
  const empty = noUsableRows(read.counts);
  if (empty) return { ok: false, refusal: empty };
  const grouper = new WorkerGrouper();
  grouper.add(read.step.rows);
  const evaluated = await evaluateAll(grouper, read.counts, { ...options, format: 'delimited' }, read.step.problems.length, 0);
  if (!evaluated) return CANCELLED;
  return { ok: true, summary: evaluated.summary, header: read.header, problemCount: evaluated.problemCount };
}
