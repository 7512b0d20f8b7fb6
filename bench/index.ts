/**
 * `npm run bench`: runs every bench/*.bench.ts (found by name, so a new file joins by being
 * there), each in its own Node process so one benchmark's warm JIT or heap does not colour the
 * next; prints a table and writes bench-results/latest.json.
 *
 * `npm run bench -- engine cli` runs only the files whose names contain one of the words.
 * A missed target is reported, not failed: this is a benchmark, not a timed test. The exit code
 * is 1 only when a benchmark could not run.
 */
import { fork } from 'node:child_process';
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { cpus, platform } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { meetsTarget, type Figure } from './figure';

const BENCH_DIR = dirname(fileURLToPath(import.meta.url));
const RESULTS_FILE = join(BENCH_DIR, '..', 'bench-results', 'latest.json');
const CHILD_FLAG = '--bench-child';

type ChildMessage = { readonly figures: readonly Figure[] } | { readonly error: string };

function isFigure(value: unknown): value is Figure {
  if (typeof value !== 'object' || value === null) return false;
  const f = value as Record<string, unknown>;
  return (
    typeof f.name === 'string' &&
    typeof f.value === 'number' &&
    typeof f.unit === 'string' &&
    (f.target === undefined || typeof f.target === 'number') &&
    (f.better === undefined || f.better === 'higher' || f.better === 'lower')
  );
}

/** In the child: import one bench file, run it, send its figures to the parent. */
async function runChild(file: string): Promise<void> {
  const send = (message: ChildMessage) => new Promise<void>((resolve) => process.send?.(message, () => resolve()));
  try {
    const mod = (await import(pathToFileURL(file).href)) as { run?: unknown };
    if (typeof mod.run !== 'function') throw new Error('it does not export run(): Promise<Figure[]>');
    const figures: unknown = await (mod.run as () => Promise<unknown>)();
    if (!Array.isArray(figures) || !figures.every(isFigure)) throw new Error('run() must resolve to Figure[] ({ name, value, unit, target?, better? })');
    await send({ figures });
  } catch (error) {
    await send({ error: error instanceof Error ? error.message : String(error) });
  }
}

function runInChild(file: string): Promise<ChildMessage> {
  return new Promise((resolve) => {
    let message: ChildMessage | undefined;
    // process.execArgv carries tsx's loader, so the child can import TypeScript too.
    const child = fork(fileURLToPath(import.meta.url), [CHILD_FLAG, file], { execArgv: process.execArgv, stdio: 'inherit' });
    child.on('message', (m: ChildMessage) => {
      message = m;
    });
    child.on('exit', (code, signal) => {
      resolve(message ?? { error: `the benchmark process ended (${signal ?? `exit ${code}`}) without reporting` });
    });
  });
}

function formatValue(value: number): string {
  if (Math.abs(value) >= 1000) return Math.round(value).toLocaleString('en-US');
  return Number(value.toPrecision(3)).toString();
}

function printTable(rows: readonly (readonly string[])[]): void {
  const widths = rows[0]?.map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length))) ?? [];
  for (const [i, row] of rows.entries()) {
    process.stdout.write(`${row.map((cell, c) => (c === 2 ? cell.padStart(widths[c] ?? 0) : cell.padEnd(widths[c] ?? 0))).join('  ').trimEnd()}\n`);
    if (i === 0) process.stdout.write(`${widths.map((w) => '-'.repeat(w)).join('  ')}\n`);
  }
}

async function runAll(filters: readonly string[]): Promise<number> {
  const files = readdirSync(BENCH_DIR)
    .filter((name) => name.endsWith('.bench.ts'))
    .filter((name) => filters.length === 0 || filters.some((f) => name.includes(f)))
    .sort();
  if (files.length === 0) {
    process.stderr.write(`bench: no bench/*.bench.ts file matches ${filters.join(', ')}\n`);
    return 1;
  }
  const results: { file: string; name: string; value: number; unit: string; target?: number; better: string; met?: boolean }[] = [];
  const errors: { file: string; error: string }[] = [];
  for (const name of files) {
    process.stderr.write(`bench: running ${name}…\n`);
    const message = await runInChild(join(BENCH_DIR, name));
    const file = basename(name);
    if ('error' in message) {
      errors.push({ file, error: message.error });
      continue;
    }
    for (const figure of message.figures) {
      const met = meetsTarget(figure);
      results.push({ file, ...figure, better: figure.better ?? 'higher', ...(met === undefined ? {} : { met }) });
    }
  }

  const rows = [['bench', 'figure', 'value', 'unit', 'target', 'met']];
  for (const r of results) {
    const target = r.target === undefined ? '' : `${r.better === 'lower' ? '≤' : '≥'} ${formatValue(r.target)}`;
    rows.push([r.file, r.name, formatValue(r.value), r.unit, target, r.met === undefined ? '' : r.met ? 'yes' : 'NO']);
  }
  process.stdout.write('\n');
  printTable(rows);
  for (const e of errors) process.stdout.write(`\n${e.file}: could not run: ${e.error}\n`);

  mkdirSync(dirname(RESULTS_FILE), { recursive: true });
  const cpu = cpus();
  const report = {
    generatedAt: new Date().toISOString(),
    node: process.version,
    platform: platform(),
    cpus: cpu.length,
    cpuModel: cpu[0]?.model ?? 'unknown',
    figures: results,
    errors,
  };
  writeFileSync(RESULTS_FILE, `${JSON.stringify(report, null, 2)}\n`);
  process.stdout.write(`\nwrote ${RESULTS_FILE}\n`);
  return errors.length > 0 ? 1 : 0;
}

const childAt = process.argv.indexOf(CHILD_FLAG);
if (childAt >= 0) {
  await runChild(process.argv[childAt + 1] ?? '');
} else {
  process.exitCode = await runAll(process.argv.slice(2));
}
