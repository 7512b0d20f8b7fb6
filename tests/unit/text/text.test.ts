import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ageCell, agedPhrase, agesPhrase, agesSpanPhrase, numberFromText, optionalText, phraseText, plural, readDecimal, spansAllAges } from '@/lib/text';
import { MAX_AGE_YEARS } from '@/lib/tables/schema';

describe('readDecimal / numberFromText', () => {
  it('reads a decimal point and a decimal comma the same way', () => {
    expect(numberFromText('0.08')).toBe(0.08);
    expect(numberFromText('0,08')).toBe(0.08);
    expect(numberFromText(' .08 ')).toBe(0.08);
    expect(numberFromText(',5')).toBe(0.5);
    expect(numberFromText('0,125')).toBe(0.125);
    expect(numberFromText('1e-3')).toBe(0.001);
  });

  it('reads "8%" as 0.08 only where a proportion is asked for (issue 12 item 13)', () => {
    // hand-computed: 8 / 100 = 0.08; 0.5 / 100 = 0.005; 12.5 / 100 = 0.125.
    expect(readDecimal('8%', { percent: true })).toEqual({ kind: 'number', value: 0.08, fromPercent: true });
    expect(numberFromText('0,5 %', { percent: true })).toBe(0.005);
    expect(numberFromText('12.5%', { percent: true })).toBe(0.125);
    expect(numberFromText('7%', { percent: true })).toBe(0.07);
    expect(numberFromText('8%')).toBeNaN();
    expect(readDecimal('8%')).toEqual({ kind: 'invalid', text: '8%' });
  });

  it('refuses what it cannot read without guessing', () => {
    for (const bad of ['abc', '12abc', '0x10', 'Infinity', 'NaN', '1.2.3', '1,2,3', '--1', '%', '8%%', '1,000', '12,500']) {
      expect(numberFromText(bad, { percent: true })).toBeNaN();
    }
    expect(readDecimal('   ')).toEqual({ kind: 'blank' });
    expect(numberFromText('')).toBeUndefined();
  });

  it('a percentage is the hundredth of the same number typed plainly', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000 }), (n) => {
        const percent = numberFromText(`${n}%`, { percent: true });
        expect(percent).toBeCloseTo(n / 100, 12);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('text helpers', () => {
  it('plural and trimming', () => {
    expect(plural(1, 'person', 'people')).toBe('person');
    expect(plural(0, 'person', 'people')).toBe('people');
    expect(optionalText('  a ')).toBe('a');
    expect(optionalText('  ')).toBeUndefined();
    expect(phraseText(' a stroke. ')).toBe('a stroke');
    expect(phraseText(undefined)).toBe('');
  });

  it('age phrases with the one open-top cut-off from lib/tables/schema', () => {
    expect(MAX_AGE_YEARS).toBe(120); // docs/table-format.md: an open top band is written 120
    expect(agesPhrase({ fromYears: 80, toYears: MAX_AGE_YEARS })).toBe('ages 80 and over');
    expect(agesPhrase({ fromYears: 50, toYears: 59 })).toBe('ages 50 to 59');
    expect(agesPhrase({ fromYears: 55, toYears: 55 })).toBe('age 55');
    expect(agesPhrase({ fromYears: 0, toYears: 120 })).toBe('all ages');
    expect(agedPhrase({ fromYears: 0, toYears: 120 })).toBeUndefined();
    expect(agedPhrase({ fromYears: 0, toYears: 17 })).toBe('aged 0 to 17');
    expect(agedPhrase({ fromYears: 80, toYears: 130 })).toBe('aged 80 and over');
    expect(ageCell({ fromYears: 50, toYears: 59 })).toBe('50\u201359');
    expect(ageCell({ fromYears: 80, toYears: 120 })).toBe('80 and over');
    expect(spansAllAges({ fromYears: 1, toYears: 120 })).toBe(false);
    expect(agesSpanPhrase([{ fromYears: 40, toYears: 49 }, { fromYears: 30, toYears: 120 }])).toBe('ages 30 and over');
  });
});
