/**
 * "Your own results" (lib/wording/ownResults.ts): the one wording of a person's glucose history
 * for the patient, used by the handout sheet and the glucose history section. Expected sentences
 * are hand-written; conversions are hand-computed.
 *
 * Histories invented for the tests (illustrative values). Ranges under ADA: HbA1c 5.7–6.4% is the
 * prediabetes range, 6.5% and above the diabetes range; fasting glucose 100–125 mg/dL is the
 * prediabetes range, 126 mg/dL and above the diabetes range (ADA Standards of Care, section 2, as
 * in lib/glycaemia/criteria.ts).
 */
import { describe, expect, it } from 'vitest';
import type { CriteriaSet } from '@/lib/glycaemia/exposure';
import type { Checkup } from '@/lib/glycaemia/schema';
import { countWords, ownResultsText } from '@/lib/wording/ownResults';

const pct = (date: string, value: number): Checkup => ({ date, hba1c: { value, unit: '%' } });
const summary = (checkups: readonly Checkup[], criteria: CriteriaSet = 'ADA') => ownResultsText({ criteria, checkups });
const yearly = (values: readonly number[]): Checkup[] => values.map((value, i) => pct(`${2019 + i}-03-01`, value));

describe('ownResultsText', () => {
  it('five yearly HbA1c results in the prediabetes range', () => {
    const s = summary([pct('2021-03-01', 5.8), pct('2022-03-07', 6.0), pct('2023-03-06', 6.2), pct('2024-03-04', 6.1), pct('2025-03-03', 5.9)]);
    expect(s?.tests).toEqual(['Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025.']);
    expect(s?.range).toBe('All five results, from 2021 to 2025, were in the prediabetes range.');
    expect(s?.confirm).toBeNull();
    expect(s?.text).toBe(
      'Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025. All five results, from 2021 to 2025, were in the prediabetes range. A range is not a diagnosis. Ranges as set by the American Diabetes Association (ADA).',
    );
    expect(s?.sentences).toEqual([
      'Your HbA1c was between 5.8% and 6.2% at five yearly checkups, from 2021 to 2025.',
      'All five results, from 2021 to 2025, were in the prediabetes range.',
      'A range is not a diagnosis.',
      'Ranges as set by the American Diabetes Association (ADA).',
    ]);
  });

  it('writes a value a spreadsheet computed with one decimal past the lab’s, and 6.4999% never as 6.50% (it is below the 6.5% cut-point)', () => {
    const s = summary(yearly([5.76666666666667, 6.4999, 6.1]));
    expect(s?.tests).toEqual(['Your HbA1c was between 5.77% and 6.4999% at three yearly checkups, from 2019 to 2021.']);
    expect(s?.range).toBe('All three results, from 2019 to 2021, were in the prediabetes range.');
  });

  it('mixed units: a converted result just under a cut-point keeps the decimals that show it is under', () => {
    // 47 mmol/mol = (47 + 23.5) / 10.93 = 6.450% (master equation solved for %, Hoelzel et al. 2004,
    // Clin Chem 50:166; hand-computed): to one decimal 6.5%, the ADA's diabetes-range cut-point it is
    // under; so two decimals, 6.45%. 47 mmol/mol is under ADA's published 48 mmol/mol too.
    const s = summary([{ date: '2022-05-02', hba1c: { value: 47, unit: 'mmol/mol' } }, pct('2023-05-08', 6.0)]);
    expect(s?.tests).toEqual(['Your HbA1c was between 6.0% and 6.45% at two yearly checkups, from 2022 to 2023.']);
    expect(s?.range).toBe('Both results, from 2022 to 2023, were in the prediabetes range.');
  });

  it('gives mixed units in the body’s unit with the decimals labs print', () => {
    // 42 mmol/mol = (42 + 23.5) / 10.93 = 5.993% (master equation solved for %, Hoelzel et al.
    // 2004, Clin Chem 50:166; hand-computed), printed to one decimal: 6.0%.
    const s = summary([{ date: '2022-05-02', hba1c: { value: 42, unit: 'mmol/mol' } }, pct('2023-05-08', 6.0)]);
    expect(s?.tests).toEqual(['Your HbA1c was 6.0% at each of two yearly checkups, from 2022 to 2023.']);
    expect(s?.range).toBe('Both results, from 2022 to 2023, were in the prediabetes range.');
  });

  it('keeps the values as entered when one unit was used throughout', () => {
    const s = summary([{ date: '2022-05-02', hba1c: { value: 40, unit: 'mmol/mol' } }, { date: '2023-05-08', hba1c: { value: 44, unit: 'mmol/mol' } }], 'NICE');
    expect(s?.tests).toEqual(['Your HbA1c was between 40 mmol/mol and 44 mmol/mol at two yearly checkups, from 2022 to 2023.']);
    expect(s?.criteriaLine).toBe('Ranges as set by the National Institute for Health and Care Excellence (NICE).');
  });

  it('one fasting glucose result, in words a patient knows', () => {
    const s = summary([{ date: '2024-06-10', fpg: { value: 104, unit: 'mg/dL' } }]);
    expect(s?.tests).toEqual(['Your fasting blood sugar (glucose) was 104 mg/dL at one checkup, in 2024.']);
    expect(s?.range).toBe('Your latest result, in 2024, is in the prediabetes range.');
  });

  it('says one HbA1c result plainly', () => {
    expect(summary([pct('2023-03-01', 6.1)])?.tests).toEqual(['Your HbA1c was 6.1% at one checkup, in 2023.']);
  });

  it('both tests, one sentence each, HbA1c first', () => {
    const s = summary([
      { date: '2023-04-03', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 106, unit: 'mg/dL' } },
      { date: '2024-04-08', hba1c: { value: 6.3, unit: '%' }, fpg: { value: 118, unit: 'mg/dL' } },
    ]);
    expect(s?.tests).toEqual([
      'Your HbA1c was between 6.1% and 6.3% at two yearly checkups, from 2023 to 2024.',
      'Your fasting blood sugar (glucose) was between 106 mg/dL and 118 mg/dL at two yearly checkups, from 2023 to 2024.',
    ]);
  });

  it('says the last results when earlier ones were in another range', () => {
    const s = summary([pct('2020-03-02', 5.4), pct('2021-03-01', 5.8), pct('2022-03-07', 5.9), pct('2023-03-06', 6.0)]);
    expect(s?.tests).toEqual(['Your HbA1c was between 5.4% and 6.0% at four yearly checkups, from 2020 to 2023.']);
    expect(s?.range).toBe('Your last three results, from 2021 to 2023, were all in the prediabetes range.');
  });

  it('a latest result in the diabetes range asks for a repeat test and never names diabetes alone', () => {
    const s = summary([pct('2023-04-03', 6.1), pct('2024-04-08', 6.3), pct('2025-04-07', 6.8)]);
    expect(s?.range).toBe('Your latest result, in 2025, is in the diabetes range.');
    expect(s?.confirm).toBe('A result in the diabetes range needs a repeat test to confirm it.');
    const text = (s?.text ?? '').replace('American Diabetes Association', '');
    expect(text).not.toMatch(/\bdiabetes\b(?! range)/i);
    expect(text).toContain('A range is not a diagnosis.');
  });

  it('fasting glucose in the diabetes range: "diabetes range" only (ADA ≥ 126 mg/dL)', () => {
    const s = summary([
      { date: '2022-04-01', fpg: { value: 118, unit: 'mg/dL' } },
      { date: '2023-04-01', fpg: { value: 131, unit: 'mg/dL' } },
    ]);
    expect(s?.tests).toEqual(['Your fasting blood sugar (glucose) was between 118 mg/dL and 131 mg/dL at two yearly checkups, from 2022 to 2023.']);
    expect(s?.range).toBe('Your latest result, in 2023, is in the diabetes range.');
    for (const sentence of s?.sentences ?? []) expect(sentence.replace('American Diabetes Association', '')).not.toMatch(/diabetes(?! range)/i);
  });

  it('does not say "yearly" across a long gap or for checkups months apart, and writes counts above ten in digits', () => {
    expect(summary([pct('2015-03-02', 5.8), pct('2024-03-04', 5.9)])?.tests).toEqual(['Your HbA1c was between 5.8% and 5.9% at two checkups, from 2015 to 2024.']);
    expect(summary([pct('2019-03-01', 6.1), pct('2021-06-01', 6.3)])?.tests).toEqual(['Your HbA1c was between 6.1% and 6.3% at two checkups, from 2019 to 2021.']);
    expect(summary([pct('2023-01-10', 6.1), pct('2023-03-01', 6.3)])?.tests).toEqual(['Your HbA1c was between 6.1% and 6.3% at two checkups, in 2023.']);
    const twelve = Array.from({ length: 12 }, (_, i) => pct(`${2013 + i}-03-04`, 6.0));
    expect(summary(twelve)?.tests).toEqual(['Your HbA1c was 6.0% at each of 12 yearly checkups, from 2013 to 2024.']);
  });

  it('leaves the range out when the body does not classify the latest result (WHO: HbA1c below 6.5% alone)', () => {
    expect(summary(yearly([6.0, 6.1]), 'WHO')?.sentences).toEqual([
      'Your HbA1c was between 6.0% and 6.1% at two yearly checkups, from 2019 to 2020.',
      'A range is not a diagnosis.',
      'Ranges as set by the World Health Organization (WHO).',
    ]);
  });

  it('sorts the checkups by date first, and gives nothing for no checkups', () => {
    const shuffled = [...yearly([5.8, 6.0, 6.2])].reverse();
    expect(summary(shuffled)?.tests[0]).toBe('Your HbA1c was between 5.8% and 6.2% at three yearly checkups, from 2019 to 2021.');
    expect(summary([])).toBeNull();
  });
});

describe('countWords', () => {
  it('writes one to ten as words and larger counts as digits (common practice)', () => {
    expect([0, 1, 5, 10, 11, 1000].map(countWords)).toEqual(['zero', 'one', 'five', 'ten', '11', '1,000']);
  });
});
