/**
 * The sessionStorage key of the "open one worker" record (./workerHandOver.ts), on its own so
 * the consultation screen can look for a record without loading the checks until one is there.
 */
export const WORKER_HANDOVER_KEY = 'hundredfold.checkups-worker';
