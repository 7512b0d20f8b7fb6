'use client';
/**
 * The glucose history as an optional part of a screen: a button opens and closes it, and the
 * section's code (./GlucoseHistory.tsx) is fetched only when it is first opened, so it does not
 * weigh on the page's first load. The rows live in the holder the screen passes in
 * (./useGlucoseHistory.ts): closing the section keeps them, and says so.
 */
import { lazy, Suspense } from 'react';
import type { GlucoseHistoryHolder } from './useGlucoseHistory';

const GlucoseHistory = lazy(() => import('./GlucoseHistory').then((m) => ({ default: m.GlucoseHistory })));

export function GlucoseSection({ history }: { history: GlucoseHistoryHolder }) {
  const kept = history.filledRows;
  return (
    <div className="optional" data-testid="glucose-section">
      <button type="button" className="button button--secondary" aria-expanded={history.open} onClick={() => history.setOpen(!history.open)}>
        {history.open ? 'Close the glucose history' : 'Check the person’s glucose history against the study’s exposure'}
      </button>
      {!history.open && kept > 0 ? (
        <p className="field__hint" data-testid="glucose-kept">
          {kept === 1 ? '1 checkup row is' : `${kept} checkup rows are`} kept while the glucose history is closed; the result does not use
          {kept === 1 ? ' it' : ' them'} until you open it again.
        </p>
      ) : null}
      {history.open ? (
        <Suspense fallback={<p className="charts__loading">Loading the glucose history…</p>}>
          <GlucoseHistory history={history} />
        </Suspense>
      ) : null}
    </div>
  );
}

export default GlucoseSection;
