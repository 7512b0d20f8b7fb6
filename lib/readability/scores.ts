/**
 * Flesch reading ease and Flesch–Kincaid grade level.
 *
 * With W words, S sentences and Y syllables:
 * - Flesch–Kincaid grade = 0.39·(W/S) + 11.8·(Y/W) − 15.59
 *   (Kincaid, Fishburne, Rogers & Chissom 1975, Naval Technical Training Command Research
 *   Branch Report 8-75);
 * - Flesch reading ease = 206.835 − 1.015·(W/S) − 84.6·(Y/W)
 *   (Flesch 1948, J Appl Psychol 32:221).
 * Valid for any text with at least one word; the grade is unbounded (short monosyllabic text
 * goes below 0) and so is the ease (above 100). Patient text should score grade ≤ 8, aiming
 * at ≤ 6 (risk-communication guide, after NIH and AAFP advice).
 *
 * Counting rules (what a word, a sentence and a syllable are) are in ./words.ts and
 * ./syllables.ts; scores from different counters differ, so compare scores from this one only.
 */
import { fail, ok, type Result } from '../result';
import { sentences, words } from './words';

/** Highest grade the editing view accepts without a warning. */
export const MAX_GRADE = 8;

export interface ReadabilityCounts {
  readonly words: number;
  readonly sentences: number;
  readonly syllables: number;
}

export interface Readability extends ReadabilityCounts {
  /** Flesch–Kincaid grade level. */
  readonly grade: number;
  /** Flesch reading ease. */
  readonly readingEase: number;
}

/**
 * Grade from counts: 0.39·(W/S) + 11.8·(Y/W) − 15.59 (Kincaid et al. 1975).
 * @example
 * fleschKincaidGrade({ words: 6, sentences: 1, syllables: 6 }) //=> -1.45 (approximately)
 */
export function fleschKincaidGrade({ words: w, sentences: s, syllables: y }: ReadabilityCounts): number {
  return 0.39 * (w / s) + 11.8 * (y / w) - 15.59;
}

/**
 * Reading ease from counts: 206.835 − 1.015·(W/S) − 84.6·(Y/W) (Flesch 1948).
 * @example
 * fleschReadingEase({ words: 6, sentences: 1, syllables: 6 }) //=> 116.145 (approximately)
 */
export function fleschReadingEase({ words: w, sentences: s, syllables: y }: ReadabilityCounts): number {
  return 206.835 - 1.015 * (w / s) - 84.6 * (y / w);
}

/** Words, sentences and syllables of a text, by the rules in ./words.ts. */
export function countText(text: string): ReadabilityCounts {
  const ws = words(text);
  return {
    words: ws.length,
    sentences: sentences(text).length,
    syllables: ws.reduce((sum, w) => sum + w.syllables, 0),
  };
}

/**
 * Both scores for a text. Refuses a text with no words (the formulas divide by W and S).
 * @example
 * readability('The cat sat on the mat.')
 * //=> { ok: true, value: { words: 6, sentences: 1, syllables: 6, grade: -1.45, readingEase: 116.145 } } (approximately)
 */
export function readability(text: string): Result<Readability> {
  const counts = countText(text);
  if (counts.words === 0 || counts.sentences === 0) {
    return fail([{ code: 'no-words', path: ['text'], message: 'The text has no words to score; write at least one sentence' }]);
  }
  return ok({ ...counts, grade: fleschKincaidGrade(counts), readingEase: fleschReadingEase(counts) });
}
