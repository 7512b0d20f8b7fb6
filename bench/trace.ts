/**
 * Main-thread tasks from a Chromium trace (Playwright's `browser.startTracing`, Chrome's trace
 * event format): every top-level task (`RunTask`) of the page's renderer main thread between two
 * `performance.mark`s, with its wall time (`dur`) and its thread time (`tdur`, the time the thread
 * actually ran — on a shared machine the wall time also counts waiting for a core), and what took
 * the time inside the long ones (garbage collection, script, style, layout, paint).
 *
 * The longtask observer measures wall time only; this is what the checkups benchmark reads to say
 * which tasks were long because of the page's own work and which because another process had the
 * core.
 */

/** One event of Chrome's trace event format (the fields read here). */
interface TraceEvent {
  readonly name: string;
  readonly cat?: string;
  readonly ph: string;
  readonly ts: number;
  readonly dur?: number;
  readonly tdur?: number;
  readonly pid: number;
  readonly tid: number;
  readonly args?: { readonly name?: string; readonly data?: { readonly functionName?: string; readonly url?: string; readonly frames?: readonly { readonly processId?: number }[] } };
}

export interface TraceTask {
  /** Milliseconds after the start mark. */
  readonly at: number;
  /** Wall time, ms. */
  readonly wall: number;
  /** Thread (CPU) time, ms. */
  readonly thread: number;
  /** The largest kinds of work inside, by wall time: "MajorGC 120", "FunctionCall 80 (…)". */
  readonly inside: readonly string[];
}

export interface TraceSummary {
  readonly tasks: number;
  /** Tasks over `overMs` of thread time, longest first. */
  readonly long: readonly TraceTask[];
  readonly longestWall: number;
  readonly longestThread: number;
  /** Sum of thread time of all tasks in the window, ms. */
  readonly busy: number;
  /** Garbage collection inside the window (MinorGC + MajorGC wall), ms. */
  readonly gc: number;
}

const GC = new Set(['MinorGC', 'MajorGC', 'V8.GC_SCAVENGER', 'V8.GC_MARK_COMPACTOR', 'BlinkGC.AtomicPhase']);
const INSIDE = new Set([
  'MinorGC',
  'MajorGC',
  'FunctionCall',
  'EventDispatch',
  'TimerFire',
  'FireAnimationFrame',
  'RunMicrotasks',
  'UpdateLayoutTree',
  'Layout',
  'Paint',
  'PrePaint',
  'Layerize',
  'ParseHTML',
  'EvaluateScript',
  'v8.compile',
  'V8.DeserializeMessage',
  'HitTest',
  'ScheduleStyleRecalculation',
]);

function renderersOf(events: readonly TraceEvent[]): Set<number> {
  const pids = new Set<number>();
  for (const e of events) {
    if (e.name === 'TracingStartedInBrowser') for (const f of e.args?.data?.frames ?? []) if (f.processId !== undefined) pids.add(f.processId);
  }
  return pids;
}

/**
 * @param overMs a task is long above this many ms of thread time (the 50)
 */
export function traceTasks(trace: { readonly traceEvents: readonly TraceEvent[] }, fromMark: string, toMark: string, overMs = 50): TraceSummary {
  const events = trace.traceEvents;
  const mainThreads = new Set<string>();
  for (const e of events) if (e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain') mainThreads.add(`${e.pid}:${e.tid}`);
  const pages = renderersOf(events);
  const mark = (name: string) => events.find((e) => e.name === name && (e.ph === 'R' || e.ph === 'I' || e.ph === 'n' || e.ph === 'b' || e.ph === 'X'));
  const from = mark(fromMark);
  const to = mark(toMark);
  if (!from || !to) throw new Error(`the trace has no ${from ? toMark : fromMark} mark`);
  const main = `${from.pid}:${from.tid}`;
  if (!mainThreads.has(main) && pages.size > 0 && !pages.has(from.pid)) throw new Error('the marks are not on a page renderer main thread');
  const onMain = events.filter((e) => `${e.pid}:${e.tid}` === main && e.ph === 'X' && e.dur !== undefined && e.ts + e.dur >= from.ts && e.ts <= to.ts);
  const tasks = onMain.filter((e) => e.name === 'RunTask');
  const long: TraceTask[] = [];
  let busy = 0;
  let gc = 0;
  let longestWall = 0;
  let longestThread = 0;
  for (const e of onMain) if (GC.has(e.name) && (e.name === 'MinorGC' || e.name === 'MajorGC')) gc += (e.dur ?? 0) / 1000;
  for (const t of tasks) {
    const wall = (t.dur ?? 0) / 1000;
    const thread = (t.tdur ?? t.dur ?? 0) / 1000;
    busy += thread;
    longestWall = Math.max(longestWall, wall);
    longestThread = Math.max(longestThread, thread);
    if (thread <= overMs) continue;
    const within = new Map<string, number>();
    for (const e of onMain) {
      if (e === t || !INSIDE.has(e.name) || e.ts < t.ts || e.ts + (e.dur ?? 0) > t.ts + (t.dur ?? 0)) continue;
      const what = e.name === 'FunctionCall' && e.args?.data?.functionName ? `FunctionCall(${e.args.data.functionName})` : e.name;
      within.set(what, (within.get(what) ?? 0) + (e.dur ?? 0) / 1000);
    }
    const inside = [...within.entries()].sort((a, b) => b[1] - a[1]).slice(0, 6).map(([n, ms]) => `${n} ${Math.round(ms)}`);
    long.push({ at: Math.round((t.ts - from.ts) / 1000), wall: Math.round(wall), thread: Math.round(thread), inside });
  }
  long.sort((a, b) => b.thread - a.thread);
  return { tasks: tasks.length, long, longestWall: Math.round(longestWall), longestThread: Math.round(longestThread), busy: Math.round(busy), gc: Math.round(gc) };
}
