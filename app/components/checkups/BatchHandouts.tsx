'use client';
/**
 * Batch handouts (issue 10, item 9): choose the workers (all who fit the exposure, all, or the
 * ones ticked in the worklist), the paper and whether each sheet carries the worker's
 * pseudonymous id, then prepare and print them in one print job, one page per worker.
 *
 * Each sheet is lib/checkups `batchHandout` (the sheet /handout makes for the worker's
 * scenario), drawn by /handout's own HandoutSheet component. The sheets exist only once the
 * physician asks for them: they are built a few at a time (the page stays responsive, a progress
 * bar says how far), kept out of sight on screen, and printed alone. Changing the choice clears
 * them.
 */
import { memo, useCallback, useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react';
import { createPortal } from 'react-dom';
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

/** Sheets built between two pauses: each takes a few milliseconds, so a slice stays well under 50 ms. */
const PER_SLICE = 4;

interface Job {
  readonly handouts: readonly BatchHandout[];
  readonly total: number;
  readonly paper: PaperSize;
  readonly done: boolean;
}

const subscribeNothing = () => () => {};

/** One printed page; memoized, so adding sheets a few at a time does not redraw the earlier ones. */
const BatchPage = memo(function BatchPage({ handout }: { handout: Extract<BatchHandout, { kind: 'sheet' }> }) {
  return (
    <div className="batch-print__page">
      <HandoutSheet sheet={handout.sheet} idPrefix={`batch-${handout.index}-`} />
      {handout.workerId !== undefined ? <p className="batch-print__id">Worker {handout.workerId}</p> : null}
    </div>
  );
});

export interface BatchHandoutsProps {
  readonly results: readonly WorkerResult[];
  /** The run's settings, checked (lib/workforce prepareCheckups); null when they cannot be. */
  readonly context: CheckupsContext | null;
  /** Workers ticked in the worklist, by position in `results`. */
  readonly ticked: ReadonlySet<number>;
}

export function BatchHandouts({ results, context, ticked }: BatchHandoutsProps) {
  const inBrowser = useSyncExternalStore(subscribeNothing, () => true, () => false);
  const [choice, setChoice] = useState<BatchChoice>('exposed');
  const [paper, setPaper] = useState<PaperSize>('a4');
  const [showIds, setShowIds] = useState(false);
  const [job, setJob] = useState<Job | null>(null);
  const timer = useRef<number | null>(null);

  const chosen = useMemo(() => batchSelection(results, choice, ticked), [results, choice, ticked]);
  const choiceCounts = useMemo(
    () => Object.fromEntries(BATCH_CHOICES.map((c) => [c, c === choice ? chosen.length : batchSelection(results, c, ticked).length])) as Record<BatchChoice, number>,
    [results, choice, chosen, ticked],
  );

  const stop = useCallback(() => {
    if (timer.current !== null) window.clearTimeout(timer.current);
    timer.current = null;
  }, []);
  useEffect(() => stop, [stop]);

  // Prepared sheets belong to the choice they were made for: any change clears them.
  const [madeFor, setMadeFor] = useState({ chosen, paper, showIds });
  if (madeFor.chosen !== chosen || madeFor.paper !== paper || madeFor.showIds !== showIds) {
    setMadeFor({ chosen, paper, showIds });
    if (job) setJob(null);
  }
  useEffect(() => {
    if (job === null) stop();
  }, [job, stop]);

  const prepare = () => {
    if (!context) return;
    stop();
    const options = { paper, date: new Date(), showIds };
    const list: BatchHandout[] = [];
    let at = 0;
    const step = () => {
      const end = Math.min(at + PER_SLICE, chosen.length);
      for (; at < end; at++) {
        const index = chosen[at];
        const result = index === undefined ? undefined : results[index];
        if (index !== undefined && result) list.push(batchHandout(result, index, context, options));
      }
      const done = at >= chosen.length;
      setJob({ handouts: list.slice(), total: chosen.length, paper, done });
      timer.current = done ? null : window.setTimeout(step, 0);
    };
    step();
  };

  const counts = job?.done ? batchCounts(job.handouts) : null;
  const skipped = job?.done ? job.handouts.filter((h): h is Extract<BatchHandout, { kind: 'skipped' }> => h.kind === 'skipped') : [];
  const sheets = job ? job.handouts.filter((h): h is Extract<BatchHandout, { kind: 'sheet' }> => h.kind === 'sheet') : [];

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
          <h3>Workers without a handout</h3>
          <ul className="checkups__problems">
            {skipped.map((h) => (
              <li key={h.index}>
                {h.worker}: {h.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {inBrowser && job && sheets.length > 0
        ? createPortal(
            <div className="batch-print" data-testid="batch-print" data-paper={job.paper} data-ready={job.done ? 'true' : 'false'}>
              <style>{pageRule(job.paper)}</style>
              {sheets.map((h) => (
                <BatchPage key={h.index} handout={h} />
              ))}
            </div>,
            document.body,
          )
        : null}
    </section>
  );
}
