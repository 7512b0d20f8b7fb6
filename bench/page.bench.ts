/**
 * The consultation screen (issue 3, "Performance"):
 * - first-load JavaScript of `/` in kB gzip (target ≤ 200): every script the prerendered HTML
 *   of `/` loads, minus the `noModule` polyfills modern browsers skip, each gzipped at level 9
 *   (the level of the `gzip-size` package Next.js used to print First Load JS; from memory) and
 *   summed, 1 kB = 1000 bytes. Chunks loaded later on demand (the result's drawing code once
 *   the page is idle, the charts, the link codec) are reported separately, not hidden;
 * - keystroke to updated result in headless Chromium (target ≤ 50 ms median): with a result on
 *   screen, a key typed into the estimate field (a digit appended, then removed, each a valid
 *   new value), timed from the key event's own timestamp to the first change inside the
 *   result, and to the start of the frame that paints it. Between keystrokes the screen is
 *   left to settle (the charts redraw in a deferred render).
 *
 * It builds the app first (`next build`, ≈ 25 s here) unless BENCH_REUSE_BUILD=1 and a build
 * exists, then serves it with `next start` on a spare port and drives Debian's Chromium.
 *
 * Run alone: `npx tsx bench/page.bench.ts`.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { gzipSync } from 'node:zlib';
import { chromium } from '@playwright/test';
import { median, type Figure } from './figure';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const NEXT_DIR = join(ROOT, '.next');
/** Debian's Chromium and the launch flags that work with it here (as playwright.config.ts); every browser bench launches it so. */
export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_ARGS = ['--no-sandbox', '--headless', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];
const KEYSTROKES = 30;
const WARM_UP = 4;

/** Recognisable strings in a chunk, to say what its bytes are (production chunks carry no module names). */
const MARKERS: readonly (readonly [string, RegExp])[] = [
  ['react-dom', /Minified React error|react-dom|__reactContainer/],
  ['Next.js router', /next-router-state-tree|__next_f|segment-cache|NEXT_ROUTER/],
  ['zod', /ZodError|\$ZodType|_zod/],
  ['react-hook-form', /shouldUnregister|_formControl|useFormContext|criteriaMode/],
  ['engine and wording (lib/)', /risk-odds-ratio|people like you|baseline-form/],
  ['consultation form (app/)', /field-|section__title|baselineSource/],
];

export interface ChunkSize {
  readonly file: string;
  readonly gzipBytes: number;
  readonly contains: readonly string[];
}

function gzipBytes(file: string): number {
  return gzipSync(readFileSync(file), { level: 9 }).length;
}

function describe(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return MARKERS.filter(([, pattern]) => pattern.test(text)).map(([name]) => name);
}

/** The scripts the prerendered `/` loads, largest first; `noModule` polyfills left out. */
export function firstLoadChunks(nextDir = NEXT_DIR): ChunkSize[] {
  const html = readFileSync(join(nextDir, 'server', 'app', 'index.html'), 'utf8');
  const files = new Set<string>();
  for (const match of html.matchAll(/<script\b([^>]*)>/g)) {
    const attributes = match[1] ?? '';
    if (/\bnoModule\b/i.test(attributes)) continue;
    const src = /\bsrc="\/_next\/([^"]+\.js)"/.exec(attributes)?.[1];
    if (src) files.add(src);
  }
  return [...files]
    .map((file) => ({ file, gzipBytes: gzipBytes(join(nextDir, file)), contains: describe(join(nextDir, file)) }))
    .sort((a, b) => b.gzipBytes - a.gzipBytes);
}

/** Every other JavaScript chunk of the build, the ones loaded on demand included (for context). */
function allChunksBytes(nextDir = NEXT_DIR): number {
  const dir = join(nextDir, 'static', 'chunks');
  return readdirSync(dir)
    .filter((name) => name.endsWith('.js'))
    .reduce((sum, name) => sum + gzipBytes(join(dir, name)), 0);
}

function build(): void {
  if (process.env.BENCH_REUSE_BUILD === '1' && existsSync(join(NEXT_DIR, 'server', 'app', 'index.html'))) return;
  const result = spawnSync('npx', ['next', 'build'], { cwd: ROOT, env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1' }, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`next build failed: ${result.stderr.trim().split('\n').slice(-3).join(' ')}`);
}

export function sparePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

export async function startServer(port: number): Promise<ChildProcess> {
  const child = spawn('npx', ['next', 'start', '-p', String(port), '-H', '127.0.0.1'], {
    cwd: ROOT,
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1' },
    stdio: 'ignore',
    detached: true,
  });
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    try {
      const response = await fetch(`http://127.0.0.1:${port}/`);
      if (response.ok) return child;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  stopServer(child);
  throw new Error('next start did not answer within 30 s');
}

export function stopServer(child: ChildProcess): void {
  // The server runs in its own process group (detached): end the group, not just npx.
  if (child.pid !== undefined) {
    try {
      process.kill(-child.pid, 'SIGTERM');
    } catch {
      // already gone
    }
  }
}

interface Latency {
  readonly dom: number;
  readonly frame: number;
}

/*
 * Browser-side code as plain text: tsx compiles functions with a name-keeping helper that does
 * not exist in the page, so page.evaluate gets source it can run as it is.
 */

/** Resolves once nothing on the page has changed for 250 ms (the previous deferred render done). */
const SETTLE = `new Promise((resolve) => {
  let timer;
  const observer = new MutationObserver(() => { clearTimeout(timer); timer = setTimeout(done, 250); });
  const done = () => { observer.disconnect(); resolve(); };
  timer = setTimeout(done, 250);
  observer.observe(document.body, { subtree: true, childList: true, characterData: true, attributes: true });
})`;

/**
 * Arms the measurement for the next key: from the key event's timestamp to the first change
 * inside the result ("dom"), and to the animation-frame callbacks of the frame that paints it
 * ("frame"). Leaves a promise in window.__latency.
 */
const ARM = `window.__latency = new Promise((resolve) => {
  const target = document.querySelector('[data-testid="result"]');
  if (!target) { resolve({ dom: NaN, frame: NaN }); return; }
  let keyAt = NaN;
  const observer = new MutationObserver(() => {
    const changedAt = performance.now();
    observer.disconnect();
    requestAnimationFrame(() => resolve({ dom: changedAt - keyAt, frame: performance.now() - keyAt }));
  });
  document.addEventListener('keydown', (event) => {
    keyAt = event.timeStamp;
    observer.observe(target, { subtree: true, childList: true, characterData: true, attributes: true });
  }, { capture: true, once: true });
}); undefined`;

/** Milliseconds from key events to the first change inside the result, with a result shown. */
export async function keystrokeLatencies(baseUrl: string, keystrokes = KEYSTROKES): Promise<Latency[]> {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium is missing at ${CHROMIUM}: install it with \`apt-get install chromium\``);
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/`);
    await page.getByTestId('load-example').click();
    await page.getByTestId('chart-horizon').waitFor();
    const estimate = page.locator('#field-effect-estimate');
    await estimate.click();
    await page.keyboard.press('End');
    const out: Latency[] = [];
    for (let i = 0; i < keystrokes; i += 1) {
      await page.evaluate(SETTLE);
      await page.evaluate(ARM);
      // "1.6" → "1.65" → "1.6" → …: every keystroke leaves a valid, different estimate.
      await page.keyboard.press(i % 2 === 0 ? '5' : 'Backspace');
      out.push((await page.evaluate('window.__latency')) as Latency);
    }
    return out;
  } finally {
    await browser.close();
  }
}

export async function run(): Promise<Figure[]> {
  build();
  const chunks = firstLoadChunks();
  const firstLoad = chunks.reduce((sum, c) => sum + c.gzipBytes, 0);
  const kB = (bytes: number) => Math.round(bytes / 10) / 100;
  const figures: Figure[] = [{ name: 'page /: first-load JS, gzip', value: kB(firstLoad), unit: 'kB', target: 200, better: 'lower' }];
  for (const chunk of chunks.slice(0, 4)) {
    figures.push({ name: `page /: first-load chunk ${chunk.file.replace('static/chunks/', '')} (${chunk.contains.join(', ') || 'runtime'})`, value: kB(chunk.gzipBytes), unit: 'kB', better: 'lower' });
  }
  figures.push({ name: 'page /: all JS chunks of the build, gzip (on-demand ones included)', value: kB(allChunksBytes()), unit: 'kB', better: 'lower' });

  const port = await sparePort();
  const server = await startServer(port);
  try {
    const latencies = (await keystrokeLatencies(`http://127.0.0.1:${port}`)).slice(WARM_UP);
    figures.push({ name: 'page /: keystroke to updated result, median (headless Chromium)', value: Math.round(median(latencies.map((l) => l.dom)) * 10) / 10, unit: 'ms', target: 50, better: 'lower' });
    figures.push({ name: 'page /: keystroke to the frame after the update, median', value: Math.round(median(latencies.map((l) => l.frame)) * 10) / 10, unit: 'ms', better: 'lower' });
    figures.push({ name: 'page /: keystroke to updated result, slowest', value: Math.round(Math.max(...latencies.map((l) => l.dom)) * 10) / 10, unit: 'ms', better: 'lower' });
  } finally {
    stopServer(server);
  }
  return figures;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  run().then(
    (figures) => {
      for (const f of figures) process.stdout.write(`${f.name}: ${f.value} ${f.unit}${f.target === undefined ? '' : ` (target ≤ ${f.target})`}\n`);
    },
    (error: unknown) => {
      process.stderr.write(`page bench failed: ${error instanceof Error ? error.message : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
