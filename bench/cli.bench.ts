/**
 * `hundredfold compute --ndjson` over 100,000 lines against Node itself reading, parsing and
 * re-serialising the same lines (bench/ndjson-baseline.mjs); issue 2 §5 asks for at most 3×.
 *
 * Both run as real processes (node startup included), input from the same file on stdin,
 * output through a pipe this process drains. Runs alternate, baseline then command, so a busy
 * spell on the machine falls on both; each figure is the median of the runs. Wall time is the
 * target figure; CPU time (user + system, from /usr/bin/time when present) is shown beside it,
 * because on a shared 2-core machine wall time also counts other programs.
 *
 * The command shares long inputs with worker threads (lib/cli/commands/ndjsonPool.ts); it is
 * timed as it runs by default, and again on one thread (HUNDREDFOLD_THREADS=1), which shows the
 * per-line cost of validation, the engine and the larger output.
 */
import { spawn } from 'node:child_process';
import { existsSync, openSync, closeSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { threadCount } from '@/lib/cli/commands/ndjsonPool';
import { buildCli, isStale } from '../scripts/build-cli.mjs';
import { median, type Figure } from './figure';
import { mixedScenarios } from './scenarios';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const LINES = 100_000;
const RUNS = 5;
const GNU_TIME = '/usr/bin/time';

interface Timing {
  readonly wallMs: number;
  /** User + system CPU time of the process, when /usr/bin/time could tell. */
  readonly cpuMs: number | undefined;
  readonly lines: number;
  readonly code: number | null;
}

/** Runs `node args…` with the file on stdin; counts output lines; times it. */
function timeRun(args: readonly string[], inputFile: string, env: Readonly<Record<string, string>> = {}): Promise<Timing> {
  return new Promise((resolve, reject) => {
    const input = openSync(inputFile, 'r');
    const useTime = existsSync(GNU_TIME);
    const [command, argv] = useTime
      ? [GNU_TIME, ['-f', 'hundredfold-bench-cpu %U %S', process.execPath, ...args]]
      : [process.execPath, [...args]];
    const start = performance.now();
    const child = spawn(command, argv, { cwd: ROOT, env: { ...process.env, ...env }, stdio: [input, 'pipe', 'pipe'] });
    closeSync(input);
    const { stdout, stderr: errors } = child;
    if (stdout === null || errors === null) throw new Error('the child has no output pipes');
    let lines = 0;
    let stderr = '';
    stdout.on('data', (chunk: Buffer) => {
      for (let i = chunk.indexOf(10); i >= 0; i = chunk.indexOf(10, i + 1)) lines += 1;
    });
    errors.on('data', (chunk: Buffer) => {
      stderr += chunk.toString('utf8');
    });
    child.on('error', reject);
    child.on('close', (code) => {
      const wallMs = performance.now() - start;
      const match = /hundredfold-bench-cpu ([\d.]+) ([\d.]+)/.exec(stderr);
      const cpuMs = match ? (Number(match[1]) + Number(match[2])) * 1000 : undefined;
      resolve({ wallMs, cpuMs, lines, code });
    });
  });
}

export async function run(): Promise<Figure[]> {
  if (isStale()) await buildCli();
  const dir = await mkdtemp(join(tmpdir(), 'hundredfold-bench-cli-'));
  try {
    const file = join(dir, 'scenarios.ndjson');
    // Every line a different scenario, so nothing is timed on repeated text.
    const lines = mixedScenarios(LINES).map((scenario) => JSON.stringify(scenario));
    await writeFile(file, `${lines.join('\n')}\n`);

    const baselineArgs = [join(ROOT, 'bench', 'ndjson-baseline.mjs')];
    const commandArgs = [join(ROOT, 'bin', 'hundredfold.mjs'), 'compute', '--ndjson'];
    const oneThread = { HUNDREDFOLD_THREADS: '1' };
    // One of each first, untimed, to warm the file cache.
    await timeRun(baselineArgs, file);
    await timeRun(commandArgs, file);

    const baseline: Timing[] = [];
    const command: Timing[] = [];
    const single: Timing[] = [];
    for (let r = 0; r < RUNS; r += 1) {
      baseline.push(await timeRun(baselineArgs, file));
      command.push(await timeRun(commandArgs, file));
      single.push(await timeRun(commandArgs, file, oneThread));
    }
    for (const t of [...baseline, ...command, ...single]) {
      if (t.code !== 0 || t.lines !== LINES) throw new Error(`a run gave exit ${t.code} and ${t.lines} lines, not 0 and ${LINES}`);
    }
    const wall = (ts: readonly Timing[]) => median(ts.map((t) => t.wallMs));
    const count = LINES.toLocaleString('en-US');
    const threads = threadCount();
    const figures: Figure[] = [
      { name: `node read + JSON.parse + JSON.stringify, ${count} lines (wall)`, value: wall(baseline), unit: 'ms', better: 'lower' },
      { name: `hundredfold compute --ndjson, ${count} lines, ${threads} thread${threads === 1 ? '' : 's'} (wall)`, value: wall(command), unit: 'ms', better: 'lower' },
      { name: 'compute --ndjson ÷ node baseline (wall time)', value: wall(command) / wall(baseline), unit: '×', target: 3, better: 'lower' },
      { name: `hundredfold compute --ndjson, ${count} lines, 1 thread (wall)`, value: wall(single), unit: 'ms', better: 'lower' },
      { name: 'compute --ndjson on 1 thread ÷ node baseline (wall time)', value: wall(single) / wall(baseline), unit: '×', better: 'lower' },
    ];
    const cpu = (ts: readonly Timing[]) => (ts.every((t) => t.cpuMs !== undefined) ? median(ts.map((t) => t.cpuMs as number)) : undefined);
    const [cpuBaseline, cpuCommand, cpuSingle] = [cpu(baseline), cpu(command), cpu(single)];
    if (cpuBaseline !== undefined && cpuCommand !== undefined && cpuSingle !== undefined) {
      figures.push(
        { name: 'node baseline (CPU time)', value: cpuBaseline, unit: 'ms', better: 'lower' },
        { name: `compute --ndjson, ${threads} threads (CPU time, all threads)`, value: cpuCommand, unit: 'ms', better: 'lower' },
        { name: 'compute --ndjson, 1 thread (CPU time)', value: cpuSingle, unit: 'ms', better: 'lower' },
        { name: 'compute --ndjson on 1 thread ÷ node baseline (CPU time)', value: cpuSingle / cpuBaseline, unit: '×', better: 'lower' },
      );
    }
    return figures;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
