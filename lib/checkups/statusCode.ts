/**
 * A worker's status as one small whole number — its position in lib/workforce WORKER_STATUSES —
 * for the typed-array columns the checkups screen keeps (./packedResults.ts, ./worklistColumns.ts).
 */
import { WORKER_STATUSES, type WorkerStatus } from '../workforce/types';

const CODES: ReadonlyMap<WorkerStatus, number> = new Map(WORKER_STATUSES.map((s, i) => [s, i]));

/**
 * @example
 * statusCode('exposed') //=> 0
 */
export function statusCode(status: WorkerStatus): number {
  const code = CODES.get(status);
  if (code === undefined) throw new RangeError(`"${String(status)}" is not a worker status`);
  return code;
}

/**
 * The status a code stands for; undefined for a code that stands for none.
 * @example
 * statusOfCode(0) //=> 'exposed'
 */
export function statusOfCode(code: number): WorkerStatus | undefined {
  return WORKER_STATUSES[code];
}
