/**
 * `hundredfold checkups` on a large workforce (issue "Workforce checkups, part 1", benchmark):
 *
 * - 100,000 workers × 5 yearly checkups (500,000 rows, generated here, invented values) in a CSV
 *   file grouped by worker: the command's wall time against the floor — Node itself reading the
 *   same file as a stream and splitting every line into fields (bench/checkups-floor.mjs) — and
 *   the command's peak memory (maximum resident set size from /usr/bin/time). Targets: within 4×
 *   the floor, under 500 MB.
 * - The same workforce with its rows shuffled by year (not grouped): read whole; its peak memory.
 *
 * 1,000,000 workers (memory flat) take minutes, so they are a separate run, not part of
 * `npm run bench`: `npm run bench:checkups-million` (bench/checkups-million.ts).
 *
 * Both the floor and the command (dist/hundredfold.mjs, the bundle) run as real processes (node
 * startup included), one core each
 * (the command uses one thread), output drained through a pipe. Runs alternate floor, command;
 * each figure is the median of the runs. Run alone: `npx tsx bench/checkups.bench.ts`.
 */
import { spawn } from 'node:child_process';
import { createWriteStream, existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildCli, isStale } from '../scripts/build-cli.mjs';
import { median, type Figure } from './figure';

export const ROOT = fileURLToPath(new URL('..', import.meta.url));
/** The bundled command itself (bin/hundredfold.mjs adds a check that the bundle is current: not timed). */
export const COMMAND = join(ROOT, 'dist', 'hundredfold.mjs');
const GNU_TIME = '/usr/bin/time';
const RUNS = 2;
export const SETTINGS = ['--criteria', 'ADA', '--table-id', 'demo-heart-failure-10y', '--evidence-id', 'demo-workforce-hba1c-heart-failure', '--today', '2026-01-01'];
const SITES = ['North', 'South', 'Harbour', 'East', 'West'];

export interface Timing {
  readonly wallMs: number;
  /** Maximum resident set size, MB (from /usr/bin/time), when it could tell. */
  readonly peakMb: number | undefined;
  /** User + system CPU time, ms (from /usr/bin/time): steadier than wall time on a shared machine. */
  readonly cpuMs: number | undefined;
  readonly lines: number;
  readonly code: number | null;
}

export function timeRun(args: readonly string[]): Promise<Timing> {
  return new Promise((resolve, reject) => {
    const useTime = existsSync(GNU_TIME);
    const [command, argv] = useTime ? [GNU_TIME, ['-f', 'hundredfold-bench-rss %M %U %S', process.execPath, ...args]] : [process.execPath, [...args]];
    const start = performance.now();
    const child = spawn(command, argv, { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    let lines = 0;
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => {
      for (let i = chunk.indexOf(10); i >= 0; i = chunk.indexOf(10, i + 1)) lines += 1;
    });
    child.stderr.on('data', (chunk: Buffer) => {
      stderr += chunk.toString('utf8');
    });
    child.on('error', reject);
    child.on('close', (code) => {
      const wallMs = performance.now() - start;
      const match = /hundredfold-bench-rss (\d+) ([\d.]+) ([\d.]+)/.exec(stderr);
      resolve({ wallMs, peakMb: match ? Number(match[1]) / 1024 : undefined, cpuMs: match ? (Number(match[2]) + Number(match[3])) * 1000 : undefined, lines, code });
    });
  });
}

/**
 * Writes an invented workforce: `workers` workers, `years` yearly checkups each from 2021, with
 * HbA1c patterns that give every status. Grouped by worker, or by year (every worker's first
 * checkup, then every second one …) when `grouped` is false.
 */
export async function writeWorkforce(file: string, workers: number, years: number, grouped: boolean): Promise<void> {
  const out = createWriteStream(file);
  const write = (text: string) => (out.write(text) ? Promise.resolve() : new Promise<void>((r) => out.once('drain', () => r())));
  await write('Worker,Checkup date,HbA1c (%),Fasting glucose (mmol/L),Age,Sex,Site\n');
  const row = (w: number, y: number) => {
    const pattern = w % 5;
    const hba1c = pattern === 0 || pattern === 1 ? 5.8 + ((w + y) % 6) / 10 : pattern === 4 ? 5.1 + ((w * 3 + y) % 5) / 10 : y < years - 2 ? 5.2 : 6.0;
    const age = 30 + (w % 40) - years + 1 + y;
    const date = `${2021 + y}-0${3 + ((w + y) % 6)}-${String(1 + ((w * 7 + y) % 28)).padStart(2, '0')}`;
    return `W${String(w).padStart(7, '0')},${date},${hba1c.toFixed(1)},${(4.8 + (w % 7) / 10).toFixed(1)},${age},${w % 2 === 0 ? 'F' : 'M'},${SITES[w % SITES.length]}\n`;
  };
  const BLOCK = 2000;
  if (grouped) {
    for (let w0 = 1; w0 <= workers; w0 += BLOCK) {
      let text = '';
      for (let w = w0; w < Math.min(w0 + BLOCK, workers + 1); w++) for (let y = 0; y < years; y++) text += row(w, y);
      await write(text);
    }
  } else {
    for (let y = 0; y < years; y++) {
      for (let w0 = 1; w0 <= workers; w0 += BLOCK) {
        let text = '';
        for (let w = w0; w < Math.min(w0 + BLOCK, workers + 1); w++) text += row(w, y);
        await write(text);
      }
    }
  }
  await new Promise<void>((resolve, reject) => out.end((error?: Error | null) => (error ? reject(error) : resolve())));
}

export async function run(): Promise<Figure[]> {
  if (isStale()) await buildCli();
  const dir = await mkdtemp(join(tmpdir(), 'hundredfold-bench-checkups-'));
  try {
    const grouped = join(dir, 'grouped.csv');
    const ungrouped = join(dir, 'ungrouped.csv');
    await writeWorkforce(grouped, 100_000, 5, true);
    await writeWorkforce(ungrouped, 100_000, 5, false);

    const floorArgs = [join(ROOT, 'bench', 'checkups-floor.mjs'), grouped];
    const commandArgs = (file: string) => [COMMAND, 'checkups', file, ...SETTINGS];
    await timeRun(floorArgs); // warms the file cache
    const floor: Timing[] = [];
    const command: Timing[] = [];
    for (let r = 0; r < RUNS; r++) {
      floor.push(await timeRun(floorArgs));
      command.push(await timeRun(commandArgs(grouped)));
    }
    const whole = await timeRun(commandArgs(ungrouped));
    for (const t of [...command, whole]) {
      if (t.code !== 0 || t.lines !== 100_001) throw new Error(`a run gave exit ${t.code} and ${t.lines} lines, not 0 and 100,001`);
    }

    const wall = (ts: readonly Timing[]) => median(ts.map((t) => t.wallMs));
    const peak = (ts: readonly Timing[]) => Math.max(...ts.map((t) => t.peakMb ?? Number.NaN));
    const cpu = (ts: readonly Timing[]) => median(ts.map((t) => t.cpuMs ?? Number.NaN));
    return [
      { name: 'node read + split into fields (CPU time)', value: cpu(floor), unit: 'ms', better: 'lower' },
      { name: 'hundredfold checkups, 100,000 workers × 5, grouped (CPU time)', value: cpu(command), unit: 'ms', better: 'lower' },
      { name: 'checkups ÷ floor (CPU time)', value: cpu(command) / cpu(floor), unit: '×', better: 'lower' },
      { name: 'node read + split into fields, 500,000 rows (wall, the floor)', value: wall(floor), unit: 'ms', better: 'lower' },
      { name: 'hundredfold checkups, 100,000 workers × 5, grouped (wall)', value: wall(command), unit: 'ms', better: 'lower' },
      { name: 'checkups ÷ floor (wall time)', value: wall(command) / wall(floor), unit: '×', target: 4, better: 'lower' },
      { name: 'checkups, 100,000 workers, grouped (peak memory)', value: peak(command), unit: 'MB', target: 500, better: 'lower' },
      { name: 'checkups, 100,000 workers, ungrouped: read whole (wall)', value: whole.wallMs, unit: 'ms', better: 'lower' },
      { name: 'checkups, 100,000 workers, ungrouped (peak memory)', value: whole.peakMb ?? Number.NaN, unit: 'MB', target: 500, better: 'lower' },
    ];
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  for (const f of await run()) process.stdout.write(`${f.name}: ${f.value.toFixed(1)} ${f.unit}\n`);
}
