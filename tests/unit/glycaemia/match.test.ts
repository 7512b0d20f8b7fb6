import { describe, expect, it } from 'vitest';
import { classifyHistory } from '@/lib/glycaemia/classify';
import { diabetesRangeNote, matchHistory } from '@/lib/glycaemia/match';
import type { ExposureDefinition } from '@/lib/glycaemia/exposure';
import type { Checkup } from '@/lib/glycaemia/schema';

// Illustrative histories and exposure definitions, invented for the tests (not from a real study).
const pre = (date: string): Checkup => ({ date, hba1c: { value: 6.0, unit: '%' } }); // ADA 5.7–6.4 %: prediabetes
const normal = (date: string): Checkup => ({ date, hba1c: { value: 5.2, unit: '%' } });
const ADA3: ExposureDefinition = { category: 'prediabetes', criteria: 'ADA', minYears: 3 };
const NO_DIAGNOSIS = /\bdiabetes\b(?! range)/i;

function allText(m: ReturnType<typeof matchHistory>): string[] {
  return [...m.reasons, m.warning?.message ?? '', m.diabetesRangeNote?.message ?? ''];
}

describe('matchHistory', () => {
  it('matches when the run is long enough, and says so plainly', () => {
    const m = matchHistory([pre('2020-03-01'), pre('2021-03-01'), pre('2022-03-01')], ADA3);
    expect(m.matches).toBe(true);
    expect(m.matchingYearlyResults).toBe(3);
    expect(m.reasons[0]).toBe('The study needed 3 yearly results in the prediabetes range (ADA); this history has 3, from 2020-03-01 to 2022-03-01.');
    expect(m.warning).toBeUndefined();
    expect(m.diabetesRangeNote).toBeUndefined();
  });

  it('does not match a run that is too short, says why, and carries a warning', () => {
    const m = matchHistory([normal('2020-03-01'), pre('2021-03-01'), pre('2022-03-01')], ADA3);
    expect(m.matches).toBe(false);
    expect(m.reasons).toEqual([
      'The study needed 3 yearly results in the prediabetes range (ADA); this history has 2, from 2021-03-01 to 2022-03-01.',
      'Before the run, the result of 2020-03-01 is in the normal range (ADA).',
    ]);
    expect(m.warning).toEqual({
      code: 'exposure-mismatch',
      message:
        "This history does not fit the study's exposure: the study needed 3 yearly results in the prediabetes range (ADA); this history has 2. The study's figures may not apply to this person.",
    });
  });

  it('explains a gap that breaks the run', () => {
    const m = matchHistory([pre('2017-03-01'), pre('2018-03-01'), pre('2021-03-01'), pre('2022-03-01')], ADA3);
    expect(m.matches).toBe(false);
    expect(m.reasons[1]).toBe(
      'The run starts after a gap of 36 months (2018-03-01 to 2021-03-01); results before a gap of more than 18 months do not count.',
    );
  });

  it('explains a latest result in another range', () => {
    const m = matchHistory([pre('2020-03-01'), pre('2021-03-01'), normal('2022-03-01')], ADA3);
    expect(m.matchingYearlyResults).toBe(0);
    expect(m.reasons).toEqual([
      'The study needed 3 yearly results in the prediabetes range (ADA); this history has 0.',
      'The latest result (2022-03-01) is in the normal range (ADA), not the prediabetes range.',
    ]);
  });

  it('counts repeats within a yearly round once, and says so', () => {
    const m = matchHistory([pre('2021-03-01'), pre('2021-04-01'), pre('2022-03-01')], ADA3);
    expect(m.matches).toBe(false);
    expect(m.reasons[0]).toMatch(/this history has 2,/);
    expect(m.reasons).toContain('The run holds 3 results; some are less than 6 months apart and count as one yearly round.');
  });

  it('applies the study\'s criteria set, not the one shown, and says so', () => {
    // HbA1c 5.8 %: ADA prediabetes (≥ 5.7), NICE normal (5.8 % = 39.9 mmol/mol < 42; hand-computed).
    const history = ['2020-03-01', '2021-03-01', '2022-03-01'].map((date): Checkup => ({ date, hba1c: { value: 5.8, unit: '%' } }));
    const m = matchHistory(history, ADA3, { shownCriteria: 'NICE' });
    expect(m.matches).toBe(true);
    expect(m.persistence.criteria).toBe('ADA');
    expect(m.reasons).toContain('The study used ADA criteria, so this check applies ADA; the results above are shown under NICE.');
    expect(matchHistory(history, { ...ADA3, criteria: 'NICE' }).matches).toBe(false);
  });

  it('cannot match when the latest result cannot be classified (WHO, HbA1c below 6.5 % only)', () => {
    const m = matchHistory(
      [{ date: '2021-03-01', fpg: { value: 6.4, unit: 'mmol/L' } }, { date: '2022-03-01', hba1c: { value: 6.0, unit: '%' } }],
      { category: 'prediabetes', criteria: 'WHO', minYears: 1 },
    );
    expect(m.matches).toBe(false);
    expect(m.reasons[1]).toMatch(/^The latest result \(2022-03-01\) cannot be classified under WHO/);
  });

  it('matches a one-year definition with one result', () => {
    expect(matchHistory([pre('2022-03-01')], { ...ADA3, minYears: 1 }).matches).toBe(true);
  });

  describe('a diabetes-range latest result', () => {
    const history: Checkup[] = [pre('2020-03-01'), pre('2021-03-01'), { date: '2022-03-01', hba1c: { value: 6.8, unit: '%' } }];
    it('never matches a prediabetes definition and carries the prominent note', () => {
      const m = matchHistory(history, ADA3);
      expect(m.matches).toBe(false);
      expect(m.reasons[1]).toBe('The latest result (2022-03-01) is in the diabetes range (ADA), not the prediabetes range.');
      expect(m.diabetesRangeNote).toEqual({
        code: 'diabetes-range-latest',
        message:
          'The latest result (2022-03-01) is in the diabetes range (ADA). Evidence about the prediabetes range does not apply to it. One result is not a diagnosis: confirm with repeat testing as your local guideline says.',
      });
    });
    it('keeps the note when the study itself is about the diabetes range', () => {
      const m = matchHistory(history, { category: 'diabetes-range', criteria: 'ADA', minYears: 1 });
      expect(m.matches).toBe(true);
      expect(m.diabetesRangeNote?.message).toBe(
        'The latest result (2022-03-01) is in the diabetes range (ADA). One result is not a diagnosis: confirm with repeat testing as your local guideline says.',
      );
    });
    it('diabetesRangeNote is null when the latest result is below the diabetes range', () => {
      expect(diabetesRangeNote(classifyHistory([history[2] as Checkup, pre('2023-03-01')], 'ADA'))).toBeNull();
    });
    it('never words anything as a diagnosis', () => {
      for (const exposure of [ADA3, { category: 'diabetes-range', criteria: 'WHO', minYears: 2 } as const, { category: 'normal', criteria: 'NICE', minYears: 1 } as const]) {
        for (const text of allText(matchHistory(history, exposure))) expect(text).not.toMatch(NO_DIAGNOSIS);
      }
    });
  });

  it('handles an empty history without throwing', () => {
    const m = matchHistory([], ADA3);
    expect(m.matches).toBe(false);
    expect(m.reasons).toEqual(['The study needed 3 yearly results in the prediabetes range (ADA); this history has 0.', 'There are no checkups.']);
  });
});
