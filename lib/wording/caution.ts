/**
 * The not-a-diagnosis caution: one text, used on the screen, the handout and in print.
 *
 * Content follows the project's safety rule (README.md): the figures are
 * an estimate for people with similar characteristics from published population data; not a
 * diagnosis; not a prediction for this person; to be discussed with the clinician; local
 * guidelines and licensed practice come first. Worded in the project's own voice and kept to
 * short sentences (tested at or below Flesch–Kincaid grade 8).
 */

/** The caution, exactly as every page shows it. Not editable. */
export const CAUTION_TEXT =
  'These numbers are an estimate for people with similar characteristics to yours. ' +
  'They come from published data on large groups of people. ' +
  'They are not a diagnosis. ' +
  'They do not predict what will happen to you. ' +
  'Talk them over with your doctor or nurse. ' +
  'Local health guidelines and the advice of your own clinician come first.';

/** A short heading for the caution box. */
export const CAUTION_HEADING = 'Please read: what these numbers are';
