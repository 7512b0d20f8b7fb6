'use client';
/**
 * Batch handouts (issue 10, item 9): choose the workers (all who fit the exposure, all, or the
 * ones ticked in the worklist), the paper and whether each sheet carries the worker's
 * pseudonymous id, then prepare and print them in one print job, one page per worker.
 *
 * Each sheet is lib/checkups `batchHandout`: the sheet /handout makes for the worker's scenario
 * and glucose history, the history read again from the file in the screen's Web Worker, all the
 * chosen workers in one pass (./workerHistories.ts), or from a saved session's rows (the session
 * keeps the rows the engine read, not the file). With neither, the screen says so before anything
 * is prepared, and the sheets have no own results.
 *
 * The pages exist only once the physician asks for them. They are made in short slices (each at
 * most {@link SLICE_MS} of work, then the page gets the thread back), one page put in at a time
 * (./batchPages.tsx draws each distinct sheet once and copies it), with a progress bar and
 * Cancel; they are kept out of sight on screen and printed alone, one page each. Changing the
 * choice clears them.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import { useHydrated } from '@/app/components/useHydrated';
import {
  BATCH_BUTTON_TEXT,
  BATCH_CHOICES,
  BATCH_MESSAGES,
  batchChoiceCounts,
  batchChoiceLabel,
  batchDoneView,
  batchHandout,
  batchSelection,
  batchStatusText,
  batchTally,
  type BatchChoice,
  type BatchTally,
  type BatchWorkerList,
} from '@/lib/checkups/batchHandouts';
import type { Checkup } from '@/lib/glycaemia/schema';
import { PAPER_SIZE_KEYS, PAPER_SIZES, pageRule, type PaperSize } from '@/lib/handout/paper';
import type { CheckupsContext, WorkerResult } from '@/lib/workforce';
import { createPageDrawer, nextTask } from './batchPages';
import type { ReadHistories } from './workerHistories';
import '@/app/components/handout/handout.css';

/**
 * Work done between two pauses, in milliseconds: well under the 50 ms a task may take (the
 * longest single step, one worker's sheet and page, takes a few milliseconds).
 */
const SLICE_MS = 10;

interface Job {
  readonly id: number;
  readonly paper: PaperSize;
  readonly total: number;
  /** Reading the workers' results again from the file, then preparing the pages. */
  readonly stage: 'reading' | 'preparing' | 'done';
  readonly bytesRead: number;
  readonly bytesTotal: number;
  /** Workers handled so far, and pages made. */
  readonly handled: number;
  readonly pages: number;
  /** Said when the file could not be read again (the sheets have no own results). */
  readonly readProblem: string | null;
  /** What is kept of every chosen worker's handout (not the sheet: its page is made), once done. */
  readonly handouts: readonly BatchTally[];
}

export interface BatchHandoutsProps {
  readonly results: readonly WorkerResult[];
  /** The run's settings, checked (lib/workforce prepareCheckups); null when they cannot be. */
  readonly context: CheckupsContext | null;
  /** Workers ticked in the worklist, by position in `results`. */
  readonly ticked: ReadonlySet<number>;
  /** Reads the chosen workers' checkups again from the file; null when there is no file (a saved session). */
  readonly readHistories: ReadHistories | null;
}

export function BatchHandouts({ results, context, ticked, readHistories }: BatchHandoutsProps) {
  const inBrowser = useHydrated();
  const [choice, setChoice] = useState<BatchChoice>('exposed');
  const [paper, setPaper] = useState<PaperSize>('a4');
  const [showIds, setShowIds] = useState(false);
  const [job, setJob] = useState<Job | null>(null);
  const pagesRef = useRef<HTMLDivElement | null>(null);
  const jobCounter = useRef(0);

  const chosen = useMemo(() => batchSelection(results, choice, ticked), [results, choice, ticked]);
  const choiceCounts = useMemo(() => batchChoiceCounts(results, ticked), [results, ticked]);

  // Prepared sheets belong to the choice they were made for: any change clears them.
  const [madeFor, setMadeFor] = useState({ chosen, paper, showIds, readHistories });
  if (madeFor.chosen !== chosen || madeFor.paper !== paper || madeFor.showIds !== showIds || madeFor.readHistories !== readHistories) {
    setMadeFor({ chosen, paper, showIds, readHistories });
    if (job) setJob(null);
  }

  // A job: read the chosen workers' checkups again (one pass over the file), then build each
  // worker's sheet (lib) and put its page in place, a slice at a time.
  const jobId = job?.id;
  useEffect(() => {
    if (jobId === undefined || !context) return;
    const container = pagesRef.current;
    if (!container) return;
    let cancelled = false;
    let cancelRead: (() => void) | null = null;
    const update = (change: Partial<Job>) => setJob((j) => (j && j.id === jobId ? { ...j, ...change } : j));
    const options = { paper, date: new Date(), showIds };
    const drawer = createPageDrawer();

    const prepare = async () => {
      let histories: ReadonlyMap<string, readonly Checkup[]> | undefined;
      if (readHistories) {
        // Each result is read from its packed form when first asked for (lib/checkups/packedResults.ts): the ids a slice at a time.
        const workers: string[] = [];
        let idsStart = performance.now();
        for (const i of chosen) {
          const worker = results[i]?.worker;
          if (worker !== undefined) workers.push(worker);
          if (performance.now() - idsStart > SLICE_MS) {
            await nextTask();
            if (cancelled) return;
            idsStart = performance.now();
          }
        }
        const read = readHistories(workers, (bytesRead, bytesTotal) => update({ bytesRead, bytesTotal }));
        cancelRead = read.cancel;
        const outcome = await read.outcome;
        cancelRead = null;
        if (cancelled) return;
        if (outcome.ok) histories = outcome.histories;
        else update({ readProblem: BATCH_MESSAGES.unreadable(outcome.message) });
      }
      update({ stage: 'preparing' });
      await nextTask();
      const list: BatchTally[] = [];
      let pages = 0;
      let sliceStart = performance.now();
      for (const index of chosen) {
        const result = results[index];
        if (!result) continue;
        // Without a file every sheet goes without own results; with one, a worker the pass did not find has none either.
        const handout = batchHandout(result, index, context, options, histories ? (histories.get(result.worker) ?? []) : undefined);
        list.push(batchTally(handout));
        if (handout.kind === 'sheet') {
          if (!drawer.has(handout)) {
            await drawer.draw(handout);
            await nextTask();
            if (cancelled) return;
            sliceStart = performance.now();
          }
          container.append(drawer.page(handout));
          pages++;
        }
        if (performance.now() - sliceStart > SLICE_MS) {
          update({ handled: list.length, pages });
          await nextTask();
          if (cancelled) return;
          sliceStart = performance.now();
        }
      }
      update({ stage: 'done', handled: list.length, pages, handouts: list });
    };
    void prepare();
    return () => {
      cancelled = true;
      cancelRead?.();
      container.replaceChildren();
      drawer.dispose();
    };
    // The job's settings are fixed when it starts (a change clears the job): only a new job restarts this.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [jobId]);

  const prepare = () => {
    if (!context || chosen.length === 0) return;
    jobCounter.current += 1;
    setJob({
      id: jobCounter.current,
      paper,
      total: chosen.length,
      stage: readHistories ? 'reading' : 'preparing',
      bytesRead: 0,
      bytesTotal: 0,
      handled: 0,
      pages: 0,
      readProblem: null,
      handouts: [],
    });
  };

  const done = job?.stage === 'done';
  const doneView = useMemo(() => (job?.stage === 'done' ? batchDoneView(job.handouts) : null), [job]);

  return (
    <section aria-labelledby="batch-heading" className="checkups__section" data-testid="batch">
      <h2 id="batch-heading">Handouts for several workers</h2>
      <p>One page per worker, each the handout the consultation screen would print for that worker&rsquo;s figures and results, all in one print job.</p>
      {readHistories ? null : (
        <p className="checkups__note" data-testid="batch-no-file">
          {BATCH_MESSAGES.noFile}
        </p>
      )}
      <div className="checkups__grid batch__choices">
        <fieldset className="checkups__fieldset">
          <legend>Which workers</legend>
          {BATCH_CHOICES.map((c) => (
            <label key={c} className="checkups__choice">
              <input type="radio" name="batch-choice" value={c} checked={choice === c} onChange={() => setChoice(c)} />
              <span>{batchChoiceLabel(c, choiceCounts[c])}</span>
            </label>
          ))}
        </fieldset>
        <fieldset className="checkups__fieldset">
          <legend>Paper</legend>
          {PAPER_SIZE_KEYS.map((key) => (
            <label key={key} className="checkups__choice">
              <input type="radio" name="batch-paper" value={key} checked={paper === key} onChange={() => setPaper(key)} />
              <span>{PAPER_SIZES[key].label}</span>
            </label>
          ))}
        </fieldset>
        <fieldset className="checkups__fieldset">
          <legend>Worker id</legend>
          <label className="checkups__choice">
            <input type="checkbox" checked={showIds} onChange={(e) => setShowIds(e.target.checked)} />
            <span>Print each worker&rsquo;s id in small print</span>
          </label>
        </fieldset>
      </div>
      <div className="checkups__actions">
        <button type="button" onClick={prepare} disabled={!context || chosen.length === 0 || (job !== null && !done)}>
          {BATCH_BUTTON_TEXT.prepare(chosen.length)}
        </button>
        {job && !done ? (
          <button type="button" onClick={() => setJob(null)}>
            Cancel
          </button>
        ) : null}
        {done && job.pages > 0 ? (
          <button type="button" onClick={() => window.print()} data-testid="batch-print-button">
            {BATCH_BUTTON_TEXT.print(job.pages)}
          </button>
        ) : null}
        {done ? (
          <button type="button" onClick={() => setJob(null)}>
            Clear the prepared handouts
          </button>
        ) : null}
      </div>
      {job?.stage === 'reading' ? (
        <div data-testid="batch-progress">
          <progress aria-label="Reading the workers’ results again" max={job.bytesTotal || 1} value={job.bytesRead} />
          <p>{BATCH_MESSAGES.reading}</p>
        </div>
      ) : null}
      {job?.stage === 'preparing' ? (
        <div data-testid="batch-progress">
          <progress aria-label="Preparing the handouts" max={job.total} value={job.handled} />
          <p>{BATCH_MESSAGES.preparing(job.handled, job.total)}</p>
        </div>
      ) : null}
      {job?.readProblem ? (
        <p className="checkups__message" data-testid="batch-read-problem">
          {job.readProblem}
        </p>
      ) : null}
      <p role="status" data-testid="batch-status">
        {batchStatusText({ chosen: chosen.length, counts: doneView?.counts ?? null, working: job !== null && !done })}
      </p>
      {doneView && doneView.leftOff.lines.length > 0 ? <WorkerList id="batch-left-off" list={doneView.leftOff} /> : null}
      {doneView && doneView.skipped.lines.length > 0 ? <WorkerList id="batch-skipped" list={doneView.skipped} /> : null}
      {inBrowser && job
        ? createPortal(
            <div className="batch-print" data-testid="batch-print" data-paper={job.paper} data-ready={done ? 'true' : 'false'} data-pages={job.pages}>
              <style>{pageRule(job.paper)}</style>
              <div ref={pagesRef} />
            </div>,
            document.body,
          )
        : null}
    </section>
  );
}

/** A titled list of workers in its own scrolling region (`id`: its test id, and its heading's id with "-heading"). */
function WorkerList({ id, list }: { readonly id: string; readonly list: BatchWorkerList }) {
  return (
    <div data-testid={id}>
      <h3 id={`${id}-heading`}>{list.heading}</h3>
      <div className="checkups__problems" tabIndex={0} role="region" aria-labelledby={`${id}-heading`}>
        <ul>
          {list.lines.map((line) => (
            <li key={line.key}>{line.text}</li>
          ))}
        </ul>
      </div>
    </div>
  );
}
