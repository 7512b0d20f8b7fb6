/**
 * Splitting text into sentences and words, and counting each word's syllables, for the
 * Flesch (1948) and Flesch–Kincaid (Kincaid et al. 1975) scores in ./scores.ts.
 *
 * Decisions (ours; the papers counted by hand):
 * - A word is a run of letters and digits, with apostrophes, hyphens, and a comma or point
 *   between digits kept inside it: "don't", "fifty-nine", "1,000" and "7.5" are one word each.
 *   A hyphenated word's syllables are the sum of its parts. Dashes (– —) and slashes separate.
 * - Numerals count as one word each, with the syllables of the number read aloud
 *   (./numberWords.ts): "8" has 1 ("eight"), "100" has 3 ("one hundred"), "1,000" has 3.
 *   A trailing "%" adds "percent" (2). This is harder on numeric text than counting a
 *   numeral as one syllable, on purpose: a reader still says the words.
 * - A token mixing letters and digits ("HbA1c") or written in capitals (2–6 letters: "BMI",
 *   "ADA") is read letter by letter: one syllable a letter ("w" three), digits as numbers.
 * - A sentence ends at ".", "!" or "?" (repeated or followed by a closing quote or bracket)
 *   before a space or the end, or at a line break; not at a point inside a number, not after
 *   the abbreviations listed below, and not at "…" or ";" or ":". A sentence with no word is
 *   not counted.
 */
import { numeralWords } from './numberWords';
import { countSyllables } from './syllables';

/** Abbreviations whose final point does not end a sentence (lower case, without the point). */
const ABBREVIATIONS = new Set(['e.g', 'i.e', 'etc', 'al', 'dr', 'mr', 'mrs', 'ms', 'vs', 'approx', 'no', 'vol', 'fig', 'cf', 'st']);

const TOKEN = /[\p{L}\p{N}]+(?:(?:['\u2019-]|[.,](?=\p{N}))[\p{L}\p{N}]+)*%?/gu;

export interface WordCount {
  readonly word: string;
  readonly syllables: number;
}

/** Syllables of one letter read aloud: "w" is "double-u", every other letter one. */
function letterSyllables(letter: string): number {
  return letter.toLowerCase() === 'w' ? 3 : 1;
}

function numberSyllables(numeral: string): number {
  return numeralWords(numeral).reduce((sum, w) => sum + w.split('-').reduce((s, part) => s + countSyllables(part), 0), 0);
}

/**
 * Syllables of one token as {@link words} splits them.
 * @example
 * tokenSyllables('100') //=> 3
 * tokenSyllables('HbA1c') //=> 5
 * tokenSyllables('fifty-nine') //=> 3
 */
export function tokenSyllables(token: string): number {
  const percent = token.endsWith('%') ? 2 : 0;
  const body = percent ? token.slice(0, -1) : token;
  if (/^[\d.,]+$/.test(body)) {
    const n = numberSyllables(body);
    return (n > 0 ? n : [...body].filter((c) => /\d/.test(c)).length) + percent;
  }
  if (/\p{N}/u.test(body) || /^\p{Lu}{2,6}s?$/u.test(body)) {
    // Read letter by letter; runs of digits read as numbers.
    let total = 0;
    for (const part of body.match(/\p{N}+|\p{L}/gu) ?? []) {
      total += /\p{N}/u.test(part) ? numberSyllables(part) : letterSyllables(part);
    }
    return total + percent;
  }
  return body.split('-').reduce((sum, part) => sum + (part ? countSyllables(part) : 0), 0) + percent;
}

/**
 * The words of a text with their syllables.
 * @example
 * words('Out of 100, about 8.').map((w) => w.syllables) //=> [1, 1, 3, 2, 1]
 */
export function words(text: string): WordCount[] {
  return [...text.matchAll(TOKEN)].map((m) => ({ word: m[0], syllables: tokenSyllables(m[0]) }));
}

/**
 * The sentences of a text, each trimmed; sentences without a word are dropped.
 * @example
 * sentences('About 8 out of 100 will. The other 92 will not.') //=> ["About 8 out of 100 will.", "The other 92 will not."]
 */
export function sentences(text: string): string[] {
  const out: string[] = [];
  for (const line of text.split(/\r?\n/)) {
    let start = 0;
    const ends = /[.!?]+['"\u2019\u201d)\]]*(?=\s|$)/g;
    for (let m = ends.exec(line); m !== null; m = ends.exec(line)) {
      const before = line.slice(start, m.index);
      const lastWord = /([\p{L}.]+)$/u.exec(before)?.[1]?.toLowerCase() ?? '';
      if (m[0].startsWith('.') && m[0].length === 1 && ABBREVIATIONS.has(lastWord)) continue;
      out.push(line.slice(start, m.index + m[0].length));
      start = m.index + m[0].length;
    }
    out.push(line.slice(start));
  }
  return out.map((s) => s.trim()).filter((s) => words(s).length > 0);
}
