/**
 * One worker: rows → history → status → baseline → figures, with the functions the
 * single-patient screen uses and nothing of its own:
 * - same-day rows merged by lib/glycaemia `mergeSameDate` (a conflicting row is skipped and reported);
 * - the latest checkup classified by lib/glycaemia `classifyCheckup` under the chosen criteria set;
 * - exposed / comparison / neither by lib/glycaemia `exposureStatus` (the evidence entry's
 *   exposure definition decides its own criteria set, test and gap rule);
 * - the baseline from lib/tables `lookupStratum` at the worker's age at the latest checkup and sex;
 * - the figures from lib/engine `computeScenario`, unchanged: the scenario is the evidence
 *   entry's effect and wording with the worker's baseline and the chosen horizon.
 *
 * Status order: a latest result in the diabetes range comes first (`diabetes-range`: a follow-up
 * note, never a diagnosis; evidence about another range does not apply); then `exposed` and
 * `comparison`; a history in a defined range that is too short, cut by a gap, or not classifiable
 * with the deciding test is `insufficient`; everything else is `neither`, with the reason in words.
 * An exposed or comparison worker the table cannot place (age outside its bands, sex missing) is
 * `neither`, with the table's own message.
 */
import { computeScenario } from '../engine/compute';
import type { ComputeResult } from '../engine/types';
import type { EvidenceEntry } from '../evidence/schema';
import { classifyCheckup, classifyHistory } from '../glycaemia/classify';
import { yearsBetween } from '../glycaemia/dates';
import { CRITERIA_SETS, type CriteriaSet, type ExposureDefinition } from '../glycaemia/exposure';
import { diabetesRangeNote, exposureStatus } from '../glycaemia/match';
import { mergeSameDate } from '../glycaemia/parse';
import type { Checkup } from '../glycaemia/schema';
import { fail, ok, type Issue, type Result, type Warning } from '../result';
import { years as yearsSchema } from '../scenario/schema';
import type { Scenario } from '../scenario/schema';
import { lookupStratum, tableNeeds } from '../tables/lookup';
import type { PopulationTable } from '../tables/schema';
import type { CheckupRow, RowProblem, WorkerResult, WorkerRows, WorkerStatus } from './types';

/** Everything every worker is evaluated against: settled once, before the first worker. */
export interface CheckupsContext {
  readonly evidence: EvidenceEntry;
  /** The entry's exposure definition (required: an entry without one cannot sort workers). */
  readonly exposure: ExposureDefinition;
  readonly table: PopulationTable;
  /** The criteria set for each worker's latest category (and the diabetes-range check). */
  readonly criteria: CriteriaSet;
  /** The horizon; default: the table's own period (as computeScenario does). */
  readonly horizonYears?: number;
  /** How row problems name the value columns (the file's headers); default "HbA1c", "fasting glucose". */
  readonly columnNames?: { readonly hba1c?: string; readonly fpg?: string };
}

export interface CheckupsSettings {
  readonly evidence: EvidenceEntry;
  readonly table: PopulationTable;
  readonly criteria: string;
  readonly horizonYears?: number;
  readonly columnNames?: { readonly hba1c?: string; readonly fpg?: string };
}

/**
 * Checks the settings once: the entry must carry an exposure definition, the criteria set must be
 * one of ADA, WHO, NICE, the horizon a number of years the scenario schema accepts.
 *
 * @example
 * prepareCheckups({ evidence: DEMO_WORKFORCE_HBA1C_HEART_FAILURE, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' })
 * //=> { ok: true, value: { exposure: { category: 'prediabetes', criteria: 'ADA', minYears: 3, … }, … } }
 */
export function prepareCheckups(settings: CheckupsSettings): Result<CheckupsContext> {
  const issues: Issue[] = [];
  const exposure = settings.evidence.exposureDefinition;
  if (!exposure) {
    issues.push({
      code: 'no-exposure-definition',
      path: ['evidence', 'exposureDefinition'],
      message: `The evidence entry "${settings.evidence.title}" has no exposure definition, so workers cannot be matched to the study; add one (which test, range, criteria set, run length) in the library`,
    });
  }
  const criteria = CRITERIA_SETS.find((c) => c === settings.criteria.toUpperCase());
  if (!criteria) issues.push({ code: 'invalid-choice', path: ['criteria'], message: `The criteria set must be ADA, WHO or NICE (got "${settings.criteria}")` });
  if (settings.horizonYears !== undefined) {
    const checked = yearsSchema('The horizon').safeParse(settings.horizonYears);
    if (!checked.success) issues.push({ code: 'out-of-range', path: ['horizonYears'], message: checked.error.issues[0]?.message ?? 'The horizon is not usable' });
  }
  if (issues.length > 0 || !exposure || !criteria) return fail(issues);
  return ok({
    evidence: settings.evidence,
    exposure,
    table: settings.table,
    criteria,
    ...(settings.horizonYears !== undefined ? { horizonYears: settings.horizonYears } : {}),
    ...(settings.columnNames ? { columnNames: settings.columnNames } : {}),
  });
}

/**
 * Age at the latest checkup: from a birth date (whole years), else from the latest row giving an
 * age (plus the whole years from that row to the latest checkup), else from a birth year
 * (latest checkup's year − birth year: at most one year high before the birthday; said in a reason).
 */
export function ageAtLatest(rows: readonly CheckupRow[], latestDate: string): { age: number | null; note: string | null } {
  const withBirthDate = rows.findLast((r) => r.birthDate !== undefined);
  if (withBirthDate?.birthDate) {
    const [by, bm, bd] = withBirthDate.birthDate.split('-').map(Number);
    const [ly, lm, ld] = latestDate.split('-').map(Number);
    if (by !== undefined && bm !== undefined && bd !== undefined && ly !== undefined && lm !== undefined && ld !== undefined) {
      const age = ly - by - (lm < bm || (lm === bm && ld < bd) ? 1 : 0);
      return { age, note: null };
    }
  }
  // The latest row giving an age (the last in file order among rows of that date).
  let withAge: CheckupRow | undefined;
  for (const r of rows) if (r.age !== undefined && (withAge === undefined || r.date >= withAge.date)) withAge = r;
  if (withAge?.age !== undefined) {
    return { age: withAge.age + Math.floor(yearsBetween(withAge.date, latestDate) + 1e-9), note: null };
  }
  const withYear = rows.findLast((r) => r.birthYear !== undefined);
  if (withYear?.birthYear !== undefined) {
    return { age: Number(latestDate.slice(0, 4)) - withYear.birthYear, note: 'The age comes from the birth year: it may be one year high.' };
  }
  return { age: null, note: null };
}

/**
 * A checkup row's test results as a glucose-history checkup (lib/glycaemia `Checkup`): the date
 * and whichever of HbA1c and fasting glucose the row gives. Used here and by the history read
 * again for one worker (lib/checkups/workerHistory.ts), so both see the same checkups.
 */
export function checkupOf(row: CheckupRow): Checkup {
  // Key by key (no spreads), the keys in the same order.
  const checkup: { -readonly [K in keyof Checkup]: Checkup[K] } = { date: row.date };
  if (row.hba1c) checkup.hba1c = row.hba1c;
  if (row.fpg) checkup.fpg = row.fpg;
  return checkup;
}

/**
 * Evaluates one worker.
 *
 * @example
 * evaluateWorker({ worker: 'W017', rows: [three yearly prediabetes-range rows, age 52, female] }, context)
 * //=> { worker: 'W017', age: 52, sex: 'female', checkups: 3, status: 'exposed', referenceRisk: 0.015, exposedRisk: { estimate: 0.0239…, … }, … }
 */
export function evaluateWorker(group: WorkerRows, context: CheckupsContext): WorkerResult {
  const { rows } = group;
  const merged = mergeSameDate(rows.map(checkupOf), (i) => `row ${rows[i]?.line ?? '?'}`);
  let problems: RowProblem[] = [];
  let kept = rows;
  let skippedRows = 0;
  if (merged.issues.length > 0) {
    const names = { hba1c: context.columnNames?.hba1c ?? 'HbA1c', fpg: context.columnNames?.fpg ?? 'fasting glucose' };
    problems = merged.issues.map((issue) => {
      const index = typeof issue.path[1] === 'number' ? issue.path[1] : -1;
      const test = issue.path[2] === 'fpg' ? 'fpg' : 'hba1c';
      return { line: rows[index]?.line ?? 0, column: names[test], code: issue.code, message: issue.message };
    });
    const skippedLines = new Set(problems.map((p) => p.line));
    kept = rows.filter((r) => !skippedLines.has(r.line));
    skippedRows = skippedLines.size;
  }
  const checkups = merged.checkups;

  let sex: 'female' | 'male' | null = null;
  const strata: Record<string, string> = {};
  for (const row of kept) {
    if (row.sex !== undefined) sex = row.sex;
    for (const name in row.strata) strata[name] = row.strata[name] as string;
  }

  // Every result has the same keys in the same order (one object shape); figures only for exposed and comparison.
  const result = (
    age: number | null,
    latest: WorkerResult['latest'],
    run: WorkerResult['run'],
    status: WorkerStatus,
    reasons: readonly string[],
    warnings: readonly Warning[],
    figures: ComputeResult | null,
  ): WorkerResult => ({
    worker: group.worker,
    sex,
    checkups: checkups.length,
    strata,
    problems,
    skippedRows,
    age,
    latest,
    run,
    status,
    reasons,
    referenceRisk: figures ? figures.referenceRisk : null,
    exposedRisk: figures ? figures.exposedRisk : null,
    riskDifference: figures ? figures.riskDifference : null,
    numberNeeded: figures ? figures.numberNeeded : null,
    horizonYears: figures ? figures.horizonYears : null,
    warnings,
  });

  const latestCheckup = checkups.at(-1);
  if (!latestCheckup) {
    return result(null, null, { category: null, yearlyResults: 0, from: null, to: null }, 'insufficient', ['No usable checkup for this worker.'], [], null);
  }
  const { age, note: ageNote } = ageAtLatest(kept, latestCheckup.date);
  const latestCategory = classifyCheckup(latestCheckup, context.criteria).category;
  const match = exposureStatus(checkups, context.exposure, { shownCriteria: context.criteria });
  const run = { category: match.run.category, yearlyResults: match.run.yearlyResults, from: match.run.from, to: match.run.to };
  const latest = { date: latestCheckup.date, category: latestCategory };

  if (latestCategory === 'diabetes-range') {
    const note = diabetesRangeNote(classifyHistory(checkups, context.criteria), context.exposure.category);
    const reasons = [note?.message ?? 'The latest result is in the diabetes range. One result is not a diagnosis: confirm with repeat testing as your local guideline says.'];
    return result(age, latest, run, 'diabetes-range', reasons, note ? [note] : [], null);
  }

  let status: WorkerStatus = match.status;
  const reasons = [...match.reasons];
  if (ageNote) reasons.push(ageNote);
  if (status === 'neither' && (match.neitherReason === 'short' || match.neitherReason === 'gap' || match.neitherReason === 'unclassified')) {
    status = 'insufficient';
    reasons[0] = match.neitherReason === 'gap' ? 'Not enough yearly results: a gap cuts the run short.' : match.neitherReason === 'short' ? 'Not enough yearly results yet.' : 'The results cannot be classified with the test the study used.';
  }
  if (status !== 'exposed' && status !== 'comparison') {
    return result(age, latest, run, status, reasons, match.exposure.warning && status === 'neither' ? [match.exposure.warning] : [], null);
  }

  const { built, computed } = scenarioFiguresFor(age, sex, strata, context);
  if (!built.ok) {
    const why = built.issues.map((i) => i.message).join('; ');
    return result(age, latest, run, 'neither', [`The population table cannot place this worker: ${why}.`, ...reasons], [], null);
  }
  if (!computed.ok) {
    return result(age, latest, run, 'neither', [`The figures cannot be computed: ${computed.issues.map((i) => i.message).join('; ')}.`, ...reasons], [], null);
  }
  // The figures and their warnings are shared, read-only, by every worker of the same scenario.
  return result(age, latest, run, status, reasons, computed.value.warnings, computed.value);
}

/**
 * The scenario for a worker: the stratum of the table at their age and sex (and any stratum the
 * table needs, from the worker's strata), the entry's effect and wording, the chosen horizon.
 */
export function scenarioFor(
  age: number | null,
  sex: 'female' | 'male' | null,
  strata: Readonly<Record<string, string>>,
  context: CheckupsContext,
): Result<Scenario> {
  const person = { ...(age !== null && age >= 0 && age <= 120 ? { age } : {}), ...(sex !== null ? { sex } : {}) };
  const lookup = lookupStratum(context.table, person, strata);
  if (!lookup.ok) return lookup;
  return ok({
    baseline: lookup.value.baseline,
    effect: context.evidence.effect,
    ...(context.horizonYears !== undefined ? { horizonYears: context.horizonYears } : {}),
    wording: context.evidence.wording,
    person,
    tableId: context.table.id,
  });
}

/** A worker's scenario and its figures: the same age, sex and table strata give the same both. */
export interface ScenarioFigures {
  /** {@link scenarioFor}'s answer. */
  readonly built: Result<Scenario>;
  /**
   * lib/engine `computeScenario(built.value)`, frozen (shared by every worker of this scenario);
   * for a scenario that could not be built, `built` itself (its issues).
   */
  readonly computed: Result<ComputeResult>;
}

/**
 * Scenarios and figures already worked out, per context: by age, then by sex, then (only when the
 * table names strata beyond age and sex) by the values of those strata written as JSON.
 */
const SCENARIOS = new WeakMap<
  CheckupsContext,
  { readonly extra: readonly string[]; readonly byAge: Map<number | null, Map<'female' | 'male' | null, Map<string, ScenarioFigures>>>; size: number }
>();
/** Most scenarios kept per context before starting over (ages × sexes × table strata: a few hundred in practice). */
export const MAX_SCENARIOS = 4096;

/** Freezes a plain value and everything in it, so that a shared answer cannot be changed through one worker's result. */
function deepFreeze<T>(value: T): T {
  if (typeof value !== 'object' || value === null || Object.isFrozen(value)) return value;
  for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key]);
  return Object.freeze(value);
}

/**
 * {@link scenarioFor} and lib/engine `computeScenario` on it, remembered per context: the table
 * lookup, the scenario and its figures depend only on the age, the sex and the strata the table
 * names (computeScenario is pure), so workers who share them share one read-only answer instead
 * of computing it again. Bounded: past {@link MAX_SCENARIOS} keys it forgets and starts over.
 *
 * @example
 * scenarioFiguresFor(52, 'female', { site: 'North' }, context)
 * //=> { built: { ok: true, value: { baseline: { risk: 0.015, … }, … } }, computed: { ok: true, value: { referenceRisk: 0.015, … } } }
 */
export function scenarioFiguresFor(age: number | null, sex: 'female' | 'male' | null, strata: Readonly<Record<string, string>>, context: CheckupsContext): ScenarioFigures {
  let cache = SCENARIOS.get(context);
  if (!cache) {
    cache = { extra: tableNeeds(context.table).extra, byAge: new Map(), size: 0 };
    SCENARIOS.set(context, cache);
  }
  const key = cache.extra.length === 0 ? '' : JSON.stringify(cache.extra.map((k) => strata[k] ?? null));
  const known = cache.byAge.get(age)?.get(sex)?.get(key);
  if (known) return known;
  const built = scenarioFor(age, sex, strata, context);
  const figures: ScenarioFigures = { built, computed: built.ok ? deepFreeze(computeScenario(built.value)) : built };
  if (cache.size >= MAX_SCENARIOS) {
    cache.byAge.clear();
    cache.size = 0;
  }
  let bySex = cache.byAge.get(age);
  if (!bySex) {
    bySex = new Map();
    cache.byAge.set(age, bySex);
  }
  let byStrata = bySex.get(sex);
  if (!byStrata) {
    byStrata = new Map();
    bySex.set(sex, byStrata);
  }
  byStrata.set(key, figures);
  cache.size += 1;
  return figures;
}

/** The scenario a worker's figures come from (for the screen's "open one worker"); null where the evidence does not apply. */
export function workerScenario(result: WorkerResult, context: CheckupsContext): Scenario | null {
  if (result.referenceRisk === null) return null;
  const built = scenarioFor(result.age, result.sex, result.strata, context);
  return built.ok ? built.value : null;
}
