import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { countText, fleschKincaidGrade, fleschReadingEase, readability, sentences, words } from '@/lib/readability';

function scored(text: string) {
  const r = readability(text);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.value;
}

// Tolerance: the formulas are exact arithmetic on whole counts, so only floating-point error
// (about 1e-14 here) separates the computed score from the hand computation; 1e-9 is honest.
const EXACT = 9;

describe('scores on fixed texts', () => {
  it('"The cat sat on the mat." — ease about 116 (from memory: the usual textbook example of a very easy sentence)', () => {
    // Counts: 6 words, 1 sentence, 6 syllables (all monosyllables).
    // Ease = 206.835 − 1.015·6 − 84.6·1 = 206.835 − 6.09 − 84.6 = 116.145 (hand-computed).
    // Grade = 0.39·6 + 11.8·1 − 15.59 = 2.34 + 11.8 − 15.59 = −1.45 (hand-computed).
    const r = scored('The cat sat on the mat.');
    expect([r.words, r.sentences, r.syllables]).toEqual([6, 1, 6]);
    expect(r.readingEase).toBeCloseTo(116.145, EXACT);
    expect(Math.round(r.readingEase)).toBe(116);
    expect(r.grade).toBeCloseTo(-1.45, EXACT);
  });

  it('"The Australian platypus is seemingly a hybrid of a mammal and reptilian creature." — ease 24.4 (from memory, a widely quoted example of a hard sentence)', () => {
    // Syllables: The 1, Aus-tra-li-an 4, plat-y-pus 3, is 1, seem-ing-ly 3, a 1, hy-brid 2, of 1,
    // a 1, mam-mal 2, and 1, rep-til-i-an 4, crea-ture 2 → 13 words, 26 syllables, 1 sentence.
    // Ease = 206.835 − 1.015·13 − 84.6·2 = 206.835 − 13.195 − 169.2 = 24.44 (hand-computed).
    // Grade = 0.39·13 + 11.8·2 − 15.59 = 5.07 + 23.6 − 15.59 = 13.08 (hand-computed).
    const r = scored('The Australian platypus is seemingly a hybrid of a mammal and reptilian creature.');
    expect([r.words, r.sentences, r.syllables]).toEqual([13, 1, 26]);
    expect(r.readingEase).toBeCloseTo(24.44, EXACT);
    expect(r.readingEase.toFixed(1)).toBe('24.4');
    expect(r.grade).toBeCloseTo(13.08, EXACT);
  });

  it('a patient sentence with numerals (hand-computed)', () => {
    // "Out of 100 people like you, about 8 will have it. The other 92 will not."
    // Out 1, of 1, 100 3 (one hun-dred), peo-ple 2, like 1, you 1, a-bout 2, 8 1, will 1, have 1, it 1;
    // The 1, oth-er 2, 92 3 (nine-ty-two), will 1, not 1 → 16 words, 2 sentences, 23 syllables.
    // Grade = 0.39·8 + 11.8·(23/16) − 15.59 = 3.12 + 16.9625 − 15.59 = 4.4925 (hand-computed).
    // Ease = 206.835 − 1.015·8 − 84.6·(23/16) = 206.835 − 8.12 − 121.6125 = 77.1025 (hand-computed).
    const r = scored('Out of 100 people like you, about 8 will have it. The other 92 will not.');
    expect([r.words, r.sentences, r.syllables]).toEqual([16, 2, 23]);
    expect(r.grade).toBeCloseTo(4.4925, EXACT);
    expect(r.readingEase).toBeCloseTo(77.1025, EXACT);
  });

  it('formulas on counts (Kincaid et al. 1975; Flesch 1948)', () => {
    // 100 words, 5 sentences, 150 syllables: grade = 0.39·20 + 11.8·1.5 − 15.59 = 7.8 + 17.7 − 15.59 = 9.91;
    // ease = 206.835 − 20.3 − 126.9 = 59.635 (hand-computed).
    expect(fleschKincaidGrade({ words: 100, sentences: 5, syllables: 150 })).toBeCloseTo(9.91, EXACT);
    expect(fleschReadingEase({ words: 100, sentences: 5, syllables: 150 })).toBeCloseTo(59.635, EXACT);
  });
});

describe('sentence and word splitting (rules in lib/readability/words.ts)', () => {
  it('does not end a sentence at a decimal point, an abbreviation, an ellipsis, ";" or ":"', () => {
    expect(sentences('Risk is 7.5 per 100. Ask Dr. Lee, e.g. at the visit; or later: soon \u2026 maybe!')).toEqual([
      'Risk is 7.5 per 100.',
      'Ask Dr. Lee, e.g. at the visit; or later: soon \u2026 maybe!',
    ]);
  });
  it('ends a sentence at a line break and after a closing quote', () => {
    expect(sentences('Heading\nHe said "stop." Then left?')).toEqual(['Heading', 'He said "stop."', 'Then left?']);
  });
  it('keeps numbers with commas, hyphenated words and contractions as one word; dashes separate', () => {
    expect(words("1,000 people \u2014 fifty-nine don't 10\u201315").map((w) => w.word)).toEqual(['1,000', 'people', 'fifty-nine', "don't", '10', '15']);
  });
  it('drops sentences without words', () => {
    expect(sentences('... ?! \n  \n Yes.')).toEqual(['Yes.']);
  });
});

describe('bad input', () => {
  it.each(['', '   ', '...', '\n\n', '\u2014 \u2013'])('refuses a text with no words: %j', (text) => {
    const r = readability(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'no-words', path: ['text'] });
  });
});

describe('properties (fast-check, 1000 runs)', () => {
  const word = fc.constantFrom('cat', 'hospital', 'people', 'will', 'about', 'diagnosis', 'care', 'numbers', '100', '8');
  const sentence = fc.array(word, { minLength: 1, maxLength: 20 }).map((ws) => `${ws.join(' ')}.`);

  it('counts are additive over sentences and the scores follow from the counts', () => {
    fc.assert(
      fc.property(fc.array(sentence, { minLength: 1, maxLength: 8 }), (ss) => {
        const whole = countText(ss.join(' '));
        const parts = ss.map(countText);
        expect(whole.words).toBe(parts.reduce((s, p) => s + p.words, 0));
        expect(whole.syllables).toBe(parts.reduce((s, p) => s + p.syllables, 0));
        expect(whole.sentences).toBe(ss.length);
        const r = scored(ss.join(' '));
        expect(r.grade).toBeCloseTo(fleschKincaidGrade(whole), EXACT);
        expect(r.readingEase).toBeCloseTo(fleschReadingEase(whole), EXACT);
      }),
      { numRuns: 1000 },
    );
  });

  it('splitting a sentence in two lowers the grade and raises the ease', () => {
    fc.assert(
      fc.property(fc.array(word, { minLength: 2, maxLength: 20 }), fc.nat(), (ws, at) => {
        const cut = 1 + (at % (ws.length - 1));
        const one = scored(`${ws.join(' ')}.`);
        const two = scored(`${ws.slice(0, cut).join(' ')}. ${ws.slice(cut).join(' ')}.`);
        expect(two.grade).toBeLessThan(one.grade);
        expect(two.readingEase).toBeGreaterThan(one.readingEase);
      }),
      { numRuns: 1000 },
    );
  });
});
