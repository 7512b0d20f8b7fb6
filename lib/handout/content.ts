/**
 * The handout's content from one scenario: the engine's result, the patient sentences
 * (lib/wording) and where the numbers come from. {@link handoutSheet} (./sheet.ts) lays this
 * out as one printable sheet; nothing here knows about paper or layout.
 *
 * Who "people like you" are: the person's sex and the age band of the table stratum the
 * baseline came from ("women aged 50 to 59"), else the person's age, else the scenario's
 * population wording if it is short enough (lib/wording/people.ts). No identifier is ever
 * part of a scenario, so none can reach the handout.
 */
import { computeScenario } from '../engine/compute';
import type { ComputeResult } from '../engine/types';
import { fail, ok, type Result, type Warning } from '../result';
import type { Scenario } from '../scenario/schema';
import { lookupStratum } from '../tables/lookup';
import type { PopulationTable } from '../tables/schema';
import { describePeople, patientText, type AgeBand, type PatientText } from '../wording';

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

function ageBandFor(scenario: Scenario, table: PopulationTable | undefined): AgeBand | undefined {
  if (!table || !scenario.person || table.id !== scenario.tableId) return undefined;
  const found = lookupStratum(table, scenario.person);
  if (!found.ok) return undefined;
  // Only a band that really is a band: a table without ages has one 0–120 stratum.
  const { ageFrom, ageTo } = found.value.stratum;
  return ageFrom === 0 && ageTo >= 120 ? undefined : { fromYears: ageFrom, toYears: ageTo };
}

/** The "where the numbers come from" lines; a group session's sheet says "this group", not "people like you". */
export function sourceLines(scenario: Scenario, table: PopulationTable | undefined, audience: HandoutAudience = 'person'): string[] {
  const lines: string[] = [];
  const whose = audience === 'group' ? 'Risk for this group' : 'Risk for people like you';
  if (table && table.id === scenario.tableId) {
    lines.push(`${whose}: ${table.title}. Source: ${table.source} (${table.year}).`);
  } else {
    lines.push(`${whose}: entered by your clinician.`);
  }
  const citation = scenario.wording?.citation?.trim();
  lines.push(citation ? `Study: ${citation}.`.replace(/\.\.$/, '.') : 'Study: not named.');
  return lines;
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
  const people = describePeople({
    person: scenario.person,
    ageBand: ageBandFor(scenario, options.table),
    population: scenario.wording?.population,
  });
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
