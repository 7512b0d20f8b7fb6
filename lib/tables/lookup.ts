/**
 * Finds the person's stratum in a population table and gives its baseline in the scenario's
 * own form: `{ risk, years }` for a table of risks, `{ rate, perPersonYears }` for a table of
 * rates. No arithmetic happens here; converting a rate or another horizon is the engine's job.
 *
 * A table's risk is the population's average, exposed people included (methods guide,
 * "Baselines"). When the exposure's prevalence is known — typed by the clinician, else the
 * stratum's, else the table's — the baseline is given as a population average,
 * `{ populationRisk, exposurePrevalence, years }` (or a rate with `exposurePrevalence`), so the
 * engine applies its population-average correction (lib/engine/baseline.ts).
 */
import { fail, ok, type Issue, type Result } from '../result';
import type { Person, PopulationBaseline, RateBaseline, RiskBaseline } from '../scenario/schema';
import { describeGroup, extraKeys, MAX_AGE_YEARS, type PopulationTable, type Stratum } from './schema';

/** Where the exposure prevalence used for the correction came from; `none` when unknown. */
export type PrevalenceSource = 'clinician' | 'stratum' | 'table' | 'none';

export interface StratumLookup {
  readonly stratum: Stratum;
  /** The stratum's baseline, ready for `scenario.baseline`. */
  readonly baseline: RiskBaseline | RateBaseline | PopulationBaseline;
  /** Which exposure prevalence the baseline carries. */
  readonly prevalenceSource: PrevalenceSource;
}

export interface LookupOptions {
  /** A prevalence typed by the clinician; overrides the table's and the stratum's. */
  readonly exposurePrevalence?: number | undefined;
}

/** Values for a table's extra strata, by name, e.g. `{ region: 'north' }`. */
export type ExtraStrata = Readonly<Record<string, string>>;

/** What a table needs to know about the person to pick a stratum. */
export interface TableNeeds {
  readonly age: boolean;
  readonly sex: boolean;
  readonly extra: readonly string[];
}

/**
 * Which of the person's details a (valid) table needs: sex unless every stratum is "any";
 * age unless one band covers every age 0–120 in each group; every extra stratum.
 */
export function tableNeeds(table: PopulationTable): TableNeeds {
  return {
    sex: table.strata.some((s) => s.sex !== 'any'),
    age: table.strata.some((s) => s.ageFrom > 0 || s.ageTo < MAX_AGE_YEARS),
    extra: extraKeys(table),
  };
}

function ageRange(strata: readonly Stratum[]): string {
  const from = Math.min(...strata.map((s) => s.ageFrom));
  const to = Math.max(...strata.map((s) => s.ageTo));
  return to >= MAX_AGE_YEARS ? `ages ${from} and over` : `ages ${from} to ${to}`;
}

/**
 * Look up the stratum for a person in a valid table (one that passed `parseTable`).
 *
 * Issues name the field the table needs: `person.age`, `person.sex` or `extra.<name>`,
 * with code `required` when it is missing and `no-stratum` when no stratum covers it.
 *
 * @example
 * lookupStratum(demoHeartFailure, { age: 45, sex: 'female' })
 * //=> { ok: true, value: { stratum: { sex: 'female', ageFrom: 40, ageTo: 49, risk: 0.006 }, baseline: { risk: 0.006, years: 10 } } }
 * lookupStratum(demoHeartFailure, { age: 17, sex: 'female' })
 * //=> { ok: false, issues: [{ code: 'no-stratum', path: ['person', 'age'], message: 'No band of the table … covers age 17 …' }] }
 */
export function lookupStratum(table: PopulationTable, person: Person, extra: ExtraStrata = {}, options: LookupOptions = {}): Result<StratumLookup> {
  const needs = tableNeeds(table);
  const issues: Issue[] = [];
  const name = `"${table.title}"`;
  if (needs.sex && person.sex === undefined) {
    issues.push({ code: 'required', path: ['person', 'sex'], message: `The sex is required: the table ${name} gives figures for women and men separately` });
  }
  if (needs.age && person.age === undefined) {
    issues.push({ code: 'required', path: ['person', 'age'], message: `The age is required: the table ${name} gives figures by age band (${ageRange(table.strata)})` });
  }
  for (const key of needs.extra) {
    if (extra[key] === undefined) {
      const values = [...new Set(table.strata.map((s) => s.extra?.[key] ?? ''))].join(', ');
      issues.push({ code: 'required', path: ['extra', key], message: `The ${key} is required: the table ${name} gives figures by ${key} (${values})` });
    }
  }
  if (issues.length > 0) return fail(issues);

  // Narrow field by field so a miss names the field that ruled the person out.
  let candidates = table.strata;
  if (needs.sex) {
    const bySex = candidates.filter((s) => s.sex === person.sex);
    if (bySex.length === 0) {
      return fail([{ code: 'no-stratum', path: ['person', 'sex'], message: `The table ${name} has no figures for sex "${person.sex}"` }]);
    }
    candidates = bySex;
  }
  for (const key of needs.extra) {
    const byExtra = candidates.filter((s) => s.extra?.[key] === extra[key]);
    if (byExtra.length === 0) {
      const values = [...new Set(candidates.map((s) => s.extra?.[key] ?? ''))].join(', ');
      return fail([{ code: 'no-stratum', path: ['extra', key], message: `The table ${name} has no ${key} "${extra[key]}"; it has ${values}` }]);
    }
    candidates = byExtra;
  }
  const age = person.age ?? 0;
  const stratum = needs.age ? candidates.find((s) => s.ageFrom <= age && age <= s.ageTo) : candidates[0];
  if (!stratum) {
    const group = candidates[0] ? ` for ${describeGroup(candidates[0])}` : '';
    return fail([
      {
        code: 'no-stratum',
        path: ['person', 'age'],
        message: `No band of the table ${name} covers age ${age}${group}; the table covers ${ageRange(candidates)}`,
      },
    ]);
  }
  const { prevalence, source } = prevalenceFor(table, stratum, options);
  return ok({ stratum, baseline: baselineOf(table, stratum, prevalence), prevalenceSource: source });
}

/** The prevalence to correct with: the clinician's, else the stratum's, else the table's. */
export function prevalenceFor(
  table: Pick<PopulationTable, 'exposurePrevalence'>,
  stratum: Pick<Stratum, 'exposurePrevalence'>,
  options: LookupOptions = {},
): { prevalence: number | undefined; source: PrevalenceSource } {
  if (options.exposurePrevalence !== undefined) return { prevalence: options.exposurePrevalence, source: 'clinician' };
  if (stratum.exposurePrevalence !== undefined) return { prevalence: stratum.exposurePrevalence, source: 'stratum' };
  if (table.exposurePrevalence !== undefined) return { prevalence: table.exposurePrevalence, source: 'table' };
  return { prevalence: undefined, source: 'none' };
}

/**
 * A stratum's baseline in the scenario's form. A risk table always has `horizonYears` once valid.
 * With a prevalence, a population average for the engine to correct.
 */
export function baselineOf(table: PopulationTable, stratum: Stratum, exposurePrevalence?: number): RiskBaseline | RateBaseline | PopulationBaseline {
  if (stratum.risk !== undefined) {
    const years = table.horizonYears ?? Number.NaN;
    if (exposurePrevalence !== undefined) return { populationRisk: stratum.risk, exposurePrevalence, years };
    return { risk: stratum.risk, years };
  }
  const rate = { rate: stratum.rate ?? Number.NaN, perPersonYears: stratum.perPersonYears ?? Number.NaN };
  return exposurePrevalence === undefined ? rate : { ...rate, exposurePrevalence };
}
