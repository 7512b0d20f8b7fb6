/**
 * The worklist as columns, for a long list: each worker's status, latest category and groups as
 * small whole numbers (with the values they stand for), so that filtering 100,000 rows reads a
 * few typed arrays instead of 100,000 row objects, and the rows themselves are made only when
 * they are shown ({@link lazyWorklistRows}). Built in the checkups Web Worker as results come;
 * sorting uses each column's ranks (./worklistOrder.ts).
 *
 * The rows shown are exactly `arrangeWorklist`'s (./worklist.ts) for the same rows, filter and
 * sort (property-tested): the same filter rule (`keepRow`), the same order.
 */
import type { WorkerResult, WorkerStatus } from '../workforce/types';
import { statusCode } from './statusCode';
import { sortFilterChoices, worklistRow, type WorklistFilter, type WorklistFilterChoices, type WorklistRow } from './worklist';

/** Code of a group a worker has no value for. */
export const NO_VALUE = 0xffffffff;

export interface WorklistStratumColumn {
  readonly name: string;
  /** The values, by code (order of first appearance). */
  readonly values: readonly string[];
  /** Each worker's value's code, or {@link NO_VALUE}. */
  readonly codes: Uint32Array;
}

export interface WorklistColumns {
  readonly count: number;
  /** Each worker's status, as its code (./statusCode.ts). */
  readonly status: Uint8Array;
  /** The latest categories, by code (order of first appearance). */
  readonly categories: readonly string[];
  readonly category: Uint32Array;
  readonly strata: readonly WorklistStratumColumn[];
}

/** What a row is filtered by (a WorklistRow has it; so do worklistCategory and worklistStrata of a result). */
export type WorklistGroups = Pick<WorklistRow, 'status' | 'category' | 'strata'>;

function grown<T extends Uint8Array | Uint32Array>(array: T, length: number, make: (n: number) => T, fill?: number): T {
  if (length <= array.length) return array;
  const next = make(Math.max(length, array.length * 2));
  if (fill !== undefined) next.fill(fill, array.length);
  next.set(array);
  return next;
}

/**
 * Builds the columns one row at a time.
 * @example
 * const builder = new WorklistColumnsBuilder();
 * builder.add({ status: 'exposed', category: 'prediabetes', strata: { site: 'North' } });
 * builder.finish().strata[0] //=> { name: 'site', values: ['North'], codes: Uint32Array [0] }
 */
export class WorklistColumnsBuilder {
  private count = 0;
  private status = new Uint8Array(1024);
  private category = new Uint32Array(1024);
  private readonly categories = new Map<string, number>();
  private readonly strata = new Map<string, { values: Map<string, number>; codes: Uint32Array }>();

  add(row: WorklistGroups): void {
    const i = this.count;
    this.status = grown(this.status, i + 1, (n) => new Uint8Array(n));
    this.category = grown(this.category, i + 1, (n) => new Uint32Array(n));
    this.status[i] = statusCode(row.status);
    this.category[i] = code(this.categories, row.category);
    for (const [name, value] of Object.entries(row.strata)) {
      let column = this.strata.get(name);
      if (!column) {
        column = { values: new Map(), codes: new Uint32Array(Math.max(1024, i + 1)).fill(NO_VALUE) };
        this.strata.set(name, column);
      }
      column.codes = grown(column.codes, i + 1, (n) => new Uint32Array(n), NO_VALUE);
      column.codes[i] = code(column.values, value);
    }
    this.count += 1;
  }

  finish(): WorklistColumns {
    const n = this.count;
    const strata = [...this.strata.entries()].map(([name, c]) => {
      const codes = new Uint32Array(n).fill(NO_VALUE);
      codes.set(c.codes.subarray(0, Math.min(n, c.codes.length)));
      return { name, values: [...c.values.keys()], codes };
    });
    return { count: n, status: this.status.slice(0, n), categories: [...this.categories.keys()], category: this.category.slice(0, n), strata };
  }
}

function code(dictionary: Map<string, number>, value: string): number {
  let c = dictionary.get(value);
  if (c === undefined) {
    c = dictionary.size;
    dictionary.set(value, c);
  }
  return c;
}

/** The typed arrays inside the columns, to transfer with them to the page. */
export function worklistColumnsBuffers(columns: WorklistColumns): ArrayBuffer[] {
  return [columns.status.buffer, columns.category.buffer, ...columns.strata.map((s) => s.codes.buffer)] as ArrayBuffer[];
}

/** The columns of some rows (a short list made on the page, or a test). */
export function worklistColumnsOf(rows: readonly WorklistGroups[]): WorklistColumns {
  const builder = new WorklistColumnsBuilder();
  for (const row of rows) builder.add(row);
  return builder.finish();
}

/** The filters' choices: `worklistFilterChoices` of the same rows, from the columns' values. */
export function columnsFilterChoices(columns: WorklistColumns): WorklistFilterChoices {
  return sortFilterChoices(columns.categories, columns.strata.flatMap((s) => s.values.map((value) => ({ name: s.name, value }))));
}

/**
 * A test of one row by position: `keepRow`'s rule (./worklist.ts), read from the columns.
 */
export function keepIndex(columns: WorklistColumns, filter: WorklistFilter): (index: number) => boolean {
  const status = filter.status ? statusCode(filter.status) : null;
  const category = filter.category ? columns.categories.indexOf(filter.category) : null;
  const stratum = filter.stratum ? columns.strata.find((s) => s.name === filter.stratum?.name) : undefined;
  const stratumCode = filter.stratum ? (stratum ? stratum.values.indexOf(filter.stratum.value) : -1) : null;
  if (category === -1 || stratumCode === -1) return () => false;
  return (i) => (status === null || columns.status[i] === status) && (category === null || columns.category[i] === category) && (stratumCode === null || stratum?.codes[i] === stratumCode);
}

const FILE_ORDER = new WeakMap<WorklistColumns, Int32Array>();

/**
 * Every row's position in the file's order (0, 1, 2, …), made once for the columns and then
 * remembered: what the worklist shows before any filter or sort.
 */
export function fileOrder(columns: WorklistColumns): Int32Array {
  let order = FILE_ORDER.get(columns);
  if (!order) {
    order = new Int32Array(columns.count);
    for (let i = 0; i < order.length; i++) order[i] = i;
    FILE_ORDER.set(columns, order);
  }
  return order;
}

/**
 * The positions of the rows shown, in order: `order` (a sort's row positions, ./worklistOrder.ts
 * `orderByRanks`) or the file's order when null, keeping the rows that pass the filter. Without a
 * filter this is `order` (or {@link fileOrder}) itself: never change what it gives.
 *
 * @example
 * arrangeColumns(columns, { status: 'exposed' }, null) //=> Int32Array [0, 2] (rows 0 and 2 exposed)
 */
export function arrangeColumns(columns: WorklistColumns, filter: WorklistFilter, order: Int32Array | null): Int32Array {
  const n = order ? order.length : columns.count;
  if (!filter.status && !filter.category && !filter.stratum) return order ?? fileOrder(columns);
  const keep = keepIndex(columns, filter);
  const out = new Int32Array(n);
  let kept = 0;
  for (let k = 0; k < n; k++) {
    const i = order ? order[k]! : k;
    if (keep(i)) out[kept++] = i;
  }
  return kept === n ? out : out.slice(0, kept);
}

/** A worklist row made from its result when one of its fields is first read (its status and position at once). */
class LazyWorklistRow implements WorklistRow {
  readonly index: number;
  readonly status: WorkerStatus;
  readonly #result: WorkerResult;
  #row: WorklistRow | null = null;

  constructor(result: WorkerResult, index: number) {
    this.index = index;
    this.status = result.status;
    this.#result = result;
  }

  get #made(): WorklistRow {
    this.#row ??= worklistRow(this.#result, this.index);
    return this.#row;
  }
  get worker() {
    return this.#made.worker;
  }
  get category() {
    return this.#made.category;
  }
  get strata() {
    return this.#made.strata;
  }
  get cells() {
    return this.#made.cells;
  }
  get keys() {
    return this.#made.keys;
  }
  toJSON(): WorklistRow {
    return this.#made;
  }
}

/**
 * The worklist rows of some results (e.g. lib/checkups/packedResults `packedChunkResults`), each
 * made (`worklistRow`) only when one of its fields other than its position and status is read.
 * @param first the position of the first result in the run
 */
export function lazyWorklistRows(results: readonly WorkerResult[], first = 0): WorklistRow[] {
  return results.map((result, i) => new LazyWorklistRow(result, first + i));
}

const COLUMNS = new WeakMap<readonly WorklistRow[], WorklistColumns>();

/**
 * Gives `rows` the columns made for them in the worker, for the worklist to find again with
 * {@link columnsOfRows} (so it never reads every row to filter or sort).
 * @throws RangeError when the columns are for another number of rows
 */
export function attachColumns(rows: readonly WorklistRow[], columns: WorklistColumns): readonly WorklistRow[] {
  if (columns.count !== rows.length) throw new RangeError(`the columns are for ${columns.count} rows, not ${rows.length}`);
  COLUMNS.set(rows, columns);
  return rows;
}

/** The columns {@link attachColumns} gave the rows, if any. */
export function columnsOfRows(rows: readonly WorklistRow[]): WorklistColumns | undefined {
  return COLUMNS.get(rows);
}
