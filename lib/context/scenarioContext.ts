/**
 * Who a scenario's figures are about and where they come from, worked out once and used by
 * every place that says it: the consultation form's result, the line under the table picker,
 * the printed handout and "How this was worked out".
 *
 * The rule for "people like you" (lib/wording/people.ts writes the words):
 * - When the baseline was looked up in a population table, the phrase describes the table's
 *   stratum, because that is the group the figures are for: its sex ("women", "men"; "people"
 *   for a stratum of both sexes) and its age band ("aged 50 to 59", "aged 80 and over"). A band
 *   that spans every age (0 to lib/tables/schema.ts MAX_AGE_YEARS) says nothing about age, so
 *   the phrase has no age at all — a man looked up in a one-band table is one of "men", never
 *   "men aged 0 and over", and not "men aged 55" either, since the table gives no figure for
 *   his age in particular.
 * - Otherwise (a baseline typed in, or a table named by the scenario but not at hand) the
 *   person's own sex and age are used ("women aged 53").
 * - With neither, the clinician's short population wording; with nothing, the phrase is
 *   refused (`population-required`).
 * Trevena et al. 2013, BMC Med Inform Decis Mak 13(Suppl 2):S7: always state who the figures
 * describe.
 *
 * Pure: no React, no DOM. The same inputs give the same context on the screen and on paper.
 */
import type { Result } from '../result';
import type { Person, Scenario } from '../scenario/schema';
import { lookupStratum, type StratumLookup } from '../tables/lookup';
import type { PopulationTable, Stratum } from '../tables/schema';
import { agesPhrase, phraseText, spansAllAges, type AgeBand } from '../text';
import { describePeople } from '../wording/people';

/** The parts of a scenario the context reads. */
export type ScenarioContextScenario = Pick<Scenario, 'person' | 'tableId' | 'wording'>;

export interface ScenarioContextOptions {
  /**
   * The population table the scenario's `tableId` names, when the caller has it. A table
   * with another id is ignored (the scenario's baseline did not come from it).
   */
  readonly table?: PopulationTable | undefined;
  /** The stratum lookup already done for this person in that table (saves doing it again). */
  readonly lookup?: StratumLookup | undefined;
}

export interface ScenarioContext {
  /** The table the baseline was looked up in, when it is at hand and is the scenario's. */
  readonly table?: PopulationTable;
  /** The table's stratum for this person, when it was found. */
  readonly stratum?: Stratum;
  /** The stratum's age band, unless it spans every age (then there is no band to name). */
  readonly ageBand?: AgeBand;
  /**
   * "women aged 50 to 59": the group every patient sentence is about ("… like you"), or the
   * issues when nothing honest can be said (`population-required`, `too-long`, path ['people']).
   */
  readonly people: Result<string>;
  /**
   * The stratum in a clinician's words, for "How this was worked out" and the table preview's
   * details: "women, ages 50 to 59", "both sexes, ages 80 and over", "men, all ages, region
   * north". Undefined without a stratum.
   */
  readonly group?: string;
  /** True when the figures come from a table marked illustrative (demo data, not for patients). */
  readonly illustrativeTable: boolean;
  /** "Risk for people like you: <title>. Source: <source> (<year>)." or "…: entered by your clinician." */
  readonly baselineSourceLine: string;
  /** "Study: <citation>." or "Study: not named." */
  readonly studySourceLine: string;
  /** Both source lines, in the order the handout prints them. */
  readonly sourceLines: readonly string[];
}

/**
 * A stratum's age band, or undefined when it spans every age.
 * @example
 * stratumAgeBand({ sex: 'male', ageFrom: 0, ageTo: 120, risk: 0.02 }) //=> undefined
 */
export function stratumAgeBand(stratum: Pick<Stratum, 'ageFrom' | 'ageTo'>): AgeBand | undefined {
  const band = { fromYears: stratum.ageFrom, toYears: stratum.ageTo };
  return spansAllAges(band) ? undefined : band;
}

/**
 * A stratum in a clinician's words: "women, ages 50 to 59"; extra strata follow as "region north".
 * @example
 * groupPhrase({ sex: 'any', ageFrom: 80, ageTo: 120 }) //=> "both sexes, ages 80 and over"
 */
export function groupPhrase(stratum: Pick<Stratum, 'sex' | 'ageFrom' | 'ageTo' | 'extra'>): string {
  const sex = stratum.sex === 'female' ? 'women' : stratum.sex === 'male' ? 'men' : 'both sexes';
  const parts = [sex, agesPhrase({ fromYears: stratum.ageFrom, toYears: stratum.ageTo })];
  for (const [key, value] of Object.entries(stratum.extra ?? {})) parts.push(`${key} ${value}`);
  return parts.join(', ');
}

/** The person the phrase describes: the stratum's sex when there is a stratum, else the person's. */
function describedPerson(person: Person | undefined, stratum: Stratum | undefined): Person | undefined {
  if (!stratum) return person;
  return stratum.sex === 'any' ? {} : { sex: stratum.sex };
}

function findStratum(scenario: ScenarioContextScenario, table: PopulationTable | undefined, lookup: StratumLookup | undefined): Stratum | undefined {
  if (!table) return undefined;
  if (lookup) return lookup.stratum;
  if (!scenario.person) return undefined;
  const found = lookupStratum(table, scenario.person);
  return found.ok ? found.value.stratum : undefined;
}

/**
 * Everything about who and where, once per scenario.
 *
 * @param scenario - the valid scenario (only `person`, `tableId` and `wording` are read)
 * @param options - the table `scenario.tableId` names, and its lookup when already done
 * @example
 * scenarioContext({ person: { age: 53, sex: 'female' }, tableId: DEMO_HEART_FAILURE_10Y.id }, { table: DEMO_HEART_FAILURE_10Y })
 * //=> { people: { ok: true, value: "women aged 50 to 59" }, group: "women, ages 50 to 59", ageBand: { fromYears: 50, toYears: 59 }, … }
 * scenarioContext({ person: { age: 55, sex: 'male' } })
 * //=> { people: { ok: true, value: "men aged 55" }, baselineSourceLine: "Risk for people like you: entered by your clinician.", … }
 */
export function scenarioContext(scenario: ScenarioContextScenario, options: ScenarioContextOptions = {}): ScenarioContext {
  const table = options.table && scenario.tableId !== undefined && options.table.id === scenario.tableId ? options.table : undefined;
  const stratum = findStratum(scenario, table, table ? options.lookup : undefined);
  const ageBand = stratum ? stratumAgeBand(stratum) : undefined;
  const people = describePeople({
    person: describedPerson(scenario.person, stratum),
    ageBand,
    population: scenario.wording?.population,
  });
  const baselineSourceLine = table
    ? `Risk for people like you: ${table.title}. Source: ${table.source} (${table.year}).`
    : 'Risk for people like you: entered by your clinician.';
  const citation = phraseText(scenario.wording?.citation);
  const studySourceLine = citation === '' ? 'Study: not named.' : `Study: ${citation}.`;
  return {
    ...(table ? { table } : {}),
    ...(stratum ? { stratum, group: groupPhrase(stratum) } : {}),
    ...(ageBand ? { ageBand } : {}),
    people,
    illustrativeTable: table?.illustrative === true,
    baselineSourceLine,
    studySourceLine,
    sourceLines: [baselineSourceLine, studySourceLine],
  };
}
