/**
 * The checkups screen's worklist: one display row per worker (lib/workforce WorkerResult, as the
 * command prints it), sorting and filtering. Every figure is the engine's own; this module only
 * formats it (lib/wording formatPercent, the number needed's own `display`).
 */
import type { WorkerResult, WorkerStatus } from '../workforce/types';
import { ageBand } from '../workforce/summary';
import { formatPercent } from '../wording/format';

/** The worklist's columns, in order. */
export const WORKLIST_COLUMNS = [
  { key: 'worker', label: 'Worker' },
  { key: 'age', label: 'Age' },
  { key: 'sex', label: 'Sex' },
  { key: 'category', label: 'Latest category' },
  { key: 'run', label: 'Run' },
  { key: 'status', label: 'Status' },
  { key: 'baseline', label: 'Risk without the exposure' },
  { key: 'exposed', label: 'Risk with the exposure' },
  { key: 'difference', label: 'Difference' },
  { key: 'numberNeeded', label: 'Number needed' },
  { key: 'notes', label: 'Notes' },
] as const;
export type WorklistColumn = (typeof WORKLIST_COLUMNS)[number]['key'];

/** Status words on screen ("diabetes range", never "diabetes"). */
export const STATUS_LABELS: Readonly<Record<WorkerStatus, string>> = {
  exposed: 'Fits the exposure',
  comparison: 'Comparison group',
  neither: 'Neither',
  'diabetes-range': 'Diabetes range: follow up',
  insufficient: 'Not enough results',
};

export interface WorklistRow {
  /** Position in the file's order of workers (0-based): the stable key. */
  readonly index: number;
  readonly worker: string;
  readonly status: WorkerStatus;
  readonly category: string;
  readonly strata: Readonly<Record<string, string>>;
  /** Display text per column. */
  readonly cells: Readonly<Record<WorklistColumn, string>>;
  /** Sort keys per column (numbers sort numerically; null last). */
  readonly keys: Readonly<Record<WorklistColumn, string | number | null>>;
}

const DASH = '—';

function categoryText(category: string | null | undefined): string {
  if (category === undefined) return 'no checkup';
  if (category === null) return 'not classified';
  return category === 'diabetes-range' ? 'diabetes range' : category; // lib/glycaemia's category name, in words
}

/**
 * A worker's latest category as the worklist writes it (the filter's values too).
 * @example
 * worklistCategory(w001) //=> "prediabetes"
 */
export function worklistCategory(result: Pick<WorkerResult, 'latest'>): string {
  return categoryText(result.latest === null ? undefined : result.latest.category);
}

/**
 * The groups a worker can be filtered by: the file's strata, their age band and their sex.
 * @example
 * worklistStrata(w001) //=> { site: "North", department: "Assembly", "age band": "50–59", sex: "female" }
 */
export function worklistStrata(result: Pick<WorkerResult, 'strata' | 'age' | 'sex'>): Record<string, string> {
  return { ...result.strata, 'age band': ageBand(result.age), sex: result.sex ?? 'unknown' };
}

/** Sort keys per column (numbers sort numerically; null last): the engine's own figures, unrounded. */
export function worklistKeys(result: WorkerResult): Record<WorklistColumn, string | number | null> {
  return {
    worker: result.worker,
    age: result.age,
    sex: result.sex,
    category: worklistCategory(result),
    run: result.run.yearlyResults,
    status: result.status,
    baseline: result.referenceRisk,
    exposed: result.exposedRisk?.estimate ?? null,
    difference: result.riskDifference?.estimate ?? null,
    numberNeeded: result.numberNeeded?.estimate ?? null,
    notes: null,
  };
}

/**
 * One worker's display row.
 * @example
 * worklistRow(w001, 0).cells.exposed //=> "2.4% (1.8% to 3.1%)" (W001 of demo/checkups/checkups.csv)
 */
export function worklistRow(result: WorkerResult, index: number): WorklistRow {
  const category = worklistCategory(result);
  const run = result.run.yearlyResults > 0 ? `${result.run.yearlyResults} yearly (${categoryText(result.run.category)})` : DASH;
  const interval = (e: { estimate: number; lower: number; upper: number }) => `${formatPercent(e.estimate)} (${formatPercent(e.lower)} to ${formatPercent(e.upper)})`;
  const notes = [...result.reasons.slice(1), ...result.warnings.map((w) => w.message)].join(' ');
  return {
    index,
    worker: result.worker,
    status: result.status,
    category,
    strata: worklistStrata(result),
    cells: {
      worker: result.worker,
      age: result.age === null ? DASH : String(result.age),
      sex: result.sex ?? DASH,
      category,
      run,
      status: STATUS_LABELS[result.status],
      baseline: result.referenceRisk === null ? DASH : formatPercent(result.referenceRisk),
      exposed: result.exposedRisk ? interval(result.exposedRisk) : DASH,
      difference: result.riskDifference ? interval(result.riskDifference) : DASH,
      numberNeeded: result.numberNeeded?.text ?? DASH,
      notes: notes === '' ? (result.reasons[0] ?? '') : notes,
    },
    keys: worklistKeys(result),
  };
}

export interface WorklistFilter {
  readonly status?: WorkerStatus | null;
  readonly category?: string | null;
  /** A stratum name and value ("site", "North"). */
  readonly stratum?: { readonly name: string; readonly value: string } | null;
}

export interface WorklistSort {
  readonly column: WorklistColumn;
  readonly direction: 'ascending' | 'descending';
}

/** English collation with numbers in text compared as numbers ("W2" before "W10"); the same order as `localeCompare(b, 'en', { numeric: true })`, made once. */
const COLLATOR = new Intl.Collator('en', { numeric: true });

/** The worklist's order of two sort keys: numbers numerically, text by {@link COLLATOR}, empty (null) last. */
export function compareKeys(a: string | number | null, b: string | number | null): number {
  if (a === b) return 0;
  if (a === null) return 1;
  if (b === null) return -1;
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return COLLATOR.compare(String(a), String(b));
}

/** Whether a row passes the filter (status, latest category, one group). */
export function keepRow(row: WorklistRow, filter: WorklistFilter): boolean {
  return (!filter.status || row.status === filter.status) && (!filter.category || row.category === filter.category) && (!filter.stratum || row.strata[filter.stratum.name] === filter.stratum.value);
}

/**
 * The rows shown: filtered, then sorted (stable: ties keep the file's order; empty values last
 * in either direction).
 */
export function arrangeWorklist(rows: readonly WorklistRow[], filter: WorklistFilter, sort: WorklistSort | null): WorklistRow[] {
  const kept = rows.filter((r) => keepRow(r, filter));
  if (!sort) return kept;
  const sign = sort.direction === 'ascending' ? 1 : -1;
  return kept.sort((a, b) => {
    const ka = a.keys[sort.column];
    const kb = b.keys[sort.column];
    if (ka === null || kb === null) return compareKeys(ka, kb) || a.index - b.index;
    return sign * compareKeys(ka, kb) || a.index - b.index;
  });
}

/** The choices of each filter: every latest category, and every group (name and value), sorted. */
export interface WorklistFilterChoices {
  readonly categories: string[];
  readonly strata: { name: string; value: string }[];
}

/** The choices of each filter, from the rows themselves (sorted). */
export function worklistFilterChoices(rows: readonly Pick<WorklistRow, 'category' | 'strata'>[]): WorklistFilterChoices {
  return sortFilterChoices(
    rows.map((r) => r.category),
    rows.flatMap((r) => Object.entries(r.strata).map(([name, value]) => ({ name, value }))),
  );
}

/** The filters' choices in the order they are offered: categories alphabetically; groups by name, then value (numbers in text as numbers). Duplicates are dropped. */
export function sortFilterChoices(categories: Iterable<string>, strata: Iterable<{ name: string; value: string }>): WorklistFilterChoices {
  const groups = new Map<string, { name: string; value: string }>();
  for (const s of strata) groups.set(`${s.name}\u0000${s.value}`, { name: s.name, value: s.value });
  return {
    categories: [...new Set(categories)].sort(),
    strata: [...groups.values()].sort((a, b) => a.name.localeCompare(b.name) || a.value.localeCompare(b.value, 'en', { numeric: true })),
  };
}
