/**
 * An evidence entry: one published relative effect a clinic trusts, with the words that
 * describe it, kept in the local library so the next consultation starts from it.
 *
 * It reuses the scenario's own schemas for the effect and the wording, and the glycaemia
 * module's exposure definition, so an entry drops into a scenario unchanged.
 */
import { z } from '../zod';
import { effectSchema, wordingSchema } from '../scenario/schema';
import { exposureDefinitionSchema } from '../glycaemia/exposure';
import { ID_PATTERN, MAX_ID } from '../tables/schema';

/** Longest title, in characters. */
export const MAX_TITLE = 200;
/** Longest notes, in characters: room for a short paragraph on the study's limits. */
export const MAX_NOTES = 5000;

export const evidenceIdSchema = z
  .string({ error: (iss) => (iss.input === undefined ? 'The entry id is required' : 'The entry id must be text') })
  .min(1, { error: 'The entry id must not be empty' })
  .max(MAX_ID, { error: `The entry id must be at most ${MAX_ID} characters` })
  .regex(ID_PATTERN, { error: 'The entry id may hold only lower-case letters, digits, "-", "_" and "." and must start with a letter or digit' });

export const evidenceEntrySchema = z.strictObject({
  id: evidenceIdSchema,
  /** A short name for the library list: "Prediabetes-range HbA1c and heart failure, workforce cohort". */
  title: z
    .string({ error: (iss) => (iss.input === undefined ? 'The title is required' : 'The title must be text') })
    .trim()
    .min(1, { error: 'The title must not be empty' })
    .max(MAX_TITLE, { error: `The title must be at most ${MAX_TITLE} characters` }),
  effect: effectSchema,
  wording: wordingSchema,
  exposureDefinition: exposureDefinitionSchema.optional(),
  /** True when the numbers are invented (the demo entries); the screen then says so. */
  illustrative: z.boolean({ error: (iss) => (iss.input === undefined ? 'Illustrative is required (true or false)' : 'Illustrative must be true or false') }),
  notes: z
    .string({ error: 'The notes must be text' })
    .max(MAX_NOTES, { error: `The notes must be at most ${MAX_NOTES} characters` })
    .optional(),
});

export type EvidenceEntry = z.infer<typeof evidenceEntrySchema>;
