/**
 * Validates anything that claims to be a {@link PopulationTable}: a bundled demo table, a
 * stored table read back from the browser, a JSON import.
 */
import { fail, ok, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { populationTableSchema, type PopulationTable } from './schema';

/**
 * Validate a population table.
 *
 * @example
 * parseTable({ id: 'x', title: 'T', outcome: 'O', horizonYears: 10, population: 'P', source: 'S', year: 2024,
 *   illustrative: true, strata: [{ sex: 'any', ageFrom: 30, ageTo: 79, risk: 0.05 }] })
 * //=> { ok: true, value: { id: 'x', … } }
 */
export function parseTable(input: unknown): Result<PopulationTable> {
  const parsed = populationTableSchema.safeParse(input, { reportInput: true });
  if (parsed.success) return ok(parsed.data);
  return fail(toIssues(parsed.error.issues));
}
