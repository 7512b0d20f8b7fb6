/**
 * The checkups screen's summary, as text and chart data, from lib/workforce's WorkforceSummary
 * only: counts by status and by stratum, the expected-events comparison for the chart, the
 * caution, and a plain-language paragraph for a report to the employer that names no worker.
 *
 * Expected events are the summary's own figures (Σ P1,i and Σ P0,i over exposed workers; see
 * lib/workforce/summary.ts for the methods); nothing is recomputed here, only rounded for reading.
 */
import type { RowProblem, WorkerStatus, WorkforceSummary } from '../workforce/types';
import { WORKER_STATUSES } from '../workforce/types';
import { formatCount } from '../text/number';
import { STATUS_LABELS } from './worklist';

export interface StatusLine {
  readonly status: WorkerStatus;
  readonly label: string;
  readonly count: number;
}

export interface StratumTable {
  readonly name: string;
  readonly rows: readonly { readonly value: string; readonly counts: readonly number[] }[];
}

export interface ExpectedEventsBar {
  readonly label: string;
  /** Expected events, to one decimal place (the chart's value). */
  readonly events: number;
}

export interface CheckupsSummaryView {
  readonly heading: string;
  readonly statuses: readonly StatusLine[];
  /** Column headings for each stratum table: the stratum's name, then each status label. */
  readonly stratumColumns: readonly string[];
  readonly strata: readonly StratumTable[];
  readonly chart: readonly ExpectedEventsBar[];
  /** The chart's text alternative (the same numbers in a sentence). */
  readonly chartText: string;
  readonly caution: string;
  readonly employerParagraph: string;
}

/** One decimal place, for expected numbers of events (common practice: a count of people). */
export function roundEvents(value: number): number {
  return Math.round(value * 10) / 10;
}

function oneDecimal(value: number): string {
  return roundEvents(value).toFixed(1);
}

function plural(count: number, one: string, many: string): string {
  return `${formatCount(count)} ${count === 1 ? one : many}`;
}

/**
 * @param outcome the evidence entry's outcome in words ("heart failure")
 * @example
 * checkupsSummaryView(summaryOfDemo40, 'heart failure').employerParagraph
 * //=> "Of 40 workers whose checkup results were reviewed, 12 fit the study's exposure …"
 */
export function checkupsSummaryView(summary: WorkforceSummary, outcome: string): CheckupsSummaryView {
  const statuses = WORKER_STATUSES.map((status) => ({ status, label: STATUS_LABELS[status], count: summary.byStatus[status] }));
  const strata = Object.entries(summary.byStratum).map(([name, values]) => ({
    name,
    rows: Object.entries(values).map(([value, counts]) => ({ value, counts: WORKER_STATUSES.map((s) => counts[s]) })),
  }));
  const ee = summary.expectedEvents;
  const years = summary.horizonYears === null ? 'over the horizon' : `over ${plural(summary.horizonYears, 'year', 'years')}`;
  const chart: ExpectedEventsBar[] = [
    { label: 'At their own (exposed) risk', events: roundEvents(ee.atOwnRisk) },
    { label: 'At the comparison group’s risk', events: roundEvents(ee.atComparisonRisk) },
  ];
  const chartText =
    ee.exposedWorkers === 0
      ? 'No worker fits the study’s exposure, so there are no expected events to compare.'
      : `Among the ${plural(ee.exposedWorkers, 'worker', 'workers')} who fit the exposure, ${oneDecimal(ee.atOwnRisk)} cases of ${outcome} are expected ${years} at their own risk, against ${oneDecimal(ee.atComparisonRisk)} at the comparison group’s risk: ${oneDecimal(ee.excess.estimate)} more (${oneDecimal(ee.excess.lower)} to ${oneDecimal(ee.excess.upper)}).`;
  const c = summary.byStatus;
  const parts = [
    `Of ${plural(summary.workers, 'worker', 'workers')} whose checkup results were reviewed, ${formatCount(c.exposed)} fit the study’s exposure, ${formatCount(c.comparison)} fit its comparison group, ${formatCount(c.neither)} fit neither, ${formatCount(c['diabetes-range'])} had a latest result in the diabetes range (a note for follow-up, not a diagnosis) and ${formatCount(c.insufficient)} had too few results to say.`,
    ee.exposedWorkers === 0 ? '' : chartText,
    'These are estimates for the group, not predictions for any one person; they assume the relation in the study is causal.',
  ];
  return {
    heading: `Summary of ${plural(summary.workers, 'worker', 'workers')}`,
    statuses,
    stratumColumns: ['Group', ...WORKER_STATUSES.map((s) => STATUS_LABELS[s])],
    strata,
    chart,
    chartText,
    caution: summary.caution,
    employerParagraph: parts.filter((p) => p !== '').join(' '),
  };
}

/** A row problem as one line: "row 7, column Checkup date: …" (the command's own form). */
export function problemLine(problem: RowProblem): string {
  const where = [problem.file, `row ${problem.line}`, problem.column === null ? null : `column ${problem.column}`].filter((p) => p !== null && p !== undefined).join(', ');
  return `${where}: ${problem.message}`;
}

/** The heading over the row problems: how many, and that the rest were processed. */
export function problemsHeading(count: number, skippedRows: number): string {
  if (count === 0) return 'No row problems';
  return `${plural(count, 'row problem', 'row problems')} (${plural(skippedRows, 'row', 'rows')} skipped; the rest were processed)`;
}
