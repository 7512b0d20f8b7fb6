import { describe, expect, it } from 'vitest';
import { categoryFor, classifyCheckup } from '@/lib/glycaemia/classify';
import { CRITERIA } from '@/lib/glycaemia/criteria';
import { roundTo } from '@/lib/glycaemia/format';
import { glucoseIn } from '@/lib/glycaemia/glucose';
import { hba1cIn } from '@/lib/glycaemia/hba1c';
import { OUTPUT_DECIMALS } from '@/lib/glycaemia/report';
import type { CriteriaSet, GlycaemicCategory } from '@/lib/glycaemia/exposure';
import type { Checkup } from '@/lib/glycaemia/schema';

/*
 * Every threshold of every criteria set, in both units of its test, at the boundary, just below
 * and just above it. The thresholds are written out here from the sources (not read from the
 * code under test), in the body's own unit:
 *
 * - ADA Standards of Care, section 2 (2021–2025; methods guide table; from memory for the
 *   section's wording): HbA1c prediabetes 5.7–6.4 %, diabetes range ≥ 6.5 %; FPG prediabetes
 *   100–125 mg/dL, diabetes range ≥ 126 mg/dL.
 * - WHO/IDF 2006 and WHO 2011 (methods guide table): FPG impaired fasting glucose 6.1–6.9 mmol/L,
 *   diabetes range ≥ 7.0 mmol/L; HbA1c diabetes range ≥ 6.5 %, and below it HbA1c does not classify.
 * - NICE PH38 (2012; methods guide table): FPG 5.5–6.9 mmol/L or HbA1c 42–47 mmol/mol; diabetes
 *   range FPG ≥ 7.0 mmol/L, HbA1c ≥ 48 mmol/mol — PH38's referral thresholds, from WHO (from memory).
 *
 * In the other unit the boundary is the threshold converted (hand-computed beside each line), so
 * "at" is that converted number and below/above are one small step either side of it. Steps:
 * 0.01 % and 0.01 mmol/L, 0.1 mmol/mol and 0.1 mg/dL — finer than any lab prints, so they
 * test the boundary itself.
 */

type Unit = '%' | 'mmol/mol' | 'mg/dL' | 'mmol/L';
interface Boundary {
  readonly criteria: CriteriaSet;
  readonly test: 'hba1c' | 'fpg';
  readonly unit: Unit;
  /** The boundary in this unit. */
  readonly at: number;
  readonly step: number;
  /** Category at and above the boundary, and just below it. */
  readonly from: GlycaemicCategory;
  readonly below: GlycaemicCategory | null;
  readonly source: string;
}

const B: readonly Boundary[] = [
  // ADA, HbA1c: 5.7 % and 6.5 %
  { criteria: 'ADA', test: 'hba1c', unit: '%', at: 5.7, step: 0.01, from: 'prediabetes', below: 'normal', source: 'ADA §2: 5.7 %' },
  { criteria: 'ADA', test: 'hba1c', unit: 'mmol/mol', at: 39, step: 0.1, from: 'prediabetes', below: 'normal', source: 'ADA §2 prints 5.7% (39 mmol/mol) (from memory)' },
  { criteria: 'ADA', test: 'hba1c', unit: '%', at: 6.5, step: 0.01, from: 'diabetes-range', below: 'prediabetes', source: 'ADA §2: 6.5 %' },
  { criteria: 'ADA', test: 'hba1c', unit: 'mmol/mol', at: 48, step: 0.1, from: 'diabetes-range', below: 'prediabetes', source: 'ADA §2 prints 6.5% (48 mmol/mol) (from memory)' },
  // ADA, FPG: 100 and 126 mg/dL
  { criteria: 'ADA', test: 'fpg', unit: 'mg/dL', at: 100, step: 0.1, from: 'prediabetes', below: 'normal', source: 'ADA §2: 100 mg/dL' },
  { criteria: 'ADA', test: 'fpg', unit: 'mmol/L', at: 5.6, step: 0.01, from: 'prediabetes', below: 'normal', source: 'ADA §2 prints 100 mg/dL (5.6 mmol/L) (from memory)' },
  { criteria: 'ADA', test: 'fpg', unit: 'mg/dL', at: 126, step: 0.1, from: 'diabetes-range', below: 'prediabetes', source: 'ADA §2: 126 mg/dL' },
  { criteria: 'ADA', test: 'fpg', unit: 'mmol/L', at: 7.0, step: 0.01, from: 'diabetes-range', below: 'prediabetes', source: 'ADA §2 prints 126 mg/dL (7.0 mmol/L) (from memory)' },
  // WHO, HbA1c: 6.5 % only; below it HbA1c does not classify
  { criteria: 'WHO', test: 'hba1c', unit: '%', at: 6.5, step: 0.01, from: 'diabetes-range', below: null, source: 'WHO 2011: 6.5 %' },
  { criteria: 'WHO', test: 'hba1c', unit: 'mmol/mol', at: 48, step: 0.1, from: 'diabetes-range', below: null, source: 'WHO 2011 prints 6.5% (48 mmol/mol) (from memory)' },
  // WHO, FPG: 6.1 and 7.0 mmol/L
  { criteria: 'WHO', test: 'fpg', unit: 'mmol/L', at: 6.1, step: 0.01, from: 'prediabetes', below: 'normal', source: 'WHO 2006: IFG from 6.1 mmol/L' },
  { criteria: 'WHO', test: 'fpg', unit: 'mg/dL', at: 110, step: 0.1, from: 'prediabetes', below: 'normal', source: 'WHO 2006 prints 6.1 mmol/L (110 mg/dL) (from memory)' },
  { criteria: 'WHO', test: 'fpg', unit: 'mmol/L', at: 7.0, step: 0.01, from: 'diabetes-range', below: 'prediabetes', source: 'WHO 2006: 7.0 mmol/L' },
  { criteria: 'WHO', test: 'fpg', unit: 'mg/dL', at: 126, step: 0.1, from: 'diabetes-range', below: 'prediabetes', source: 'WHO 2006 prints 7.0 mmol/L (126 mg/dL) (from memory)' },
  // NICE, HbA1c: 42 and 48 mmol/mol
  { criteria: 'NICE', test: 'hba1c', unit: 'mmol/mol', at: 42, step: 0.1, from: 'prediabetes', below: 'normal', source: 'NICE PH38: 42 mmol/mol' },
  { criteria: 'NICE', test: 'hba1c', unit: '%', at: 6.0, step: 0.01, from: 'prediabetes', below: 'normal', source: 'NICE PH38 prints 42 mmol/mol (6.0%) (from memory)' },
  { criteria: 'NICE', test: 'hba1c', unit: 'mmol/mol', at: 48, step: 0.1, from: 'diabetes-range', below: 'prediabetes', source: 'NICE PH38 referral: 48 mmol/mol (from memory)' },
  { criteria: 'NICE', test: 'hba1c', unit: '%', at: 6.5, step: 0.01, from: 'diabetes-range', below: 'prediabetes', source: 'NICE PH38 prints 48 mmol/mol (6.5%) (from memory)' },
  // NICE, FPG: 5.5 and 7.0 mmol/L
  { criteria: 'NICE', test: 'fpg', unit: 'mmol/L', at: 5.5, step: 0.01, from: 'prediabetes', below: 'normal', source: 'NICE PH38: 5.5 mmol/L' },
  // NICE prints 5.5 mmol/L with no mg/dL form, so that one cut-point is converted: 5.5 × 18.016 = 99.088 mg/dL (hand-computed).
  { criteria: 'NICE', test: 'fpg', unit: 'mg/dL', at: 5.5 * 18.016, step: 0.1, from: 'prediabetes', below: 'normal', source: 'NICE 5.5 mmol/L = 99.088 mg/dL (hand-computed)' },
  { criteria: 'NICE', test: 'fpg', unit: 'mmol/L', at: 7.0, step: 0.01, from: 'diabetes-range', below: 'prediabetes', source: 'NICE PH38 referral: 7.0 mmol/L (from memory)' },
  { criteria: 'NICE', test: 'fpg', unit: 'mg/dL', at: 126, step: 0.1, from: 'diabetes-range', below: 'prediabetes', source: 'NICE PH38 takes 7.0 mmol/L from WHO, printed 126 mg/dL (from memory)' },
];

function checkupWith(test: 'hba1c' | 'fpg', value: number, unit: Unit): Checkup {
  return test === 'hba1c'
    ? { date: '2023-03-01', hba1c: { value, unit: unit as '%' | 'mmol/mol' } }
    : { date: '2023-03-01', fpg: { value, unit: unit as 'mg/dL' | 'mmol/L' } };
}

describe.each(B)('$criteria $test in $unit at $at ($source)', (b) => {
  it(`is ${b.from} at the boundary`, () => {
    const c = classifyCheckup(checkupWith(b.test, b.at, b.unit), b.criteria);
    expect(c[b.test]?.category).toBe(b.from);
  });
  it(`is ${b.from} just above`, () => {
    const c = classifyCheckup(checkupWith(b.test, b.at + b.step, b.unit), b.criteria);
    expect(c[b.test]?.category).toBe(b.from);
    expect(c.category).toBe(b.from);
  });
  it(`is ${b.below ?? 'not classified'} just below`, () => {
    const c = classifyCheckup(checkupWith(b.test, b.at - b.step, b.unit), b.criteria);
    expect(c[b.test]?.category).toBe(b.below);
    expect(c.category).toBe(b.below);
  });
  it('names the body with the result', () => {
    expect(classifyCheckup(checkupWith(b.test, b.at, b.unit), b.criteria).criteria).toBe(b.criteria);
  });
});

describe('results as labs print them, against the bodies\' quoted equivalents', () => {
  const cases: ReadonlyArray<readonly [CriteriaSet, 'hba1c' | 'fpg', number, Unit, GlycaemicCategory | null, string]> = [
    // ADA quotes 39–47 mmol/mol for 5.7–6.4 %, 48 for 6.5 % (ADA §2, from memory):
    ['ADA', 'hba1c', 38, 'mmol/mol', 'normal', '(38 + 23.5)/10.93 = 5.627 % < 5.7'],
    ['ADA', 'hba1c', 39, 'mmol/mol', 'prediabetes', '62.5/10.93 = 5.718 % ≥ 5.7'],
    ['ADA', 'hba1c', 47, 'mmol/mol', 'prediabetes', '70.5/10.93 = 6.450 % < 6.5'],
    ['ADA', 'hba1c', 48, 'mmol/mol', 'diabetes-range', '71.5/10.93 = 6.542 % ≥ 6.5'],
    ['ADA', 'fpg', 5.5, 'mmol/L', 'normal', '5.5 × 18.016 = 99.09 mg/dL < 100'],
    ['ADA', 'fpg', 5.6, 'mmol/L', 'prediabetes', '5.6 × 18.016 = 100.89 mg/dL'],
    ['ADA', 'fpg', 6.9, 'mmol/L', 'prediabetes', '6.9 × 18.016 = 124.31 mg/dL'],
    ['ADA', 'fpg', 7.0, 'mmol/L', 'diabetes-range', '126.11 mg/dL ≥ 126'],
    // WHO quotes 110 and 126 mg/dL (WHO 2006, from memory). Issue 11 item 1: a lab's 126 mg/dL is compared
    // with WHO's own 126 mg/dL, so it is in the diabetes range although it converts to 6.994 mmol/L:
    ['WHO', 'fpg', 109, 'mg/dL', 'normal', '109/18.016 = 6.050 mmol/L'],
    ['WHO', 'fpg', 110, 'mg/dL', 'prediabetes', '110/18.016 = 6.106 mmol/L'],
    ['WHO', 'fpg', 126, 'mg/dL', 'diabetes-range', 'WHO prints 126 mg/dL; converted 6.994 mmol/L would be under 7.0'],
    ['WHO', 'fpg', 125, 'mg/dL', 'prediabetes', '125 < 126 mg/dL'],
    ['WHO', 'fpg', 127, 'mg/dL', 'diabetes-range', '127/18.016 = 7.049 mmol/L'],
    ['WHO', 'hba1c', 48, 'mmol/mol', 'diabetes-range', '6.542 % ≥ 6.5'],
    ['WHO', 'hba1c', 6.4, '%', null, 'below 6.5 %: HbA1c does not classify under WHO'],
    // NICE quotes 6.0–6.4 % for 42–47 mmol/mol and 6.5 % for 48 (PH38, from memory). Issue 11 item 1: a lab's
    // 6.5% is compared with NICE's own 6.5%, so it is in the diabetes range although it converts to 47.5 mmol/mol:
    ['NICE', 'hba1c', 5.9, '%', 'normal', '10.93×5.9 − 23.5 = 40.99 mmol/mol'],
    ['NICE', 'hba1c', 6.0, '%', 'prediabetes', '42.08 mmol/mol'],
    ['NICE', 'hba1c', 6.5, '%', 'diabetes-range', 'NICE prints 48 mmol/mol (6.5%); converted 47.545 would be under 48'],
    ['NICE', 'hba1c', 6.4, '%', 'prediabetes', '6.4 < 6.5%'],
    ['NICE', 'hba1c', 6.6, '%', 'diabetes-range', '48.638 mmol/mol'],
    ['NICE', 'fpg', 99, 'mg/dL', 'normal', '99/18.016 = 5.495 mmol/L < 5.5'],
    ['NICE', 'fpg', 100, 'mg/dL', 'prediabetes', '5.551 mmol/L'],
  ];
  it.each(cases)('%s %s %d %s → %s (%s, hand-computed)', (criteria, test, value, unit, expected) => {
    expect(classifyCheckup(checkupWith(test, value, unit), criteria).category).toBe(expected);
  });

  it('notes a value between the two published forms of a cut-point, and one compared after conversion near a threshold', () => {
    // 6.5 % → 47.545 mmol/mol: between NICE's 48 mmol/mol and its 6.5% (hand-computed); placed by the % form.
    const nice = classifyCheckup(checkupWith('hba1c', 6.5, '%'), 'NICE');
    expect(nice.notes.map((n) => n.code)).toContain('conversion-near-threshold');
    expect(nice.notes[0]?.message).toContain('between the two published forms');
    expect(nice.notes[0]?.message).toContain('the unit the lab printed (%)');
    expect(nice.notes[0]?.message).not.toMatch(/lab's own/);
    expect(nice.hba1c?.text).toBe('47.5 mmol/mol');
    // 99 mg/dL → 5.4951 mmol/L: shown with enough decimals to stay below NICE's 5.5.
    const fpg = classifyCheckup(checkupWith('fpg', 99, 'mg/dL'), 'NICE');
    expect(fpg.fpg?.text).toBe('5.495 mmol/L');
    expect(fpg.notes.map((n) => n.code)).toContain('conversion-near-threshold');
  });

  it('adds no conversion note to a value entered in the body\'s own unit, or far from a threshold', () => {
    expect(classifyCheckup(checkupWith('hba1c', 6.5, '%'), 'ADA').notes).toEqual([]);
    expect(classifyCheckup(checkupWith('hba1c', 44, 'mmol/mol'), 'ADA').notes).toEqual([]); // 6.18 %, far from 5.7 and 6.5
  });
});

describe('the report\'s rounded conversions stay on the side of every threshold', () => {
  it('for every value as labs print it, over the plausible ranges (enumeration)', () => {
    // Reporting steps, common practice: 0.1 %, whole mmol/mol, 0.1 mmol/L, whole mg/dL. Ranges from
    // lib/glycaemia/schema.ts. A converted value rounded to OUTPUT_DECIMALS must fall in the range its
    // unrounded value falls in, under each body's thresholds (so the JSON never contradicts its category).
    const tenths = (from: number, to: number) => Array.from({ length: Math.round((to - from) * 10) + 1 }, (_, i) => Number((from + i / 10).toFixed(1)));
    const wholes = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);
    const crossings: string[] = [];
    for (const body of Object.values(CRITERIA)) {
      const hbFrom = body.hba1c.unit === '%' ? 'mmol/mol' : '%';
      for (const value of hbFrom === '%' ? tenths(3, 20) : wholes(9, 195)) {
        const v = hba1cIn(body.hba1c.unit, { value, unit: hbFrom });
        if (categoryFor(v, body.hba1c) !== categoryFor(roundTo(v, OUTPUT_DECIMALS), body.hba1c)) crossings.push(`${body.id} ${value} ${hbFrom}`);
      }
      const gFrom = body.fpg.unit === 'mg/dL' ? 'mmol/L' : 'mg/dL';
      for (const value of gFrom === 'mmol/L' ? tenths(1, 50) : wholes(18, 900)) {
        const v = glucoseIn(body.fpg.unit, { value, unit: gFrom });
        if (categoryFor(v, body.fpg) !== categoryFor(roundTo(v, OUTPUT_DECIMALS), body.fpg)) crossings.push(`${body.id} ${value} ${gFrom}`);
      }
    }
    expect(crossings).toEqual([]);
  });
});
