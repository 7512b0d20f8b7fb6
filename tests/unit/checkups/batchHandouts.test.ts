/**
 * Batch handouts: which workers are chosen (hand-worked counts), and that each sheet is exactly
 * the one lib/handout makes for the worker's scenario (handoutSheet is tested on its own in
 * tests/unit/handout/sheet.test.ts, so calling it here for the expected value is legitimate: the
 * code under test is the choice of scenario and the wiring, not the sheet). Batch sheets leave
 * out the editor's reading grades (`grades: false`, not printed): {@link printed} compares the
 * rest with /handout's own sheet.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { BATCH_BUTTON_TEXT, BATCH_CHOICES, BATCH_MESSAGES, batchChoiceCounts, batchChoiceLabel, batchCounts, batchCountsText, batchHandout, batchHandouts, batchSelection, batchDoneView, batchStatusText, batchTally } from '@/lib/checkups/batchHandouts';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { Checkup } from '@/lib/glycaemia/schema';
import { DEFAULT_BLOCKS, handoutSheet, ILLUSTRATIVE_BAND_HEADING, type HandoutSheet } from '@/lib/handout';
import type { Scenario } from '@/lib/scenario/schema';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { prepareCheckups, WORKER_STATUSES, type CheckupsContext, type WorkerResult } from '@/lib/workforce';
import { C003, W001, W001_CHECKUPS, W002 } from './fixtures';

const DATE = new Date(2025, 4, 12, 12); // 12 May 2025, local noon

/** A sheet less its reading grades (editor-only, never printed, left out of batch sheets). */
function printed(sheet: HandoutSheet): Omit<HandoutSheet, 'readability'> {
  const { readability: _grades, ...rest } = sheet;
  return rest;
}

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

describe('batchChoiceCounts: every choice counted in one pass', () => {
  it('hand-worked: two exposed of four; ticked 3, 1 and a stale 9 count two', () => {
    expect(batchChoiceCounts([W001, W002, C003, M064], new Set([3, 1, 9]))).toEqual({ exposed: 2, all: 4, selected: 2 });
    expect(batchChoiceCounts([], new Set([0]))).toEqual({ exposed: 0, all: 0, selected: 0 });
  });

  it('property: each count is the length of that choice’s selection (batchSelection, tested above by hand)', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...WORKER_STATUSES), { maxLength: 60 }), fc.array(fc.integer({ min: -3, max: 70 }), { maxLength: 30 }), (list, ticks) => {
        const results = list.map((status) => ({ status }));
        const ticked = new Set(ticks);
        const counts = batchChoiceCounts(results, ticked);
        for (const choice of BATCH_CHOICES) expect(counts[choice]).toBe(batchSelection(results, choice, ticked).length);
      }),
    );
  });

  it('labels each choice with its count, thousands separated (common practice)', () => {
    expect(batchChoiceLabel('exposed', 1)).toBe('All workers who fit the exposure (1)');
    expect(batchChoiceLabel('all', 12000)).toBe('All workers (12,000)');
    expect(batchChoiceLabel('selected', 0)).toBe('The workers ticked in the worklist (0)');
  });
});

describe('batchStatusText and the list headings', () => {
  it('says nothing while working or when workers are chosen, that none is chosen when none is, and what is ready when done', () => {
    expect(batchStatusText({ chosen: 3, counts: null, working: false })).toBe('');
    expect(batchStatusText({ chosen: 3, counts: null, working: true })).toBe('');
    expect(batchStatusText({ chosen: 0, counts: null, working: false })).toBe('No worker chosen yet.');
    expect(batchStatusText({ chosen: 2, counts: { chosen: 2, sheets: 1, skipped: 1, byReason: { 'not-applicable': 1 } }, working: false })).toBe(
      'Ready. 2 workers chosen: 1 handout (one page each); 1 worker gets none (listed below).',
    );
  });
  it('heads the two lists with their counts', () => {
    expect(BATCH_MESSAGES.leftOffHeading(1200)).toBe('Handouts without the worker\u2019s own results (1,200)');
    expect(BATCH_MESSAGES.skippedHeading(3)).toBe('Workers without a handout (3)');
  });
});

describe('batchHandout: the sheet is the one /handout makes for the worker’s scenario', () => {
  it('W001 on A4: equal to handoutSheet for the hand-written scenario, with the illustrative band', () => {
    const expected = handoutSheet(W001_SCENARIO, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: DATE, paper: 'a4', table: DEMO_HEART_FAILURE_10Y });
    if (!expected.ok) throw new Error('the hand-written scenario must give a sheet');
    const got = batchHandout(W001, 0, CONTEXT, { paper: 'a4', date: DATE, showIds: false });
    expect(got.kind).toBe('sheet');
    if (got.kind !== 'sheet') return;
    expect(printed(got.sheet)).toEqual(printed(expected.value));
    expect(got.sheet.readability).toEqual({ blocks: [], whole: '', wholeGrade: undefined });
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
    expect(printed(got.sheet)).toEqual(printed(expected.value));
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

/** Invented: three yearly HbA1c results only, for a second worker of W001's stratum. */
const OTHER_CHECKUPS: Checkup[] = [
  { date: '2022-03-01', hba1c: { value: 5.8, unit: '%' } },
  { date: '2023-03-01', hba1c: { value: 5.9, unit: '%' } },
  { date: '2024-03-01', hba1c: { value: 6.1, unit: '%' } },
];
/** A print date after every checkup above (a checkup after the print date is refused, as on /handout). */
const LATER = new Date(2026, 0, 15, 12);

describe('batchHandout with the worker’s checkups: their own results, as /handout prints them', () => {
  it('W001 with the five checkups of the file: the sheet /handout makes for that scenario and history', () => {
    const expected = handoutSheet(W001_SCENARIO, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: LATER, paper: 'a4', table: DEMO_HEART_FAILURE_10Y, history: { criteria: 'ADA', checkups: W001_CHECKUPS } });
    if (!expected.ok) throw new Error('the hand-written scenario must give a sheet');
    const got = batchHandout(W001, 0, CONTEXT, { paper: 'a4', date: LATER, showIds: false }, W001_CHECKUPS);
    if (got.kind !== 'sheet') throw new Error('W001 must get a sheet');
    expect(printed(got.sheet)).toEqual(printed(expected.value));
    expect(got.historyLeftOff).toBeUndefined();
    // Hand-written from the file: HbA1c 5.9 … 6.2 %, every checkup 9 to 13 months after the one
    // before (yearly: 6 to 18 months, lib/glycaemia/persistence.ts), 2021 to 2025; ADA the run's criteria set.
    expect(got.sheet.ownResults?.heading).toBe('Your own results');
    expect(got.sheet.ownResults?.items).toContain('Your HbA1c was between 5.9% and 6.2% at five yearly checkups, from 2021 to 2025.');
    expect(got.sheet.ownResults?.items).toContain('Your fasting blood sugar (glucose) was between 5.2 mmol/L and 5.6 mmol/L at five yearly checkups, from 2021 to 2025.');
    expect(got.sheet.ownResults?.items).toContain('A range is not a diagnosis.');
    expect(got.sheet.ownResults?.items).toContain('Ranges as set by the American Diabetes Association (ADA).');
  });

  it('two workers of one stratum with other histories: one sheet key (drawn once), each with their own results', () => {
    const options = { paper: 'a4', date: LATER, showIds: false } as const;
    const a = batchHandout(W001, 0, CONTEXT, options, W001_CHECKUPS);
    const b = batchHandout({ ...W001, worker: 'W099', age: 55 }, 1, CONTEXT, options, OTHER_CHECKUPS);
    if (a.kind !== 'sheet' || b.kind !== 'sheet') throw new Error('both must be sheets');
    expect(b.sheetKey).toBe(a.sheetKey);
    expect(b.sheet.ownResults?.items).toContain('Your HbA1c was between 5.8% and 6.1% at three yearly checkups, from 2022 to 2024.'); // hand-written from OTHER_CHECKUPS
    expect(b.sheet.ownResults?.items).not.toEqual(a.sheet.ownResults?.items);
    expect(a.sheetKey).not.toContain('5.9%');
    // everything else printed is the same
    expect({ ...b.sheet, ownResults: undefined, readability: undefined }).toEqual({ ...a.sheet, ownResults: undefined, readability: undefined });
  });

  it('without checkups (a saved session): no own results, and another key than a sheet with them', () => {
    const options = { paper: 'a4', date: LATER, showIds: false } as const;
    const without = batchHandout(W001, 0, CONTEXT, options);
    const withOwn = batchHandout(W001, 0, CONTEXT, options, W001_CHECKUPS);
    if (without.kind !== 'sheet' || withOwn.kind !== 'sheet') throw new Error('both must be sheets');
    expect(without.sheet.ownResults).toBeUndefined();
    expect(without.historyLeftOff).toBeUndefined();
    expect(without.sheetKey).not.toBe(withOwn.sheetKey);
  });

  it('a checkup after the print date is refused by /handout’s checks: the sheet prints without own results and says why', () => {
    // 12 May 2025 is before W001's checkup of 23 May 2025 (line 7).
    const got = batchHandout(W001, 0, CONTEXT, { paper: 'a4', date: DATE, showIds: false }, W001_CHECKUPS);
    if (got.kind !== 'sheet') throw new Error('W001 must get a sheet');
    expect(got.sheet.ownResults).toBeUndefined();
    expect(got.historyLeftOff).toContain('2025-05-23 is after today (2025-05-12)');
    expect(BATCH_MESSAGES.leftOff('W001', got.historyLeftOff ?? '')).toMatch(/^W001: the handout prints without their own results\. The glucose history/);
  });

  it('batchHandouts takes each worker’s checkups by id; a worker missing from the map gets none', () => {
    const batch = batchHandouts([W001, { ...W001, worker: 'W099' }], [0, 1], CONTEXT, { paper: 'a4', date: LATER, showIds: false }, new Map([['W001', W001_CHECKUPS]]));
    const [a, b] = batch;
    if (a?.kind !== 'sheet' || b?.kind !== 'sheet') throw new Error('both must be sheets');
    expect(a.sheet.ownResults?.items[0]).toBe('Your HbA1c was between 5.9% and 6.2% at five yearly checkups, from 2021 to 2025.');
    expect(b.sheet.ownResults).toBeUndefined();
  });
});

describe('BATCH_MESSAGES', () => {
  it('the file cannot be read again: what that means, then the reader’s reason, ending in one full stop', () => {
    expect(BATCH_MESSAGES.unreadable('No file was given')).toBe('The workers\u2019 own results could not be read again from the file, so these handouts print without them. No file was given.');
    expect(BATCH_MESSAGES.unreadable('No file was given.')).toBe('The workers\u2019 own results could not be read again from the file, so these handouts print without them. No file was given.');
    expect(BATCH_MESSAGES.preparing(12, 1500)).toBe('Preparing handout 12 of 1,500\u2026');
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

  it('a tally keeps what the screen counts and lists, not the sheet; the counts of the tallies are the counts of the handouts', () => {
    const batch = batchHandouts(results, batchSelection(results, 'all', new Set()), CONTEXT, { paper: 'a4', date: DATE, showIds: true });
    const tallies = batch.map(batchTally);
    expect(tallies[0]).toEqual({ kind: 'sheet', index: 0, worker: 'W001', historyLeftOff: undefined });
    expect(Object.keys(tallies[0] ?? {})).not.toContain('sheet');
    expect(tallies[1]).toBe(batch[1]); // a skipped worker's record is small already
    expect(batchCounts(tallies)).toEqual({ chosen: 4, sheets: 2, skipped: 2, byReason: { 'not-applicable': 2 } });
  });

  it('the finished batch on screen: the counts, and each worker without a sheet or without own results, with why', () => {
    const batch = batchHandouts(results, batchSelection(results, 'all', new Set()), CONTEXT, { paper: 'a4', date: DATE, showIds: false });
    const tallies = [...batch.map(batchTally), { kind: 'sheet' as const, index: 7, worker: 'Q7', historyLeftOff: 'A checkup is dated after today.' }];
    const view = batchDoneView(tallies);
    expect(view.counts).toEqual({ chosen: 5, sheets: 3, skipped: 2, byReason: { 'not-applicable': 2 } });
    expect(view.skipped.heading).toBe('Workers without a handout (2)');
    expect(view.skipped.lines.map((l) => l.key)).toEqual([1, 2]);
    expect(view.skipped.lines[0]?.text).toMatch(/^W002: Not enough results/);
    expect(view.leftOff).toEqual({ heading: 'Handouts without the worker\u2019s own results (1)', lines: [{ key: 7, text: 'Q7: the handout prints without their own results. A checkup is dated after today.' }] });
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

describe('BATCH_BUTTON_TEXT', () => {
  it('words the prepare and print buttons with their counts (the screen\'s own wording, common practice for thousands separators)', () => {
    expect(BATCH_BUTTON_TEXT.prepare(1)).toBe('Prepare the handout');
    expect(BATCH_BUTTON_TEXT.prepare(1500)).toBe('Prepare 1,500 handouts');
    expect(BATCH_BUTTON_TEXT.print(1)).toBe('Print or save as PDF (1 page)');
    expect(BATCH_BUTTON_TEXT.print(500)).toBe('Print or save as PDF (500 pages)');
  });
});
