/**
 * A population table: the baseline risk (or event rate) of one outcome in the reference
 * population, by sex and age band, optionally split further by other strata (e.g. region).
 * The consultation screen looks up the person's stratum ({@link ../tables/lookup}) and hands
 * the engine a baseline in the scenario's own form.
 *
 * Rules, stated once here (and in docs/table-format.md):
 * - Every stratum gives either `risk` (a fraction over the table's `horizonYears`) or
 *   `rate` events per `perPersonYears` person-years; one table uses one form throughout.
 *   A risk table must state `horizonYears`; a rate table may state it as the horizon the
 *   screen suggests.
 * - Age bands are whole years, both ends included: `ageFrom 30, ageTo 39` covers ages 30 to 39.
 *   An open top band ("80 and over") is written `ageTo 120`.
 * - `sex` is `female`, `male` or `any`; one table uses either `any` throughout or
 *   `female`/`male` throughout, so that a person never falls in two strata.
 * - Extra strata are key/value text (e.g. `{ region: "north" }`); every stratum carries the
 *   same keys.
 * - Within one group of strata (same sex and same extra values) bands neither overlap nor
 *   leave a gap, and no stratum is repeated.
 *
 * Numbers in a clinic's table come from its source; the schema only checks they are usable.
 */
import { z } from '../zod';
import { fraction, MAX_TEXT, years } from '../validation/fields';
import { checkStrataLayout } from './bands';

/** The age-band tiling lives in bands.ts; re-exported here for existing importers. */
export { checkStrataLayout, describeGroup, StrataLayout, stratumGroupKey, type StratumLabel } from './bands';

/**
 * The exposure's prevalence in the table's population, a fraction in [0, 1). A table's risk is
 * the population's average, exposed people included; with the prevalence known the engine
 * recovers the comparison group's risk (methods guide, "Baselines"; lib/engine/baseline.ts).
 */
export function exposurePrevalenceField() {
  return z
    .number({ error: 'The exposure prevalence must be a number' })
    .gte(0, { error: 'The exposure prevalence must be at least 0' })
    .lt(1, { error: 'The exposure prevalence must be less than 1 (a fraction: for 30% enter 0.3)' });
}

/** Oldest age a band may reach, in years; also the end of an open top band (common practice). */
export const MAX_AGE_YEARS = 120;
/** Most strata in one table: far above any real table; keeps a typing slip from filling storage. */
export const MAX_STRATA = 100_000;
/** Longest id, in characters (the scenario's `tableId` allows the same). */
export const MAX_ID = 100;
/** Longest extra-stratum key or value, in characters. */
export const MAX_STRATUM_TEXT = 100;
/** Earliest and latest publication year accepted for a table's source. */
export const MIN_SOURCE_YEAR = 1900;
export const MAX_SOURCE_YEAR = 2100;

export const SEXES = ['female', 'male', 'any'] as const;
export type StratumSex = (typeof SEXES)[number];

/** Allowed characters of an id (and of an extra-stratum key): lower-case letters, digits, - _ . */
export const ID_PATTERN = /^[a-z0-9][a-z0-9._-]*$/;
/** Extra-stratum keys: a letter first, then letters, digits or underscores (they become CSV columns). */
export const STRATUM_KEY_PATTERN = /^[a-z][a-z0-9_]*$/;

/** One line of text: a table's details and stratum values each fit on one line of a CSV file. */
function requiredText(what: string, max = MAX_TEXT) {
  return z
    .string({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be text`) })
    .trim()
    .min(1, { error: `${what} must not be empty` })
    .max(max, { error: `${what} must be at most ${max} characters` })
    .regex(/^[^\r\n]*$/, { error: `${what} must fit on one line (no line breaks)` });
}

function age(what: string) {
  return z
    .number({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a number`) })
    .int({ error: `${what} must be a whole number of years` })
    .gte(0, { error: `${what} must be at least 0` })
    .lte(MAX_AGE_YEARS, { error: `${what} must be at most ${MAX_AGE_YEARS} (write an open top band as ${MAX_AGE_YEARS})` });
}

export const tableIdSchema = z
  .string({ error: (iss) => (iss.input === undefined ? 'The table id is required' : 'The table id must be text') })
  .min(1, { error: 'The table id must not be empty' })
  .max(MAX_ID, { error: `The table id must be at most ${MAX_ID} characters` })
  .regex(ID_PATTERN, { error: 'The table id may hold only lower-case letters, digits, "-", "_" and "." and must start with a letter or digit' });

/** A stratum's fields, each checked on its own (the CSV reader checks cell by cell with these). */
export const stratumFieldsSchema = z.strictObject({
  sex: z.enum(SEXES, { error: 'The sex must be female, male or any' }),
  ageFrom: age('The band start age'),
  ageTo: age('The band end age'),
  /** Further strata, e.g. `{ region: "north" }`; absent when the table has none (never `{}`). */
  extra: z
    .record(
      z.string().regex(STRATUM_KEY_PATTERN, {
        error: 'An extra stratum name must start with a lower-case letter and hold only lower-case letters, digits and "_"',
      }),
      requiredText('An extra stratum value', MAX_STRATUM_TEXT),
    )
    .refine((extra) => Object.keys(extra).length > 0, { error: 'Extra strata must name at least one stratum; leave the field out when there are none' })
    .optional(),
  /** Risk over the table's `horizonYears`, a fraction. */
  risk: fraction('The risk').optional(),
  /** Events per `perPersonYears` person-years. */
  rate: z
    .number({ error: 'The rate must be a number' })
    .gt(0, { error: 'The rate must be greater than 0 (events per person-years; a negative or zero rate cannot be used)' })
    .lte(1e6, { error: 'The rate must be at most 1,000,000' })
    .optional(),
  perPersonYears: z
    .number({ error: 'The person-years must be a number' })
    .gt(0, { error: 'The person-years must be greater than 0 (e.g. 1000 for a rate per 1000 person-years)' })
    .lte(1e9, { error: 'The person-years must be at most 1,000,000,000' })
    .optional(),
  /** The exposure's prevalence in this stratum; overrides the table's when both are given. */
  exposurePrevalence: exposurePrevalenceField().optional(),
});

/** Receives one problem: its path (in the stratum or the table), its issue code and its message. */
export type TableProblemReport = (path: (string | number)[], code: string, message: string) => void;

/**
 * The rules across one stratum's fields: a band ends no earlier than it starts; a risk, or a
 * rate with its person-years, never both.
 */
export function checkStratum(s: z.infer<typeof stratumFieldsSchema>, report: TableProblemReport): void {
  if (s.ageFrom > s.ageTo) {
    report(['ageTo'], 'age-band-order', `The band end age (${s.ageTo}) must be at least the start age (${s.ageFrom}); both ends are included`);
  }
  const hasRisk = s.risk !== undefined;
  const hasRate = s.rate !== undefined || s.perPersonYears !== undefined;
  if (hasRisk && hasRate) {
    report(['risk'], 'stratum-form', 'A stratum gives either a risk or a rate with its person-years, not both');
  } else if (!hasRisk && !hasRate) {
    report(['risk'], 'stratum-form', 'A stratum needs either a risk or a rate with its person-years');
  } else if (hasRate && s.rate === undefined) {
    report(['rate'], 'required', 'The rate is required when the person-years are given');
  } else if (hasRate && s.perPersonYears === undefined) {
    report(['perPersonYears'], 'required', 'The person-years are required with a rate (e.g. 1000 for a rate per 1000 person-years)');
  }
}

/** One stratum: who it covers and its baseline (a risk, or a rate per person-years). */
export const stratumSchema = stratumFieldsSchema.superRefine((s, ctx) => {
  checkStratum(s, (path, code, message) => ctx.addIssue({ code: 'custom', path, params: { code }, message }));
});

export type Stratum = z.infer<typeof stratumSchema>;

export const populationTableSchema = z
  .strictObject({
    id: tableIdSchema,
    title: requiredText('The title'),
    /** What the risk or rate is of, in plain words: "hospital admission for heart failure". */
    outcome: requiredText('The outcome'),
    /** Years the risks are over; required for a risk table, a suggested horizon for a rate table. */
    horizonYears: years('The horizon').optional(),
    /** Who the figures describe: "adults registered with practices in the north district". */
    population: requiredText('The population'),
    /** Where the figures come from (publication, registry, report). */
    source: requiredText('The source'),
    /** Year of the source's figures or publication. */
    year: z
      .number({ error: (iss) => (iss.input === undefined ? 'The year is required' : 'The year must be a number') })
      .int({ error: 'The year must be a whole number' })
      .gte(MIN_SOURCE_YEAR, { error: `The year must be at least ${MIN_SOURCE_YEAR}` })
      .lte(MAX_SOURCE_YEAR, { error: `The year must be at most ${MAX_SOURCE_YEAR}` }),
    /** True when the numbers are invented (the demo tables); the screen then says so. */
    illustrative: z.boolean({ error: 'Illustrative must be true or false' }),
    /** The exposure's prevalence in the whole table's population, when known (a stratum's own overrides it). */
    exposurePrevalence: exposurePrevalenceField().optional(),
    strata: z
      .array(stratumSchema, { error: 'The strata must be a list' })
      .min(1, { error: 'A table needs at least one stratum' })
      .max(MAX_STRATA, { error: `A table may hold at most ${MAX_STRATA.toLocaleString('en-GB')} strata` }),
  })
  .superRefine((table, ctx) => {
    checkTable(table, (path, code, message) => ctx.addIssue({ code: 'custom', path, params: { code }, message }));
  });

export type PopulationTable = z.infer<typeof populationTableSchema>;

/** The baseline form a table uses throughout. */
export type TableForm = 'risk' | 'rate';

/** Which form a (valid) table uses. */
export function tableForm(table: Pick<PopulationTable, 'strata'>): TableForm {
  return table.strata[0]?.risk !== undefined ? 'risk' : 'rate';
}

/** The extra-stratum keys of a (valid) table, sorted. */
export function extraKeys(table: Pick<PopulationTable, 'strata'>): string[] {
  return Object.keys(table.strata[0]?.extra ?? {}).sort();
}

/**
 * The whole-table rules: one form, a horizon for risks, one sex scheme, the same extra keys,
 * and age bands that tile each group without overlap, gap or repeat. Runs on strata that
 * each passed {@link stratumSchema}.
 */
export function checkTable(table: { horizonYears?: number | undefined; strata: readonly Stratum[] }, report: TableProblemReport): void {
  const { strata } = table;
  const first = strata[0];
  if (!first) return;

  const firstForm: TableForm = first.risk !== undefined ? 'risk' : 'rate';
  strata.forEach((s, i) => {
    const form: TableForm = s.risk !== undefined ? 'risk' : 'rate';
    if (form !== firstForm) {
      report(['strata', i, form], 'mixed-baseline-forms', `Stratum ${i + 1} gives a ${form} but stratum 1 gives a ${firstForm}; one table uses one form throughout`);
    }
  });
  if (firstForm === 'risk' && table.horizonYears === undefined) {
    report(['horizonYears'], 'horizon-required', 'The horizon is required for a table of risks: say over how many years the risks run');
  }

  const keys = JSON.stringify(Object.keys(first.extra ?? {}).sort());
  strata.forEach((s, i) => {
    const these = JSON.stringify(Object.keys(s.extra ?? {}).sort());
    if (these !== keys) {
      report(['strata', i, 'extra'], 'extra-strata-keys', `Stratum ${i + 1} has extra strata ${these} but stratum 1 has ${keys}; every stratum carries the same extra strata`);
    }
  });

  checkStrataLayout(strata, (path, code, message) => report(['strata', ...path], code, message));
}
