'use client';
/**
 * A valid result, in order: the caution (first, not dismissible), who the figures are for,
 * "Copy link" and "Prepare handout", the pictures and sentences for the person, the clinician's
 * figures and warnings, the charts and how it was all worked out.
 */
import { lazy, Suspense, useEffect, useMemo, useState } from 'react';
import { Caution } from '@/app/components/Caution';
import { riskByHorizon } from '@/lib/chart/riskByHorizon';
import { explainSteps } from '@/lib/explain/steps';
import type { Warning } from '@/lib/result';
import { clinicianText } from '@/lib/wording/clinician';
import { formatCount, overTheNext } from '@/lib/wording/format';
import { patientText } from '@/lib/wording/patient';
import { ClinicianPanel } from './ClinicianPanel';
import type { FormOutcome } from './formModel';
import { PatientView } from './PatientView';
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

const NO_WARNINGS: readonly Warning[] = [];

export function Figures({ outcome, extraWarnings = NO_WARNINGS }: { outcome: FormOutcome; extraWarnings?: readonly Warning[] }) {
  const { scenario, result, table } = outcome;
  const patientResult = useMemo(
    () => patientText({ result, wording: scenario.wording, people: outcome.people, horizonYears: result.horizonYears }),
    [result, scenario.wording, outcome.people],
  );
  const clinician = useMemo(() => {
    const text = clinicianText(result, scenario.wording);
    return extraWarnings.length > 0 ? { ...text, warnings: [...text.warnings, ...extraWarnings] } : text;
  }, [result, scenario.wording, extraWarnings]);
  const rangeNote = extraWarnings.find((w) => w.code === 'diabetes-range-latest');
  // The pictures, sentences and figures update at once; the charts and the worked-out steps
  // follow once typing pauses, so a keystroke is never held up by drawing the charts.
  const later = useSettled(outcome);
  const waiting = later !== outcome;
  const points = useMemo(() => riskByHorizon(later.scenario, later.result.horizonYears), [later.scenario, later.result.horizonYears]);
  const steps = useMemo(
    () => explainSteps({ scenario: later.scenario, result: later.result, table: later.table, stratum: later.lookup?.stratum }),
    [later],
  );
  const laterClinician = useMemo(() => clinicianText(later.result, later.scenario.wording), [later.result, later.scenario.wording]);
  // Group names for the charts, from the same wording the sentences use.
  const laterPatient = useMemo(
    () => patientText({ result: later.result, wording: later.scenario.wording, people: later.people, horizonYears: later.result.horizonYears }),
    [later],
  );
  const groupWords = laterPatient.ok
    ? [laterPatient.value.exposedGroup, laterPatient.value.comparisonGroup, laterPatient.value.exposed.heading, laterPatient.value.reference.heading]
    : ['', '', '', ''];
  const [exposedGroup = '', comparisonGroup = '', exposedName = '', comparisonName = ''] = groupWords;
  const chartGroups = useMemo(() => ({ exposed: exposedGroup, comparison: comparisonGroup }), [exposedGroup, comparisonGroup]);
  const chartNames = useMemo(() => ({ exposed: exposedName, comparison: comparisonName }), [exposedName, comparisonName]);

  if (!patientResult.ok) {
    // The form checks what the sentences need, so this should not happen; if it does, no figure is shown.
    return (
      <div className="pending" data-testid="no-result">
        <p className="pending__lead">No result: the sentences cannot be written.</p>
        <ul>
          {patientResult.issues.map((issue) => (
            <li key={`${issue.path.join('.')}-${issue.code}`}>{issue.message}</li>
          ))}
        </ul>
      </div>
    );
  }
  const patient = patientResult.value;
  const counts = result.iconArray;
  return (
    <div className="result__body" data-testid="result">
      <Caution />
      {rangeNote ? (
        <p className="range-note" role="note" data-testid="diabetes-range-note">
          <strong>For the clinician:</strong> {rangeNote.message}
        </p>
      ) : null}
      <p className="result__context" data-testid="result-context">
        {`Figures for ${outcome.people}, ${overTheNext(result.horizonYears)}. Each picture shows ${formatCount(counts.denominator)} people (${counts.automatic ? 'number chosen automatically' : 'number chosen by the clinician'}).`}
        {table ? ` Baseline from “${table.title}”.` : ''}
      </p>
      <ShareBar scenario={scenario} />
      <PatientView text={patient} />
      <ClinicianPanel text={clinician} teachBack={patient.teachBack} teachBackIntro={patient.teachBackIntro} />
      <div className={waiting ? 'settling settling--busy' : 'settling'} aria-busy={waiting} data-testid="settling">
        {points.ok && laterPatient.ok ? (
          <Suspense fallback={<p className="charts__loading">Loading the charts…</p>}>
            <Charts result={later.result} points={points.value} absoluteSentence={laterClinician.absoluteRisks} groups={chartGroups} names={chartNames} />
          </Suspense>
        ) : null}
        <WorkedOut steps={steps} />
      </div>
    </div>
  );
}

export default Figures;
