import { describe, expect, it } from 'vitest';
import { countSyllables, integerWords, numeralWords, tokenSyllables } from '@/lib/readability';

// Expected counts are hand-checked against the usual dictionary syllabification (hand-checked,
// common practice of English syllable division); each word exercises the rule named beside it.
const WORDS: readonly (readonly [string, number, string])[] = [
  ['cat', 1, 'one vowel group'],
  ['hospital', 3, 'vowel groups'],
  ['failure', 2, 'silent final e'],
  ['care', 1, 'silent final e'],
  ['table', 2, 'consonant + le'],
  ['little', 2, 'consonant + le'],
  ['centre', 2, 'consonant + re'],
  ['whole', 1, 'vowel + le is silent'],
  ['agreed', 2, '-eed keeps its vowel'],
  ['aged', 1, 'silent -ed'],
  ['needed', 2, '-ed after d is spoken'],
  ['tested', 2, '-ed after t is spoken'],
  ['published', 2, 'silent -ed'],
  ['tables', 2, 'plural s adds nothing'],
  ['places', 2, '-ces is spoken'],
  ['changes', 2, '-ges is spoken'],
  ['boxes', 2, '-xes is spoken'],
  ['years', 1, 'plural s; initial y is a consonant'],
  ['likely', 2, '-ly keeps the stem silent e'],
  ['careful', 2, '-ful'],
  ['carefully', 3, '-ful then -ly'],
  ['statement', 2, '-ment'],
  ['judgement', 2, '-ment'],
  ['only', 2, 'short word, y as a vowel'],
  ['party', 2, 'y after a consonant is a vowel'],
  ['player', 2, 'y after a vowel is a consonant'],
  ['beyond', 2, 'y after a vowel is a consonant'],
  ['studying', 3, 'vowel y ends its group'],
  ['eye', 1, 'y after a vowel'],
  ['dial', 2, 'ia split'],
  ['social', 2, 'cia is one'],
  ['Australian', 4, 'ia split'],
  ['period', 3, 'io split'],
  ['nation', 2, 'tio is one'],
  ['rodeo', 3, 'eo split'],
  ['usual', 3, 'ua split'],
  ['equal', 2, 'qua is one'],
  ['medium', 3, 'iu split'],
  ['earlier', 3, '-ier'],
  ["didn't", 2, "n't after a consonant"],
  ["don't", 1, "n't after a vowel"],
  ['people', 2, 'exception'],
  ['diabetes', 4, 'exception'],
  ['prediabetes', 5, 'exception'],
  ['characteristics', 5, 'plural of a long word'],
  ['diagnosis', 4, 'ia split, -is is not a plural'],
  ['population', 4, 'tion'],
  ['clinician', 3, 'cia is one'],
  ['platypus', 3, '-us is not a plural; y as a vowel'],
  ['reptilian', 4, 'ia split'],
  ['creature', 2, 'silent final e'],
  ['seemingly', 3, '-ly'],
  ['the', 1, 'at least one syllable'],
  ['café', 2, 'accents ignored'],
];

describe('countSyllables on fixed words (hand-checked)', () => {
  it.each(WORDS)('%s has %i syllables (%s)', (word, expected) => {
    expect(countSyllables(word)).toBe(expected);
  });
  it('is case-insensitive', () => {
    expect(countSyllables('HOSPITAL')).toBe(3);
  });
  it('gives 0 for a token with no letters and at least 1 for any letter', () => {
    expect(countSyllables('')).toBe(0);
    expect(countSyllables("'")).toBe(0);
    expect(countSyllables('x')).toBe(1);
  });
});

describe('numbers read aloud (common practice of English number reading)', () => {
  it('writes integers in words', () => {
    expect(integerWords(0)).toEqual(['zero']);
    expect(integerWords(8)).toEqual(['eight']);
    expect(integerWords(59)).toEqual(['fifty-nine']);
    expect(integerWords(100)).toEqual(['one', 'hundred']);
    expect(integerWords(1000)).toEqual(['one', 'thousand']);
    expect(integerWords(2024)).toEqual(['two', 'thousand', 'twenty-four']);
    expect(integerWords(1_000_001)).toEqual(['one', 'million', 'one']);
  });
  it('refuses what is not a whole number in range', () => {
    expect(integerWords(-1)).toEqual([]);
    expect(integerWords(1.5)).toEqual([]);
    expect(integerWords(Number.NaN)).toEqual([]);
    expect(integerWords(Number.POSITIVE_INFINITY)).toEqual([]);
    expect(numeralWords('1,00')).toEqual([]);
  });
  it('reads decimals digit by digit', () => {
    expect(numeralWords('7.5')).toEqual(['seven', 'point', 'five']);
    expect(numeralWords('1,000')).toEqual(['one', 'thousand']);
  });
  it('counts syllables of numerals, percentages and letter-by-letter tokens (hand-counted)', () => {
    expect(tokenSyllables('8')).toBe(1); // eight
    expect(tokenSyllables('12')).toBe(1); // twelve
    expect(tokenSyllables('100')).toBe(3); // one hun-dred
    expect(tokenSyllables('1,000')).toBe(3); // one thou-sand
    expect(tokenSyllables('59')).toBe(3); // fif-ty-nine
    expect(tokenSyllables('7.5')).toBe(4); // sev-en point five
    expect(tokenSyllables('8%')).toBe(3); // eight per-cent
    expect(tokenSyllables('HbA1c')).toBe(5); // H b A one c
    expect(tokenSyllables('BMI')).toBe(3); // B M I
    expect(tokenSyllables('WHO')).toBe(5); // dou-ble-u H O
    expect(tokenSyllables('fifty-nine')).toBe(3); // fif-ty + nine
  });
});
