'use client';
/**
 * The glucose history's state, held by the screen that owns the section (the consultation screen)
 * rather than by the section itself, so that closing the section keeps every row, and the history
 * match is derived from the rows while rendering — never pushed up from the section by an effect.
 *
 *     const glucose = useGlucoseHistory({ exposure });   // in the screen
 *     glucose.warnings                                    // for the result: [] while closed
 *     <GlucoseHistory history={glucose} />                // renders and edits it
 *
 * What is kept: whether the section is open, the rows as typed (drafts, with stable keys), the
 * criteria set the clinician chose (until then the exposure's, else ADA), and the rows the last
 * "Clear all rows" removed, for its undo. What is derived, each render: the section's view model
 * (lib/glycaemia/view.ts) while open, the match with the study's exposure, and the result's
 * warnings. The view module is fetched the first time the section opens, so it does not weigh on
 * the page's first load; until it has arrived `view` is null.
 *
 * While the section is closed the rows are kept but not used: the result carries no glucose
 * warning until it is opened again.
 */
import { useCallback, useEffect, useId, useMemo, useRef, useState } from 'react';
import { localIsoDate } from '@/lib/glycaemia/dates';
import { emptyDraft, isBlankDraft, type CheckupDraft, type DraftField } from '@/lib/glycaemia/draft';
import type { CriteriaSet, ExposureDefinition } from '@/lib/glycaemia/exposure';
import type { HistoryMatch } from '@/lib/glycaemia/match';
import type { GlucoseHistory } from '@/lib/glycaemia/parse';
import type { GlucoseHistoryView } from '@/lib/glycaemia/view';
import type { Warning } from '@/lib/result';

/** One row of the section: a stable key (for React and for field ids) and what was typed. */
export interface GlucoseRow {
  readonly key: string;
  readonly draft: CheckupDraft;
}

/** How rows from a paste or a file join the history. */
export type ImportMode = 'add' | 'replace';

export interface GlucoseHistoryOptions {
  /** The study's exposure definition, when the chosen evidence has one. */
  readonly exposure?: ExposureDefinition | undefined;
  /** Today as YYYY-MM-DD; default the local date (tests pass one). */
  readonly today?: string | undefined;
  /** Start with the section open (a section shown on its own, and tests). Default closed. */
  readonly initiallyOpen?: boolean | undefined;
}

export interface GlucoseHistoryHolder {
  readonly open: boolean;
  readonly rows: readonly GlucoseRow[];
  /** Rows with something typed in them (blank rows are ignored everywhere). */
  readonly filledRows: number;
  /** The criteria set in use: the clinician's choice, else the exposure's, else ADA. */
  readonly criteria: CriteriaSet;
  readonly exposure: ExposureDefinition | undefined;
  readonly today: string;
  /** Everything the section shows; null while closed or while its module is loading. */
  readonly view: GlucoseHistoryView | null;
  /** The history against the exposure; null while closed, without an exposure, or before the rows are valid. */
  readonly match: HistoryMatch | null;
  /** The valid history for the handout's "Your own results"; null while closed or while a row is invalid. */
  readonly handoutHistory: GlucoseHistory | null;
  /** For the result's warnings: the diabetes-range note and the mismatch warning, when present. */
  readonly warnings: readonly Warning[];
  /** How many rows "Clear all rows" removed, while its undo is offered; null otherwise. */
  readonly clearedRows: number | null;
  setOpen(open: boolean): void;
  setCriteria(criteria: CriteriaSet): void;
  setField(key: string, field: DraftField, value: string): void;
  /** Adds a blank row at the end; returns its key (the section moves the focus there). */
  addRow(): string;
  /** Removes a row; the last row is replaced by a blank one. */
  removeRow(key: string): void;
  /** Rows from a paste or a file: added after the filled rows, or replacing every row. Blank rows are dropped. */
  putDrafts(drafts: readonly CheckupDraft[], mode: ImportMode): void;
  /** Removes every row (leaving one blank row) and offers {@link undoClear}. */
  clearAll(): void;
  /** Brings back the rows the last {@link clearAll} removed. */
  undoClear(): void;
}

type ViewModule = typeof import('@/lib/glycaemia/view');
let loadedView: ViewModule | null = null;
let loadingView: Promise<ViewModule> | null = null;

/** Fetches the view module once; later holders get it at once. Tests await it before rendering. */
export function loadGlucoseView(): Promise<ViewModule> {
  loadingView ??= import('@/lib/glycaemia/view').then((m) => {
    loadedView = m;
    return m;
  });
  return loadingView;
}

function sameExposure(a: ExposureDefinition | undefined, b: ExposureDefinition | undefined): boolean {
  if (a === b) return true;
  return (
    a !== undefined &&
    b !== undefined &&
    a.category === b.category &&
    a.criteria === b.criteria &&
    a.minYears === b.minYears &&
    a.test === b.test &&
    a.maxGapMonths === b.maxGapMonths &&
    a.comparison?.category === b.comparison?.category &&
    a.comparison?.minYears === b.comparison?.minYears
  );
}

function sameWarnings(a: readonly Warning[], b: readonly Warning[]): boolean {
  return a.length === b.length && a.every((w, i) => w.code === b[i]?.code && w.message === b[i]?.message);
}

interface Kept {
  readonly open: boolean;
  readonly chosenCriteria: CriteriaSet | null;
  readonly rows: readonly GlucoseRow[];
  readonly cleared: readonly GlucoseRow[] | null;
}

export function useGlucoseHistory({ exposure, today, initiallyOpen = false }: GlucoseHistoryOptions = {}): GlucoseHistoryHolder {
  const id = useId();
  const counter = useRef(0);
  const newKey = useCallback(() => {
    counter.current += 1;
    return `${id}-row-${counter.current}`;
  }, [id]);
  const [kept, setKept] = useState<Kept>(() => ({
    open: initiallyOpen,
    chosenCriteria: null,
    rows: initiallyOpen ? [{ key: `${id}-row-0`, draft: emptyDraft(exposure?.criteria ?? 'ADA') }] : [],
    cleared: null,
  }));
  const [viewModule, setViewModule] = useState<ViewModule | null>(loadedView);
  // An equal exposure in a new object (the screen rebuilds it) keeps the derived match as it is.
  const [stableExposure, setStableExposure] = useState(exposure);
  let currentExposure = stableExposure;
  if (!sameExposure(stableExposure, exposure)) {
    setStableExposure(exposure);
    currentExposure = exposure;
  }
  const criteria = kept.chosenCriteria ?? currentExposure?.criteria ?? 'ADA';
  const day = today ?? localIsoDate();

  useEffect(() => {
    if (!kept.open || viewModule !== null) return;
    let live = true;
    void loadGlucoseView().then((m) => {
      if (live) setViewModule(() => m);
    });
    return () => {
      live = false;
    };
  }, [kept.open, viewModule]);

  const view = useMemo(
    () => (kept.open && viewModule ? viewModule.glucoseHistoryView({ drafts: kept.rows.map((r) => r.draft), criteria, today: day, exposure: currentExposure }) : null),
    [kept.open, kept.rows, viewModule, criteria, day, currentExposure],
  );
  const match = view?.match ?? null;
  // The result's warnings, as the screen had them: the match's diabetes-range note and mismatch.
  // Kept as the same array while their content is the same, so typing that changes nothing in
  // them does not redraw the result.
  const fresh = [match?.diabetesRangeNote, match?.warning].filter((w): w is Warning => w !== undefined);
  const [keptWarnings, setKeptWarnings] = useState<readonly Warning[]>(fresh);
  let warnings = keptWarnings;
  if (!sameWarnings(keptWarnings, fresh)) {
    setKeptWarnings(fresh);
    warnings = fresh;
  }

  const blankRow = useCallback((c: CriteriaSet): GlucoseRow => ({ key: newKey(), draft: emptyDraft(c) }), [newKey]);
  const editRows = useCallback((change: (rows: readonly GlucoseRow[]) => readonly GlucoseRow[]) => setKept((k) => ({ ...k, rows: change(k.rows), cleared: null })), []);

  const setOpen = useCallback(
    (open: boolean) => setKept((k) => ({ ...k, open, rows: open && k.rows.length === 0 ? [blankRow(criteria)] : k.rows })),
    [blankRow, criteria],
  );
  const setCriteria = useCallback((c: CriteriaSet) => setKept((k) => ({ ...k, chosenCriteria: c })), []);
  const setField = useCallback(
    (key: string, field: DraftField, value: string) =>
      editRows((rows) => rows.map((r) => (r.key === key ? { ...r, draft: { ...r.draft, [field]: value } as CheckupDraft } : r))),
    [editRows],
  );
  const addRow = useCallback(() => {
    const row = blankRow(criteria);
    editRows((rows) => [...rows, row]);
    return row.key;
  }, [blankRow, criteria, editRows]);
  const removeRow = useCallback(
    (key: string) =>
      editRows((rows) => {
        const left = rows.filter((r) => r.key !== key);
        return left.length > 0 ? left : [blankRow(criteria)];
      }),
    [blankRow, criteria, editRows],
  );
  const putDrafts = useCallback(
    (drafts: readonly CheckupDraft[], mode: ImportMode) =>
      editRows((rows) => {
        const incoming = drafts.map((draft) => ({ key: newKey(), draft }));
        const all = [...(mode === 'add' ? rows.filter((r) => !isBlankDraft(r.draft)) : []), ...incoming];
        return all.length > 0 ? all : [blankRow(criteria)];
      }),
    [blankRow, criteria, editRows, newKey],
  );
  const clearAll = useCallback(
    () => setKept((k) => ({ ...k, rows: [blankRow(criteria)], cleared: k.rows.some((r) => !isBlankDraft(r.draft)) ? k.rows : null })),
    [blankRow, criteria],
  );
  const undoClear = useCallback(() => setKept((k) => (k.cleared ? { ...k, rows: k.cleared, cleared: null } : k)), []);

  return {
    open: kept.open,
    rows: kept.rows,
    filledRows: kept.rows.filter((r) => !isBlankDraft(r.draft)).length,
    criteria,
    exposure: currentExposure,
    today: day,
    view,
    match,
    handoutHistory: view?.history ?? null,
    warnings,
    clearedRows: kept.cleared ? kept.cleared.filter((r) => !isBlankDraft(r.draft)).length : null,
    setOpen,
    setCriteria,
    setField,
    addRow,
    removeRow,
    putDrafts,
    clearAll,
    undoClear,
  };
}
