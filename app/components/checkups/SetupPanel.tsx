'use client';
/**
 * The checkups set-up: the evidence entry and population table (the bundled demo ones, marked
 * illustrative, and those saved in this browser's clinic library), the criteria set and the
 * horizon. Which entries can be used, and the sentence when one cannot, come from
 * lib/checkups/setup.ts; the library is read here and again whenever it changes (any tab).
 *
 * `useCheckupsSetup()` holds the choices and resolves them to the entry and table themselves;
 * `<SetupPanel setup={…} />` renders them.
 */
import { useCallback, useEffect, useMemo, useState } from 'react';
import Link from 'next/link';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { DEMO_TABLES } from '@/lib/tables/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { PopulationTable } from '@/lib/tables/schema';
import type { TableSummary } from '@/lib/storage/records';
import { CRITERIA_SETS, type CriteriaSet } from '@/lib/glycaemia/exposure';
import { setupView, type SetupGroup, type SetupOption, type SetupView } from '@/lib/checkups/setup';
import type { SessionSetup } from '@/lib/checkups/session';
import { openLibrary, type Library } from '@/app/storage/library';
import { onLibraryChange } from '@/app/storage/changes';

export interface CheckupsSetup {
  readonly view: SetupView;
  readonly evidenceId: string;
  readonly tableId: string;
  readonly criteria: CriteriaSet;
  readonly horizon: string;
  /** The chosen entry and table themselves (undefined while a saved table is read, or when missing). */
  readonly evidence: EvidenceEntry | undefined;
  readonly table: PopulationTable | undefined;
  /** Why the library's own records are not listed, when they cannot be read. */
  readonly libraryProblem: string | null;
  readonly setEvidenceId: (id: string) => void;
  readonly setTableId: (id: string) => void;
  readonly setCriteria: (criteria: CriteriaSet) => void;
  readonly setHorizon: (horizon: string) => void;
  /** Shows a saved session's set-up (its entry and table as they were saved). */
  readonly restore: (setup: SessionSetup) => void;
}

const DEMO_TABLE_CHOICES = DEMO_TABLES.map((t) => ({ id: t.id, title: t.title, illustrative: t.illustrative }));

export function useCheckupsSetup(): CheckupsSetup {
  const [evidenceId, setEvidenceId] = useState('demo-workforce-hba1c-heart-failure');
  const [tableId, setTableId] = useState('demo-heart-failure-10y');
  const [criteria, setCriteria] = useState<CriteriaSet>('ADA');
  const [horizon, setHorizon] = useState('');
  const [library, setLibrary] = useState<Library | undefined>(undefined);
  const [libraryProblem, setLibraryProblem] = useState<string | null>(null);
  const [savedEvidence, setSavedEvidence] = useState<readonly EvidenceEntry[]>([]);
  const [savedTables, setSavedTables] = useState<readonly TableSummary[]>([]);
  const [revision, setRevision] = useState(0);
  /** A saved session's entry and table, shown even when the library no longer has them. */
  const [restored, setRestored] = useState<SessionSetup | null>(null);
  const [loadedTable, setLoadedTable] = useState<PopulationTable | undefined>(undefined);

  useEffect(() => {
    let live = true;
    let opened: Library | undefined;
    void openLibrary().then((r) => {
      if (!live) {
        if (r.ok) r.value.close();
        return;
      }
      if (r.ok) {
        opened = r.value;
        setLibrary(r.value);
      } else setLibraryProblem(`${r.issues[0]?.message ?? 'The clinic library cannot be read'}; the demo entries and tables can still be used.`);
    });
    const stop = onLibraryChange(() => setRevision((n) => n + 1));
    return () => {
      live = false;
      stop();
      opened?.close();
    };
  }, []);

  useEffect(() => {
    if (!library) return;
    let live = true;
    void Promise.all([library.listEvidence(), library.listTables()]).then(([e, t]) => {
      if (!live) return;
      if (e.ok) setSavedEvidence(e.value.items.map((s) => s.entry));
      if (t.ok) setSavedTables(t.value.items);
    });
    return () => {
      live = false;
    };
  }, [library, revision]);

  const libraryEvidence = useMemo(
    () => (restored && ![...DEMO_EVIDENCE, ...savedEvidence].some((e) => e.id === restored.evidence.id) ? [...savedEvidence, restored.evidence] : savedEvidence),
    [savedEvidence, restored],
  );
  const libraryTables = useMemo(() => {
    const choices = savedTables.map((t) => ({ id: t.id, title: t.title, illustrative: t.illustrative }));
    const r = restored?.table;
    return r && ![...DEMO_TABLE_CHOICES, ...choices].some((t) => t.id === r.id) ? [...choices, { id: r.id, title: r.title, illustrative: r.illustrative }] : choices;
  }, [savedTables, restored]);

  const view = useMemo(
    () => setupView({ demoEvidence: DEMO_EVIDENCE, libraryEvidence, demoTables: DEMO_TABLE_CHOICES, libraryTables, evidenceId, tableId }),
    [libraryEvidence, libraryTables, evidenceId, tableId],
  );

  const evidence = restored?.evidence.id === evidenceId ? restored.evidence : [...DEMO_EVIDENCE, ...libraryEvidence].find((e) => e.id === evidenceId);
  const demoTable = DEMO_TABLES.find((t) => t.id === tableId);
  const restoredTable = restored?.table.id === tableId ? restored.table : undefined;

  // A saved table is read whole only once chosen (the list holds summaries).
  useEffect(() => {
    if (demoTable || restoredTable || !library) return;
    let live = true;
    void library.getTable(tableId).then((r) => {
      if (live) setLoadedTable(r.ok ? r.value.table : undefined);
    });
    return () => {
      live = false;
    };
  }, [library, tableId, demoTable, restoredTable, revision]);

  const table = demoTable ?? restoredTable ?? (loadedTable?.id === tableId ? loadedTable : undefined);

  const restore = useCallback((setup: SessionSetup) => {
    setRestored(setup);
    setEvidenceId(setup.evidence.id);
    setTableId(setup.table.id);
    setCriteria(setup.criteria);
    setHorizon(setup.horizonYears === null ? '' : String(setup.horizonYears));
  }, []);

  return { view, evidenceId, tableId, criteria, horizon, evidence, table, libraryProblem, setEvidenceId, setTableId, setCriteria, setHorizon, restore };
}

/** A choice list in groups (demo, then saved in this browser), as the set-up view model lists them. */
function GroupedSelect({ value, onChange, groups, testId }: { value: string; onChange: (id: string) => void; groups: readonly SetupGroup<SetupOption>[]; testId: string }) {
  return (
    <select value={value} onChange={(e) => onChange(e.target.value)} data-testid={testId}>
      {groups.map((g) => (
        <optgroup key={g.label} label={g.label}>
          {g.options.map((o) => (
            <option key={o.id} value={o.id}>
              {o.label}
            </option>
          ))}
        </optgroup>
      ))}
    </select>
  );
}

/**
 * The chosen option's whole text under its list, for a narrow screen where the closed list cuts
 * it (checkups.css shows it at 480 px and below; a screen reader hears the option's own text).
 */
function Chosen({ text, testId }: { text: string | null; testId: string }) {
  return text === null ? null : (
    <p className="checkups__chosen" data-testid={testId}>
      {text}
    </p>
  );
}

export function SetupPanel({ setup }: { setup: CheckupsSetup }) {
  const { view } = setup;
  return (
    <section aria-labelledby="setup-heading" className="checkups__section">
      <h2 id="setup-heading">Set-up</h2>
      <div className="checkups__grid">
        <div className="checkups__choice-field">
          <label>
            Evidence
            <GroupedSelect value={setup.evidenceId} onChange={setup.setEvidenceId} groups={view.evidenceGroups} testId="setup-evidence" />
          </label>
          <Chosen text={view.chosen.evidence} testId="setup-evidence-chosen" />
        </div>
        <div className="checkups__choice-field">
          <label>
            Population table
            <GroupedSelect value={setup.tableId} onChange={setup.setTableId} groups={view.tableGroups} testId="setup-table" />
          </label>
          <Chosen text={view.chosen.table} testId="setup-table-chosen" />
        </div>
        <label>
          Criteria set
          <select value={setup.criteria} onChange={(e) => setup.setCriteria(e.target.value as CriteriaSet)}>
            {CRITERIA_SETS.map((c) => (
              <option key={c}>{c}</option>
            ))}
          </select>
        </label>
        <label>
          Horizon in years (blank: the table&rsquo;s own period)
          <input inputMode="decimal" value={setup.horizon} onChange={(e) => setup.setHorizon(e.target.value)} />
        </label>
      </div>
      {view.evidenceProblem ? (
        <p role="alert" className="checkups__message" data-testid="setup-problem">
          {view.evidenceProblem}{' '}
          {/* The plain address of the consultation screen: no entry, scenario or worker in it. */}
          <Link href="/" prefetch={false}>
            Add it in the clinic library
          </Link>{' '}
          (on the consultation screen: Clinic library, Open the library, then Edit beside the entry).
        </p>
      ) : null}
      {setup.libraryProblem ? <p className="checkups__note">{setup.libraryProblem}</p> : null}
    </section>
  );
}
