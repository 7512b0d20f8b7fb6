/**
 * A run's results packed for the page: every worker's result (lib/workforce WorkerResult) as
 * UTF-8 JSON, back to back in a few large byte arrays, plus each worker's status as one byte.
 *
 * Why: 100,000 results as objects are millions of small objects on the page's heap — taking them
 * from the Web Worker (structured clone) and collecting their garbage held up the page for
 * longer than 50 ms at a time (README, Performance, "The checkups screen in a browser"). Packed,
 * they cross from the worker without a copy (the byte arrays are transferred) and stay off the
 * heap the garbage collector walks; a result becomes an object only when something reads it
 * ({@link packedResultList}: the rows on screen, the handouts chosen, the worker opened).
 *
 * Exactness: JSON writes every finite number exactly (ECMAScript's Number-to-String gives the
 * shortest text that reads back as the same double), and a result is plain data (strings, finite
 * numbers, booleans, null, arrays, objects) — so {@link unpackResult} gives back a result deep-equal
 * to the one packed. (JSON would write −0 as 0 and NaN or ±Infinity as null; the engine gives none
 * of these in a result: a figure it cannot give is null.)
 */
import type { WorkerResult, WorkerStatus } from '../workforce/types';
import { statusCode, statusOfCode } from './statusCode';

/** Results per chunk: a chunk of 4,096 results is about 5 MB of text. */
export const PACKED_CHUNK_RESULTS = 4096;

/** Some consecutive results, packed. */
export interface PackedChunk {
  /** The position of the chunk's first result in the run (0-based, file order of workers). */
  readonly first: number;
  /** The results' JSON, UTF-8, one after another. */
  readonly bytes: Uint8Array;
  /** Where each result's JSON ends in `bytes` (the next one starts there). */
  readonly ends: Uint32Array;
  /** Each result's status, as its code (./statusCode.ts). */
  readonly status: Uint8Array;
}

export interface PackedResults {
  readonly count: number;
  /** In order; every chunk but the last holds `chunkSize` results. */
  readonly chunks: readonly PackedChunk[];
  readonly chunkSize: number;
}

/** The buffers of a chunk, to transfer it to another thread (without a copy; they are then gone here). */
export function packedChunkBuffers(chunk: PackedChunk): ArrayBuffer[] {
  return [chunk.bytes.buffer, chunk.ends.buffer, chunk.status.buffer] as ArrayBuffer[];
}

/** A copy of a chunk (its own buffers), e.g. to transfer one and keep the other. */
export function copyPackedChunk(chunk: PackedChunk): PackedChunk {
  return { first: chunk.first, bytes: chunk.bytes.slice(), ends: chunk.ends.slice(), status: chunk.status.slice() };
}

/**
 * Packs results one at a time (in the worker, as the engine gives them); each full chunk goes
 * to `onChunk` as soon as it is made, the last one when the packer is finished.
 *
 * @example
 * const packer = new ResultsPacker((chunk) => postMessage({ type: 'results', chunk }, packedChunkBuffers(chunk)));
 * for (const result of results) packer.add(result);
 * packer.finish(); //=> { count, chunks, chunkSize }
 */
export class ResultsPacker {
  private readonly encoder = new TextEncoder();
  private readonly chunks: PackedChunk[] = [];
  private bytes = new Uint8Array(1 << 20);
  private used = 0;
  private ends: number[] = [];
  private statuses: number[] = [];
  private count = 0;

  constructor(
    private readonly onChunk: (chunk: PackedChunk) => void = () => {},
    private readonly chunkSize: number = PACKED_CHUNK_RESULTS,
  ) {
    if (!Number.isInteger(chunkSize) || chunkSize < 1) throw new RangeError(`chunkSize must be a whole number ≥ 1 (got ${chunkSize})`);
  }

  add(result: WorkerResult): void {
    const json = JSON.stringify(result);
    // UTF-8 takes at most 3 bytes per UTF-16 code unit.
    const room = this.used + json.length * 3;
    if (room > this.bytes.length) {
      const grown = new Uint8Array(Math.max(room, this.bytes.length * 2));
      grown.set(this.bytes.subarray(0, this.used));
      this.bytes = grown;
    }
    this.used += this.encoder.encodeInto(json, this.bytes.subarray(this.used)).written;
    this.ends.push(this.used);
    this.statuses.push(statusCode(result.status));
    this.count += 1;
    if (this.ends.length === this.chunkSize) this.closeChunk();
  }

  private closeChunk(): void {
    if (this.ends.length === 0) return;
    const chunk: PackedChunk = { first: this.count - this.ends.length, bytes: this.bytes.slice(0, this.used), ends: Uint32Array.from(this.ends), status: Uint8Array.from(this.statuses) };
    this.chunks.push(chunk);
    this.used = 0;
    this.ends = [];
    this.statuses = [];
    this.onChunk(chunk);
  }

  /** Every result packed (the last chunk goes to `onChunk` now); the packer is spent. */
  finish(): PackedResults {
    this.closeChunk();
    return { count: this.count, chunks: this.chunks, chunkSize: this.chunkSize };
  }
}

const DECODER = new TextDecoder();

/** The chunk's result `at` (0-based within the chunk), read back as a new object. */
function unpackAt(chunk: PackedChunk, at: number): WorkerResult {
  const end = chunk.ends[at] ?? 0;
  const start = at === 0 ? 0 : (chunk.ends[at - 1] ?? 0);
  return JSON.parse(DECODER.decode(chunk.bytes.subarray(start, end))) as WorkerResult;
}

/**
 * Result `index` (0-based, file order of workers), read back as a new object.
 * @throws RangeError when there is no such result
 */
export function unpackResult(packed: PackedResults, index: number): WorkerResult {
  const chunk = Number.isInteger(index) && index >= 0 && index < packed.count ? packed.chunks[Math.floor(index / packed.chunkSize)] : undefined;
  if (!chunk) throw new RangeError(`there is no result ${index} (the run has ${packed.count})`);
  return unpackAt(chunk, index - chunk.first);
}

/** A packed result read on demand: `status` from the status column at once, everything else from its JSON, read once when first asked for. */
class PackedWorkerResult implements WorkerResult {
  readonly status: WorkerStatus;
  readonly #chunk: PackedChunk;
  readonly #at: number;
  #result: WorkerResult | null = null;

  constructor(chunk: PackedChunk, at: number) {
    this.#chunk = chunk;
    this.#at = at;
    // A plain field, not a getter: choosing workers by status reads it for every worker.
    this.status = statusOfCode(chunk.status[at] ?? -1) ?? this.#full.status;
  }

  get #full(): WorkerResult {
    this.#result ??= unpackAt(this.#chunk, this.#at);
    return this.#result;
  }

  get worker() {
    return this.#full.worker;
  }
  get age() {
    return this.#full.age;
  }
  get sex() {
    return this.#full.sex;
  }
  get checkups() {
    return this.#full.checkups;
  }
  get latest() {
    return this.#full.latest;
  }
  get run() {
    return this.#full.run;
  }
  get reasons() {
    return this.#full.reasons;
  }
  get referenceRisk() {
    return this.#full.referenceRisk;
  }
  get exposedRisk() {
    return this.#full.exposedRisk;
  }
  get riskDifference() {
    return this.#full.riskDifference;
  }
  get numberNeeded() {
    return this.#full.numberNeeded;
  }
  get horizonYears() {
    return this.#full.horizonYears;
  }
  get warnings() {
    return this.#full.warnings;
  }
  get strata() {
    return this.#full.strata;
  }
  get problems() {
    return this.#full.problems;
  }
  get skippedRows() {
    return this.#full.skippedRows;
  }

  /** The plain result (what JSON.stringify writes). */
  toJSON(): WorkerResult {
    return this.#full;
  }
}

/**
 * A chunk's results, each read from the packed form only when one of its fields is (its status
 * without reading anything). Each is the same object every time it is read and reads like a
 * WorkerResult; to copy one or send it elsewhere use `toJSON()` or {@link unpackResult} (its
 * fields live on its class, so `{ ...result }` would be empty).
 */
export function packedChunkResults(chunk: PackedChunk): WorkerResult[] {
  const list: WorkerResult[] = [];
  for (let at = 0; at < chunk.ends.length; at++) list.push(new PackedWorkerResult(chunk, at));
  return list;
}

/** Every packed result, in order, as {@link packedChunkResults} gives them. */
export function packedResultList(packed: PackedResults): WorkerResult[] {
  return packed.chunks.flatMap(packedChunkResults);
}
