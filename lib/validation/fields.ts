/**
 * Field builders shared by every zod schema in lib/: numbers with a plain "is required" /
 * "must be a number" message, probabilities, years, ratios and bounded text. Each message
 * names the field ("The risk must be less than 1 …"), so a message is usable as it stands on
 * the form, on the command line and in an import report.
 */
import { z } from '../zod';

/** Longest horizon or follow-up accepted, in years: a human life span (common practice). */
export const MAX_YEARS = 100;
/** Largest ratio accepted: beyond this, a typing slip is far likelier than a real effect. */
export const MAX_RATIO = 1000;
/** Smallest ratio accepted, symmetric with {@link MAX_RATIO} on the log scale (1/1000). */
export const MIN_RATIO = 0.001;
/** Longest free-text field (wording, citation), in characters. */
export const MAX_TEXT = 500;

/**
 * A number: missing → "… is required", anything else not a number → "… must be a number".
 * @example
 * numberField('The risk').safeParse('x').error?.issues[0]?.message //=> "The risk must be a number"
 */
export function numberField(what: string) {
  return z.number({
    error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a number`),
  });
}

/** A probability strictly between 0 and 1. */
export function fraction(what: string) {
  return numberField(what)
    .gt(0, { error: `${what} must be greater than 0 (risks are fractions: for 8% enter 0.08)` })
    .lt(1, { error: `${what} must be less than 1 (risks are fractions: for 8% enter 0.08)` });
}

/** A number of years, above 0 and at most {@link MAX_YEARS}. */
export function years(what: string) {
  return numberField(what)
    .gt(0, { error: `${what} must be greater than 0 years` })
    .lte(MAX_YEARS, { error: `${what} must be at most ${MAX_YEARS} years` });
}

/** A ratio (OR, RR, HR or a limit), from {@link MIN_RATIO} to {@link MAX_RATIO}. */
export function ratio(what: string) {
  return numberField(what)
    .gt(0, { error: `${what} must be greater than 0 (ratios are positive)` })
    .gte(MIN_RATIO, { error: `${what} must be at least ${MIN_RATIO} (1/${MAX_RATIO}; smaller is almost always a typing slip)` })
    .lte(MAX_RATIO, { error: `${what} must be at most ${MAX_RATIO}` });
}

/** Free text of at most {@link MAX_TEXT} characters. */
export function text(what: string) {
  return z
    .string({ error: `${what} must be text` })
    .max(MAX_TEXT, { error: `${what} must be at most ${MAX_TEXT} characters` });
}
