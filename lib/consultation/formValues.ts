/**
 * The consultation form's values: what the clinician types, and how it becomes a
 * {@link Scenario} and a result. Pure (no React): the screen (app/consultation) only wires these
 * values to react-hook-form. Tested in tests/unit/consultation/formValues.test.ts.
 *
 * The form holds text exactly as typed. {@link makeConsultationSchema} builds the zod schema the
 * form's resolver uses: its input is the raw form values, its output a {@link FormOutcome}. The
 * output is produced only through the engine's own checks — the table lookup
 * (lib/tables/lookup.ts), {@link parseScenario} (the scenario schema, the same one the URL and the
 * command line use) and {@link computeScenario} — and their issues are mapped back onto the form
 * fields, so every message the clinician sees is the engine's message for that field.
 */
import { z } from '../zod';
import { computeScenario } from '../engine/compute';
import type { ComputeResult } from '../engine/types';
import { fail, ok, type Issue, type Result } from '../result';
import { parseScenario } from '../scenario/parse';
import { toIssues } from '../validation/issues';
import { personSchema, type Scenario } from '../scenario/schema';
import { lookupStratum, tableNeeds, type StratumLookup } from '../tables/lookup';
import type { PopulationTable } from '../tables/schema';
import { scenarioContext, type ScenarioContext } from '../context';
import {
  ADJUSTED_CHOICES_FOR_FORM,
  BASELINE_SOURCE_CHOICES,
  choiceValues,
  DENOMINATOR_CHOICES_FOR_FORM,
  DESIGN_CHOICES,
  LEVEL_CHOICES_FOR_FORM,
  MEASURE_CHOICES,
  SEX_CHOICES_FOR_FORM,
} from './choices';
import { numberFromText, optionalText, phraseText } from '../text';
import { EMPTY_EXPOSURE_FORM, exposureFormSchema, exposureFromFormValues } from '../evidence/exposureForm';
import type { ExposureDefinition } from '../glycaemia/exposure';

export { numberFromText };

/** Where the baseline comes from: a bundled table, or one of the engine's three forms typed in. */
export const BASELINE_SOURCES = choiceValues(BASELINE_SOURCE_CHOICES);
export type BaselineSource = (typeof BASELINE_SOURCES)[number];

// The zod enums are the values of the form's own choice lists (./choices.ts): one list each.
export const DENOMINATOR_CHOICES = choiceValues(DENOMINATOR_CHOICES_FOR_FORM);
export const LEVEL_CHOICES = choiceValues(LEVEL_CHOICES_FOR_FORM);
export const ADJUSTED_CHOICES = choiceValues(ADJUSTED_CHOICES_FOR_FORM);
export const SEX_CHOICES = choiceValues(SEX_CHOICES_FOR_FORM);

/** The raw form: every field is text as typed, or the value of a choice ("" = not stated). */
export const formInputSchema = z.object({
  baselineSource: z.enum(BASELINE_SOURCES),
  tableId: z.string(),
  /** The exposure's prevalence typed for a table baseline; overrides the table's (issue 11 item 3). */
  tablePrevalence: z.string(),
  person: z.object({ age: z.string(), sex: z.enum(SEX_CHOICES) }),
  riskBaseline: z.object({ risk: z.string(), years: z.string() }),
  rateBaseline: z.object({ rate: z.string(), perPersonYears: z.string() }),
  populationBaseline: z.object({ populationRisk: z.string(), exposurePrevalence: z.string(), years: z.string() }),
  evidenceId: z.string(),
  effect: z.object({
    measure: z.enum(['', ...choiceValues(MEASURE_CHOICES)]),
    estimate: z.string(),
    lower: z.string(),
    upper: z.string(),
    level: z.enum(LEVEL_CHOICES),
    design: z.enum(choiceValues(DESIGN_CHOICES)),
    followUpYears: z.string(),
    adjusted: z.enum(ADJUSTED_CHOICES),
  }),
  wording: z.object({ outcome: z.string(), exposure: z.string(), comparison: z.string(), population: z.string(), citation: z.string() }),
  /** The study's exposure definition over time (lib/evidence/exposureForm.ts), every field a choice. */
  exposure: exposureFormSchema,
  horizonYears: z.string(),
  denominator: z.enum(DENOMINATOR_CHOICES),
});

export type ConsultationFormValues = z.infer<typeof formInputSchema>;

/** The form as it first opens: nothing chosen, nothing typed. */
export const EMPTY_FORM_VALUES: ConsultationFormValues = {
  baselineSource: 'table',
  tableId: '',
  tablePrevalence: '',
  person: { age: '', sex: '' },
  riskBaseline: { risk: '', years: '' },
  rateBaseline: { rate: '', perPersonYears: '' },
  populationBaseline: { populationRisk: '', exposurePrevalence: '', years: '' },
  evidenceId: '',
  effect: { measure: '', estimate: '', lower: '', upper: '', level: '', design: '', followUpYears: '', adjusted: '' },
  wording: { outcome: '', exposure: '', comparison: '', population: '', citation: '' },
  exposure: EMPTY_EXPOSURE_FORM,
  horizonYears: '',
  denominator: 'auto',
};

/** The figures, made from valid numbers; the words may still be missing. */
export interface FormFigures {
  readonly scenario: Scenario;
  readonly result: ComputeResult;
  /** The table and stratum the baseline was looked up in, when it was. */
  readonly table?: PopulationTable;
  readonly lookup?: StratumLookup;
  /** Who the figures are about and where they come from (lib/context), worked out once. */
  readonly context: ScenarioContext;
  /** What the patient sentences and the handout still need, each on its form field. */
  readonly wordsNeeded: readonly Issue[];
}

/** Everything the screen shows, made from valid form values with their words. */
export interface FormOutcome extends FormFigures {
  /** Who "people like you" are, e.g. "women aged 40 to 49". */
  readonly people: string;
}

/**
 * The sentences (lib/wording/patient.ts) refuse a result without these two, with the same
 * codes; checking them here keeps the form from offering a result the sentences would refuse.
 */
export const OUTCOME_REQUIRED_MESSAGE = 'The outcome is required in plain words, e.g. "heart failure needing hospital care"';

/** Drops the keys whose value is undefined, so optional scenario fields stay absent. */
export function defined<T extends Record<string, unknown>>(object: T): { [K in keyof T]?: Exclude<T[K], undefined> } {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(object)) if (value !== undefined) out[key] = value;
  return out as { [K in keyof T]?: Exclude<T[K], undefined> };
}

const BASELINE_FIELD_GROUP: Record<Exclude<BaselineSource, 'table'>, keyof ConsultationFormValues> = {
  risk: 'riskBaseline',
  rate: 'rateBaseline',
  population: 'populationBaseline',
};

const FIRST_BASELINE_FIELD: Record<Exclude<BaselineSource, 'table'>, string> = { risk: 'risk', rate: 'rate', population: 'populationRisk' };

/** Maps an issue's path in the scenario onto the form field that holds it. */
export function formPathFor(scenarioPath: readonly (string | number)[], source: BaselineSource): (string | number)[] {
  const [head, ...rest] = scenarioPath;
  if (head === 'baseline') {
    if (source === 'table') return rest[0] === 'exposurePrevalence' ? ['tablePrevalence'] : ['tableId'];
    return [BASELINE_FIELD_GROUP[source], ...(rest.length > 0 ? rest : [FIRST_BASELINE_FIELD[source]])];
  }
  if (head === 'tableId' || head === 'extra') return ['tableId'];
  if (head === undefined) return ['baselineSource'];
  return [head, ...rest];
}

function remap(issues: readonly Issue[], source: BaselineSource): Issue[] {
  return issues.map((issue) => ({ ...issue, path: formPathFor(issue.path, source) }));
}

type BaselinePart = {
  baseline: unknown;
  person?: Scenario['person'];
  tableId?: string;
  table?: PopulationTable;
  lookup?: StratumLookup;
  horizonFromTable?: number;
};

export function checkedPerson(person: Scenario['person'] & object): Result<Scenario['person']> {
  const checked = personSchema.safeParse(person, { reportInput: true });
  if (checked.success) return ok(checked.data);
  return fail(toIssues(checked.error.issues).map((issue) => ({ ...issue, path: ['person', ...issue.path] })));
}

/**
 * A typed-in baseline needs no person, but an age or sex the clinician gives says who
 * "people like you" are in the sentences; both are optional.
 */
function withPerson(values: ConsultationFormValues, part: BaselinePart): Result<BaselinePart> {
  const person = defined({ age: numberFromText(values.person.age), sex: values.person.sex === '' ? undefined : values.person.sex });
  if (Object.keys(person).length === 0) return ok(part);
  const checked = checkedPerson(person);
  if (!checked.ok) return fail(checked.issues);
  return ok({ ...part, person: checked.value });
}

/** Risk and prevalence fields are proportions: "8%" there is read as 0.08 (lib/text/decimal.ts). */
const PERCENT = { percent: true } as const;

/** The baseline part of the scenario, from the chosen source. */
function baselinePart(
  values: ConsultationFormValues,
  tables: readonly PopulationTable[],
): Result<BaselinePart> {
  switch (values.baselineSource) {
    // Every key of the chosen form is kept, even when blank, so the engine reports each missing
    // field of that form ("… is required") rather than "the baseline must be one of …".
    case 'risk':
      return withPerson(values, { baseline: { risk: numberFromText(values.riskBaseline.risk, PERCENT), years: numberFromText(values.riskBaseline.years) } });
    case 'rate':
      return withPerson(values, { baseline: { rate: numberFromText(values.rateBaseline.rate), perPersonYears: numberFromText(values.rateBaseline.perPersonYears) } });
    case 'population':
      return withPerson(values, {
        baseline: {
          populationRisk: numberFromText(values.populationBaseline.populationRisk, PERCENT),
          exposurePrevalence: numberFromText(values.populationBaseline.exposurePrevalence, PERCENT),
          years: numberFromText(values.populationBaseline.years),
        },
      });
    case 'table': {
      const table = tables.find((t) => t.id === values.tableId);
      if (!table) {
        return fail([{ code: 'required', path: ['tableId'], message: 'Choose a population table, or enter the baseline yourself' }]);
      }
      const needs = tableNeeds(table);
      const age = needs.age ? numberFromText(values.person.age) : undefined;
      const person = defined({ age, sex: needs.sex && values.person.sex !== '' ? values.person.sex : undefined });
      // The person schema checks the age (whole years, 0 to 120) before the lookup uses it.
      const checked = checkedPerson(person);
      if (!checked.ok) return fail(checked.issues);
      const found = lookupStratum(table, person, {}, { exposurePrevalence: numberFromText(values.tablePrevalence) });
      if (!found.ok) return fail(found.issues);
      return ok({
        baseline: found.value.baseline,
        person,
        tableId: table.id,
        table,
        lookup: found.value,
        ...(table.horizonYears !== undefined && 'rate' in found.value.baseline ? { horizonFromTable: table.horizonYears } : {}),
      });
    }
  }
}

/**
 * The effect fields as typed → the effect for the scenario schema to judge: numbers through the
 * one decimal reader (lib/text/decimal.ts), "" (not stated) left out. The consultation form and
 * the library's evidence editor (./evidenceEditor.ts) both use it.
 * @example
 * effectFromForm({ measure: 'RR', estimate: '1,5', lower: '1.2', upper: '1.9', level: '', design: '', followUpYears: '', adjusted: 'yes' })
 * //=> { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9, adjusted: true }
 */
export function effectFromForm(e: ConsultationFormValues['effect']): Record<string, unknown> {
  return defined({
    measure: e.measure === '' ? undefined : e.measure,
    estimate: numberFromText(e.estimate),
    lower: numberFromText(e.lower),
    upper: numberFromText(e.upper),
    level: e.level === '' ? undefined : Number(e.level),
    design: e.design === '' ? undefined : e.design,
    followUpYears: numberFromText(e.followUpYears),
    adjusted: e.adjusted === '' ? undefined : e.adjusted === 'yes',
  });
}

/** The wording fields, trimmed; blank ones left out. */
export function wordingFromForm(w: ConsultationFormValues['wording']): Record<string, string> {
  return defined({
    outcome: optionalText(w.outcome),
    exposure: optionalText(w.exposure),
    comparison: optionalText(w.comparison),
    population: optionalText(w.population),
    citation: optionalText(w.citation),
  });
}

/**
 * Valid numbers → scenario, result and context, with the words the patient sentences still
 * need (`wordsNeeded`, each on its form field); otherwise the issues, each on its form field.
 * The figures do not wait for the words: the screen shows them as soon as the numbers are valid.
 *
 * @param tables - the population tables the clinician can pick from
 * @example
 * formToFigures({ ...EMPTY_FORM_VALUES, baselineSource: 'risk', riskBaseline: { risk: '0.08', years: '10' },
 *   effect: { ...EMPTY_FORM_VALUES.effect, measure: 'RR', estimate: '1.5', lower: '1.2', upper: '1.9' } }, [])
 * //=> { ok: true, value: { scenario: { baseline: { risk: 0.08, years: 10 }, … }, result: { … }, wordsNeeded: [{ code: 'population-required', … }, { code: 'outcome-required', … }] } }
 */
export function formToFigures(values: ConsultationFormValues, tables: readonly PopulationTable[]): Result<FormFigures> {
  const source = values.baselineSource;
  const base = baselinePart(values, tables);
  const effect = effectFromForm(values.effect);
  const wordingFields = wordingFromForm(values.wording);
  const exposure = exposureFromFormValues(values.exposure, ['exposure']);
  const horizonTyped = numberFromText(values.horizonYears);
  const horizonYears = horizonTyped ?? (base.ok ? base.value.horizonFromTable : undefined);
  const candidate = defined({
    // A placeholder baseline keeps the other fields' checks running while the table is unfinished.
    baseline: base.ok ? base.value.baseline : { risk: 0.5, years: 1 },
    effect,
    horizonYears,
    denominator: values.denominator === 'auto' ? undefined : Number(values.denominator),
    wording: Object.keys(wordingFields).length > 0 ? wordingFields : undefined,
    person: base.ok ? base.value.person : undefined,
    exposureDefinition: exposure.ok ? exposure.value : undefined,
    tableId: base.ok ? base.value.tableId : undefined,
  });

  const parsed = parseScenario(candidate);
  const issues: Issue[] = [
    ...(base.ok ? [] : remap(base.issues, source)),
    ...(parsed.ok ? [] : remap(parsed.issues, source)),
    ...(exposure.ok ? [] : exposure.issues),
  ];
  if (!base.ok || !parsed.ok || !exposure.ok) return fail(dedupe(issues));

  const computed = computeScenario(parsed.value);
  if (!computed.ok) {
    // A degenerate baseline over the horizon: the horizon is the field most likely to fix it.
    return fail(remap(computed.issues, source).map((issue) => (source === 'table' ? { ...issue, path: ['horizonYears'] } : issue)));
  }
  const { table, lookup } = base.value;
  const scenario = parsed.value;
  const result = computed.value;
  const context = scenarioContext(scenario, { table, lookup });
  const people = context.people;
  const textIssues: Issue[] = people.ok ? [] : [...people.issues];
  if (phraseText(scenario.wording?.outcome) === '') {
    textIssues.push({ code: 'outcome-required', path: ['wording', 'outcome'], message: OUTCOME_REQUIRED_MESSAGE });
  }
  return ok({
    scenario,
    result,
    ...(table ? { table } : {}),
    ...(lookup ? { lookup } : {}),
    context,
    wordsNeeded: dedupe(textIssues.map((issue) => ({ ...issue, path: textPathFor(issue.path) }))),
  });
}

/**
 * The exposure definition the form holds, when its fields make a valid one (whatever the rest
 * of the form says): the glucose history is checked against it while the figures are unfinished.
 * @example
 * formExposure({ ...EMPTY_FORM_VALUES, exposure: { ...EMPTY_EXPOSURE_FORM, defined: 'yes' } })
 * //=> { category: 'prediabetes', criteria: 'ADA', minYears: 3, comparison: { category: 'normal' } }
 */
export function formExposure(values: unknown): ExposureDefinition | undefined {
  const shaped = formInputSchema.shape.exposure.safeParse((values as { exposure?: unknown } | null)?.exposure);
  if (!shaped.success) return undefined;
  const read = exposureFromFormValues(shaped.data);
  return read.ok ? read.value : undefined;
}

/**
 * Valid form values with the words the sentences need → scenario and result; otherwise the
 * issues, each on its form field (the figures' issues, else the missing words).
 *
 * @param tables - the population tables the clinician can pick from
 * @example
 * formToOutcome({ ...EMPTY_FORM_VALUES, baselineSource: 'risk', riskBaseline: { risk: '0.08', years: '10' },
 *   effect: { ...EMPTY_FORM_VALUES.effect, measure: 'RR', estimate: '1.5', lower: '1.2', upper: '1.9' } }, [])
 * //=> { ok: false, issues: [{ code: 'population-required', path: ['wording', 'population'], … }, { code: 'outcome-required', … }] }
 */
export function formToOutcome(values: ConsultationFormValues, tables: readonly PopulationTable[]): Result<FormOutcome> {
  const figures = formToFigures(values, tables);
  if (!figures.ok) return figures;
  const { context, wordsNeeded } = figures.value;
  if (!context.people.ok || wordsNeeded.length > 0) return fail(wordsNeeded);
  return ok({ ...figures.value, people: context.people.value });
}

/**
 * The sentences need the outcome in words and who the figures are about: without an age or sex
 * the population wording names the group, so that is the field to fill.
 */
function textPathFor(path: readonly (string | number)[]): (string | number)[] {
  if (path[0] === 'people') return ['wording', 'population'];
  return [...path];
}

/** One message per field: the first, as the engine orders them. */
function dedupe(issues: readonly Issue[]): Issue[] {
  const seen = new Set<string>();
  return issues.filter((issue) => {
    const key = issue.path.join('.');
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/**
 * The zod schema for react-hook-form's resolver: raw values in, {@link FormOutcome} out, the
 * engine's issues attached to the form's field paths.
 *
 * @param tables - the tables the clinician can pick from (bundled and from the clinic library)
 */
export function makeConsultationSchema(tables: readonly PopulationTable[]) {
  return formInputSchema.transform((values, ctx) => {
    const outcome = formToOutcome(values, tables);
    if (outcome.ok) return outcome.value;
    for (const issue of outcome.issues) {
      ctx.addIssue({ code: 'custom', path: [...issue.path], message: issue.message, params: { code: issue.code } });
    }
    return z.NEVER;
  });
}
