/**
 * Workers' glucose histories from the checkup file, for "open one worker" (issue 10, item 7) and
 * for the own results on batch handouts (item 9). The run keeps only each worker's result, so the
 * file (still in the page's memory) is read again with the same readers and the same confirmed
 * mapping (lib/workforce), keeping the rows of the wanted workers only, in one pass however many
 * they are; the rows become checkups exactly as lib/workforce `evaluateWorker` makes them
 * (lib/glycaemia `mergeSameDate`: same-day rows merged, a conflicting row left out).
 */
import { mergeSameDate } from '../glycaemia/parse';
import type { Checkup } from '../glycaemia/schema';
import { checkupOf } from '../workforce/evaluate';
import { FhirBulkReader } from '../workforce/fhirBulk';
import { createCheckupTextReader, isRefusal, readCheckupTable, type CheckupReaderOptions, type ReadRefusal } from '../workforce/reader';
import type { CellValue, CheckupRow } from '../workforce/types';


/**
 * A worker's rows → their checkups, date order, as the engine evaluated them.
 * @example
 * workerCheckups([{ line: 2, worker: 'W001', date: '2021-04-06', hba1c: { value: 5.9, unit: '%' }, strata: {} }])
 * //=> [{ date: '2021-04-06', hba1c: { value: 5.9, unit: '%' } }]
 */
export function workerCheckups(rows: readonly CheckupRow[]): Checkup[] {
  const checkups = mergeSameDate(rows.map(checkupOf)).checkups;
  return [...checkups].sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
}

/** Each wanted worker's rows, in file order; a wanted worker with no row is absent. */
export type RowsByWorker = Map<string, CheckupRow[]>;

/** Collects the rows of the wanted workers as a file's rows go by. */
function rowKeeper(workers: ReadonlySet<string>) {
  const kept: RowsByWorker = new Map();
  return {
    kept,
    keep(rows: readonly CheckupRow[]) {
      for (const r of rows) {
        if (!workers.has(r.worker)) continue;
        const list = kept.get(r.worker);
        if (list) list.push(r);
        else kept.set(r.worker, [r]);
      }
    },
  };
}

/**
 * The rows of the wanted workers in a file given as text chunks (CSV/TSV, or FHIR bulk NDJSON
 * with `{ file }` markers), read once with the run's reader options; a refusal when the file
 * cannot be read.
 * @example
 * await collectWorkersRows(['Worker,Checkup date,HbA1c (%)\nW001,2021-04-06,5.9\nW002,2021-04-07,5.2\n'], { reader: { today: '2025-06-01' }, format: 'delimited' }, new Set(['W002']))
 * //=> Map { 'W002' => [{ line: 3, worker: 'W002', date: '2021-04-07', hba1c: { value: 5.2, unit: '%' }, strata: {} }] }
 */
export async function collectWorkersRows(
  chunks: AsyncIterable<string | { readonly file: string }> | Iterable<string | { readonly file: string }>,
  options: { readonly reader: CheckupReaderOptions; readonly format: 'delimited' | 'fhir-ndjson' },
  workers: ReadonlySet<string>,
): Promise<RowsByWorker | ReadRefusal> {
  const { kept, keep } = rowKeeper(workers);
  if (options.format === 'fhir-ndjson') {
    const reader = new FhirBulkReader(options.reader);
    for await (const chunk of chunks) {
      if (typeof chunk === 'string') reader.push(chunk);
      else reader.startFile(chunk.file);
    }
    keep(reader.end().rows);
    return kept;
  }
  const reader = createCheckupTextReader(options.reader);
  for await (const chunk of chunks) {
    if (typeof chunk !== 'string') continue;
    const step = reader.push(chunk);
    if (isRefusal(step)) return step;
    keep(step.rows);
  }
  const last = reader.end();
  if (isRefusal(last)) return last;
  keep(last.rows);
  return kept;
}

/** The same for a workbook's sheet already read into cells. */
export function collectWorkersRowsFromTable(table: readonly (readonly CellValue[])[], reader: CheckupReaderOptions, workers: ReadonlySet<string>): RowsByWorker | ReadRefusal {
  const read = readCheckupTable(table, reader);
  return isRefusal(read) ? read : workersRowsFrom(read.step.rows, workers);
}

/**
 * The wanted workers' rows among rows already read: a saved session's (lib/checkups/session.ts
 * keeps the rows the engine read, not the file), in their order.
 * @example
 * workersRowsFrom(session.rows, new Set(['W001'])).get('W001') //=> [{ line: 2, worker: 'W001', date: '2021-03-02', … }, …]
 */
export function workersRowsFrom(rows: readonly CheckupRow[], workers: ReadonlySet<string>): RowsByWorker {
  const { kept, keep } = rowKeeper(workers);
  keep(rows);
  return kept;
}
