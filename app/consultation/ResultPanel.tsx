'use client';
/**
 * The result: the view model of lib/consultation (consultationView), rendered. Shown as soon
 * as the numbers are valid; otherwise a list of what is still needed, never an old result.
 */
import { lazy, memo, Suspense, useEffect, useMemo, useState } from 'react';
import { consultationView, ENTRY_NO_LONGER_APPLIES, leftoverIssues, type EntryCheck } from '@/lib/consultation';
import type { GlucoseHistory } from '@/lib/glycaemia/parse';
import type { Issue, Result, Warning } from '@/lib/result';
import { NO_RESULT_ANNOUNCEMENT, NO_RESULT_LEAD } from '@/lib/wording/screen';
import type { FormFigures } from '@/lib/consultation/formValues';
import { IssueLinks } from './IssueLinks';

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

const NO_WARNINGS: readonly Warning[] = [];

function Pending({ issues }: { issues: readonly Issue[] }) {
  return (
    <div className="pending" data-testid="no-result">
      <p className="pending__lead">{NO_RESULT_LEAD}</p>
      {issues.length > 0 ? (
        <>
          <p id="pending-list-heading">Still needed or to correct:</p>
          <IssueLinks issues={issues} labelledBy="pending-list-heading" />
        </>
      ) : null}
    </div>
  );
}

const NO_ENTRY: EntryCheck = { noLongerApplies: false, leftoverFields: [], illustrative: false };

interface ResultPanelProps {
  readonly figures: Result<FormFigures>;
  readonly extraWarnings?: readonly Warning[];
  /** Whether the saved entry the form started from still applies (lib/consultation/entry.ts). */
  readonly entry?: EntryCheck;
  /** The valid glucose history, handed to /handout with "Prepare handout"; null without one. */
  readonly handoutHistory?: GlucoseHistory | null;
}

function ResultPanelView({ figures, extraWarnings = NO_WARNINGS, entry = NO_ENTRY, handoutHistory = null }: ResultPanelProps) {
  const view = useMemo(() => {
    if (!figures.ok) return undefined;
    const { scenario, result, context, wordsNeeded } = figures.value;
    return consultationView({
      scenario,
      result,
      context,
      wordsNeeded: [...wordsNeeded, ...leftoverIssues(entry)],
      extraWarnings,
      illustrativeEvidence: entry.illustrative,
      entryNotice: entry.noLongerApplies ? ENTRY_NO_LONGER_APPLIES : undefined,
    });
  }, [figures, extraWarnings, entry]);
  const announced = useQuietAnnouncement(view ? view.announcement : NO_RESULT_ANNOUNCEMENT);
  return (
    <section className="result" id="result" aria-labelledby="result-heading" tabIndex={-1}>
      <h2 id="result-heading">Result</h2>
      <p className="visually-hidden" role="status" aria-live="polite">
        {announced}
      </p>
      {figures.ok && view ? (
        <Suspense fallback={<p className="charts__loading">Preparing the result…</p>}>
          <Figures figures={figures.value} view={view} handoutHistory={handoutHistory} />
        </Suspense>
      ) : (
        <Pending issues={figures.ok ? [] : figures.issues} />
      )}
    </section>
  );
}

/** Redraws only when the figures, the extra warnings or the entry check change. */
export const ResultPanel = memo(ResultPanelView);
