/**
 * Everything the printed handout shows, from one scenario: the engine's result, the patient
 * sentences (lib/wording), where the numbers come from and the date. The page only lays this
 * out; it computes nothing.
 *
 * Who "people like you" are and the source lines come from lib/context/scenarioContext.ts, the
 * same function the consultation screen uses, so screen and paper always agree. No identifier is ever
 * part of a scenario, so none can reach the handout.
 */
import { computeScenario } from '../engine/compute';
import type { ComputeResult } from '../engine/types';
import { fail, ok, type Result, type Warning } from '../result';
import type { Scenario } from '../scenario/schema';
import { scenarioContext } from '../context';
import type { PopulationTable } from '../tables/schema';
import { patientText, TEXT_LOCALE, type PatientText } from '../wording';

export interface HandoutContent {
  readonly result: ComputeResult;
  readonly text: PatientText;
  /** "Where the numbers come from": one line for the baseline, one for the study. */
  readonly sources: readonly string[];
  /** "Prepared on 12 May 2025"-style line, locale en. */
  readonly preparedOn: string;
  /** The engine's warnings, for the clinician's panel on screen (not printed). */
  readonly clinicianWarnings: readonly Warning[];
}

export interface HandoutOptions {
  /** The population table the baseline was looked up in, when `scenario.tableId` names one. */
  readonly table?: PopulationTable | undefined;
  /** The day the handout is prepared. */
  readonly date: Date;
}

const dateFormat = new Intl.DateTimeFormat(TEXT_LOCALE, { year: 'numeric', month: 'long', day: 'numeric' });

/** "Prepared on May 12, 2025." */
export function preparedOnLine(date: Date): string {
  return Number.isNaN(date.getTime()) ? 'Prepared today.' : `Prepared on ${dateFormat.format(date)}.`;
}

/** The "where the numbers come from" lines (lib/context/scenarioContext.ts writes them). */
export function sourceLines(scenario: Scenario, table: PopulationTable | undefined): string[] {
  return [...scenarioContext(scenario, { table }).sourceLines];
}

/**
 * @example
 * buildHandout({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
 *   wording: { outcome: 'a stroke' }, person: { age: 55, sex: 'female' } }, { date: new Date('2025-05-12T12:00:00Z') })
 * //=> { ok: true, value: { text: { referenceSentence: "Think of 100 women aged 55 like you. …" }, preparedOn: "Prepared on May 12, 2025.", … } }
 */
export function buildHandout(scenario: Scenario, options: HandoutOptions): Result<HandoutContent> {
  const computed = computeScenario(scenario);
  if (!computed.ok) return computed;
  const result = computed.value;
  const context = scenarioContext(scenario, { table: options.table });
  const people = context.people;
  if (!people.ok) return fail(people.issues);
  const text = patientText({ result, wording: scenario.wording, people: people.value, horizonYears: scenario.horizonYears ?? result.horizonYears });
  if (!text.ok) return fail(text.issues);
  return ok({
    result,
    text: text.value,
    sources: context.sourceLines,
    preparedOn: preparedOnLine(options.date),
    clinicianWarnings: result.warnings,
  });
}
