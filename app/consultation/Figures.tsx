'use client';
/**
 * A valid result, in order: the caution (first, not dismissible), the illustrative band for
 * demo data, who the figures are for, "Copy link" and "Prepare handout", the pictures and
 * sentences for the person, the clinician's figures and warnings, the charts and how it was
 * all worked out. Everything shown comes from the view model (lib/consultation).
 */
import { lazy, Suspense, useEffect, useMemo, useState } from 'react';
import { Caution } from '@/app/components/Caution';
import { consultationDetails, type ConsultationView } from '@/lib/consultation';
import type { GlucoseHistory } from '@/lib/glycaemia/parse';
import { ClinicianPanel } from './ClinicianPanel';
import type { FormFigures } from '@/lib/consultation/formValues';
import { PatientView } from './PatientView';
import { IssueLinks } from './IssueLinks';
import { ShareBar } from './ShareBar';
import { WorkedOut } from './WorkedOut';

/** The chart library is large and below the fold: it loads on demand. */
const Charts = lazy(() => import('./Charts'));

/** How long the inputs must rest before the charts and the worked-out steps redraw (ms). */
const SETTLE_MS = 120;

/**
 * The value once it has stopped changing for {@link SETTLE_MS}: the charts redraw after the
 * frame that shows the new numbers, not before it. While they wait they are marked busy.
 */
function useSettled<T>(value: T): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = window.setTimeout(() => setSettled(value), SETTLE_MS);
    return () => window.clearTimeout(timer);
  }, [value]);
  return settled;
}

export function Figures({ figures, view, handoutHistory = null }: { figures: FormFigures; view: ConsultationView; handoutHistory?: GlucoseHistory | null }) {
  // The pictures, sentences and figures update at once; the charts and the worked-out steps
  // follow once typing pauses, so a keystroke is never held up by drawing the charts.
  const later = useSettled(figures);
  const waiting = later !== figures;
  const details = useMemo(() => consultationDetails(later), [later]);

  return (
    <div className="result__body" data-testid="result">
      <Caution />
      {view.illustrativeBand ? (
        <p className="illustrative-band" role="note" data-testid="illustrative-band">
          {view.illustrativeBand}
        </p>
      ) : null}
      {view.rangeNote ? (
        <p className="range-note" role="note" data-testid="diabetes-range-note">
          <strong>For the clinician:</strong> {view.rangeNote.message}
        </p>
      ) : null}
      <p className="result__context" data-testid="result-context">
        {view.contextLine}
      </p>
      {view.entryNotice ? (
        <p className="entry-notice" role="note" data-testid="entry-notice">
          {view.entryNotice}
        </p>
      ) : null}
      <ShareBar scenario={figures.scenario} handoutAllowed={view.handoutAllowed} history={handoutHistory} />
      {view.capped ? (
        <div className="capped" role="note" data-testid="capped">
          <p className="capped__title">{view.capped.title}</p>
          <p>{view.capped.text}</p>
        </div>
      ) : null}
      {view.wordsNeeded.issues.length > 0 ? (
        <div className="words-needed" data-testid="words-needed">
          <p id="words-needed-heading">{view.wordsNeeded.lead}</p>
          <IssueLinks issues={view.wordsNeeded.issues} labelledBy="words-needed-heading" />
        </div>
      ) : null}
      {view.patient ? <PatientView view={view.patient} /> : null}
      <ClinicianPanel view={view.clinician} />
      <div className={waiting ? 'settling settling--busy' : 'settling'} aria-busy={waiting} data-testid="settling">
        {details.charts ? (
          <Suspense fallback={<p className="charts__loading">Loading the charts…</p>}>
            <Charts view={details.charts} />
          </Suspense>
        ) : null}
        <WorkedOut steps={details.steps} />
      </div>
    </div>
  );
}

export default Figures;
