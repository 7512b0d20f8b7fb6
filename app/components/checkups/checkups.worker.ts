/// <reference lib="webworker" />
/**
 * The checkups run off the main thread: lib/workforce's runCheckups / runCheckupTable, exactly as
 * lib/workforce/index.ts documents, with progress, batches of results and cancellation.
 */
import { createCheckupTextReader, isRefusal, prepareCheckups, readCheckupTable, readXlsxSheet, runCheckups, runCheckupTable, type WorkerResult } from '@/lib/workforce';
import { collectWorkerRows, collectWorkerRowsFromTable, workerCheckups } from '@/lib/checkups/workerHistory';
import type { FromWorker, ToWorker } from './protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (message: FromWorker) => scope.postMessage(message);
const SLICE = 1 << 20;
const PREVIEW_BYTES = 64 * 1024;
let controller: AbortController | null = null;

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

async function run(data: Extract<ToWorker, { type: 'run' }>): Promise<void> {
  controller = new AbortController();
  const context = prepareCheckups({ evidence: data.evidence, table: data.table, criteria: data.criteria, ...(data.horizon !== null ? { horizonYears: data.horizon } : {}) });
  if (!context.ok) return post({ type: 'refused', messages: context.issues.map((i) => i.message) });
  let batch: WorkerResult[] = [];
  const flush = () => {
    if (batch.length > 0) post({ type: 'workers', workers: batch });
    batch = [];
  };
  const options = {
    context: context.value,
    reader: { today: data.today, ...(data.mapping ? { mapping: data.mapping } : {}) },
    signal: controller.signal,
    pause: () => {
      flush();
      return new Promise<void>((resolve) => setTimeout(resolve, 0));
    },
    onWorker: (w: WorkerResult) => {
      batch.push(w);
      if (batch.length >= 500) flush();
    },
    onProblems: (problems: readonly import('@/lib/workforce').RowProblem[]) => post({ type: 'problems', problems }),
    onProgress: (progress: import('@/lib/workforce').CheckupsProgress) => post({ type: 'progress', progress }),
  };
  let outcome;
  if (data.kind === 'xlsx') {
    const file = data.files[0];
    const sheet = file ? await readXlsxSheet(file) : null;
    if (!sheet) return post({ type: 'refused', messages: ['No file was given'] });
    outcome = isRefusal(sheet) ? ({ ok: false, refusal: sheet } as const) : await runCheckupTable(sheet.rows, options);
  } else {
    outcome = await runCheckups(slices(data.files, data.kind === 'fhir-ndjson'), { ...options, format: data.kind });
  }
  flush();
  post({ type: 'done', outcome });
}

/** One worker's checkups, read again from the same files with the same mapping. */
async function history(data: Extract<ToWorker, { type: 'history' }>): Promise<void> {
  const reader = { today: data.today, ...(data.mapping ? { mapping: data.mapping } : {}) };
  let rows;
  if (data.kind === 'xlsx') {
    const file = data.files[0];
    const sheet = file ? await readXlsxSheet(file) : null;
    rows = !sheet ? null : isRefusal(sheet) ? sheet : collectWorkerRowsFromTable(sheet.rows, reader, data.worker);
  } else {
    rows = await collectWorkerRows(slices(data.files, data.kind === 'fhir-ndjson'), { reader, format: data.kind }, data.worker);
  }
  if (!rows || isRefusal(rows)) return post({ type: 'history', worker: data.worker, checkups: null, message: rows ? rows.message : 'No file was given' });
  post({ type: 'history', worker: data.worker, checkups: workerCheckups(rows), message: null });
}

scope.onmessage = (event: MessageEvent<ToWorker>) => {
  const data = event.data;
  if (data.type === 'cancel') {
    controller?.abort();
    return;
  }
  if (data.type === 'preview') void preview(data);
  else if (data.type === 'history') void history(data);
  else void run(data);
};
