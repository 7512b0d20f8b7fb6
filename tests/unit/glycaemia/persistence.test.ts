import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { classifyHistory } from '@/lib/glycaemia/classify';
import { addMonths, daysBetween, parseIsoDate, wholeMonthsBetween, yearsBetween } from '@/lib/glycaemia/dates';
import { countYearlyRounds, isLongGap, persistence } from '@/lib/glycaemia/persistence';
import type { Checkup } from '@/lib/glycaemia/schema';

// Illustrative histories, invented for the tests (not from a real person or study).
const pre = (date: string): Checkup => ({ date, hba1c: { value: 6.0, unit: '%' } }); // ADA prediabetes (5.7–6.4 %)
const normal = (date: string): Checkup => ({ date, hba1c: { value: 5.2, unit: '%' } });
const dm = (date: string): Checkup => ({ date, fpg: { value: 131, unit: 'mg/dL' } }); // ADA diabetes range (≥ 126)

function runOf(checkups: readonly Checkup[], criteria: 'ADA' | 'WHO' | 'NICE' = 'ADA') {
  return persistence(classifyHistory(checkups, criteria), criteria);
}

describe('calendar helpers (common practice: Gregorian calendar)', () => {
  it('adds months with the day clamped to the month end', () => {
    expect(addMonths('2020-01-15', 18)).toBe('2021-07-15');
    expect(addMonths('2020-08-31', 18)).toBe('2022-02-28');
    expect(addMonths('2022-08-31', 18)).toBe('2024-02-29'); // leap year
    expect(addMonths('2020-11-30', 3)).toBe('2021-02-28');
  });
  it('counts whole months and days (hand-computed)', () => {
    expect(wholeMonthsBetween('2020-01-15', '2021-07-15')).toBe(18);
    expect(wholeMonthsBetween('2020-01-15', '2021-07-14')).toBe(17);
    expect(daysBetween('2020-01-01', '2021-01-01')).toBe(366); // 2020 is a leap year
    expect(yearsBetween('2020-01-01', '2021-01-01')).toBeCloseTo(366 / 365.25, 12);
  });
  it('rejects impossible days', () => {
    expect(parseIsoDate('2100-02-29')).toBeNull(); // 2100 is not a leap year (divisible by 100, not 400)
    expect(parseIsoDate('2000-02-29')).not.toBeNull(); // 2000 is (divisible by 400)
    expect(parseIsoDate('2023-00-10')).toBeNull();
  });
  it('whole months never overshoot: from + n months ≤ to < from + (n + 1) months (property, 1000 runs)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 20000 }), fc.integer({ min: 0, max: 3000 }), (start, length) => {
        const from = new Date(Date.UTC(1980, 0, 1 + start)).toISOString().slice(0, 10);
        const to = new Date(Date.UTC(1980, 0, 1 + start + length)).toISOString().slice(0, 10);
        const n = wholeMonthsBetween(from, to);
        expect(addMonths(from, n) <= to).toBe(true);
        expect(addMonths(from, n + 1) > to).toBe(true);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('persistence: the run ending at the latest checkup', () => {
  it('counts an unbroken yearly run', () => {
    const run = runOf([pre('2019-03-01'), pre('2020-03-02'), pre('2021-02-26'), pre('2022-03-01')]);
    expect(run).toMatchObject({ category: 'prediabetes', checkups: 4, yearlyResults: 4, from: '2019-03-01', to: '2022-03-01', gaps: [], brokenBy: null });
    expect(run.years).toBeCloseTo(1096 / 365.25, 12); // 2019-03-01 → 2022-03-01 = 1096 days (2020 leap; hand-computed)
  });

  it('sorts unordered input first', () => {
    const run = runOf([pre('2022-03-01'), normal('2019-03-01'), pre('2021-03-01'), pre('2020-03-01')]);
    expect(run).toMatchObject({ category: 'prediabetes', checkups: 3, from: '2020-03-01', to: '2022-03-01' });
    expect(run.brokenBy).toEqual({ date: '2019-03-01', reason: 'category', category: 'normal', gap: null });
  });

  it('stops at a change of category', () => {
    const run = runOf([pre('2019-03-01'), normal('2020-03-01'), pre('2021-03-01'), pre('2022-03-01')]);
    expect(run).toMatchObject({ checkups: 2, yearlyResults: 2, brokenBy: { reason: 'category', date: '2020-03-01' } });
  });

  describe('a gap of more than 18 months breaks the run', () => {
    it('exactly 18 months does not break it', () => {
      expect(isLongGap('2020-01-15', '2021-07-15')).toBe(false);
      expect(runOf([pre('2020-01-15'), pre('2021-07-15')])).toMatchObject({ checkups: 2, gaps: [], brokenBy: null });
    });
    it('18 months and a day breaks it and is reported', () => {
      expect(isLongGap('2020-01-15', '2021-07-16')).toBe(true);
      const run = runOf([pre('2020-01-15'), pre('2021-07-16')]);
      const gap = { from: '2020-01-15', to: '2021-07-16', months: 18, days: 548 }; // 366 + 182 days (hand-computed)
      expect(run).toMatchObject({ checkups: 1, yearlyResults: 1, from: '2021-07-16', gaps: [gap] });
      expect(run.brokenBy).toEqual({ date: '2020-01-15', reason: 'gap', category: 'prediabetes', gap });
    });
    it('reports every long gap in the history, even those before the run', () => {
      const run = runOf([pre('2012-05-01'), normal('2015-05-01'), pre('2016-05-01'), pre('2017-05-01')]);
      expect(run.gaps.map((g) => [g.from, g.to, g.months])).toEqual([['2012-05-01', '2015-05-01', 36]]);
      expect(run.brokenBy?.reason).toBe('category');
    });
    it('names the gap when both the gap and a category change would end the run', () => {
      const run = runOf([normal('2018-01-01'), pre('2021-01-01')]);
      expect(run.brokenBy?.reason).toBe('gap');
    });
  });

  describe('missing tests', () => {
    it('a run may mix checkups with only HbA1c, only glucose, or both', () => {
      const run = runOf([
        { date: '2020-03-01', hba1c: { value: 6.0, unit: '%' } },
        { date: '2021-03-01', fpg: { value: 110, unit: 'mg/dL' } },
        { date: '2022-03-01', hba1c: { value: 42, unit: 'mmol/mol' }, fpg: { value: 5.7, unit: 'mmol/L' } },
      ]);
      expect(run).toMatchObject({ category: 'prediabetes', checkups: 3, brokenBy: null });
    });
    it('WHO: a checkup with only an HbA1c below 6.5 % cannot continue a run', () => {
      const run = runOf(
        [
          { date: '2020-03-01', fpg: { value: 6.3, unit: 'mmol/L' } },
          { date: '2021-03-01', hba1c: { value: 6.0, unit: '%' } },
          { date: '2022-03-01', fpg: { value: 6.4, unit: 'mmol/L' } },
        ],
        'WHO',
      );
      expect(run).toMatchObject({ category: 'prediabetes', checkups: 1, brokenBy: { reason: 'unclassified', date: '2021-03-01', category: null } });
    });
    it('WHO: when the latest checkup cannot be classified the run is empty', () => {
      const run = runOf([{ date: '2020-03-01', fpg: { value: 6.3, unit: 'mmol/L' } }, { date: '2021-03-01', hba1c: { value: 6.0, unit: '%' } }], 'WHO');
      expect(run).toMatchObject({ category: null, checkups: 0, yearlyResults: 0, years: 0, from: null, to: null });
      expect(run.brokenBy).toEqual({ date: '2021-03-01', reason: 'unclassified', category: null, gap: null });
    });
  });

  it('an empty history has an empty run', () => {
    expect(runOf([])).toMatchObject({ category: null, checkups: 0, yearlyResults: 0, brokenBy: null, gaps: [] });
  });

  it('a single checkup is a run of one', () => {
    expect(runOf([dm('2023-03-01')])).toMatchObject({ category: 'diabetes-range', checkups: 1, yearlyResults: 1, years: 0 });
  });

  describe('yearly rounds: repeats less than 6 months apart count once', () => {
    it('a confirming test weeks later adds a checkup, not a year', () => {
      const run = runOf([pre('2021-03-01'), pre('2022-03-01'), pre('2022-04-12'), pre('2023-03-01')]);
      expect(run).toMatchObject({ checkups: 4, yearlyResults: 3 });
    });
    it('6 months exactly starts a new round; a day less does not', () => {
      expect(countYearlyRounds(['2022-01-10', '2022-07-10'])).toBe(2);
      expect(countYearlyRounds(['2022-01-10', '2022-07-09'])).toBe(1);
    });
    it('rounds never exceed checkups, and checkups never exceed the history (property, 1000 runs)', () => {
      fc.assert(
        fc.property(fc.array(fc.integer({ min: 0, max: 4000 }), { minLength: 1, maxLength: 15 }), (offsets) => {
          const dates = [...new Set(offsets)].map((d) => new Date(Date.UTC(2010, 0, 1 + d)).toISOString().slice(0, 10));
          const run = runOf(dates.map(pre));
          expect(run.yearlyResults).toBeLessThanOrEqual(run.checkups);
          expect(run.checkups).toBeLessThanOrEqual(dates.length);
          expect(run.checkups).toBeGreaterThanOrEqual(1);
          expect(run.years).toBeGreaterThanOrEqual(0);
          // Same result whatever the input order.
          expect(runOf([...dates].reverse().map(pre))).toEqual(run);
        }),
        { numRuns: 1000 },
      );
    });
  });
});
