'use client';
/**
 * The consultation screen on `/`: the form on one side, the result on the other.
 *
 * Data flow, once per change (DEVELOPERS.md "Follow a number"):
 * - react-hook-form holds the text as typed. The list of tables (bundled plus those taken from
 *   the clinic library) is derived while rendering and handed to the resolver as its context.
 * - The resolver and the result ask one pipeline (lib/consultation/pipeline.ts → lib/consultation/formValues.ts
 *   formToFigures) for the same values; it runs the engine once and answers both.
 * - The result panel renders the view model from lib/consultation (consultationView); it
 *   computes nothing.
 * - The address holds the whole scenario through the link codec (lib/link): a link opens
 *   exactly that screen, and reloading keeps it. Nothing is sent anywhere while typing.
 */
import { toNestErrors } from '@hookform/resolvers';
import { memo, useCallback, useEffect, useMemo, useState } from 'react';
import { useHydrated } from '@/app/components/useHydrated';
import { FormProvider, useForm, useWatch, type FieldError, type Resolver } from 'react-hook-form';
import { checkEntry, type EntryCheck, type WordingField } from '@/lib/consultation/entry';
import { DEMO_EVIDENCE, DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { LinkReading } from '@/lib/link';
import { LinkNotice } from '@/app/link/LinkNotice';
import { IssueNotice } from '@/app/components/IssueNotice';
import { pushEmptyScenarioLink, useScenarioLink, writeScenarioLink } from '@/app/link/useScenarioLink';
import { useGlucoseHistory } from '@/app/components/glucose/useGlucoseHistory';
import { useWorkerHandOver } from '@/app/checkups/workerHandOver';
import { DEMO_HEART_FAILURE_10Y, DEMO_TABLES } from '@/lib/tables/demo';
import { SEE_RESULT, SEE_STILL_NEEDED } from '@/lib/wording/screen';
import type { PopulationTable } from '@/lib/tables/schema';
import { BaselineSection } from './BaselineSection';
import { EvidenceSection } from './EvidenceSection';
import { EMPTY_FORM_VALUES, formExposure, formInputSchema, type ConsultationFormValues } from '@/lib/consultation/formValues';
import { createResultLinkStore, ResultLinkContext } from './fields';
import { GlucoseSection, LibrarySection } from './OptionalSections';
import { createFormPipeline, sameFormValues, type FormPipeline } from '@/lib/consultation/pipeline';
import { preloadFigures, ResultPanel } from './ResultPanel';
import { SettingsSection } from './SettingsSection';

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
const Glucose = memo(GlucoseSection);
const Library = memo(LibrarySection);

/** What the resolver is handed on every run: the tables the clinician can pick from now. */
interface ResolverContext {
  readonly tables: readonly PopulationTable[];
}

/** A resolver over the shared pipeline: the pipeline's issues become field errors. */
function pipelineResolver(pipeline: FormPipeline): Resolver<ConsultationFormValues, ResolverContext> {
  return (values, context, options) => {
    const outcome = pipeline(values, context?.tables ?? []);
    if (outcome.ok) return { values, errors: {} };
    const flat: Record<string, FieldError> = {};
    for (const issue of outcome.issues) {
      const name = issue.path.join('.');
      if (name !== '' && flat[name] === undefined) flat[name] = { type: issue.code, message: issue.message };
    }
    return { values: {}, errors: toNestErrors(flat, options) };
  };
}

/** An example the clinician can load with one click: demo table and demo evidence, both invented. */
export async function exampleValues(): Promise<ConsultationFormValues> {
  const { evidenceToFormValues } = await import('@/lib/consultation/fromScenario');
  return {
    ...EMPTY_FORM_VALUES,
    baselineSource: 'table',
    tableId: DEMO_HEART_FAILURE_10Y.id,
    person: { age: '55', sex: 'male' },
    evidenceId: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id,
    ...evidenceToFormValues(DEMO_WORKFORCE_HBA1C_HEART_FAILURE),
  };
}

const NO_ENTRY: EntryCheck = { noLongerApplies: false, leftoverFields: [], illustrative: false };

function unique<T extends { id: string }>(bundled: readonly T[], added: readonly T[]): readonly T[] {
  return [...bundled, ...added.filter((item) => !bundled.some((b) => b.id === item.id))];
}

export function ConsultationScreen({
  tables = DEMO_TABLES,
  entries = DEMO_EVIDENCE,
}: {
  tables?: readonly PopulationTable[];
  entries?: readonly EvidenceEntry[];
}) {
  const hydrated = useHydrated();
  // Tables and entries the clinician takes from the clinic library join the bundled ones.
  const [libraryTables, setLibraryTables] = useState<readonly PopulationTable[]>([]);
  const [libraryEntries, setLibraryEntries] = useState<readonly EvidenceEntry[]>([]);
  const [linkReading, setLinkReading] = useState<LinkReading | undefined>(undefined);
  const link = useScenarioLink();
  const allTables = useMemo(() => unique(tables, libraryTables), [tables, libraryTables]);
  const allEntries = useMemo(() => unique(entries, libraryEntries), [entries, libraryEntries]);
  const [pipeline] = useState(createFormPipeline);
  const [resolver] = useState(() => pipelineResolver(pipeline));
  const methods = useForm<ConsultationFormValues, ResolverContext>({
    resolver,
    context: { tables: allTables },
    defaultValues: EMPTY_FORM_VALUES,
    mode: 'onChange',
    delayError: 350,
  });
  const { reset, setValue, getValues, control, trigger, subscribe } = methods;
  const values = useWatch({ control });
  const figures = pipeline(values, allTables);
  // After every change on a narrow screen, a link to the result under the field that changed (./fields.tsx).
  const [resultLink] = useState(() => createResultLinkStore(SEE_STILL_NEEDED));
  useEffect(
    () => subscribe({ formState: { values: true }, callback: ({ name, type }) => resultLink.changed(type === 'change' ? name : undefined) }),
    [subscribe, resultLink],
  );
  useEffect(() => resultLink.setText(figures.ok ? SEE_RESULT : SEE_STILL_NEEDED), [figures.ok, resultLink]);
  // Whether the saved entry the form started from still applies, and which of its words are left.
  const [kept, setKept] = useState<Partial<Record<WordingField, string>>>({});
  const entryCheck = useMemo(() => {
    const shaped = formInputSchema.safeParse(values);
    if (!shaped.success) return NO_ENTRY;
    return checkEntry(allEntries.find((e) => e.id === shaped.data.evidenceId), shaped.data, kept);
  }, [values, allEntries, kept]);
  const keepWording = useCallback((field: WordingField, text: string) => setKept((k) => ({ ...k, [field]: text })), []);
  // The glucose rows live here, so closing their section keeps them; the match is derived from
  // them, against the exposure definition in the form (typed, from an entry, or from a link).
  const exposure = useMemo(() => formExposure(values), [values]);
  const glucose = useGlucoseHistory({ exposure });
  const handOverRefused = useWorkerHandOver({ reset, tables, glucose }); // a worker opened from the checkups worklist

  // When the list of tables changes (one taken from the library, or read back for a link), the
  // form is checked again against the new list: the resolver gets it as its context.
  useEffect(() => {
    if (libraryTables.length > 0) void trigger();
  }, [libraryTables, trigger]);

  const takeLibraryTable = useCallback(
    (table: PopulationTable) => {
      setLibraryTables((list) => [...list.filter((t) => t.id !== table.id), table]);
      // Checked once the list holds the table (the effect above), not now against the old list.
      const options = { shouldDirty: true, shouldTouch: true } as const;
      setValue('baselineSource', 'table', options);
      setValue('tableId', table.id, options);
    },
    [setValue],
  );

  const takeLibraryEntry = useCallback(
    async (entry: EvidenceEntry) => {
      setLibraryEntries((list) => [...list.filter((e) => e.id !== entry.id), entry]);
      const { evidenceToFormValues } = await import('@/lib/consultation/fromScenario');
      const filled = evidenceToFormValues(entry);
      const options = { shouldValidate: true, shouldDirty: true, shouldTouch: true } as const;
      setValue('evidenceId', entry.id, options);
      setValue('effect', filled.effect, options);
      setValue('wording', filled.wording, options);
      setValue('exposure', filled.exposure, options);
    },
    [setValue],
  );

  const useEvidence = useCallback((entry: EvidenceEntry) => void takeLibraryEntry(entry), [takeLibraryEntry]);

  // The address follows a valid scenario.
  const scenario = figures.ok ? figures.value.scenario : undefined;
  useEffect(() => {
    if (!scenario) return;
    let current = true;
    void loadLinkCodec().then(({ encodeScenarioLink }) => {
      if (!current) return;
      writeScenarioLink(encodeScenarioLink(scenario));
    });
    return () => {
      current = false;
    };
  }, [scenario]);

  // The result's drawing code is fetched once the page is idle, before any result is due.
  useEffect(() => {
    const idle = window.requestIdleCallback ?? ((run: () => void) => window.setTimeout(run, 200));
    idle(() => {
      preloadFigures();
      void loadLinkCodec();
      void import('@/lib/consultation/fromScenario');
    });
  }, []);

  // A scenario in the address (a copied link, a reload, a `hundredfold link` path, or Back
  // after "Clear the form") fills the form. The fragment is read after hydration (the page is
  // static): app/link/useScenarioLink.ts.
  useEffect(() => {
    // No scenario in the address (a plain visit, or after "Clear the form"): nothing to read;
    // the notice below is shown only while the address holds a link.
    if (link === undefined || link === '') return;
    let current = true;
    void Promise.all([loadLinkCodec(), import('@/lib/consultation/fromScenario')]).then(async ([{ readScenarioLink }, { scenarioToFormValues }]) => {
      if (!current) return;
      const reading = readScenarioLink(link);
      setLinkReading(reading);
      const decoded = reading.result;
      if (!decoded.ok) return;
      const first = scenarioToFormValues(decoded.value, tables);
      reset(first);
      // A table from this browser's clinic library: once it is read, the form names it as the
      // baseline's source again (only if its stratum still gives the same baseline, which
      // scenarioToFormValues checks, and only if the clinician has not started typing).
      const tableId = decoded.value.tableId;
      if (tableId === undefined || tables.some((t) => t.id === tableId)) return;
      const { openLibrary } = await import('@/app/storage/library');
      const opened = await openLibrary();
      if (!opened.ok) return;
      const got = await opened.value.getTable(tableId);
      if (!current || !got.ok || !sameFormValues(getValues(), first)) return;
      const table = got.value.table;
      setLibraryTables((list) => [...list.filter((t) => t.id !== table.id), table]);
      reset(scenarioToFormValues(decoded.value, [...tables, table]));
    });
    return () => {
      current = false;
    };
  }, [reset, getValues, tables, link]);

  const [cleared, setCleared] = useState<ConsultationFormValues | null>(null);
  function clearForm() {
    const previous = getValues();
    reset(EMPTY_FORM_VALUES);
    // The scenario stays in the history: Back brings it back.
    if (window.location.hash !== '') pushEmptyScenarioLink('/');
    setCleared(sameFormValues(previous, EMPTY_FORM_VALUES) ? null : previous);
  }
  function undoClear() {
    if (cleared) reset(cleared);
    setCleared(null);
  }

  return (
    <FormProvider {...methods}>
      <ResultLinkContext.Provider value={resultLink}>
        <a className="skip-link" href="#result">
          Skip to the result
        </a>
        <div className="screen">
          <div className="screen__form">
            <div className="intro">
              <h1>Hundredfold</h1>
              <p>
                Turn a published relative effect and a population baseline into absolute numbers for the person in front of you. The result
                updates as you type. Nothing you type is sent anywhere: the scenario stays in this page and its address.
              </p>
              <div className="intro__actions">
                <button type="button" className="button button--secondary" disabled={!hydrated} onClick={() => void exampleValues().then((example) => reset(example))} data-testid="load-example">
                  Fill in an example (illustrative numbers)
                </button>
                <button type="button" className="button button--quiet" onClick={clearForm} data-testid="clear-form">
                  Clear the form
                </button>
              </div>
              <a className="see-result" href="#result" data-testid="see-result">
                {figures.ok ? SEE_RESULT : SEE_STILL_NEEDED}
              </a>
              {cleared ? (
                <p className="cleared" role="status" data-testid="cleared">
                  The form was cleared.{' '}
                  <button type="button" className="button button--quiet" onClick={undoClear} data-testid="undo-clear">
                    Undo
                  </button>
                </p>
              ) : null}
              <LinkNotice reading={link ? linkReading : undefined} refused="This link could not be read, so the form starts empty:" />
              {handOverRefused ? <IssueNotice lead={handOverRefused.lead} issues={handOverRefused.issues} testId="handover-notice" /> : null}
            </div>
            <form className="form" noValidate aria-label="Scenario" data-hydrated={hydrated ? 'true' : 'false'} onSubmit={(event) => event.preventDefault()}>
              <Baseline tables={allTables} />
              <Evidence entries={allEntries} entryCheck={entryCheck} onKeepWording={keepWording} />
              <Settings />
            </form>
            <Glucose history={glucose} />
            <Library tables={allTables} entries={allEntries} figures={figures} onUseTable={takeLibraryTable} onUseEvidence={useEvidence} />
          </div>
          <div className="screen__result">
            <ResultPanel figures={figures} extraWarnings={glucose.warnings} entry={entryCheck} handoutHistory={glucose.handoutHistory} />
          </div>
        </div>
      </ResultLinkContext.Provider>
    </FormProvider>
  );
}

export default ConsultationScreen;
