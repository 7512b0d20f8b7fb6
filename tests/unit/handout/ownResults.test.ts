/**
 * The person's own results on the handout (issue 12.15) and the hand-over record from the
 * consultation screen. Expected sentences are hand-written; conversions are hand-computed.
 */
import { describe, expect, it } from 'vitest';
import type { Checkup } from '@/lib/glycaemia/schema';
import { HANDOUT_HISTORY_FORMAT, handOverRecord, ownResultsSentences, readHandOver } from '@/lib/handout';
import type { Scenario } from '@/lib/scenario/schema';

const yearly = (values: readonly number[], unit: '%' | 'mmol/mol' = '%'): Checkup[] =>
  values.map((value, i) => ({ date: `${2019 + i}-03-01`, hba1c: { value, unit } }));

describe('ownResultsSentences', () => {
  it('gives the range of five yearly HbA1c results and the latest range (ADA prediabetes 5.7 ≤ % < 6.5, lib/glycaemia/criteria.ts)', () => {
    expect(ownResultsSentences({ criteria: 'ADA', checkups: yearly([5.8, 6.0, 5.9, 6.2, 6.1]) })).toEqual([
      'Your HbA1c was between 5.8% and 6.2% at 5 yearly checkups, from March 2019 to March 2023.',
      'Your latest result, in March 2023, is in the prediabetes range by the ADA\u2019s limits. One result on its own is not a diagnosis.',
    ]);
  });

  it('says one result plainly', () => {
    expect(ownResultsSentences({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }] })[0]).toBe(
      'Your HbA1c was 6.1% at your checkup in March 2023.',
    );
  });

  it('writes every result in the latest result’s unit, converted and rounded as labs report', () => {
    // Hand-computed: 42 mmol/mol = (42 + 23.5) / 10.93 = 5.9927% → 6.0% (Hoelzel et al. 2004 master equation).
    const history = { criteria: 'ADA' as const, checkups: [{ date: '2022-03-01', hba1c: { value: 42, unit: 'mmol/mol' as const } }, { date: '2023-03-01', hba1c: { value: 6.0, unit: '%' as const } }] };
    expect(ownResultsSentences(history)[0]).toBe('Your HbA1c was 6.0% at each of 2 yearly checkups, from March 2022 to March 2023.');
  });

  it('does not call checkups yearly when they are months apart or a gap is longer than 18 months', () => {
    const close = [{ date: '2023-01-10', hba1c: { value: 6.1, unit: '%' as const } }, { date: '2023-03-01', hba1c: { value: 6.3, unit: '%' as const } }];
    expect(ownResultsSentences({ criteria: 'ADA', checkups: close })[0]).toBe('Your HbA1c was between 6.1% and 6.3% at 2 checkups, from January 2023 to March 2023.');
    const gap = [{ date: '2019-03-01', hba1c: { value: 6.1, unit: '%' as const } }, { date: '2021-06-01', hba1c: { value: 6.3, unit: '%' as const } }];
    expect(ownResultsSentences({ criteria: 'ADA', checkups: gap })[0]).toBe('Your HbA1c was between 6.1% and 6.3% at 2 checkups, from March 2019 to June 2021.');
  });

  it('gives fasting glucose in words a patient knows, and only ever "diabetes range"', () => {
    // ADA: fasting glucose ≥ 126 mg/dL is the diabetes range (lib/glycaemia/criteria.ts).
    const sentences = ownResultsSentences({
      criteria: 'ADA',
      checkups: [
        { date: '2022-04-01', fpg: { value: 118, unit: 'mg/dL' } },
        { date: '2023-04-01', fpg: { value: 131, unit: 'mg/dL' } },
      ],
    });
    expect(sentences[0]).toBe('Your fasting blood sugar (glucose) was between 118 mg/dL and 131 mg/dL at 2 yearly checkups, from April 2022 to April 2023.');
    expect(sentences[1]).toContain('is in the diabetes range by the ADA\u2019s limits');
    for (const s of sentences) expect(s).not.toMatch(/diabetes(?! range)/);
  });

  it('leaves the range out when the body does not classify the latest result (WHO: HbA1c below 6.5% alone)', () => {
    expect(ownResultsSentences({ criteria: 'WHO', checkups: yearly([6.0, 6.1]) })).toEqual(['Your HbA1c was between 6.0% and 6.1% at 2 yearly checkups, from March 2019 to March 2020.']);
  });

  it('sorts the checkups by date first, and says nothing for an empty history', () => {
    const shuffled = [...yearly([5.8, 6.0, 6.2])].reverse();
    expect(ownResultsSentences({ criteria: 'ADA', checkups: shuffled })[0]).toContain('from March 2019 to March 2021');
    expect(ownResultsSentences({ criteria: 'ADA', checkups: [] })).toEqual([]);
  });
});

describe('the hand-over from the consultation screen', () => {
  const scenario: Scenario = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };
  const history = { criteria: 'ADA' as const, checkups: yearly([5.8, 6.0]) };
  const today = '2024-01-01';

  it('reads back the history stored for the same scenario', () => {
    const stored = handOverRecord(scenario, history);
    expect(JSON.parse(stored)).toMatchObject({ format: HANDOUT_HISTORY_FORMAT, version: 1, query: '?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9' });
    const read = readHandOver(stored, scenario, today);
    expect(read?.ok && read.value.checkups).toEqual(history.checkups);
  });

  it('ignores a history stored for another scenario, and nothing stored', () => {
    const stored = handOverRecord({ ...scenario, baseline: { risk: 0.09, years: 10 } }, history);
    expect(readHandOver(stored, scenario, today)).toBeUndefined();
    expect(readHandOver(null, scenario, today)).toBeUndefined();
    expect(readHandOver('', scenario, today)).toBeUndefined();
  });

  it('refuses a damaged record or an invalid history, with a plain reason', () => {
    const bad = readHandOver('{', scenario, today);
    expect(bad?.ok === false && bad.issues[0]?.code).toBe('invalid-json');
    const wrong = readHandOver(JSON.stringify({ format: 'other', version: 1, query: '', history: {} }), scenario, today);
    expect(wrong?.ok === false && wrong.issues[0]?.code).toBe('wrong-format');
    const future = readHandOver(handOverRecord(scenario, { criteria: 'ADA', checkups: [{ date: '2030-01-01', hba1c: { value: 6, unit: '%' } }] }), scenario, today);
    expect(future?.ok === false && future.issues[0]?.code).toBe('future-date');
  });
});
