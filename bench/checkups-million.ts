/**
 * `npm run bench:checkups-million`: memory of `hundredfold checkups` on a file grouped by worker
 * grows not with the number of workers (issue "Workforce checkups, part 1", benchmark). Writes
 * invented workforces (illustrative) of 100,000 and 1,000,000 workers × 3 yearly checkups, grouped,
 * runs the command on each (output drained through a pipe) and prints each run's peak resident
 * memory (/usr/bin/time) and wall time. Not part of `npm run bench` (it takes minutes) nor of CI.
 *
 * The command streams such a file: a first quick pass over the worker column checks the grouping
 * (./lib/workforce/group.ts), the second evaluates each worker as soon as the next one's row
 * arrives and writes its line; only counts and sums are kept for the summary.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildCli, isStale } from '../scripts/build-cli.mjs';
import { COMMAND, SETTINGS, timeRun, writeWorkforce } from './checkups.bench';

const SIZES = [100_000, 1_000_000];
const YEARS = 3;

if (isStale()) await buildCli();
const dir = await mkdtemp(join(tmpdir(), 'hundredfold-bench-million-'));
try {
  for (const workers of SIZES) {
    const file = join(dir, `grouped-${workers}.csv`);
    await writeWorkforce(file, workers, YEARS, true);
    const run = await timeRun([COMMAND, 'checkups', file, ...SETTINGS]);
    await rm(file, { force: true });
    if (run.code !== 0 || run.lines !== workers + 1) throw new Error(`${workers} workers: exit ${run.code} and ${run.lines} lines, not 0 and ${workers + 1}`);
    const peak = run.peakMb === undefined ? 'unknown (no /usr/bin/time)' : `${run.peakMb.toFixed(0)} MB`;
    const cpu = run.cpuMs === undefined ? '' : `, CPU ${(run.cpuMs / 1000).toFixed(1)} s`;
    process.stdout.write(`${workers.toLocaleString('en-US')} workers × ${YEARS}, grouped: peak memory ${peak}, wall ${(run.wallMs / 1000).toFixed(1)} s${cpu}\n`);
  }
} finally {
  await rm(dir, { recursive: true, force: true });
}
