/**
 * The hand-over record from the consultation screen to the handout (issue 12.15). The sentences
 * themselves are tested in tests/unit/wording/ownResults.test.ts.
 */
import { describe, expect, it } from 'vitest';
import type { Checkup } from '@/lib/glycaemia/schema';
import { HANDOUT_HISTORY_FORMAT, handOverRecord, readHandOver } from '@/lib/handout';
import type { Scenario } from '@/lib/scenario/schema';

const yearly = (values: readonly number[], unit: '%' | 'mmol/mol' = '%'): Checkup[] =>
  values.map((value, i) => ({ date: `${2019 + i}-03-01`, hba1c: { value, unit } }));

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
