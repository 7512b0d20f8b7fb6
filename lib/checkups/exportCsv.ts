/**
 * The checkups screen's two CSV exports: one line per worker, and the summary. Each starts with
 * lines naming the evidence, the table, the criteria set, the horizon and the date, so the file
 * says what it was computed from. File names carry the date only, never worker data.
 *
 * Every text cell goes through ONE guard, lib/export `guardTextCell` (a leading `=`, `+`, `-`,
 * `@`, tab or carriage return gets a `'` in front so a spreadsheet shows it as text); numbers
 * are written as numbers. Quoting follows RFC 4180 (a cell holding a comma, a quotation mark or
 * a line break is quoted, quotation marks doubled).
 */
import { guardTextCell } from '../export/spreadsheetCell';
import type { WorkerResult, WorkforceSummary } from '../workforce/types';
import { WORKER_STATUSES } from '../workforce/types';

export interface ExportContext {
  readonly evidenceTitle: string;
  readonly evidenceId: string;
  readonly tableTitle: string;
  readonly tableId: string;
  readonly criteria: string;
  /** YYYY-MM-DD. */
  readonly date: string;
}

type Cell = string | number | null;

/** One cell: text guarded then quoted when needed (RFC 4180); a number as written; null empty. */
export function csvCell(value: Cell): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = guardTextCell(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function line(cells: readonly Cell[]): string {
  return cells.map(csvCell).join(',');
}

function preamble(context: ExportContext, horizonYears: number | null): string[] {
  return [
    line(['Evidence', `${context.evidenceTitle} (${context.evidenceId})`]),
    line(['Population table', `${context.tableTitle} (${context.tableId})`]),
    line(['Criteria set', context.criteria]),
    line(['Horizon (years)', horizonYears]),
    line(['Date', context.date]),
    line(['Caution', 'Estimates for groups, not diagnoses; a result in the diabetes range is a note for follow-up, not a diagnosis']),
    '',
  ];
}

/** The export's file names: the date only (no worker data). */
export function checkupsFileNames(date: string): { workers: string; summary: string } {
  return { workers: `checkups-workers-${date}.csv`, summary: `checkups-summary-${date}.csv` };
}

/**
 * One line per worker, in the file's order. Its columns are its own, not the command's
 * (`hundredfold checkups --format csv`, lib/cli/commands/checkups.ts `CSV_COLUMNS`): this file is
 * read by people in a spreadsheet, the command's by programs; both write cells with {@link csvCell}.
 * @example
 * workersCsv([w001], ctx).split('\r\n')[7] //=> 'worker,age,sex,latest date,latest category,…'
 */
export function workersCsv(results: readonly WorkerResult[], context: ExportContext): string {
  const strata = [...new Set(results.flatMap((r) => Object.keys(r.strata)))].sort();
  const header = ['worker', 'age', 'sex', 'latest date', 'latest category', 'yearly results in run', 'status', 'risk without the exposure', 'risk with the exposure', 'lower', 'upper', 'difference', 'lower', 'upper', 'number needed', ...strata, 'notes'];
  const lines = results.map((r) =>
    line([
      r.worker,
      r.age,
      r.sex,
      r.latest?.date ?? null,
      r.latest ? (r.latest.category ?? 'not classified') : null,
      r.run.yearlyResults,
      r.status,
      r.referenceRisk,
      r.exposedRisk?.estimate ?? null,
      r.exposedRisk?.lower ?? null,
      r.exposedRisk?.upper ?? null,
      r.riskDifference?.estimate ?? null,
      r.riskDifference?.lower ?? null,
      r.riskDifference?.upper ?? null,
      r.numberNeeded?.text ?? null,
      ...strata.map((s) => r.strata[s] ?? null),
      [...r.reasons, ...r.warnings.map((w) => w.message)].join(' '),
    ]),
  );
  const horizon = results.find((r) => r.horizonYears !== null)?.horizonYears ?? null;
  return [...preamble(context, horizon), line(header), ...lines].join('\r\n') + '\r\n';
}

/** The summary: counts by status, by stratum, and the expected events (as the lib summary gives them). */
export function summaryCsv(summary: WorkforceSummary, context: ExportContext): string {
  const ee = summary.expectedEvents;
  const lines = [
    ...preamble(context, summary.horizonYears),
    line(['Workers', summary.workers]),
    line(['Rows read', summary.rows.read]),
    line(['Rows used', summary.rows.used]),
    line(['Rows skipped', summary.rows.skipped]),
    '',
    line(['group', 'value', ...WORKER_STATUSES]),
    line(['all', 'all', ...WORKER_STATUSES.map((s) => summary.byStatus[s])]),
    ...Object.entries(summary.byStratum).flatMap(([name, values]) => Object.entries(values).map(([value, counts]) => line([name, value, ...WORKER_STATUSES.map((s) => counts[s])]))),
    '',
    line(['Exposed workers with figures', ee.exposedWorkers]),
    line(['Expected events at their own risk', ee.atOwnRisk]),
    line(['Expected events at the comparison group risk', ee.atComparisonRisk]),
    line(['Excess', ee.excess.estimate]),
    line(['Excess lower', ee.excess.lower]),
    line(['Excess upper', ee.excess.upper]),
    line(['Attributable fraction among the exposed', ee.attributableFractionAmongExposed]),
    line(['Caution', summary.caution]),
  ];
  return lines.join('\r\n') + '\r\n';
}
