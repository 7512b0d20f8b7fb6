/**
 * Sorting a long worklist without holding up the page: each column's sort keys are turned once
 * (in the checkups Web Worker) into ranks — a whole number per row, equal for equal keys, in
 * {@link compareKeys} order — and a sort is then a counting sort over those ranks, O(rows), on
 * the page. The order is exactly {@link arrangeWorklist}'s: by key, ties in the file's order,
 * empty values last in either direction.
 */
import { arrangeWorklist, compareKeys, keepRow, WORKLIST_COLUMNS, type WorklistColumn, type WorklistFilter, type WorklistRow, type WorklistSort } from './worklist';

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

/** Every sortable column's ranks for the rows (the notes column has no key). */
export function worklistRanks(rows: readonly WorklistRow[]): Record<WorklistColumn, Int32Array> {
  const out = {} as Record<WorklistColumn, Int32Array>;
  for (const { key } of WORKLIST_COLUMNS) out[key] = rankKeys(rows.map((r) => r.keys[key]));
  return out;
}

/**
 * Row positions in sorted order, by a counting sort over the ranks: stable (file order within a
 * rank), empty values last in both directions.
 *
 * @example
 * orderByRanks(Int32Array.from([1, -1, 0, 1]), 'descending') //=> Int32Array [0, 3, 2, 1]
 */
export function orderByRanks(ranks: Int32Array, direction: WorklistSort['direction']): Int32Array {
  let max = -1;
  for (let i = 0; i < ranks.length; i++) if (ranks[i]! > max) max = ranks[i]!;
  // Buckets 0..max for ranks in the chosen direction, then one for empty values.
  const buckets = max + 2;
  const starts = new Int32Array(buckets + 1);
  const bucketOf = (r: number) => (r === EMPTY_RANK ? buckets - 1 : direction === 'ascending' ? r : max - r);
  for (let i = 0; i < ranks.length; i++) starts[bucketOf(ranks[i]!) + 1]! += 1;
  for (let b = 0; b < buckets; b++) starts[b + 1]! += starts[b]!;
  const order = new Int32Array(ranks.length);
  for (let i = 0; i < ranks.length; i++) order[starts[bucketOf(ranks[i]!)]!++] = i;
  return order;
}

/**
 * The rows shown, as {@link arrangeWorklist} gives them, using the column's ranks when they are
 * known for these rows (rows[i].index === i) and the plain sort otherwise.
 */
export function arrangeWithRanks(rows: readonly WorklistRow[], filter: WorklistFilter, sort: WorklistSort | null, ranks: WorklistRanks | null): WorklistRow[] {
  const columnRanks = sort && ranks ? ranks[sort.column] : undefined;
  if (!sort || !columnRanks || columnRanks.length !== rows.length) {
    if (!sort) return rows.filter((r) => keepRow(r, filter));
    return arrangeWorklist(rows, filter, sort);
  }
  const order = orderByRanks(columnRanks, sort.direction);
  const out: WorklistRow[] = [];
  for (let i = 0; i < order.length; i++) {
    const row = rows[order[i]!]!;
    if (keepRow(row, filter)) out.push(row);
  }
  return out;
}
