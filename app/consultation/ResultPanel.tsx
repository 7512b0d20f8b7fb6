'use client';
/**
 * The result: the caution first, then the pictures and sentences for the person, the
 * clinician's figures and warnings, the charts and how it was all worked out. Shown only for a
 * complete, valid scenario; otherwise a list of what is still needed, never an old result.
 */
import { lazy, memo, Suspense, useEffect, useState } from 'react';
import type { Issue, Result, Warning } from '@/lib/result';
import { formatCount, overTheNext } from '@/lib/wording/format';
import { fieldDomId, type FieldName } from './fields';
import type { FormOutcome } from './formModel';

/**
 * The figures are drawn by a separate chunk: the page needs the form first, and a result only
 * once the inputs are valid. The screen asks for the chunk as soon as it is idle
 * ({@link preloadFigures}), so it is there by the time a result is. React.lazy rather than
 * next/dynamic: a result is never rendered on the server (the page is static and empty there).
 */
const Figures = lazy(() => import('./Figures'));

export function preloadFigures(): void {
  void import('./Figures');
}

/** How long the result must stay put before the screen reader hears a summary of it (ms). */
const ANNOUNCE_AFTER_MS = 900;

function useQuietAnnouncement(text: string): string {
  const [announced, setAnnounced] = useState('');
  useEffect(() => {
    const timer = window.setTimeout(() => setAnnounced(text), ANNOUNCE_AFTER_MS);
    return () => window.clearTimeout(timer);
  }, [text]);
  return announced;
}

const SHOWN_ISSUES = 8;
const NO_WARNINGS: readonly Warning[] = [];

function Pending({ issues }: { issues: readonly Issue[] }) {
  const shown = issues.slice(0, SHOWN_ISSUES);
  return (
    <div className="pending" data-testid="no-result">
      <p className="pending__lead">No result yet. It appears here as soon as the inputs are complete and valid.</p>
      {shown.length > 0 ? (
        <>
          <p id="pending-list-heading">Still needed or to correct:</p>
          <ul aria-labelledby="pending-list-heading">
            {shown.map((issue) => (
              <li key={`${issue.path.join('.')}-${issue.code}`}>
                <a href={`#${fieldDomId(issue.path.join('.') as FieldName)}`}>{issue.message}</a>
              </li>
            ))}
          </ul>
          {issues.length > shown.length ? <p>…and {issues.length - shown.length} more.</p> : null}
        </>
      ) : null}
    </div>
  );
}

function ResultPanelView({ outcome, extraWarnings = NO_WARNINGS }: { outcome: Result<FormOutcome>; extraWarnings?: readonly Warning[] }) {
  const summary = outcome.ok
    ? `Result updated: figures for ${outcome.value.people}, ${overTheNext(outcome.value.result.horizonYears)}, out of ${formatCount(outcome.value.result.iconArray.denominator)} people.`
    : 'No result: some inputs are missing or need correcting.';
  const announced = useQuietAnnouncement(summary);
  return (
    <section className="result" id="result" aria-labelledby="result-heading">
      <h2 id="result-heading">Result</h2>
      <p className="visually-hidden" role="status" aria-live="polite">
        {announced}
      </p>
      {outcome.ok ? (
        <Suspense fallback={<p className="charts__loading">Preparing the result…</p>}>
          <Figures outcome={outcome.value} extraWarnings={extraWarnings} />
        </Suspense>
      ) : (
        <Pending issues={outcome.issues} />
      )}
    </section>
  );
}

/** Redraws only when the outcome or the extra warnings change. */
export const ResultPanel = memo(ResultPanelView);
