'use client';
/**
 * The consultation screen on `/`: the form on one side, the result on the other.
 *
 * - react-hook-form with a zod resolver built on the engine's schemas (./formModel.ts).
 * - The result is recomputed from the current values on every change, through the same
 *   pipeline as the resolver; when any input is invalid there is no result at all.
 * - The address fragment holds the whole scenario through the link codec (lib/link, read and
 *   written by app/link/useScenarioLink.ts): a link opens exactly that screen, and reloading
 *   keeps it. The fragment is never sent, so nothing typed reaches any server.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { memo, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { flushSync } from 'react-dom';
import { FormProvider, useForm, useWatch, type Control, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { DEMO_EVIDENCE, DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { LinkNotice } from '@/app/link/LinkNotice';
import { useScenarioLink, writeScenarioLink } from '@/app/link/useScenarioLink';
import type { LinkReading } from '@/lib/link';
import { useGlucoseHistory } from '@/app/components/glucose/useGlucoseHistory';
import { fail, type Warning } from '@/lib/result';
import { DEMO_HEART_FAILURE_10Y, DEMO_TABLES } from '@/lib/tables/demo';
import type { PopulationTable } from '@/lib/tables/schema';
import { BaselineSection } from './BaselineSection';
import { EvidenceSection } from './EvidenceSection';
import { EMPTY_FORM_VALUES, formInputSchema, formToOutcome, makeConsultationSchema, type ConsultationFormValues } from './formModel';
import { GlucoseSection, LibrarySection } from './OptionalSections';
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
export async function exampleValues(): Promise<ConsultationFormValues> {
  const { evidenceToFormValues } = await import('./fromScenario');
  return {
    ...EMPTY_FORM_VALUES,
    baselineSource: 'table',
    tableId: DEMO_HEART_FAILURE_10Y.id,
    person: { age: '55', sex: 'male' },
    evidenceId: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id,
    ...evidenceToFormValues(DEMO_WORKFORCE_HBA1C_HEART_FAILURE),
  };
}

interface LiveResultProps {
  readonly control: Control<z.input<Schema>, unknown, z.output<Schema>>;
  readonly tables: readonly PopulationTable[];
  /** Cautions from outside the engine (the glucose history's match), shown with the engine's. */
  readonly extraWarnings: readonly Warning[];
}

function LiveResult({ control, tables, extraWarnings }: LiveResultProps) {
  const values = useWatch({ control });
  // The form re-announces its values after every validation; the result is rebuilt only when
  // they differ, so the screen below redraws once per change.
  const key = JSON.stringify(values);
  const outcome = useMemo(() => {
    const shaped = formInputSchema.safeParse(JSON.parse(key));
    if (!shaped.success) return fail<never>([{ code: 'invalid', path: [], message: 'The form is incomplete' }]);
    return formToOutcome(shaped.data, tables);
  }, [key, tables]);

  useEffect(() => {
    if (!outcome.ok) return;
    let current = true;
    void loadLinkCodec().then(({ encodeScenarioLink }) => {
      if (current) writeScenarioLink(encodeScenarioLink(outcome.value.scenario));
    });
    return () => {
      current = false;
    };
  }, [outcome]);

  return <ResultPanel outcome={outcome} extraWarnings={extraWarnings} />;
}

export function ConsultationScreen({
  tables = DEMO_TABLES,
  entries = DEMO_EVIDENCE,
}: {
  tables?: readonly PopulationTable[];
  entries?: readonly EvidenceEntry[];
}) {
  // Tables and entries the clinician takes from the clinic library join the bundled ones.
  const [libraryTables, setLibraryTables] = useState<readonly PopulationTable[]>([]);
  const [libraryEntries, setLibraryEntries] = useState<readonly EvidenceEntry[]>([]);
  const allTables = useMemo(() => [...tables, ...libraryTables.filter((t) => !tables.some((d) => d.id === t.id))], [tables, libraryTables]);
  const allEntries = useMemo(() => [...entries, ...libraryEntries.filter((e) => !entries.some((d) => d.id === e.id))], [entries, libraryEntries]);
  const tablesRef = useRef(allTables);
  useEffect(() => {
    tablesRef.current = allTables;
  }, [allTables]);
  // The resolver reads the current tables when it runs (never during render), keeping one
  // schema per list of tables.
  const resolverCache = useRef<{ tables: readonly PopulationTable[]; resolve: Resolver<z.input<Schema>, unknown, z.output<Schema>> } | null>(null);
  const resolver = useCallback<Resolver<z.input<Schema>, unknown, z.output<Schema>>>((values, context, options) => {
    const current = tablesRef.current;
    if (resolverCache.current?.tables !== current) {
      resolverCache.current = { tables: current, resolve: zodResolver(makeConsultationSchema(current)) };
    }
    return resolverCache.current.resolve(values, context, options);
  }, []);
  const methods = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver,
    defaultValues: EMPTY_FORM_VALUES,
    mode: 'onChange',
    delayError: 350,
  });
  const [linkReading, setLinkReading] = useState<LinkReading | undefined>(undefined);
  const link = useScenarioLink();
  const { reset, setValue, getValues } = methods;
  // The glucose rows live here, so closing their section keeps them; the match is derived from them.
  const evidenceId = useWatch({ control: methods.control, name: 'evidenceId' });
  const glucose = useGlucoseHistory({ exposure: allEntries.find((e) => e.id === evidenceId)?.exposureDefinition });

  const takeLibraryTable = useCallback(
    (table: PopulationTable) => {
      // The new option must be in the list before the select can take it.
      flushSync(() => setLibraryTables((list) => [...list.filter((t) => t.id !== table.id), table]));
      tablesRef.current = [...tablesRef.current.filter((t) => t.id !== table.id), table];
      const options = { shouldValidate: true, shouldDirty: true, shouldTouch: true } as const;
      setValue('baselineSource', 'table', options);
      setValue('tableId', table.id, options);
    },
    [setValue],
  );

  const takeLibraryEntry = useCallback(
    async (entry: EvidenceEntry) => {
      flushSync(() => setLibraryEntries((list) => [...list.filter((e) => e.id !== entry.id), entry]));
      const { evidenceToFormValues } = await import('./fromScenario');
      const filled = evidenceToFormValues(entry);
      const options = { shouldValidate: true, shouldDirty: true, shouldTouch: true } as const;
      setValue('evidenceId', entry.id, options);
      setValue('effect', filled.effect, options);
      setValue('wording', filled.wording, options);
    },
    [setValue],
  );

  // The result's drawing code is fetched once the page is idle, before any result is due.
  useEffect(() => {
    const idle = window.requestIdleCallback ?? ((run: () => void) => window.setTimeout(run, 200));
    idle(() => {
      preloadFigures();
      void loadLinkCodec();
      void import('./fromScenario');
    });
  }, []);

  // A scenario in the address (a copied link, a reload, a `hundredfold link` path) fills the form.
  useEffect(() => {
    // The address fragment is read after hydration (the page is static): app/link/useScenarioLink.ts.
    if (link === undefined || link === '') return;
    void Promise.all([loadLinkCodec(), import('./fromScenario')]).then(async ([{ readScenarioLink }, { scenarioToFormValues }]) => {
      const reading = readScenarioLink(link);
      setLinkReading(reading);
      const decoded = reading.result;
      if (!decoded.ok) return;
      const first = scenarioToFormValues(decoded.value, tablesRef.current);
      reset(first);
      // A table from this browser's clinic library: once it is read, the form names it as the
      // baseline's source again (only if its stratum still gives the same baseline, which
      // scenarioToFormValues checks, and only if the clinician has not started typing).
      const tableId = decoded.value.tableId;
      if (tableId === undefined || tablesRef.current.some((t) => t.id === tableId)) return;
      const { openLibrary } = await import('@/app/storage/library');
      const opened = await openLibrary();
      if (!opened.ok) return;
      const got = await opened.value.getTable(tableId);
      if (!got.ok || JSON.stringify(getValues()) !== JSON.stringify(first)) return;
      const table = got.value.table;
      flushSync(() => setLibraryTables((list) => [...list.filter((t) => t.id !== table.id), table]));
      tablesRef.current = [...tablesRef.current.filter((t) => t.id !== table.id), table];
      reset(scenarioToFormValues(decoded.value, tablesRef.current));
    });
  }, [reset, getValues, link]);

  return (
    <FormProvider {...methods}>
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
              <button type="button" className="button button--secondary" onClick={() => void exampleValues().then((values) => reset(values))} data-testid="load-example">
                Fill in an example (illustrative numbers)
              </button>
              <button type="button" className="button button--quiet" onClick={() => { reset(EMPTY_FORM_VALUES); window.history.replaceState(null, '', '/'); }}>
                Clear the form
              </button>
            </div>
            <LinkNotice reading={linkReading} refused="This link could not be read, so the form starts empty:" />
          </div>
          <form className="form" noValidate aria-label="Scenario" onSubmit={(event) => event.preventDefault()}>
            <Baseline tables={allTables} />
            <Evidence entries={allEntries} />
            <Settings />
          </form>
          <GlucoseSection history={glucose} />
          <LibrarySection tables={allTables} entries={allEntries} onUseTable={takeLibraryTable} onUseEvidence={(entry) => void takeLibraryEntry(entry)} />
        </div>
        <div className="screen__result">
          <LiveResult control={methods.control} tables={allTables} extraWarnings={glucose.warnings} />
        </div>
      </div>
    </FormProvider>
  );
}

export default ConsultationScreen;
