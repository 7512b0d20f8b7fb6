/**
 * A study's exposure definition (lib/glycaemia/exposure.ts) as form fields: the plain labels,
 * the one-line explanation under each field and the choices, shared by the consultation form
 * (app/consultation/EvidenceSection.tsx) and the library's evidence editor
 * (app/components/exposure/ExposureFields.tsx); and the pure mapping between the definition and
 * the form's text values, both ways.
 *
 * Every field is a choice, so nothing typed needs reading. "Not stated" (the empty value) keeps
 * an optional part of the definition absent, so a definition goes through the form and back
 * unchanged: `exposureFromFormValues(exposureToFormValues(d))` is `d` for every valid `d`.
 */
import { z } from '../zod';
import {
  CRITERIA_SETS,
  DECIDING_TESTS,
  exposureDefinitionSchema,
  GLYCAEMIC_CATEGORIES,
  MAX_RUN_GAP_MONTHS,
  MIN_RUN_GAP_MONTHS,
  type DecidingTest,
  type ExposureDefinition,
  type GlycaemicCategory,
} from '../glycaemia/exposure';
import { CRITERIA } from '../glycaemia/criteria';
import { fail, ok, type Result } from '../result';
import { toIssues } from '../validation/issues';

/** The deciding test in words. */
export const DECIDING_TEST_LABELS: Readonly<Record<DecidingTest, string>> = {
  either: 'HbA1c or fasting glucose (the higher range counts)',
  hba1c: 'HbA1c only',
  fpg: 'Fasting glucose only',
  both: 'Both tests, in the same range',
};

/** A range in words, for a list of choices. */
export const RANGE_LABELS: Readonly<Record<GlycaemicCategory, string>> = {
  normal: 'Normal range',
  prediabetes: 'Prediabetes range',
  'diabetes-range': 'Diabetes range',
};

/** Each field's plain label and the one line under it. */
export const EXPOSURE_FIELD_TEXT = {
  defined: { label: 'Does the study define its exposure over time?', hint: 'Needed to check a person’s checkup history, or a workforce’s, against the study.' },
  test: { label: 'Which test decides', hint: 'The test the study used to place people in a range at each checkup.' },
  category: { label: 'Range of the exposed group', hint: 'The range the exposed people were in, for example the prediabetes range.' },
  criteria: { label: 'Criteria set', hint: 'Whose cut-points the study used for the ranges: ADA, WHO or NICE.' },
  minYears: { label: 'Yearly results in a row', hint: 'How many yearly checkups in a row had to be in that range.' },
  maxGapMonths: { label: 'Longest gap allowed between checkups', hint: 'A longer gap breaks the run; 18 months is a missed yearly round.' },
  comparison: { label: 'Range of the comparison group', hint: 'The range the comparison people stayed in, for example the normal range.' },
  comparisonYears: { label: 'Comparison: yearly results in a row', hint: 'Leave at “same as the exposed group” when the study compared the same span.' },
} as const;

/** The run lengths offered (a definition allows up to 50; a longer one read from a file is added to the list). */
export const RUN_YEARS = Array.from({ length: 15 }, (_, i) => i + 1);
/** The gaps a definition may allow, in months. */
export const GAP_MONTHS = Array.from({ length: MAX_RUN_GAP_MONTHS - MIN_RUN_GAP_MONTHS + 1 }, (_, i) => MIN_RUN_GAP_MONTHS + i);

/** The exposure part of a form: every field is the value of a choice ("" = not stated). */
export const exposureFormSchema = z.object({
  defined: z.enum(['no', 'yes']),
  test: z.enum(['', ...DECIDING_TESTS]),
  category: z.enum(GLYCAEMIC_CATEGORIES),
  criteria: z.enum(CRITERIA_SETS),
  minYears: z.string(),
  maxGapMonths: z.string(),
  comparison: z.enum(['', ...GLYCAEMIC_CATEGORIES]),
  comparisonYears: z.string(),
});
export type ExposureFormValues = z.infer<typeof exposureFormSchema>;

/** No definition: the fields as they first open when "Yes" is chosen (the common shape of a workforce study). */
export const EMPTY_EXPOSURE_FORM: ExposureFormValues = {
  defined: 'no',
  test: '',
  category: 'prediabetes',
  criteria: 'ADA',
  minYears: '3',
  maxGapMonths: '',
  comparison: 'normal',
  comparisonYears: '',
};

/** A choice list entry: its value in the form and its label. */
export interface ExposureChoice {
  readonly value: string;
  readonly label: string;
}

/** The choices of each field, in the order shown; a run length beyond the list (read from a file) is added to it. */
export function exposureChoices(current?: Pick<ExposureFormValues, 'minYears' | 'comparisonYears'>): Readonly<Record<keyof ExposureFormValues, readonly ExposureChoice[]>> {
  const years = (value: string | undefined) => {
    const n = Number(value);
    const extra = value !== undefined && value !== '' && Number.isInteger(n) && !RUN_YEARS.includes(n) ? [n] : [];
    return [...RUN_YEARS, ...extra].sort((a, b) => a - b).map((y) => ({ value: String(y), label: String(y) }));
  };
  return {
    defined: [
      { value: 'no', label: 'No, or not stated' },
      { value: 'yes', label: 'Yes' },
    ],
    test: [{ value: '', label: 'Not stated (either test; the higher range counts)' }, ...DECIDING_TESTS.map((t) => ({ value: t, label: DECIDING_TEST_LABELS[t] }))],
    category: GLYCAEMIC_CATEGORIES.map((c) => ({ value: c, label: RANGE_LABELS[c] })),
    // Short names, so the list fits a 390 px phone; the hint names the bodies.
    criteria: CRITERIA_SETS.map((c) => ({ value: c, label: CRITERIA[c].id })),
    minYears: years(current?.minYears),
    maxGapMonths: [{ value: '', label: `Not stated (${MAX_RUN_GAP_MONTHS} months)` }, ...GAP_MONTHS.map((m) => ({ value: String(m), label: `${m} months` }))],
    comparison: [{ value: '', label: 'Not stated' }, ...GLYCAEMIC_CATEGORIES.map((c) => ({ value: c, label: RANGE_LABELS[c] }))],
    comparisonYears: [{ value: '', label: 'Same as the exposed group' }, ...years(current?.comparisonYears)],
  };
}

/**
 * A definition (or none) as form values.
 * @example
 * exposureToFormValues({ category: 'prediabetes', criteria: 'ADA', minYears: 3 })
 * //=> { defined: 'yes', test: '', category: 'prediabetes', criteria: 'ADA', minYears: '3', maxGapMonths: '', comparison: '', comparisonYears: '' }
 */
export function exposureToFormValues(definition: ExposureDefinition | undefined): ExposureFormValues {
  if (!definition) return EMPTY_EXPOSURE_FORM;
  return {
    defined: 'yes',
    test: definition.test ?? '',
    category: definition.category,
    criteria: definition.criteria,
    minYears: String(definition.minYears),
    maxGapMonths: definition.maxGapMonths === undefined ? '' : String(definition.maxGapMonths),
    comparison: definition.comparison?.category ?? '',
    comparisonYears: definition.comparison?.minYears === undefined ? '' : String(definition.comparison.minYears),
  };
}

/**
 * Form values → the definition (undefined when the study defines none), checked by the
 * definition's schema; its issues carry the path `[...prefix, field]` of the form field.
 * @example
 * exposureFromFormValues({ ...EMPTY_EXPOSURE_FORM, defined: 'yes', comparison: '' })
 * //=> { ok: true, value: { category: 'prediabetes', criteria: 'ADA', minYears: 3 } }
 */
export function exposureFromFormValues(values: ExposureFormValues, prefix: readonly (string | number)[] = ['exposure']): Result<ExposureDefinition | undefined> {
  if (values.defined === 'no') return ok(undefined);
  const candidate = {
    category: values.category,
    criteria: values.criteria,
    minYears: Number(values.minYears),
    ...(values.test === '' ? {} : { test: values.test }),
    ...(values.maxGapMonths === '' ? {} : { maxGapMonths: Number(values.maxGapMonths) }),
    ...(values.comparison === ''
      ? {}
      : { comparison: { category: values.comparison, ...(values.comparisonYears === '' ? {} : { minYears: Number(values.comparisonYears) }) } }),
  };
  const checked = exposureDefinitionSchema.safeParse(candidate, { reportInput: true });
  if (checked.success) return ok(checked.data);
  return fail(
    toIssues(checked.error.issues).map((issue) => {
      const [head, tail] = issue.path;
      const field = head === 'comparison' ? (tail === 'minYears' ? 'comparisonYears' : 'comparison') : String(head ?? 'defined');
      return { ...issue, path: [...prefix, field] };
    }),
  );
}
