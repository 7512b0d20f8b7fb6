/**
 * Sorting a long worklist without holding up the page: each column's sort keys are turned once
 * (in the checkups Web Worker) into ranks — a whole number per row, equal for equal keys, in
 * {@link compareKeys} order — and a sort is then a counting sort over those ranks, O(rows), on
 * the page. The order is exactly {@link arrangeWorklist}'s: by key, ties in the file's order,
 * empty values last in either direction.
 */
import { arrangeWorklist, compareKeys, WORKLIST_COLUMNS, type WorklistColumn, type WorklistFilter, type WorklistRow, type WorklistSort } from './worklist';
import { arrangeColumns, worklistColumnsOf } from './worklistColumns';

/** Rank of an empty (null) key: always last. */
export const EMPTY_RANK = -1;

/** Each column's ranks, one per row in file order. */
export type WorklistRanks = Readonly<Partial<Record<WorklistColumn, Int32Array>>>;

/**
 * Ranks of one column's keys: 0 for the smallest, equal keys equal ranks, {@link EMPTY_RANK} for empty.
 *
 * @example
 * rankKeys([3, null, 1, 3]) //=> Int32Array [1, -1, 0, 1]
 */
export function rankKeys(keys: readonly (string | number | null)[]): Int32Array {
  const ranks = new Int32Array(keys.length).fill(EMPTY_RANK);
  const distinct = [...new Set(keys.filter((k): k is string | number => k !== null))].sort(compareKeys);
  const rankOf = new Map<string | number, number>();
  let rank = -1;
  let previous: string | number | undefined;
  for (const key of distinct) {
    if (previous === undefined || compareKeys(previous, key) !== 0) rank += 1;
    rankOf.set(key, rank);
    previous = key;
  }
  keys.forEach((k, i) => {
    if (k !== null) ranks[i] = rankOf.get(k) ?? EMPTY_RANK;
  });
  return ranks;
}

/**
 * Each column's sort keys, collected row by row (in the worker, from `worklistKeys` of each
 * result, so no display row is made there), then ranked.
 */
export class WorklistKeyColumns {
  private readonly keys = Object.fromEntries(WORKLIST_COLUMNS.map((c) => [c.key, [] as (string | number | null)[]])) as Record<WorklistColumn, (string | number | null)[]>;

  add(keys: Readonly<Record<WorklistColumn, string | number | null>>): void {
    for (const { key } of WORKLIST_COLUMNS) this.keys[key].push(keys[key]);
  }

  /** Every column's ranks (the notes column has no key: all empty). */
  ranks(): Record<WorklistColumn, Int32Array> {
    const out = {} as Record<WorklistColumn, Int32Array>;
    for (const { key } of WORKLIST_COLUMNS) out[key] = rankKeys(this.keys[key]);
    return out;
  }
}

/** Every sortable column's ranks for the rows (the notes column has no key). */
export function worklistRanks(rows: readonly WorklistRow[]): Record<WorklistColumn, Int32Array> {
  const columns = new WorklistKeyColumns();
  for (const row of rows) columns.add(row.keys);
  return columns.ranks();
}

/** A column's ranks when they are known for these many rows, else null. */
export function columnRanks(ranks: WorklistRanks | null, column: WorklistColumn, count: number): Int32Array | null {
  const found = ranks?.[column];
  return found && found.length === count ? found : null;
}

/**
 * Row positions in sorted order, by a counting sort over the ranks: stable (file order within a
 * rank), empty values last in both directions.
 *
 * @example
 * orderByRanks(Int32Array.from([1, -1, 0, 1]), 'descending') //=> Int32Array [0, 3, 2, 1]
 */
export function orderByRanks(ranks: Int32Array, direction: WorklistSort['direction']): Int32Array {
  // Plain loops, no callbacks: this runs once per click, on up to 100,000 rows, often before the
  // browser has optimised it.
  const n = ranks.length;
  let max = -1;
  for (let i = 0; i < n; i++) if (ranks[i]! > max) max = ranks[i]!;
  // Buckets 0..max for ranks in the chosen direction, then one for empty values.
  const empty = max + 1;
  const ascending = direction === 'ascending';
  const bucket = new Int32Array(n);
  const starts = new Int32Array(empty + 2);
  for (let i = 0; i < n; i++) {
    const r = ranks[i]!;
    const b = r === EMPTY_RANK ? empty : ascending ? r : max - r;
    bucket[i] = b;
    starts[b + 1]! += 1;
  }
  for (let b = 0; b <= empty; b++) starts[b + 1]! += starts[b]!;
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[starts[bucket[i]!]!++] = i;
  return order;
}

/** Each column's rows in sorted order, both ways, as {@link orderByRanks} gives them. */
export type WorklistOrders = Readonly<Partial<Record<WorklistColumn, { readonly ascending: Int32Array; readonly descending: Int32Array }>>>;

/** Every column's orders both ways, from its ranks (made in the worker, so a sort on the page has nothing to compute). */
export function worklistOrders(ranks: WorklistRanks): WorklistOrders {
  const out: Partial<Record<WorklistColumn, { ascending: Int32Array; descending: Int32Array }>> = {};
  for (const { key } of WORKLIST_COLUMNS) {
    const r = ranks[key];
    if (r) out[key] = { ascending: orderByRanks(r, 'ascending'), descending: orderByRanks(r, 'descending') };
  }
  return out;
}

const ORDERS = new WeakMap<Int32Array, { ascending?: Int32Array; descending?: Int32Array }>();

/**
 * {@link orderByRanks}, made once per ranks and direction and then remembered (or given ahead by
 * {@link rememberOrders}).
 */
export function sortedOrder(ranks: Int32Array, direction: WorklistSort['direction']): Int32Array {
  let known = ORDERS.get(ranks);
  if (!known) {
    known = {};
    ORDERS.set(ranks, known);
  }
  return (known[direction] ??= orderByRanks(ranks, direction));
}

/**
 * Remembers each column's orders made elsewhere (the worker's {@link worklistOrders}) for its ranks.
 * @throws RangeError when an order is not as long as its column's ranks
 */
export function rememberOrders(ranks: WorklistRanks, orders: WorklistOrders): void {
  for (const { key } of WORKLIST_COLUMNS) {
    const r = ranks[key];
    const o = orders[key];
    if (!r || !o) continue;
    if (o.ascending.length !== r.length || o.descending.length !== r.length) throw new RangeError(`the orders of the ${key} column are not for its ${r.length} rows`);
    ORDERS.set(r, { ascending: o.ascending, descending: o.descending });
  }
}

/**
 * The rows shown, as {@link arrangeWorklist} gives them, using the column's ranks when they are
 * known for these rows (rows[i].index === i) and the plain sort otherwise.
 */
export function arrangeWithRanks(rows: readonly WorklistRow[], filter: WorklistFilter, sort: WorklistSort | null, ranks: WorklistRanks | null): WorklistRow[] {
  const known = sort ? columnRanks(ranks, sort.column, rows.length) : null;
  if (sort && !known) return arrangeWorklist(rows, filter, sort);
  const shown = arrangeColumns(worklistColumnsOf(rows), filter, sort && known ? orderByRanks(known, sort.direction) : null);
  return Array.from(shown, (i) => rows[i]!);
}
