/**
 * How a study defined its glycaemic exposure over time, e.g. "in the prediabetes range by the
 * ADA criteria at every yearly checkup for at least 3 years". An evidence entry may carry one;
 * a person's checkup history is then matched against it (see ./match.ts, issue "Glucose history").
 */
import { z } from '../zod';

export const CRITERIA_SETS = ['ADA', 'WHO', 'NICE'] as const;
export type CriteriaSet = (typeof CRITERIA_SETS)[number];

/** Per-checkup categories. "diabetes-range" is a range, never a diagnosis. */
export const GLYCAEMIC_CATEGORIES = ['normal', 'prediabetes', 'diabetes-range'] as const;
export type GlycaemicCategory = (typeof GLYCAEMIC_CATEGORIES)[number];

export const exposureDefinitionSchema = z.strictObject({
  category: z.enum(GLYCAEMIC_CATEGORIES, { error: 'The exposure category must be normal, prediabetes or diabetes-range' }),
  criteria: z.enum(CRITERIA_SETS, { error: 'The criteria set must be ADA, WHO or NICE' }),
  minYears: z
    .number({ error: 'The minimum run must be a number of years' })
    .int({ error: 'The minimum run must be a whole number of yearly checkups' })
    .gte(1, { error: 'The minimum run must be at least 1 year' })
    .lte(50, { error: 'The minimum run must be at most 50 years' }),
});

export type ExposureDefinition = z.infer<typeof exposureDefinitionSchema>;
