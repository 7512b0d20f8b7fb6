/**
 * Asks the screen's Web Worker (./checkups.worker.ts, 'histories') for the checkups of many
 * workers, read again from the file in one pass, for the own results on batch handouts. The
 * answers arrive in small batches (each taken in a few milliseconds); progress through the file
 * is reported as it goes; `cancel` stops the pass.
 */
import type { Checkup } from '@/lib/glycaemia/schema';
import type { FromWorker, ToWorker } from './protocol';

export type HistoriesRequest = Omit<Extract<ToWorker, { type: 'histories' }>, 'type' | 'id' | 'workers'>;

export type HistoriesOutcome = { readonly ok: true; readonly histories: ReadonlyMap<string, readonly Checkup[]> } | { readonly ok: false; readonly message: string };

export interface HistoriesRead {
  readonly outcome: Promise<HistoriesOutcome>;
  /** Stops the pass; `outcome` then never settles. */
  cancel(): void;
}

/** Reads the workers' histories: `workers` by id, `onProgress` with the bytes read so far. */
export type ReadHistories = (workers: readonly string[], onProgress: (bytesRead: number, bytesTotal: number) => void) => HistoriesRead;

let passes = 0;

/** A {@link ReadHistories} for the screen's worker and the run's files. */
export function historiesReader(worker: () => Worker, request: HistoriesRequest): ReadHistories {
  return (workers, onProgress) => {
    const w = worker();
    const id = ++passes;
    const histories = new Map<string, readonly Checkup[]>();
    let listener: ((event: MessageEvent<FromWorker>) => void) | null = null;
    const stop = () => {
      if (listener) w.removeEventListener('message', listener);
      listener = null;
    };
    const outcome = new Promise<HistoriesOutcome>((resolve) => {
      listener = (event) => {
        const m = event.data;
        if (m.type !== 'histories' || m.id !== id) return;
        onProgress(m.bytesRead, m.bytesTotal);
        for (const h of m.histories) histories.set(h.worker, h.checkups);
        if (!m.done) return;
        stop();
        resolve(m.message === null ? { ok: true, histories } : { ok: false, message: m.message });
      };
      w.addEventListener('message', listener);
    });
    const message: ToWorker = { type: 'histories', id, ...request, workers };
    w.postMessage(message);
    return {
      outcome,
      cancel() {
        if (!listener) return;
        stop();
        const cancel: ToWorker = { type: 'histories-cancel', id };
        w.postMessage(cancel);
      },
    };
  };
}
