/**
 * Batch handouts for 500 workers on the checkups screen (issue 10, item 9: "500 workers print as
 * 500 one-page sheets"), in headless Chromium against the production build, then printed.
 *
 * The file: the invented workforce of bench/checkups.bench.ts, 1,250 workers × 5 yearly
 * checkups, of whom 500 (every worker whose number ends in 0, 1, 5 or 6) have HbA1c in the
 * prediabetes range at every checkup and so fit the demo study's exposure. On /checkups with the
 * screen's own settings (the demo evidence entry and table, ADA), "All workers who fit the
 * exposure" and "Print each worker's id" are chosen and the 500 handouts prepared:
 *
 * - Prepare clicked → the pages ready (the worker's results read again from the file, then each
 *   sheet built and its page put in place), and the longest main-thread task meanwhile (target:
 *   none over 50 ms) from a PerformanceObserver('longtask');
 * - the print (`page.pdf`, A4) and what it holds, checked with poppler: exactly 500 pages; page i
 *   carries the i-th exposed worker's id and nobody else's, the caution, and the figures and own
 *   results of that worker's sheet as lib/checkups `batchHandout` makes it here in Node from the
 *   same file (the same engine and history reader). A page that does not match stops the run:
 *   this checks that the screen puts the right sheet on the right page, once each; the sheets'
 *   own content is tested in tests/unit/checkups/batchHandouts.test.ts and the browser specs.
 *
 * A benchmark, not a test: a missed target is reported, never failed. It builds the app first
 * unless BENCH_REUSE_BUILD=1 and a build exists; BENCH_BASE_URL uses a server already running.
 * Run alone: `npx tsx bench/batch-handouts.bench.ts`. BENCH_KEEP=dir keeps the PDF and a few
 * pages as PNG (pdftoppm -r 50) there to look at.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from '@playwright/test';
import { batchHandout, batchSelection, type BatchHandout } from '../lib/checkups/batchHandouts';
import { collectWorkersRows, workerCheckups } from '../lib/checkups/workerHistory';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '../lib/evidence/demo';
import { localIsoDate } from '../lib/glycaemia/dates';
import { DEMO_HEART_FAILURE_10Y } from '../lib/tables/demo';
import { CAUTION_TEXT } from '../lib/wording';
import { isRefusal, prepareCheckups, runCheckups, type WorkerResult } from '../lib/workforce';
import { runWhenAlone, type Figure } from './figure';
import { traceTasks } from './trace';
import { writeWorkforce } from './checkups.bench';
import { CHROMIUM, CHROMIUM_ARGS, sparePort, startServer, stopServer } from './page.bench';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
/** 1,250 workers: 500 of them (2 in 5) fit the exposure (bench/checkups.bench.ts `writeWorkforce`). */
const WORKERS = 1250;
const SHEETS = 500;
/**
 * BENCH_TRACE=<file>: a Chromium trace of Prepare → ready is written there, and each main-thread
 * task's thread time is read from it (bench/trace.ts): what the page itself ran, whatever the load.
 */
const TRACE = process.env.BENCH_TRACE;
const TRACE_CATEGORIES = ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'blink.user_timing', 'v8.execute'];

function build(): void {
  if (process.env.BENCH_REUSE_BUILD === '1' && existsSync(join(ROOT, '.next', 'BUILD_ID'))) return;
  const result = spawnSync('npm', ['run', 'build'], { cwd: ROOT, env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1' }, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`npm run build failed: ${result.stderr.trim().split('\n').slice(-3).join(' ')}`);
}

const squash = (text: string) => text.replace(/\s+/g, ' ').trim();

/** What each page must hold, worked out in Node from the same file with the screen's settings. */
async function expectedSheets(file: string): Promise<Extract<BatchHandout, { kind: 'sheet' }>[]> {
  const context = prepareCheckups({ evidence: DEMO_WORKFORCE_HBA1C_HEART_FAILURE, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
  if (!context.ok) throw new Error(JSON.stringify(context.issues));
  const text = readFileSync(file, 'utf8');
  const reader = { today: localIsoDate() };
  const results: WorkerResult[] = [];
  const outcome = await runCheckups([text], { context: context.value, reader, format: 'delimited', onWorker: (w) => results.push(w) });
  if (!outcome.ok) throw new Error('the invented file must process');
  const chosen = batchSelection(results, 'exposed', new Set());
  const rows = await collectWorkersRows([text], { reader, format: 'delimited' }, new Set(chosen.map((i) => results[i]?.worker ?? '')));
  if (isRefusal(rows)) throw new Error(rows.message);
  const date = new Date();
  return chosen.flatMap((i) => {
    const r = results[i];
    if (!r) return [];
    const h = batchHandout(r, i, context.value, { paper: 'a4', date, showIds: true }, workerCheckups(rows.get(r.worker) ?? []));
    return h.kind === 'sheet' ? [h] : [];
  });
}

/** Records every long task from now on, the click on Prepare, and when the pages are ready. */
const ARM = `(() => {
  window.__long = [];
  new PerformanceObserver((list) => { for (const e of list.getEntries()) window.__long.push({ start: e.startTime, duration: e.duration }); }).observe({ type: 'longtask' });
  document.addEventListener('click', (event) => { window.__clickAt = event.timeStamp; performance.mark('bench:prepare'); }, { capture: true, once: true });
  window.__readyAt = new Promise((resolve) => {
    const observer = new MutationObserver(() => {
      if (document.querySelector('[data-testid="batch-print"][data-ready="true"]')) { observer.disconnect(); performance.mark('bench:ready'); resolve(performance.now()); }
    });
    observer.observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['data-ready'] });
  });
})(); undefined`;

interface LongTask {
  readonly start: number;
  readonly duration: number;
}

export async function measure(baseUrl: string, file: string, keep: string | undefined): Promise<Figure[]> {
  const expected = await expectedSheets(file);
  if (expected.length !== SHEETS) throw new Error(`the invented file gives ${expected.length} sheets, not ${SHEETS}`);
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
  const dir = keep ?? (await mkdtemp(join(tmpdir(), 'hundredfold-bench-batch-')));
  mkdirSync(dir, { recursive: true });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/checkups`);
    await page.waitForFunction(() => !(document.querySelector('input[type="file"]') as HTMLInputElement | null)?.disabled);
    await page.getByLabel(/Checkup file/).setInputFiles(file);
    await page.getByRole('button', { name: 'Confirm the columns and process' }).click({ timeout: 60_000 });
    await page.getByTestId('summary').waitFor({ timeout: 120_000 });
    await page.getByLabel(/^All workers who fit the exposure/).check();
    await page.getByLabel('Print each worker\u2019s id in small print', { exact: true }).check();
    await page.evaluate(ARM);
    if (TRACE) await browser.startTracing(page, { categories: TRACE_CATEGORIES });
    await page.getByRole('button', { name: `Prepare ${SHEETS} handouts` }).click();
    // Polled with the page's own querySelector, once a second: Playwright's selector engine walks
    // the whole document in script, which over 500 pages is itself a long task.
    await page.waitForFunction(() => document.querySelector('[data-testid="batch-print"][data-ready="true"]') !== null, null, { polling: 1000, timeout: 600_000 });
    const readyAt = (await page.evaluate('window.__readyAt')) as number;
    const clickAt = (await page.evaluate('window.__clickAt')) as number;
    const preparedMs = Math.round(readyAt - clickAt);
    await page.waitForTimeout(300);
    const long = ((await page.evaluate('window.__long')) as LongTask[]).filter((l) => l.start + l.duration >= clickAt && l.start <= readyAt + 300);
    const longest = Math.max(0, ...long.map((l) => l.duration));
    for (const l of long) if (l.duration > 50) process.stderr.write(`long task (wall) while preparing, at +${Math.round(l.start - clickAt)} ms: ${Math.round(l.duration)} ms\n`);
    const status = await page.getByTestId('batch-status').textContent();
    const traced: Figure[] = [];
    if (TRACE) {
      // The window ends when the pages are ready (marked by the page itself): what the bench does
      // afterwards (Playwright's selector engine walking 500 pages) is not the screen's work.
      const buffer = await browser.stopTracing();
      writeFileSync(TRACE, buffer);
      const summary = traceTasks(JSON.parse(buffer.toString('utf8')) as Parameters<typeof traceTasks>[0], 'bench:prepare', 'bench:ready', 30);
      for (const t of summary.long) process.stderr.write(`task over 30 ms of thread time while preparing, at +${t.at} ms: thread ${t.thread} ms, wall ${t.wall} ms: ${t.inside.join(', ')}\n`);
      traced.push(
        { name: 'trace: longest main-thread task while preparing (thread time)', value: summary.longestThread, unit: 'ms', target: 50, better: 'lower' },
        { name: 'trace: the same, wall time', value: summary.longestWall, unit: 'ms', better: 'lower' },
        { name: 'trace: main-thread tasks over 50 ms of thread time while preparing', value: summary.long.filter((t) => t.thread > 50).length, unit: 'tasks', target: 0, better: 'lower' },
        { name: 'trace: garbage collection on the main thread while preparing', value: summary.gc, unit: 'ms', better: 'lower' },
      );
    }

    const t1 = Date.now();
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    const printMs = Date.now() - t1;
    const pdfPath = join(dir, 'batch-500.pdf');
    writeFileSync(pdfPath, pdf);
    const info = execFileSync('pdfinfo', [pdfPath]).toString();
    const pages = Number(/^Pages:\s+(\d+)$/m.exec(info)?.[1] ?? 0);
    if (pages !== SHEETS) throw new Error(`the PDF has ${pages} pages, not ${SHEETS}`);
    // One pdftotext over the whole file; pages are separated by form feeds.
    const texts = execFileSync('pdftotext', ['-raw', pdfPath, '-'], { maxBuffer: 256 * 1024 * 1024 }).toString().split('\f').map(squash);
    const caution = squash(CAUTION_TEXT);
    expected.forEach((h, i) => {
      const text = texts[i] ?? '';
      const where = `page ${i + 1} (${h.worker})`;
      const ids = text.match(/W\d{7}/g) ?? [];
      if (ids.length !== 1 || ids[0] !== h.worker) throw new Error(`${where}: worker ids ${JSON.stringify(ids)}`);
      if (!text.includes(`Worker ${h.worker}`)) throw new Error(`${where}: no id line`);
      if (!text.includes(caution)) throw new Error(`${where}: no caution`);
      for (const line of [h.sheet.text.reference.caption, h.sheet.text.exposed.caption, ...(h.sheet.ownResults?.items ?? [])]) {
        if (!text.includes(squash(line))) throw new Error(`${where}: missing "${line}"`);
      }
      if (!h.sheet.ownResults) throw new Error(`${where}: the sheet has no own results`);
    });
    if (keep) {
      for (const n of [1, 2, 250, 500]) execFileSync('pdftoppm', ['-png', '-r', '50', '-f', String(n), '-l', String(n), pdfPath, join(dir, `page-${n}`)]);
    }
    const distinct = new Set(expected.map((h) => h.sheetKey)).size;
    return [
      { name: `batch handouts, ${SHEETS} workers: Prepare → pages ready (results read again, sheets built and put in)`, value: preparedMs, unit: 'ms', better: 'lower' },
      { name: 'batch handouts: longest main-thread task while preparing', value: Math.round(longest), unit: 'ms', target: 50, better: 'lower' },
      { name: 'batch handouts: main-thread tasks over 50 ms while preparing', value: long.filter((l) => l.duration > 50).length, unit: 'tasks', target: 0, better: 'lower' },
      { name: `batch handouts: print to PDF (page.pdf, A4), ${SHEETS} pages checked with pdftotext (${distinct} distinct sheets drawn; screen said "${status}")`, value: printMs, unit: 'ms', better: 'lower' },
      { name: 'batch handouts: PDF size', value: Math.round(pdf.length / 1024), unit: 'KiB', better: 'lower' },
      ...traced,
    ];
  } finally {
    await browser.close();
    if (!keep) await rm(dir, { recursive: true, force: true });
  }
}

export async function run(): Promise<Figure[]> {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium is missing at ${CHROMIUM}: install it with \`apt-get install chromium\``);
  const dir = await mkdtemp(join(tmpdir(), 'hundredfold-bench-batch-file-'));
  const file = join(dir, 'checkups.csv');
  await writeWorkforce(file, WORKERS, 5, true);
  try {
    if (process.env.BENCH_BASE_URL) return await measure(process.env.BENCH_BASE_URL, file, process.env.BENCH_KEEP);
    build();
    const port = await sparePort();
    const server = await startServer(port);
    try {
      return await measure(`http://127.0.0.1:${port}`, file, process.env.BENCH_KEEP);
    } finally {
      stopServer(server);
    }
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

runWhenAlone(import.meta.url, run, 'batch handouts bench');
