/**
 * The glucose history input: a criteria set and a list of checkups, each with a date and an HbA1c
 * and/or a fasting plasma glucose (FPG), each with its unit. The single source of these types
 * (`z.infer`); the command line, the screen's rows, the pasted rows and the FHIR import all end
 * in {@link parseGlucoseHistory} (./parse.ts), which applies this schema.
 *
 * Plausible bounds (common practice; beyond them a typing slip or a unit mix-up is far likelier
 * than a real result, so the value is refused with a hint at the other unit):
 * - HbA1c 3–20 % (9–195 mmol/mol: the same span through the master equation, rounded inwards).
 *   Below about 3% and above about 20% lie outside the reportable range of routine assays.
 * - FPG 1–50 mmol/L (18–900 mg/dL: 1 × 18.016 and 50 × 18.016, rounded). Below 1 mmol/L is not
 *   an ordinary fasting sample; 50 mmol/L is above the levels of hyperosmolar emergencies.
 * Dates: real calendar days from 1900-01-01 to today (today is passed in, for testability).
 * The schemas that check dates are therefore functions of {@link HistoryOptions}.
 */
import { z } from '../zod';
import { CRITERIA_SETS, type CriteriaSet } from './exposure';
import { GLUCOSE_UNITS, type GlucoseUnit } from './glucose';
import { HBA1C_UNITS, type Hba1cUnit } from './hba1c';
import { parseIsoDate } from './dates';

/** Plausible range per unit, inclusive. */
export const HBA1C_BOUNDS: Readonly<Record<Hba1cUnit, { readonly min: number; readonly max: number }>> = {
  '%': { min: 3, max: 20 },
  'mmol/mol': { min: 9, max: 195 },
};
export const FPG_BOUNDS: Readonly<Record<GlucoseUnit, { readonly min: number; readonly max: number }>> = {
  'mmol/L': { min: 1, max: 50 },
  'mg/dL': { min: 18, max: 900 },
};

/** Earliest checkup date accepted: anything earlier is a typing slip. */
export const EARLIEST_DATE = '1900-01-01';
/** Most checkups in one history: decades of yearly checkups with repeats, with room to spare. */
export const MAX_CHECKUPS = 500;

function valueField(what: string) {
  return z.number({
    error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a number`),
  });
}

function otherUnitHint<U extends string>(
  value: number,
  unit: U,
  bounds: Readonly<Record<U, { readonly min: number; readonly max: number }>>,
): string {
  for (const other of Object.keys(bounds) as U[]) {
    if (other === unit) continue;
    const b = bounds[other];
    if (value >= b.min && value <= b.max) return `; ${value} looks like a value in ${other}: check the unit`;
  }
  return '';
}

/**
 * A unit as written → the canonical unit, or null. Accepts the spellings record systems and
 * people use: UCUM is case-sensitive, but "l" and "L" are both the litre (UCUM §4.2, from memory),
 * so "mg/dl" and "mmol/l" are the same units; letter case is otherwise ignored (the four units are
 * told apart without it); a UCUM annotation in braces, e.g. "%{HbA1c}" or "mmol/mol{Hb}", is not
 * part of the unit (UCUM §2.1 annotations, from memory) and is dropped. Shared by the typed and JSON
 * input, the paste and the FHIR import (lib/fhir/observation.ts).
 *
 * @example
 * canonicalUnit('%{HbA1c}') //=> '%'
 * canonicalUnit('mg/dl')    //=> 'mg/dL'
 * canonicalUnit('mg')       //=> null
 */
export function canonicalUnit(text: string): '%' | 'mmol/mol' | 'mg/dL' | 'mmol/L' | null {
  const bare = text.replace(/\{[^{}]*\}/g, '').trim().toLowerCase();
  switch (bare) {
    case '%':
      return '%';
    case 'mmol/mol':
      return 'mmol/mol';
    case 'mg/dl':
      return 'mg/dL';
    case 'mmol/l':
      return 'mmol/L';
    default:
      return null;
  }
}

function boundedReading<U extends string>(
  what: string,
  units: readonly [U, ...U[]],
  bounds: Readonly<Record<U, { readonly min: number; readonly max: number }>>,
) {
  return z
    .strictObject({
      value: valueField(`The ${what} value`),
      unit: z.preprocess(
        (input) => (typeof input === 'string' ? (canonicalUnit(input) ?? input) : input),
        z.enum(units, {
          error: (iss) =>
            iss.input === undefined
              ? `The ${what} unit is required: ${units.map((u) => `"${u}"`).join(' or ')}`
              : `The ${what} unit must be ${units.map((u) => `"${u}"`).join(' or ')}`,
        }),
      ),
    })
    .superRefine((reading, ctx) => {
      const b = bounds[reading.unit];
      if (reading.value < b.min || reading.value > b.max) {
        ctx.addIssue({
          code: 'custom',
          path: ['value'],
          params: { code: 'out-of-range' },
          message: `The ${what} value in ${reading.unit} must be between ${b.min} and ${b.max} (got ${reading.value})${otherUnitHint(reading.value, reading.unit, bounds)}`,
        });
      }
    });
}

export const hba1cReadingSchema = boundedReading('HbA1c', HBA1C_UNITS, HBA1C_BOUNDS);
export const fpgReadingSchema = boundedReading('fasting glucose', GLUCOSE_UNITS, FPG_BOUNDS);

/** Options every date check needs: today's date, passed in so tests and the CLI agree on it. */
export interface HistoryOptions {
  /** Today as "YYYY-MM-DD"; a checkup after it is refused. */
  readonly today: string;
  /**
   * How messages that name another checkup refer to the one at an input index; default
   * "checkup [i]". The screen passes "row n".
   */
  readonly checkupName?: (index: number) => string;
  /**
   * The criteria set the history will be classified under, when known: one sample reported in
   * both units on one day keeps the reading in this body's own unit, whichever came first
   * (issue 11 item 2). parseGlucoseHistory takes it from the input's `criteria`.
   */
  readonly criteria?: CriteriaSet | undefined;
}

export function checkupDateSchema({ today }: HistoryOptions) {
  return z
    .string({ error: (iss) => (iss.input === undefined ? 'The date is required (YYYY-MM-DD)' : 'The date must be text in the form YYYY-MM-DD') })
    .superRefine((text, ctx) => {
      if (!/^\d{4}-\d{2}-\d{2}$/.test(text)) {
        ctx.addIssue({ code: 'custom', params: { code: 'invalid-date' }, message: `The date must be written YYYY-MM-DD (got "${text}")` });
      } else if (!parseIsoDate(text)) {
        ctx.addIssue({ code: 'custom', params: { code: 'invalid-date' }, message: `The date ${text} is not a real calendar day` });
      } else if (text < EARLIEST_DATE) {
        ctx.addIssue({ code: 'custom', params: { code: 'out-of-range' }, message: `The date ${text} is before ${EARLIEST_DATE}: check the year` });
      } else if (text > today) {
        ctx.addIssue({
          code: 'custom',
          params: { code: 'future-date' },
          message: `The date ${text} is after today (${today}): a checkup cannot be in the future`,
        });
      }
    });
}

export function checkupSchema(options: HistoryOptions) {
  return z
    .strictObject({
      date: checkupDateSchema(options),
      hba1c: hba1cReadingSchema.optional(),
      fpg: fpgReadingSchema.optional(),
    })
    .superRefine((checkup, ctx) => {
      if (checkup.hba1c === undefined && checkup.fpg === undefined) {
        ctx.addIssue({
          code: 'custom',
          params: { code: 'required' },
          message: 'The checkup has neither an HbA1c nor a fasting glucose: give at least one',
        });
      }
    });
}

export const criteriaSchema = z.enum(CRITERIA_SETS, {
  error: (iss) => (iss.input === undefined ? 'The criteria set is required: ADA, WHO or NICE' : 'The criteria set must be ADA, WHO or NICE'),
});

/**
 * The whole input, `{"criteria", "checkups": [...]}`. Checks that need more than one checkup
 * (the same date twice with different results) run afterwards, in ./parse.ts.
 */
export function glucoseHistorySchema(options: HistoryOptions) {
  return z.strictObject({
    criteria: criteriaSchema,
    checkups: z
      .array(checkupSchema(options), {
        error: (iss) => (iss.input === undefined ? 'The checkups are required (a list)' : 'The checkups must be a list'),
      })
      .min(1, { error: 'Give at least one checkup' })
      .max(MAX_CHECKUPS, { error: `At most ${MAX_CHECKUPS} checkups` }),
  });
}

export type Hba1cReading = z.infer<typeof hba1cReadingSchema>;
export type FpgReading = z.infer<typeof fpgReadingSchema>;
export type Checkup = z.infer<ReturnType<typeof checkupSchema>>;
export type GlucoseHistoryInput = z.infer<ReturnType<typeof glucoseHistorySchema>>;
