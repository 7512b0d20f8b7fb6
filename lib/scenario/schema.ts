/**
 * The scenario: everything needed to compute one result, and everything the consultation
 * screen, the handout, the link codec and the `hundredfold` command share.
 *
 * This file is the single source of the input types (`z.infer`). The same schema validates
 * the form, the URL, the command line and every import; {@link parseScenario} turns its
 * failures into {@link Issue}s.
 *
 * Ranges are stated once here, with the reason for each bound. Risks are fractions.
 */
import { z } from '../zod';
import { exposureDefinitionSchema } from '../glycaemia/exposure';
import { fraction, MAX_RATIO, MAX_TEXT, MAX_YEARS, MIN_RATIO, numberField, ratio, text, years } from '../validation/fields';

/**
 * The interval levels offered as choices in forms. Any level from {@link MIN_INTERVAL_LEVEL} to
 * {@link MAX_INTERVAL_LEVEL} is accepted (e.g. 0.975 for a one-sided 2.5% test); the engine carries
 * the level through and takes z from lib/stats/normalQuantile.ts; it does not re-estimate.
 */
export const INTERVAL_LEVELS = [0.9, 0.95, 0.99] as const;
/** Lowest interval level accepted: 80% (common practice: narrower intervals are not published as confidence intervals). */
export const MIN_INTERVAL_LEVEL = 0.8;
/** Highest interval level accepted: 99.9%. */
export const MAX_INTERVAL_LEVEL = 0.999;
/** An interval level, a fraction from 0.8 to 0.999. */
export type IntervalLevel = number;

/**
 * Study designs, each with its own treatment of an odds ratio (see lib/engine/conversion.ts).
 * The two matched designs report a conditional odds ratio (conditional logistic regression):
 * `matched-case-control` with controls drawn from non-cases (read as a risk odds ratio),
 * `matched-risk-set-case-control` with risk-set sampling (read as a rate ratio).
 */
export const STUDY_DESIGNS = [
  'cohort',
  'trial',
  'cross-sectional',
  'case-control',
  'risk-set-case-control',
  'case-cohort',
  'matched-case-control',
  'matched-risk-set-case-control',
] as const;
export type StudyDesign = (typeof STUDY_DESIGNS)[number];

export const EFFECT_MEASURES = ['OR', 'RR', 'HR'] as const;
export type EffectMeasure = (typeof EFFECT_MEASURES)[number];

export const DENOMINATORS = [100, 1000] as const;
export type Denominator = (typeof DENOMINATORS)[number];

// The field builders and limits are shared by every schema in lib/ (lib/validation/fields.ts);
// re-exported here for the modules that import them from the scenario.
export { fraction, MAX_RATIO, MAX_TEXT, MAX_YEARS, MIN_RATIO, years };

/** A risk over a stated number of years in the reference (unexposed) group. */
export const riskBaselineSchema = z.strictObject({
  risk: fraction('The baseline risk'),
  years: years('The baseline period'),
});

function prevalence(what: string) {
  return numberField(what)
    .gte(0, { error: `${what} must be at least 0` })
    .lt(1, { error: `${what} must be less than 1 (a fraction: for 30% enter 0.3)` });
}

/**
 * An event rate: `rate` events per `perPersonYears` person-years (e.g. 12 per 1000). With
 * `exposurePrevalence` the rate is a population average (e.g. from a population table that
 * states the exposure's prevalence) and the engine corrects it as it does a population risk.
 */
export const rateBaselineSchema = z.strictObject({
  rate: numberField('The event rate')
    .gt(0, { error: 'The event rate must be greater than 0' })
    .lte(1e6, { error: 'The event rate must be at most 1,000,000' }),
  perPersonYears: numberField('The person-years')
    .gt(0, { error: 'The person-years must be greater than 0 (e.g. 1000 for a rate per 1000 person-years)' })
    .lte(1e9, { error: 'The person-years must be at most 1,000,000,000' }),
  exposurePrevalence: prevalence('The exposure prevalence').optional(),
});

/**
 * A population-average risk, which mixes exposed and unexposed people, plus the exposure's
 * prevalence in that population; the engine solves for the reference-group risk.
 */
export const populationBaselineSchema = z.strictObject({
  populationRisk: fraction('The population risk'),
  exposurePrevalence: prevalence('The exposure prevalence'),
  years: years('The baseline period'),
});

export const baselineSchema = z.union([riskBaselineSchema, rateBaselineSchema, populationBaselineSchema]);

/** The keys that pick each baseline form, in the order of {@link baselineSchema}'s options. */
export const BASELINE_FORM_KEYS = ['risk', 'rate', 'populationRisk'] as const;

export const effectSchema = z
  .strictObject({
    measure: z.enum(EFFECT_MEASURES, {
      error: (iss) => (iss.input === undefined ? 'The measure is required: OR, RR or HR' : 'The measure must be one of OR, RR or HR'),
    }),
    estimate: ratio('The estimate'),
    lower: ratio('The lower limit'),
    upper: ratio('The upper limit'),
    level: z
      .number({ error: 'The interval level must be a number, a fraction such as 0.95' })
      .gte(MIN_INTERVAL_LEVEL, { error: `The interval level must be from ${MIN_INTERVAL_LEVEL} to ${MAX_INTERVAL_LEVEL} (a fraction: for 95% enter 0.95)` })
      .lte(MAX_INTERVAL_LEVEL, { error: `The interval level must be from ${MIN_INTERVAL_LEVEL} to ${MAX_INTERVAL_LEVEL} (a fraction: for 95% enter 0.95)` })
      .optional(),
    design: z
      .enum(STUDY_DESIGNS, {
        error: `The study design must be one of ${STUDY_DESIGNS.join(', ')}`,
      })
      .optional(),
    followUpYears: years('The follow-up').optional(),
    adjusted: z.boolean({ error: 'Adjusted must be true or false' }).optional(),
  })
  .superRefine((effect, ctx) => {
    if (effect.lower >= effect.upper) {
      ctx.addIssue({
        code: 'custom',
        path: ['lower'],
        params: { code: 'interval-order' },
        message: `The lower limit (${effect.lower}) must be less than the upper limit (${effect.upper}); check the order of the limits`,
      });
    } else if (effect.estimate < effect.lower || effect.estimate > effect.upper) {
      ctx.addIssue({
        code: 'custom',
        path: ['estimate'],
        params: { code: 'estimate-outside-interval' },
        message: `The estimate (${effect.estimate}) must lie within its interval (${effect.lower} to ${effect.upper}); this is almost always a typing slip`,
      });
    }
  });

/** Words that describe the evidence; shown on the screen and the handout, never computed with. */
export const wordingSchema = z.strictObject({
  outcome: text('The outcome').optional(),
  exposure: text('The exposure').optional(),
  comparison: text('The comparison').optional(),
  population: text('The population').optional(),
  citation: text('The citation').optional(),
});

/** Who the baseline was looked up for. Never an identifier: only what a table's strata need. */
export const personSchema = z.strictObject({
  age: numberField('The age')
    .int({ error: 'The age must be a whole number of years' })
    .gte(0, { error: 'The age must be at least 0' })
    .lte(120, { error: 'The age must be at most 120' })
    .optional(),
  sex: z.enum(['female', 'male'], { error: 'The sex must be female or male' }).optional(),
});

/** Everything in a scenario but its baseline. */
const scenarioShape = {
  effect: effectSchema,
  horizonYears: years('The horizon').optional(),
  /** Icon-array denominator chosen by the clinician; absent means the engine's automatic rule. */
  denominator: z
    .union(DENOMINATORS.map((d) => z.literal(d)), { error: 'The denominator must be 100 or 1000' })
    .optional(),
  wording: wordingSchema.optional(),
  person: personSchema.optional(),
  /**
   * How the study defined its exposure over time (lib/glycaemia/exposure.ts), when it did: the
   * glucose history check uses it. Carried with the evidence, never computed with.
   */
  exposureDefinition: exposureDefinitionSchema.optional(),
  /** Id of the population table the baseline was looked up in, when it was. */
  tableId: z
    .string({ error: 'The table id must be text' })
    .min(1, { error: 'The table id must not be empty' })
    .max(100, { error: 'The table id must be at most 100 characters' })
    .optional(),
};

function requireHorizonForRate(
  scenario: { readonly baseline: object; readonly horizonYears?: number | undefined },
  ctx: z.RefinementCtx,
): void {
  if ('rate' in scenario.baseline && scenario.horizonYears === undefined) {
    ctx.addIssue({
      code: 'custom',
      path: ['horizonYears'],
      params: { code: 'horizon-required' },
      message: 'The horizon is required when the baseline is a rate: say over how many years to give the risk',
    });
  }
}

export const scenarioSchema = z.strictObject({ baseline: baselineSchema, ...scenarioShape }).superRefine(requireHorizonForRate);

/**
 * One scenario schema per baseline form, keyed by the key that selects the form. parseScenario
 * checks a scenario whose baseline form is evident against that form alone: faster than the
 * union, and with that form's own messages.
 */
export const scenarioSchemaByForm = {
  risk: z.strictObject({ baseline: riskBaselineSchema, ...scenarioShape }).superRefine(requireHorizonForRate),
  rate: z.strictObject({ baseline: rateBaselineSchema, ...scenarioShape }).superRefine(requireHorizonForRate),
  populationRisk: z.strictObject({ baseline: populationBaselineSchema, ...scenarioShape }).superRefine(requireHorizonForRate),
} as const;

export type RiskBaseline = z.infer<typeof riskBaselineSchema>;
export type RateBaseline = z.infer<typeof rateBaselineSchema>;
export type PopulationBaseline = z.infer<typeof populationBaselineSchema>;
export type Baseline = z.infer<typeof baselineSchema>;
export type Effect = z.infer<typeof effectSchema>;
export type Wording = z.infer<typeof wordingSchema>;
export type Person = z.infer<typeof personSchema>;
export type Scenario = z.infer<typeof scenarioSchema>;
