/**
 * Rows → workers, in the order each worker first appears.
 *
 * Two ways, same result:
 * - {@link WorkerGrouper} keeps every row until the end (any file order; memory grows with rows);
 * - {@link StreamingGrouper} hands a worker over as soon as the next worker's row arrives, so a
 *   file already grouped by worker (each worker's rows together) is processed with memory flat
 *   in the number of workers. It notices a worker who comes back after another worker's rows
 *   ({@link StreamingGrouper.ungrouped}); the caller then reads the file whole with
 *   {@link WorkerGrouper} instead. It remembers finished workers in a fixed-size Bloom filter
 *   (Bloom 1970, Commun ACM 13:422): a false "seen before" costs only the fallback, never a
 *   wrong result, and memory stays fixed.
 */
import type { CheckupRow, WorkerRows } from './types';

/** Collects every row; {@link WorkerGrouper.workers} gives the workers in order of first appearance. */
export class WorkerGrouper {
  private readonly byWorker = new Map<string, CheckupRow[]>();

  add(rows: readonly CheckupRow[]): void {
    for (const row of rows) {
      const list = this.byWorker.get(row.worker);
      if (list) list.push(row);
      else this.byWorker.set(row.worker, [row]);
    }
  }

  get size(): number {
    return this.byWorker.size;
  }

  /** Every worker, in order of first appearance. */
  *workers(): Generator<WorkerRows> {
    for (const [worker, rows] of this.byWorker) yield { worker, rows };
  }
}

/** A fixed-size Bloom filter of strings (FNV-1a hashes, double hashing; Kirsch & Mitzenmacher 2006). */
export class BloomFilter {
  private readonly bits: Uint32Array;
  private readonly size: number;

  constructor(
    bitsLog2 = 24,
    private readonly hashes = 7,
  ) {
    this.size = 2 ** bitsLog2;
    this.bits = new Uint32Array(this.size / 32);
  }

  private positions(text: string): number[] {
    let h1 = 0x811c9dc5;
    let h2 = 0x01000193;
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      h1 = Math.imul(h1 ^ c, 0x01000193) >>> 0;
      h2 = Math.imul(h2 ^ c, 0x5bd1e995) >>> 0;
    }
    h2 = (h2 | 1) >>> 0;
    const out: number[] = [];
    for (let k = 0; k < this.hashes; k++) out.push((h1 + Math.imul(k, h2)) % this.size >>> 0);
    return out;
  }

  add(text: string): void {
    for (const p of this.positions(text)) this.bits[p >>> 5]! |= 1 << (p & 31);
  }

  mightHave(text: string): boolean {
    return this.positions(text).every((p) => (this.bits[p >>> 5]! & (1 << (p & 31))) !== 0);
  }
}

/**
 * Whether worker ids arrive grouped (each worker's rows together), fed one id per row; for a
 * quick first pass over a file that reads only the worker column.
 */
export class GroupingCheck {
  private current: string | null = null;
  private readonly done = new BloomFilter();
  grouped = true;

  /** Feeds the next row's worker id; false once a finished worker comes back. */
  add(worker: string): boolean {
    if (!this.grouped || worker === this.current) return this.grouped;
    if (this.done.mightHave(worker)) {
      this.grouped = false;
      return false;
    }
    if (this.current !== null) this.done.add(this.current);
    this.current = worker;
    return true;
  }
}

/**
 * Hands over each worker once the next worker's row arrives.
 *
 * @example
 * const g = new StreamingGrouper();
 * g.add([w1row, w1row, w2row]) //=> [{ worker: 'W1', rows: [w1row, w1row] }]
 * g.end()                      //=> [{ worker: 'W2', rows: [w2row] }]
 */
export class StreamingGrouper {
  private current: { worker: string; rows: CheckupRow[] } | null = null;
  private readonly done = new BloomFilter();
  /** Set when a finished worker's id appears again: the file is not grouped by worker. */
  ungrouped: { readonly worker: string; readonly line: number } | null = null;

  /** The workers completed by these rows. Once {@link ungrouped} is set, nothing more is handed over. */
  add(rows: readonly CheckupRow[]): WorkerRows[] {
    const out: WorkerRows[] = [];
    if (this.ungrouped) return out;
    for (const row of rows) {
      if (this.current && this.current.worker === row.worker) {
        this.current.rows.push(row);
        continue;
      }
      if (this.done.mightHave(row.worker)) {
        this.ungrouped = { worker: row.worker, line: row.line };
        return out;
      }
      if (this.current) {
        this.done.add(this.current.worker);
        out.push(this.current);
      }
      this.current = { worker: row.worker, rows: [row] };
    }
    return out;
  }

  /** The last worker. */
  end(): WorkerRows[] {
    if (this.ungrouped || !this.current) return [];
    const last = this.current;
    this.current = null;
    return [last];
  }
}
