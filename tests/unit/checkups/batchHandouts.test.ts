/**
 * Batch handouts: which workers are chosen (hand-worked counts), and that each sheet is exactly
 * the one lib/handout makes for the worker's scenario (handoutSheet is tested on its own in
 * tests/unit/handout/sheet.test.ts, so calling it here for the expected value is legitimate: the
 * code under test is the choice of scenario and the wiring, not the sheet).
 */
import { describe, expect, it } from 'vitest';
import { batchCounts, batchCountsText, batchHandout, batchHandouts, batchSelection } from '@/lib/checkups/batchHandouts';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { DEFAULT_BLOCKS, handoutSheet, ILLUSTRATIVE_BAND_HEADING } from '@/lib/handout';
import type { Scenario } from '@/lib/scenario/schema';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { prepareCheckups, type CheckupsContext, type WorkerResult } from '@/lib/workforce';
import { C003, W001, W002 } from './fixtures';

const DATE = new Date(2025, 4, 12, 12); // 12 May 2025, local noon

function contextFor(evidence: EvidenceEntry): CheckupsContext {
  const prepared = prepareCheckups({ evidence, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
  if (!prepared.ok) throw new Error(JSON.stringify(prepared.issues));
  return prepared.value;
}
const CONTEXT = contextFor(DEMO_WORKFORCE_HBA1C_HEART_FAILURE);

/**
 * W001's scenario written out by hand: the demo table's women 50–59 stratum (10-year risk 0.015,
 * lib/tables/demo.ts), the demo entry's effect and words, age 53 and female (the command's line
 * for W001, tests/unit/checkups/fixtures.ts), no horizon chosen (the table's own 10 years).
 */
const W001_SCENARIO: Scenario = {
  baseline: { risk: 0.015, years: 10 },
  effect: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.effect,
  wording: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.wording,
  person: { age: 53, sex: 'female' },
  tableId: DEMO_HEART_FAILURE_10Y.id,
};

/** A second exposed worker (invented): a man of 64, demo table men 60–69, 10-year risk 0.055. */
const M064: WorkerResult = { ...W001, worker: 'M064', age: 64, sex: 'male', referenceRisk: 0.055 };
const M064_SCENARIO: Scenario = { ...W001_SCENARIO, baseline: { risk: 0.055, years: 10 }, person: { age: 64, sex: 'male' } };

describe('batchSelection (hand-worked)', () => {
  // statuses: 0 exposed (W001), 1 insufficient (W002), 2 comparison (C003), 3 exposed (M064)
  const results = [W001, W002, C003, M064];

  it('all exposed: the two exposed workers, in file order', () => {
    expect(batchSelection(results, 'exposed', new Set([1]))).toEqual([0, 3]);
  });
  it('all: every worker', () => {
    expect(batchSelection(results, 'all', new Set())).toEqual([0, 1, 2, 3]);
  });
  it('selected: the ticked ones in file order, whatever the order of ticking; a stale index (9) is ignored', () => {
    expect(batchSelection(results, 'selected', new Set([3, 1, 9]))).toEqual([1, 3]);
    expect(batchSelection(results, 'selected', new Set())).toEqual([]);
  });
});

describe('batchHandout: the sheet is the one /handout makes for the worker’s scenario', () => {
  it('W001 on A4: equal to handoutSheet for the hand-written scenario, with the illustrative band', () => {
    const expected = handoutSheet(W001_SCENARIO, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: DATE, paper: 'a4', table: DEMO_HEART_FAILURE_10Y });
    if (!expected.ok) throw new Error('the hand-written scenario must give a sheet');
    const got = batchHandout(W001, 0, CONTEXT, { paper: 'a4', date: DATE, showIds: false });
    expect(got.kind).toBe('sheet');
    if (got.kind !== 'sheet') return;
    expect(got.sheet).toEqual(expected.value);
    expect(got.workerId).toBeUndefined();
    // Demo table and demo study: the band is on the sheet (lib/handout/illustrative.ts).
    expect(got.sheet.illustrative?.heading).toBe(ILLUSTRATIVE_BAND_HEADING);
    // hand-computed: 1,000 people (0.89 percentage points would not be a whole count of 100);
    // 0.015 × 1000 = 15 without, 0.02389 × 1000 = 23.9 → 24 with (W001's figures, fixtures.ts)
    expect(got.sheet.denominator).toBe(1000);
    expect(got.sheet.text.reference.caption).toContain('15 out of 1,000');
    expect(got.sheet.text.exposed.caption).toContain('24 out of 1,000');
  });

  it('the id rides beside the sheet only when ticked; the sheet itself is the same', () => {
    const without = batchHandout(W001, 0, CONTEXT, { paper: 'letter', date: DATE, showIds: false });
    const withId = batchHandout(W001, 0, CONTEXT, { paper: 'letter', date: DATE, showIds: true });
    if (without.kind !== 'sheet' || withId.kind !== 'sheet') throw new Error('both must be sheets');
    expect(withId.workerId).toBe('W001');
    expect(without.workerId).toBeUndefined();
    expect(withId.sheet).toEqual(without.sheet);
    expect(JSON.stringify(withId.sheet)).not.toContain('W001');
    expect(withId.sheet.paper.key).toBe('letter');
  });

  it('a second worker gets their own figures', () => {
    const expected = handoutSheet(M064_SCENARIO, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: DATE, paper: 'a4', table: DEMO_HEART_FAILURE_10Y });
    if (!expected.ok) throw new Error('the hand-written scenario must give a sheet');
    const got = batchHandout(M064, 3, CONTEXT, { paper: 'a4', date: DATE, showIds: false });
    if (got.kind !== 'sheet') throw new Error('M064 must get a sheet');
    expect(got.sheet).toEqual(expected.value);
    expect(got.index).toBe(3);
  });

  it('the sheet key: two workers with equal sheets share it (same stratum, another age: the age is not printed); another stratum has another', () => {
    const options = { paper: 'a4', date: DATE, showIds: true } as const;
    const a = batchHandout(W001, 0, CONTEXT, options);
    const b = batchHandout({ ...W001, worker: 'W099', age: 55 }, 1, CONTEXT, options);
    const c = batchHandout(M064, 2, CONTEXT, options);
    if (a.kind !== 'sheet' || b.kind !== 'sheet' || c.kind !== 'sheet') throw new Error('all three must be sheets');
    expect(a.sheetKey).toBe(b.sheetKey);
    expect(b.sheet).toEqual(a.sheet);
    expect(c.sheetKey).not.toBe(a.sheetKey);
    expect(a.sheetKey).not.toContain('W001');
    // one letter per icon: 1,000 people in each of the two pictures (hand-worked: 0.015 → 1,000, as above)
    expect(a.sheetKey).toContain('"cells":"' + 'e'.repeat(15));
    expect(a.sheetKey.length).toBeLessThan(20_000);
  });
});

describe('batchHandout: workers who get no sheet', () => {
  it('the evidence does not apply (not enough results): skipped with the status and the reason', () => {
    const got = batchHandout(W002, 1, CONTEXT, { paper: 'a4', date: DATE, showIds: true });
    expect(got).toEqual({
      kind: 'skipped',
      index: 1,
      worker: 'W002',
      reason: 'not-applicable',
      message: 'Not enough results: the study\u2019s figures do not apply (Not enough yearly results yet).',
    });
  });

  it('capped: a ratio that takes the risk to certainty gives no sheet, as on /handout', () => {
    // Invented entry: RR 50 (40 to 70). hand-computed: 0.015 × 70 = 1.05 ≥ 1 at the upper limit.
    const capped = contextFor({ ...DEMO_WORKFORCE_HBA1C_HEART_FAILURE, effect: { measure: 'RR', estimate: 50, lower: 40, upper: 70, design: 'cohort' } });
    const got = batchHandout(W001, 0, capped, { paper: 'a4', date: DATE, showIds: false });
    expect(got.kind).toBe('skipped');
    if (got.kind !== 'skipped') return;
    expect(got.reason).toBe('capped');
    expect(got.message).toBe('The handout cannot be made for these figures: they reach certainty.');
  });
});

describe('batchHandouts and its counts (hand-worked)', () => {
  const results = [W001, W002, C003, M064];

  it('all four: W001 and M064 get sheets; W002 (not enough results) and C003 (no age or sex: the table cannot place them) get none', () => {
    const batch = batchHandouts(results, batchSelection(results, 'all', new Set()), CONTEXT, { paper: 'a4', date: DATE, showIds: false });
    expect(batch.map((b) => `${b.worker}:${b.kind}`)).toEqual(['W001:sheet', 'W002:skipped', 'C003:skipped', 'M064:sheet']);
    const counts = batchCounts(batch);
    expect(counts).toEqual({ chosen: 4, sheets: 2, skipped: 2, byReason: { 'not-applicable': 2 } });
    expect(batchCountsText(counts)).toBe('4 workers chosen: 2 handouts (one page each); 2 workers get none (listed below).');
  });

  it('500 exposed workers give 500 sheets', () => {
    const many = Array.from({ length: 500 }, (_, i) => ({ ...W001, worker: `X${i}` }));
    const batch = batchHandouts(many, batchSelection(many, 'exposed', new Set()), CONTEXT, { paper: 'a4', date: DATE, showIds: true });
    expect(batchCounts(batch)).toEqual({ chosen: 500, sheets: 500, skipped: 0, byReason: {} });
    expect(batch[499]?.kind === 'sheet' ? batch[499].workerId : null).toBe('X499');
  });

  it('words for nothing and for one', () => {
    expect(batchCountsText({ chosen: 0, sheets: 0, skipped: 0, byReason: {} })).toBe('No worker chosen yet.');
    expect(batchCountsText({ chosen: 1, sheets: 1, skipped: 0, byReason: {} })).toBe('1 worker chosen: 1 handout (one page each).');
  });
});
