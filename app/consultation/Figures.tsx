'use client';
/**
 * A valid result, in order: the caution (first, not dismissible), who the figures are for,
 * "Copy link" and "Prepare handout", the pictures and sentences for the person, the clinician's
 * figures and warnings, the charts and how it was all worked out.
 */
import { lazy, Suspense, useMemo } from 'react';
import { Caution } from '@/app/components/Caution';
import { riskByHorizon } from '@/lib/chart/riskByHorizon';
import { explainSteps } from '@/lib/explain/steps';
import { clinicianText } from '@/lib/wording/clinician';
import { formatCount, overTheNext } from '@/lib/wording/format';
import { ClinicianPanel } from './ClinicianPanel';
import type { FormOutcome } from './formModel';
import { PatientView } from './PatientView';
import { ShareBar } from './ShareBar';
import { WorkedOut } from './WorkedOut';

/** The chart library is large and below the fold: it loads on demand. */
const Charts = lazy(() => import('./Charts'));

export function Figures({ outcome }: { outcome: FormOutcome }) {
  const { scenario, result, patient, table, lookup } = outcome;
  const clinician = useMemo(() => clinicianText(result, scenario.wording), [result, scenario.wording]);
  const points = useMemo(() => riskByHorizon(scenario, result.horizonYears), [scenario, result.horizonYears]);
  const steps = useMemo(() => explainSteps({ scenario, result, table, stratum: lookup?.stratum }), [scenario, result, table, lookup]);
  const counts = result.iconArray;
  return (
    <div className="result__body" data-testid="result">
      <Caution />
      <p className="result__context" data-testid="result-context">
        {`Figures for ${outcome.people}, ${overTheNext(result.horizonYears)}. Each picture shows ${formatCount(counts.denominator)} people (${counts.automatic ? 'number chosen automatically' : 'number chosen by the clinician'}).`}
        {table ? ` Baseline from “${table.title}”.` : ''}
      </p>
      <ShareBar scenario={scenario} />
      <PatientView text={patient} />
      <ClinicianPanel text={clinician} teachBack={patient.teachBack} teachBackIntro={patient.teachBackIntro} />
      {points.ok ? (
        <Suspense fallback={<p className="charts__loading">Loading the charts…</p>}>
          <Charts
            result={result}
            points={points.value}
            absoluteSentence={clinician.absoluteRisks}
            groups={{ exposed: patient.exposedGroup, comparison: patient.comparisonGroup }}
            names={{ exposed: patient.exposed.heading, comparison: patient.reference.heading }}
          />
        </Suspense>
      ) : null}
      <WorkedOut steps={steps} />
    </div>
  );
}

export default Figures;
