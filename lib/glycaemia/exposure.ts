/**
 * How a study defined its glycaemic exposure over time, e.g. "HbA1c in the prediabetes range by
 * the ADA criteria at 3 yearly checkups in a row, no gap over 18 months", and, optionally, its
 * comparison group's own definition ("normal at every yearly checkup over the same span"). An
 * evidence entry may carry one; a person's checkup history is then matched against it (./match.ts)
 * and is `exposed`, `comparison` or `neither`.
 *
 * Backward compatible: the first shape, `{category, criteria, minYears}`, is still a complete
 * definition. Each later field is optional and its default is what that shape meant:
 * - `test`: which test decides — `either` (default: a checkup takes the higher range of the tests
 *   it has, as ./classify.ts does), `hba1c` or `fpg` (only that test's results count; checkups
 *   without it are not results of the definition), `both` (both tests present and in the same
 *   range; a checkup with one test, or discordant tests, does not count);
 * - `maxGapMonths`: the longest gap allowed between two yearly results of the run (default and
 *   most: {@link MAX_RUN_GAP_MONTHS}, the run rule of ./persistence.ts);
 * - `comparison`: the comparison group's definition — a category and a run length, with the same
 *   criteria set, test and gap rule as the exposure. Its `minYears` defaults to the exposure's
 *   ("over the same span"). Without it nobody is classed `comparison`.
 */
import { z } from '../zod';

export const CRITERIA_SETS = ['ADA', 'WHO', 'NICE'] as const;
export type CriteriaSet = (typeof CRITERIA_SETS)[number];

/** Per-checkup categories. "diabetes-range" is a range, never a diagnosis. */
export const GLYCAEMIC_CATEGORIES = ['normal', 'prediabetes', 'diabetes-range'] as const;
export type GlycaemicCategory = (typeof GLYCAEMIC_CATEGORIES)[number];

/** Which test decides a checkup's range for an exposure definition. */
export const DECIDING_TESTS = ['either', 'hba1c', 'fpg', 'both'] as const;
export type DecidingTest = (typeof DECIDING_TESTS)[number];

/**
 * The longest gap a definition may allow, in months: the same 18 months after which
 * ./persistence.ts breaks every run (a missed yearly round). Kept equal to its MAX_GAP_MONTHS
 * (tested); not imported, so that this schema module stays free of the run code.
 */
export const MAX_RUN_GAP_MONTHS = 18;
/** The shortest gap a definition may set: yearly rounds are at least 6 months apart (./persistence.ts). */
export const MIN_RUN_GAP_MONTHS = 6;

function runYears(what: string) {
  return z
    .number({ error: `The ${what} must be a number of years` })
    .int({ error: `The ${what} must be a whole number of yearly checkups` })
    .gte(1, { error: `The ${what} must be at least 1 year` })
    .lte(50, { error: `The ${what} must be at most 50 years` });
}

/** The comparison group's own definition: same criteria set, test and gap rule as the exposure. */
export const comparisonDefinitionSchema = z.strictObject({
  category: z.enum(GLYCAEMIC_CATEGORIES, { error: 'The comparison category must be normal, prediabetes or diabetes-range' }),
  /** Yearly results in a row in that range; default: the exposure's `minYears` (the same span). */
  minYears: runYears('comparison run').optional(),
});

export const exposureDefinitionSchema = z
  .strictObject({
    category: z.enum(GLYCAEMIC_CATEGORIES, { error: 'The exposure category must be normal, prediabetes or diabetes-range' }),
    criteria: z.enum(CRITERIA_SETS, { error: 'The criteria set must be ADA, WHO or NICE' }),
    minYears: z
      .number({ error: 'The minimum run must be a number of years' })
      .int({ error: 'The minimum run must be a whole number of yearly checkups' })
      .gte(1, { error: 'The minimum run must be at least 1 year' })
      .lte(50, { error: 'The minimum run must be at most 50 years' }),
    test: z.enum(DECIDING_TESTS, { error: 'The deciding test must be either, hba1c, fpg or both' }).optional(),
    maxGapMonths: z
      .number({ error: 'The longest gap must be a number of months' })
      .int({ error: 'The longest gap must be a whole number of months' })
      .gte(MIN_RUN_GAP_MONTHS, { error: `The longest gap must be at least ${MIN_RUN_GAP_MONTHS} months (yearly rounds are at least 6 months apart)` })
      .lte(MAX_RUN_GAP_MONTHS, { error: `The longest gap must be at most ${MAX_RUN_GAP_MONTHS} months (a longer gap always breaks a run)` })
      .optional(),
    comparison: comparisonDefinitionSchema.optional(),
  })
  .superRefine((definition, ctx) => {
    if (definition.comparison && definition.comparison.category === definition.category) {
      ctx.addIssue({
        code: 'custom',
        path: ['comparison', 'category'],
        params: { code: 'invalid-choice' },
        message: `The comparison category must differ from the exposure category (${definition.category})`,
      });
    }
  });

export type ExposureDefinition = z.infer<typeof exposureDefinitionSchema>;
export type ComparisonDefinition = z.infer<typeof comparisonDefinitionSchema>;

/** A definition with every default filled in, as ./match.ts applies it. */
export interface ResolvedExposureDefinition {
  readonly category: GlycaemicCategory;
  readonly criteria: CriteriaSet;
  readonly minYears: number;
  readonly test: DecidingTest;
  readonly maxGapMonths: number;
  readonly comparison: { readonly category: GlycaemicCategory; readonly minYears: number } | null;
}

/**
 * Fills in the defaults of a (valid) definition.
 *
 * @example
 * resolveExposureDefinition({ category: 'prediabetes', criteria: 'ADA', minYears: 3 })
 * //=> { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'either', maxGapMonths: 18, comparison: null }
 */
export function resolveExposureDefinition(definition: ExposureDefinition): ResolvedExposureDefinition {
  return {
    category: definition.category,
    criteria: definition.criteria,
    minYears: definition.minYears,
    test: definition.test ?? 'either',
    maxGapMonths: definition.maxGapMonths ?? MAX_RUN_GAP_MONTHS,
    comparison: definition.comparison ? { category: definition.comparison.category, minYears: definition.comparison.minYears ?? definition.minYears } : null,
  };
}
