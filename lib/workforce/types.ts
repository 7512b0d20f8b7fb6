/**
 * The shapes the workforce engine passes between its steps: file → rows (./reader.ts,
 * ./fhirBulk.ts, ./xlsx.ts) → workers (./group.ts) → per-worker results (./evaluate.ts) →
 * the workforce summary (./summary.ts). Plain data only, so every value can cross a Web
 * Worker's postMessage (structured clone) unchanged.
 */
import type { Warning } from '../result';
import type { Estimate, NumberNeeded } from '../engine/types';
import type { FpgReading, Hba1cReading } from '../glycaemia/schema';
import type { GlycaemicCategory } from '../glycaemia/exposure';

/** What a column of a checkup file can be taken to be. */
export const CHECKUP_FIELDS = [
  'worker',
  'date',
  'hba1c',
  'hba1c-unit',
  'fpg',
  'fpg-unit',
  'age',
  'birth-year',
  'birth-date',
  'sex',
  'stratum',
  'ignore',
] as const;
export type CheckupField = (typeof CHECKUP_FIELDS)[number];

/** Units a value column can carry in its header ("HbA1c (%)") or be given with --map. */
export type Hba1cUnitName = Hba1cReading['unit'];
export type FpgUnitName = FpgReading['unit'];

/** One column of the file and what it was taken to be. */
export interface ColumnAssignment {
  /** 0-based position in the header. */
  readonly index: number;
  /** The header text as written (trimmed). */
  readonly header: string;
  /** What the column is; null when it is not used (unknown, or left out). */
  readonly field: CheckupField | null;
  /** For an `hba1c` or `fpg` column: the unit from its header or the mapping; null when it comes from a unit column. */
  readonly unit: Hba1cUnitName | FpgUnitName | null;
  /** For a `stratum` column: the stratum's name in the output ("site", "department", "shift"). */
  readonly stratum: string | null;
  /** True when the column looks like names or a national identifier: left out of every output. */
  readonly identifying: boolean;
}

/** The settled mapping of a file's columns. */
export interface ColumnMapping {
  readonly columns: readonly ColumnAssignment[];
}

/** A mapping problem: the file is refused until it is settled (--map COLUMN=FIELD; the screen asks). */
export interface MappingProblem {
  readonly code: 'no-header' | 'missing-column' | 'ambiguous-column' | 'unit-unknown' | 'unknown-map' | 'duplicate-column';
  /** The column (header text) concerned, or null when a required column is missing. */
  readonly column: string | null;
  readonly message: string;
}

/** A note about the columns that does not stop the file (an identifying column left out, a column not used). */
export interface MappingNote {
  readonly code: 'identifying-column' | 'unused-column';
  readonly column: string;
  readonly message: string;
}

/** `--map COLUMN=FIELD` as data: header text (case- and accent-insensitive) → field, with an optional unit ("hba1c:%"). */
export type MappingOverrides = Readonly<Record<string, string>>;

/** A cell as a reader hands it over: text from CSV/TSV, typed values from a workbook. */
export type CellValue = string | number | boolean | Date | null;

/** One usable checkup row. */
export interface CheckupRow {
  /** Where it came from: the file's line (1-based, header included) or the NDJSON line. */
  readonly line: number;
  /** Pseudonymous worker id, as written (trimmed). */
  readonly worker: string;
  readonly date: string;
  readonly hba1c?: Hba1cReading;
  readonly fpg?: FpgReading;
  /** Age at this checkup, whole years. */
  readonly age?: number;
  readonly birthYear?: number;
  /** YYYY-MM-DD (FHIR Patient.birthDate, or a birth-date column). */
  readonly birthDate?: string;
  readonly sex?: 'female' | 'male';
  /** Stratum name → value: site, department, any `group_*` column. */
  readonly strata: Readonly<Record<string, string>>;
}

/** A row that was skipped (or a cell that was not used), with where and why. */
export interface RowProblem {
  /** The file's line (1-based, header included), or the NDJSON line. */
  readonly line: number;
  /** The file, when several are read together (FHIR bulk export: one file per resource type). */
  readonly file?: string;
  /** The column's header text (or a FHIR field, e.g. "Observation.valueQuantity"); null for the whole row. */
  readonly column: string | null;
  readonly code: string;
  readonly message: string;
}

/** What a reader has seen so far. */
export interface RowCounts {
  /** Data rows read (blank lines not counted). */
  readonly read: number;
  /** Rows that became checkups. */
  readonly used: number;
  /** Rows reported and skipped. */
  readonly skipped: number;
}

/** One step of an incremental read: the rows and problems found in the text given so far. */
export interface ReadStep {
  readonly rows: readonly CheckupRow[];
  readonly problems: readonly RowProblem[];
}

/** All rows of one worker, in file order. */
export interface WorkerRows {
  readonly worker: string;
  readonly rows: readonly CheckupRow[];
}

export const WORKER_STATUSES = ['exposed', 'comparison', 'neither', 'diabetes-range', 'insufficient'] as const;
export type WorkerStatus = (typeof WORKER_STATUSES)[number];

/** One worker's line: the command's NDJSON line and the screen's worklist row. */
export interface WorkerResult {
  readonly worker: string;
  /** Age at the latest checkup; null when the file gives none. */
  readonly age: number | null;
  readonly sex: 'female' | 'male' | null;
  /** Checkups after same-day rows were merged. */
  readonly checkups: number;
  /** The latest checkup under the criteria set chosen for the run (null category: not classified). */
  readonly latest: { readonly date: string; readonly category: GlycaemicCategory | null } | null;
  /** The run ending at the latest checkup, under the exposure definition's criteria and test. */
  readonly run: { readonly category: GlycaemicCategory | null; readonly yearlyResults: number; readonly from: string | null; readonly to: string | null };
  readonly status: WorkerStatus;
  /** Plain-language reasons for the status. */
  readonly reasons: readonly string[];
  /** P0 over the horizon, as computeScenario gives it; null where the evidence does not apply. */
  readonly referenceRisk: number | null;
  readonly exposedRisk: Estimate | null;
  readonly riskDifference: Estimate | null;
  readonly numberNeeded: NumberNeeded | null;
  readonly horizonYears: number | null;
  readonly warnings: readonly Warning[];
  /** Stratum name → value (site, department, group_*), from the worker's latest row that gives it. */
  readonly strata: Readonly<Record<string, string>>;
  /** Problems with this worker's rows found while building the history (same-day conflicts); those rows are skipped. */
  readonly problems: readonly RowProblem[];
  /** How many of this worker's rows were skipped for those problems. */
  readonly skippedRows: number;
}

/** Counts by status, every status present (0 when none). */
export type StatusCounts = Readonly<Record<WorkerStatus, number>>;

export interface ExpectedEvents {
  /** Exposed workers with figures. */
  readonly exposedWorkers: number;
  /** E1 = Σ P1,i over exposed workers (at the ratio's estimate). */
  readonly atOwnRisk: number;
  /** E0 = Σ P0,i over the same workers (the comparison group's risk at their own age and sex). */
  readonly atComparisonRisk: number;
  /** E1 − E0, with limits Σ (P1,i(limit) − P0,i). */
  readonly excess: Estimate;
  /** (E1 − E0) / E1; null when E1 is 0 (no exposed worker). */
  readonly attributableFractionAmongExposed: number | null;
}

export interface WorkforceSummary {
  readonly workers: number;
  readonly rows: RowCounts;
  readonly byStatus: StatusCounts;
  /** Latest checkup's category ("not-classified" when it has none; "none" for a worker with no checkup). */
  readonly byLatestCategory: Readonly<Record<string, number>>;
  /** Stratum name (site, department, group_*, "age band", "sex") → value → counts by status. */
  readonly byStratum: Readonly<Record<string, Readonly<Record<string, StatusCounts>>>>;
  readonly expectedEvents: ExpectedEvents;
  readonly horizonYears: number | null;
  readonly caution: string;
}
