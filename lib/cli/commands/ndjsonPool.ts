/**
 * Worker threads for long `compute --ndjson` inputs, so a batch of 100,000 lines uses every
 * core rather than one. The main thread reads the input, cuts it into batches of whole lines
 * and writes the results in input order; workers (and the main thread, when every worker is
 * busy) compute the batches with the same {@link computeBatch} as a single thread would, so
 * the output is byte for byte the same.
 *
 * Threads: `HUNDREDFOLD_THREADS` (a whole number ≥ 1, counting the main thread), else the
 * machine's available parallelism, at most {@link MAX_THREADS}. 1 means no workers.
 * Workers run the command's own bundle (dist/hundredfold.mjs), which registers itself with
 * {@link registerWorkerScript}; without a registered script (e.g. tests importing the source)
 * there is no pool and everything runs on the main thread. A worker that fails has its
 * batches recomputed on the main thread: no line is lost or repeated.
 */
import { availableParallelism } from 'node:os';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';

export interface Batch {
  /** The results, one line each, as text (main thread) or UTF-8 bytes (from a worker). */
  readonly output: string | Uint8Array;
  readonly failed: boolean;
}

type ComputeBatch = (text: string, firstLine: number) => { readonly output: string; readonly failed: boolean };

interface Request {
  readonly id: number;
  readonly text: string;
  readonly firstLine: number;
}

interface Reply {
  readonly id: number;
  readonly output: Uint8Array;
  readonly failed: boolean;
}

/** Marks a worker started by this module, in its workerData. */
const WORKER_MARK = 'hundredfoldNdjsonWorker';
export const MAX_THREADS = 4;
/** Batches a worker holds at once: one computing, one waiting, so it never idles. */
const PER_WORKER = 2;
/** Batches in flight before the reader waits for the oldest to be written. */
const QUEUE_LIMIT = 8;

let workerScript: URL | undefined;
let computeInWorker: ComputeBatch | undefined;

/** Called by the command's entry point with its own URL, and the batch function to run there. */
export function registerWorkerScript(script: URL, compute: ComputeBatch): void {
  workerScript = script;
  computeInWorker = compute;
}

/** True inside a worker this module started. */
export function isNdjsonWorker(): boolean {
  return !isMainThread && typeof workerData === 'object' && workerData !== null && WORKER_MARK in workerData;
}

/** In a worker: compute each batch the main thread sends and send back its bytes. */
export function serveBatches(compute: ComputeBatch): void {
  const port = parentPort;
  if (port === null) return;
  const encoder = new TextEncoder();
  port.on('message', (request: Request) => {
    const { output, failed } = compute(request.text, request.firstLine);
    const bytes = encoder.encode(output);
    const reply: Reply = { id: request.id, output: bytes, failed };
    port.postMessage(reply, [bytes.buffer]);
  });
}

/** Compute threads to use, counting the main thread. */
export function threadCount(env: NodeJS.ProcessEnv = process.env): number {
  const asked = env.HUNDREDFOLD_THREADS;
  if (asked !== undefined && /^\d+$/.test(asked) && Number(asked) >= 1) return Math.min(Number(asked), MAX_THREADS);
  return Math.min(availableParallelism(), MAX_THREADS);
}

interface Lane {
  readonly worker: Worker;
  readonly pending: Map<number, { readonly text: string; readonly firstLine: number; readonly resolve: (batch: Batch) => void }>;
  alive: boolean;
}

export interface Pool {
  /**
   * Queues a batch. Returns the oldest results that must be written before more input is read
   * (in order; await each), which keeps memory bounded and respects a slow reader.
   */
  submit(text: string, firstLine: number): Promise<Batch>[];
  /** Every result still queued, in order. */
  drain(): Promise<Batch>[];
  close(): Promise<void>;
}

/** Starts the workers, or returns undefined when there is no script to run or one thread only. */
export function startPool(): Pool | undefined {
  const compute = computeInWorker;
  if (workerScript === undefined || compute === undefined) return undefined;
  const workers = threadCount() - 1;
  if (workers < 1) return undefined;

  const lanes: Lane[] = [];
  for (let i = 0; i < workers; i += 1) {
    let worker: Worker;
    try {
      worker = new Worker(workerScript, { workerData: { [WORKER_MARK]: true } });
    } catch {
      break;
    }
    const lane: Lane = { worker, pending: new Map(), alive: true };
    const fallBack = () => {
      // Recompute on the main thread whatever the worker still held.
      lane.alive = false;
      for (const { text, firstLine, resolve } of lane.pending.values()) resolve(compute(text, firstLine));
      lane.pending.clear();
    };
    worker.on('message', (reply: Reply) => {
      const waiting = lane.pending.get(reply.id);
      if (waiting === undefined) return;
      lane.pending.delete(reply.id);
      waiting.resolve({ output: reply.output, failed: reply.failed });
    });
    worker.on('error', fallBack);
    worker.on('exit', fallBack);
    lanes.push(lane);
  }
  if (lanes.length === 0) return undefined;

  const queue: Promise<Batch>[] = [];
  let nextId = 0;

  const place = (text: string, firstLine: number): Promise<Batch> => {
    let lane: Lane | undefined;
    for (const candidate of lanes) {
      if (candidate.alive && candidate.pending.size < PER_WORKER && (lane === undefined || candidate.pending.size < lane.pending.size)) {
        lane = candidate;
      }
    }
    // Every worker busy: the main thread takes this batch itself.
    if (lane === undefined) return Promise.resolve(compute(text, firstLine));
    const id = nextId;
    nextId += 1;
    const target = lane;
    return new Promise<Batch>((resolve) => {
      target.pending.set(id, { text, firstLine, resolve });
      const request: Request = { id, text, firstLine };
      target.worker.postMessage(request);
    });
  };

  return {
    submit(text, firstLine) {
      queue.push(place(text, firstLine));
      return queue.length > QUEUE_LIMIT ? queue.splice(0, queue.length - QUEUE_LIMIT) : [];
    },
    drain() {
      return queue.splice(0);
    },
    async close() {
      for (const lane of lanes) {
        lane.worker.removeAllListeners('exit');
        lane.worker.removeAllListeners('error');
        lane.worker.on('error', () => {
          // Ending anyway.
        });
      }
      await Promise.all(lanes.map((lane) => lane.worker.terminate()));
    },
  };
}
