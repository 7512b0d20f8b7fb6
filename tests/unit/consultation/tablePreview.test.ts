import { describe, expect, it } from 'vitest';
import { tablePreview } from '@/app/consultation/tablePreview';
import { DEMO_CORONARY_RATE, DEMO_HEART_FAILURE_10Y, DEMO_STROKE_5Y } from '@/lib/tables/demo';

// Expected text is literal (issue 11: not built with the code's own formatter). formatPercent's
// rule (lib/wording/format.ts): below 1% two significant digits, else one decimal.

describe('tablePreview: what the chosen table gives for the person so far', () => {
  it('names the group and its risk for a risk table', () => {
    // lib/tables/demo.ts (invented): female 40–49, 0.006 over 10 years.
    expect(tablePreview(DEMO_HEART_FAILURE_10Y, { age: '45', sex: 'female' })).toEqual({
      ok: true,
      group: 'Women aged 40 to 49',
      figure: 'a risk of 0.60% over 10 years', // hand-computed: 0.006 = 0.60%
    });
  });

  it('gives the rate and the suggested horizon for a rate table', () => {
    // lib/tables/demo.ts (invented): male 50–59, 5.5 per 1000 person-years; suggested horizon 10 years.
    expect(tablePreview(DEMO_CORONARY_RATE, { age: '55', sex: 'male' })).toEqual({
      ok: true,
      group: 'Men aged 50 to 59',
      figure: '5.5 events per 1,000 person-years; the suggested horizon is 10 years',
    });
  });

  it('asks only for what the table needs', () => {
    expect(tablePreview(DEMO_HEART_FAILURE_10Y, { age: '', sex: '' })).toEqual({ ok: false, message: 'Enter the person’s age and sex to look up the risk.' });
    expect(tablePreview(DEMO_STROKE_5Y, { age: '', sex: 'male' })).toEqual({ ok: false, message: 'Enter the person’s age to look up the risk.' });
    // The stroke table is for both sexes together: the sex is not used.
    // lib/tables/demo.ts (invented): 80 and over, 0.12 over 5 years.
    expect(tablePreview(DEMO_STROKE_5Y, { age: '85', sex: 'male' })).toEqual({ ok: true, group: 'People aged 80 and over', figure: 'a risk of 12.0% over 5 years' }); // hand-computed: 0.12 = 12.0%
  });

  it('passes on the engine’s message for an age outside the table or not a whole number', () => {
    const young = tablePreview(DEMO_HEART_FAILURE_10Y, { age: '17', sex: 'female' });
    expect(young.ok === false && young.message).toMatch(/No band of the table .* covers age 17/);
    const fractional = tablePreview(DEMO_HEART_FAILURE_10Y, { age: '45.5', sex: 'female' });
    expect(fractional.ok === false && fractional.message).toBe('The age must be a whole number of years');
    const text = tablePreview(DEMO_HEART_FAILURE_10Y, { age: 'abc', sex: 'female' });
    expect(text.ok === false && text.message).toBe('The age must be a number');
  });
});
