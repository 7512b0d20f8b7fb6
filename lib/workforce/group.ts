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
  /** size − 1 when the size is at most 2^30 (then `x mod size` is `x & mask` for any uint32 x), else −1. */
  private readonly mask: number;
  private h1 = 0;
  private h2 = 0;

  constructor(
    bitsLog2 = 24,
    private readonly hashes = 7,
  ) {
    this.size = 2 ** bitsLog2;
    this.mask = bitsLog2 <= 30 ? this.size - 1 : -1;
    this.bits = new Uint32Array(Math.ceil(this.size / 32));
  }

  /** The two hashes of a text (into h1, h2: no allocation per call). */
  private hash(text: string): void {
    let h1 = 0x811c9dc5;
    let h2 = 0x01000193;
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      h1 = Math.imul(h1 ^ c, 0x01000193) >>> 0;
      h2 = Math.imul(h2 ^ c, 0x5bd1e995) >>> 0;
    }
    this.h1 = h1;
    this.h2 = (h2 | 1) >>> 0;
  }

  /** Bit k of the text: (h1 + k·h2) mod 2^32, then mod the size (never negative, never past the end). */
  private position(k: number): number {
    const x = (this.h1 + Math.imul(k, this.h2)) >>> 0;
    // The low bits by a mask (integer arithmetic) rather than a remainder of a number past 2^31 (floating point).
    return this.mask >= 0 ? x & this.mask : x % this.size;
  }

  add(text: string): void {
    this.hash(text);
    for (let k = 0; k < this.hashes; k++) {
      const p = this.position(k);
      this.bits[p >>> 5]! |= 1 << (p & 31);
    }
  }

  mightHave(text: string): boolean {
    this.hash(text);
    for (let k = 0; k < this.hashes; k++) {
      const p = this.position(k);
      if ((this.bits[p >>> 5]! & (1 << (p & 31))) === 0) return false;
    }
    return true;
  }
}

/**
 * Most ids {@link GroupingCheck} keeps to confirm; past that the file is taken as not grouped (read
 * whole). A grouped file of a million workers gives about 500 (2^24 bits, 7 hashes); an ungrouped
 * one reaches this soon.
 */
export const MAX_SUSPECTS = 10_000;

/**
 * Whether worker ids arrive grouped (each worker's rows together), fed one id per row; for a
 * quick first pass over a file that reads only the worker column.
 *
 * A finished worker's id is remembered in a fixed-size Bloom filter, which can answer "seen" for
 * an id never seen (about 1 in 2,000 new ids once a million workers are in it). Such ids are
 * {@link GroupingCheck.suspects}: whether one of them truly comes back is settled exactly by
 * counting their runs ({@link countRuns}) in a second quick pass, so a false "seen" never sends a
 * grouped file to the whole read. An id found back next to itself (a worker's rows together) is
 * never a suspect.
 */
export class GroupingCheck {
  private current: string | null = null;
  private readonly done: BloomFilter;
  /** Ids the filter says came before: each may be a false "seen"; confirm with {@link countRuns}. */
  readonly suspects = new Set<string>();
  grouped = true;

  /** @param bitsLog2 - the filter's size (2^bitsLog2 bits); the same as the StreamingGrouper's that follows */
  constructor(bitsLog2 = 24) {
    this.done = new BloomFilter(bitsLog2);
  }

  /** Feeds the next row's worker id; false once the file is known not to be grouped. */
  add(worker: string): boolean {
    if (!this.grouped || worker === this.current) return this.grouped;
    if (this.done.mightHave(worker)) {
      if (this.suspects.has(worker) || this.suspects.size >= MAX_SUSPECTS) {
        // A suspect seen starting a second run is certainly back; too many suspects: give up streaming.
        this.grouped = false;
        return false;
      }
      this.suspects.add(worker);
    }
    if (this.current !== null) this.done.add(this.current);
    this.current = worker;
    return true;
  }
}

/**
 * How many separate runs (blocks of consecutive rows) each of some ids has, fed one id per row:
 * an id with two runs makes the file not grouped. The second pass of {@link GroupingCheck}.
 */
export class RunCounter {
  private current: string | null = null;
  private readonly runs = new Map<string, number>();
  grouped = true;

  constructor(private readonly ids: ReadonlySet<string>) {}

  add(worker: string): boolean {
    if (!this.grouped || worker === this.current) return this.grouped;
    this.current = worker;
    if (!this.ids.has(worker)) return true;
    const runs = (this.runs.get(worker) ?? 0) + 1;
    this.runs.set(worker, runs);
    if (runs > 1) this.grouped = false;
    return this.grouped;
  }
}

/**
 * Hands over each worker once the next worker's row arrives.
 *
 * @param confirmed - ids a first pass confirmed to have one run each ({@link GroupingCheck}
 *   suspects that {@link RunCounter} cleared): the Bloom filter's "seen" for them is false.
 *   The filter holds only ids of rows that were read, a subset of the first pass's, so each
 *   "seen" it gives for a new id the first pass gave too (same size, same hashes).
 * @param bitsLog2 - the filter's size; the same as the GroupingCheck's
 *
 * @example
 * const g = new StreamingGrouper();
 * g.add([w1row, w1row, w2row]) //=> [{ worker: 'W1', rows: [w1row, w1row] }]
 * g.end()                      //=> [{ worker: 'W2', rows: [w2row] }]
 */
export class StreamingGrouper {
  private current: { worker: string; rows: CheckupRow[] } | null = null;
  private readonly done: BloomFilter;
  /** Set when a finished worker's id appears again: the file is not grouped by worker. */
  ungrouped: { readonly worker: string; readonly line: number } | null = null;

  constructor(
    private readonly confirmed: ReadonlySet<string> = new Set(),
    bitsLog2 = 24,
  ) {
    this.done = new BloomFilter(bitsLog2);
  }

  /** The workers completed by these rows. Once {@link ungrouped} is set, nothing more is handed over. */
  add(rows: readonly CheckupRow[]): WorkerRows[] {
    const out: WorkerRows[] = [];
    if (this.ungrouped) return out;
    for (const row of rows) {
      if (this.current && this.current.worker === row.worker) {
        this.current.rows.push(row);
        continue;
      }
      if (this.done.mightHave(row.worker) && !this.confirmed.has(row.worker)) {
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
