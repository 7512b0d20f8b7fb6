'use client';
/**
 * Batch handouts (issue 10, item 9): choose the workers (all who fit the exposure, all, or the
 * ones ticked in the worklist), the paper and whether each sheet carries the worker's
 * pseudonymous id, then prepare and print them in one print job, one page per worker.
 *
 * Each sheet is lib/checkups `batchHandout` (the sheet /handout makes for the worker's
 * scenario), drawn by /handout's own HandoutSheet component (once per distinct sheet, then copied
 * page by page: see createSheetDrawer). The pages exist only once the physician asks for them:
 * they are made a few at a time (the page stays responsive, a progress bar says how far), kept
 * out of sight on screen, and printed alone, one page each. Changing the choice clears them.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import { useHydrated } from '@/app/components/useHydrated';

import { createPortal, flushSync } from 'react-dom';
import { createRoot, type Root } from 'react-dom/client';
import { HandoutSheet } from '@/app/components/handout/HandoutSheet';
import {
  BATCH_CHOICE_LABELS,
  BATCH_CHOICES,
  batchCounts,
  batchCountsText,
  batchHandout,
  batchSelection,
  type BatchChoice,
  type BatchHandout,
} from '@/lib/checkups/batchHandouts';
import { PAPER_SIZE_KEYS, PAPER_SIZES, pageRule, type PaperSize } from '@/lib/handout/paper';
import type { CheckupsContext, WorkerResult } from '@/lib/workforce';
import '@/app/components/handout/handout.css';

/** Workers handled between two pauses: each sheet takes a few milliseconds to build and to copy. */
const PER_SLICE = 4;

interface Job {
  readonly id: number;
  readonly handouts: readonly BatchHandout[];
  readonly total: number;
  readonly paper: PaperSize;
  readonly done: boolean;
}

type SheetHandout = Extract<BatchHandout, { kind: 'sheet' }>;


/**
 * The drawn sheets of one batch, one per sheet key, drawn by React into elements that are never
 * in the document; each printed page is a copy (`cloneNode`) of one of them. Drawing a sheet of
 * 2,000 icons with React for each of 500 workers took minutes here; most workers of a workforce
 * share a handful of sheets, and a copy is cheap.
 */
function createSheetDrawer() {
  const drawn = new Map<string, { root: Root; element: Element }>();
  return {
    page(handout: SheetHandout): HTMLElement {
      let found = drawn.get(handout.sheetKey);
      if (!found) {
        const holder = document.createElement('div');
        const root = createRoot(holder);
        flushSync(() => root.render(<HandoutSheet sheet={handout.sheet} idPrefix={`batch-${drawn.size}-`} />));
        const element = holder.firstElementChild ?? holder;
        found = { root, element };
        drawn.set(handout.sheetKey, found);
      }
      const page = document.createElement('div');
      page.className = 'batch-print__page';
      page.append(found.element.cloneNode(true));
      if (handout.workerId !== undefined) {
        const id = document.createElement('p');
        id.className = 'batch-print__id';
        id.textContent = `Worker ${handout.workerId}`;
        page.append(id);
      }
      return page;
    },
    dispose() {
      for (const { root } of drawn.values()) root.unmount();
      drawn.clear();
    },
  };
}

export interface BatchHandoutsProps {
  readonly results: readonly WorkerResult[];
  /** The run's settings, checked (lib/workforce prepareCheckups); null when they cannot be. */
  readonly context: CheckupsContext | null;
  /** Workers ticked in the worklist, by position in `results`. */
  readonly ticked: ReadonlySet<number>;
}

export function BatchHandouts({ results, context, ticked }: BatchHandoutsProps) {
  const inBrowser = useHydrated();
  const [choice, setChoice] = useState<BatchChoice>('exposed');
  const [paper, setPaper] = useState<PaperSize>('a4');
  const [showIds, setShowIds] = useState(false);
  const [job, setJob] = useState<Job | null>(null);
  const [pagesReady, setPagesReady] = useState(0);
  const pagesRef = useRef<HTMLDivElement | null>(null);
  const jobCounter = useRef(0);

  const chosen = useMemo(() => batchSelection(results, choice, ticked), [results, choice, ticked]);
  const choiceCounts = useMemo(
    () => Object.fromEntries(BATCH_CHOICES.map((c) => [c, c === choice ? chosen.length : batchSelection(results, c, ticked).length])) as Record<BatchChoice, number>,
    [results, choice, chosen, ticked],
  );

  // Prepared sheets belong to the choice they were made for: any change clears them.
  const [madeFor, setMadeFor] = useState({ chosen, paper, showIds });
  if (madeFor.chosen !== chosen || madeFor.paper !== paper || madeFor.showIds !== showIds) {
    setMadeFor({ chosen, paper, showIds });
    if (job) setJob(null);
  }

  // A job runs a few workers at a time: build each one's sheet (lib), then put its page in place.
  const jobId = job?.id;
  useEffect(() => {
    if (jobId === undefined || !context) return;
    const container = pagesRef.current;
    if (!container) return;
    const drawer = createSheetDrawer();
    const options = { paper, date: new Date(), showIds };
    const list: BatchHandout[] = [];
    let at = 0;
    let pages = 0;
    let timer: number | null = null;
    // The pages wait outside the document and go in together at the end: copies of one sheet
    // share its ids, and each copy put into the document on its own makes the browser re-check
    // every icon already there that refers to those ids (minutes for 500 pages here).
    const added = document.createDocumentFragment();
    const step = () => {
      const end = Math.min(at + PER_SLICE, chosen.length);
      for (; at < end; at++) {
        const index = chosen[at];
        const result = index === undefined ? undefined : results[index];
        if (index === undefined || !result) continue;
        const handout = batchHandout(result, index, context, options);
        list.push(handout);
        if (handout.kind === 'sheet') {
          added.append(drawer.page(handout));
          pages++;
        }
      }
      const done = at >= chosen.length;
      if (done) container.append(added);
      setPagesReady(pages);
      setJob((j) => (j && j.id === jobId ? { ...j, handouts: list.slice(), done } : j));
      timer = done ? null : window.setTimeout(step, 0);
    };
    timer = window.setTimeout(step, 0);
    return () => {
      if (timer !== null) window.clearTimeout(timer);
      drawer.dispose();
      container.replaceChildren();
    };
    // The job's settings are fixed when it starts (a change clears the job): only a new job restarts this.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [jobId]);

  const prepare = () => {
    if (!context || chosen.length === 0) return;
    jobCounter.current += 1;
    setPagesReady(0);
    setJob({ id: jobCounter.current, handouts: [], total: chosen.length, paper, done: false });
  };

  const counts = job?.done ? batchCounts(job.handouts) : null;
  const skipped = job?.done ? job.handouts.filter((h): h is Extract<BatchHandout, { kind: 'skipped' }> => h.kind === 'skipped') : [];
  const sheets = job ? job.handouts.filter((h): h is SheetHandout => h.kind === 'sheet') : [];

  return (
    <section aria-labelledby="batch-heading" className="checkups__section" data-testid="batch">
      <h2 id="batch-heading">Handouts for several workers</h2>
      <p>One page per worker, each the handout the consultation screen would print for that worker&rsquo;s figures, all in one print job.</p>
      <div className="checkups__grid">
        <fieldset className="checkups__fieldset">
          <legend>Which workers</legend>
          {BATCH_CHOICES.map((c) => (
            <label key={c} className="checkups__choice">
              <input type="radio" name="batch-choice" value={c} checked={choice === c} onChange={() => setChoice(c)} />
              {BATCH_CHOICE_LABELS[c]} ({choiceCounts[c]})
            </label>
          ))}
        </fieldset>
        <fieldset className="checkups__fieldset">
          <legend>Paper</legend>
          {PAPER_SIZE_KEYS.map((key) => (
            <label key={key} className="checkups__choice">
              <input type="radio" name="batch-paper" value={key} checked={paper === key} onChange={() => setPaper(key)} />
              {PAPER_SIZES[key].label}
            </label>
          ))}
        </fieldset>
        <fieldset className="checkups__fieldset">
          <legend>Worker id</legend>
          <label className="checkups__choice">
            <input type="checkbox" checked={showIds} onChange={(e) => setShowIds(e.target.checked)} />
            Print each worker&rsquo;s id in small print
          </label>
        </fieldset>
      </div>
      <div className="checkups__actions">
        <button type="button" onClick={prepare} disabled={!context || chosen.length === 0 || (job !== null && !job.done)}>
          Prepare {chosen.length === 1 ? 'the handout' : `${chosen.length} handouts`}
        </button>
        {job && !job.done ? (
          <button type="button" onClick={() => setJob(null)}>
            Cancel
          </button>
        ) : null}
        {job?.done && sheets.length > 0 ? (
          <button type="button" onClick={() => window.print()} data-testid="batch-print-button">
            Print or save as PDF ({sheets.length === 1 ? '1 page' : `${sheets.length} pages`})
          </button>
        ) : null}
        {job?.done ? (
          <button type="button" onClick={() => setJob(null)}>
            Clear the prepared handouts
          </button>
        ) : null}
      </div>
      {job && !job.done ? (
        <>
          <progress aria-label="Preparing the handouts" max={job.total} value={job.handouts.length} />
          <p>
            Preparing handout {job.handouts.length} of {job.total}…
          </p>
        </>
      ) : null}
      <p role="status" data-testid="batch-status">
        {counts ? `Ready. ${batchCountsText(counts)}` : job ? '' : chosen.length === 0 ? batchCountsText({ chosen: 0, sheets: 0, skipped: 0, byReason: {} }) : ''}
      </p>
      {skipped.length > 0 ? (
        <div data-testid="batch-skipped">
          <h3 id="batch-skipped-heading">Workers without a handout ({skipped.length})</h3>
          <div className="checkups__problems" tabIndex={0} role="region" aria-labelledby="batch-skipped-heading">
            <ul>
              {skipped.map((h) => (
                <li key={h.index}>
                  {h.worker}: {h.message}
                </li>
              ))}
            </ul>
          </div>
        </div>
      ) : null}
      {inBrowser && job
        ? createPortal(
            <div className="batch-print" data-testid="batch-print" data-paper={job.paper} data-ready={job.done ? 'true' : 'false'} data-pages={pagesReady}>
              <style>{pageRule(job.paper)}</style>
              <div ref={pagesRef} />
            </div>,
            document.body,
          )
        : null}
    </section>
  );
}
