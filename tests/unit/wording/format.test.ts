import { describe, expect, it } from 'vitest';
import { formatCount, formatPercent, formatPercentagePoints, formatRatio, formatYears, inTheNext, intervalLabel, peopleCount, plural } from '@/lib/wording';

describe('formatting for locale en (common practice)', () => {
  it('groups thousands', () => {
    expect(formatCount(1000)).toBe('1,000');
    expect(formatCount(100)).toBe('100');
    expect(formatCount(12345)).toBe('12,345');
  });
  it('pluralises people', () => {
    expect(peopleCount(1)).toBe('1 person');
    expect(peopleCount(0)).toBe('0 people');
    expect(peopleCount(2)).toBe('2 people');
    expect(plural(1, 'year', 'years')).toBe('year');
  });
  it('writes horizons', () => {
    expect(inTheNext(1)).toBe('in the next year');
    expect(inTheNext(10)).toBe('in the next 10 years');
    expect(inTheNext(2.5)).toBe('in the next 2.5 years');
    expect(formatYears(7.25)).toBe('7.3');
  });
  it('writes clinician figures', () => {
    expect(formatPercent(0.08)).toBe('8.0%');
    expect(formatPercentagePoints(0.04)).toBe('+4.0');
    expect(formatPercentagePoints(-0.031)).toBe('\u22123.1');
    expect(formatPercentagePoints(0)).toBe('0.0');
    expect(formatRatio(1.4567)).toBe('1.46');
  });
  it('never shows a small risk as 0.0% (two significant figures below 1%)', () => {
    // Hand-computed: 0.3 per 1,000 person-years over 1 year ≈ 0.0003 → 0.030%.
    expect(formatPercent(0.0003)).toBe('0.030%');
    expect(formatPercent(0.0049)).toBe('0.49%');
    expect(formatPercent(0)).toBe('0.0%');
    expect(formatPercentagePoints(0.004)).toBe('+0.40');
  });
  it('rounds percentage points by magnitude, so +x and −x mirror each other', () => {
    // Hand-computed: ±0.0315 → ±3.15 points → 3.2 either way (half away from zero, as toLocaleString rounds).
    expect(formatPercentagePoints(0.0315)).toBe('+3.2');
    expect(formatPercentagePoints(-0.0315)).toBe('\u22123.2');
  });
});

describe('intervalLabel', () => {
  it.each([
    [0.9, '90% CI'],
    [0.95, '95% CI'],
    [0.99, '99% CI'],
  ])('%s → %s', (level, label) => {
    // Common practice: the level written as a whole percentage before "CI".
    expect(intervalLabel(level)).toBe(label);
  });
});
