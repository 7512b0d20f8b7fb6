import { describe, expect, it } from 'vitest';
import { classifyCheckup, classifyHistory } from '@/lib/glycaemia/classify';
import { describeCheckup, describeExposure, describePersistence, yearsText } from '@/lib/glycaemia/describe';
import { persistence } from '@/lib/glycaemia/persistence';
import { glycaemiaReport } from '@/lib/glycaemia/report';
import type { Checkup } from '@/lib/glycaemia/schema';

// Illustrative histories, invented for the tests.
const NO_DIAGNOSIS = /\bdiabetes\b(?! range)/i;

describe('describeCheckup', () => {
  it('names the range, the body and the deciding test', () => {
    expect(describeCheckup(classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 92, unit: 'mg/dL' } }, 'ADA'))).toBe(
      '2023-03-01: prediabetes range (ADA), from HbA1c 6.1%. The tests disagree: fasting glucose 92 mg/dL is in the normal range.',
    );
  });
  it('shows a converted value with the value as entered', () => {
    // 5.9 mmol/L × 18.016 = 106.29 mg/dL (hand-computed)
    expect(describeCheckup(classifyCheckup({ date: '2023-03-01', fpg: { value: 5.9, unit: 'mmol/L' } }, 'ADA'))).toBe(
      '2023-03-01: prediabetes range (ADA), from fasting glucose 106.3 mg/dL, entered as 5.9 mmol/L.',
    );
  });
  it('says "both tests" when they agree, and words WHO\'s unclassified HbA1c', () => {
    expect(describeCheckup(classifyCheckup({ date: '2023-03-01', hba1c: { value: 45, unit: 'mmol/mol' }, fpg: { value: 6.0, unit: 'mmol/L' } }, 'NICE'))).toBe(
      '2023-03-01: prediabetes range (NICE: non-diabetic hyperglycaemia), from both tests (HbA1c 45 mmol/mol; fasting glucose 6.0 mmol/L).',
    );
    expect(describeCheckup(classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.0, unit: '%' } }, 'WHO'))).toBe(
      '2023-03-01: not classified (WHO). Under WHO an HbA1c below 6.5% alone does not place a result in a range; a fasting glucose is needed.',
    );
  });
  it('never words a result as a diagnosis', () => {
    const text = describeCheckup(classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.2, unit: '%' }, fpg: { value: 7.4, unit: 'mmol/L' } }, 'WHO'));
    expect(text).toBe('2023-03-01: diabetes range (WHO), from fasting glucose 7.4 mmol/L. The tests disagree: HbA1c 6.2% is below the diabetes range.');
    expect(text).not.toMatch(NO_DIAGNOSIS);
  });
});

describe('describePersistence', () => {
  const pre = (date: string): Checkup => ({ date, hba1c: { value: 6.0, unit: '%' } });
  const words = (checkups: Checkup[], criteria: 'ADA' | 'WHO' = 'ADA') => describePersistence(persistence(classifyHistory(checkups, criteria), criteria));

  it('describes a run with its span', () => {
    // 2021-03-01 → 2023-03-01 = 730 days = 1.9986 years → "2.0 years" (hand-computed)
    expect(words([pre('2021-03-01'), pre('2022-03-01'), pre('2023-03-01')])).toBe(
      'The last 3 yearly results, from 2021-03-01 to 2023-03-01 (2.0 years), are in the prediabetes range (ADA). There are no earlier results.',
    );
  });
  it('describes a single result, a gap and repeats', () => {
    expect(words([pre('2019-03-01'), pre('2023-03-01')])).toBe(
      'The latest result (2023-03-01) is in the prediabetes range (ADA). Before that there is a gap of 48 months (2019-03-01 to 2023-03-01), which breaks the run.',
    );
    expect(words([pre('2022-03-01'), pre('2022-04-01')])).toBe(
      'The last 2 checkups, all within one yearly round (2022-03-01 to 2022-04-01), are in the prediabetes range (ADA). There are no earlier results.',
    );
  });
  it('says "more than 18 months" for a gap of 18 whole months that breaks the run (issue 11 item 14)', () => {
    // Hand-computed: 2021-03-01 + 18 months = 2022-09-01; 2022-09-02 is one day later, so the gap is
    // more than 18 months (it breaks the run) but 18 whole months.
    expect(words([pre('2021-03-01'), pre('2022-09-02')])).toBe(
      'The latest result (2022-09-02) is in the prediabetes range (ADA). Before that there is a gap of more than 18 months (2021-03-01 to 2022-09-02), which breaks the run.',
    );
  });
  it('mentions earlier gaps that did not end the run', () => {
    const text = words([pre('2012-03-01'), { date: '2016-03-01', hba1c: { value: 5.0, unit: '%' } }, pre('2017-03-01')]);
    expect(text).toBe(
      'The latest result (2017-03-01) is in the prediabetes range (ADA). Before that, the result of 2016-03-01 is in the normal range (ADA). The history also has a gap of 48 months (2012-03-01 to 2016-03-01).',
    );
  });
  it('explains an unclassified latest result', () => {
    expect(words([{ date: '2023-03-01', hba1c: { value: 6.0, unit: '%' } }], 'WHO')).toBe(
      'The latest result (2023-03-01) cannot be classified under WHO, so there is no run to report.',
    );
  });
  it('writes years to one decimal', () => {
    expect(yearsText(1)).toBe('1.0 year');
    expect(yearsText(2.96)).toBe('3.0 years');
    expect(yearsText(0.04)).toBe('0.0 years');
  });
});

describe('glycaemiaReport', () => {
  it('prints entered values exactly, converted ones to 4 decimals, and null for missing tests', () => {
    const report = glycaemiaReport({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 47, unit: 'mmol/mol' } }], notes: [] });
    expect(report.checkups[0]).toMatchObject({
      hba1cMmolMol: 47,
      hba1cPercent: 6.4501, // 70.5 / 10.93 = 6.45013… (hand-computed)
      fpgMgDl: null,
      fpgMmolL: null,
      fpgCategory: null,
      hba1cCategory: 'prediabetes',
    });
    expect(report.criteriaName).toBe('American Diabetes Association (ADA)');
    expect(report.diabetesRangeNote).toBeNull();
  });
  it('carries the caution and no diagnostic wording', () => {
    const report = glycaemiaReport({ criteria: 'NICE', checkups: [{ date: '2023-03-01', hba1c: { value: 53, unit: 'mmol/mol' } }], notes: [] });
    expect(report.diabetesRangeNote?.code).toBe('diabetes-range-latest');
    expect(report.caution).toMatch(/not a diagnosis/);
    expect(JSON.stringify(report)).not.toMatch(/\bdiabetes\b(?![ -]range)/i);
  });
});

describe('describeExposure', () => {
  it('words a study\'s exposure definition', () => {
    expect(describeExposure({ category: 'prediabetes', criteria: 'ADA', minYears: 3 })).toBe("The study's exposure: 3 yearly results in a row in the prediabetes range (ADA).");
    expect(describeExposure({ category: 'normal', criteria: 'NICE', minYears: 1 })).toBe("The study's exposure: a result in the normal range (NICE).");
  });

  it('names the deciding test, the longest gap and the comparison group when the definition states them (issue 9 item 1)', () => {
    expect(describeExposure({ category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'hba1c', maxGapMonths: 15, comparison: { category: 'normal' } })).toBe(
      "The study's exposure: 3 yearly results in a row in the prediabetes range (ADA), decided by HbA1c alone, with no gap longer than 15 months. Comparison group: 3 yearly results in a row in the normal range, over the same span.",
    );
    expect(describeExposure({ category: 'diabetes-range', criteria: 'WHO', minYears: 2, test: 'fpg' })).toBe(
      "The study's exposure: 2 yearly results in a row in the diabetes range (WHO), decided by fasting glucose alone.",
    );
    expect(describeExposure({ category: 'prediabetes', criteria: 'NICE', minYears: 4, test: 'both', comparison: { category: 'normal', minYears: 2 } })).toBe(
      "The study's exposure: 4 yearly results in a row in the prediabetes range (NICE), decided by HbA1c and fasting glucose together, both in the range. Comparison group: 2 yearly results in a row in the normal range.",
    );
    expect(describeExposure({ category: 'prediabetes', criteria: 'ADA', minYears: 1, test: 'either', maxGapMonths: 18 })).toBe(
      "The study's exposure: a result in the prediabetes range (ADA), decided by HbA1c or fasting glucose, whichever is in the higher range, with no gap longer than 18 months.",
    );
  });
});
