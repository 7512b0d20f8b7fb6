/**
 * The workforce summary: counts, and the expected number of events among exposed workers.
 *
 * Methods (cited per figure):
 * - Expected events in a group over the horizon = Σ Pi, the sum of its members' risks: the mean of
 *   the Poisson-binomial count of events among independent members (Wang 1993, Statistica Sinica
 *   3:295, from memory; the methods guide, "Many people at once").
 *   Among exposed workers: E1 = Σ P1,i at their own (exposed) risks; E0 = Σ P0,i at the comparison
 *   group's risks for the same workers (each worker's reference risk at their own age and sex).
 * - Excess = E1 − E0, with limits Σ (P1,i(L) − P0,i) and Σ (P1,i(U) − P0,i): each worker's risk
 *   difference at the ratio's limits with the baseline held fixed, as the engine does for one
 *   person (Cochrane Handbook §12.5.4.5). Summing limits gives the range of the excess over the
 *   ratio's interval (every worker's difference is increasing in the same ratio); it ignores
 *   uncertainty in the baselines.
 * - Attributable fraction among the exposed = (E1 − E0) / E1 (Rothman, Greenland & Lash, Modern
 *   Epidemiology, 3rd ed., ch. 4; from memory). It assumes the relation is causal, which
 *   observational evidence does not show; the caution says so.
 *
 * Pure: {@link summariseWorkforce} over any list of worker results; {@link SummaryAccumulator}
 * gives the same figures one worker at a time (the command and the screen's Web Worker add each
 * worker as it is done, keeping no list).
 */
import type { GlycaemicCategory } from '../glycaemia/exposure';
import type { ExpectedEvents, RowCounts, StatusCounts, WorkerResult, WorkerStatus, WorkforceSummary } from './types';
import { WORKER_STATUSES } from './types';

/** The caution every summary carries. */
export const WORKFORCE_CAUTION =
  'Estimates for groups, not diagnoses, and not a prediction for any one worker. ' +
  'Expected numbers of events are sums of per-worker risks from published figures and a population table. ' +
  'The share linked to the exposure assumes the relation is causal, which observational studies do not show. ' +
  'A result in the diabetes range is a note for follow-up, not a diagnosis: confirm per local guideline.';

/** The age band a worker is counted in: 10-year bands ("30–39"), "under 20", "70 and over", "unknown". */
export function ageBand(age: number | null): string {
  if (age === null) return 'unknown';
  if (age < 20) return 'under 20';
  if (age >= 70) return '70 and over';
  const from = Math.floor(age / 10) * 10;
  return DECADE_BANDS[from] ?? `${from}–${from + 9}`;
}

/** "20–29" … "60–69", written once (a summary counts every worker in one). */
const DECADE_BANDS: Readonly<Record<number, string>> = Object.fromEntries([20, 30, 40, 50, 60].map((from) => [from, `${from}–${from + 9}`]));

function zeroCounts(): Record<WorkerStatus, number> {
  return Object.fromEntries(WORKER_STATUSES.map((s) => [s, 0])) as Record<WorkerStatus, number>;
}

function categoryKey(category: GlycaemicCategory | null | undefined, hasLatest: boolean): string {
  if (!hasLatest) return 'none';
  return category ?? 'not-classified';
}

/** Adds workers one at a time; {@link SummaryAccumulator.finish} gives the summary. */
export class SummaryAccumulator {
  private workers = 0;
  private readonly byStatus = zeroCounts();
  private readonly byLatestCategory: Record<string, number> = {};
  /** Stratum → value → counts by status (maps: any text is a value, "__proto__" too). */
  private readonly byStratum = new Map<string, Map<string, Record<WorkerStatus, number>>>();
  private exposedWorkers = 0;
  private e1 = 0;
  private e0 = 0;
  private excessLower = 0;
  private excessUpper = 0;
  private horizonYears: number | null = null;

  add(result: WorkerResult): void {
    this.workers++;
    this.byStatus[result.status]++;
    const category = categoryKey(result.latest?.category, result.latest !== null);
    this.byLatestCategory[category] = (this.byLatestCategory[category] ?? 0) + 1;
    const { strata, status } = result;
    for (const name in strata) if (Object.hasOwn(strata, name)) this.countIn(name, strata[name] as string, status);
    this.countIn('age band', ageBand(result.age), status);
    this.countIn('sex', result.sex ?? 'unknown', status);
    if (result.status === 'exposed' && result.exposedRisk && result.referenceRisk !== null) {
      this.exposedWorkers++;
      this.e1 += result.exposedRisk.estimate;
      this.e0 += result.referenceRisk;
      this.excessLower += result.exposedRisk.lower - result.referenceRisk;
      this.excessUpper += result.exposedRisk.upper - result.referenceRisk;
    }
    if (this.horizonYears === null && result.horizonYears !== null) this.horizonYears = result.horizonYears;
  }

  /** One more worker of this status in a stratum's value. */
  private countIn(name: string, value: string, status: WorkerStatus): void {
    let byValue = this.byStratum.get(name);
    if (byValue === undefined) {
      byValue = new Map();
      this.byStratum.set(name, byValue);
    }
    let counts = byValue.get(value);
    if (counts === undefined) {
      counts = zeroCounts();
      byValue.set(value, counts);
    }
    counts[status]++;
  }

  finish(rows: RowCounts): WorkforceSummary {
    const expectedEvents: ExpectedEvents = {
      exposedWorkers: this.exposedWorkers,
      atOwnRisk: this.e1,
      atComparisonRisk: this.e0,
      excess: { estimate: this.e1 - this.e0, lower: this.excessLower, upper: this.excessUpper },
      attributableFractionAmongExposed: this.e1 > 0 ? (this.e1 - this.e0) / this.e1 : null,
    };
    // Names and values in sorted order, each an own property (Object.fromEntries: "__proto__" too).
    const byStratum: Record<string, Record<string, StatusCounts>> = Object.fromEntries(
      [...this.byStratum.keys()].sort().map((name) => {
        const values = this.byStratum.get(name) ?? new Map<string, Record<WorkerStatus, number>>();
        return [name, Object.fromEntries([...values.keys()].sort().map((v) => [v, { ...(values.get(v) ?? zeroCounts()) }]))];
      }),
    );
    return {
      workers: this.workers,
      rows,
      byStatus: { ...this.byStatus },
      byLatestCategory: { ...this.byLatestCategory },
      byStratum,
      expectedEvents,
      horizonYears: this.horizonYears,
      caution: WORKFORCE_CAUTION,
    };
  }
}

/**
 * The summary of a list of worker results.
 *
 * @example
 * summariseWorkforce([exposedWorker(P0 0.015, P1 0.0239), comparisonWorker], { read: 8, used: 8, skipped: 0 })
 * //=> { workers: 2, byStatus: { exposed: 1, comparison: 1, … }, expectedEvents: { atOwnRisk: 0.0239, atComparisonRisk: 0.015, … }, caution: '…' }
 */
export function summariseWorkforce(results: Iterable<WorkerResult>, rows: RowCounts): WorkforceSummary {
  const acc = new SummaryAccumulator();
  for (const r of results) acc.add(r);
  return acc.finish(rows);
}
