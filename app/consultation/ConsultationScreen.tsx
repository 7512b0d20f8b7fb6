'use client';
/**
 * The consultation screen on `/`: the form on one side, the result on the other.
 *
 * - react-hook-form with a zod resolver built on the engine's schemas (./formModel.ts).
 * - The result is recomputed from the current values on every change, through the same
 *   pipeline as the resolver; when any input is invalid there is no result at all.
 * - The address holds the whole scenario through the link codec (lib/link): a link opens
 *   exactly that screen, and reloading keeps it. Nothing is sent anywhere while typing.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { memo, useEffect, useMemo, useState } from 'react';
import { FormProvider, useForm, useWatch, type Control } from 'react-hook-form';
import type { z } from 'zod';
import { DEMO_EVIDENCE, DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { fail, type Issue } from '@/lib/result';
import { DEMO_HEART_FAILURE_10Y, DEMO_TABLES } from '@/lib/tables/demo';
import type { PopulationTable } from '@/lib/tables/schema';
import { BaselineSection } from './BaselineSection';
import { EvidenceSection } from './EvidenceSection';
import {
  EMPTY_FORM_VALUES,
  evidenceToFormValues,
  formInputSchema,
  formToOutcome,
  makeConsultationSchema,
  scenarioToFormValues,
  type ConsultationFormValues,
} from './formModel';
import { preloadFigures, ResultPanel } from './ResultPanel';
import { SettingsSection } from './SettingsSection';

type Schema = ReturnType<typeof makeConsultationSchema>;

/**
 * The link codec is only needed once the page is running (to read the address, and to write
 * it when a result is valid), so it is fetched then instead of with the page.
 */
let linkCodec: Promise<typeof import('@/lib/link')> | undefined;
function loadLinkCodec(): Promise<typeof import('@/lib/link')> {
  linkCodec ??= import('@/lib/link');
  return linkCodec;
}

const Baseline = memo(BaselineSection);
const Evidence = memo(EvidenceSection);
const Settings = memo(SettingsSection);

/** An example the clinician can load with one click: demo table and demo evidence, both invented. */
export function exampleValues(): ConsultationFormValues {
  return {
    ...EMPTY_FORM_VALUES,
    baselineSource: 'table',
    tableId: DEMO_HEART_FAILURE_10Y.id,
    person: { age: '55', sex: 'male' },
    evidenceId: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id,
    ...evidenceToFormValues(DEMO_WORKFORCE_HBA1C_HEART_FAILURE),
  };
}

function LiveResult({ control, tables }: { control: Control<z.input<Schema>, unknown, z.output<Schema>>; tables: readonly PopulationTable[] }) {
  const values = useWatch({ control });
  const outcome = useMemo(() => {
    const shaped = formInputSchema.safeParse(values);
    if (!shaped.success) return fail<never>([{ code: 'invalid', path: [], message: 'The form is incomplete' }]);
    return formToOutcome(shaped.data, tables);
  }, [values, tables]);

  useEffect(() => {
    if (!outcome.ok) return;
    let current = true;
    void loadLinkCodec().then(({ encodeScenarioLink }) => {
      if (!current) return;
      const path = encodeScenarioLink(outcome.value.scenario);
      if (path !== `${window.location.pathname}${window.location.search}`) window.history.replaceState(null, '', path);
    });
    return () => {
      current = false;
    };
  }, [outcome]);

  return <ResultPanel outcome={outcome} />;
}

export function ConsultationScreen({
  tables = DEMO_TABLES,
  entries = DEMO_EVIDENCE,
}: {
  tables?: readonly PopulationTable[];
  entries?: readonly EvidenceEntry[];
}) {
  const schema = useMemo(() => makeConsultationSchema(tables), [tables]);
  const methods = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(schema),
    defaultValues: EMPTY_FORM_VALUES,
    mode: 'onChange',
    delayError: 350,
  });
  const [linkIssues, setLinkIssues] = useState<readonly Issue[]>([]);
  const { reset } = methods;

  // The result's drawing code is fetched once the page is idle, before any result is due.
  useEffect(() => {
    const idle = window.requestIdleCallback ?? ((run: () => void) => window.setTimeout(run, 200));
    idle(() => {
      preloadFigures();
      void loadLinkCodec();
    });
  }, []);

  // A scenario in the address (a copied link, a reload, a `hundredfold link` path) fills the form.
  useEffect(() => {
    // The address is outside React and is read once, after hydration (the page is static).
    const query = window.location.search.replace(/^\?/, '');
    if (query === '') return;
    void loadLinkCodec().then(({ decodeScenarioQuery }) => {
      const decoded = decodeScenarioQuery(query);
      if (decoded.ok) reset(scenarioToFormValues(decoded.value, tables));
      else setLinkIssues(decoded.issues);
    });
  }, [reset, tables]);

  return (
    <FormProvider {...methods}>
      <div className="screen">
        <div className="screen__form">
          <div className="intro">
            <h1>Hundredfold</h1>
            <p>
              Turn a published relative effect and a population baseline into absolute numbers for the person in front of you. The result
              updates as you type. Nothing you type is sent anywhere: the scenario stays in this page and its address.
            </p>
            <div className="intro__actions">
              <button type="button" className="button button--secondary" onClick={() => reset(exampleValues())} data-testid="load-example">
                Fill in an example (illustrative numbers)
              </button>
              <button type="button" className="button button--quiet" onClick={() => { reset(EMPTY_FORM_VALUES); window.history.replaceState(null, '', '/'); }}>
                Clear the form
              </button>
            </div>
            {linkIssues.length > 0 ? (
              <div className="link-problem" role="alert">
                <p>This link could not be read, so the form starts empty:</p>
                <ul>
                  {linkIssues.map((issue) => (
                    <li key={`${issue.path.join('.')}-${issue.code}`}>{issue.message}</li>
                  ))}
                </ul>
              </div>
            ) : null}
          </div>
          <form className="form" noValidate aria-label="Scenario" onSubmit={(event) => event.preventDefault()}>
            <Baseline tables={tables} />
            <Evidence entries={entries} />
            <Settings />
          </form>
        </div>
        <div className="screen__result">
          <LiveResult control={methods.control} tables={tables} />
        </div>
      </div>
    </FormProvider>
  );
}

export default ConsultationScreen;
