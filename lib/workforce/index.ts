/**
 * Workforce checkups: a whole workforce's yearly HbA1c / fasting glucose results → each worker's
 * history, status and figures → the workforce summary. Pure (no DOM, no Node), so the command
 * (`hundredfold checkups`, lib/cli/commands/checkups.ts) and the screen (in a Web Worker) run the
 * same code and get the same numbers.
 *
 * ## The steps (each its own module)
 *
 * | step | function | module |
 * |---|---|---|
 * | columns: header → field, --map overrides, problems, identifying columns | `proposeMapping(headers, overrides?)` → `{ mapping, problems, notes }` | ./columns.ts |
 * | CSV/TSV text chunks → rows + row problems | `createCheckupTextReader({ today, overrides? \| mapping? })` → `{ push(chunk), end(), header, counts() }` | ./reader.ts |
 * | workbook → cells (lazy `read-excel-file`) | `await readXlsxSheet(arrayBufferOrBlob, sheet?)` → `{ sheet, sheets, rows }` or a refusal | ./xlsx.ts |
 * | workbook cells → rows + row problems | `readCheckupTable(rows, { today, overrides? \| mapping? })` | ./reader.ts |
 * | FHIR bulk NDJSON chunks → rows | `new FhirBulkReader({ today })`: `startFile(name)`, `push(chunk)`, `end()`, `counts()` | ./fhirBulk.ts |
 * | rows → workers (order of first appearance) | `new WorkerGrouper()` (any order) / `new StreamingGrouper(confirmed?)` (grouped files, flat memory) | ./group.ts |
 * | is a file grouped by worker? (a quick pass over one column) | `new ColumnScanner(delimiter, column, onCell)` feeding `new GroupingCheck()`; its `suspects` (Bloom filter "seen", maybe false) settled exactly by `new RunCounter(suspects)` in a second quick pass | ./delimited.ts, ./group.ts |
 * | settings, checked once | `prepareCheckups({ evidence, table, criteria, horizonYears?, columnNames? })` → `Result<CheckupsContext>` | ./evaluate.ts |
 * | one worker | `evaluateWorker({ worker, rows }, context)` → `WorkerResult` | ./evaluate.ts |
 * | one worker's scenario (for "open one worker") | `workerScenario(result, context)` → `Scenario \| null` | ./evaluate.ts |
 * | summary | `summariseWorkforce(results, rowCounts)`, or `new SummaryAccumulator()`: `add(result)`, `finish(rowCounts)` | ./summary.ts |
 * | everything, incrementally | `await runCheckups(chunks, { context, reader, format, onWorker, onProblems, onProgress, pause, signal })` | ./run.ts |
 *
 * Every reader returns data, never throws: row problems `{ line, column, code, message }` (the
 * row is skipped, the rest go on) and refusals `{ refused: true, code, message, problems }` for a
 * file that cannot be used whole (no header, an unsettled mapping, no usable row, not a workbook).
 *
 * ## In a Web Worker (the screen, issue "Workforce checkups, part 2")
 *
 * ```ts
 * // checkups.worker.ts
 * import { prepareCheckups, runCheckups, readXlsxSheet, runCheckupTable, proposeMapping } from '@/lib/workforce';
 * let controller: AbortController | null = null;
 * self.onmessage = async ({ data }) => {
 *   if (data.type === 'cancel') return controller?.abort();
 *   controller = new AbortController();
 *   const context = prepareCheckups({ evidence: data.evidence, table: data.table, criteria: data.criteria, horizonYears: data.horizon });
 *   if (!context.ok) return postMessage({ type: 'refused', issues: context.issues });
 *   const options = {
 *     context: context.value,
 *     reader: { today: data.today, mapping: data.mapping },     // the mapping the physician confirmed
 *     signal: controller.signal,
 *     pause: () => new Promise<void>((r) => setTimeout(r, 0)),    // lets the cancel message in
 *     onWorker: (w) => batch.push(w),                             // post in batches of a few hundred
 *     onProblems: (p) => postMessage({ type: 'problems', p }),
 *     onProgress: (p) => postMessage({ type: 'progress', p }),    // rows read, workers done / total
 *   };
 *   const outcome = data.kind === 'xlsx'
 *     ? await (async () => { const s = await readXlsxSheet(data.file); return 'refused' in s ? { ok: false, refusal: s } : runCheckupTable(s.rows, options); })()
 *     : await runCheckups(sliceFile(data.file, 1 << 20), { ...options, format: data.kind }); // async generator of text slices
 *   postMessage({ type: 'done', outcome });                       // { ok, summary } | { ok: false, refusal } | { ok: false, cancelled }
 * };
 * ```
 *
 * Before processing, the screen shows the columns: push the first slice into
 * `createCheckupTextReader({ today })` (or `readCheckupTable` for a workbook) and read `.header`
 * (`headers`, `sample`, `proposal.mapping.columns` with each column's field, `proposal.problems`
 * to settle, `proposal.notes` — identifying columns left out). Everything crossing postMessage is
 * plain data.
 *
 * ## Status of a worker
 * `exposed` / `comparison` (the evidence entry's exposure and comparison definitions, lib/glycaemia
 * `exposureStatus`), `neither` (with the reason in words), `diabetes-range` (latest result in the
 * diabetes range: a follow-up note, never a diagnosis), `insufficient` (too few results, a gap,
 * or results the deciding test cannot classify). Figures (`referenceRisk`, `exposedRisk`,
 * `riskDifference`, `numberNeeded`) only for `exposed` and `comparison`, exactly as
 * lib/engine `computeScenario` gives them.
 */
export * from './types';
export * from './columns';
export * from './rows';
export * from './delimited';
export * from './reader';
export * from './fhirBulk';
export * from './xlsx';
export * from './group';
export * from './evaluate';
export * from './summary';
export * from './run';
