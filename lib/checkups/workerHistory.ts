/**
 * One worker's glucose history from the checkup file, for "open one worker" (issue 10, item 7).
 * The run keeps only each worker's result, so the file (still in the page's memory) is read again
 * with the same readers and the same confirmed mapping (lib/workforce), keeping that worker's
 * rows only; the rows become checkups exactly as lib/workforce `evaluateWorker` makes them
 * (lib/glycaemia `mergeSameDate`: same-day rows merged, a conflicting row left out).
 */
import { mergeSameDate } from '../glycaemia/parse';
import type { Checkup } from '../glycaemia/schema';
import { FhirBulkReader } from '../workforce/fhirBulk';
import { createCheckupTextReader, isRefusal, readCheckupTable, type CheckupReaderOptions, type ReadRefusal } from '../workforce/reader';
import type { CellValue, CheckupRow } from '../workforce/types';

function checkupOf(row: CheckupRow): Checkup {
  return { date: row.date, ...(row.hba1c ? { hba1c: row.hba1c } : {}), ...(row.fpg ? { fpg: row.fpg } : {}) };
}

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

/**
 * The rows of one worker in a file given as text chunks (CSV/TSV, or FHIR bulk NDJSON with
 * `{ file }` markers), read with the run's reader options; a refusal when the file cannot be read.
 */
export async function collectWorkerRows(
  chunks: AsyncIterable<string | { readonly file: string }> | Iterable<string | { readonly file: string }>,
  options: { readonly reader: CheckupReaderOptions; readonly format: 'delimited' | 'fhir-ndjson' },
  worker: string,
): Promise<CheckupRow[] | ReadRefusal> {
  const kept: CheckupRow[] = [];
  const keep = (rows: readonly CheckupRow[]) => {
    for (const r of rows) if (r.worker === worker) kept.push(r);
  };
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
export function collectWorkerRowsFromTable(table: readonly (readonly CellValue[])[], reader: CheckupReaderOptions, worker: string): CheckupRow[] | ReadRefusal {
  const read = readCheckupTable(table, reader);
  if (isRefusal(read)) return read;
  return read.step.rows.filter((r) => r.worker === worker);
}
