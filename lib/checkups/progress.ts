/**
 * The progress bar's text and value while the checkups are processed in the Web Worker: rows
 * read, workers done, and the time left, estimated by linear extrapolation of the elapsed time
 * over the fraction done (common practice). Reading counts for the first half of the bar (by
 * characters read against the file's size), evaluating for the second (workers done / total).
 */
import type { CheckupsProgress } from '../workforce/run';
import { formatCount } from '../text/number';

export interface ProgressView {
  /** 0 to 1. */
  readonly fraction: number;
  /** "Rows read: 1,000 · workers done: 0 of …" */
  readonly text: string;
  /** "about 12 s left", or "" while there is too little to go on. */
  readonly timeLeft: string;
}

/**
 * @param sizeChars the file's size (bytes stand in for characters: close for ASCII text)
 * @example
 * checkupsProgressView({ phase: 'evaluating', charsDone: 100, rowsRead: 10, workersDone: 50, workersTotal: 100 }, 100, 3000)
 * //=> { fraction: 0.75, text: 'Rows read: 10 · workers done: 50 of 100', timeLeft: 'about 1 s left' }
 */
export function checkupsProgressView(progress: CheckupsProgress, sizeChars: number, elapsedMs: number): ProgressView {
  const reading = sizeChars > 0 ? Math.min(1, progress.charsDone / sizeChars) : 0;
  const fraction =
    progress.phase === 'reading' ? reading / 2 : 0.5 + (progress.workersTotal && progress.workersTotal > 0 ? progress.workersDone / progress.workersTotal : 1) / 2;
  const total = progress.workersTotal === null ? '…' : formatCount(progress.workersTotal);
  const text = `Rows read: ${formatCount(progress.rowsRead)} · workers done: ${formatCount(progress.workersDone)} of ${total}`;
  let timeLeft = '';
  if (fraction >= 0.05 && fraction < 1 && elapsedMs > 0) {
    const seconds = Math.ceil((elapsedMs / fraction - elapsedMs) / 1000);
    timeLeft = `about ${formatCount(seconds)} s left`;
  }
  return { fraction, text, timeLeft };
}
