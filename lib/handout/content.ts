/**
 * The handout's content from one scenario: the engine's result, the patient sentences
 * (lib/wording) and where the numbers come from. {@link handoutSheet} (./sheet.ts) lays this
 * out as one printable sheet; nothing here knows about paper or layout.
 *
 * Who "people like you" are and the source lines come from lib/context/scenarioContext.ts, the
 * same function the consultation screen uses, so screen and paper always agree. No identifier
 * is ever part of a scenario, so none can reach the handout.
 */
import { scenarioContext } from '../context';
import { computeScenario } from '../engine/compute';
import type { ComputeResult } from '../engine/types';
import { fail, ok, type Result, type Warning } from '../result';
import type { Scenario } from '../scenario/schema';
import type { PopulationTable } from '../tables/schema';
import { patientText, type PatientText } from '../wording';

export type HandoutAudience = 'person' | 'group';

export interface HandoutContent {
  readonly result: ComputeResult;
  readonly text: PatientText;
  /** "Where the numbers come from": one line for the baseline, one for the study. */
  readonly sources: readonly string[];
  /** The engine's warnings, for the clinician's panel on screen (not printed). */
  readonly clinicianWarnings: readonly Warning[];
}

export interface HandoutContentOptions {
  /** The population table the baseline was looked up in, when `scenario.tableId` names one. */
  readonly table?: PopulationTable | undefined;
  /** One person (default) or a class: a group session's sheet leaves out "like you". */
  readonly audience?: HandoutAudience | undefined;
}

const PERSON_SOURCE_PREFIX = 'Risk for people like you:';
const GROUP_SOURCE_PREFIX = 'Risk for this group:';

/**
 * The "where the numbers come from" lines (lib/context/scenarioContext.ts writes them); a group
 * session's sheet says "Risk for this group" where one person's says "Risk for people like you".
 */
export function sourceLines(scenario: Scenario, table: PopulationTable | undefined, audience: HandoutAudience = 'person'): string[] {
  const lines = [...scenarioContext(scenario, { table }).sourceLines];
  return audience === 'group' ? lines.map((line) => (line.startsWith(PERSON_SOURCE_PREFIX) ? `${GROUP_SOURCE_PREFIX}${line.slice(PERSON_SOURCE_PREFIX.length)}` : line)) : lines;
}

/**
 * @example
 * buildHandout({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
 *   wording: { outcome: 'a stroke' }, person: { age: 55, sex: 'female' } }, {})
 * //=> { ok: true, value: { text: { referenceSentence: "Think of 100 women aged 55 like you. …" }, sources: [...], … } }
 */
export function buildHandout(scenario: Scenario, options: HandoutContentOptions): Result<HandoutContent> {
  const computed = computeScenario(scenario);
  if (!computed.ok) return computed;
  const result = computed.value;
  const people = scenarioContext(scenario, { table: options.table }).people;
  if (!people.ok) return fail(people.issues);
  const text = patientText({
    result,
    wording: scenario.wording,
    people: people.value,
    horizonYears: scenario.horizonYears ?? result.horizonYears,
    audience: options.audience,
  });
  if (!text.ok) return fail(text.issues);
  return ok({
    result,
    text: text.value,
    sources: sourceLines(scenario, options.table, options.audience),
    clinicianWarnings: result.warnings,
  });
}
