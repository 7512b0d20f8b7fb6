import { describe, expect, it } from 'vitest';
import { classifyHistory } from '@/lib/glycaemia/classify';
import { glucoseTimeline } from '@/lib/glycaemia/timeline';
import { glucoseHistoryView } from '@/lib/glycaemia/view';
import type { CheckupDraft } from '@/lib/glycaemia/draft';

// Illustrative rows, invented for the tests.
const TODAY = '2024-06-30';
const row = (date: string, hba1cValue = '', fpgValue = '', hba1cUnit: '%' | 'mmol/mol' = '%', fpgUnit: 'mg/dL' | 'mmol/L' = 'mg/dL'): CheckupDraft => ({
  date,
  hba1cValue,
  hba1cUnit,
  fpgValue,
  fpgUnit,
});

describe('glucoseTimeline', () => {
  it('puts each test in the body\'s unit, with the body\'s thresholds as lines', () => {
    const t = glucoseTimeline(
      classifyHistory(
        [
          { date: '2021-03-01', hba1c: { value: 42, unit: 'mmol/mol' } },
          { date: '2022-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 5.9, unit: 'mmol/L' } },
        ],
        'ADA',
      ),
      'ADA',
    );
    expect(t?.series.map((s) => s.title)).toEqual(['HbA1c (%)', 'Fasting glucose (mg/dL)']);
    const hba1c = t?.series[0];
    expect(hba1c?.points.map((p) => p.text)).toEqual(['5.99%', '6.1%']); // 65.5 / 10.93 = 5.9927 → 5.99 (hand-computed)
    expect(hba1c?.thresholds).toEqual([
      { value: 5.7, label: 'prediabetes range from 5.7%' },
      { value: 6.5, label: 'diabetes range from 6.5%' },
    ]);
    // y range: values 5.99–6.5 span 0.51; pad max(0.051, 0.5) = 0.5; floor((5.7 − 0.5)/0.5)·0.5 = 5.0, ceil((6.5 + 0.5)/0.5)·0.5 = 7.0 (hand-computed)
    expect(hba1c?.yDomain).toEqual([5, 7]);
    expect(t?.series[1]?.points).toHaveLength(1);
    expect(t?.ticks).toEqual([18687, 19052]); // days since 1970-01-01 (Date.UTC / 86 400 000)
    expect(t?.tickLabels).toEqual({ 18687: '2021-03-01', 19052: '2022-03-01' });
    expect(t?.xDomain).toEqual([18687 - 45, 19052 + 45]);
  });

  it('draws only the WHO diabetes-range line for HbA1c, and says everything in its text alternative', () => {
    const t = glucoseTimeline(classifyHistory([{ date: '2022-03-01', hba1c: { value: 6.0, unit: '%' } }], 'WHO'), 'WHO');
    expect(t?.series[0]?.thresholds).toEqual([{ value: 6.5, label: 'diabetes range from 6.5%' }]);
    expect(t?.series[0]?.summary).toBe('HbA1c (%) under WHO: 2022-03-01 6.0%, not classified (WHO). Lines mark the diabetes range from 6.5%.');
  });

  it('is null for no checkups', () => {
    expect(glucoseTimeline([], 'ADA')).toBeNull();
  });
});

describe('glucoseHistoryView', () => {
  it('is empty until something is typed', () => {
    const v = glucoseHistoryView({ drafts: [row('')], criteria: 'ADA', today: TODAY });
    expect(v.status).toBe('empty');
    expect(v.rowErrors).toEqual([{}]);
    expect(v.rowLabels).toEqual(['Row 1']);
    expect(v.statusText).toBe('No checkups yet: add a row, paste rows or load a FHIR file.');
    expect(v.ownResults).toBeNull();
    expect(v.history).toBeNull();
  });

  it('maps every issue to its row and field', () => {
    const v = glucoseHistoryView({
      drafts: [row(''), row('2023-02-30', '6.1'), row('2023-03-01', 'abc'), row('2023-04-01'), row('2023-05-01', '', '5', '%', 'mg/dL')],
      criteria: 'ADA',
      today: TODAY,
    });
    expect(v.status).toBe('invalid');
    expect(v.rowErrors[0]).toEqual({});
    expect(v.rowErrors[1]).toEqual({ date: 'The date 2023-02-30 is not a real calendar day' });
    expect(v.rowErrors[2]).toEqual({ hba1cValue: 'The HbA1c value must be a number' });
    expect(v.rowErrors[3]).toEqual({ row: 'The checkup has neither an HbA1c nor a fasting glucose: give at least one' });
    expect(v.rowErrors[4]?.fpgValue).toMatch(/between 18 and 900 \(got 5\); 5 looks like a value in mmol\/L/);
    expect(v.errorLines[0]).toBe('Row 2, date: The date 2023-02-30 is not a real calendar day');
    expect(v.statusText).toBe('4 problems in the rows; nothing is classified until they are fixed:');
    expect(v.checkups).toEqual([]);
    expect(v.match).toBeNull();
  });

  it('names rows, not input indices, in same-date conflicts', () => {
    const v = glucoseHistoryView({ drafts: [row(''), row('2023-03-01', '6.1'), row('2023-03-01', '6.6')], criteria: 'ADA', today: TODAY });
    expect(v.rowErrors[2]?.hba1cValue).toBe('Row 3 (2023-03-01) has a different HbA1c (6.6%) from row 2 on the same date (6.1%): keep one result per test and date');
  });

  it('shows each checkup, the run, the chart and the match when rows are valid', () => {
    const v = glucoseHistoryView({
      drafts: [row('2022-03-01', '6.0'), row('2023-03-01', '6.2', '99')],
      criteria: 'ADA',
      today: TODAY,
      exposure: { category: 'prediabetes', criteria: 'ADA', minYears: 3 },
    });
    expect(v.status).toBe('ready');
    expect(v.statusText).toBe('2 checkups, classified under ADA.');
    expect(v.exposureText).toBe("The study's exposure: 3 yearly results in a row in the prediabetes range (ADA).");
    expect(v.checkups.map((c) => [c.date, c.label, c.hba1cText, c.fpgText, c.discordant])).toEqual([
      ['2022-03-01', 'prediabetes range (ADA)', '6.0%', null, false],
      ['2023-03-01', 'prediabetes range (ADA)', '6.2%', '99 mg/dL', true],
    ]);
    expect(v.runText).toMatch(/^The last 2 yearly results, from 2022-03-01 to 2023-03-01/);
    expect(v.match?.matches).toBe(false);
    expect(v.match?.reasons[0]).toBe('The study needed 3 yearly results in the prediabetes range (ADA); this history has 2, from 2022-03-01 to 2023-03-01.');
    expect(v.timeline?.series).toHaveLength(2);
    expect(v.diabetesRangeNote).toBeNull();
    expect(v.caution).toMatch(/not a diagnosis/);
    // The person's own results as the handout words them (lib/wording/ownResults.ts), and the
    // valid history for the hand-over. Hand-written: HbA1c 6.0% and 6.2% a year apart; fasting
    // glucose 99 mg/dL once (ADA normal below 100 mg/dL); the latest checkup is in the
    // prediabetes range by its HbA1c (the higher range counts), and so is the one before.
    expect(v.ownResults).toEqual({
      heading: 'Your own results, as the handout words them',
      text:
        'Your HbA1c was between 6.0% and 6.2% at two yearly checkups, from 2022 to 2023. Your fasting blood sugar (glucose) was 99 mg/dL at one checkup, in 2023. Both results, from 2022 to 2023, were in the prediabetes range. A range is not a diagnosis. Ranges as set by the American Diabetes Association (ADA).',
    });
    expect(v.history?.checkups).toHaveLength(2);
  });

  it('shows the diabetes-range note for a latest result in that range', () => {
    const v = glucoseHistoryView({ drafts: [row('2023-03-01', '', '7.3', '%', 'mmol/L')], criteria: 'WHO', today: TODAY });
    expect(v.diabetesRangeNote?.code).toBe('diabetes-range-latest');
    expect(v.checkups[0]?.label).toBe('diabetes range (WHO)');
  });

  it('keeps conversion notes on the checkup', () => {
    // 126 mg/dL = 6.9938 mmol/L: below WHO's 7.0, but it would print as 7.0 (hand-computed); WHO's own
    // 126 mg/dL form places it in the diabetes range (issue 11 item 1), and the note says why.
    const v = glucoseHistoryView({ drafts: [row('2023-03-01', '', '126')], criteria: 'WHO', today: TODAY });
    expect(v.checkups[0]?.fpgText).toBe('6.99 mmol/L');
    expect(v.checkups[0]?.notes[0]).toMatch(/within rounding of the 7\.0 mmol\/L limit/);
    expect(v.checkups[0]?.label).toBe('diabetes range (WHO)');
  });
});
