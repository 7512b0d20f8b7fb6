/**
 * The checkups screen in a browser (issue "Workforce checkups, part 2", Performance): 100,000
 * workers × 5 yearly checkups (the invented workforce of bench/checkups.bench.ts, 500,000 rows,
 * grouped by worker) chosen on /checkups in headless Chromium against the production build.
 *
 * - file chosen → summary on screen (target 15 s): from the file input's `change` event to the
 *   frame after the summary appears, the columns confirmed at once (no reading time counted);
 * - the longest main-thread task meanwhile (target: none over 50 ms), from a
 *   PerformanceObserver('longtask') armed before the file is chosen; and how many went over;
 * - sorting the 100,000-row worklist (target 200 ms): from the click on a column heading to the
 *   frame after the rows are shown in the new order, for a number column and the worker id, once
 *   the worker's sort ranks have arrived (and how long after the summary that was).
 *
 * It builds the app first (`npm run build`) unless BENCH_REUSE_BUILD=1 and a build exists, then
 * serves it with `next start` on a spare port (BENCH_PORT to choose one). A benchmark, not a
 * test: a missed target is reported, never failed. Run alone: `npx tsx bench/checkups-page.bench.ts`,
 * or `npm run bench:browser`.
 *
 * The longtask observer measures wall time, which on a shared machine also counts the time the
 * page waited for a core. BENCH_TRACE=<file> records a Chromium trace of the same run and adds
 * each window's longest main-thread task by thread time (what the page itself ran), how many went
 * over 50 ms of it, the main thread's busy time and its garbage collection (bench/trace.ts), and
 * prints what filled any long one. BENCH_CHECKUPS_WORKERS=30000 for a quicker look;
 * BENCH_CPU_PROFILE=<file> writes a CPU profile of the page (Chrome DevTools' format).
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Page } from '@playwright/test';
import type { Figure } from './figure';
import { writeWorkforce } from './checkups.bench';
import { CHROMIUM, CHROMIUM_ARGS, sparePort, startServer, stopServer } from './page.bench';
import { traceTasks } from './trace';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
/** The workforce's size: the issue's 100,000, or BENCH_CHECKUPS_WORKERS for quicker looks (e.g. 30000). */
const WORKERS = Number(process.env.BENCH_CHECKUPS_WORKERS ?? 100_000);
/** A Chromium trace of the run is written here and read for each main-thread task's thread time (bench/trace.ts). */
const TRACE = process.env.BENCH_TRACE;
/** A CPU profile of the page's main thread (Chrome DevTools' .cpuprofile) is written here. */
const PROFILE = process.env.BENCH_CPU_PROFILE;
const TRACE_CATEGORIES = ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'blink.user_timing', 'v8.execute'];

function build(): void {
  if (process.env.BENCH_REUSE_BUILD === '1' && existsSync(join(ROOT, '.next', 'BUILD_ID'))) return;
  const result = spawnSync('npm', ['run', 'build'], { cwd: ROOT, env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1' }, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`npm run build failed: ${result.stderr.trim().split('\n').slice(-3).join(' ')}`);
}

/*
 * Browser-side code as plain text (tsx's name-keeping helper does not exist in the page).
 */

/** Records every long task, and the time the file input changes. */
const ARM = `(() => {
  window.__long = [];
  new PerformanceObserver((list) => { for (const e of list.getEntries()) window.__long.push({ start: e.startTime, duration: e.duration }); }).observe({ type: 'longtask' });
  document.addEventListener('change', (event) => { if (event.target instanceof HTMLInputElement && event.target.type === 'file') { window.__chosenAt = performance.now(); performance.mark('bench:chosen'); } }, { capture: true });
  window.__summaryAt = new Promise((resolve) => {
    const check = () => { if (document.querySelector('[data-testid="summary"]')) { observer.disconnect(); requestAnimationFrame(() => { performance.mark('bench:summary'); resolve(performance.now()); }); return true; } return false; };
    const observer = new MutationObserver(check);
    if (!check()) observer.observe(document.body, { subtree: true, childList: true });
  });
})(); undefined`;

/** Arms the sort measurement: click on a heading → the table says the new order is on screen → next frame. */
const armSort = (state: string) => `window.__sorted = new Promise((resolve) => {
  let clickAt = NaN;
  const table = document.querySelector('[data-testid="worklist"]');
  const done = () => table.getAttribute('data-order') === ${JSON.stringify(state)};
  const observer = new MutationObserver(() => { if (done()) { observer.disconnect(); requestAnimationFrame(() => resolve(performance.now() - clickAt)); } });
  document.addEventListener('click', (event) => { clickAt = event.timeStamp; performance.mark('bench:sort-${state}'); observer.observe(table, { attributes: true, attributeFilter: ['data-order'] }); }, { capture: true, once: true });
}); undefined`;

interface LongTask {
  readonly start: number;
  readonly duration: number;
}

async function sortTime(page: Page, column: string, state: string): Promise<{ ms: number; longest: number }> {
  await page.evaluate('window.__long = []');
  await page.evaluate(armSort(state));
  await page.getByTestId('worklist').getByRole('button', { name: column, exact: true }).click();
  const ms = (await page.evaluate('window.__sorted')) as number;
  await page.waitForTimeout(200);
  await page.evaluate(`performance.mark('bench:sorted-${state}')`);
  const long = (await page.evaluate('window.__long')) as LongTask[];
  return { ms, longest: Math.max(0, ...long.map((l) => l.duration)) };
}

export async function measure(baseUrl: string, file: string): Promise<Figure[]> {
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/checkups`);
    const input = page.getByLabel(/Checkup file/);
    await input.waitFor();
    await page.waitForFunction(() => !(document.querySelector('input[type="file"]') as HTMLInputElement | null)?.disabled, undefined, { timeout: 120_000 });
    await page.evaluate(ARM);
    if (TRACE) await browser.startTracing(page, { categories: TRACE_CATEGORIES });
    const profiler = PROFILE ? await page.context().newCDPSession(page) : null;
    if (profiler) {
      await profiler.send('Profiler.enable');
      await profiler.send('Profiler.setSamplingInterval', { interval: 200 });
      await profiler.send('Profiler.start');
    }
    await input.setInputFiles(file);
    await page.getByRole('button', { name: 'Confirm the columns and process' }).click({ timeout: 60_000 });
    await page.getByTestId('summary').waitFor({ timeout: 300_000 });
    const summaryAt = (await page.evaluate('window.__summaryAt')) as number;
    const chosenAt = (await page.evaluate('window.__chosenAt')) as number;
    await page.waitForTimeout(500); // a task running as the summary appears is counted too
    await page.evaluate("performance.mark('bench:settled')");
    const long = ((await page.evaluate('window.__long')) as LongTask[]).filter((l) => l.start >= chosenAt && l.start <= summaryAt + 500);
    const shown = await page.getByTestId('worklist-count').textContent();
    if (!shown?.startsWith(`${WORKERS.toLocaleString('en-US')} of`) && !shown?.startsWith(`${WORKERS} of`)) throw new Error(`the worklist shows "${shown}", not ${WORKERS} workers`);
    const longest = Math.max(0, ...long.map((l) => l.duration));
    // The sort ranks arrive from the worker after the summary: sorting before then takes the plain path.
    await page.locator('[data-testid="worklist"][data-ranked="true"]').waitFor({ timeout: 300_000 });
    const rankedAt = (await page.evaluate('performance.now()')) as number;
    const risk = await sortTime(page, 'Risk with the exposure', 'exposed-ascending');
    const riskDown = await sortTime(page, 'Risk with the exposure', 'exposed-descending');
    const worker = await sortTime(page, 'Worker', 'worker-ascending');
    if (profiler && PROFILE) await writeFile(PROFILE, JSON.stringify((await profiler.send('Profiler.stop')).profile));
    const traced = TRACE ? await traceFigures(await browser.stopTracing(), TRACE) : [];
    return [
      { name: `checkups screen, ${WORKERS.toLocaleString('en-US')} workers × 5: file chosen → summary on screen`, value: Math.round(summaryAt - chosenAt), unit: 'ms', target: 15_000, better: 'lower' },
      { name: 'checkups screen: longest main-thread task meanwhile', value: Math.round(longest), unit: 'ms', target: 50, better: 'lower' },
      { name: 'checkups screen: main-thread tasks over 50 ms meanwhile', value: long.filter((l) => l.duration > 50).length, unit: 'tasks', target: 0, better: 'lower' },
      { name: 'checkups screen: summary on screen → sort ranks ready (at most; polled)', value: Math.round(rankedAt - summaryAt), unit: 'ms', better: 'lower' },
      { name: `checkups screen: sort ${WORKERS.toLocaleString('en-US')} rows by risk (click → rows shown)`, value: Math.round(risk.ms), unit: 'ms', target: 200, better: 'lower' },
      { name: 'checkups screen: sort by risk, descending', value: Math.round(riskDown.ms), unit: 'ms', target: 200, better: 'lower' },
      { name: 'checkups screen: sort by worker id', value: Math.round(worker.ms), unit: 'ms', target: 200, better: 'lower' },
      { name: 'checkups screen: longest main-thread task while sorting', value: Math.round(Math.max(risk.longest, riskDown.longest, worker.longest)), unit: 'ms', target: 50, better: 'lower' },
      ...traced,
    ];
  } finally {
    await browser.close();
  }
}

/**
 * The trace's view of the same windows: each main-thread task's thread time (what the page itself
 * ran, whatever the machine's load), the long ones with what took their time, and GC.
 */
async function traceFigures(buffer: Buffer, path: string): Promise<Figure[]> {
  await writeFile(path, buffer);
  const trace = JSON.parse(buffer.toString('utf8')) as Parameters<typeof traceTasks>[0];
  const run = traceTasks(trace, 'bench:chosen', 'bench:settled');
  const sorts = ['exposed-ascending', 'exposed-descending', 'worker-ascending'].map((s) => traceTasks(trace, `bench:sort-${s}`, `bench:sorted-${s}`));
  for (const t of run.long) process.stderr.write(`long task while processing at +${t.at} ms: thread ${t.thread} ms, wall ${t.wall} ms: ${t.inside.join(', ')}\n`);
  for (const t of sorts.flatMap((s) => s.long)) process.stderr.write(`long task while sorting: thread ${t.thread} ms, wall ${t.wall} ms: ${t.inside.join(', ')}\n`);
  return [
    { name: 'trace: longest main-thread task, file chosen → summary + 0.5 s (thread time)', value: run.longestThread, unit: 'ms', target: 50, better: 'lower' },
    { name: 'trace: the same, wall time', value: run.longestWall, unit: 'ms', better: 'lower' },
    { name: 'trace: main-thread tasks over 50 ms thread time meanwhile', value: run.long.length, unit: 'tasks', target: 0, better: 'lower' },
    { name: 'trace: main-thread busy (thread time) meanwhile', value: run.busy, unit: 'ms', better: 'lower' },
    { name: 'trace: garbage collection on the main thread meanwhile', value: run.gc, unit: 'ms', better: 'lower' },
    { name: 'trace: longest main-thread task while sorting (thread time)', value: Math.max(...sorts.map((s) => s.longestThread)), unit: 'ms', target: 50, better: 'lower' },
  ];
}

export async function run(): Promise<Figure[]> {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium is missing at ${CHROMIUM}: install it with \`apt-get install chromium\``);
  build();
  const dir = await mkdtemp(join(tmpdir(), 'hundredfold-bench-checkups-page-'));
  const port = process.env.BENCH_PORT ? Number(process.env.BENCH_PORT) : await sparePort();
  const server = await startServer(port);
  try {
    const file = join(dir, 'checkups.csv');
    await writeWorkforce(file, WORKERS, 5, true);
    return await measure(`http://127.0.0.1:${port}`, file);
  } finally {
    stopServer(server);
    await rm(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  run().then(
    (figures) => {
      for (const f of figures) process.stdout.write(`${f.name}: ${f.value} ${f.unit}${f.target === undefined ? '' : ` (target ≤ ${f.target})`}\n`);
    },
    (error: unknown) => {
      process.stderr.write(`checkups page bench failed: ${error instanceof Error ? error.message : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
