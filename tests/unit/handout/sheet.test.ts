/**
 * handoutSheet: one call gives the whole printable sheet. Expected counts come from the engine
 * (computeScenario), never from the sheet; sentences are checked against hand-written text.
 */
import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence';
import { DEFAULT_BLOCKS, gradeLine, handoutSheet, LARGE_PICTURE_MIN_WIDTH_MM, paragraphs, type HandoutSheetTemplate } from '@/lib/handout';
import type { Scenario } from '@/lib/scenario/schema';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables';
import { CAUTION_HEADING, CAUTION_TEXT } from '@/lib/wording';

const DATE = new Date(2025, 4, 12, 12); // 12 May 2025, local noon
const TEMPLATE: HandoutSheetTemplate = { blocks: DEFAULT_BLOCKS, clinic: {} };

/** Typed in, invented: 10-year risk 0.08, RR 1.5 (1.2 to 1.9). */
const TYPED: Scenario = {
  baseline: { risk: 0.08, years: 10 },
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9, design: 'cohort' },
  wording: { outcome: 'a first stroke', exposure: 'raised blood pressure', comparison: 'normal blood pressure' },
  person: { age: 62, sex: 'female' },
};

/** Demo table, women 50–59 (invented 1.5%), and the demo evidence entry. */
const DEMO: Scenario = {
  baseline: { risk: 0.015, years: 10 },
  effect: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.effect,
  horizonYears: 10,
  wording: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.wording,
  person: { age: 53, sex: 'female' },
  tableId: DEMO_HEART_FAILURE_10Y.id,
};

function sheetOf(scenario: Scenario, options: Partial<Parameters<typeof handoutSheet>[2]> = {}, template = TEMPLATE) {
  const r = handoutSheet(scenario, template, { date: DATE, ...options });
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.value;
}

function allText(value: unknown): string {
  return JSON.stringify(value);
}

describe('handoutSheet: the numbers', () => {
  it('draws the engine’s counts and says them in the captions', () => {
    const engine = computeScenario(TYPED);
    if (!engine.ok) throw new Error('engine');
    const c = engine.value.iconArray;
    // Hand-computed: P0 = 0.08 → 8 of 100; P1 = 1.5 × 0.08 = 0.12 → 12 of 100; 1.2 × 0.08 = 0.096 → 10; 1.9 × 0.08 = 0.152 → 15.
    expect([c.denominator, c.referenceEvents, c.exposedEvents, c.exposedLower, c.exposedUpper]).toEqual([100, 8, 12, 10, 15]);
    const sheet = sheetOf(TYPED);
    const [reference, exposed] = sheet.arrays;
    expect(sheet.denominator).toBe(100);
    expect(reference.layout.tally.event).toBe(8);
    expect(exposed.layout.tally.event + exposed.layout.tally.added).toBe(12);
    expect(reference.caption).toBe(
      'Think of 100 women aged 62 like you. All of them have normal blood pressure. In the next 10 years, about 8 out of 100 will have a first stroke. The other 92 out of 100 will not.',
    );
    expect(exposed.caption).toContain('That is about 4 more out of 100.');
    expect(exposed.caption).toContain('anywhere from 10 to 15 out of 100');
    expect(sheet.numbersHeading).toBe('Women aged 62 like you, over the next 10 years');
  });

  it('puts the caution on every sheet, unchanged', () => {
    const sheet = sheetOf(TYPED);
    expect(sheet.caution).toEqual({ heading: CAUTION_HEADING, text: CAUTION_TEXT });
  });

  it('gives one key for both pictures, each kind once, "could be" last', () => {
    const kinds = sheetOf(TYPED).legend.entries.map((e) => `${e.kind}${e.uncertain ? '?' : ''}`);
    expect(kinds).toEqual(['event', 'added', 'none', 'none?']);
  });

  it('is pure: the same call gives the same sheet and leaves its input alone', () => {
    const frozen = Object.freeze({ ...TYPED, effect: Object.freeze({ ...TYPED.effect }) }) as Scenario;
    expect(sheetOf(frozen)).toEqual(sheetOf(frozen));
  });
});

describe('handoutSheet: a capped result gives no sheet (issue 12.4)', () => {
  it('refuses when the risk ratio times the baseline reaches certainty', () => {
    // Hand-computed: RR 2.5 × P0 0.4 = 1.0, the engine caps P1 at 1 and warns.
    const capped: Scenario = { ...TYPED, baseline: { risk: 0.4, years: 10 }, effect: { measure: 'RR', estimate: 2.5, lower: 2, upper: 3.2, design: 'cohort' } };
    const r = handoutSheet(capped, TEMPLATE, { date: DATE });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues.map((i) => i.code)).toEqual(['certainty-reached']);
      expect(r.issues[0]?.message).toContain('No handout is made');
    }
  });

  it('refuses when only the upper limit reaches certainty', () => {
    // Hand-computed: 0.3 × 2.5 = 0.75 at the estimate, 0.3 × 3.5 = 1.05 ≥ 1 at the upper limit.
    const r = handoutSheet({ ...TYPED, baseline: { risk: 0.3, years: 10 }, effect: { measure: 'RR', estimate: 2.5, lower: 1.8, upper: 3.5, design: 'cohort' } }, TEMPLATE, { date: DATE });
    expect(r.ok).toBe(false);
  });

  it('still makes a sheet for a large odds ratio, which never reaches certainty (Zhang & Yu 1998)', () => {
    expect(handoutSheet({ ...TYPED, baseline: { risk: 0.4, years: 10 }, effect: { measure: 'OR', estimate: 2.5, lower: 2, upper: 3.2, design: 'cohort' } }, TEMPLATE, { date: DATE }).ok).toBe(true);
  });
});

describe('handoutSheet: demo content carries the band (issue 12.2)', () => {
  it('marks a demo table and a demo entry', () => {
    const band = sheetOf(DEMO, { table: DEMO_HEART_FAILURE_10Y }).illustrative;
    expect(band?.heading).toBe('Illustrative figures \u2014 not for patients');
    expect(band?.what).toEqual(['table', 'study']);
    expect(band?.text).toBe('Table and study invented for a demonstration.');
  });

  it('marks a demo table named by id even before the table is found', () => {
    expect(sheetOf({ ...TYPED, tableId: DEMO_HEART_FAILURE_10Y.id }).illustrative?.what).toEqual(['table']);
  });

  it('marks the demo entry’s words typed under the clinician’s own numbers', () => {
    expect(sheetOf({ ...TYPED, wording: { ...TYPED.wording, citation: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.wording.citation } }).illustrative?.what).toEqual(['study']);
  });

  it('leaves a typed-in scenario unmarked', () => {
    expect(sheetOf(TYPED).illustrative).toBeUndefined();
  });
});

describe('handoutSheet: options (issue 12.16)', () => {
  it('a group session leaves out "like you" everywhere on the sheet', () => {
    const person = sheetOf(TYPED);
    const group = sheetOf(TYPED, { audience: 'group' });
    expect(allText(person)).toContain('like you');
    expect(allText(group)).not.toMatch(/like you/i);
    expect(group.arrays[0].caption).toBe(
      'Think of 100 women aged 62. All of them have normal blood pressure. In the next 10 years, about 8 out of 100 will have a first stroke. The other 92 out of 100 will not.',
    );
    expect(group.questions.items[0]).toBe('Out of 100 people in this group, about how many will have a first stroke in the next 10 years?');
    expect(group.footer.sources[0]).toBe('Risk for this group: entered by your clinician.');
  });

  it('writes the date as the paper’s region does: A4 day first, US Letter month first', () => {
    expect(sheetOf(TYPED, { paper: 'a4' }).footer.preparedOn).toBe('Prepared on 12 May 2025.');
    expect(sheetOf(TYPED, { paper: 'letter' }).footer.preparedOn).toBe('Prepared on May 12, 2025.');
  });

  it('gives the page rule and the printable height of the paper', () => {
    // Hand-computed: 297 − 2 × 10 = 277 mm; 279.4 − 2 × 10 = 259.4 mm.
    expect(sheetOf(TYPED, { paper: 'a4' }).paper.printableHeightMm).toBe(277);
    expect(sheetOf(TYPED, { paper: 'letter' }).paper.printableHeightMm).toBeCloseTo(259.4, 9);
    expect(sheetOf(TYPED, { paper: 'letter' }).paper.pageRule).toBe('@page { size: letter portrait; margin: 10mm; }');
    expect(sheetOf(TYPED, { paper: 'letter' }).paper.overflowWarning).toContain('second US Letter page');
  });

  it('warns before printing that the large layout with the person’s own results may need a second page (measured in print, lib/handout/sheet.ts), and only then', () => {
    const history = { criteria: 'ADA' as const, checkups: [{ date: '2024-03-01', hba1c: { value: 6.1, unit: '%' as const } }] }; // invented
    expect(sheetOf(TYPED, { layout: 'large', history, paper: 'letter' }).paper.fitWarning).toBe(
      'With the person\u2019s own results, the large layout may run onto a second US Letter page: for one page, choose the standard layout or leave their results off.',
    );
    expect(sheetOf(TYPED, { layout: 'large', history }).paper.fitWarning).toContain('second A4 page');
    expect(sheetOf(TYPED, { layout: 'standard', history }).paper.fitWarning).toBeUndefined();
    expect(sheetOf(TYPED, { layout: 'large' }).paper.fitWarning).toBeUndefined();
    expect(sheetOf(TYPED, { layout: 'large', history, audience: 'group' }).paper.fitWarning).toBeUndefined(); // a group's sheet has no own results
  });

  it('carries the layout choice; the large pictures are at least 6 cm wide', () => {
    expect(sheetOf(TYPED).layout).toBe('standard');
    expect(sheetOf(TYPED, { layout: 'large' }).layout).toBe('large');
    expect(LARGE_PICTURE_MIN_WIDTH_MM).toBeGreaterThanOrEqual(60);
  });

  it('keeps a telephone number in the clinic contact together', () => {
    const sheet = sheetOf(TYPED, {}, { blocks: DEFAULT_BLOCKS, clinic: { name: ' Harbour Lane Clinic ', contact: 'Call +44 20 7946 0000 (weekdays)' } });
    expect(sheet.clinic?.name).toBe('Harbour Lane Clinic');
    expect(sheet.clinic?.contact).toEqual([
      { text: 'Call ', keepTogether: false },
      { text: '+44 20 7946 0000', keepTogether: true },
      { text: ' (weekdays)', keepTogether: false },
    ]);
    expect(sheetOf(TYPED).clinic).toBeUndefined();
  });
});

describe('handoutSheet: editable text and reading grades', () => {
  it('splits the blocks into paragraphs and flags an empty title', () => {
    expect(paragraphs('One.\n\n  Two.  \n\n\n')).toEqual(['One.', 'Two.']);
    const sheet = sheetOf(TYPED, {}, { blocks: { ...DEFAULT_BLOCKS, title: '  ', nextSteps: '' }, clinic: {} });
    expect(sheet.titleWarning).toBe('The title is empty: the page prints without one.');
    expect(sheet.nextSteps.paragraphs).toEqual([]);
    expect(sheetOf(TYPED).titleWarning).toBeUndefined();
  });

  it('names the formula beside every grade', () => {
    expect(gradeLine({ grade: 6.24, readingEase: 74.6 })).toBe('Flesch\u2013Kincaid grade 6.2 (aim for 8 or below); Flesch reading ease 75.');
    const sheet = sheetOf(TYPED);
    for (const b of sheet.readability.blocks) expect(b.line).toMatch(/^Flesch\u2013Kincaid grade -?\d+\.\d \(aim for 8 or below\); Flesch reading ease -?\d+\.$/);
    expect(sheet.readability.whole).toMatch(/^Whole handout: Flesch\u2013Kincaid grade \d+\.\d\.$/);
  });

  it('warns for a block above grade 8 and says when a block has no words', () => {
    const hard = 'Comprehensive cardiometabolic characterisation necessitates individualised interpretation of epidemiological associations.';
    const sheet = sheetOf(TYPED, {}, { blocks: { ...DEFAULT_BLOCKS, opening: hard, nextSteps: '' }, clinic: {} });
    const opening = sheet.readability.blocks.find((b) => b.key === 'opening');
    expect(opening?.aboveTarget).toBe(true);
    expect(opening?.warning).toBe('Above grade 8: try shorter sentences and everyday words.');
    expect(sheet.readability.blocks.find((b) => b.key === 'nextSteps')?.line).toBe('No words yet, so no reading grade.');
  });

  it('grades: false leaves the (unprinted) reading grades out and changes nothing else', () => {
    const history = { criteria: 'ADA' as const, checkups: [{ date: '2024-03-01', hba1c: { value: 6.1, unit: '%' as const } }] }; // invented
    const withGrades = sheetOf(DEMO, { table: DEMO_HEART_FAILURE_10Y, history });
    const without = sheetOf(DEMO, { table: DEMO_HEART_FAILURE_10Y, history, grades: false });
    expect(without.readability).toEqual({ blocks: [], whole: '', wholeGrade: undefined });
    expect(withGrades.readability.blocks).toHaveLength(3); // opening, next steps and the title: the editable blocks (lib/handout/blocks.ts)
    expect({ ...without, readability: null }).toEqual({ ...withGrades, readability: null });
  });

  it('lists the engine’s warnings for the clinician, not on the sheet itself', () => {
    const sheet = sheetOf(DEMO, { table: DEMO_HEART_FAILURE_10Y });
    // The demo entry's follow-up is 8 years, the horizon 10: the engine warns (horizon-beyond-follow-up).
    expect(sheet.clinicianNotes.items.some((m) => m.includes('follow-up'))).toBe(true);
  });
});
