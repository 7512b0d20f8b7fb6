/**
 * The consultation pipeline run once per change: form values → {@link formToFigures}. The
 * resolver (field errors) and the result panel both ask for the same values; the second
 * asker gets the first one's answer, so the engine runs once per change and an unchanged
 * form gives the very same outcome object (memoised components then skip their redraw).
 * Pure TypeScript (no React), tested in tests/unit/consultation/pipeline.test.ts.
 */
import { fail, type Result } from '../result';
import type { PopulationTable } from '../tables/schema';
import { formInputSchema, formToFigures, type ConsultationFormValues, type FormFigures } from './formValues';

/**
 * Structural equality of plain form values (objects of strings): the same fields with the
 * same text.
 * @example
 * sameFormValues({ a: '1', b: { c: '' } }, { a: '1', b: { c: '' } }) //=> true
 */
export function sameFormValues(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  const aKeys = Object.keys(a);
  const bKeys = Object.keys(b);
  if (aKeys.length !== bKeys.length) return false;
  return aKeys.every((key) => Object.hasOwn(b, key) && sameFormValues((a as Record<string, unknown>)[key], (b as Record<string, unknown>)[key]));
}

export type FormPipeline = (values: unknown, tables: readonly PopulationTable[]) => Result<FormFigures>;

const INCOMPLETE = fail<never>([{ code: 'invalid', path: [], message: 'The form is incomplete' }]);

/**
 * A pipeline that remembers its last answer.
 * @example
 * const run = createFormPipeline();
 * run(values, tables) === run({ ...values }, tables) //=> true
 */
export function createFormPipeline(compute: typeof formToFigures = formToFigures): FormPipeline {
  let last: { values: ConsultationFormValues; tables: readonly PopulationTable[]; outcome: Result<FormFigures> } | undefined;
  return (values, tables) => {
    const shaped = formInputSchema.safeParse(values);
    if (!shaped.success) return INCOMPLETE;
    if (last && last.tables === tables && sameFormValues(last.values, shaped.data)) return last.outcome;
    const outcome = compute(shaped.data, tables);
    last = { values: shaped.data, tables, outcome };
    return outcome;
  };
}
